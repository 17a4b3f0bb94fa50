package org.lagmill.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.lagmill.features.FeatureSpec;
import org.lagmill.features.FeatureSpecYaml;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.learner.DatasetParameters;
import org.lagmill.learner.Objective;
import org.lagmill.learner.TrainParameters;
import org.lagmill.run.MemberPlans;
import org.lagmill.training.TrainingPlan;
import picocli.CommandLine.Option;

/** Options shared by every command that trains ({@code train}, {@code backtest}, {@code demo}). */
final class TrainingOptions {
  @Option(names = "--config", paramLabel = "FILE", description = "feature spec YAML (see docs/configuration.md)")
  Path config;

  @Option(names = "--horizon", converter = Counts.Positive.class,
      paramLabel = "PERIODS", description = "forecast horizon and validation window in "
          + "periods of the store: days, or weeks of a weekly store (default: the config's horizonDays; without "
          + "one, 28 days in a daily store, 8 periods in a weekly or longer one)")
  Integer horizonDays;

  @Option(names = "--lags", converter = Counts.Positive.class,
      split = ",", paramLabel = "PERIODS", description = "lags of units in periods, e.g. "
          + "1,2,3,7,14 (default: the config's; without one, see lagmill config --template)")
  int[] lagDays;

  @Option(names = "--windows", converter = Counts.Positive.class,
      split = ",", paramLabel = "PERIODS", description = "rolling windows in periods, "
          + "e.g. 7,28,56")
  int[] windowDays;

  @Option(names = "--rounds", converter = Counts.Positive.class,
      paramLabel = "N", defaultValue = "1000", description = "most boosting rounds "
          + "(default: ${DEFAULT-VALUE})")
  int rounds;

  @Option(names = "--early-stopping", converter = Counts.NonNegative.class,
      paramLabel = "N", defaultValue = "50",
      description = "stop after N rounds without validation gain; 0 disables (default: ${DEFAULT-VALUE})")
  int earlyStoppingRounds;

  @Option(names = "--objective", paramLabel = "NAME", defaultValue = "tweedie",
      description = "tweedie, poisson or l2 (default: ${DEFAULT-VALUE})")
  String objective;

  @Option(names = "--tweedie-power", paramLabel = "P", defaultValue = "1.1",
      description = "tweedie variance power in [1, 2) (default: ${DEFAULT-VALUE})")
  double tweediePower;

  @Option(names = "--learning-rate", paramLabel = "RATE", defaultValue = "0.05",
      description = "shrinkage per round (default: ${DEFAULT-VALUE})")
  double learningRate;

  @Option(names = "--leaves", converter = Counts.Positive.class,
      paramLabel = "N", defaultValue = "127", description = "leaves per tree "
          + "(default: ${DEFAULT-VALUE})")
  int leafCount;

  @Option(names = "--feature-fraction", paramLabel = "SHARE", defaultValue = "0.8",
      description = "share of features each tree may use (default: ${DEFAULT-VALUE})")
  double featureFraction;

  @Option(names = "--bagging-fraction", paramLabel = "SHARE", defaultValue = "0.8",
      description = "share of rows each tree is grown on; 1 disables bagging (default: ${DEFAULT-VALUE})")
  double baggingFraction;

  @Option(names = "--goss", description = "grow each tree on LightGBM's gradient-based one-side sample (every row "
      + "with a large gradient and a weighted share of the rest) instead of a bagged share of rows")
  boolean goss;

  @Option(names = "--threads", converter = Counts.Positive.class,
      paramLabel = "N", description = "threads (default: all processors)")
  Integer threadCount;

  @Option(names = "--seed", paramLabel = "N", defaultValue = "1", description = "random seed (default: "
      + "${DEFAULT-VALUE})")
  long seed;

  @Option(names = "--deterministic", description = "bit-identical models for the same inputs and thread count")
  boolean deterministic;

  @Option(names = "--refit", negatable = true, description = "after early stopping picks the rounds on the last "
      + "horizon of days, train again on every day and ship that model; --no-refit (the default, which backtests "
      + "found more accurate) ships the early-stopped model (see docs/learner.md)")
  Boolean refit;

  @Option(names = "--partition-by", paramLabel = "ATTRIBUTE",
      description = "train one model per value of this attribute (e.g. store), one after another")
  String partitionAttribute;

  @Option(names = "--weights", paramLabel = "KIND", defaultValue = "none",
      description = "row weights: none or sales-value (the error metric's weights) (default: ${DEFAULT-VALUE})")
  String weights;

  @Option(names = "--zero-rows-kept", paramLabel = "SHARE", defaultValue = "1",
      description = "share in (0, 1] of the training rows with zero sales to keep, each kept one weighted by its "
          + "inverse (a hash of series, day and --seed picks them; validation rows are never dropped); fewer rows make "
          + "each boosting round cheaper (default: ${DEFAULT-VALUE}, every row; see docs/learner.md)")
  double zeroRowsKept;

  @Option(names = "--sample-rows", converter = Counts.Positive.class,
      paramLabel = "N", defaultValue = "200000",
      description = "rows sampled to fix LightGBM's bin boundaries (default: ${DEFAULT-VALUE})")
  int sampleRowCount;

  /**
   * The feature spec for a store of this period: the config file (keys left out take the period's defaults) or the
   * period's defaults, with command-line overrides.
   */
  FeatureSpec featureSpec(int periodDays) throws IOException {
    FeatureSpec spec = config == null ? FeatureSpec.defaultsFor(periodDays) : FeatureSpecYaml.read(config, periodDays);
    FeatureSpec.Builder builder = spec.toBuilder();
    if (horizonDays != null) {
      builder.horizonDays(horizonDays);
    }
    if (lagDays != null) {
      builder.lagDays(lagDays);
    }
    if (windowDays != null) {
      builder.rollingWindowDays(windowDays);
    }
    return builder.build();
  }

  /**
   * The plans of a run for a store of this period: with no member, the spec of {@code --config} (or the period's
   * defaults) as one plain plan; with one, that spec file's as one plain plan; with several, one named member per
   * {@code SPEC[@ATTRIBUTE]} (the spec file's features, keys left out taking the period's defaults, partitioned by the
   * attribute when given). The other training options apply to every member.
   */
  List<MemberPlans.Member> members(List<String> memberArgs, int periodDays, int cutIndex) throws IOException {
    if (memberArgs.isEmpty()) {
      return List.of(new MemberPlans.Member(null, plan(featureSpec(periodDays), cutIndex)));
    }
    List<MemberPlans.Member> plans = new ArrayList<>();
    for (String member : memberArgs) {
      int at = member.lastIndexOf('@');
      FeatureSpec spec = FeatureSpecYaml.read(Path.of(at < 0 ? member : member.substring(0, at)), periodDays);
      TrainingPlan base = plan(spec, cutIndex);
      TrainingPlan plan = at < 0 ? base : new TrainingPlan(base.spec(), base.trainParameters(),
          base.datasetParameters(), base.cutDayIndex(), base.validationDays(), member.substring(at + 1),
          base.salesValueWeights(), base.refit(), base.zeroRowsKept());
      plans.add(new MemberPlans.Member(memberArgs.size() == 1 ? null : member, plan));
    }
    return plans;
  }

  TrainingPlan plan(FeatureSpec spec, int cutDayIndex) {
    int threads = threadCount == null ? Runtime.getRuntime().availableProcessors() : threadCount;
    TrainParameters train = TrainParameters.defaults().withObjective(objective(objective))
        .withTweedieVariancePower(tweediePower).withLearningRate(learningRate).withLeafCount(leafCount)
        .withFractions(featureFraction, baggingFraction)
        .withRounds(rounds, earlyStoppingRounds).withThreadCount(threads).withSeed(seed)
        .withDeterministic(deterministic).withGoss(goss);
    boolean salesValue = switch (weights.toLowerCase(Locale.ROOT)) {
      case "none" -> false;
      case "sales-value" -> true;
      default -> throw new InvalidRequestException("--weights must be none or sales-value, got '" + weights + "'");
    };
    DatasetParameters dataset = DatasetParameters.defaults().withSampleRowCount(sampleRowCount).withSeed(seed)
        .withDeterministic(deterministic).withUseWeights(salesValue).withThreadCount(threads);
    return new TrainingPlan(spec, train, dataset, cutDayIndex, spec.horizonDays(), partitionAttribute, salesValue,
        refit == null ? TrainingPlan.REFIT_BY_DEFAULT : refit, zeroRowsKept);
  }

  static Objective objective(String name) {
    return switch (name.toLowerCase(Locale.ROOT)) {
      case "tweedie" -> Objective.TWEEDIE;
      case "poisson" -> Objective.POISSON;
      case "l2", "regression" -> Objective.REGRESSION;
      default -> throw new InvalidRequestException("--objective must be tweedie, poisson or l2, got '" + name + "'");
    };
  }
}
