package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

/**
 * One call of {@link Main#run} with what it printed: Main.run writes to System.out and System.err, as the installed
 * command does, so they are swapped for buffers during the call and put back after it.
 *
 * @param exitCode the process exit code the command would end with
 * @param out everything written to standard output, UTF-8
 * @param err everything written to standard error, UTF-8
 */
record MainRun(int exitCode, String out, String err) {
  /** Runs the command line with these arguments; synchronized because the swapped streams are global. */
  static synchronized MainRun of(String... args) {
    PrintStream oldOut = System.out;
    PrintStream oldErr = System.err;
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    try {
      System.setOut(new PrintStream(out, true, StandardCharsets.UTF_8));
      System.setErr(new PrintStream(err, true, StandardCharsets.UTF_8));
      int exitCode = Main.run(args);
      return new MainRun(exitCode, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    } finally {
      System.setOut(oldOut);
      System.setErr(oldErr);
    }
  }

  /**
   * Asserts that the command succeeded (exit code 0), with both streams in the failure message because a command may
   * explain its failure on either; returns this run so a command can be run, checked and kept in one statement.
   */
  MainRun expectOk() {
    assertEquals(0, exitCode, "stdout: " + out + "\nstderr: " + err);
    return this;
  }
}
