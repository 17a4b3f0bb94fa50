package org.lagmill.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreDirectories;
import org.lagmill.store.StoreWriter;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.Blackhole;

/**
 * Bulk read of every series' units from the mapped store, per width, against a plain {@code int[][]} baseline.
 * Score is microseconds per full pass over {@code seriesCount * dayCount} item-days.
 * Run: {@code java --add-exports java.base/jdk.internal.misc=ALL-UNNAMED -jar bench/target/lagmill-bench.jar
 * UnitsReadBenchmark -prof gc}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(value = 1, jvmArgsAppend = {"--add-exports", "java.base/jdk.internal.misc=ALL-UNNAMED"})
public class UnitsReadBenchmark {
  @Param({"BYTE", "SHORT", "INT"})
  public String width;

  @Param({"1000"})
  public int seriesCount;

  @Param({"1941"})
  public int dayCount;

  private Path dir;
  private MemoryBudget budget;
  private SalesStore store;
  private int[][] plain;
  private int[] row;

  @Setup(Level.Trial)
  public void setUp() throws IOException {
    int max = switch (width) {
      case "BYTE" -> 254;
      case "SHORT" -> 65_534;
      default -> 1_000_000;
    };
    Random random = new Random(1);
    plain = new int[seriesCount][dayCount];
    dir = Files.createTempDirectory("units-bench");
    budget = MemoryBudget.unlimited("bench");
    try (StoreWriter writer = new StoreWriter(dir.resolve("store"), LocalDate.of(2020, 1, 1), dayCount,
        List.of("item"), budget)) {
      for (int s = 0; s < seriesCount; s++) {
        for (int d = 0; d < dayCount; d++) {
          plain[s][d] = random.nextInt(20) == 0 ? -1 : random.nextInt(max + 1);
        }
        plain[s][0] = max;
        writer.addSeries(new String[] {"item-" + s}, plain[s]);
      }
      writer.finish(List.of());
    }
    store = SalesStore.open(dir.resolve("store"), budget);
    row = new int[dayCount];
  }

  @TearDown(Level.Trial)
  public void tearDown() throws IOException {
    store.close();
    budget.close();
    StoreDirectories.deleteRecursively(dir);
  }

  @Benchmark
  public void storeBulkRead(Blackhole blackhole) {
    long sum = 0;
    for (int s = 0; s < seriesCount; s++) {
      store.readUnits(s, 0, row, 0, dayCount);
      sum += row[dayCount - 1];
    }
    blackhole.consume(sum);
    blackhole.consume(row);
  }

  @Benchmark
  public void plainArrayCopy(Blackhole blackhole) {
    long sum = 0;
    for (int s = 0; s < seriesCount; s++) {
      System.arraycopy(plain[s], 0, row, 0, dayCount);
      sum += row[dayCount - 1];
    }
    blackhole.consume(sum);
    blackhole.consume(row);
  }
}
