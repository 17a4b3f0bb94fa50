package org.lagmill.ingest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesStore;

/**
 * Writers and readers of one store at the same time: two appends of the same next day never both land (the second
 * waits for the first, then finds the day taken), and a reader opened during appends sees one whole generation.
 */
@Tag("reliability")
class ConcurrentStoreUseTest {
  private static final LocalDate FIRST = LocalDate.of(2025, 1, 1);
  private static final int SERIES = 40;

  @TempDir
  Path temp;

  /** Units of series s on day d: series s widens from one byte to two on day 3·s, so layouts change per append. */
  private static int unitsOf(int s, int d) {
    return d >= 3 * s ? 1000 + d : (s + d) % 7;
  }

  private Path dayFile(String name, int fromDay, int toDay, int bias) throws IOException {
    StringBuilder csv = new StringBuilder("sku,shop");
    for (int d = fromDay; d < toDay; d++) {
      csv.append(',').append(FIRST.plusDays(d));
    }
    csv.append('\n');
    for (int s = 0; s < SERIES; s++) {
      csv.append("k").append(s).append(",s").append(s % 3);
      for (int d = fromDay; d < toDay; d++) {
        csv.append(',').append(unitsOf(s, d) + bias);
      }
      csv.append('\n');
    }
    return Files.writeString(temp.resolve(name), csv);
  }

  @Test
  void shouldLandOneOfTwoAppendsOfTheSameDayAndRefuseTheOther() throws Exception {
    Path store = temp.resolve("store");
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(dayFile("base.csv", 0, 5, 0), store), budget);
      for (int round = 0; round < 4; round++) {
        int day = 5 + round;
        List<Path> files = List.of(dayFile("a" + round + ".csv", day, day + 1, 0),
            dayFile("b" + round + ".csv", day, day + 1, 1));
        List<String> outcomes = Collections.synchronizedList(new ArrayList<>());
        CountDownLatch start = new CountDownLatch(1);
        List<Thread> threads = new ArrayList<>();
        for (Path file : files) {
          Thread t = new Thread(() -> {
            try {
              start.await();
              StoreAppend.append(AppendOptions.of(store, file), budget);
              outcomes.add("landed " + file.getFileName());
            } catch (InputFormatException e) {
              outcomes.add("refused");
            } catch (Exception e) {
              outcomes.add("failed " + e);
            }
          });
          t.start();
          threads.add(t);
        }
        start.countDown();
        for (Thread t : threads) {
          t.join(60_000);
        }
        assertEquals(2, outcomes.size(), outcomes.toString());
        assertTrue(outcomes.contains("refused"), outcomes.toString());
        int bias = outcomes.contains("landed a" + round + ".csv") ? 0 : 1;
        try (SalesStore opened = SalesStore.open(store, budget)) {
          assertEquals(day + 1, opened.dayCount(), "exactly one day was added");
          for (int s = 0; s < SERIES; s++) {
            assertEquals(unitsOf(s, day) + bias, opened.units(opened.attributes().seriesIndexOf("k" + s + "/s"
                + s % 3), day), "series " + s + " holds the winner's day, whole");
          }
        }
      }
      assertEquals(0, budget.heldBytes());
    }
  }

  @Test
  void shouldLetReadersSeeOnlyWholeGenerationsWhileAppendsRun() throws Exception {
    Path store = temp.resolve("store");
    int appends = 12;
    AtomicBoolean done = new AtomicBoolean();
    AtomicInteger opens = new AtomicInteger();
    List<String> problems = Collections.synchronizedList(new ArrayList<>());
    try (MemoryBudget budget = MemoryBudget.unlimited("test")) {
      StoreIngest.ingest(IngestOptions.of(dayFile("base.csv", 0, 3, 0), store), budget);
      List<Thread> readers = new ArrayList<>();
      for (int r = 0; r < 2; r++) {
        Thread reader = new Thread(() -> {
          int[] units = new int[64];
          while (!done.get()) {
            try (SalesStore opened = SalesStore.open(store, budget)) {
              opens.incrementAndGet();
              int days = opened.dayCount();
              for (int s = 0; s < SERIES; s++) {
                int index = opened.attributes().seriesIndexOf("k" + s + "/s" + s % 3);
                opened.readUnits(index, 0, units, 0, days);
                for (int d = 0; d < days; d++) {
                  if (units[d] != unitsOf(s, d)) {
                    problems.add("series " + s + " day " + d + " of " + days + ": " + units[d]);
                  }
                }
              }
            } catch (Exception e) {
              problems.add(e.toString());
            }
          }
        });
        reader.start();
        readers.add(reader);
      }
      for (int day = 3; day < 3 + appends; day++) {
        StoreAppend.append(AppendOptions.of(store, dayFile("d" + day + ".csv", day, day + 1, 0)), budget);
      }
      done.set(true);
      for (Thread reader : readers) {
        reader.join(60_000);
      }
      assertEquals(List.of(), problems.subList(0, Math.min(5, problems.size())));
      assertTrue(opens.get() > 0);
      try (SalesStore opened = SalesStore.open(store, budget)) {
        assertEquals(3 + appends, opened.dayCount());
      }
      assertEquals(0, budget.heldBytes());
    }
  }
}
