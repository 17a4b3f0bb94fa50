package org.lagmill.learner;

/**
 * Where the rows of a continued training get their starting raw scores (LightGBM's {@code init_score}): predicted
 * from {@code model} for every row, or carried over from the scores {@code model} gave the rows it was trained and
 * validated on ({@link RowScores}), predicting only the rows it never saw.
 *
 * @param model the starting model; not owned, must stay open while the Datasets are used
 * @param carried scores of the rows {@code model} was trained and validated on, or null to predict every row; not
 *     owned
 * @param seriesOrder the series in the order the rows stream (a feature pass's series order); null without
 *     {@code carried}
 */
public record StartingScores(TrainedModel model, RowScores carried, int[] seriesOrder) {
  public StartingScores {
    java.util.Objects.requireNonNull(model, "model");
    if ((carried == null) != (seriesOrder == null)) {
      throw new IllegalArgumentException("carried scores need the series order of the rows, and only they do");
    }
  }

  /** Every row's starting score predicted by {@code model}. */
  public static StartingScores predicted(TrainedModel model) {
    return new StartingScores(model, null, null);
  }

  /**
   * The scores {@code model} holds for its own training and validation rows ({@link TrainedModel#rowScores()}) where
   * it has them, predicted elsewhere.
   */
  public static StartingScores of(TrainedModel model, int[] seriesOrder) {
    RowScores carried = model.rowScores();
    return carried == null ? predicted(model) : new StartingScores(model, carried, seriesOrder.clone());
  }
}
