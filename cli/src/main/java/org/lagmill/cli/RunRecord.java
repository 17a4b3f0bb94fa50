package org.lagmill.cli;

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
import org.lagmill.memory.ProcessMemory;

/**
 * The {@code run.json} every command that produces results writes: configuration, versions, time and memory per
 * stage, and metrics, so a run can be compared with another or turned into a report later.
 */
final class RunRecord {
  static final String FILE_NAME = "run.json";
  static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

  /** Time and memory of one stage. */
  record Stage(String name, double seconds, long peakResidentBytes, long offHeapBytes, long rowCount) {
    public double rowsPerSecond() {
      return seconds > 0 ? rowCount / seconds : 0;
    }
  }

  private final String command;
  private final long startNanos = System.nanoTime();
  private final String startedAt = Instant.now().toString();
  private final Map<String, Object> configuration = new LinkedHashMap<>();
  private final Map<String, Object> results = new LinkedHashMap<>();
  private final List<Stage> stages = new ArrayList<>();
  private long stageStartNanos = System.nanoTime();

  RunRecord(String command) {
    this.command = command;
  }

  RunRecord configure(String key, Object value) {
    configuration.put(key, value);
    return this;
  }

  RunRecord result(String key, Object value) {
    results.put(key, value);
    return this;
  }

  /** Closes the stage that began at the previous call (or at creation) and records it. */
  Stage endStage(String name, long offHeapBytes, long rowCount) {
    long now = System.nanoTime();
    Stage stage = new Stage(name, (now - stageStartNanos) / 1e9, ProcessMemory.peakResidentBytes(), offHeapBytes,
        rowCount);
    stages.add(stage);
    stageStartNanos = now;
    return stage;
  }

  List<Stage> stages() {
    return stages;
  }

  double elapsedSeconds() {
    return (System.nanoTime() - startNanos) / 1e9;
  }

  Map<String, Object> toMap() {
    Map<String, Object> map = new LinkedHashMap<>();
    map.put("command", command);
    map.put("startedAt", startedAt);
    map.put("seconds", elapsedSeconds());
    map.put("versions", Map.of("lagmill", new VersionProvider().getVersion()[0],
        "java", System.getProperty("java.version"), "lightgbm", "4.3.0 (lightgbm4j 4.3.0-1)"));
    map.put("machine", Map.of("processors", Runtime.getRuntime().availableProcessors(),
        "maxHeapBytes", Runtime.getRuntime().maxMemory()));
    map.put("configuration", configuration);
    map.put("stages", stages);
    map.put("peakResidentBytes", ProcessMemory.peakResidentBytes());
    map.put("results", results);
    return map;
  }

  /** Writes {@code dir/run.json} through a temporary file. */
  void write(Path dir) throws IOException {
    write(dir, FILE_NAME);
  }

  /** Writes {@code dir/fileName} through a temporary file. */
  void write(Path dir, String fileName) throws IOException {
    AtomicFiles.write(dir.resolve(fileName), JSON.writeValueAsBytes(toMap()));
  }

}
