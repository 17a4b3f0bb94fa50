package org.lagmill.bench;

import java.util.List;
import java.util.Locale;

/**
 * Formats the footprint harness's measurements as markdown tables: peak memory per route, bytes per training row above
 * the JVM baseline, their ratios, the dataframe practice's reference, then the stage times and the partitioned peak.
 */
final class FootprintTable {
  /** The dataframe practice's peak per item-day measured in FACTS.md (pandas pipeline to a float32 matrix). */
  static final double DATAFRAME_BYTES_PER_ITEM_DAY = 400;

  /** Measurements of one size; {@code matrix} is null when it was skipped, with {@code matrixNote} saying why. */
  record SizeResult(int seriesCount, int dayCount, ProbeResult stream, ProbeResult floor, ProbeResult matrix,
      String matrixNote, PartitionResult partition) {
    long itemDays() {
      return (long) seriesCount * dayCount;
    }
  }

  /** {@code lagmill train} without and with {@code --partition-by outlet} on the same store. */
  record PartitionResult(long unpartitionedPeakBytes, long partitionedPeakBytes, long allRowCount,
      long largestPartitionRowCount, int partitionCount) {}

  private FootprintTable() {}

  static String markdown(ProbeResult baseline, List<SizeResult> sizes) {
    long baselineBytes = baseline.peakAfterTrainingBytes();
    StringBuilder out = new StringBuilder();
    out.append(
        String.format(Locale.ROOT, "Baseline JVM with LightGBM loaded: %d MB peak RSS.%n%n", mib(baselineBytes)));
    out.append("| item-days | training rows | features | stream peak MB | floor peak MB | matrix peak MB "
        + "| stream B/row | floor B/row | matrix B/row | stream/floor | matrix/stream "
        + "| dataframe practice MB (400 B/item-day) | dataframe/stream |\n");
    out.append("|---|---|---|---|---|---|---|---|---|---|---|---|---|\n");
    for (SizeResult size : sizes) {
      ProbeResult stream = size.stream();
      long rows = stream.rowCount();
      double dataframeBytes = DATAFRAME_BYTES_PER_ITEM_DAY * size.itemDays();
      out.append(String.format(Locale.ROOT, "| %s (%d × %d) | %,d | %d | %,d | %,d | %s | %.1f | %.1f | %s | %.2f | %s "
          + "| %,d | %.1f× |%n", millions(size.itemDays()), size.seriesCount(), size.dayCount(), rows,
          stream.featureCount(), mib(peak(stream)), mib(peak(size.floor())),
          size.matrix() == null ? size.matrixNote() : String.format(Locale.ROOT, "%,d", mib(peak(size.matrix()))),
          bytesPerRow(stream, baselineBytes), bytesPerRow(size.floor(), baselineBytes),
          size.matrix() == null ? "–" : String.format(Locale.ROOT, "%.1f", bytesPerRow(size.matrix(), baselineBytes)),
          ratio(peak(stream), peak(size.floor())),
          size.matrix() == null ? "–" : String.format(Locale.ROOT, "%.2f", ratio(peak(size.matrix()), peak(stream))),
          mib((long) dataframeBytes), dataframeBytes / peak(stream)));
    }
    out.append('\n');
    out.append("| item-days | rows | sampling pass rows | feature pass s (sampling pass / push pass) "
        + "| feature pass rows/s (push pass) | our sample s | LightGBM Dataset s (stream) | push+binning rows/s "
        + "| feature pass (both passes) / LightGBM Dataset | LightGBM Dataset s (floor) "
        + "| train s (stream / floor / matrix) | matrix fill s | CreateFromMat s |\n");
    out.append("|---|---|---|---|---|---|---|---|---|---|---|---|---|\n");
    for (SizeResult size : sizes) {
      ProbeResult stream = size.stream();
      double samplePass = stream.samplePassSourceSeconds();
      double pushPass = stream.sourceSeconds() - samplePass;
      ProbeResult matrix = size.matrix();
      out.append(String.format(Locale.ROOT, "| %s | %,d | %,d | %.1f / %.1f | %,.0f | %.1f | %.1f | %,.0f | %.2f "
          + "| %.1f | %.1f / %.1f / %s | %s | %s |%n", millions(size.itemDays()), stream.rowCount(),
          stream.samplePassRowCount(), samplePass, pushPass, stream.rowCount() / pushPass, stream.sampleSeconds(),
          stream.datasetSeconds(), stream.rowCount() / stream.datasetSeconds(),
          stream.sourceSeconds() / stream.datasetSeconds(), size.floor().datasetSeconds(), stream.trainSeconds(),
          size.floor().trainSeconds(), matrix == null ? "–" : String.format(Locale.ROOT, "%.1f", matrix.trainSeconds()),
          matrix == null ? "–" : String.format(Locale.ROOT, "%.1f", matrix.sourceSeconds()),
          matrix == null ? "–" : String.format(Locale.ROOT, "%.1f", matrix.datasetSeconds())));
    }
    boolean anyPartition = sizes.stream().anyMatch(s -> s.partition() != null);
    if (anyPartition) {
      out.append('\n');
      out.append("| item-days | `lagmill train` peak MB | `--partition-by outlet` peak MB | partitions "
          + "| training rows (all) | training rows (largest partition) | partitioned / unpartitioned |\n");
      out.append("|---|---|---|---|---|---|---|\n");
      for (SizeResult size : sizes) {
        PartitionResult p = size.partition();
        if (p != null) {
          out.append(String.format(Locale.ROOT, "| %s | %,d | %,d | %d | %,d | %,d | %.2f |%n",
              millions(size.itemDays()), mib(p.unpartitionedPeakBytes()), mib(p.partitionedPeakBytes()),
              p.partitionCount(), p.allRowCount(), p.largestPartitionRowCount(),
              ratio(p.partitionedPeakBytes(), p.unpartitionedPeakBytes())));
        }
      }
    }
    return out.toString();
  }

  /** The process's peak as the probe itself read it at its end (VmHWM never decreases). */
  static long peak(ProbeResult result) {
    return result.peakAfterTrainingBytes();
  }

  /** (peak − baseline) / rows: what each training row costs above an idle JVM with LightGBM loaded. */
  static double bytesPerRow(ProbeResult result, long baselineBytes) {
    return (peak(result) - baselineBytes) / (double) result.rowCount();
  }

  static double ratio(long numerator, long denominator) {
    return numerator / (double) denominator;
  }

  static long mib(long bytes) {
    return bytes >> 20;
  }

  static String millions(long itemDays) {
    return itemDays % 1_000_000 == 0 ? itemDays / 1_000_000 + "M"
        : String.format(Locale.ROOT, "%.1fM", itemDays / 1e6);
  }
}
