package org.lagmill.eval;

/**
 * The exponential smoothing (ETS) model forms the {@link BaselineKind#ETS} baseline chooses from, in the state space
 * notation (error, trend, season) of Hyndman, Koehler, Ord and Snyder, <i>Forecasting with Exponential Smoothing: The
 * State Space Approach</i> (Springer, 2008), tables 2.2 and 2.3. Additive-error forms serve any series; the
 * multiplicative-season forms use a multiplicative error (the book's stable pairing) and need every known value of the
 * fitted window to be positive. Order matters: on an exact tie of the information criterion the earlier, simpler form
 * wins.
 */
public enum EtsForm {
  /** Level only (simple exponential smoothing). */
  ANN(false, false, false, Season.NONE),
  /** Level and additive trend. */
  AAN(false, true, false, Season.NONE),
  /** Level and damped additive trend. */
  AADN(false, true, true, Season.NONE),
  /** Level and additive season. */
  ANA(false, false, false, Season.ADDITIVE),
  /** Level, additive trend and additive season. */
  AAA(false, true, false, Season.ADDITIVE),
  /** Level, damped trend and additive season. */
  AADA(false, true, true, Season.ADDITIVE),
  /** Level and multiplicative season, multiplicative error. */
  MNM(true, false, false, Season.MULTIPLICATIVE),
  /** Level, additive trend and multiplicative season, multiplicative error. */
  MAM(true, true, false, Season.MULTIPLICATIVE),
  /** Level, damped trend and multiplicative season, multiplicative error. */
  MADM(true, true, true, Season.MULTIPLICATIVE);

  /** How the season enters the one-step forecast. */
  public enum Season {
    NONE,
    ADDITIVE,
    MULTIPLICATIVE
  }

  private final boolean multiplicativeError;
  private final boolean trend;
  private final boolean damped;
  private final Season season;

  EtsForm(boolean multiplicativeError, boolean trend, boolean damped, Season season) {
    this.multiplicativeError = multiplicativeError;
    this.trend = trend;
    this.damped = damped;
    this.season = season;
  }

  public boolean multiplicativeError() {
    return multiplicativeError;
  }

  public boolean hasTrend() {
    return trend;
  }

  public boolean damped() {
    return damped;
  }

  public Season season() {
    return season;
  }

  public boolean seasonal() {
    return season != Season.NONE;
  }

  /**
   * Smoothing parameters estimated for this form, in the order alpha, beta, gamma, phi (absent ones skipped).
   */
  public int smoothingParameterCount() {
    return 1 + (trend ? 1 : 0) + (seasonal() ? 1 : 0) + (damped ? 1 : 0);
  }

  /**
   * Parameters counted by the information criterion: smoothing parameters, the initial level, trend and season
   * states (the season's last state is fixed by its normalisation, so {@code m − 1}), and the error variance.
   */
  public int criterionParameterCount(int seasonLength) {
    return smoothingParameterCount() + 1 + (trend ? 1 : 0) + (seasonal() ? seasonLength - 1 : 0) + 1;
  }

  /** The book's label, e.g. {@code ETS(A,Ad,A)}. */
  public String label() {
    return "ETS(" + (multiplicativeError ? "M" : "A") + "," + (trend ? (damped ? "Ad" : "A") : "N") + ","
        + switch (season) {
          case NONE -> "N";
          case ADDITIVE -> "A";
          case MULTIPLICATIVE -> "M";
        } + ")";
  }
}
