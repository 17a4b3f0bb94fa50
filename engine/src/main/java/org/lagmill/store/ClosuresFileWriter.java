package org.lagmill.store;

import java.io.IOException;
import java.nio.file.Path;
import org.lagmill.memory.MemoryBudget;

/** Writes {@code closures.bin} ({@link ClosuresLayout}) from any {@link ClosureTable}. */
final class ClosuresFileWriter {
  private ClosuresFileWriter() {}

  static ChecksummedFileWriter write(Path file, ClosureTable closures, int seriesCount, MemoryBudget budget)
      throws IOException {
    int tableSeriesCount = closures.isEmpty() ? 0 : seriesCount;
    long rangeCount = 0;
    for (int s = 0; s < tableSeriesCount; s++) {
      rangeCount += closures.rangeCount(s);
    }
    if (rangeCount > Integer.MAX_VALUE / Integer.BYTES) {
      throw new IllegalArgumentException("too many closed ranges: " + rangeCount + ", at most "
          + Integer.MAX_VALUE / Integer.BYTES);
    }
    ChecksummedFileWriter out = new ChecksummedFileWriter(file, FileKind.CLOSURES, budget);
    try {
      out.putInt(seriesCount);
      out.putInt((int) rangeCount);
      int start = 0;
      for (int s = 0; s < seriesCount; s++) {
        out.putInt(start);
        start += s < tableSeriesCount ? closures.rangeCount(s) : 0;
      }
      out.putInt(start);
      for (int s = 0; s < tableSeriesCount; s++) {
        for (int k = 0; k < closures.rangeCount(s); k++) {
          out.putInt(closures.firstDayIndex(s, k));
        }
      }
      for (int s = 0; s < tableSeriesCount; s++) {
        for (int k = 0; k < closures.rangeCount(s); k++) {
          out.putInt(closures.lastDayIndex(s, k));
        }
      }
      out.finish();
      return out;
    } finally {
      out.close();
    }
  }
}
