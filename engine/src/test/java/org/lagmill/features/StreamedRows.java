package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.lagmill.memory.MemoryBudget;

/** Every row of one stream copied out of the batches, with checks of batch bookkeeping on the way. */
final class StreamedRows {
  record Row(long rowIndex, int seriesIndex, int dayIndex, float label, float weight, float[] values) {}

  final List<Row> rows = new ArrayList<>();
  int batchCount;

  static StreamedRows of(RowStream stream, int capacityRows) {
    StreamedRows out = new StreamedRows();
    try (MemoryBudget budget = MemoryBudget.unlimited("test");
        FeatureBatch batch = new FeatureBatch(budget, capacityRows, stream.schema().featureCount())) {
      stream.stream(batch, b -> {
        assertEquals(out.rows.size(), b.firstRowIndex(), "batch firstRowIndex");
        assertTrue(b.rowCount() > 0, "empty batch handed on");
        out.batchCount++;
        for (int r = 0; r < b.rowCount(); r++) {
          float[] values = new float[b.featureCount()];
          for (int f = 0; f < values.length; f++) {
            values[f] = b.get(r, f);
          }
          out.rows.add(new Row(b.firstRowIndex() + r, b.seriesIndexes()[r], b.dayIndexes()[r], b.labels()[r],
              b.weights()[r], values));
        }
      });
    }
    return out;
  }
}
