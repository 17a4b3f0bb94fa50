package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Random;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.RandomStoreData;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreAssertions;

/**
 * Files wider than the CSV parser's default of 16,384 fields are read by every reader up to 1,048,576 columns and
 * refused beyond, with the limit named.
 */
@Tag("reliability")
class WideColumnsTest {
  private static final long MASTER_SEED = TestSeeds.master(20_000L);
  private static final String LIMIT_MESSAGE = ": more than 1,048,576 columns: expected at most 1,048,576 columns in"
      + " a line";

  @TempDir
  Path temp;

  @Test
  void shouldIngestTwentyThousandDayColumnsDetectedFromTheHeader() throws IOException {
    RandomStoreData data = new RandomStoreData(MASTER_SEED, 3, 20_000);
    Path csv = temp.resolve("wide.csv");
    Files.writeString(csv, WideCsv.of(RandomStoreData.ATTRIBUTE_NAMES, data.attributeValues,
        RandomStoreData.FIRST_DATE, data.units, 0, data.dayCount));
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      // the default format is detected from the header, which the field-based reader reads
      StoreIngest.ingest(IngestOptions.of(csv, temp.resolve("store")).withPrices(data.prices())
          .withCalendar(data.calendar), budget);
      try (SalesStore store = SalesStore.open(temp.resolve("store"), budget)) {
        assertEquals(20_000, store.dayCount());
        StoreAssertions.assertSameHistory(data.reference(), store, new Random(MASTER_SEED),
            "master seed " + MASTER_SEED);
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldReadARecordOfTwentyThousandFieldsInEveryFieldBasedReader() {
    StringBuilder text = new StringBuilder("date");
    for (int c = 1; c < 20_000; c++) {
      text.append(",c").append(c);
    }
    text.append("\n2024-01-01");
    for (int c = 1; c < 20_000; c++) {
      text.append(',').append(c % 7);
    }
    Path file = IngestFiles.write(temp, "calendar.csv", text.append('\n').toString());
    try (CsvSource source = CsvSource.open(file)) {
      assertEquals(20_000, source.readHeader().length);
      assertEquals(String.valueOf(19_999 % 7), source.next().getField(19_999));
    }
  }

  private Path header(String name, int columnCount) {
    byte[] line = new byte[2 * columnCount];
    for (int c = 0; c < columnCount; c++) {
      line[2 * c] = 'x';
      line[2 * c + 1] = (byte) (c == columnCount - 1 ? '\n' : ',');
    }
    try {
      return Files.write(temp.resolve(name), line);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  @Test
  void shouldRefuseOneColumnBeyondTheLimitNamingIt() {
    Path file = header("over.csv", ColumnLimit.MAX_COLUMN_COUNT + 1);
    InputFormatException fieldBased = assertThrows(InputFormatException.class, () -> {
      try (CsvSource source = CsvSource.open(file)) {
        source.readHeader();
      }
    });
    assertEquals(file + ", line 1" + LIMIT_MESSAGE, fieldBased.getMessage());
    InputFormatException byteBased = assertThrows(InputFormatException.class,
        () -> WideSalesReader.open(file, "series_id").close());
    assertEquals(file + ", line 1" + LIMIT_MESSAGE, byteBased.getMessage());
  }

  @Test
  void shouldRefuseALineBeyondTheParsersOwnLimitInTheSameWords() {
    Path file = header("far.csv", 2 * ColumnLimit.MAX_COLUMN_COUNT + 1);
    InputFormatException e = assertThrows(InputFormatException.class, () -> {
      try (CsvSource source = CsvSource.open(file)) {
        source.readHeader();
      }
    });
    assertEquals(file + ", line 1" + LIMIT_MESSAGE, e.getMessage());
  }

  @Test
  void shouldReadExactlyTheLimit() {
    Path file = header("at.csv", ColumnLimit.MAX_COLUMN_COUNT);
    try (CsvSource source = CsvSource.open(file)) {
      assertEquals(ColumnLimit.MAX_COLUMN_COUNT, source.readHeader().length);
    }
  }
}
