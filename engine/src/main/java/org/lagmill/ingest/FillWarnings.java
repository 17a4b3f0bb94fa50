package org.lagmill.ingest;

import java.util.List;
import java.util.Locale;
import org.lagmill.io.Setting;
import org.lagmill.store.StoreManifest;

/**
 * The one place that words what ingest and append say about filled and unknown item-days, so that a fill never
 * changes a result in silence.
 */
final class FillWarnings {
  /** Share of unknown item-days above which a store gets a warning (common practice, no source: a fifth). */
  static final double LARGE_UNKNOWN_SHARE = 0.20;

  private FillWarnings() {}

  /**
   * Adds a warning for item-days read as zero in this run and one when the store's unknown share is large.
   *
   * @param zeroFilledThisRun item-days with no row that this ingest or append read as zero
   */
  static void add(StoreManifest manifest, long zeroFilledThisRun, List<String> warnings) {
    if (zeroFilledThisRun > 0) {
      warnings.add(String.format(Locale.ROOT, "read %,d item-days with no row in the long sales as zero sales "
          + "(" + Setting.MISSING_ROWS + " zero, the default: till exports leave out days with no sale); give "
          + Setting.MISSING_ROWS + " "
          + "unknown if a missing row means not known", zeroFilledThisRun));
    }
    long itemDays = (long) manifest.seriesCount() * manifest.dayCount();
    long unknown = manifest.fill() == null ? 0 : manifest.fill().unknownItemDays();
    if (itemDays > 0 && unknown > LARGE_UNKNOWN_SHARE * itemDays) {
      warnings.add(String.format(Locale.ROOT, "%,d of %,d item-days (%.1f %%) are unknown and are left out of "
          + "training and scores; if they are days with no sale, give long sales with " + Setting.MISSING_ROWS
          + " zero (the "
          + "default) or write 0 in wide sales", unknown, itemDays, 100.0 * unknown / itemDays));
    }
  }
}
