package org.lagmill.store;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import java.io.IOException;
import java.nio.file.Path;
import org.lagmill.memory.MemoryBudget;

/**
 * Writes {@code prices.bin} ({@link PricesLayout}) from any {@link PriceTable}, keeping only the change points that
 * change something:
 * <ul>
 *   <li>change points before day 0: only the last of them is kept, moved to day 0, because it is the price in force
 *       when the sales start;
 *   <li>a change point whose price equals the price in force before it is dropped. A price file with one row per
 *       item-store-week repeats the same price week after week; each repeat would cost 8 bytes and change no day's
 *       price. The stored change points are therefore the days on which the price really changes,
 *   <li>except the series' last change point, kept even when it repeats the price: it records how far the price file
 *       reached, which the forecast's price coverage check reads (a price confirmed for the horizon is not stale).
 * </ul>
 * Dropping repeats changes no day's price. Price features that aggregate over change points (the series' mean price)
 * read these kept points, so a file of weekly rows and a file of change points give the same features, but for the
 * last point of a weekly file, which counts once more.
 */
final class PricesFileWriter {
  private PricesFileWriter() {}

  static ChecksummedFileWriter write(Path file, PriceTable prices, int seriesCount, MemoryBudget budget)
      throws IOException {
    int tableSeriesCount = prices.isEmpty() ? 0 : seriesCount;
    IntArrayList kept = new IntArrayList();
    long changeCount = 0;
    for (int s = 0; s < tableSeriesCount; s++) {
      changeCount += keptChanges(prices, s, kept).size();
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
        start += s < tableSeriesCount ? keptChanges(prices, s, kept).size() : 0;
      }
      out.putInt(start);
      for (int s = 0; s < tableSeriesCount; s++) {
        keptChanges(prices, s, kept);
        for (int i = 0; i < kept.size(); i++) {
          out.putInt(Math.max(0, prices.changeDayIndex(s, kept.getInt(i))));
        }
      }
      for (int s = 0; s < tableSeriesCount; s++) {
        keptChanges(prices, s, kept);
        for (int i = 0; i < kept.size(); i++) {
          out.putFloat(prices.changePrice(s, kept.getInt(i)));
        }
      }
      out.finish();
      return out;
    } finally {
      out.close();
    }
  }

  /**
   * Fills {@code kept} (cleared first) with the indexes of the series' change points to store: the last one on or
   * before day 0 (or the first, when all lie after day 0), then each later one whose price differs from the last kept,
   * and the series' last change point in any case.
   *
   * @return {@code kept}
   */
  static IntArrayList keptChanges(PriceTable prices, int seriesIndex, IntArrayList kept) {
    kept.clear();
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
    int lastPriceBits = 0;
    for (int k = first; k < changeCount; k++) {
      // Bit equality, so a price that differs in the last float bit is a change and one read back is never merged.
      int priceBits = Float.floatToIntBits(prices.changePrice(seriesIndex, k));
      if (kept.isEmpty() || priceBits != lastPriceBits || k == changeCount - 1) {
        kept.add(k);
        lastPriceBits = priceBits;
      }
    }
    return kept;
  }
}
