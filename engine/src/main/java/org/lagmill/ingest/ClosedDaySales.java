package org.lagmill.ingest;

import java.util.List;
import java.util.Locale;
import org.lagmill.store.ClosureTable;
import org.lagmill.store.Periods;
import org.lagmill.store.SalesStore;

/**
 * Sales on days the closures declare closed. A closed day reads as unknown everywhere (no training row, no score), so
 * units above 0 on such a day are set aside; they usually mean a closures file that is wrong (a store that did open)
 * or a till export dated to the wrong day, and the user hears how many.
 */
final class ClosedDaySales {
  private ClosedDaySales() {}

  /** Item-days inside a closure whose stored units are above 0; reads only the closed ranges. */
  static long count(SalesStore store) {
    ClosureTable closures = store.closures();
    if (closures.isEmpty()) {
      return 0;
    }
    int[] units = new int[0];
    long count = 0;
    for (int s = 0; s < store.seriesCount(); s++) {
      for (int k = 0; k < closures.rangeCount(s); k++) {
        int first = Math.max(0, closures.firstDayIndex(s, k));
        int last = Math.min(store.dayCount() - 1, closures.lastDayIndex(s, k));
        if (last < first) {
          continue;
        }
        int length = last - first + 1;
        if (units.length < length) {
          units = new int[length];
        }
        store.readStoredUnits(s, first, units, 0, length);
        for (int d = 0; d < length; d++) {
          // An unknown day is stored as a negative sentinel, so only real sales pass.
          if (units[d] > 0) {
            count++;
          }
        }
      }
    }
    return count;
  }

  /** Adds the warning for {@link #count} of {@code store} when it is above 0, in the store's periods. */
  static void warn(SalesStore store, List<String> warnings) {
    long count = count(store);
    if (count > 0) {
      String unit = Periods.unit(store.periodDays());
      warnings.add(String.format(Locale.ROOT, "%,d item-%ss with sales above 0 fall on %ss the closures declare "
          + "closed: they count as closed (not trained on, not scored, forecast 0); check the closures file if "
          + "those stores did open", count, unit, unit));
    }
  }
}
