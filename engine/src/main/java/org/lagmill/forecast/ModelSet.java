package org.lagmill.forecast;

import java.util.List;
import org.lagmill.features.FeatureSpec;
import org.lagmill.learner.TrainedModel;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SalesHistory;

/**
 * The trained models of a run, one per partition of the series, with what forecasting needs besides them: the
 * feature spec, which partition each series belongs to, and each series' forecast dispersion (for intervals).
 *
 * <p>Owns the native boosters; close it.
 */
public final class ModelSet implements AutoCloseable {
  private final FeatureSpec spec;
  private final String partitionAttribute;
  private final List<Partition> partitions;
  private final float[] dispersionBySeries;

  /** One model and the series it forecasts. */
  public record Partition(String value, int[] seriesIndexes, TrainedModel model, PartitionReport report) {}

  ModelSet(FeatureSpec spec, String partitionAttribute, List<Partition> partitions, float[] dispersionBySeries) {
    this.spec = spec;
    this.partitionAttribute = partitionAttribute;
    this.partitions = List.copyOf(partitions);
    this.dispersionBySeries = dispersionBySeries;
  }

  public FeatureSpec spec() { return spec; }

  /** The attribute the series are partitioned by, or null for a single model. */
  public String partitionAttribute() { return partitionAttribute; }

  public List<Partition> partitions() { return partitions; }

  /** Negative binomial dispersion of each series' forecast errors, estimated on held-out days. */
  public float[] dispersionBySeries() { return dispersionBySeries; }

  /**
   * Point forecasts of the {@code horizonDays} days after the history's last day for every series, each series by its
   * partition's model.
   *
   * @return {@code [seriesIndex][dayOffset]} non-negative expected units
   */
  public double[][] forecast(SalesHistory history, int horizonDays, MemoryBudget budget) {
    return forecast(history, horizonDays, budget, null);
  }

  /**
   * As {@link #forecast(SalesHistory, int, MemoryBudget)}, for the chosen series only; the rows of the others hold
   * NaN (which the forecast file writer leaves out).
   *
   * @param chosenSeries ascending series indexes, or null for every series
   */
  public double[][] forecast(SalesHistory history, int horizonDays, MemoryBudget budget, int[] chosenSeries) {
    double[][] out = new double[history.seriesCount()][horizonDays];
    java.util.BitSet chosen = null;
    if (chosenSeries != null) {
      chosen = new java.util.BitSet(history.seriesCount());
      for (int s : chosenSeries) {
        chosen.set(s);
      }
      for (int s = 0; s < out.length; s++) {
        if (!chosen.get(s)) {
          java.util.Arrays.fill(out[s], Double.NaN);
        }
      }
    }
    for (Partition partition : partitions) {
      int[] series = partition.seriesIndexes();
      if (chosen != null) {
        series = java.util.Arrays.stream(series).filter(chosen::get).toArray();
      }
      if (series.length > 0) {
        Forecaster.forecast(history, spec, partition.model()::predict, series, horizonDays, budget, out);
      }
    }
    return out;
  }

  /**
   * Quantile forecasts around point forecasts from each series' count distribution.
   *
   * @return {@code [quantileIndex][seriesIndex][dayOffset]}
   */
  public double[][][] quantiles(double[][] pointForecasts, double[] probabilities) {
    double[][][] out = new double[probabilities.length][pointForecasts.length][];
    for (int q = 0; q < probabilities.length; q++) {
      for (int s = 0; s < pointForecasts.length; s++) {
        double[] row = new double[pointForecasts[s].length];
        for (int d = 0; d < row.length; d++) {
          row[d] = CountQuantiles.quantile(pointForecasts[s][d], dispersionBySeries[s], probabilities[q]);
        }
        out[q][s] = row;
      }
    }
    return out;
  }

  @Override
  public void close() {
    for (Partition partition : partitions) {
      partition.model().close();
    }
  }
}
