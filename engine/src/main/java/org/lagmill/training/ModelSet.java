package org.lagmill.training;

import java.util.List;
import org.lagmill.features.FeatureSpec;
import org.lagmill.learner.TrainedModel;

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
  public String partitionAttribute() {
    return partitionAttribute;
  }

  public List<Partition> partitions() { return partitions; }

  /** Negative binomial dispersion of each series' forecast errors, estimated on held-out days. */
  public float[] dispersionBySeries() {
    return dispersionBySeries;
  }

  @Override
  public void close() {
    for (Partition partition : partitions) {
      partition.model().close();
    }
  }
}
