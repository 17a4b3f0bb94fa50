package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.lagmill.eval.BacktestSettings;
import org.lagmill.eval.Hierarchy;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.memory.MemoryBudgetExceededException;

/** One exit code per kind of failure, and a JVM out-of-memory told apart from a budget refusal. */
class ExitCodeMappingTest {
  @Test
  void shouldTellAJvmOutOfMemoryFromABudgetRefusal() {
    OutOfMemoryError heap = new OutOfMemoryError("Java heap space");
    assertEquals(ExitCodes.JVM_OUT_OF_MEMORY, Main.exitCodeOf(heap));
    assertEquals("the Java process ran out of memory (Java heap space), outside lagmill's off-heap budget; give it"
        + " more heap with LAGMILL_HEAP (e.g. LAGMILL_HEAP=4g, the launcher's default is 1g) or run on fewer series",
        Main.message(heap));
    // the JVM's direct-memory cap is named as such: more heap is not the remedy (measured at 59M item-days)
    OutOfMemoryError direct = new OutOfMemoryError("Cannot reserve 186302444 bytes of direct buffer memory "
        + "(allocated: 942849948, limit: 1073741824)");
    assertEquals(ExitCodes.JVM_OUT_OF_MEMORY, Main.exitCodeOf(direct));
    assertEquals("the Java process reached its cap on direct memory (Cannot reserve 186302444 bytes of direct buffer"
        + " memory (allocated: 942849948, limit: 1073741824)), outside lagmill's off-heap budget; the launcher lifts"
        + " the cap to the machine's memory: run through ./lagmill, or give java -XX:MaxDirectMemorySize=SIZE (e.g."
        + " 16g; by default it equals -Xmx)", Main.message(direct));
    MemoryBudgetExceededException budget = new MemoryBudgetExceededException("lagmill/train", 10, 95, 100);
    assertEquals(ExitCodes.OUT_OF_MEMORY_BUDGET, Main.exitCodeOf(budget));
  }

  @Test
  void shouldTellARequestThatCannotBeDoneFromABug() {
    // A request the data cannot satisfy is the user's to change: usage exit code, the message as it is.
    InvalidRequestException request = new InvalidRequestException("--origins must be >= 1, got 0");
    assertEquals(ExitCodes.USAGE_ERROR, Main.exitCodeOf(request));
    assertEquals("--origins must be >= 1, got 0", Main.message(request));
    // A broken internal contract is a bug: internal-error exit code, said so.
    IllegalArgumentException contract = new IllegalArgumentException("need 3 values, got 2");
    assertEquals(ExitCodes.INTERNAL_ERROR, Main.exitCodeOf(contract));
    assertEquals("internal error: java.lang.IllegalArgumentException: need 3 values, got 2 (please report it with the"
        + " command you ran)", Main.message(contract));
  }

  @Test
  void shouldReportEngineRequestErrorsAsUsageErrors() {
    // Thrown by the engine on what the user asked for, not by the CLI.
    assertEquals(ExitCodes.USAGE_ERROR, Main.exitCodeOf(catchThrown(() -> Hierarchy.parse(java.util.List.of(
        "store>store")))));
    assertEquals(ExitCodes.USAGE_ERROR, Main.exitCodeOf(catchThrown(() -> new BacktestSettings(0, 7, 7,
        java.util.List.of(), Hierarchy.parse(java.util.List.of()), new double[0]))));
    assertEquals(ExitCodes.USAGE_ERROR, Main.exitCodeOf(catchThrown(() -> Path.of("a\u0000b"))));
  }

  @Test
  void shouldEndACommandThatExhaustsTheJavaHeapWithItsExitCodeAndNoStackTrace() {
    // picocli hands only exceptions to the failure handler; an Error thrown by a command passes through it
    picocli.CommandLine cli = Main.commandLine();
    cli.addSubcommand("exhaust", new picocli.CommandLine(new Exhaust()));
    java.io.StringWriter err = new java.io.StringWriter();
    cli.setErr(new java.io.PrintWriter(err, true));
    assertEquals(ExitCodes.JVM_OUT_OF_MEMORY, Main.execute(cli, "exhaust"));
    assertEquals("lagmill: the Java process ran out of memory (Requested array size exceeds VM limit), outside"
        + " lagmill's off-heap budget; give it more heap with LAGMILL_HEAP (e.g. LAGMILL_HEAP=4g, the launcher's"
        + " default is 1g) or run on fewer series", err.toString().strip());
  }

  @picocli.CommandLine.Command(name = "exhaust")
  static final class Exhaust implements java.util.concurrent.Callable<Integer> {
    @Override
    public Integer call() {
      throw new OutOfMemoryError("Requested array size exceeds VM limit");
    }
  }

  private static Throwable catchThrown(Runnable action) {
    try {
      action.run();
    } catch (RuntimeException e) {
      return e;
    }
    throw new AssertionError("expected a failure");
  }
}
