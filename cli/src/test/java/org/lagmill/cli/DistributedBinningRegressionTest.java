package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.HashSet;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Two ranks on loopback train on data that crashed LightGBM 4.3.0's distributed learner before lagmill shared the
 * settings of {@code learner.DistributedBinning} over every rank: each case failed without them (a SIGSEGV, heap
 * corruption or ranks ending with different models) and must now end with one model on both ranks. The smallest
 * sizes found that fail: 1,200 series over 120 days and 48 series over 100 days; 3 rounds keep each under 15 s here.
 */
class DistributedBinningRegressionTest {
  private static final Pattern SHA = Pattern.compile("model SHA-256 ([0-9a-f]{64})");
  private static final Pattern LIMIT = Pattern.compile("categorical splits may hold up to (\\d+) categories");

  @TempDir
  static Path dir;

  /**
   * 100 articles in 12 outlets: the article feature gets over 100 bins, so a split may hold 32 categories, more than
   * the 28 LightGBM 4.3.0's split exchange has room for; the ranks then split on garbage bins.
   */
  @Test
  void shouldTrainOneModelWhenACategoricalFeatureHasMoreBinsThanTheSplitExchangeFits() {
    String out = trainTwoRanks("wide", 1200, 120);
    Matcher limit = LIMIT.matcher(out);
    assertTrue(limit.find(), out);
    assertTrue(Integer.parseInt(limit.group(1)) > 32, out);
  }

  /**
   * 16 training days with no public holiday: the holiday column is missing in every sampled row, and the rank that
   * bins it crashed copying its empty category table to the other rank.
   */
  @Test
  void shouldTrainOneModelWhenACategoricalColumnHoldsNoCategoryInTheSample() {
    String out = trainTwoRanks("short", 48, 100);
    assertTrue(out.contains("1 categorical feature(s) binned as numbers on every rank because some rank's bin "
        + "sample holds no category for them [cal_holiday]"), out);
  }

  private static String trainTwoRanks(String name, int series, int days) {
    Path store = GeneratedScenario.generateAndIngest(dir.resolve(name + "-data"), dir.resolve(name + "-store"), series,
        days, 42, false);
    MainRun.of("shard", "--store", store.toString(), "--parts", "2", "--by", "article", "--out",
        dir.resolve(name + "-shards").toString()).expectOk();
    MainRun cluster = MainRun.of("cluster-local", "--workers", "2", "--", "train", "--store",
        dir.resolve(name + "-shards").toString() + "/shard-{rank}", "--model", dir.resolve(name + "-model")
            .toString(),
        // Lags 28 to 56 pin the launch skip at 56 days, so 100 days leave the 16 training days the second case needs.
        "--lags", "28,35,42,49,56", "--rounds", "3", "--early-stopping", "0", "--threads", "1", "--rank-timeout",
        "120");
    assertEquals(0, cluster.exitCode(), cluster.out() + cluster.err());
    Set<String> checksums = new HashSet<>();
    int ranks = 0;
    for (String line : cluster.out().split("\n")) {
      Matcher sha = SHA.matcher(line);
      if (sha.find()) {
        checksums.add(sha.group(1));
        ranks++;
      }
    }
    assertEquals(2, ranks, cluster.out());
    assertEquals(1, checksums.size(), "both ranks must hold the same model: " + cluster.out());
    return cluster.out();
  }
}
