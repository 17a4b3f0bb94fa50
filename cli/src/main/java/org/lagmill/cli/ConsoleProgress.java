package org.lagmill.cli;

import java.io.PrintStream;
import java.util.Locale;
import org.lagmill.memory.ProcessMemory;
import org.lagmill.progress.ProgressListener;

/**
 * Renders engine progress on stderr: a redrawn bar with rate and ETA when stderr is a terminal, otherwise one line at
 * most every {@link #LINE_INTERVAL_NANOS} so logs of batch jobs stay short.
 */
final class ConsoleProgress implements ProgressListener {
  private static final long LINE_INTERVAL_NANOS = 5_000_000_000L;
  private static final long REDRAW_INTERVAL_NANOS = 200_000_000L;
  private static final int BAR_WIDTH = 30;

  private final PrintStream err;
  private final boolean terminal;
  private String stageName = "";
  private String unitName = "";
  private long totalUnits;
  private long stageStartNanos;
  private long lastPrintNanos;
  private long doneUnits;

  ConsoleProgress(PrintStream err, boolean terminal) {
    this.err = err;
    this.terminal = terminal;
  }

  /** The listener for a command: silent with {@code --quiet}, a bar on a terminal, lines otherwise. */
  static ProgressListener forCommand(boolean quiet) {
    if (quiet) {
      return ProgressListener.SILENT;
    }
    return new ConsoleProgress(System.err, System.console() != null);
  }

  @Override
  public void startStage(String stageName, String unitName, long totalUnits) {
    this.stageName = stageName;
    this.unitName = unitName;
    this.totalUnits = totalUnits;
    this.doneUnits = 0;
    this.stageStartNanos = System.nanoTime();
    this.lastPrintNanos = stageStartNanos;
    if (!terminal) {
      err.println("[" + stageName + "] started" + (totalUnits > 0 ? ", " + totalUnits + " " + unitName : ""));
    }
  }

  @Override
  public void advance(long doneUnits) {
    this.doneUnits = doneUnits;
    long now = System.nanoTime();
    if (now - lastPrintNanos < (terminal ? REDRAW_INTERVAL_NANOS : LINE_INTERVAL_NANOS)) {
      return;
    }
    lastPrintNanos = now;
    String status = status(now);
    if (terminal) {
      err.print("\r" + status + "   ");
    } else {
      err.println(status);
    }
    err.flush();
  }

  @Override
  public void note(String text) {
    if (terminal) {
      err.print("\r");
    }
    err.println("[" + stageName + "] " + text);
  }

  @Override
  public void endStage() {
    double seconds = (System.nanoTime() - stageStartNanos) / 1e9;
    if (terminal) {
      err.print("\r");
    }
    err.println(String.format(Locale.ROOT, "[%s] done: %d %s in %.1f s%s", stageName, doneUnits, unitName, seconds,
        seconds > 0 && doneUnits > 0 ? String.format(Locale.ROOT, " (%,.0f %s/s)", doneUnits / seconds, unitName)
            : ""));
  }

  private String status(long now) {
    double seconds = (now - stageStartNanos) / 1e9;
    double rate = seconds > 0 ? doneUnits / seconds : 0;
    StringBuilder b = new StringBuilder("[").append(stageName).append("] ");
    if (totalUnits > 0) {
      double share = Math.min(1.0, doneUnits / (double) totalUnits);
      int filled = (int) Math.round(share * BAR_WIDTH);
      if (terminal) {
        b.append('[').append("#".repeat(filled)).append(" ".repeat(BAR_WIDTH - filled)).append("] ");
      }
      b.append(String.format(Locale.ROOT, "%3.0f%% ", share * 100));
      double etaSeconds = rate > 0 ? (totalUnits - doneUnits) / rate : Double.NaN;
      b.append(String.format(Locale.ROOT, "%,d/%,d %s, %,.0f/s, ETA %s", doneUnits, totalUnits, unitName, rate,
          Double.isNaN(etaSeconds) ? "?" : formatDuration(etaSeconds)));
    } else {
      b.append(String.format(Locale.ROOT, "%,d %s, %,.0f/s", doneUnits, unitName, rate));
    }
    long resident = ProcessMemory.residentBytes();
    if (resident != ProcessMemory.UNAVAILABLE) {
      b.append(String.format(Locale.ROOT, ", RSS %,d MB", resident >> 20));
    }
    return b.toString();
  }

  static String formatDuration(double seconds) {
    long s = Math.round(seconds);
    return s >= 3600 ? String.format(Locale.ROOT, "%dh%02dm", s / 3600, (s % 3600) / 60)
        : s >= 60 ? String.format(Locale.ROOT, "%dm%02ds", s / 60, s % 60) : s + "s";
  }
}
