package org.lagmill.cli;

import java.io.PrintWriter;
import org.lagmill.memory.ProcessMemory;
import org.lagmill.run.TrainJob;
import org.lagmill.training.PartitionReport;

/** A training's console lines: one per partition, then the memory it took and where the model went. */
final class TrainPrinter {
  private TrainPrinter() {}

  static void print(PrintWriter out, TrainJob.Outcome outcome) {
    for (PartitionReport r : outcome.partitions()) {
      out.printf("model %-12s %,d series, Dataset %,d rows x %d features (%.1f bytes per row), best iteration %d of"
          + " %d, validation %s %.5f%n", r.partitionValue(), r.seriesCount(), r.trainingRowCount(), r.featureCount(),
          r.datasetBytesPerRow(), r.bestIteration(), r.iterationCount(), r.validationMetric(),
          r.validationCurve().length == 0 ? Double.NaN : r.validationCurve()[Math.max(0, r.bestIteration() - 1)]);
      String dropped = PartitionReport.zeroRowsNotice(java.util.List.of(r));
      if (dropped != null) {
        out.println("  " + dropped);
      }
    }
    long peak = ProcessMemory.peakResidentBytes();
    long rows = outcome.partitions().stream().mapToLong(PartitionReport::trainingRowCount).max().orElse(0);
    out.printf("peak RSS %,d MB (%.1f bytes per training row of the largest partition); off-heap held: store %,d MB "
        + "mapped, learner peak %,d KB%n", peak >> 20, rows == 0 ? 0 : peak / (double) rows,
        outcome.storeOffHeapBytes() >> 20, outcome.learnerPeakBytes() >> 10);
    if (!outcome.memberNames().isEmpty()) {
      out.printf("combination of %d members, trained in turn (forecast averages them): %s%n",
          outcome.memberNames().size(), String.join(", ", outcome.memberNames()));
    }
    out.printf("model written to %s%n", outcome.modelDir());
  }
}
