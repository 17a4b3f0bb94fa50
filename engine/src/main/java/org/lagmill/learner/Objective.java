package org.lagmill.learner;

/** The loss a model is trained for; each names LightGBM's objective and the validation metric early stopping uses. */
public enum Objective {
  /** Tweedie deviance with a log link: suits counts with many zeros and a long tail (daily unit sales). */
  TWEEDIE("tweedie", "tweedie"),
  /** Poisson deviance with a log link. */
  POISSON("poisson", "poisson"),
  /** Squared error (L2) on the raw scale. */
  REGRESSION("regression", "l2");

  private final String lightGbmName;
  private final String metricName;

  Objective(String lightGbmName, String metricName) {
    this.lightGbmName = lightGbmName;
    this.metricName = metricName;
  }

  String lightGbmName() {
    return lightGbmName;
  }

  /** LightGBM's name of this objective's own metric (lower is better). */
  public String metricName() {
    return metricName;
  }

  /**
   * The objective named on a LightGBM model text's {@code objective=} line (e.g. {@code objective=tweedie
   * tweedie_variance_power:1.1}).
   *
   * @throws LearnerException when there is no such line or it names an objective lagmill does not train
   */
  static Objective ofModelText(String modelText) {
    for (String line : modelText.split("\n", 64)) {
      if (line.startsWith("objective=")) {
        String name = line.substring("objective=".length()).split(" ")[0].strip();
        for (Objective o : values()) {
          if (o.lightGbmName.equals(name)) {
            return o;
          }
        }
        throw new LearnerException("the model's objective '" + name + "' is not one lagmill trains (tweedie, "
            + "poisson, regression)");
      }
    }
    throw new LearnerException("the model text has no objective= line");
  }

  /** True when predictions are exp(raw score): the model learns log(mean). */
  public boolean hasLogLink() {
    return this != REGRESSION;
  }
}
