package org.lagmill.learner;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeatureSchema;
import org.lagmill.features.RowStream;

/** A test-only RowStream over an in-heap row-major matrix. */
final class MatrixRowStream implements RowStream {
  private final FeatureSchema schema;
  private final float[][] rows;
  private final float[] labels;
  private final float[] weights;

  MatrixRowStream(FeatureSchema schema, float[][] rows, float[] labels, float[] weights) {
    this.schema = schema;
    this.rows = rows;
    this.labels = labels;
    this.weights = weights;
  }

  /**
   * Random rows: {@code categoricalCount} leading integer-coded columns (0..9), then numeric columns with about 5 %
   * NaN and 10 % exact zeros; the label is a Poisson-like count whose mean depends on a few columns.
   */
  static MatrixRowStream random(long seed, int rowCount, int numericCount, int categoricalCount) {
    SplittableRandom random = new SplittableRandom(seed);
    int featureCount = categoricalCount + numericCount;
    List<String> names = new ArrayList<>();
    List<Boolean> categorical = new ArrayList<>();
    for (int c = 0; c < featureCount; c++) {
      names.add((c < categoricalCount ? "code_" : "num_") + c);
      categorical.add(c < categoricalCount);
    }
    float[][] rows = new float[rowCount][featureCount];
    float[] labels = new float[rowCount];
    float[] weights = new float[rowCount];
    for (int r = 0; r < rowCount; r++) {
      for (int c = 0; c < featureCount; c++) {
        if (c < categoricalCount) {
          rows[r][c] = random.nextInt(10);
        } else {
          double u = random.nextDouble();
          rows[r][c] = u < 0.05 ? Float.NaN : u < 0.15 ? 0f : (float) (random.nextGaussian() * 3);
        }
      }
      double mean = 1.0;
      if (categoricalCount > 0) {
        mean += rows[r][0] % 3;
      }
      if (numericCount > 0 && !Float.isNaN(rows[r][categoricalCount])) {
        mean *= Math.exp(0.3 * Math.max(-3, Math.min(3, rows[r][categoricalCount])));
      }
      labels[r] = poisson(random, mean);
      weights[r] = 0.5f + random.nextInt(3);
    }
    return new MatrixRowStream(new FeatureSchema(names, categorical), rows, labels, weights);
  }

  private static int poisson(SplittableRandom random, double mean) {
    double limit = Math.exp(-mean);
    double product = random.nextDouble();
    int count = 0;
    while (product > limit) {
      product *= random.nextDouble();
      count++;
    }
    return count;
  }

  MatrixRowStream withLabels(float[] newLabels) {
    return new MatrixRowStream(schema, rows, newLabels, weights);
  }

  MatrixRowStream slice(int fromRow, int toRow) {
    return new MatrixRowStream(schema, Arrays.copyOfRange(rows, fromRow, toRow),
        Arrays.copyOfRange(labels, fromRow, toRow), Arrays.copyOfRange(weights, fromRow, toRow));
  }

  float[][] rows() {
    return rows;
  }

  float[] labels() {
    return labels;
  }

  @Override
  public FeatureSchema schema() {
    return schema;
  }

  @Override
  public long rowCount() {
    return rows.length;
  }

  @Override
  public void stream(FeatureBatch batch, BatchConsumer consumer) {
    batch.reset(0);
    for (int r = 0; r < rows.length; r++) {
      int row = batch.addRow(r, r, labels[r], weights[r]);
      for (int c = 0; c < rows[r].length; c++) {
        batch.set(row, c, rows[r][c]);
      }
      if (batch.isFull()) {
        consumer.accept(batch);
        batch.reset(r + 1);
      }
    }
    if (batch.rowCount() > 0) {
      consumer.accept(batch);
    }
  }
}
