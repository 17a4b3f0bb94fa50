package org.lagmill.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** Hand-checked formatting of numbers, bytes, durations and escaped text. */
class ReportFormatTest {

  @Test
  void shouldFormatNumbersCompactly() {
    assertEquals("0", ReportFormat.compact(0));
    assertEquals("0", ReportFormat.compact(-0.0));
    assertEquals("0.25", ReportFormat.compact(0.25));
    assertEquals("0.001", ReportFormat.compact(0.001));
    assertEquals("1.5", ReportFormat.compact(1.5));
    assertEquals("12.5", ReportFormat.compact(12.5));
    assertEquals("1234", ReportFormat.compact(1234));
    assertEquals("12.3k", ReportFormat.compact(12_345));
    assertEquals("185.2k", ReportFormat.compact(185_239.4));
    assertEquals("1.5M", ReportFormat.compact(1_500_000));
    assertEquals("-2M", ReportFormat.compact(-2_000_000));
    assertEquals("3G", ReportFormat.compact(3e9));
    assertEquals("1.0e-04", ReportFormat.compact(1e-4));
    assertEquals("\u2013", ReportFormat.compact(Double.NaN));
  }

  @Test
  void shouldFormatScoresCountsAndShares() {
    assertEquals("0.842", ReportFormat.score(0.8424));
    assertEquals("0.843", ReportFormat.score(0.8425000001));
    assertEquals("\u2013", ReportFormat.score(null));
    assertEquals("\u2013", ReportFormat.score(Double.NaN));
    assertEquals("\u221e", ReportFormat.score(Double.POSITIVE_INFINITY));
    assertEquals("2,630,400", ReportFormat.count(2_630_400L));
    assertEquals("58.3%", ReportFormat.percent(0.583));
  }

  @Test
  void shouldFormatBytesInBinaryUnits() {
    assertEquals("512 B", ReportFormat.bytes(512L));
    assertEquals("1.5 KiB", ReportFormat.bytes(1536L));
    assertEquals("310.0 MiB", ReportFormat.bytes(310L << 20));
    assertEquals("2.0 GiB", ReportFormat.bytes(2L << 30));
    assertEquals("\u2013", ReportFormat.bytes(null));
  }

  @Test
  void shouldFormatDurations() {
    assertEquals("0.84 s", ReportFormat.seconds(0.84));
    assertEquals("12.3 s", ReportFormat.seconds(12.34));
    assertEquals("4 min 05 s", ReportFormat.seconds(245));
    assertEquals("1 h 02 min", ReportFormat.seconds(3725));
  }

  @Test
  void shouldEscapeMarkupAndDropCharactersXmlForbids() {
    assertEquals("&lt;b&gt; &amp; &quot;x&quot; &#39;y&#39;", ReportFormat.escape("<b> & \"x\" 'y'"));
    assertEquals("a\uFFFDb\tc", ReportFormat.escape("a\u0001b\tc"));
    assertEquals("", ReportFormat.escape(null));
  }
}
