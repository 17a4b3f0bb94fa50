package org.lagmill.report;

import java.time.LocalDate;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;

/**
 * One actual-versus-forecast chart: recent history, the forecast and its interval band, on one daily axis.
 *
 * @param title what is plotted, e.g. "total", "region Northvale", "item-store PNT-D2-0041@NV-03"
 * @param dates the day of each point, in order
 * @param actual units sold per day, NaN where unknown or in the future; same length as {@code dates}
 * @param forecast forecast units per day, NaN where none; same length as {@code dates}
 * @param lower the band's lower bound per day (NaN where none), or null when there is no band
 * @param upper the band's upper bound per day (NaN where none), or null when there is no band
 * @param lowerQuantile the quantile level of {@code lower} in (0, 1), e.g. 0.1, or null
 * @param upperQuantile the quantile level of {@code upper} in (0, 1), e.g. 0.9, or null
 * @param originIndex index in {@code dates} of the first forecast day, or -1 when there is no origin to mark
 */
public record SeriesChart(
    String title,
    List<LocalDate> dates,
    double[] actual,
    double[] forecast,
    double[] lower,
    double[] upper,
    Double lowerQuantile,
    Double upperQuantile,
    int originIndex) {

  public SeriesChart {
    title = ReportData.requireText(title, "title");
    if (dates == null) {
      throw new IllegalArgumentException("dates of chart " + title + " must not be null");
    }
    dates = List.copyOf(dates);
    int dayCount = dates.size();
    requireLength(title, "actual", actual, dayCount, false);
    requireLength(title, "forecast", forecast, dayCount, false);
    requireLength(title, "lower", lower, dayCount, true);
    requireLength(title, "upper", upper, dayCount, true);
    if ((lower == null) != (upper == null)) {
      throw new IllegalArgumentException("chart " + title + ": give both lower and upper band bounds or neither");
    }
    if (originIndex < -1 || originIndex >= Math.max(dayCount, 1)) {
      throw new IllegalArgumentException("chart " + title + ": originIndex must be in [-1, " + (dayCount - 1)
          + "], got " + originIndex + " (-1 means no origin marker)");
    }
  }

  private static void requireLength(String title, String name, double[] values, int dayCount, boolean nullable) {
    if (values == null) {
      if (!nullable) {
        throw new IllegalArgumentException("chart " + title + ": " + name + " must not be null; use NaN for "
            + "unknown days");
      }
      return;
    }
    if (values.length != dayCount) {
      throw new IllegalArgumentException("chart " + title + ": " + name + " has " + values.length
          + " values but there are " + dayCount + " dates; give one value per date (NaN where unknown)");
    }
  }

  /** Whether the chart carries an interval band. */
  public boolean hasBand() {
    return lower != null;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof SeriesChart c && title.equals(c.title) && dates.equals(c.dates)
        && Arrays.equals(actual, c.actual) && Arrays.equals(forecast, c.forecast) && Arrays.equals(lower, c.lower)
        && Arrays.equals(upper, c.upper) && Objects.equals(lowerQuantile, c.lowerQuantile)
        && Objects.equals(upperQuantile, c.upperQuantile) && originIndex == c.originIndex;
  }

  @Override
  public int hashCode() {
    return Objects.hash(title, dates, Arrays.hashCode(actual), Arrays.hashCode(forecast), Arrays.hashCode(lower),
        Arrays.hashCode(upper), lowerQuantile, upperQuantile, originIndex);
  }

  @Override
  public String toString() {
    return "SeriesChart[" + title + ", " + dates.size() + " days, origin " + originIndex + "]";
  }
}
