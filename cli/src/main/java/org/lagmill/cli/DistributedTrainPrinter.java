package org.lagmill.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.lagmill.learner.DistributedBinning;
import org.lagmill.memory.ProcessMemory;
import org.lagmill.run.DistributedTrainJob;
import org.lagmill.training.DistributedTraining;
import org.lagmill.training.PartitionReport;

/**
 * The console lines of one rank of {@code train --machines}: on rank 0 what the ranks' binning changed against one
 * machine, then this rank's rows, the model over all ranks, what was dropped and the memory it took.
 */
final class DistributedTrainPrinter {
  private DistributedTrainPrinter() {}

  static void print(PrintWriter out, DistributedTrainJob.Outcome outcome) {
    int rank = outcome.rank();
    DistributedTraining.Binning binning = outcome.binning();
    if (binning.differsFromOneMachine() && rank == 0) {
      List<String> changes = new ArrayList<>();
      if (binning.categoriesPerSplit() != DistributedBinning.DEFAULT_CATEGORIES_PER_SPLIT) {
        changes.add(String.format(Locale.ROOT, "categorical splits may hold up to %d categories (one machine: %d),"
            + " so that LightGBM 4.3.0's split exchange cannot overrun", binning.categoriesPerSplit(),
            DistributedBinning.DEFAULT_CATEGORIES_PER_SPLIT));
      }
      if (!binning.categoricalsBinnedAsNumbers().isEmpty()) {
        changes.add(binning.categoricalsBinnedAsNumbers().size() + " categorical feature(s) binned as numbers on "
            + "every rank because some rank's bin sample holds no category for them "
            + binning.categoricalsBinnedAsNumbers());
      }
      out.println("distributed binning: " + String.join("; ", changes));
    }
    PartitionReport report = outcome.partition();
    out.printf(Locale.ROOT, "rank %d of %d: %,d of %,d training rows here, best iteration %d of %d, validation "
        + "%s over all ranks %.5f, model SHA-256 %s (the same on every rank)%n", rank, outcome.rankCount(),
        outcome.localTrainingRowCount(), report.trainingRowCount(), report.bestIteration(), report.iterationCount(),
        report.validationMetric(), report.validationCurve().length == 0 ? Double.NaN
            : report.validationCurve()[Math.max(0, report.bestIteration() - 1)],
        outcome.modelSha256());
    String dropped = PartitionReport.zeroRowsNotice(List.of(report));
    if (dropped != null) {
      out.printf(Locale.ROOT, "rank %d: over all ranks %s%n", rank, dropped);
    }
    out.printf(Locale.ROOT, "rank %d: peak RSS %,d MB, learner off-heap peak %,d KB%s%n", rank,
        ProcessMemory.peakResidentBytes() >> 20, outcome.learnerPeakBytes() >> 10,
        outcome.modelDir() == null ? "" : ", model written to " + outcome.modelDir());
  }
}
