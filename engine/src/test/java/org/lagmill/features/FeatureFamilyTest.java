package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.ArraySeriesAttributes;

class FeatureFamilyTest {
  @Test
  void shouldGroupEveryDefaultFeatureIntoAPlannerFamily() {
    ArraySalesHistory history = new ArraySalesHistory(java.time.LocalDate.of(2024, 1, 1), new int[2][120],
        ArraySeriesAttributes.of(new String[] {"sku", "shop"}, new String[][] {{"a", "s"}, {"b", "s"}}),
        org.lagmill.store.PriceTable.EMPTY, org.lagmill.store.DayCalendar.EMPTY);
    FeatureSchema schema = FeaturePass.training(history, FeatureSpec.defaults()).schema();
    for (String name : schema.names()) {
      assertEquals(false, FeatureFamily.of(name) == FeatureFamily.OTHER, name);
      assertEquals(false, FeatureFamily.label(name, "days").equals(name), name);
    }
  }

  @Test
  void shouldMapHandPickedNames() {
    assertEquals(FeatureFamily.RECENT_LEVEL, FeatureFamily.of("lag_28"));
    assertEquals(FeatureFamily.RECENT_LEVEL, FeatureFamily.of("roll_zero_share_7_shift_1"));
    assertEquals(FeatureFamily.WEEKLY_PATTERN, FeatureFamily.of("day_of_week"));
    assertEquals(FeatureFamily.SEASON, FeatureFamily.of("week_of_year"));
    assertEquals(FeatureFamily.EVENTS, FeatureFamily.of("cal_harvest_fair"));
    assertEquals(FeatureFamily.PRICE, FeatureFamily.of("price_to_group"));
    assertEquals(FeatureFamily.PRICE, FeatureFamily.of("promo"));
    assertEquals(FeatureFamily.PLAN, FeatureFamily.of("plan_display"));
    assertEquals(FeatureFamily.LAUNCH, FeatureFamily.of("days_since_first_sale"));
    assertEquals(FeatureFamily.SERIES, FeatureFamily.of("attr_shop"));
    assertEquals(FeatureFamily.OTHER, FeatureFamily.of("something_new"));
    assertEquals("mean units over 28 weeks, ending 4 weeks before",
        FeatureFamily.label("roll_mean_28_shift_4", "weeks"));
    assertEquals("share of periods without sales over 7 days, ending 1 days before",
        FeatureFamily.label("roll_zero_share_7_shift_1", "days"));
    assertEquals("units 35 days before", FeatureFamily.label("lag_35", "days"));
    assertEquals("calendar: harvest fair", FeatureFamily.label("cal_harvest_fair", "days"));
    assertEquals("which shop", FeatureFamily.label("attr_shop", "days"));
    assertEquals(List.of("recent level", "weekly pattern", "season", "events and holidays", "price", "plan",
        "launch", "item and location", "other"),
        java.util.Arrays.stream(FeatureFamily.values())
            .map(FeatureFamily::label).toList());
  }
}
