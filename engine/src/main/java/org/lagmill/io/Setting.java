package org.lagmill.io;

import java.util.Locale;
import java.util.Objects;
import java.util.function.Function;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A setting the user chooses, named in engine messages by what it is, not by how a front end spells it. The engine
 * says which setting a message is about ({@code Setting.ORIGINS + " must be >= 1"}); a front end shows each mention in
 * its own words with {@link #render} (the command line as its flag, {@code --origins}). Without rendering a mention
 * reads {@code ‹origins›}.
 */
public enum Setting {
  ORIGINS("origins"),
  STEP("step"),
  HORIZON("horizon"),
  MISSING_ROWS("missing-rows"),
  SALES_FORMAT("sales-format"),
  SERIES_ID_COLUMN("series-id-column"),
  DATE_COLUMN("date-column"),
  UNITS_COLUMN("units-column"),
  PRICES_FROM_COLUMN("prices-from-column"),
  PRICES_PRICE_COLUMN("prices-price-column"),
  CALENDAR_DATE_COLUMN("calendar-date-column"),
  CLOSURES_FROM_COLUMN("closures-from-column"),
  CLOSURES_UNTIL_COLUMN("closures-until-column"),
  PLAN_DATE_COLUMN("plan-date-column"),
  PLAN_FROM_COLUMN("plan-from-column"),
  SALES("sales"),
  CALENDAR("calendar"),
  PRICES("prices"),
  CLOSURES("closures"),
  PLAN("plan"),
  SHOWN_SERIES("show"),
  CHOSEN_SERIES("series"),
  SERIES_CONDITION("where"),
  HIERARCHY("hierarchy"),
  LEVELS("level"),
  SHARD("shard"),
  SCORING_PART("scoring-part"),
  SHARD_ATTRIBUTE("by"),
  SHARD_COUNT("parts"),
  NO_WAIT("no-wait"),
  MEMORY_LIMIT("memory-limit"),
  PERIOD("period"),
  DATE_WINDOW("date-window"),
  MODEL("model"),
  PARTITION_BY("partition-by"),
  MACHINES("machines"),
  RANK("rank"),
  RANK_TIMEOUT("rank-timeout"),
  TREE_LEARNER("tree-learner"),
  SCENARIO_SERIES("series"),
  SCENARIO_DAYS("days"),
  SCENARIO_FUTURE_DAYS("future-days"),
  SCENARIO_START("start"),
  SCENARIO_PERIOD("period"),
  STORE("store"),
  REPORT("report"),
  BACKTEST_REPORT("backtest"),
  UNTIL("until"),
  MATCH("match"),
  PLAN_CARRY_FORWARD("plan-carry-forward"),
  CONFIG("config"),
  MEMBER("member"),
  FROM_BACKTEST("from-backtest"),
  PRICES_KEY_COLUMN("prices-key-column"),
  PLAN_KEY_COLUMN("plan-key-column"),
  CLOSURES_KEY_COLUMN("closures-key-column"),
  ZERO_ROWS_KEPT("zero-rows-kept"),
  REFIT("refit"),
  CONTINUE_FROM("continue-from"),
  CONTINUE_ORIGINS("continue-origins"),
  SAVE_LAST_MODEL("save-last-model");

  /**
   * A task a front end offers, named in engine hints ({@code Command.APPEND + " " + Setting.PLAN + " FILE"}); the
   * command line shows it as its subcommand ({@code lagmill append --plan FILE}). Without rendering a mention reads
   * {@code ‹append command›}.
   */
  public enum Command {
    SERIES,
    APPEND,
    BACKTEST,
    EVALUATE,
    FORECAST,
    DEMO,
    SHARD;

    /** The neutral name: the constant in lower case, words joined by '-', e.g. {@code append}. */
    public String key() {
      return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /** The mention that engine messages carry, e.g. {@code ‹append command›}. */
    @Override
    public String toString() {
      return "\u2039" + key() + " command\u203a";
    }
  }

  private static volatile Function<String, String> shownAs = Function.identity();

  private static final Pattern MENTION = Pattern.compile("\u2039([a-z-]+)( command)?\u203a");

  private final String key;

  Setting(String key) {
    this.key = key;
  }

  /** The neutral name, e.g. {@code missing-rows}. */
  public String key() {
    return key;
  }

  /** The mention that engine messages carry: the key between single angle quotes, e.g. {@code ‹origins›}. */
  @Override
  public String toString() {
    return "\u2039" + key + "\u203a";
  }

  /**
   * The text with every mention replaced by {@code names} of its setting or {@code commands} of its command; a mention
   * of an unknown key is left as it is. Settings that share a key (the generator's series count and a series choice)
   * are told apart by the command, so a front end names them alike.
   */
  public static String render(String text, Function<Setting, String> names, Function<Command, String> commands) {
    if (text == null || text.indexOf('\u2039') < 0) {
      return text;
    }
    Matcher m = MENTION.matcher(text);
    StringBuilder out = new StringBuilder();
    while (m.find()) {
      String shown;
      if (m.group(2) != null) {
        Command command = byKey(Command.values(), Command::key, m.group(1));
        shown = command == null ? m.group() : commands.apply(command);
      } else {
        Setting setting = byKey(values(), Setting::key, m.group(1));
        shown = setting == null ? m.group() : names.apply(setting);
      }
      m.appendReplacement(out, Matcher.quoteReplacement(shown));
    }
    m.appendTail(out);
    return out.toString();
  }

  /**
   * Sets how text the engine writes for people into files (the report page, the run record's lines) shows
   * mentions: a front end sets its own names once at start; until then mentions stay as they are.
   */
  public static void showMentionsAs(Function<Setting, String> names, Function<Command, String> commands) {
    Objects.requireNonNull(names, "names");
    Objects.requireNonNull(commands, "commands");
    shownAs = text -> render(text, names, commands);
  }

  /** {@code text} with its mentions as the front end shows them ({@link #showMentionsAs}). */
  public static String shown(String text) {
    return shownAs.apply(text);
  }

  private static <E> E byKey(E[] values, Function<E, String> keyOf, String key) {
    for (E value : values) {
      if (keyOf.apply(value).equals(key)) {
        return value;
      }
    }
    return null;
  }
}
