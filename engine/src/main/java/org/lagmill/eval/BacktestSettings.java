package org.lagmill.eval;

import java.util.List;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;

/**
 * Where a rolling-origin backtest puts its origins and what it compares the model with.
 *
 * @param originCount number of forecast origins, the last one {@code horizonDays} before the end of the history
 * @param stepDays days between consecutive origins
 * @param baselines simple rules scored on the same origins
 * @param quantileLevels probabilities of the interval quantiles scored by the pinball loss; empty to skip
 */
public record BacktestSettings(int originCount, int stepDays, int horizonDays, List<BaselineKind> baselines,
    Hierarchy hierarchy, double[] quantileLevels) {

  public BacktestSettings {
    if (originCount < 1) {
      throw new InvalidRequestException(Setting.ORIGINS + " must be >= 1, got " + originCount);
    }
    if (stepDays < 1) {
      throw new InvalidRequestException(Setting.STEP + " must be >= 1 day, got " + stepDays);
    }
    if (horizonDays < 1) {
      throw new InvalidRequestException(Setting.HORIZON + " must be >= 1 day, got " + horizonDays);
    }
    baselines = List.copyOf(baselines);
  }

  /** Day index of origin {@code k} (0 = earliest) in a history of {@code dayCount} days. */
  public int originDayIndex(int dayCount, int k) {
    return dayCount - horizonDays - (originCount - 1 - k) * stepDays;
  }
}
