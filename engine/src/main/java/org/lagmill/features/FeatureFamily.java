package org.lagmill.features;

import java.util.Locale;

/**
 * The groups a planner reads a forecast's drivers in, and the one mapping from a feature column's name to its group
 * and to a label in plain words. The names are the ones the kernels write ({@code lag_28},
 * {@code roll_mean_28_shift_28}, {@code day_of_week}, {@code cal_<column>}, {@code price_to_max},
 * {@code plan_<column>}, {@code days_since_first_sale}, {@code attr_<attribute>}, …); a name no rule knows goes to
 * {@link #OTHER}, so nothing is dropped from a sum.
 */
public enum FeatureFamily {
  RECENT_LEVEL("recent level"),
  WEEKLY_PATTERN("weekly pattern"),
  SEASON("season"),
  EVENTS(
      "events and holidays"),
  PRICE(
      "price"),
  PLAN("plan"),
  LAUNCH("launch"),
  SERIES("item and location"),
  OTHER("other");

  private final String label;

  FeatureFamily(String label) {
    this.label = label;
  }

  /** The family's name as a planner reads it, e.g. "events and holidays". */
  public String label() {
    return label;
  }

  /** The family of a feature column, by the name its kernel gave it. */
  public static FeatureFamily of(String featureName) {
    if (featureName.startsWith("lag_") || featureName.startsWith("roll_") || featureName.startsWith("zero_run")) {
      return RECENT_LEVEL;
    }
    if (featureName.equals("day_of_week")) {
      return WEEKLY_PATTERN;
    }
    if (featureName.equals("day_of_month") || featureName.equals("month") || featureName.equals("week_of_year")
        || featureName.equals("day_of_year")) {
      return SEASON;
    }
    if (featureName.startsWith("cal_")) {
      return EVENTS;
    }
    if (featureName.equals("price") || featureName.startsWith("price_") || featureName.equals("promo")) {
      return PRICE;
    }
    if (featureName.startsWith("plan_")) {
      return PLAN;
    }
    if (featureName.equals("days_since_first_sale")) {
      return LAUNCH;
    }
    if (featureName.startsWith("attr_")) {
      return SERIES;
    }
    return OTHER;
  }

  /**
   * The feature in plain words, e.g. {@code roll_mean_28_shift_28} → "mean units over 28 days, ending 28 days
   * before"; the technical name itself when no rule knows it.
   *
   * @param periodUnit the store's period in the plural, "days" or "weeks", since lags and windows count periods
   */
  public static String label(String featureName, String periodUnit) {
    String[] parts = featureName.split("_");
    if (featureName.matches("lag_\\d+")) {
      return "units " + parts[1] + " " + periodUnit + " before";
    }
    if (featureName.matches("roll_[a-z_]+_\\d+_shift_\\d+")) {
      int shift = featureName.lastIndexOf("_shift_");
      String head = featureName.substring("roll_".length(), shift);
      String window = head.substring(head.lastIndexOf('_') + 1);
      String stat = head.substring(0, head.lastIndexOf('_'));
      String what = switch (stat) {
        case "mean" -> "mean units";
        case "std" -> "variation (standard deviation) of units";
        case "min" -> "lowest units";
        case "max" -> "highest units";
        case "zero_share" -> "share of periods without sales";
        default -> stat + " of units";
      };
      return what + " over " + window + " " + periodUnit + ", ending " + featureName.substring(shift + 7) + " "
          + periodUnit + " before";
    }
    if (featureName.matches("zero_run_shift_\\d+")) {
      return "periods in a row without sales, up to " + parts[3] + " " + periodUnit + " before";
    }
    return switch (featureName) {
      case "day_of_week" -> "weekday";
      case "day_of_month" -> "day of the month";
      case "month" -> "month of the year";
      case "week_of_year" -> "week of the year";
      case "day_of_year" -> "day of the year";
      case "price" -> "shelf price";
      case "price_to_mean" -> "price against the item's usual price";
      case "price_to_max" -> "price against the regular price";
      case "price_change_7" -> "price change over 7 days";
      case "promo" -> "price cut (below the regular price)";
      case "price_to_group" -> "price against similar items";
      case "days_since_first_sale" -> "time since the first sale";
      default -> prefixed(featureName);
    };
  }

  private static String prefixed(String featureName) {
    if (featureName.startsWith("cal_")) {
      return "calendar: " + words(featureName.substring(4));
    }
    if (featureName.startsWith("plan_")) {
      return "plan: " + words(featureName.substring(5));
    }
    if (featureName.startsWith("attr_")) {
      return "which " + words(featureName.substring(5));
    }
    return featureName;
  }

  private static String words(String name) {
    return name.replace('_', ' ').toLowerCase(Locale.ROOT);
  }
}
