package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Path;
import java.util.EnumMap;
import java.util.Map;
import java.util.function.Function;
import org.junit.jupiter.api.Test;
import org.lagmill.ingest.ColumnNames.Column;
import org.lagmill.io.InvalidRequestException;

/** Renaming one column changes that column only; an empty name names the setting and its default. */
class ColumnNamesTest {
  /** Which component each column is, written out by hand rather than taken from the enum's order. */
  private static final Map<Column, Function<ColumnNames, String>> COMPONENT = new EnumMap<>(Map.of(
      Column.SERIES_ID, ColumnNames::seriesIdColumn, Column.SALES_DATE, ColumnNames::dateColumn,
      Column.UNITS, ColumnNames::unitsColumn, Column.PRICES_FROM, ColumnNames::fromColumn,
      Column.PRICE, ColumnNames::priceColumn, Column.CALENDAR_DATE, ColumnNames::calendarDateColumn,
      Column.CLOSURES_FROM, ColumnNames::closuresFromColumn, Column.CLOSURES_UNTIL, ColumnNames::closuresUntilColumn));

  @Test
  void shouldHoldTheDocumentedDefaults() {
    // docs/formats.md, "Column-name options"
    Map<Column, String> documented = Map.of(Column.SERIES_ID, "series_id", Column.SALES_DATE, "date", Column.UNITS,
        "units", Column.PRICES_FROM, "from", Column.PRICE, "price", Column.CALENDAR_DATE, "date",
        Column.CLOSURES_FROM, "from", Column.CLOSURES_UNTIL, "until");
    for (Column column : Column.values()) {
      assertEquals(documented.get(column), COMPONENT.get(column).apply(ColumnNames.DEFAULTS), column.name());
    }
    assertEquals(KeyColumns.NONE, ColumnNames.DEFAULTS.keyColumns());
  }

  @Test
  void shouldRenameOnlyTheColumnAsked() {
    for (Column renamed : Column.values()) {
      ColumnNames names = ColumnNames.DEFAULTS.with(renamed, "x_" + renamed);
      for (Column column : Column.values()) {
        String expected = column == renamed ? "x_" + renamed : COMPONENT.get(column).apply(ColumnNames.DEFAULTS);
        assertEquals(expected, COMPONENT.get(column).apply(names), renamed + " renamed, " + column + " read");
      }
    }
    ColumnNames both = ColumnNames.DEFAULTS.withDateColumn("day");
    assertEquals("day", both.dateColumn());
    assertEquals("day", both.calendarDateColumn());
    assertEquals("from", both.fromColumn());
  }

  @Test
  void shouldRefuseAnEmptyNameNamingTheSettingAndItsDefault() {
    InvalidRequestException units = assertThrows(InvalidRequestException.class,
        () -> ColumnNames.DEFAULTS.with(Column.UNITS, ""));
    assertEquals("\u2039units-column\u203a must name a column, got an empty name; the default is units",
        units.getMessage());
    InvalidRequestException until = assertThrows(InvalidRequestException.class,
        () -> ColumnNames.DEFAULTS.with(Column.CLOSURES_UNTIL, ""));
    assertEquals("\u2039closures-until-column\u203a must name a column, got an empty name; the default is until",
        until.getMessage());
    InvalidRequestException plan = assertThrows(InvalidRequestException.class,
        () -> new PlanSource(Path.of("plan.csv"), "", "from"));
    assertEquals("\u2039plan-date-column\u203a must name a column, got an empty name; the default is date",
        plan.getMessage());
  }
}
