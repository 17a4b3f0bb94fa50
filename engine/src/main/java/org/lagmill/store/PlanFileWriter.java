package org.lagmill.store;

import java.io.IOException;
import java.nio.file.Path;
import org.lagmill.memory.MemoryBudget;

/** Writes {@code plan.bin} ({@link PlanLayout}) from any {@link PlanTable}. */
final class PlanFileWriter {
  private PlanFileWriter() {}

  static ChecksummedFileWriter write(Path file, PlanTable plan, int seriesCount, MemoryBudget budget)
      throws IOException {
    int keyCount = plan.keyCount();
    int columnCount = plan.columnCount();
    long changeCount = 0;
    for (int k = 0; k < keyCount; k++) {
      changeCount += plan.changeCount(k);
    }
    if (changeCount * Math.max(1, columnCount) > Integer.MAX_VALUE / Float.BYTES) {
      throw new IllegalArgumentException("too many plan values: " + changeCount + " change points × " + columnCount
          + " columns, at most " + Integer.MAX_VALUE / Float.BYTES + " values");
    }
    ChecksummedFileWriter out = new ChecksummedFileWriter(file, FileKind.PLAN, budget);
    try {
      out.putInt(seriesCount);
      out.putInt(columnCount);
      out.putInt(plan.keyAttributeNames().size());
      out.putInt(keyCount);
      out.putInt((int) changeCount);
      out.putInt(plan.reachDayIndex());
      for (String name : plan.keyAttributeNames()) {
        out.putString(name);
      }
      for (int c = 0; c < columnCount; c++) {
        out.putString(plan.columnName(c));
      }
      out.padTo(Integer.BYTES);
      for (int s = 0; s < seriesCount; s++) {
        out.putInt(plan.keyOf(s));
      }
      int start = 0;
      for (int k = 0; k < keyCount; k++) {
        out.putInt(start);
        start += plan.changeCount(k);
      }
      out.putInt(start);
      for (int k = 0; k < keyCount; k++) {
        for (int i = 0, n = plan.changeCount(k); i < n; i++) {
          out.putInt(plan.changeDayIndex(k, i));
        }
      }
      for (int k = 0; k < keyCount; k++) {
        for (int i = 0, n = plan.changeCount(k); i < n; i++) {
          for (int c = 0; c < columnCount; c++) {
            out.putFloat(plan.changeValue(k, i, c));
          }
        }
      }
      out.finish();
      return out;
    } finally {
      out.close();
    }
  }
}
