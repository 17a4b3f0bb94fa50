package org.lagmill.eval;

import java.util.Arrays;

/**
 * Fits exponential smoothing (ETS) models in state space form to one series at a time and chooses the form with the
 * smallest AICc; the arithmetic of {@link BaselineKind#ETS}. Rules and sources: docs/metrics.md, section "Exponential
 * smoothing with trend and season".
 *
 * <p>The fit: start states by the heuristic of {@link EtsInitialStates}; smoothing parameters (alpha, beta, gamma,
 * phi) by maximum likelihood (the likelihood with the error variance concentrated out, Hyndman et al. 2008, section
 * 5.1) with a bounded Nelder–Mead search inside the usual region {@code 0 < alpha < 1}, {@code 0 < beta < alpha},
 * {@code 0 < gamma < 1 − alpha}, {@code 0.8 ≤ phi ≤ 0.98}. Estimating the m + 2 start states by likelihood too would
 * raise the search from at most 4 to 13 dimensions (59 for a weekly season) and cost tens of times more per series;
 * over tens of thousands of series the heuristic start is the documented simpler fit we accept.
 *
 * <p>Unknown values (NaN) carry the state forward without an update and add nothing to the likelihood: the state
 * space treatment of a missing observation. One instance reuses its scratch arrays for every series; not thread-safe.
 */
public final class EtsFitter implements BoundedSimplex.Objective {
  /** The fitted window holds at most this many seasons before the origin (364 days for a weekly season of days). */
  public static final int FIT_SEASONS = 52;
  /** Fewer known values than this in the window: the forecast is their mean (statsmodels' minimum for a fit). */
  public static final int MIN_KNOWN_VALUES = EtsInitialStates.REGRESSION_VALUES;

  private static final double LOWER = 1e-4;
  private static final double UPPER = 1 - 1e-4;
  private static final double PHI_LOWER = 0.8;
  private static final double PHI_UPPER = 0.98;
  private static final int MAX_EVALUATIONS_PER_PARAMETER = 200;
  private static final double RELATIVE_TOLERANCE = 1e-6;
  private static final double LOG_TWO_PI = Math.log(2 * Math.PI);

  private final int seasonLength;
  private final EtsInitialStates initial;
  private final BoundedSimplex simplex = new BoundedSimplex(4);
  private final double[] start = new double[4];
  private final double[] bestStart = new double[4];
  private final double[] lower = new double[4];
  private final double[] upper = new double[4];
  private final double[] ring;
  private final double[] bestRing;
  private double[] values = new double[0];
  private int valueCount;
  private int knownCount;
  private double knownMean;
  private boolean allPositive;

  private EtsForm objectiveForm;
  /** When set, {@link #evaluate} writes each one-step forecast here. */
  private double[] oneStepSink;
  private double level;
  private double trend;

  private EtsForm fittedForm;
  private final double[] fittedParameters = new double[4];
  private final double[] candidateParameters = new double[4];
  private final double[] bestParameters = new double[4];
  private double fittedLogLikelihood;
  private double fittedAicc;
  private double bestLevel;
  private double bestTrend;

  /** @param seasonLength periods in one season, {@code >= 2} (7 for days, 52 for weeks) */
  public EtsFitter(int seasonLength) {
    if (seasonLength < 2) {
      throw new IllegalArgumentException("seasonLength must be >= 2, got " + seasonLength);
    }
    this.seasonLength = seasonLength;
    this.initial = new EtsInitialStates(seasonLength);
    this.ring = new double[seasonLength];
    this.bestRing = new double[seasonLength];
  }

  /**
   * Forecasts one series the way {@link BaselineKind#ETS} does: from the first sale in {@code units[from .. origin)},
   * over the last {@link #FIT_SEASONS} seasons, unknown days (negative) skipped; the mean of the known values when
   * fewer than {@link #MIN_KNOWN_VALUES} are known or every known value is equal; 0 when nothing sold; never below 0.
   */
  public void forecastUnits(int[] units, int from, int origin, int horizon, double[] dst, int dstOffset) {
    int firstSale = BaselineKernels.firstSale(units, from, origin);
    if (firstSale < 0) {
      Arrays.fill(dst, dstOffset, dstOffset + horizon, 0.0);
      return;
    }
    int windowStart = Math.max(firstSale, origin - FIT_SEASONS * seasonLength);
    int count = origin - windowStart;
    ensureCapacity(count);
    for (int t = 0; t < count; t++) {
      int u = units[windowStart + t];
      values[t] = u < 0 ? Double.NaN : u;
    }
    loadStatistics(count);
    if (knownCount < MIN_KNOWN_VALUES || isConstant() || selectForm() == null) {
      Arrays.fill(dst, dstOffset, dstOffset + horizon, knownMean);
      return;
    }
    forecast(horizon, dst, dstOffset);
    for (int k = 0; k < horizon; k++) {
      dst[dstOffset + k] = Math.max(0, dst[dstOffset + k]);
    }
  }

  /** Loads a series to fit: {@code series[0 .. count)}, NaN for an unknown value; a copy is kept. */
  public void load(double[] series, int count) {
    ensureCapacity(count);
    System.arraycopy(series, 0, values, 0, count);
    loadStatistics(count);
  }

  /**
   * Fits every form the loaded series allows and keeps the one with the smallest AICc.
   *
   * @return the chosen form, or null when no form can be fitted (too few values)
   */
  public EtsForm selectForm() {
    EtsForm best = null;
    double bestAicc = Double.POSITIVE_INFINITY;
    for (EtsForm form : EtsForm.values()) {
      if (!fit(form)) {
        continue;
      }
      if (best == null || fittedAicc < bestAicc) {
        best = form;
        bestAicc = fittedAicc;
        System.arraycopy(fittedParameters, 0, bestParameters, 0, 4);
      }
    }
    if (best != null) {
      // Re-run the winner so the final states, likelihood and criterion are its own.
      initial.compute(values, valueCount, knownMean, best.season());
      remember(best, bestParameters);
    }
    return best;
  }

  /**
   * Fits one form by maximum likelihood from the heuristic start states.
   *
   * @return false when the loaded series cannot support the form (too few values for its start states or its
   *     parameter count, or a multiplicative season on a series with a value at or below 0)
   */
  public boolean fit(EtsForm form) {
    if (!available(form)) {
      return false;
    }
    objectiveForm = form;
    int dimension = form.smoothingParameterCount();
    double best = search(form, 0.1, 0.1, 0.98 - 1e-3);
    System.arraycopy(start, 0, bestStart, 0, dimension);
    if (form.hasTrend()) {
      // The trend's likelihood often has a second ridge (little damping and no trend change, or strong damping and a
      // quick one); a second start on the other side finds it (common practice with Nelder–Mead, no source).
      if (search(form, 0.3, 0.3, 0.85) < best) {
        System.arraycopy(start, 0, bestStart, 0, dimension);
      }
    }
    System.arraycopy(bestStart, 0, start, 0, dimension);
    modelParameters(form, start, candidateParameters);
    return Double.isFinite(remember(form, candidateParameters));
  }

  /** Minimises −logL from one start (alpha, beta* = beta/alpha, phi; gamma starts at 0.01); result in {@code start}. */
  private double search(EtsForm form, double alpha, double betaStar, double phi) {
    int dimension = form.smoothingParameterCount();
    int i = 0;
    start[i] = alpha;
    lower[i] = LOWER;
    upper[i++] = UPPER;
    if (form.hasTrend()) {
      // beta* = beta / alpha keeps beta < alpha inside a box.
      start[i] = betaStar;
      lower[i] = LOWER;
      upper[i++] = UPPER;
    }
    if (form.seasonal()) {
      // gamma* = gamma / (1 − alpha) keeps gamma < 1 − alpha inside a box.
      start[i] = 0.01 / (1 - alpha);
      lower[i] = LOWER;
      upper[i++] = UPPER;
    }
    if (form.damped()) {
      start[i] = phi;
      lower[i] = PHI_LOWER;
      upper[i] = PHI_UPPER;
    }
    double value = Double.NaN;
    // One restart from the first result: a collapsed simplex near a bound often stops short of the optimum.
    for (int round = 0; round < 2; round++) {
      value = simplex.minimise(this, start, lower, upper, dimension, MAX_EVALUATIONS_PER_PARAMETER * dimension,
          RELATIVE_TOLERANCE);
    }
    return value;
  }

  /** True when the loaded series has enough values (and, for a multiplicative season, only positive ones). */
  public boolean available(EtsForm form) {
    if (form.seasonal() && valueCount < EtsInitialStates.minimumSeasonalValues(seasonLength)) {
      return false;
    }
    if (form.season() == EtsForm.Season.MULTIPLICATIVE && !allPositive) {
      return false;
    }
    if (knownCount - form.criterionParameterCount(seasonLength) - 1 <= 0) {
      return false;
    }
    return initial.compute(values, valueCount, knownMean, form.season());
  }

  /**
   * Log-likelihood of the loaded series under a form with given parameters from the heuristic start states; leaves
   * the final states for {@link #forecast}.
   *
   * @param alpha level smoothing; {@code beta}, {@code gamma}, {@code phi} are ignored by forms without them
   * @return the log-likelihood, or NaN when the form is unavailable or a multiplicative forecast reaches 0
   */
  public double logLikelihood(EtsForm form, double alpha, double beta, double gamma, double phi) {
    if (!available(form)) {
      return Double.NaN;
    }
    double[] parameters = {alpha, beta, gamma, phi};
    return remember(form, parameters);
  }

  @Override
  public double value(double[] searchParameters) {
    modelParameters(objectiveForm, searchParameters, candidateParameters);
    return -evaluate(objectiveForm, candidateParameters);
  }

  /**
   * Point forecasts of the last fitted or evaluated form from its final states: level plus (damped) trend, with the
   * season of the same position.
   */
  public void forecast(int horizon, double[] dst, int dstOffset) {
    if (fittedForm == null) {
      throw new IllegalStateException("no form fitted yet");
    }
    double phi = fittedForm.damped() ? fittedParameters[3] : 1;
    double trendSum = 0;
    double phiPower = 1;
    int position = valueCount % seasonLength;
    for (int k = 0; k < horizon; k++) {
      if (fittedForm.hasTrend()) {
        phiPower *= phi;
        trendSum += phiPower;
      }
      double base = bestLevel + trendSum * bestTrend;
      double season = bestRing[(position + k) % seasonLength];
      dst[dstOffset + k] = switch (fittedForm.season()) {
        case NONE -> base;
        case ADDITIVE -> base + season;
        case MULTIPLICATIVE -> base * season;
      };
    }
  }

  /**
   * One-step forecasts of the loaded values under the last fitted or evaluated form, each made from the states before
   * that value, into {@code dst[0 .. valueCount)}.
   */
  public void oneStepForecasts(double[] dst) {
    if (fittedForm == null) {
      throw new IllegalStateException("no form fitted yet");
    }
    oneStepSink = dst;
    try {
      remember(fittedForm, fittedParameters.clone());
    } finally {
      oneStepSink = null;
    }
  }

  public EtsForm fittedForm() {
    return fittedForm;
  }

  /** Fitted alpha, beta, gamma, phi (0 for a parameter the form lacks, phi 1 when undamped); a copy. */
  public double[] fittedParameters() {
    double[] result = fittedParameters.clone();
    if (!fittedForm.hasTrend()) {
      result[1] = 0;
    }
    if (!fittedForm.seasonal()) {
      result[2] = 0;
    }
    if (!fittedForm.damped()) {
      result[3] = 1;
    }
    return result;
  }

  public double fittedLogLikelihood() {
    return fittedLogLikelihood;
  }

  /** AICc = −2 logL + 2k + 2k(k+1)/(n−k−1), k from {@link EtsForm#criterionParameterCount}, n known values. */
  public double fittedAicc() {
    return fittedAicc;
  }

  /** Start level of the last form whose start states were computed. */
  public double initialLevel() {
    return initial.level();
  }

  public double initialTrend() {
    return initial.trend();
  }

  /** Start season state of position {@code j} (position 0 = the first loaded value). */
  public double initialSeason(int j) {
    return initial.season(j);
  }

  /** Converts search parameters (alpha, beta*, gamma*, phi, absent ones skipped) to alpha, beta, gamma, phi. */
  private static void modelParameters(EtsForm form, double[] search, double[] dst) {
    int i = 0;
    double alpha = search[i++];
    double beta = form.hasTrend() ? alpha * search[i++] : 0;
    double gamma = form.seasonal() ? (1 - alpha) * search[i++] : 0;
    double phi = form.damped() ? search[i] : 1;
    dst[0] = alpha;
    dst[1] = beta;
    dst[2] = gamma;
    dst[3] = phi;
  }

  /** Runs the state recursion from the start states last computed by {@code initial}; returns the log-likelihood. */
  private double evaluate(EtsForm form, double[] parameters) {
    double alpha = parameters[0];
    double beta = form.hasTrend() ? parameters[1] : 0;
    double gamma = parameters[2];
    double phi = form.hasTrend() ? (form.damped() ? parameters[3] : 1) : 0;
    int m = seasonLength;
    level = initial.level();
    trend = form.hasTrend() ? initial.trend() : 0;
    boolean seasonal = form.seasonal();
    for (int j = 0; j < m; j++) {
      ring[j] = seasonal ? initial.season(j) : 0;
    }
    double squaredErrors = 0;
    double logForecasts = 0;
    int position = 0;
    boolean multiplicativeError = form.multiplicativeError();
    for (int t = 0; t < valueCount; t++) {
      double base = level + phi * trend;
      double season = ring[position];
      double y = values[t];
      if (oneStepSink != null) {
        double one = base;
        if (form.season() == EtsForm.Season.ADDITIVE) {
          one = base + season;
        } else if (form.season() == EtsForm.Season.MULTIPLICATIVE) {
          one = base * season;
        }
        oneStepSink[t] = one;
      }
      if (Double.isNaN(y)) {
        level = base;
        trend = phi * trend;
      } else if (multiplicativeError) {
        double forecast = seasonal ? base * season : base;
        if (!(forecast > 0)) {
          return Double.NaN;
        }
        double error = (y - forecast) / forecast;
        squaredErrors += error * error;
        logForecasts += Math.log(forecast);
        level = base * (1 + alpha * error);
        trend = phi * trend + beta * base * error;
        if (seasonal) {
          ring[position] = season * (1 + gamma * error);
        }
      } else {
        double forecast = seasonal ? base + season : base;
        double error = y - forecast;
        squaredErrors += error * error;
        level = base + alpha * error;
        trend = phi * trend + beta * error;
        if (seasonal) {
          ring[position] = season + gamma * error;
        }
      }
      position = position + 1 == m ? 0 : position + 1;
    }
    // A perfect fit would give log(0); the floor keeps the criterion finite (such a series is its own forecast).
    double variance = Math.max(squaredErrors / knownCount, 1e-300);
    return -0.5 * knownCount * (LOG_TWO_PI + Math.log(variance) + 1) - logForecasts;
  }

  /** Evaluates a form and keeps it as the fitted one (parameters, final states, criterion); returns logL. */
  private double remember(EtsForm form, double[] parameters) {
    fittedForm = form;
    System.arraycopy(parameters, 0, fittedParameters, 0, 4);
    double logLikelihood = evaluate(form, parameters);
    fittedLogLikelihood = logLikelihood;
    int k = form.criterionParameterCount(seasonLength);
    fittedAicc = -2 * logLikelihood + 2 * k + 2.0 * k * (k + 1) / (knownCount - k - 1);
    bestLevel = level;
    bestTrend = trend;
    System.arraycopy(ring, 0, bestRing, 0, seasonLength);
    return logLikelihood;
  }

  private void loadStatistics(int count) {
    valueCount = count;
    knownCount = 0;
    double sum = 0;
    allPositive = true;
    for (int t = 0; t < count; t++) {
      double y = values[t];
      if (!Double.isNaN(y)) {
        knownCount++;
        sum += y;
        allPositive = allPositive && y > 0;
      }
    }
    knownMean = knownCount == 0 ? 0 : sum / knownCount;
    fittedForm = null;
  }

  private boolean isConstant() {
    double first = Double.NaN;
    for (int t = 0; t < valueCount; t++) {
      double y = values[t];
      if (Double.isNaN(y)) {
        continue;
      }
      if (Double.isNaN(first)) {
        first = y;
      } else if (y != first) {
        return false;
      }
    }
    return true;
  }

  private void ensureCapacity(int count) {
    if (values.length < count) {
      values = new double[Math.max(count, values.length * 2)];
    }
  }
}
