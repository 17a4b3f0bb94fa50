package org.lagmill.cli;

import java.io.PrintWriter;
import java.util.Locale;
import org.lagmill.memory.ProcessMemory;
import org.lagmill.run.TrainJob;
import org.lagmill.training.PartitionReport;

/** A training's console lines: one per partition, then the memory it took and where the model went. */
final class TrainPrinter {
  private TrainPrinter() {}

  /** What a continued model started from and what it added, e.g. for a console line. */
  static String continuation(PartitionReport r) {
    String losses = r.startingValidationLoss() == null ? "" : String.format(Locale.ROOT,
        "; validation %s %.5f before, %.5f after", r.validationMetric(), r.startingValidationLoss(),
        r.bestIteration() == 0 ? r.startingValidationLoss() : r.validationCurve()[r.bestIteration() - 1]);
    return String.format(Locale.ROOT, "continued from %s (%d rounds), added %d rounds (%d in all)%s",
        r.continuedFrom(), r.startingRounds(), r.addedRounds(), r.iterationCount(), losses);
  }

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
      if (r.continued()) {
        out.println("  " + continuation(r));
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
