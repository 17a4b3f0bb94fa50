package org.lagmill.report;

import java.util.Locale;

/**
 * Compact, locale-independent number and text formatting shared by the tables and the charts. Missing values (null,
 * NaN) print as an en dash so a table cell never reads "NaN". Stateless and thread-safe.
 */
public final class ReportFormat {
  /** What a missing value prints as. */
  public static final String MISSING = "\u2013";

  private ReportFormat() {}

  /** {@code value} with exactly {@code decimals} decimals ("0.842"), or {@link #MISSING}. */
  public static String fixed(Double value, int decimals) {
    if (value == null || !Double.isFinite(value)) {
      return value != null && Double.isInfinite(value) ? (value > 0 ? "\u221e" : "\u2212\u221e") : MISSING;
    }
    return String.format(Locale.ROOT, "%." + decimals + "f", value);
  }

  /** A scaled error (RMSSE, WRMSSE, ratio) with three decimals. */
  public static String score(Double value) {
    return fixed(value, 3);
  }

  /** A whole count with thousands separators ("30,490"), or {@link #MISSING}. */
  public static String count(Long value) {
    return value == null ? MISSING : String.format(Locale.ROOT, "%,d", value);
  }

  /** A share in [0, 1] as a percentage with one decimal ("61.2%"), or {@link #MISSING}. */
  public static String percent(Double share) {
    return share == null || !Double.isFinite(share) ? MISSING : String.format(Locale.ROOT, "%.1f%%", share * 100);
  }

  /**
   * A number in at most about four significant characters for axis ticks and bar labels: "0", "0.25", "12.5",
   * "1.2k", "3.4M", "5G". Trailing zeros are dropped.
   */
  public static String compact(double value) {
    if (!Double.isFinite(value)) {
      return MISSING;
    }
    double abs = Math.abs(value);
    if (abs >= 1e9) {
      return trim(value / 1e9, 1) + "G";
    }
    if (abs >= 1e6) {
      return trim(value / 1e6, 1) + "M";
    }
    if (abs >= 1e4) {
      return trim(value / 1e3, 1) + "k";
    }
    if (abs >= 100 || abs == 0) {
      return trim(value, 0);
    }
    if (abs >= 1) {
      return trim(value, 2);
    }
    if (abs >= 0.001) {
      return trim(value, 3);
    }
    return String.format(Locale.ROOT, "%.1e", value);
  }

  /** Bytes in binary units ("512 B", "1.5 KiB", "3.2 MiB", "1.1 GiB"), or {@link #MISSING}. */
  public static String bytes(Long byteCount) {
    if (byteCount == null) {
      return MISSING;
    }
    double v = byteCount;
    String[] units = {"B", "KiB", "MiB", "GiB", "TiB"};
    int unitIndex = 0;
    while (Math.abs(v) >= 1024 && unitIndex < units.length - 1) {
      v /= 1024;
      unitIndex++;
    }
    return unitIndex == 0 ? byteCount + " B" : String.format(Locale.ROOT, "%.1f %s", v, units[unitIndex]);
  }

  /** A duration in seconds ("0.84 s", "12.3 s", "4 min 05 s", "1 h 02 min"). */
  public static String seconds(double seconds) {
    if (!Double.isFinite(seconds)) {
      return MISSING;
    }
    if (seconds < 10) {
      return String.format(Locale.ROOT, "%.2f s", seconds);
    }
    if (seconds < 60) {
      return String.format(Locale.ROOT, "%.1f s", seconds);
    }
    long whole = Math.round(seconds);
    if (whole < 3600) {
      return String.format(Locale.ROOT, "%d min %02d s", whole / 60, whole % 60);
    }
    return String.format(Locale.ROOT, "%d h %02d min", whole / 3600, (whole % 3600) / 60);
  }

  private static String trim(double value, int decimals) {
    String s = String.format(Locale.ROOT, "%." + decimals + "f", value);
    if (s.indexOf('.') >= 0) {
      s = s.replaceAll("0+$", "");
      if (s.endsWith(".")) {
        s = s.substring(0, s.length() - 1);
      }
    }
    return s.equals("-0") ? "0" : s;
  }

  /**
   * Escapes text for HTML and XML element content and attribute values. Characters XML forbids (most control
   * characters) become U+FFFD so the document always stays well-formed.
   */
  public static String escape(String text) {
    if (text == null) {
      return "";
    }
    StringBuilder b = new StringBuilder(text.length() + 16);
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      switch (c) {
        case '&' -> b.append("&amp;");
        case '<' -> b.append("&lt;");
        case '>' -> b.append("&gt;");
        case '"' -> b.append("&quot;");
        case '\'' -> b.append("&#39;");
        default -> {
          boolean allowed = c >= 0x20 ? c != 0xFFFE && c != 0xFFFF : c == '\t' || c == '\n' || c == '\r';
          b.append(allowed ? c : '\uFFFD');
        }
      }
    }
    return b.toString();
  }
}
