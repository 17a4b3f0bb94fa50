package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.ingest.ColumnNames.Column;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.Periods;
import org.lagmill.store.SalesStore;

/**
 * A very sparse daily export can look like another period: here every sale lies an even number of days from the
 * first, so the most common gap is 2 days. Detection says so and warns; {@code --period day} reads it daily (the days
 * between filled by the missing-rows policy); a given period is checked against the dates and the header.
 */
class PeriodOptionTest {
  /** Two skus selling on 03-01, 03-03, 03-05, 03-09 only (hand-made: every gap 2 or 4 days). */
  private static final String SPARSE = """
      sku,shop,day,qty
      A,s1,2025-03-01,2
      B,s1,2025-03-03,1
      A,s1,2025-03-05,4
      B,s1,2025-03-05,1
      A,s1,2025-03-09,3
      """;

  @TempDir
  Path temp;

  private final ColumnNames columns = ColumnNames.DEFAULTS.with(Column.SALES_DATE, "day").with(Column.UNITS, "qty");

  @Test
  void shouldSayWhichPeriodItDetectedAndWarnOnAnUnusualOne() throws Exception {
    Path sales = Files.writeString(temp.resolve("till.csv"), SPARSE);
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      IngestResult detected = StoreIngest.ingest(
          IngestOptions.of(SalesInputs.of(sales).withColumns(columns), temp.resolve("a")),
          budget);
      // Gaps between the distinct dates 03-01, 03-03, 03-05, 03-09: 2, 2, 4.
      assertEquals("period every 2 days: detected from the sales dates, the most common gap between consecutive "
          + "dates (2 of 3 gaps)", detected.periodNote());
      assertEquals(2, detected.manifest().periodDaysOrDaily());
      assertEquals(5, detected.manifest().dayCount());
      assertEquals("the sales dates lie 2 days apart most often, so the store holds one value per 2 days; if these "
          + "are daily (or weekly) sales with some days missing, give ‹period› day (or ‹period› week)",
          detected.warnings().get(0));

      IngestResult daily = StoreIngest
          .ingest(IngestOptions.of(SalesInputs.of(sales).withColumns(columns), temp.resolve("b"))
              .withPeriodDays(1), budget);
      assertEquals("period daily: given with ‹period›", daily.periodNote());
      assertEquals(9, daily.manifest().dayCount());
      // A: 03-02 .. 03-04, 03-06 .. 03-08 zero (6); B: 03-04, 03-06 .. 03-09 zero (5), 03-01, 03-02 unknown.
      assertEquals(11, daily.manifest().fill().zeroFilledItemDays());
      assertEquals(2, daily.manifest().fill().unknownItemDays());
      try (SalesStore store = SalesStore.open(temp.resolve("b"), budget)) {
        int a = store.attributes().seriesIndexOf("A/s1");
        int[] units = new int[9];
        store.readUnits(a, 0, units, 0, 9);
        assertEquals(List.of(2, 0, 0, 0, 4, 0, 0, 0, 3), java.util.Arrays.stream(units).boxed().toList());
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldCheckAGivenPeriodAgainstTheData() throws Exception {
    Path sales = Files.writeString(temp.resolve("till.csv"), SPARSE);
    Path wide = Files.writeString(temp.resolve("wide.csv"), "sku,shop,2025-03-03,2025-03-10\nA,s1,1,2\n");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      InputFormatException e = assertThrows(InputFormatException.class, () -> StoreIngest.ingest(
          IngestOptions.of(SalesInputs.of(sales).withColumns(columns), temp.resolve("a")).withPeriodDays(7), budget));
      assertEquals(sales + ", line 3, column 3: day '2025-03-03' is off the file's step of 7 days (given with "
          + "‹period›, from 2025-03-01): expected 2025-03-01 or 2025-03-08", e.getMessage());
      e = assertThrows(InputFormatException.class, () -> StoreIngest.ingest(IngestOptions.of(wide, temp.resolve("b"))
          .withPeriodDays(1), budget));
      assertEquals(wide + ", line 1: date columns 7 days apart: expected the step given with ‹period›, 1 day",
          e.getMessage());
      IngestResult weekly = StoreIngest.ingest(IngestOptions.of(wide, temp.resolve("c")), budget);
      assertEquals("period weekly: detected from the step between the date columns", weekly.periodNote());
      assertEquals(0, budget.heldBytes());
    }
    assertEquals(14, Periods.parse("--period", "14"));
    assertEquals(7, Periods.parse("--period", "WEEK"));
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Periods.parse("--period",
        "month"));
    assertEquals("--period must be day, week or a number of days 1 to 366, got 'month'", e.getMessage());
  }
}
