package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.lagmill.TestSeeds;
import org.lagmill.io.InvalidRequestException;

/**
 * Zero-row sampling in the feature pass: the kept rows and their weights against a slow reference, fraction 1 as
 * today's rows, only label-0 rows dropped, and the weighted count of kept zero rows as an estimate of the true count.
 */
class ZeroRowSamplingTest {
  private static final long MASTER_SEED = TestSeeds.master(20261202L);
  private static final double[] FRACTIONS = {1.0, 0.73, 0.5, 0.25, 0.1};

  /**
   * The slow reference decision: the JDK's own SplittableRandom (SplitMix64, Steele, Lea and Flood, OOPSLA 2014),
   * seeded with the row's packed position mixed with the seed's first output, and its first double compared with the
   * fraction. One new generator per row: obvious, not fast.
   */
  private static boolean referenceKeeps(int seriesIndex, int dayIndex, long seed, double fraction) {
    long seedMix = new SplittableRandom(seed).nextLong();
    long position = ((long) seriesIndex << 32) | (dayIndex & 0xffff_ffffL);
    return new SplittableRandom(position ^ seedMix).nextDouble() < fraction;
  }

  @Test
  void shouldDecideAsTheLibraryGeneratorDoesForAnyPosition() {
    Random random = new Random(MASTER_SEED);
    for (int i = 0; i < 20_000; i++) {
      long seed = random.nextLong();
      double fraction = 0.001 + 0.998 * random.nextDouble();
      int series = random.nextInt(Integer.MAX_VALUE);
      int day = random.nextInt(1_000_000);
      assertEquals(referenceKeeps(series, day, seed, fraction), ZeroRowSampling.of(fraction, seed)
          .keepsZeroRow(series, day),
          "series " + series + ", day " + day + ", seed " + seed + ", fraction "
              + fraction + ", master seed " + MASTER_SEED);
    }
  }

  @Test
  void shouldKeepTheReferenceRowsWithInverseWeightsOnRandomStores() {
    for (int round = 0; round < 6; round++) {
      long seed = MASTER_SEED + round;
      RandomStore store = new RandomStore(seed, 45, 160, 0, round % 2 == 0);
      float[] seriesWeights = null;
      if (round % 3 == 1) {
        Random random = new Random(seed);
        seriesWeights = new float[store.history.seriesCount()];
        for (int s = 0; s < seriesWeights.length; s++) {
          seriesWeights[s] = 0.05f + random.nextInt(300) / 37f;
        }
      }
      FeaturePass plain = FeaturePass.training(store.history, FeatureSpec.defaults(), null, 0, 159);
      if (seriesWeights != null) {
        plain = plain.withSeriesWeights(seriesWeights);
      }
      StreamedRows all = StreamedRows.of(plain, 97);
      for (double fraction : FRACTIONS) {
        long samplingSeed = seed * 31 + (long) (fraction * 1000);
        FeaturePass sampled = FeaturePass.training(store.history, FeatureSpec.defaults(), null, 0, 159,
            ZeroRowSampling.of(fraction, samplingSeed));
        if (seriesWeights != null) {
          sampled = sampled.withSeriesWeights(seriesWeights);
        }
        String where = "round " + round + ", fraction " + fraction + ", master seed " + MASTER_SEED;
        List<StreamedRows.Row> expected = new ArrayList<>();
        long zeroRows = 0;
        for (StreamedRows.Row row : all.rows) {
          if (row.label() != 0) {
            expected.add(row);
            continue;
          }
          zeroRows++;
          if (referenceKeeps(row.seriesIndex(), row.dayIndex(), samplingSeed, fraction)) {
            expected.add(row);
          }
        }
        StreamedRows kept = StreamedRows.of(sampled, 61);
        assertEquals(expected.size(), kept.rows.size(), where);
        assertEquals(expected.size(), sampled.rowCount(), "rowCount known before streaming, " + where);
        assertEquals(zeroRows, sampled.zeroRowCount(), where);
        assertEquals(all.rows.size() - expected.size(), sampled.droppedZeroRowCount(), where);
        for (int i = 0; i < expected.size(); i++) {
          StreamedRows.Row want = expected.get(i);
          StreamedRows.Row got = kept.rows.get(i);
          String at = "row " + i + ", " + where;
          assertEquals(want.seriesIndex(), got.seriesIndex(), at);
          assertEquals(want.dayIndex(), got.dayIndex(), at);
          assertEquals(want.label(), got.label(), at);
          float seriesWeight = seriesWeights == null ? 1f : seriesWeights[want.seriesIndex()];
          float expectedWeight = want.label() == 0 ? seriesWeight * (float) (1 / fraction) : seriesWeight;
          assertEquals(expectedWeight, got.weight(), at);
          assertArrayEquals(want.values(), got.values(), "features of a kept row are those of the full pass, " + at);
        }
      }
    }
  }

  @Test
  void shouldGiveExactlyTodaysRowsAtFractionOne() {
    RandomStore store = new RandomStore(MASTER_SEED, 30, 140, 0, true);
    FeaturePass plain = FeaturePass.training(store.history, FeatureSpec.defaults(), null, 0, 139);
    FeaturePass one = FeaturePass.training(store.history, FeatureSpec.defaults(), null, 0, 139,
        ZeroRowSampling.of(1.0, 12345));
    assertSame(ZeroRowSampling.KEEP_ALL, one.zeroSampling());
    assertEquals(1f, one.zeroSampling().zeroRowWeight());
    StreamedRows want = StreamedRows.of(plain, 50);
    StreamedRows got = StreamedRows.of(one, 50);
    assertEquals(want.rows.size(), got.rows.size());
    assertEquals(0, one.droppedZeroRowCount());
    assertTrue(one.zeroRowCount() > 0, "the random store has zero-sales days");
    for (int i = 0; i < want.rows.size(); i++) {
      StreamedRows.Row a = want.rows.get(i);
      StreamedRows.Row b = got.rows.get(i);
      assertEquals(a.seriesIndex(), b.seriesIndex());
      assertEquals(a.dayIndex(), b.dayIndex());
      assertEquals(Float.floatToRawIntBits(a.label()), Float.floatToRawIntBits(b.label()));
      assertEquals(Float.floatToRawIntBits(a.weight()), Float.floatToRawIntBits(b.weight()));
      assertArrayEquals(a.values(), b.values());
    }
  }

  @Test
  void shouldDropOnlyRowsWithZeroSales() {
    RandomStore store = new RandomStore(MASTER_SEED + 7, 40, 150, 0, false);
    FeaturePass plain = FeaturePass.training(store.history, FeatureSpec.defaults(), null, 0, 149);
    FeaturePass sampled = FeaturePass.training(store.history, FeatureSpec.defaults(), null, 0, 149,
        ZeroRowSampling.of(0.2, 3));
    java.util.Set<Long> keptRows = new java.util.HashSet<>();
    for (StreamedRows.Row row : StreamedRows.of(sampled, 128).rows) {
      keptRows.add(((long) row.seriesIndex() << 32) | row.dayIndex());
    }
    long selling = 0;
    for (StreamedRows.Row row : StreamedRows.of(plain, 128).rows) {
      if (row.label() > 0) {
        selling++;
        assertTrue(keptRows.contains(((long) row.seriesIndex() << 32) | row.dayIndex()), "a row with sales on"
            + " series " + row.seriesIndex() + " day " + row.dayIndex() + " was dropped, master seed " + MASTER_SEED);
      }
    }
    assertEquals(plain.rowCount() - sampled.droppedZeroRowCount(), sampled.rowCount());
    assertTrue(sampled.droppedZeroRowCount() > 0 && selling > 0);
  }

  /**
   * External check: the Horvitz-Thompson estimator (Horvitz and Thompson, 1952, J. Amer. Statist. Assoc. 47:663-685).
   * Each of the N zero rows is kept independently with inclusion probability p and counted with weight 1 / p, so the
   * weighted count of kept zero rows is the HT estimate of N (y_i = 1 for every zero row). Its textbook variance
   * Σ (1 - π_i) / π_i · y_i² (joint inclusion π_ij = π_i π_j under independent draws, so the cross terms vanish)
   * is N (1 - p) / p: a binomial count k ~ Bin(N, p) scaled by 1 / p. The check allows 6 standard deviations: a fair
   * Bernoulli(p) draw falls outside with probability at most 1/36 by Chebyshev's inequality and about 2e-9 by the
   * normal approximation, while a sampler biased by a few percent of p falls outside at these N.
   */
  @Test
  void shouldEstimateTheTrueZeroCountWithinTheHorvitzThompsonBound() {
    RandomStore store = new RandomStore(MASTER_SEED + 11, 300, 365, 0, false);
    for (double fraction : new double[] {0.5, 0.25, 0.1, 0.03}) {
      FeaturePass sampled = FeaturePass.training(store.history, FeatureSpec.defaults(), null, 0, 364,
          ZeroRowSampling.of(fraction, MASTER_SEED));
      long trueZeroCount = sampled.zeroRowCount();
      double weightedKept = 0;
      long keptZeroRows = 0;
      for (StreamedRows.Row row : StreamedRows.of(sampled, 4096).rows) {
        if (row.label() == 0) {
          weightedKept += row.weight();
          keptZeroRows++;
        }
      }
      assertEquals(trueZeroCount - sampled.droppedZeroRowCount(), keptZeroRows);
      double standardDeviation = Math.sqrt(trueZeroCount * (1 - fraction) / fraction);
      String where = "fraction " + fraction + ": " + trueZeroCount + " zero rows, weighted count of kept "
          + weightedKept + ", bound ±" + 6 * standardDeviation + ", master seed " + MASTER_SEED;
      assertTrue(trueZeroCount > 10_000, where);
      assertTrue(Math.abs(weightedKept - trueZeroCount) <= 6 * standardDeviation, where);
    }
  }

  @Test
  void shouldRefuseSharesOutsideZeroToOne() {
    for (double bad : new double[] {0, -0.5, 1.5, Double.NaN, Double.POSITIVE_INFINITY, -0.0}) {
      InvalidRequestException e = assertThrows(InvalidRequestException.class, () -> ZeroRowSampling.of(bad, 1));
      assertEquals("‹zero-rows-kept› must be a share in (0, 1] of the training rows with zero sales to keep, got "
          + bad + " (1 keeps them all; 0.25 keeps about one in four and weighs each kept one 4)", e.getMessage());
    }
  }
}
