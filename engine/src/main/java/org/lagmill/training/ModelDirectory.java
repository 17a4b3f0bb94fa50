package org.lagmill.training;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.BufferedReader;
import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.lagmill.features.FeatureSpec;
import org.lagmill.features.FeatureSpecYaml;
import org.lagmill.io.Crc32c;
import org.lagmill.io.CsvCells;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.OutputRefusedException;
import org.lagmill.io.OutputTargets;
import org.lagmill.io.Setting;
import org.lagmill.io.SealedJson;
import org.lagmill.learner.RowScores;
import org.lagmill.learner.TrainedModel;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.CorruptStoreException;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesIdentity;
import org.lagmill.store.StoreDirectories;
import org.lagmill.store.StoreGenerations;

/**
 * Saves a {@link ModelSet} as a directory (LightGBM model files, {@code manifest.json}, {@code dispersion.csv}) and
 * opens it again against a store. Saving builds a temporary sibling and renames it into place, so a failed run never
 * damages an existing model directory; opening verifies each model file's checksum.
 */
public final class ModelDirectory {
  static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

  private ModelDirectory() {}

  /** One series' negative binomial dispersion, as {@code dispersion.csv} holds it. */
  public record SeriesDispersion(String seriesId, float dispersion) {}

  /** Writes the model set; {@code trainingFirstDate} etc. describe the windows the models learned from. */
  public static ModelManifest save(ModelSet models, Path dir, SalesHistory history, TrainingPlan plan,
      String storeFingerprint) throws IOException {
    List<SeriesDispersion> rows = new ArrayList<>();
    float[] dispersion = models.dispersionBySeries();
    for (int s = 0; s < dispersion.length; s++) {
      rows.add(new SeriesDispersion(history.attributes().seriesId(s), dispersion[s]));
    }
    return save(models, dir, history, plan, storeFingerprint, rows);
  }

  /**
   * As {@link #save(ModelSet, Path, SalesHistory, TrainingPlan, String)} with the dispersion rows given: a distributed
   * training's rank 0 writes every rank's series, so each shard finds its own when it forecasts.
   */
  public static ModelManifest save(ModelSet models, Path dir, SalesHistory history, TrainingPlan plan,
      String storeFingerprint, List<SeriesDispersion> dispersionRows) throws IOException {
    checkTarget(dir);
    Path temp = StoreDirectories.createTempSibling(dir);
    try {
      Map<String, String> checksums = new LinkedHashMap<>();
      List<PartitionReport> reports = new ArrayList<>();
      for (ModelSet.Partition partition : models.partitions()) {
        Path file = temp.resolve(partition.report().modelFile());
        partition.model().saveTo(file);
        checksums.put(partition.report().modelFile(), crc32c(file));
        if (partition.model().rowScores() != null) {
          partition.model().rowScores().write(temp.resolve(rowScoresFileName(partition.report().modelFile())));
        }
        reports.add(partition.report());
      }
      Path dispersionFile = temp.resolve(ModelManifest.DISPERSION_FILE_NAME);
      writeDispersion(dispersionFile, dispersionRows);
      ModelManifest manifest = new ModelManifest(ModelManifest.FORMAT_VERSION_CURRENT, Instant.now().toString(),
          storeFingerprint, FeatureSpecYaml.format(models.spec()), parameters(plan.trainParameters()),
          parameters(plan.datasetParameters()), history.dateOf(0).toString(),
          history.dateOf(plan.trainingLastDayIndex()).toString(), history.dateOf(plan.validationFirstDayIndex())
              .toString(),
          history.dateOf(plan.cutDayIndex()).toString(), plan.partitionAttribute(), reports, checksums,
          ModelManifest.DISPERSION_FILE_NAME, crc32c(dispersionFile), plan.zeroRowsKept());
      Files.write(temp.resolve(ModelManifest.FILE_NAME), SealedJson.seal(JSON.writeValueAsBytes(manifest)));
      StoreDirectories.publish(temp, dir);
      return manifest;
    } catch (IOException | RuntimeException | Error e) {
      // The save's own failure is what the user needs to see; a failed clean-up rides along with it.
      StoreDirectories.deleteAfterFailure(temp, e);
      throw e;
    }
  }

  /**
   * Checks, before anything is trained or written, that a model may be saved at {@code dir}: a missing or empty
   * folder or one holding a model; a store folder is refused in those words, anything else as not ours.
   *
   * @throws org.lagmill.io.OutputRefusedException when {@code dir} holds a store or anything but a model
   */
  public static void checkTarget(Path dir) throws IOException {
    StoreDirectories.recoverSiblings(dir);
    if (holdsAStore(dir)) {
      throw new OutputRefusedException(dir, OutputRefusedException.Reason.NOT_OURS, "it holds a sales store, not a"
          + " model; nothing was changed, choose a new or empty folder for the model (a store folder goes to "
          + Setting.STORE + ")");
    }
    OutputTargets.checkFolder(dir.toAbsolutePath().normalize(), "model directory",
        d -> looksLikeModel(d) || ModelCombination.looksLikeCombination(d), Set.of());
  }

  /** Reads only the manifest, checking its checksum (format version 2) and version. */
  public static ModelManifest readManifest(Path dir) throws IOException {
    StoreDirectories.recoverSiblings(dir);
    Path file = dir.resolve(ModelManifest.FILE_NAME);
    if (Files.isRegularFile(dir)) {
      throw new FileSystemException(dir.toString(), null, "is a file, not a model: give the folder train wrote");
    }
    if (holdsAStore(dir)) {
      throw new FileSystemException(dir.toString(), null, "not a model: it holds a sales store; give the folder"
          + " train wrote (a store folder goes to " + Setting.STORE + ")");
    }
    if (!Files.exists(file) && ModelCombination.isCombination(dir)) {
      throw new InvalidRequestException(dir + " holds a combination of models (" + ModelCombination.FILE_NAME
          + "), which only a forecast reads as a whole; give one member's folder, e.g. " + dir.resolve("member-1"));
    }
    if (!Files.exists(file)) {
      throw new NoSuchFileException(file.toString(), null, "not a model directory: no " + ModelManifest.FILE_NAME);
    }
    SealedJson.Unsealed unsealed = SealedJson.unseal(file, Files.readAllBytes(file));
    ModelManifest manifest;
    try {
      manifest = JSON.readValue(unsealed.bytes(), ModelManifest.class);
    } catch (JsonProcessingException e) {
      throw new CorruptStoreException(file, "not a valid model manifest: " + e.getOriginalMessage(), e);
    }
    int version = manifest.formatVersion();
    if (version < ModelManifest.FORMAT_VERSION_OLDEST || version > ModelManifest.FORMAT_VERSION_CURRENT) {
      throw new CorruptStoreException(file, "unsupported model format version: expected "
          + ModelManifest.FORMAT_VERSION_OLDEST + " to " + ModelManifest.FORMAT_VERSION_CURRENT + ", actual "
          + version);
    }
    if (version >= 2 && (!unsealed.sealed() || manifest.dispersionFileChecksum() == null)) {
      throw new CorruptStoreException(file, "expected the " + SealedJson.MEMBER + " member and the dispersion "
          + "table's checksum in format version " + version + ", actual " + (unsealed.sealed() ? "no dispersion "
              + "checksum" : "no " + SealedJson.MEMBER + " member"));
    }
    return manifest;
  }

  /** A store folder: the pointer of the generation layout, or a version-1 store manifest (files and fingerprint). */
  private static boolean holdsAStore(Path dir) {
    if (Files.isRegularFile(dir.resolve(StoreGenerations.POINTER_FILE_NAME))) {
      return true;
    }
    Path file = dir.resolve(ModelManifest.FILE_NAME);
    try {
      JsonNode tree = JSON.readTree(file.toFile());
      return tree != null && tree.has("fingerprint") && tree.has("files") && !tree.has("modelFileChecksums");
    } catch (IOException e) {
      return false;
    }
  }

  /** A folder holding a model manifest that parses (checksums aside): one lagmill may replace. */
  static boolean looksLikeModel(Path dir) {
    Path file = dir.resolve(ModelManifest.FILE_NAME);
    if (!Files.isRegularFile(file)) {
      return false;
    }
    try {
      return JSON.readTree(file.toFile()).has("modelFileChecksums");
    } catch (IOException e) {
      return false;
    }
  }

  /**
   * Opens the models for forecasting the series of {@code history}; each series goes to the model of its partition
   * value and takes its stored dispersion (the pooled one of its partition when the series is new).
   */
  public static ModelSet open(Path dir, SalesHistory history) throws IOException {
    ModelManifest manifest = readManifest(dir);
    FeatureSpec spec = FeatureSpecYaml.parse(manifest.featureSpecYaml(), dir.resolve(ModelManifest.FILE_NAME)
        .toString());
    Map<String, int[]> seriesByPartition = ModelTraining.partitionSeries(history, manifest.partitionAttribute());
    Map<String, PartitionReport> reports = new LinkedHashMap<>();
    for (PartitionReport report : manifest.partitions()) {
      reports.put(report.partitionValue(), report);
    }
    float[] dispersion = new float[history.seriesCount()];
    java.util.Arrays.fill(dispersion, Float.NaN);
    Path dispersionFile = dir.resolve(manifest.dispersionFile());
    if (manifest.dispersionFileChecksum() != null) {
      verifyChecksum(dispersionFile, manifest.dispersionFileChecksum(), "dispersion table");
    }
    readDispersion(dispersionFile, history, dispersion);
    List<ModelSet.Partition> partitions = new ArrayList<>();
    try {
      for (Map.Entry<String, int[]> entry : seriesByPartition.entrySet()) {
        PartitionReport report = reports.get(entry.getKey());
        if (report == null) {
          throw new InvalidRequestException("the store has series with " + manifest.partitionAttribute() + " = "
              + entry.getKey() + " but the model directory " + dir + " has no model for it; train again");
        }
        Path file = dir.resolve(report.modelFile());
        verifyChecksum(file, manifest.modelFileChecksums().get(report.modelFile()), "model file");
        for (int s : entry.getValue()) {
          if (Float.isNaN(dispersion[s])) {
            dispersion[s] = (float) report.pooledDispersion();
          }
        }
        partitions.add(new ModelSet.Partition(entry.getKey(), entry.getValue(), TrainedModel.load(file), report));
      }
    } catch (IOException | RuntimeException | Error e) {
      partitions.forEach(p -> p.model().close());
      throw e;
    }
    return new ModelSet(spec, manifest.partitionAttribute(), partitions, dispersion);
  }

  /**
   * The file beside a partition's model file holding the raw scores its model gave its training and validation rows
   * ({@link RowScores}), when the training kept them (a backtest's last origin saved for a continued final fit).
   */
  static String rowScoresFileName(String modelFile) {
    return modelFile + ".row-scores";
  }

  /**
   * Gives each model of {@code models}, opened from {@code dir}, the row scores saved beside it, so that a training
   * continued from it carries them over instead of predicting them. They are taken only from a directory trained on
   * the store {@code history} is now (the same fingerprint): a row's score is only right for the units it was computed
   * from. Scores that are absent, from another store state or unreadable are left out, and the returned text says
   * which and why; the training then predicts those rows' starting scores (the same result, slower).
   *
   * @return one line per partition saying whether its scores were carried and, if not, why
   */
  public static List<String> attachRowScores(ModelSet models, Path dir, String storeFingerprint, MemoryBudget budget)
      throws IOException {
    ModelManifest manifest = readManifest(dir);
    boolean sameStore = storeFingerprint != null && storeFingerprint.equals(manifest.storeFingerprint());
    List<String> lines = new ArrayList<>();
    for (ModelSet.Partition partition : models.partitions()) {
      Path file = dir.resolve(rowScoresFileName(partition.report().modelFile()));
      String name = "partition " + partition.value();
      if (!Files.exists(file)) {
        lines.add(name + ": no saved row scores, every starting score is predicted");
      } else if (!sameStore) {
        lines.add(name + ": the row scores saved with the model were computed on another state of the store (its "
            + "fingerprint differs), so every starting score is predicted");
      } else {
        try {
          partition.model().attachRowScores(RowScores.read(file, budget));
          lines.add(name + ": " + partition.model().rowScores().rowCount() + " saved row scores read");
        } catch (IOException e) {
          lines.add(name + ": the saved row scores cannot be used (" + e.getMessage() + "), so every starting score "
              + "is predicted");
        }
      }
    }
    return lines;
  }

  private static void writeDispersion(Path file, List<SeriesDispersion> rows) throws IOException {
    try (BufferedWriter out = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
      out.write(SeriesIdentity.SERIES_ID + ",dispersion\n");
      for (SeriesDispersion row : rows) {
        out.write(CsvCells.cell(row.seriesId()) + "," + row.dispersion() + "\n");
      }
    }
  }

  private static void readDispersion(Path file, SalesHistory history, float[] dispersion) throws IOException {
    try (BufferedReader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
      String line = in.readLine();
      long lineNumber = 1;
      while ((line = in.readLine()) != null) {
        lineNumber++;
        int comma = line.lastIndexOf(',');
        if (comma < 0) {
          throw new CorruptStoreException(file, "line " + lineNumber + ": expected " + SeriesIdentity.SERIES_ID
              + ",dispersion, actual "
              + line);
        }
        String id = line.substring(0, comma);
        if (id.startsWith("\"")) {
          id = id.substring(1, id.length() - 1).replace("\"\"", "\"");
        }
        int series = history.attributes().seriesIndexOf(id);
        if (series >= 0) {
          dispersion[series] = Float.parseFloat(line.substring(comma + 1));
        }
      }
    }
  }

  private static void verifyChecksum(Path file, String expected, String what) throws IOException {
    String actual = crc32c(file);
    if (!actual.equals(expected)) {
      throw new CorruptStoreException(file, what + " checksum mismatch: expected " + expected + ", actual " + actual);
    }
  }

  private static Map<String, Object> parameters(Record parameters) {
    return JSON.convertValue(parameters, JSON.getTypeFactory().constructMapType(LinkedHashMap.class, String.class,
        Object.class));
  }

  static String crc32c(Path file) throws IOException {
    return Crc32c.hex(Crc32c.ofFile(file));
  }
}
