package org.lagmill.bench;

import java.time.LocalDate;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.lagmill.eval.BaselineForecaster;
import org.lagmill.eval.BaselineKind;
import org.lagmill.store.ArraySalesHistory;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Time of the ETS baseline (every form fitted by likelihood, the smallest AICc kept) over a history of daily series,
 * beside the seasonal naive and simple exponential smoothing baselines on the same history. One operation forecasts
 * every series 28 days ahead; divide by {@link #seriesCount} for the time per series. The series mix what a retail
 * store holds: a third fast movers with a weekly pattern (every value positive, so the multiplicative-season forms
 * are fitted too), a third slow movers (Poisson mean 0.3 to 2, zeros), a third intermittent (a sale every week or
 * two), each with 3% unknown days and a launch somewhere in the first year.
 *
 * <p>Run: {@code java -jar bench/target/lagmill-bench.jar EtsBaselineBenchmark -f 1 -wi 1 -i 3}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1)
@Warmup(iterations = 1, time = 5)
@Measurement(iterations = 3, time = 5)
public class EtsBaselineBenchmark {
  private static final int HORIZON_DAYS = 28;

  @Param({"1000"})
  int seriesCount;

  @Param({"730"})
  int dayCount;

  private ArraySalesHistory history;

  @Setup
  public void setUp() {
    SplittableRandom random = new SplittableRandom(42L);
    int[][] units = new int[seriesCount][dayCount];
    double[] weekday = {0.8, 0.7, 0.9, 1.0, 1.3, 1.6, 0.7};
    for (int s = 0; s < seriesCount; s++) {
      int launch = random.nextInt(365);
      int kind = s % 3;
      double mean = kind == 0 ? 8 + random.nextDouble() * 30 : kind == 1 ? 0.3 + random.nextDouble() * 1.7
          : 0.08 + random.nextDouble() * 0.1;
      for (int d = 0; d < dayCount; d++) {
        if (d < launch) {
          continue;
        }
        if (random.nextInt(33) == 0) {
          units[s][d] = -1;
          continue;
        }
        double lambda = mean * (kind == 2 ? 1 : weekday[d % 7]);
        units[s][d] = kind == 0 ? Math.max(1, poisson(random, lambda)) : poisson(random, lambda);
      }
    }
    history = ArraySalesHistory.ofUnits(LocalDate.of(2024, 1, 1), units);
  }

  private static int poisson(SplittableRandom random, double lambda) {
    double limit = Math.exp(-lambda);
    double product = random.nextDouble();
    int count = 0;
    while (product > limit) {
      product *= random.nextDouble();
      count++;
    }
    return count;
  }

  @Benchmark
  public double[][] ets() {
    return BaselineForecaster.forecastAll(history, dayCount, HORIZON_DAYS, BaselineKind.ETS);
  }

  @Benchmark
  public double[][] seasonalNaive() {
    return BaselineForecaster.forecastAll(history, dayCount, HORIZON_DAYS, BaselineKind.SEASONAL_NAIVE);
  }

  @Benchmark
  public double[][] simpleExponentialSmoothing() {
    return BaselineForecaster.forecastAll(history, dayCount, HORIZON_DAYS, BaselineKind.SES);
  }
}
