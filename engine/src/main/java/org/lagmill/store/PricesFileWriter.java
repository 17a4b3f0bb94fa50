package org.lagmill.store;

import java.io.IOException;
import java.nio.file.Path;
import org.lagmill.memory.MemoryBudget;

/**
 * Writes {@code prices.bin} ({@link PricesLayout}) from any {@link PriceTable}. Change points before day 0 are clamped:
 * only the last of them is kept, moved to day 0, because it is the price in force when the sales start.
 */
final class PricesFileWriter {
  private PricesFileWriter() {}

  static ChecksummedFileWriter write(Path file, PriceTable prices, int seriesCount, MemoryBudget budget)
      throws IOException {
    int tableSeriesCount = prices.isEmpty() ? 0 : seriesCount;
    long changeCount = 0;
    for (int s = 0; s < tableSeriesCount; s++) {
      changeCount += keptChangeCount(prices, s);
    }
    if (changeCount > Integer.MAX_VALUE / Integer.BYTES) {
      throw new IllegalArgumentException("too many price changes: " + changeCount + ", at most "
          + Integer.MAX_VALUE / Integer.BYTES);
    }
    ChecksummedFileWriter out = new ChecksummedFileWriter(file, FileKind.PRICES, budget);
    try {
      out.putInt(seriesCount);
      out.putInt((int) changeCount);
      int start = 0;
      for (int s = 0; s < seriesCount; s++) {
        out.putInt(start);
        start += s < tableSeriesCount ? keptChangeCount(prices, s) : 0;
      }
      out.putInt(start);
      for (int s = 0; s < tableSeriesCount; s++) {
        int first = firstKeptChange(prices, s);
        for (int k = first; k < prices.changeCount(s); k++) {
          out.putInt(k == first ? Math.max(0, prices.changeDayIndex(s, k)) : prices.changeDayIndex(s, k));
        }
      }
      for (int s = 0; s < tableSeriesCount; s++) {
        for (int k = firstKeptChange(prices, s); k < prices.changeCount(s); k++) {
          out.putFloat(prices.changePrice(s, k));
        }
      }
      out.finish();
      return out;
    } finally {
      out.close();
    }
  }

  /** Index of the first change kept: the last one on or before day 0, or 0 when all lie after day 0. */
  private static int firstKeptChange(PriceTable prices, int seriesIndex) {
    int changeCount = prices.changeCount(seriesIndex);
    int first = 0;
    for (int k = 0; k < changeCount; k++) {
      int day = prices.changeDayIndex(seriesIndex, k);
      if (k > 0 && day <= prices.changeDayIndex(seriesIndex, k - 1)) {
        throw new IllegalArgumentException("price changes of series " + seriesIndex + " must have increasing days, "
            + "got day " + day + " after day " + prices.changeDayIndex(seriesIndex, k - 1) + " at change " + k);
      }
      if (day <= 0) {
        first = k;
      }
    }
    return first;
  }

  private static int keptChangeCount(PriceTable prices, int seriesIndex) {
    int changeCount = prices.changeCount(seriesIndex);
    return changeCount == 0 ? 0 : changeCount - firstKeptChange(prices, seriesIndex);
  }
}
