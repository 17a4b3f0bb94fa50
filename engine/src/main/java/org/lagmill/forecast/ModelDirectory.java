package org.lagmill.forecast;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.BufferedReader;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.zip.CRC32C;
import org.lagmill.features.FeatureSpec;
import org.lagmill.features.FeatureSpecYaml;
import org.lagmill.learner.TrainedModel;
import org.lagmill.store.CorruptStoreException;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.StoreDirectories;

/**
 * Saves a {@link ModelSet} as a directory (LightGBM model files, {@code manifest.json}, {@code dispersion.csv}) and
 * opens it again against a store. Saving builds a temporary sibling and renames it into place, so a failed run never
 * damages an existing model directory; opening verifies each model file's checksum.
 */
public final class ModelDirectory {
  static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

  private ModelDirectory() {}

  /** Writes the model set; {@code trainingFirstDate} etc. describe the windows the models learned from. */
  public static ModelManifest save(ModelSet models, Path dir, SalesHistory history, TrainingPlan plan,
      String storeFingerprint) throws IOException {
    Path temp = StoreDirectories.createTempSibling(dir);
    try {
      Map<String, String> checksums = new LinkedHashMap<>();
      List<PartitionReport> reports = new ArrayList<>();
      for (ModelSet.Partition partition : models.partitions()) {
        Path file = temp.resolve(partition.report().modelFile());
        partition.model().saveTo(file);
        checksums.put(partition.report().modelFile(), crc32c(file));
        reports.add(partition.report());
      }
      writeDispersion(temp.resolve(ModelManifest.DISPERSION_FILE_NAME), history, models.dispersionBySeries());
      ModelManifest manifest = new ModelManifest(ModelManifest.FORMAT_VERSION_CURRENT, Instant.now().toString(),
          storeFingerprint, FeatureSpecYaml.format(models.spec()), parameters(plan.trainParameters()),
          parameters(plan.datasetParameters()), history.dateOf(0).toString(),
          history.dateOf(plan.trainingLastDayIndex()).toString(), history.dateOf(plan.validationFirstDayIndex())
          .toString(), history.dateOf(plan.cutDayIndex()).toString(), plan.partitionAttribute(), reports, checksums,
          ModelManifest.DISPERSION_FILE_NAME);
      JSON.writeValue(temp.resolve(ModelManifest.FILE_NAME).toFile(), manifest);
      StoreDirectories.publish(temp, dir);
      return manifest;
    } catch (IOException | RuntimeException | Error e) {
      // The save's own failure is what the user needs to see; a failed clean-up rides along with it.
      StoreDirectories.deleteAfterFailure(temp, e);
      throw e;
    }
  }

  /** Reads only the manifest. */
  public static ModelManifest readManifest(Path dir) throws IOException {
    Path file = dir.resolve(ModelManifest.FILE_NAME);
    if (!Files.exists(file)) {
      throw new NoSuchFileException(file.toString(), null, "not a model directory: no " + ModelManifest.FILE_NAME);
    }
    ModelManifest manifest = JSON.readValue(file.toFile(), ModelManifest.class);
    if (manifest.formatVersion() != ModelManifest.FORMAT_VERSION_CURRENT) {
      throw new CorruptStoreException(file, "unsupported model format version: expected "
          + ModelManifest.FORMAT_VERSION_CURRENT + ", actual " + manifest.formatVersion());
    }
    return manifest;
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
    readDispersion(dir.resolve(manifest.dispersionFile()), history, dispersion);
    List<ModelSet.Partition> partitions = new ArrayList<>();
    try {
      for (Map.Entry<String, int[]> entry : seriesByPartition.entrySet()) {
        PartitionReport report = reports.get(entry.getKey());
        if (report == null) {
          throw new IllegalArgumentException("the store has series with " + manifest.partitionAttribute() + " = "
              + entry.getKey() + " but the model directory " + dir + " has no model for it; train again");
        }
        Path file = dir.resolve(report.modelFile());
        String expected = manifest.modelFileChecksums().get(report.modelFile());
        String actual = crc32c(file);
        if (!actual.equals(expected)) {
          throw new CorruptStoreException(file, "model file checksum mismatch: expected " + expected + ", actual "
              + actual);
        }
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

  private static void writeDispersion(Path file, SalesHistory history, float[] dispersion) throws IOException {
    try (BufferedWriter out = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
      out.write("series_id,dispersion\n");
      for (int s = 0; s < dispersion.length; s++) {
        out.write(csvCell(history.attributes().seriesId(s)) + "," + dispersion[s] + "\n");
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
          throw new CorruptStoreException(file, "line " + lineNumber + ": expected series_id,dispersion, actual "
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

  static String csvCell(String text) {
    return text.contains(",") || text.contains("\"") ? "\"" + text.replace("\"", "\"\"") + "\"" : text;
  }

  private static Map<String, Object> parameters(Record parameters) {
    return JSON.convertValue(parameters, JSON.getTypeFactory().constructMapType(LinkedHashMap.class, String.class,
        Object.class));
  }

  static String crc32c(Path file) throws IOException {
    CRC32C crc = new CRC32C();
    byte[] buffer = new byte[1 << 16];
    try (InputStream in = Files.newInputStream(file)) {
      int read;
      while ((read = in.read(buffer)) > 0) {
        crc.update(buffer, 0, read);
      }
    }
    return String.format("%08x", crc.getValue());
  }
}
