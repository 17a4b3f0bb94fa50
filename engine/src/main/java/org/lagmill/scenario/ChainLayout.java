package org.lagmill.scenario;

import java.io.IOException;
import java.nio.charset.StandardCharsets;

/**
 * The invented chain "Marrowgate &amp; Tillbox": outlets that each belong to one of two banners, have one of three
 * formats and lie in one of three school districts (three attributes that cross, none nested in another), and
 * articles with opaque codes grouped in families, each family in one section. Series are laid out article-major:
 * series {@code s} is article {@code s / outletCount()} in outlet {@code s % outletCount()}. Ids are written straight
 * to a writer, so no per-article string is ever held.
 *
 * <p>Outlet traits come from a fixed table whose first four rows already cross every pair of store attributes, so
 * even the smallest scenario has no accidental nesting among banner, format and district.
 */
final class ChainLayout {
  static final String CHAIN_NAME = "Marrowgate & Tillbox";
  static final String[] BANNER_NAMES = {"Marrowgate", "Tillbox"};
  static final String[] FORMAT_NAMES = {"superstore", "neighbourhood", "kiosk"};
  static final String[] DISTRICT_NAMES = {"Ferncombe", "Lowbridge", "Quarrytown"};
  static final int SUPERSTORE = 0;
  static final int KIOSK = 2;
  /** Outlet codes: a letter and a number that encodes nothing. */
  static final int[] OUTLET_NUMBER = {104, 117, 121, 138, 142, 156, 163, 179, 185, 190, 207, 212};
  static final int[] OUTLET_BANNER = {0, 1, 0, 1, 0, 1, 0, 1, 0, 1, 0, 1};
  static final int[] OUTLET_FORMAT = {0, 0, 2, 1, 1, 2, 0, 1, 2, 0, 1, 2};
  static final int[] OUTLET_DISTRICT = {0, 1, 1, 0, 2, 2, 1, 1, 0, 2, 0, 1};
  static final String[] SECTION_NAMES = {"Chilled", "Grocery", "Drinks", "Homecare", "Garden"};
  static final String[] FAMILY_NAMES = {"Dairy", "Cheese", "Meals", "Cereal", "Baking", "Snacks", "Tins", "Soda",
      "Juice", "Laundry", "Cleaning", "Paper", "Seeds", "Tools"};
  /** Section of each family: sections hold two to four families. */
  static final int[] FAMILY_SECTION = {0, 0, 0, 1, 1, 1, 1, 2, 2, 3, 3, 3, 4, 4};
  /** Relative share of articles per family. */
  static final int[] FAMILY_WEIGHT = {8, 5, 6, 7, 6, 10, 7, 8, 5, 6, 8, 5, 4, 5};
  static final int MIN_OUTLET_COUNT = 4;
  static final int MAX_OUTLET_COUNT = OUTLET_NUMBER.length;
  /** Series per outlet before another outlet opens; 3000 series and more get every outlet. */
  static final int SERIES_PER_OUTLET_STEP = 250;
  static final String SALES_HEADER_PREFIX = "series_id,article,family,section,outlet,banner,format,district";
  /** Cells before the first unit count in a sales row. */
  static final int SALES_KEY_CELLS = 8;
  /** Crockford's base-32 digits: no I, L, O or U, so codes read unambiguously. */
  private static final byte[] CODE_DIGITS = "0123456789ABCDEFGHJKMNPQRSTVWXYZ".getBytes(StandardCharsets.US_ASCII);
  static final int CODE_LENGTH = 5;
  static final long CODE_SPACE = 1L << (5 * CODE_LENGTH);
  private static final long CODE_MASK = CODE_SPACE - 1;

  private final int seriesCount;
  private final int outletCount;
  private final int articleCount;

  ChainLayout(int seriesCount) {
    this.seriesCount = seriesCount;
    int wanted = (int) ((seriesCount + (long) SERIES_PER_OUTLET_STEP - 1) / SERIES_PER_OUTLET_STEP);
    this.outletCount = Math.max(MIN_OUTLET_COUNT, Math.min(MAX_OUTLET_COUNT, wanted));
    this.articleCount = (int) ((seriesCount + (long) outletCount - 1) / outletCount);
    assert articleCount <= CODE_SPACE : articleCount;
  }

  int seriesCount() {
    return seriesCount;
  }

  int outletCount() {
    return outletCount;
  }

  int articleCount() {
    return articleCount;
  }

  int articleIndex(int seriesIndex) {
    return seriesIndex / outletCount;
  }

  int outletIndex(int seriesIndex) {
    return seriesIndex % outletCount;
  }

  /** Number of outlets that sell an article: all of them, except possibly for the last article. */
  int outletCountOf(int articleIndex) {
    return (int) Math.min(outletCount, seriesCount - (long) articleIndex * outletCount);
  }

  static int bannerIndex(int outletIndex) {
    return OUTLET_BANNER[outletIndex];
  }

  static int formatIndex(int outletIndex) {
    return OUTLET_FORMAT[outletIndex];
  }

  static int districtIndex(int outletIndex) {
    return OUTLET_DISTRICT[outletIndex];
  }

  /** Whether any of the first {@code outletCount} outlets lies in the district. */
  boolean hasDistrict(int districtIndex) {
    for (int outlet = 0; outlet < outletCount; outlet++) {
      if (OUTLET_DISTRICT[outlet] == districtIndex) {
        return true;
      }
    }
    return false;
  }

  /** Whether an article is sold in at least one outlet of the banner. */
  boolean sellsInBanner(int articleIndex, int bannerIndex) {
    int count = outletCountOf(articleIndex);
    for (int outlet = 0; outlet < count; outlet++) {
      if (OUTLET_BANNER[outlet] == bannerIndex) {
        return true;
      }
    }
    return false;
  }

  /**
   * The article code's number: a scramble of the index within 25 bits, so neighbouring articles get unrelated codes.
   * Each step (multiplying by an odd number, adding, xor with a right shift, all modulo 2^25) is a bijection, so
   * codes never collide.
   */
  static long articleCode(int articleIndex) {
    long x = (articleIndex * 0x1C69B3F5L + 0x0A5B1D3L) & CODE_MASK;
    x ^= x >>> 13;
    x = (x * 0x2E5BF271L) & CODE_MASK;
    x ^= x >>> 11;
    x = (x * 0x19E3779BL + 0x1234567L) & CODE_MASK;
    return x ^ (x >>> 12);
  }

  /** Writes an article code such as {@code 7QK2M}: five base-32 digits that carry no grouping. */
  static void writeArticleCode(AsciiWriter out, int articleIndex) throws IOException {
    long code = articleCode(articleIndex);
    for (int shift = 5 * (CODE_LENGTH - 1); shift >= 0; shift -= 5) {
      out.writeByte(CODE_DIGITS[(int) ((code >>> shift) & 31)]);
    }
  }

  /** Writes an outlet code such as {@code L138}. */
  static void writeOutletCode(AsciiWriter out, int outletIndex) throws IOException {
    out.writeByte('L');
    out.writeInt(OUTLET_NUMBER[outletIndex]);
  }

  /** Writes the leading cells of a sales row (series_id .. district), each followed by a comma. */
  void writeSeriesCells(AsciiWriter out, int seriesIndex, int familyIndex) throws IOException {
    int articleIndex = articleIndex(seriesIndex);
    int outletIndex = outletIndex(seriesIndex);
    writeArticleCode(out, articleIndex);
    out.writeByte('/');
    writeOutletCode(out, outletIndex);
    out.writeByte(',');
    writeArticleCode(out, articleIndex);
    out.writeByte(',');
    out.writeAscii(FAMILY_NAMES[familyIndex]);
    out.writeByte(',');
    out.writeAscii(SECTION_NAMES[FAMILY_SECTION[familyIndex]]);
    out.writeByte(',');
    writeOutletCode(out, outletIndex);
    out.writeByte(',');
    out.writeAscii(BANNER_NAMES[OUTLET_BANNER[outletIndex]]);
    out.writeByte(',');
    out.writeAscii(FORMAT_NAMES[OUTLET_FORMAT[outletIndex]]);
    out.writeByte(',');
    out.writeAscii(DISTRICT_NAMES[OUTLET_DISTRICT[outletIndex]]);
    out.writeByte(',');
  }
}
