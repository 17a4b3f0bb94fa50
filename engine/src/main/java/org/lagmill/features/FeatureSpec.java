package org.lagmill.features;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.stream.Collectors;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.store.Periods;

/**
 * What the feature pass computes: lags and rolling statistics of units, calendar, price and series features, and the
 * training window. Immutable; built with {@link #defaults()}, {@link #toBuilder()} or the {@code with…} methods, and
 * read from YAML by {@link FeatureSpecYaml}. Every argument is checked when the spec is built; checks that need the
 * history (a window longer than it, missing attributes) run when a {@link FeaturePass} is created.
 *
 * <p>Defaults suit daily retail demand with a 28-day horizon and a direct model: lags 28, 35, 42, 49, 56 days; rolling
 * mean and sample standard deviation over 7, 28 and 56 days of units shifted by the horizon.
 */
public final class FeatureSpec {
  /** How forecasts are produced: one model reads only what is known at the origin, or predictions are fed back. */
  public enum Strategy {
    DIRECT,
    RECURSIVE;

    public String configName() { return name().toLowerCase(Locale.ROOT); }

    public static Strategy parse(String name) {
      return parseName(Strategy.class, "strategy", name);
    }
  }

  /** Statistics of a rolling window of units. STD is the sample standard deviation (divisor n − 1). */
  public enum RollingStat {
    MEAN,
    STD,
    MIN,
    MAX,
    ZERO_SHARE;

    public String configName() { return name().toLowerCase(Locale.ROOT); }

    public static RollingStat parse(String name) {
      return parseName(RollingStat.class, "rolling statistic", name);
    }
  }

  /** Features derived from the date alone. */
  public enum CalendarFeature {
    DAY_OF_WEEK,
    DAY_OF_MONTH,
    MONTH,
    WEEK_OF_YEAR,
    DAY_OF_YEAR;

    public String configName() { return name().toLowerCase(Locale.ROOT); }

    public static CalendarFeature parse(String name) {
      return parseName(CalendarFeature.class, "calendar feature", name);
    }
  }

  /** Features of the shelf price; computed only when the history has prices. */
  public enum PriceFeature {
    PRICE,
    PRICE_TO_MEAN,
    PRICE_TO_MAX,
    PRICE_CHANGE_7,
    PROMO,
    PRICE_TO_GROUP;

    public String configName() { return name().toLowerCase(Locale.ROOT); }

    public static PriceFeature parse(String name) {
      return parseName(PriceFeature.class, "price feature", name);
    }
  }

  /** Features of the series' own history besides lags and rolling windows. */
  public enum SeriesFeature {
    DAYS_SINCE_FIRST_SALE,
    ZERO_RUN;

    public String configName() { return name().toLowerCase(Locale.ROOT); }

    public static SeriesFeature parse(String name) {
      return parseName(SeriesFeature.class, "series feature", name);
    }
  }

  public static final int DEFAULT_HORIZON_DAYS = 28;
  /** Default horizon of a store whose period is longer than a day: 8 periods, two months of weeks. */
  public static final int COARSE_HORIZON_PERIODS = 8;

  private final int horizonDays;
  private final Strategy strategy;
  private final int[] lagDays;
  private final int[] rollingWindowDays;
  private final Integer rollingShiftDaysOrNull;
  private final List<RollingStat> rollingStats;
  private final List<CalendarFeature> calendarFeatures;
  private final boolean calendarColumns;
  private final List<PriceFeature> priceFeatures;
  private final List<String> priceGroupAttributesOrNull;
  private final List<String> categoricalAttributesOrNull;
  private final List<SeriesFeature> seriesFeatures;
  private final List<String> planColumnsOrNull;
  private final LocalDate fromDate;
  private final LocalDate untilDate;
  private final boolean skipPreLaunch;

  private FeatureSpec(Builder b) {
    horizonDays = b.horizonDays;
    strategy = Objects.requireNonNull(b.strategy, "strategy");
    lagDays = b.lagDays.clone();
    rollingWindowDays = b.rollingWindowDays.clone();
    rollingShiftDaysOrNull = b.rollingShiftDays;
    rollingStats = List.copyOf(b.rollingStats);
    calendarFeatures = List.copyOf(b.calendarFeatures);
    calendarColumns = b.calendarColumns;
    priceFeatures = List.copyOf(b.priceFeatures);
    priceGroupAttributesOrNull = b.priceGroupAttributes == null ? null : List.copyOf(b.priceGroupAttributes);
    categoricalAttributesOrNull = b.categoricalAttributes == null ? null : List.copyOf(b.categoricalAttributes);
    seriesFeatures = List.copyOf(b.seriesFeatures);
    planColumnsOrNull = b.planColumns == null ? null : List.copyOf(b.planColumns);
    fromDate = b.fromDate;
    untilDate = b.untilDate;
    skipPreLaunch = b.skipPreLaunch;
    validate();
  }

  /**
   * The builder's starting point, the daily direct spec described in the class comment. What lagmill applies when the
   * user gives no spec is {@link #defaultsFor(int)}.
   */
  public static FeatureSpec defaults() {
    return builder().build();
  }

  /**
   * The spec lagmill applies to a store of this period when the user gives none: {@link Strategy#RECURSIVE} with
   * short lags. Backtests on two scenarios shaped differently chose it (docs/benchmarks.md, "Which default spec"):
   * on daily data it ties the direct spec, on weekly data it is the only spec that beats the naive baselines.
   *
   * @param periodDays the store's step in days ({@link Periods#requireValid})
   */
  public static FeatureSpec defaultsFor(int periodDays) {
    return defaultsFor(periodDays, Strategy.RECURSIVE);
  }

  /**
   * The default spec of a store's period for one strategy; a spec file that names a strategy starts from this.
   * <ul>
   *   <li>Daily: a 28-day horizon; direct reads lags 28 to 56 and windows 7, 28, 56 shifted by the horizon;
   *       recursive reads lags 1 to 7, 14, 21, 28, 35 and the same windows ending the day before.
   *   <li>Any longer period (sized for weeks): an 8-period horizon, windows 4, 13 and 26; direct reads lags 8, 9, 10,
   *       12, 16, 26, recursive lags 1 to 4, 8, 13, 26. No 52-week lag: a series' training rows start at its first
   *       sale plus the longest lag ({@link #launchSkipDays()}), and a year of rows is most of a weekly history
   *       (measured: 0.9646 against 0.7727 mean WRMSSE over 3 origins, docs/benchmarks.md); the yearly season comes
   *       from {@code week_of_year} and the calendar instead.
   * </ul>
   */
  public static FeatureSpec defaultsFor(int periodDays, Strategy strategy) {
    Builder b = builder().strategy(strategy);
    if (Periods.requireValid(periodDays) == Periods.DAILY) {
      return strategy == Strategy.DIRECT ? b.build()
          : b.lagDays(1, 2, 3, 4, 5, 6, 7, 14, 21, 28, 35).rollingShiftDays(1).build();
    }
    b.horizonDays(COARSE_HORIZON_PERIODS).rollingWindowDays(4, 13, 26);
    return strategy == Strategy.DIRECT ? b.lagDays(8, 9, 10, 12, 16, 26).build()
        : b.lagDays(1, 2, 3, 4, 8, 13, 26).rollingShiftDays(1).build();
  }

  public static Builder builder() {
    return new Builder();
  }

  public Builder toBuilder() {
    Builder b = new Builder();
    b.horizonDays = horizonDays;
    b.strategy = strategy;
    b.lagDays = lagDays.clone();
    b.rollingWindowDays = rollingWindowDays.clone();
    b.rollingShiftDays = rollingShiftDaysOrNull;
    b.rollingStats = rollingStats;
    b.calendarFeatures = calendarFeatures;
    b.calendarColumns = calendarColumns;
    b.priceFeatures = priceFeatures;
    b.priceGroupAttributes = priceGroupAttributesOrNull;
    b.categoricalAttributes = categoricalAttributesOrNull;
    b.seriesFeatures = seriesFeatures;
    b.planColumns = planColumnsOrNull;
    b.fromDate = fromDate;
    b.untilDate = untilDate;
    b.skipPreLaunch = skipPreLaunch;
    return b;
  }

  /** Days ahead a forecast reaches; a direct model's lags and rolling shift must be at least this. */
  public int horizonDays() {
    return horizonDays;
  }

  public Strategy strategy() { return strategy; }

  /** Lags of units in days, in the order their columns appear. */
  public int[] lagDays() { return lagDays.clone(); }

  /** Rolling window lengths in days. */
  public int[] rollingWindowDays() { return rollingWindowDays.clone(); }

  /** Days between a row's day and the last day of its rolling windows; the horizon unless set. */
  public int rollingShiftDays() {
    return rollingShiftDaysOrNull == null ? horizonDays : rollingShiftDaysOrNull;
  }

  /** True when the rolling shift was set explicitly rather than following the horizon. */
  public boolean hasExplicitRollingShift() {
    return rollingShiftDaysOrNull != null;
  }

  public List<RollingStat> rollingStats() { return rollingStats; }

  public List<CalendarFeature> calendarFeatures() { return calendarFeatures; }

  /** Whether every column of the history's day calendar becomes a feature ({@code cal_<name>}). */
  public boolean calendarColumns() {
    return calendarColumns;
  }

  public List<PriceFeature> priceFeatures() { return priceFeatures; }

  /**
   * Attributes whose shared values form a price group, or null for the default: department and store when the series
   * have both, else no group feature.
   */
  public List<String> priceGroupAttributes() { return priceGroupAttributesOrNull; }

  /** Attributes whose codes become categorical features, or null for every attribute except {@code series_id}. */
  public List<String> categoricalAttributes() {
    return categoricalAttributesOrNull;
  }

  public List<SeriesFeature> seriesFeatures() { return seriesFeatures; }

  /**
   * Columns of the history's plan that become features {@code plan_<column>}, in this order, or null for every column
   * the history's plan has. Training records the columns it used here, so a model reads the same columns at
   * forecast time whatever else a later plan holds.
   */
  public List<String> planColumns() { return planColumnsOrNull; }

  /**
   * This spec with {@link #planColumns()} fixed to the columns of {@code planColumnNames} when it is unset (what
   * training records); unchanged when already set.
   */
  public FeatureSpec withPlanColumnsResolved(List<String> planColumnNames) {
    return planColumnsOrNull != null ? this : toBuilder().planColumns(planColumnNames).build();
  }

  /** First date of training rows, or null for the start of the history. */
  public LocalDate fromDate() {
    return fromDate;
  }

  /** Last date of training rows (inclusive), or null for the end of the history. */
  public LocalDate untilDate() {
    return untilDate;
  }

  /** Whether training rows of a series start only at its first sale plus the longest lag. */
  public boolean skipPreLaunch() {
    return skipPreLaunch;
  }

  /** The shortest number of days between a row and the most recent unit any feature reads. */
  public int shortestShiftDays() {
    int shift = rollingWindowDays.length > 0 ? rollingShiftDays() : Integer.MAX_VALUE;
    for (int lag : lagDays) {
      shift = Math.min(shift, lag);
    }
    return shift == Integer.MAX_VALUE ? rollingShiftDays() : shift;
  }

  /** Days after the first sale before a training row starts when {@link #skipPreLaunch()}: the longest lag. */
  public int launchSkipDays() {
    int longest = 0;
    for (int lag : lagDays) {
      longest = Math.max(longest, lag);
    }
    return lagDays.length == 0 ? rollingShiftDays() : longest;
  }

  public FeatureSpec withHorizonDays(int days) { return toBuilder().horizonDays(days).build(); }
  public FeatureSpec withStrategy(Strategy value) { return toBuilder().strategy(value).build(); }
  public FeatureSpec withLagDays(int... days) { return toBuilder().lagDays(days).build(); }
  public FeatureSpec withRollingWindowDays(int... days) { return toBuilder().rollingWindowDays(days).build(); }
  public FeatureSpec withRollingShiftDays(int days) { return toBuilder().rollingShiftDays(days).build(); }
  public FeatureSpec withRollingStats(List<RollingStat> stats) { return toBuilder().rollingStats(stats).build(); }
  public FeatureSpec withTrainingWindow(LocalDate from, LocalDate until) {
    return toBuilder().fromDate(from).untilDate(until).build();
  }

  private void validate() {
    if (horizonDays < 1) {
      throw new InvalidRequestException("horizonDays " + horizonDays + " is out of range: it must be >= 1 (days)");
    }
    checkDays("lag", lagDays);
    checkDays("rolling window", rollingWindowDays);
    int shift = rollingShiftDays();
    if (shift < 1) {
      throw new InvalidRequestException("rolling shift " + shift + " is out of range: it must be >= 1 (days)");
    }
    if (strategy == Strategy.DIRECT) {
      for (int lag : lagDays) {
        if (lag < horizonDays) {
          throw new InvalidRequestException("lag " + lag + " is shorter than the horizon of " + horizonDays
              + " days: a direct model would read units it cannot know when forecasting day " + (lag + 1)
              + " onward (a leak); use lags >= " + horizonDays + " or set strategy: recursive");
        }
      }
      if (rollingWindowDays.length > 0 && shift < horizonDays) {
        throw new InvalidRequestException("rolling shift " + shift + " is shorter than the horizon of " + horizonDays
            + " days: a direct model would read units it cannot know when forecasting day " + (shift + 1)
            + " onward (a leak); use rollingShiftDays >= " + horizonDays + " or set strategy: recursive");
      }
    }
    if (fromDate != null && untilDate != null && untilDate.isBefore(fromDate)) {
      throw new InvalidRequestException("untilDate " + untilDate + " is before fromDate " + fromDate
          + ": the training window would be empty; swap them or drop one");
    }
    checkNoDuplicates("rolling statistic", rollingStats.stream().map(RollingStat::configName).toList());
    checkNoDuplicates("calendar feature", calendarFeatures.stream().map(CalendarFeature::configName).toList());
    checkNoDuplicates("price feature", priceFeatures.stream().map(PriceFeature::configName).toList());
    checkNoDuplicates("series feature", seriesFeatures.stream().map(SeriesFeature::configName).toList());
    if (planColumnsOrNull != null) {
      checkNoDuplicates("plan column", planColumnsOrNull);
    }
  }

  private static void checkDays(String what, int[] days) {
    for (int i = 0; i < days.length; i++) {
      if (days[i] < 1) {
        throw new InvalidRequestException(what + " " + days[i] + " is out of range: it must be >= 1 (days)");
      }
      for (int j = 0; j < i; j++) {
        if (days[j] == days[i]) {
          throw new InvalidRequestException(what + " " + days[i] + " is listed twice; list each once");
        }
      }
    }
  }

  private static void checkNoDuplicates(String what, List<String> names) {
    for (int i = 0; i < names.size(); i++) {
      if (names.indexOf(names.get(i)) != i) {
        throw new InvalidRequestException(what + " '" + names.get(i) + "' is listed twice; list each once");
      }
    }
  }

  static <E extends Enum<E>> E parseName(Class<E> type, String what, String name) {
    for (E e : type.getEnumConstants()) {
      if (e.name().toLowerCase(Locale.ROOT).equals(name)) {
        return e;
      }
    }
    String allowed = Arrays.stream(type.getEnumConstants()).map(e -> e.name().toLowerCase(Locale.ROOT))
        .collect(Collectors.joining(", "));
    throw new InvalidRequestException("unknown " + what + " '" + name + "'; allowed: " + allowed);
  }

  @Override
  public boolean equals(Object o) {
    if (!(o instanceof FeatureSpec other)) {
      return false;
    }
    return horizonDays == other.horizonDays && strategy == other.strategy && Arrays.equals(lagDays, other.lagDays)
        && Arrays.equals(rollingWindowDays, other.rollingWindowDays)
        && Objects.equals(rollingShiftDaysOrNull, other.rollingShiftDaysOrNull)
        && rollingStats.equals(other.rollingStats) && calendarFeatures.equals(other.calendarFeatures)
        && calendarColumns == other.calendarColumns && priceFeatures.equals(other.priceFeatures)
        && Objects.equals(priceGroupAttributesOrNull, other.priceGroupAttributesOrNull)
        && Objects.equals(categoricalAttributesOrNull, other.categoricalAttributesOrNull)
        && seriesFeatures.equals(other.seriesFeatures) && Objects.equals(planColumnsOrNull, other.planColumnsOrNull)
        && Objects.equals(fromDate, other.fromDate)
        && Objects.equals(untilDate, other.untilDate) && skipPreLaunch == other.skipPreLaunch;
  }

  @Override
  public int hashCode() {
    return Objects.hash(horizonDays, strategy, Arrays.hashCode(lagDays), Arrays.hashCode(rollingWindowDays),
        rollingStats, calendarFeatures, priceFeatures, seriesFeatures, fromDate, untilDate);
  }

  @Override
  public String toString() {
    return "FeatureSpec[horizonDays=" + horizonDays + ", strategy=" + strategy.configName() + ", lagDays="
        + Arrays.toString(lagDays) + ", rollingWindowDays=" + Arrays.toString(rollingWindowDays)
        + ", rollingShiftDays=" + rollingShiftDays() + ", rollingStats=" + rollingStats + "]";
  }

  /** Mutable builder; {@link #build()} validates. */
  public static final class Builder {
    private int horizonDays = DEFAULT_HORIZON_DAYS;
    private Strategy strategy = Strategy.DIRECT;
    private int[] lagDays = {28, 35, 42, 49, 56};
    private int[] rollingWindowDays = {7, 28, 56};
    private Integer rollingShiftDays;
    private List<RollingStat> rollingStats = List.of(RollingStat.MEAN, RollingStat.STD);
    private List<CalendarFeature> calendarFeatures = List.of(CalendarFeature.values());
    private boolean calendarColumns = true;
    private List<PriceFeature> priceFeatures = List.of(PriceFeature.values());
    private List<String> priceGroupAttributes;
    private List<String> categoricalAttributes;
    private List<SeriesFeature> seriesFeatures = List.of(SeriesFeature.values());
    private List<String> planColumns;
    private LocalDate fromDate;
    private LocalDate untilDate;
    private boolean skipPreLaunch = true;

    private Builder() {}

    public Builder horizonDays(int days) { horizonDays = days; return this; }
    public Builder strategy(Strategy value) { strategy = value; return this; }
    public Builder lagDays(int... days) { lagDays = days.clone(); return this; }
    public Builder rollingWindowDays(int... days) { rollingWindowDays = days.clone(); return this; }
    /** Sets the rolling shift in days; null makes it follow the horizon. */
    public Builder rollingShiftDays(Integer days) {
      rollingShiftDays = days;
      return this;
    }
    public Builder rollingStats(List<RollingStat> stats) { rollingStats = List.copyOf(stats); return this; }

    /** Rolling statistics by config name (mean, std, min, max, zero_share). */
    public Builder rollingStatNames(List<String> names) {
      return rollingStats(names.stream().map(RollingStat::parse).toList());
    }

    public Builder calendarFeatures(List<CalendarFeature> features) {
      calendarFeatures = List.copyOf(features);
      return this;
    }

    public Builder calendarFeatureNames(List<String> names) {
      return calendarFeatures(names.stream().map(CalendarFeature::parse).toList());
    }

    public Builder calendarColumns(boolean include) { calendarColumns = include; return this; }
    public Builder priceFeatures(List<PriceFeature> features) { priceFeatures = List.copyOf(features); return this; }

    public Builder priceFeatureNames(List<String> names) {
      return priceFeatures(names.stream().map(PriceFeature::parse).toList());
    }

    /** Null restores the default (department and store when present). */
    public Builder priceGroupAttributes(List<String> names) {
      priceGroupAttributes = names == null ? null : new ArrayList<>(names);
      return this;
    }

    /** Null restores the default (every attribute except series_id). */
    public Builder categoricalAttributes(List<String> names) {
      categoricalAttributes = names == null ? null : new ArrayList<>(names);
      return this;
    }

    public Builder seriesFeatures(List<SeriesFeature> features) {
      seriesFeatures = List.copyOf(features);
      return this;
    }

    public Builder seriesFeatureNames(List<String> names) {
      return seriesFeatures(names.stream().map(SeriesFeature::parse).toList());
    }

    /** Null restores the default (every column of the history's plan); an empty list takes none. */
    public Builder planColumns(List<String> names) {
      planColumns = names == null ? null : new ArrayList<>(names);
      return this;
    }

    public Builder fromDate(LocalDate date) { fromDate = date; return this; }
    public Builder untilDate(LocalDate date) { untilDate = date; return this; }
    public Builder skipPreLaunch(boolean skip) { skipPreLaunch = skip; return this; }

    public FeatureSpec build() {
      return new FeatureSpec(this);
    }
  }
}
