package org.lagmill.learner;

import org.lagmill.features.FeatureBatch;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.memory.NativeDoubleArray;

/**
 * Writes the starting raw score of each pushed row of a continued training: the carried score where
 * {@link StartingScores#carried()} holds the row, the starting model's prediction elsewhere (consecutive rows
 * without a carried score are predicted in one call). The first carried row of each batch is also predicted and must
 * agree: a carried score is only right while a row's features do not depend on the cut, and a feature that broke that
 * would otherwise go unnoticed.
 *
 * <p>Not thread-safe; one filler per Dataset build.
 */
final class StartingScoreFiller implements AutoCloseable {
  /**
   * Largest difference allowed between a carried and a predicted raw score, relative to max(1, |score|): both sum the
   * same trees in the same order, so they differ only by the log of LightGBM's exp (about 1e-16; common practice, no
   * source, for the margin).
   */
  static final double AGREEMENT_TOLERANCE = 1e-9;

  private final StartingScores start;
  private final RowScores.Cursor cursor;
  private final int threadCount;
  private final NativeDoubleArray checkScore;
  private long carriedRowCount;
  private long predictedRowCount;

  StartingScoreFiller(StartingScores start, int threadCount, MemoryBudget budget) {
    this.start = start;
    this.threadCount = threadCount;
    this.cursor = start.carried() == null ? null : start.carried().cursor(start.seriesOrder());
    this.checkScore = new NativeDoubleArray(budget, 1);
  }

  /** Writes the starting raw score of each of {@code batch}'s rows, row {@code i} into {@code out[firstRow + i]}. */
  void fill(FeatureBatch batch, NativeDoubleArray out, int firstRow) {
    TrainedModel model = start.model();
    int rowCount = batch.rowCount();
    if (cursor == null) {
      model.predictRawRows(batch.valuesAddress(), rowCount, out.address(firstRow), threadCount);
      predictedRowCount += rowCount;
      return;
    }
    int[] series = batch.seriesIndexes();
    int[] days = batch.dayIndexes();
    long rowBytes = (long) Float.BYTES * batch.featureCount();
    int missingFrom = -1;
    boolean checked = false;
    for (int row = 0; row <= rowCount; row++) {
      double carried = row < rowCount ? cursor.find(series[row], days[row]) : Double.NaN;
      boolean missing = row < rowCount && Double.isNaN(carried);
      if (missing && missingFrom < 0) {
        missingFrom = row;
      } else if (!missing && missingFrom >= 0) {
        model.predictRawRows(batch.valuesAddress() + missingFrom * rowBytes, row - missingFrom,
            out.address(firstRow + missingFrom), threadCount);
        predictedRowCount += row - missingFrom;
        missingFrom = -1;
      }
      if (row < rowCount && !missing) {
        if (!checked) {
          check(batch, row, carried, rowBytes);
          checked = true;
        }
        out.set(firstRow + row, carried);
        carriedRowCount++;
      }
    }
  }

  private void check(FeatureBatch batch, int row, double carried, long rowBytes) {
    start.model().predictRawRows(batch.valuesAddress() + row * rowBytes, 1, checkScore.address(0), threadCount);
    double predicted = checkScore.get(0);
    if (!(Math.abs(carried - predicted) <= AGREEMENT_TOLERANCE * Math.max(1, Math.abs(predicted)))) {
      throw new IllegalStateException("the starting score carried for series " + batch.seriesIndexes()[row]
          + ", day " + batch.dayIndexes()[row] + " is " + carried + " but the starting model predicts " + predicted
          + " for that row: its features differ from when the starting model was trained, so scores cannot carry"
          + " over (a defect to report with the store; trainings from scratch are not affected)");
    }
  }

  TrainedModel model() {
    return start.model();
  }

  /** Rows whose starting score was carried over. */
  long carriedRowCount() {
    return carriedRowCount;
  }

  /** Rows whose starting score was predicted (every row when nothing is carried). */
  long predictedRowCount() {
    return predictedRowCount;
  }

  @Override
  public void close() {
    checkScore.close();
  }
}
