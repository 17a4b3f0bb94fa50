package org.lagmill.cli;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.FileSystemException;
import java.nio.file.InvalidPathException;
import java.nio.file.NoSuchFileException;
import java.util.Locale;
import java.util.ResourceBundle;
import org.lagmill.ingest.InputFiles;
import org.lagmill.ingest.InputFormatException;
import org.lagmill.io.CorruptFileException;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.OutputRefusedException;
import org.lagmill.io.Setting;
import org.lagmill.memory.MemoryBudgetExceededException;
import org.lagmill.store.StoreBusyException;
import org.lagmill.store.StoreNotices;
import org.lagmill.training.RankFailureException;
import picocli.CommandLine.Command;
import picocli.CommandLine;

/** The {@code lagmill} command: parses arguments, runs one subcommand, maps failures to documented exit codes. */
@Command(
    name = "lagmill",
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    description = "Daily demand forecasting for item-store series from a compact off-heap store.",
    subcommands = {CommandLine.HelpCommand.class},
    footer = {"", "Example:", "  lagmill demo --out demo-run", "",
        "Exit codes: 0 ok, 1 internal error, 2 usage error, 3 bad input, 4 corrupt store,",
        "            5 out of memory budget, 6 file not readable or writable, or not ours",
        "            to replace, 7 store busy (being written, and --no-wait was given),",
        "            8 Java heap exhausted, 9 a distributed training rank failed"})
public final class Main {

  public static void main(String[] args) {
    System.exit(run(args));
  }

  /** Runs the command line and returns its exit code; tests call this instead of {@link #main}. */
  public static int run(String... args) {
    return execute(commandLine(), args);
  }

  /**
   * Executes {@code args} on {@code cli}. picocli hands only exceptions to the failure handler; a command that
   * exhausts the Java heap throws an {@link OutOfMemoryError} past it, which is worded and given its exit code here.
   */
  static int execute(CommandLine cli, String... args) {
    try {
      return cli.execute(args);
    } catch (OutOfMemoryError e) {
      cli.getErr().println("lagmill: " + message(e));
      cli.getErr().flush();
      return exitCodeOf(e);
    }
  }

  static CommandLine commandLine() {
    CommandLine cli = new CommandLine(new Main());
    Setting.showMentionsAs(FlagNames::flagOf, FlagNames::commandOf);
    StoreNotices.setSink(text -> {
      cli.getErr().println("note: " + FlagNames.render(text));
      cli.getErr().flush();
    });
    for (Object sub : Subcommands.all()) {
      cli.addSubcommand(sub);
    }
    // After the subcommands: picocli hands the bundle to every command registered at this moment.
    cli.setResourceBundle(ResourceBundle.getBundle("org.lagmill.cli.OptionTexts", Locale.ROOT));
    HelpLayout.apply(cli);
    cli.setExecutionExceptionHandler((e, commandLine, parseResult) -> {
      Throwable t = e instanceof UncheckedIOException u ? u.getCause() : e;
      if (t instanceof InputFormatException bad) {
        t = InputFiles.blameCompressedStream(bad);
      }
      commandLine.getErr().println("lagmill: " + FlagNames.render(message(t)));
      return exitCodeOf(t);
    });
    return cli;
  }

  static int exitCodeOf(Throwable t) {
    if (t instanceof InputFormatException) {
      return ExitCodes.BAD_INPUT;
    }
    if (t instanceof CorruptFileException) {
      return ExitCodes.CORRUPT_STORE;
    }
    if (t instanceof MemoryBudgetExceededException) {
      return ExitCodes.OUT_OF_MEMORY_BUDGET;
    }
    if (t instanceof OutOfMemoryError) {
      return ExitCodes.JVM_OUT_OF_MEMORY;
    }
    if (t instanceof InvalidRequestException || t instanceof InvalidPathException) {
      return ExitCodes.USAGE_ERROR;
    }
    if (t instanceof RankFailureException) {
      return ExitCodes.RANK_FAILED;
    }
    if (t instanceof StoreBusyException) {
      return ExitCodes.STORE_BUSY;
    }
    if (t instanceof IOException) {
      return ExitCodes.IO_ERROR;
    }
    return ExitCodes.INTERNAL_ERROR;
  }

  static String message(Throwable t) {
    if (t instanceof OutputRefusedException r && r.reason() == OutputRefusedException.Reason.EXISTS) {
      return r.getMessage() + "; pass --replace to replace it";
    }
    if (t instanceof NoSuchFileException n) {
      return "no such file: " + n.getFile() + (n.getReason() == null ? "" : " (" + n.getReason() + ")");
    }
    if (t instanceof OutOfMemoryError && String.valueOf(t.getMessage()).contains("direct buffer memory")) {
      // the JVM's own cap on direct buffers, not the heap and not lagmill's budget: more heap is the wrong advice
      return "the Java process reached its cap on direct memory (" + t.getMessage() + "), outside lagmill's off-heap"
          + " budget; the launcher lifts the cap to the machine's memory: run through ./lagmill, or give java"
          + " -XX:MaxDirectMemorySize=SIZE (e.g. 16g; by default it equals -Xmx)";
    }
    if (t instanceof OutOfMemoryError) {
      return "the Java process ran out of memory (" + t.getMessage() + "), outside lagmill's off-heap budget; give it"
          + " more heap with LAGMILL_HEAP (e.g. LAGMILL_HEAP=4g, the launcher's default is 1g) or run on fewer series";
    }
    if (t instanceof FileSystemException f) {
      return PathFailureText.of(f);
    }
    if (t instanceof InputFormatException || t instanceof CorruptFileException
        || t instanceof MemoryBudgetExceededException || t instanceof InvalidRequestException
        || t instanceof InvalidPathException || t instanceof IOException
        || t instanceof RankFailureException) {
      return t.getMessage();
    }
    return "internal error: " + t + " (please report it with the command you ran)";
  }
}
