package org.lagmill.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Arrays;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeaturePass;
import org.lagmill.features.FeatureSpec;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.ArraySalesHistory;

/**
 * The {@link FeaturePassBenchmark} stream timed by the streaming thread's CPU time rather than the wall clock, so a
 * figure from a machine shared with other builds counts only the time the pass actually ran (cache and core sharing
 * still slow it). Prints the median, minimum and maximum CPU ms per stream after 15 warm-up streams.
 *
 * <p>Run: {@code java --add-exports java.base/jdk.internal.misc=ALL-UNNAMED -cp bench/target/lagmill-bench.jar
 * org.lagmill.bench.FeaturePassCpuTime [streams=15]}
 */
public final class FeaturePassCpuTime {
  private static final int WARMUP_STREAMS = 15;

  private FeaturePassCpuTime() {}

  public static void main(String[] args) {
    int streamCount = args.length > 0 ? Integer.parseInt(args[0]) : 15;
    ArraySalesHistory history = FeaturePassBenchmark.generate(2000, 1000, 42L);
    FeaturePass pass = FeaturePass.training(history, FeatureSpec.defaults());
    ThreadMXBean threads = ManagementFactory.getThreadMXBean();
    double[] cpuMillis = new double[streamCount];
    float[] sink = new float[1];
    try (MemoryBudget budget = MemoryBudget.unlimited("bench");
        FeatureBatch batch = new FeatureBatch(budget, 8192, pass.schema().featureCount())) {
      for (int w = 0; w < WARMUP_STREAMS; w++) {
        pass.stream(batch, b -> sink[0] += b.get(b.rowCount() - 1, 0));
      }
      for (int r = 0; r < streamCount; r++) {
        long startNanos = threads.getCurrentThreadCpuTime();
        pass.stream(batch, b -> sink[0] += b.get(b.rowCount() - 1, 0));
        cpuMillis[r] = (threads.getCurrentThreadCpuTime() - startNanos) / 1e6;
      }
    }
    Arrays.sort(cpuMillis);
    double median = cpuMillis[streamCount / 2];
    System.out.printf("%d rows per stream: CPU ms per stream median %.1f (min %.1f, max %.1f), %.2f M rows per CPU"
        + " second (checksum %s)%n", pass.rowCount(), median, cpuMillis[0], cpuMillis[streamCount - 1],
        pass.rowCount() / median / 1e3, sink[0]);
  }
}
