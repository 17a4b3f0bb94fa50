package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesStore;

/** A date outside the plausible window stops the run with file, line and column, before any store is written. */
class DateWindowTest {
  @TempDir
  Path temp;

  @AfterEach
  void resetWindow() {
    DateWindow.reset();
  }

  private void ingest(Path sales, Path store) throws IOException {
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(sales, store), budget);
    }
  }

  @Test
  void shouldRefuseATypoYearInALongFileInsteadOfBuildingMillionsOfDays() throws IOException {
    Path sales = Files.writeString(temp.resolve("long.csv"), "sku,shop,date,units\nk1,s1,2024-01-05,3\n"
        + "k1,s1,9024-01-05,4\nk2,s1,2024-01-06,1\n");
    InputFormatException e = assertThrows(InputFormatException.class, () -> ingest(sales, temp.resolve("store")));
    assertEquals(sales + ", line 3, column 3: date 9024-01-05: expected a date within 1900-01-01..2200-12-31 (a typo? "
        + "a wider window can be asked for)", e.getMessage());
    assertFalse(Files.exists(temp.resolve("store")));
  }

  @Test
  void shouldRefuseAWideHeaderDateOutsideTheWindowAndAcceptItOnceWidened() throws IOException {
    Path sales = Files.writeString(temp.resolve("wide.csv"), "sku,1850-03-01,1850-03-02\nk1,1,2\n");
    InputFormatException e = assertThrows(InputFormatException.class, () -> ingest(sales, temp.resolve("store")));
    assertEquals(sales + ", line 1, column 2: date column 1850-03-01: expected a date within "
        + "1900-01-01..2200-12-31 (a typo? a wider window can be asked for)", e.getMessage());
    DateWindow.set(LocalDate.of(1800, 1, 1), LocalDate.of(2200, 12, 31));
    ingest(sales, temp.resolve("store"));
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
      assertEquals(LocalDate.of(1850, 3, 1), store.firstDate());
    }
  }

  @Test
  void shouldRefuseAWindowThatEndsBeforeItStarts() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> DateWindow.set(LocalDate.of(2000, 1, 1), LocalDate.of(1999, 1, 1)));
    assertEquals("date window 2000-01-01..1999-01-01: the last date must not be before the first", e.getMessage());
  }

  @Test
  void shouldRefuseAHorizonThatReachesPastTheWindow() {
    LocalDate next = LocalDate.of(2026, 1, 19);
    // 2026-01-19 .. 2200-12-31 holds 63,899 days (Python: (date(2200, 12, 31) - date(2026, 1, 19)).days + 1)
    DateWindow.requireHorizonWithin(next, 1, 63_899);
    InvalidRequestException e = assertThrows(InvalidRequestException.class,
        () -> DateWindow.requireHorizonWithin(next, 1, 63_900));
    assertEquals("‹horizon› 63900 reaches past 2200-12-31, the last plausible date: expected at most 63899 periods"
        + " from 2026-01-19", e.getMessage());
    // weekly: the 9,129th week starts on 2200-12-29 (Python: date(2026, 1, 19) + timedelta(days=9128 * 7))
    DateWindow.requireHorizonWithin(next, 7, 9_129);
    assertThrows(InvalidRequestException.class, () -> DateWindow.requireHorizonWithin(next, 7, 9_130));
    assertThrows(InvalidRequestException.class, () -> DateWindow.requireHorizonWithin(next, 7, Integer.MAX_VALUE));
  }
}
