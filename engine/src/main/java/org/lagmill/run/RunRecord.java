package org.lagmill.run;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.lagmill.io.AtomicFiles;
import org.lagmill.learner.LightGbmVersion;
import org.lagmill.memory.ProcessMemory;

/**
 * The {@code run.json} of a run: configuration, versions, the stages' time and memory, and results, so a run can be
 * compared with another or turned into a report later. Stages are added by {@link Stage#close()} only.
 *
 * <p>Not thread-safe.
 */
public final class RunRecord {
  /** The record's file name in a run's output folder. */
  public static final String FILE_NAME = "run.json";
  /** Indented JSON for every file a run writes. */
  public static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

  private final String command;
  private final long startNanos = System.nanoTime();
  private final String startedAt = Instant.now().toString();
  private final Map<String, Object> configuration = new LinkedHashMap<>();
  private final Map<String, Object> results = new LinkedHashMap<>();
  private final List<StageRecord> stages = new ArrayList<>();

  RunRecord(String command) {
    this.command = command;
  }

  /** Records one configuration value (an option, a plan) under {@code key}. */
  public RunRecord configure(String key, Object value) {
    configuration.put(key, value);
    return this;
  }

  /** Records one result (metrics, partition reports) under {@code key}. */
  public RunRecord result(String key, Object value) {
    results.put(key, value);
    return this;
  }

  void addStage(StageRecord stage) {
    stages.add(stage);
  }

  /** The finished stages in the order they closed. */
  public List<StageRecord> stages() {
    return List.copyOf(stages);
  }

  /** Wall time since the run started. */
  public double elapsedSeconds() {
    return (System.nanoTime() - startNanos) / 1e9;
  }

  /** The record as the JSON document {@link #write} produces. */
  public Map<String, Object> toMap() {
    Map<String, Object> map = new LinkedHashMap<>();
    map.put("command", command);
    map.put("startedAt", startedAt);
    map.put("seconds", elapsedSeconds());
    map.put("versions", Map.of("lagmill", Versions.lagmill(), "java", System.getProperty("java.version"),
        "lightgbm", LightGbmVersion.describe()));
    map.put("machine", Map.of("processors", Runtime.getRuntime().availableProcessors(),
        "maxHeapBytes", Runtime.getRuntime().maxMemory()));
    map.put("configuration", configuration);
    map.put("stages", stages);
    map.put("peakResidentBytes", ProcessMemory.peakResidentBytes());
    map.put("results", results);
    return map;
  }

  /** Writes {@code dir/run.json} through a temporary file. */
  public void write(Path dir) throws IOException {
    write(dir, FILE_NAME);
  }

  /** Writes {@code dir/fileName} through a temporary file. */
  public void write(Path dir, String fileName) throws IOException {
    AtomicFiles.write(dir.resolve(fileName), JSON.writeValueAsBytes(toMap()));
  }

}
