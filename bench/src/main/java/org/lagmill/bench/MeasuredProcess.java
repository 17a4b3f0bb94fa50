package org.lagmill.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;

/**
 * Runs one command in a fresh process and measures its wall time and peak resident memory, read from the child's
 * {@code /proc/<pid>/status} (VmHWM, the kernel's own high-water mark, so sampling every few milliseconds still sees the
 * true peak as long as the process is alive when sampled after it).
 */
final class MeasuredProcess {
  private static final long SAMPLE_INTERVAL_MILLIS = 20;

  /** Outcome of one run. */
  record Result(List<String> command, int exitCode, double seconds, long peakResidentBytes, Path logFile) {}

  private MeasuredProcess() {}

  static Result run(List<String> command, Path logFile, long timeoutSeconds) throws IOException, InterruptedException {
    return run(command, Map.of(), logFile, timeoutSeconds);
  }

  /** Runs {@code command} with {@code environment} added to this process's environment. */
  static Result run(List<String> command, Map<String, String> environment, Path logFile, long timeoutSeconds)
      throws IOException, InterruptedException {
    ProcessBuilder builder = new ProcessBuilder(command).redirectErrorStream(true)
        .redirectOutput(logFile.toFile());
    builder.environment().putAll(environment);
    long start = System.nanoTime();
    Process process = builder.start();
    Path status = Path.of("/proc", Long.toString(process.pid()), "status");
    long peak = 0;
    long deadline = start + TimeUnit.SECONDS.toNanos(timeoutSeconds);
    while (process.isAlive()) {
      peak = Math.max(peak, readPeakResidentBytes(status));
      if (System.nanoTime() > deadline) {
        process.destroyForcibly();
        break;
      }
      process.waitFor(SAMPLE_INTERVAL_MILLIS, TimeUnit.MILLISECONDS);
    }
    int exitCode = process.waitFor();
    double seconds = (System.nanoTime() - start) / 1e9;
    return new Result(List.copyOf(command), exitCode, seconds, peak, logFile);
  }

  /** VmHWM of a live process in bytes, 0 once it has exited. */
  static long readPeakResidentBytes(Path statusFile) {
    try {
      for (String line : Files.readAllLines(statusFile)) {
        if (line.startsWith("VmHWM:")) {
          String[] parts = line.trim().split("\\s+");
          return Long.parseLong(parts[1]) * 1024;
        }
      }
    } catch (IOException | RuntimeException e) {
      // the process exited between the liveness check and the read: its last sample stands
    }
    return 0;
  }
}
