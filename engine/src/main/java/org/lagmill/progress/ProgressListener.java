package org.lagmill.progress;

/**
 * Receives progress of long stages from engine code, which itself never prints. The CLI renders it as a bar with an ETA
 * on a terminal, as periodic one-line reports otherwise, or not at all with {@code --quiet}.
 *
 * <p>Calls come from the thread running the stage; {@link #advance} may be called per batch, never per row.
 */
public interface ProgressListener {
  /** Starts a stage of {@code totalUnits} units of work (rows, series, iterations); 0 when unknown. */
  void startStage(String stageName, String unitName, long totalUnits);

  /** Reports {@code doneUnits} units done so far in the current stage (a running total, not an increment). */
  void advance(long doneUnits);

  /** A short free-form status line (e.g. the validation loss of an iteration). */
  void note(String text);

  /** Ends the current stage. */
  void endStage();

  ProgressListener SILENT = new ProgressListener() {
    @Override
    public void startStage(String stageName, String unitName, long totalUnits) {}
    @Override
    public void advance(long doneUnits) {}
    @Override
    public void note(String text) {}
    @Override
    public void endStage() {}
  };
}
