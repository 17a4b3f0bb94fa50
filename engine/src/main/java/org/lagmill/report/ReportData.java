package org.lagmill.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * Everything one report shows, as plain records: the same value is written as the run's {@code report.json}
 * ({@link ReportJson}) and rendered as HTML ({@link HtmlReportWriter}).
 *
 * <p>Only {@code title} and {@code caution} are required. Every other part may be {@code null} (or an empty list): the
 * report then keeps the section and says in one line that the data is absent. Arrays inside the records are not
 * copied; treat them as owned by the record once passed in. Immutable otherwise, and so safe to share between threads.
 *
 * @param title report title, not blank
 * @param caution the caution shown in the top banner and in the closing section, not blank
 * @param run how and where the run was made, or null
 * @param data what the sales history holds, or null
 * @param stages time and memory per pipeline stage, in run order; empty when not recorded
 * @param training validation curve and feature importance, or null when no model was trained
 * @param accuracy the backtest scores against the baselines, or null when no evaluation ran
 * @param horizon error by horizon day, or null
 * @param series actual-versus-forecast charts, in display order; empty when none were requested
 * @param drivers why-this-forecast charts (the forecast split by driver family), in display order; empty when none
 */
public record ReportData(
    String title,
    String caution,
    RunInfo run,
    DataSummary data,
    List<StageStats> stages,
    TrainingSummary training,
    AccuracySummary accuracy,
    HorizonErrors horizon,
    List<SeriesChart> series,
    List<DriverChart> drivers) {

  /** The caution every report carries unless the caller words it differently. */
  public static final String DEFAULT_CAUTION = "These forecasts are statistical estimates for a planner to review. "
      + "They are not orders: check them against promotions, supply constraints and local knowledge before acting on "
      + "them.";

  public ReportData {
    title = requireText(title, "title");
    caution = requireText(caution, "caution");
    stages = stages == null ? List.of() : List.copyOf(stages);
    series = series == null ? List.of() : List.copyOf(series);
    drivers = drivers == null ? List.of() : List.copyOf(drivers);
  }

  /** Starts a report with the given title and the {@link #DEFAULT_CAUTION}; all other parts absent. */
  public static Builder builder(String title) {
    return new Builder(title);
  }

  /** A copy of this report as a builder, to replace some parts. */
  public Builder toBuilder() {
    Builder b = new Builder(title).caution(caution).run(run).data(data).training(training).accuracy(accuracy)
        .horizon(horizon);
    b.stages.addAll(stages);
    b.series.addAll(series);
    b.drivers.addAll(drivers);
    return b;
  }

  static String requireText(String value, String name) {
    if (value == null || value.isBlank()) {
      throw new IllegalArgumentException(name + " must be a non-blank text, got " + (value == null ? "null" : "\""
          + value + "\"") + "; every report needs a " + name);
    }
    return value;
  }

  /** Assembles a {@link ReportData} part by part; not thread-safe. */
  public static final class Builder {
    private final String title;
    private String caution = DEFAULT_CAUTION;
    private RunInfo run;
    private DataSummary data;
    private final List<StageStats> stages = new ArrayList<>();
    private TrainingSummary training;
    private AccuracySummary accuracy;
    private HorizonErrors horizon;
    private final List<SeriesChart> series = new ArrayList<>();
    private final List<DriverChart> drivers = new ArrayList<>();

    private Builder(String title) {
      this.title = title;
    }

    public Builder caution(String text) {
      this.caution = text;
      return this;
    }

    public Builder run(RunInfo value) {
      this.run = value;
      return this;
    }

    public Builder data(DataSummary value) {
      this.data = value;
      return this;
    }

    /** Appends one stage; stages keep the order in which they are added. */
    public Builder stage(StageStats value) {
      stages.add(Objects.requireNonNull(value, "stage"));
      return this;
    }

    public Builder clearStages() {
      stages.clear();
      return this;
    }

    public Builder training(TrainingSummary value) {
      this.training = value;
      return this;
    }

    public Builder accuracy(AccuracySummary value) {
      this.accuracy = value;
      return this;
    }

    public Builder horizon(HorizonErrors value) {
      this.horizon = value;
      return this;
    }

    /** Appends one series chart; charts keep the order in which they are added. */
    public Builder series(SeriesChart value) {
      series.add(Objects.requireNonNull(value, "series chart"));
      return this;
    }

    public Builder clearSeries() {
      series.clear();
      return this;
    }

    /** Appends one why-this-forecast chart; charts keep the order in which they are added. */
    public Builder driver(DriverChart value) {
      drivers.add(Objects.requireNonNull(value, "driver chart"));
      return this;
    }

    public ReportData build() {
      return new ReportData(title, caution, run, data, stages, training, accuracy, horizon, series, drivers);
    }
  }
}
