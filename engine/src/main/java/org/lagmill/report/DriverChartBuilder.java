package org.lagmill.report;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.eval.AggregateTable;
import org.lagmill.eval.Aggregator;
import org.lagmill.eval.Level;
import org.lagmill.features.FeatureFamily;
import org.lagmill.forecast.ForecastExplainer;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesHistory;
import org.lagmill.training.ModelSet;

/**
 * Explains the forecast after a history's last period for the largest aggregate of each level (by units over the
 * recent periods, as the actual-and-forecast charts choose) and for the series the user names.
 */
public final class DriverChartBuilder {
  /** Name of the part holding the base level (exp of the model's bias with a log link). */
  public static final String BASE_PART = "base level";
  /** Name of the part holding units added where an identity-link prediction was floored at zero. */
  public static final String FLOOR_PART = "floor at zero";

  private DriverChartBuilder() {}

  /**
   * @param levels bound levels; their largest aggregates are explained, the bottom level's only when named
   * @param shownSeriesIds bottom series to explain as well, by series id
   * @param contextDays periods before the last one over which the largest aggregate is chosen
   */
  public static List<DriverChart> build(SalesHistory history, List<Level> levels, ModelSet models, int horizonDays,
      List<String> shownSeriesIds, int contextDays, MemoryBudget budget) {
    int firstDay = Math.max(0, history.dayCount() - contextDays);
    AggregateTable actual = new Aggregator(levels).aggregateActuals(history, firstDay, history.dayCount() - firstDay);
    List<ForecastExplainer.Target> targets = new ArrayList<>();
    for (int l = 0; l < levels.size(); l++) {
      Level level = levels.get(l);
      if (level.isBottom()) {
        continue;
      }
      int top = SeriesChartBuilder.largestAggregate(actual, l, actual.dayCount());
      List<Integer> members = new ArrayList<>();
      for (int s = 0; s < history.seriesCount(); s++) {
        if (level.aggregateIndexOf(s) == top) {
          members.add(s);
        }
      }
      String title = level.attributeNames().isEmpty() ? "total" : level.name() + ": " + level.aggregateName(top);
      targets.add(new ForecastExplainer.Target(title, members.stream().mapToInt(Integer::intValue).toArray()));
    }
    for (String id : shownSeriesIds) {
      int series = history.attributes().seriesIndexOf(id);
      if (series < 0) {
        throw new InvalidRequestException(Setting.CHOSEN_SERIES + " " + id
            + ": no such series in the store; list them with "
            + Setting.Command.SERIES + " " + Setting.STORE + " DIR " + Setting.MATCH + " TEXT");
      }
      targets.add(new ForecastExplainer.Target("series " + id, new int[] {series}));
    }
    List<LocalDate> dates = new ArrayList<>();
    for (int d = 0; d < horizonDays; d++) {
      dates.add(history.dateOf(history.dayCount() + d));
    }
    List<DriverChart> charts = new ArrayList<>();
    for (ForecastExplainer.Explanation e : ForecastExplainer.explain(history, models, horizonDays, targets, budget)) {
      charts.add(chart(e, dates));
    }
    return charts;
  }

  /** The report's form of one explanation: base first, then each family with a share, then the floor if any. */
  public static DriverChart chart(ForecastExplainer.Explanation e, List<LocalDate> dates) {
    List<DriverChart.Part> parts = new ArrayList<>();
    parts.add(new DriverChart.Part(BASE_PART, e.base()));
    for (FeatureFamily family : FeatureFamily.values()) {
      double[] units = e.families()[family.ordinal()];
      if (anyNonZero(units)) {
        parts.add(new DriverChart.Part(family.label(), units));
      }
    }
    if (anyNonZero(e.floorUnits())) {
      parts.add(new DriverChart.Part(FLOOR_PART, e.floorUnits()));
    }
    return new DriverChart(e.name(), e.seriesCount(), dates, e.forecast(), parts);
  }

  private static boolean anyNonZero(double[] values) {
    for (double v : values) {
      if (v != 0) {
        return true;
      }
    }
    return false;
  }
}
