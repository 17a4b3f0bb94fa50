package org.lagmill.features;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.lagmill.io.Setting;
import org.lagmill.store.Periods;

/**
 * A commented feature spec file: every key of {@link FeatureSpecYaml}, what it means, and its default. The values
 * come from {@link FeatureSpec#defaultsFor(int)}, the one place defaults live, so the template cannot drift from them; keys
 * unset by default are written commented out. Reading the template back gives the defaults (a test checks it).
 */
public final class FeatureSpecTemplate {
  /** A key's meaning; a key unset by default also says what happens when it is left out. */
  record Key(String name, String meaning) {}

  /** Every key, in the file's order, with its meaning (docs/configuration.md has the long form). */
  static final List<Key> KEYS = List.of(
      new Key("horizonDays", "periods ahead a forecast reaches (days in a daily store, weeks in a weekly one); >= 1"),
      new Key("strategy", "direct: one model reads only units known at the origin, so every lag and the rolling shift"
          + " must be >= horizonDays; recursive: predictions are fed back period by period, short lags allowed"),
      new Key("lagDays", "one column lag_<n> per lag: units n periods before the row's period; each >= 1"),
      new Key("rollingWindowDays", "rolling window lengths in periods; each >= 1 and at most the history's length"),
      new Key("rollingShiftDays", "periods between a row and the last period of its rolling windows; unset: follows"
          + " horizonDays"),
      new Key("rollingStats", "statistics of each window: mean, std (sample), min, max, zero_share"),
      new Key("calendarFeatures", "features of the date: day_of_week, day_of_month, month, week_of_year, day_of_year"),
      new Key("calendarColumns", "true: every column of the calendar file becomes a feature cal_<name>"),
      new Key("priceFeatures", "only with prices: price, price_to_mean, price_to_max, price_change_7, promo,"
          + " price_to_group"),
      new Key("priceGroupAttributes", "attributes whose shared values form the group of price_to_group; [] drops it;"
          + " unset: department and store when the series have both"),
      new Key("categoricalAttributes", "attributes whose codes become categorical columns attr_<name>; unset: every"
          + " attribute except series_id"),
      new Key("seriesFeatures", "features of the series' own history: days_since_first_sale, zero_run"),
      new Key("planColumns", "columns of the store's plan that become features plan_<name>; [] takes none; unset:"
          + " every column the plan has (training records the list in the model)"),
      new Key("fromDate", "first date of training rows (yyyy-mm-dd); unset: the start of the history"),
      new Key("untilDate", "last date of training rows (yyyy-mm-dd); unset: the end of the history"),
      new Key("skipPreLaunch", "true: a series' training rows start at its first sale plus the longest lag"));

  private FeatureSpecTemplate() {}

  /**
   * The template text for a store of this period: a header, then per key its meaning and the period's default
   * ({@link FeatureSpec#defaultsFor(int)}) as comments and the key itself.
   */
  public static String text(int periodDays) {
    Map<String, Object> defaults = FeatureSpecYaml.values(FeatureSpec.defaultsFor(periodDays));
    StringBuilder b = new StringBuilder();
    b.append("# lagmill feature spec for a store whose periods are ").append(Periods.count(periodDays, Periods.DAILY))
        .append(" long. Every key is optional; a key left out keeps\n")
        .append("# its default, shown here (with strategy: direct, left-out keys take the direct defaults instead).\n")
        .append(
            "# Use it with " + Setting.CONFIG + " FILE (train, backtest). docs/configuration.md explains each key.\n");
    for (Key key : KEYS) {
      b.append('\n');
      for (String line : wrap(key.meaning(), 116)) {
        b.append("# ").append(line).append('\n');
      }
      Object value = defaults.get(key.name());
      if (value == null) {
        b.append("# ").append(key.name()).append(":\n");
      } else {
        b.append(key.name()).append(": ").append(flow(value)).append('\n');
      }
    }
    return b.toString();
  }

  /** YAML flow form of a default: lists as {@code [a, b]}, everything else as its text. */
  private static String flow(Object value) {
    if (value instanceof List<?> list) {
      List<String> items = new ArrayList<>();
      list.forEach(item -> items.add(String.valueOf(item)));
      return "[" + String.join(", ", items) + "]";
    }
    return String.valueOf(value);
  }

  private static List<String> wrap(String text, int widthColumns) {
    List<String> lines = new ArrayList<>();
    StringBuilder line = new StringBuilder();
    for (String word : text.split(" ")) {
      if (line.length() > 0 && line.length() + 1 + word.length() > widthColumns) {
        lines.add(line.toString());
        line.setLength(0);
      }
      line.append(line.length() == 0 ? "" : " ").append(word);
    }
    lines.add(line.toString());
    return lines;
  }
}
