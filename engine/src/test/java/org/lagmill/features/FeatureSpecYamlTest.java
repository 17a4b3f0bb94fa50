package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.features.FeatureSpec.RollingStat;
import org.lagmill.features.FeatureSpec.Strategy;

class FeatureSpecYamlTest {
  @Test
  void shouldReadEveryKey(@TempDir Path dir) throws IOException {
    Path file = dir.resolve("features.yaml");
    Files.writeString(file, String.join("\n",
        "horizonDays: 14",
        "strategy: recursive",
        "lagDays: [1, 7, 14]",
        "rollingWindowDays: [7, 28]",
        "rollingShiftDays: 1",
        "rollingStats: [mean, std, zero_share]",
        "calendarFeatures: [day_of_week, week_of_year]",
        "calendarColumns: false",
        "priceFeatures: [price, promo]",
        "priceGroupAttributes: [store]",
        "categoricalAttributes: [item, store]",
        "seriesFeatures: [zero_run]",
        "fromDate: 2023-01-02",
        "untilDate: 2024-06-30",
        "skipPreLaunch: false", ""));
    FeatureSpec spec = FeatureSpecYaml.read(file, 1);
    FeatureSpec expected = FeatureSpec.builder().horizonDays(14).strategy(Strategy.RECURSIVE).lagDays(1, 7, 14)
        .rollingWindowDays(7, 28).rollingShiftDays(1)
        .rollingStats(List.of(RollingStat.MEAN, RollingStat.STD, RollingStat.ZERO_SHARE))
        .calendarFeatures(List.of(FeatureSpec.CalendarFeature.DAY_OF_WEEK, FeatureSpec.CalendarFeature.WEEK_OF_YEAR))
        .calendarColumns(false).priceFeatures(List.of(FeatureSpec.PriceFeature.PRICE, FeatureSpec.PriceFeature.PROMO))
        .priceGroupAttributes(List.of("store")).categoricalAttributes(List.of("item", "store"))
        .seriesFeatures(List.of(FeatureSpec.SeriesFeature.ZERO_RUN)).fromDate(LocalDate.of(2023, 1, 2))
        .untilDate(LocalDate.of(2024, 6, 30)).skipPreLaunch(false).build();
    assertEquals(expected, spec);
  }

  @Test
  void shouldRoundTripAndGiveDefaultsForAnEmptyFile(@TempDir Path dir) throws IOException {
    Path file = dir.resolve("spec.yaml");
    FeatureSpec spec = FeatureSpec.defaults().withRollingStats(List.of(RollingStat.MAX, RollingStat.MEAN));
    FeatureSpecYaml.write(spec, file);
    assertEquals(spec, FeatureSpecYaml.read(file, 1));
    assertEquals(spec, FeatureSpecYaml.read(file, 7), "a written spec holds every key: the period adds nothing");
    assertEquals(FeatureSpec.defaultsFor(1), FeatureSpecYaml.parse("", "empty.yaml", 1));
    assertEquals(FeatureSpec.defaultsFor(7), FeatureSpecYaml.parse("", "empty.yaml", 7));
    assertEquals(FeatureSpec.defaultsFor(1), FeatureSpecYaml.parse("horizonDays: 28\n", "min.yaml", 1));
  }

  @Test
  void shouldFillLeftOutKeysFromThePeriodsDefaultsOfTheFilesStrategy() {
    assertEquals(FeatureSpec.defaultsFor(7, Strategy.DIRECT), FeatureSpecYaml.parse("strategy: direct\n", "d", 7));
    assertEquals(FeatureSpec.defaultsFor(1, Strategy.DIRECT), FeatureSpecYaml.parse("strategy: direct\n", "d", 1));
    FeatureSpec weekly = FeatureSpecYaml.parse("planColumns: [promo]\n", "plan.yaml", 7);
    assertEquals(FeatureSpec.defaultsFor(7).toBuilder().planColumns(List.of("promo")).build(), weekly);
    assertEquals(8, weekly.horizonDays());
  }

  @Test
  void shouldReadAStoredSpecWithTheBuildersValuesWhateverThePeriodDefaults() {
    // A model's manifest written before the period defaults existed leaves the rolling shift out when it follows
    // the horizon; reading it must not take today's recursive shift of 1.
    FeatureSpec stored = FeatureSpecYaml.parse("strategy: recursive\nlagDays: [1, 7]\n", "manifest.json");
    assertEquals(28, stored.rollingShiftDays());
    assertEquals(FeatureSpec.defaults(), FeatureSpecYaml.parse("", "manifest.json"));
  }

  @Test
  void shouldNameAnUnknownKey() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> FeatureSpecYaml.parse("horizonDays: 28\nlags: [28]\n", "features.yaml"));
    assertEquals("features.yaml line 2: unknown key 'lags'; allowed: horizonDays, strategy, lagDays,"
        + " rollingWindowDays, rollingShiftDays, rollingStats, calendarFeatures, calendarColumns, priceFeatures,"
        + " priceGroupAttributes, categoricalAttributes, seriesFeatures, planColumns, fromDate, untilDate, skipPreLaunch",
        e.getMessage());
  }

  @Test
  void shouldPrefixValidationErrorsWithTheFile() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> FeatureSpecYaml.parse("rollingStats: [mean, median]\n", "features.yaml"));
    assertEquals("features.yaml: unknown rolling statistic 'median'; allowed: mean, std, min, max, zero_share",
        e.getMessage());
    e = assertThrows(IllegalArgumentException.class,
        () -> FeatureSpecYaml.parse("fromDate: 2024/01/31\n", "features.yaml"));
    assertEquals("features.yaml: fromDate '2024/01/31' is not a date; write it as yyyy-mm-dd, e.g. 2024-01-31",
        e.getMessage());
  }

  @Test
  void shouldRefuseAFractionalLagInItsOwnWords() {
    assertYamlError("horizonDays: 14\nlagDays: [14, 28.5]\n",
        "features.yaml line 2: key 'lagDays': expected a list of whole numbers, e.g. [28, 35], found '28.5'");
    assertYamlError("horizonDays: 14.0\n",
        "features.yaml line 1: key 'horizonDays': expected a whole number, found '14.0'");
  }

  @Test
  void shouldRefuseADuplicateKey() {
    assertYamlError("horizonDays: 14\nstrategy: direct\nhorizonDays: 21\n",
        "features.yaml line 3: key 'horizonDays' appears twice: expected each key once");
  }

  @Test
  void shouldNameKeyExpectedTypeAndFoundValue() {
    assertYamlError("horizonDays: fourteen\n",
        "features.yaml line 1: key 'horizonDays': expected a whole number, found 'fourteen'");
    assertYamlError("lagDays: 14\n",
        "features.yaml line 1: key 'lagDays': expected a list of whole numbers, e.g. [28, 35], found '14'");
    assertYamlError("horizonDays: 99999999999\n",
        "features.yaml line 1: key 'horizonDays': expected a whole number, found '99999999999'");
    assertYamlError("calendarColumns: true\nskipPreLaunch: maybe\n",
        "features.yaml line 2: key 'skipPreLaunch': expected true or false, found 'maybe'");
    assertYamlError("horizonDays: [1, 2]\n",
        "features.yaml line 1: key 'horizonDays': expected a whole number, found a list");
    assertYamlError("- a\n- b\n",
        "features.yaml line 1: expected keys with values (key: value, one per line), found a list");
  }

  @Test
  void shouldRefuseAKeyWithoutAValueInsteadOfTakingTheDefault() {
    // an empty value would otherwise keep the default (28 days) without a word
    assertYamlError("horizonDays:\n", "features.yaml line 1: key 'horizonDays': expected a whole number, found an"
        + " empty value");
    assertYamlError("lagDays: 28\n".replace("28", "null"), "features.yaml line 1: key 'lagDays': expected a list of"
        + " whole numbers, e.g. [28, 35], found an empty value");
    assertYamlError("horizonDays: 7\nlagDays:\n", "features.yaml line 2: key 'lagDays': expected a list of whole"
        + " numbers, e.g. [28, 35], found an empty value");
    assertYamlError("horizonDays: 7\nstrategy: ~\n", "features.yaml line 2: key 'strategy': expected direct or"
        + " recursive, found an empty value");
  }

  @Test
  void shouldReportBrokenYamlWithoutTheLibrarysWords() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> FeatureSpecYaml.parse("strategy: direct\nhorizonDays: 14: 15\n", "features.yaml"));
    assertEquals("features.yaml line 2: not valid YAML (mapping values are not allowed here): expected one"
        + " 'key: value' per line", e.getMessage());
  }

  @Test
  void shouldQuoteAtMostAnExcerptOfALongValue() {
    assertYamlError("horizonDays: 14\n" + "x".repeat(500) + ": 1\n", "features.yaml line 2: unknown key '"
        + "x".repeat(60) + "… (500 characters)'; allowed: " + String.join(", ", FeatureSpecYaml.KEYS));
    assertYamlError("horizonDays: " + "9".repeat(5000) + "\n",
        "features.yaml: key 'horizonDays': expected a whole number");
  }

  private static void assertYamlError(String yaml, String expected) {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> FeatureSpecYaml.parse(yaml, "features.yaml"));
    assertEquals(expected, e.getMessage());
  }
}
