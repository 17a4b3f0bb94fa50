package org.lagmill.bench;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeaturePass;
import org.lagmill.features.FeatureSchema;
import org.lagmill.features.FeatureSpec;
import org.lagmill.learner.DatasetBuilder;
import org.lagmill.learner.DatasetParameters;
import org.lagmill.learner.NativeLibrary;
import org.lagmill.learner.TrainParameters;
import org.lagmill.learner.TrainedModel;
import org.lagmill.learner.Trainer;
import org.lagmill.learner.TrainingDataset;
import org.lagmill.learner.TrainingListener;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.memory.NativeFloatArray;
import org.lagmill.memory.ProcessMemory;
import org.lagmill.store.SalesStore;

/**
 * One footprint measurement, meant to run alone in a fresh JVM (the harness starts one per mode) and to print one
 * {@link ProbeResult} line. Every mode trains on the same rows, the training rows {@code lagmill train} builds its
 * Dataset from (default feature spec, cut on the store's last day, the last horizon of days held out), with the same
 * Dataset and Booster parameters: tweedie, {@code --rounds} rounds, no early stopping, {@code --threads} threads,
 * force_col_wise.
 *
 * <p>Usage: {@code FootprintProbe MODE [--store DIR] [--dump DIR] [--rounds N] [--threads N]} with MODE one of
 * <ul>
 *   <li>{@code baseline}: loads LightGBM's native library and nothing else (the JVM baseline);
 *   <li>{@code dump}: writes the training rows to {@code --dump} (for {@code floor});
 *   <li>{@code stream}: store → feature pass → DatasetBuilder.build (sampling pass over the feature pass's sample
 *       source, then every row pushed in batches) → Trainer;
 *   <li>{@code floor}: the dumped rows read back in 64k-row chunks and pushed the same way (the file cannot subset
 *       itself by series, so its sample is drawn from every row); no store, no feature pass;
 *   <li>{@code matrix}: the whole float32 matrix in native memory → LGBM_DatasetCreateFromMat → Trainer, nothing
 *       freed until trained.
 * </ul>
 */
public final class FootprintProbe {
  private FootprintProbe() {}

  public static void main(String[] args) throws IOException {
    if (args.length < 1) {
      System.err.println("usage: FootprintProbe baseline|dump|stream|floor|matrix [--store DIR] [--dump DIR] "
          + "[--rounds N] [--threads N]");
      System.exit(2);
    }
    String mode = args[0];
    Path store = null;
    Path dump = null;
    int rounds = 10;
    int threads = 2;
    for (int i = 1; i + 1 < args.length; i += 2) {
      switch (args[i]) {
        case "--store" -> store = Path.of(args[i + 1]);
        case "--dump" -> dump = Path.of(args[i + 1]);
        case "--rounds" -> rounds = Integer.parseInt(args[i + 1]);
        case "--threads" -> threads = Integer.parseInt(args[i + 1]);
        default -> throw new IllegalArgumentException("unknown option " + args[i]
            + "; allowed: --store, --dump, --rounds, --threads");
      }
    }
    TrainParameters train = TrainParameters.defaults().withRounds(rounds, 0).withThreadCount(threads);
    DatasetParameters dataset = DatasetParameters.defaults().withThreadCount(threads);
    ProbeResult result;
    try (MemoryBudget budget = MemoryBudget.unlimited("probe")) {
      result = switch (mode) {
        case "baseline" -> baseline();
        case "dump" -> dump(require(store, "--store"), require(dump, "--dump"), budget, dataset);
        case "stream" -> stream(require(store, "--store"), budget, dataset, train);
        case "floor" -> floor(require(dump, "--dump"), budget, dataset, train);
        case "matrix" -> matrix(require(store, "--store"), budget, dataset, train);
        default -> throw new IllegalArgumentException("mode must be baseline, dump, stream, floor or matrix, got '"
            + mode + "'");
      };
    }
    System.out.println(result.toLine());
  }

  private static Path require(Path value, String option) {
    if (value == null) {
      throw new IllegalArgumentException("this mode needs " + option + " DIR");
    }
    return value;
  }

  /** The rows every mode trains on: what {@code lagmill train} streams into its training Dataset. */
  static FeaturePass trainingRows(SalesStore store) {
    FeatureSpec spec = FeatureSpec.defaults();
    int cutDayIndex = store.dayCount() - 1;
    return FeaturePass.training(store, spec, null, 0, cutDayIndex - spec.horizonDays());
  }

  private static ProbeResult baseline() {
    NativeLibrary.load();
    long peak = ProcessMemory.peakResidentBytes();
    return new ProbeResult("baseline", 0, 0, peak, peak, peak, ProcessMemory.residentBytes(), 0, 0, 0, 0, 0, 0, 0,
        0);
  }

  private static ProbeResult dump(Path storeDir, Path dumpDir, MemoryBudget budget, DatasetParameters dataset)
      throws IOException {
    try (SalesStore store = SalesStore.open(storeDir, budget.child("store"))) {
      FeaturePass rows = trainingRows(store);
      long start = System.nanoTime();
      RowDump.Header header = RowDump.write(rows, dumpDir, budget, dataset.batchRowCount());
      double seconds = (System.nanoTime() - start) / 1e9;
      long peak = ProcessMemory.peakResidentBytes();
      return new ProbeResult("dump", header.rowCount(), header.names().size(), peak, peak, peak,
          ProcessMemory.residentBytes(), seconds, 0, 0, 0, 1, store.offHeapBytes(), 0, 0);
    }
  }

  private static ProbeResult stream(Path storeDir, MemoryBudget budget, DatasetParameters dataset,
      TrainParameters train) throws IOException {
    try (SalesStore store = SalesStore.open(storeDir, budget.child("store"))) {
      return pushAndTrain("stream", trainingRows(store), budget, dataset, train, store.offHeapBytes());
    }
  }

  private static ProbeResult floor(Path dumpDir, MemoryBudget budget, DatasetParameters dataset,
      TrainParameters train) throws IOException {
    try (RowDump.FileRowStream rows = new RowDump.FileRowStream(dumpDir)) {
      return pushAndTrain("floor", rows, budget, dataset, train, 0);
    }
  }

  /** The streamed build (DatasetBuilder.build) then training; the stages are timed and their peaks read. */
  private static ProbeResult pushAndTrain(String mode, org.lagmill.features.RowStream source, MemoryBudget budget,
      DatasetParameters dataset, TrainParameters train, long storeOffHeapBytes) {
    NativeLibrary.load();
    TimedRowStream rows = new TimedRowStream(source, 2);
    long peakBefore = ProcessMemory.peakResidentBytes();
    long buildStart = System.nanoTime();
    try (TrainingDataset built = new DatasetBuilder(budget.child("learner"), dataset).build(rows)) {
      double buildSeconds = (System.nanoTime() - buildStart) / 1e9;
      long peakAfterDataset = ProcessMemory.peakResidentBytes();
      long residentAfterDataset = ProcessMemory.residentBytes();
      long trainStart = System.nanoTime();
      try (TrainedModel model = new Trainer(train).train(built, TrainingListener.NONE)) {
        double trainSeconds = (System.nanoTime() - trainStart) / 1e9;
        double sourceSeconds = rows.producerSeconds();
        double sampleSeconds = rows.consumerSeconds(0);
        System.err.printf(Locale.ROOT, "%s: %d rounds trained, passes %.2f s (%d rows) and %.2f s (%d rows)%n", mode,
            model.iterationCount(), rows.passSeconds(0), rows.passRowCount(0), rows.passSeconds(1),
            rows.passRowCount(1));
        return new ProbeResult(mode, built.rowCount(), built.featureCount(), peakBefore, peakAfterDataset,
            ProcessMemory.peakResidentBytes(), residentAfterDataset, sourceSeconds, sampleSeconds,
            buildSeconds - sourceSeconds - sampleSeconds, trainSeconds, rows.passCount(), storeOffHeapBytes,
            rows.passRowCount(0), rows.producerSeconds(0));
      }
    }
  }

  private static ProbeResult matrix(Path storeDir, MemoryBudget budget, DatasetParameters dataset,
      TrainParameters train) throws IOException {
    NativeLibrary.load();
    try (SalesStore store = SalesStore.open(storeDir, budget.child("store"))) {
      FeaturePass rows = trainingRows(store);
      FeatureSchema schema = rows.schema();
      int featureCount = schema.featureCount();
      long valueCount = rows.rowCount() * featureCount;
      if (rows.rowCount() >= Integer.MAX_VALUE) {
        throw new IllegalArgumentException(rows.rowCount() + " rows exceed LightGBM's int32 row count");
      }
      int rowCount = (int) rows.rowCount();
      long peakBefore = ProcessMemory.peakResidentBytes();
      MemoryBudget learner = budget.child("learner");
      try (OffHeapMatrix matrix = new OffHeapMatrix(valueCount);
          NativeFloatArray labels = new NativeFloatArray(learner, rowCount)) {
        long fillStart = System.nanoTime();
        try (FeatureBatch batch = new FeatureBatch(learner, Math.min(dataset.batchRowCount(), rowCount),
            featureCount)) {
          rows.stream(batch, full -> {
            int firstRow = (int) full.firstRowIndex();
            for (int row = 0; row < full.rowCount(); row++) {
              long base = (long) (firstRow + row) * featureCount;
              for (int feature = 0; feature < featureCount; feature++) {
                matrix.set(base + feature, full.get(row, feature));
              }
              labels.set(firstRow + row, full.labels()[row]);
            }
          });
        }
        double fillSeconds = (System.nanoTime() - fillStart) / 1e9;
        long datasetStart = System.nanoTime();
        try (TrainingDataset built = new DatasetBuilder(learner, dataset).buildFromMatrix(matrix.address(), rowCount,
            schema, labels)) {
          double datasetSeconds = (System.nanoTime() - datasetStart) / 1e9;
          long peakAfterDataset = ProcessMemory.peakResidentBytes();
          long residentAfterDataset = ProcessMemory.residentBytes();
          long trainStart = System.nanoTime();
          try (TrainedModel model = new Trainer(train).train(built, TrainingListener.NONE)) {
            double trainSeconds = (System.nanoTime() - trainStart) / 1e9;
            return new ProbeResult("matrix", rowCount, featureCount, peakBefore, peakAfterDataset,
                ProcessMemory.peakResidentBytes(), residentAfterDataset, fillSeconds, 0, datasetSeconds,
                trainSeconds, 1, store.offHeapBytes(), 0, 0);
          }
        }
      }
    }
  }
}
