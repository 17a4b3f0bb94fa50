package org.lagmill.bench;

import java.time.LocalDate;
import java.util.List;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeaturePass;
import org.lagmill.features.FeatureSpec;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.ArrayDayCalendar;
import org.lagmill.store.ArrayPriceTable;
import org.lagmill.store.ArraySalesHistory;
import org.lagmill.store.ArraySeriesAttributes;
import org.lagmill.store.DayCalendar;
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
 * Rows per second of the feature pass alone (no learner) over a generated history with the default spec: lags,
 * rolling mean/std, calendar with a per-region column, price with group means, series features. One operation streams
 * every training row; divide {@link #rowCount} by the seconds per operation for rows/s. The baseline copies the same
 * number of floats into a plain array, the floor any row producer pays.
 *
 * <p>Defaults: 1 fork, 2 warm-up and 5 measured iterations of 2 s. Run: {@code java -jar bench/target/lagmill-bench.jar
 * FeaturePassBenchmark -prof gc} (bytes per operation should be near zero beyond the per-stream setup).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1, jvmArgsAppend = {"--add-exports", "java.base/jdk.internal.misc=ALL-UNNAMED"})
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 5, time = 2)
public class FeaturePassBenchmark {
  @Param({"2000"})
  int seriesCount;

  @Param({"1000"})
  int dayCount;

  @Param({"8192"})
  int batchRows;

  long rowCount;
  private MemoryBudget budget;
  private FeatureBatch batch;
  private FeaturePass pass;
  private float[] baselineRow;

  @Setup(Level.Trial)
  public void setUp() {
    ArraySalesHistory history = generate(seriesCount, dayCount, 42L);
    pass = FeaturePass.training(history, FeatureSpec.defaults());
    rowCount = pass.rowCount();
    budget = MemoryBudget.unlimited("bench");
    batch = new FeatureBatch(budget, batchRows, pass.schema().featureCount());
    baselineRow = new float[batchRows * pass.schema().featureCount()];
    System.out.println("rows per operation: " + rowCount + ", features: " + pass.schema().featureCount());
  }

  @TearDown(Level.Trial)
  public void tearDown() {
    batch.close();
    budget.close();
  }

  @Benchmark
  public void featurePass(Blackhole blackhole) {
    pass.stream(batch, b -> blackhole.consume(b.get(b.rowCount() - 1, 0)));
  }

  /** Writes as many floats as the pass produces, into a heap array, with no feature logic. */
  @Benchmark
  public void plainArrayBaseline(Blackhole blackhole) {
    int featureCount = pass.schema().featureCount();
    long remaining = rowCount;
    float v = 0;
    while (remaining > 0) {
      int rows = (int) Math.min(remaining, batchRows);
      for (int i = 0; i < rows * featureCount; i++) {
        baselineRow[i] = v;
        v += 1f;
      }
      blackhole.consume(baselineRow[0]);
      remaining -= rows;
    }
  }

  static ArraySalesHistory generate(int seriesCount, int dayCount, long seed) {
    Random random = new Random(seed);
    int[][] units = new int[seriesCount][dayCount];
    String[][] attributes = new String[seriesCount][];
    int[][] changeDays = new int[seriesCount][];
    float[][] changePrices = new float[seriesCount][];
    for (int s = 0; s < seriesCount; s++) {
      int store = s % 10;
      int item = s / 10;
      attributes[s] = new String[] {"item_" + item + "_store_" + store, "item_" + item, "dept_" + item % 7,
          "store_" + store, "region_" + store % 3};
      int launch = random.nextInt(4) == 0 ? random.nextInt(dayCount / 2) : 0;
      for (int d = 0; d < dayCount; d++) {
        units[s][d] = d < launch || random.nextInt(3) == 0 ? 0 : random.nextInt(12);
      }
      units[s][launch] = 1;
      int changes = 1 + dayCount / 60;
      changeDays[s] = new int[changes];
      changePrices[s] = new float[changes];
      for (int k = 0; k < changes; k++) {
        changeDays[s][k] = k * 60;
        changePrices[s][k] = 1 + random.nextInt(500) / 100f;
      }
    }
    float[][] payday = new float[3][dayCount + 28];
    for (float[] row : payday) {
      for (int d = 0; d < row.length; d++) {
        row[d] = d % 14 == 0 ? 1 : 0;
      }
    }
    DayCalendar calendar = new ArrayDayCalendar(dayCount + 28, List.of(
        new ArrayDayCalendar.Column("payday", DayCalendar.ColumnKind.NUMERIC, null, "region", payday)));
    return new ArraySalesHistory(LocalDate.of(2021, 1, 4), units, ArraySeriesAttributes.of(
        new String[] {"series_id", "item", "department", "store", "region"}, attributes),
        new ArrayPriceTable(changeDays, changePrices), calendar);
  }
}
