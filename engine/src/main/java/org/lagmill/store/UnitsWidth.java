package org.lagmill.store;

/**
 * Byte width of one series' daily units column, chosen once from the series' largest value. The all-ones value of each
 * width is the sentinel for an unknown day: 255 and 65535 for the unsigned byte and short widths (which therefore hold
 * one value fewer than their range) and -1 for the signed int width, which no units value can take.
 */
public enum UnitsWidth {
  BYTE(1, 0xFF),
  SHORT(2, 0xFFFF),
  INT(4, -1);

  /** Largest units value a BYTE column holds; 255 is its unknown-day sentinel. */
  public static final int BYTE_MAX_UNITS = 254;
  /** Largest units value a SHORT column holds; 65535 is its unknown-day sentinel. */
  public static final int SHORT_MAX_UNITS = 65_534;
  /**
   * Largest units value an INT column holds, the bound the sales readers enforce. Integer.MAX_VALUE is not a
   * sentinel (the INT sentinel is the all-ones int, -1); the bound stays one below it like the other widths' bounds.
   */
  public static final int INT_MAX_UNITS = Integer.MAX_VALUE - 1;

  private final int bytesPerValue;
  private final int sentinel;

  UnitsWidth(int bytesPerValue, int sentinel) {
    this.bytesPerValue = bytesPerValue;
    this.sentinel = sentinel;
  }

  /** Bytes one day of units takes in this width. */
  public int bytesPerValue() {
    return bytesPerValue;
  }

  /** The stored (unsigned, then widened to int) value that marks an unknown day. */
  int sentinel() {
    return sentinel;
  }

  /** The narrowest width that holds every value in {@code 0 .. maxUnits} besides its sentinel. */
  public static UnitsWidth forMaxValue(int maxUnits) {
    if (maxUnits < 0 || maxUnits > INT_MAX_UNITS) {
      throw new IllegalArgumentException("maxUnits must be in [0, " + INT_MAX_UNITS + "], got " + maxUnits
          + "; daily units are non-negative and fit a signed int, whose all-ones value (-1) marks an unknown day");
    }
    if (maxUnits <= BYTE_MAX_UNITS) {
      return BYTE;
    }
    return maxUnits <= SHORT_MAX_UNITS ? SHORT : INT;
  }

  /** The width whose {@link #bytesPerValue()} is {@code bytesPerValue}, as stored in the series table. */
  static UnitsWidth ofBytesPerValue(int bytesPerValue) {
    switch (bytesPerValue) {
      case 1 :
        return BYTE;
      case 2 :
        return SHORT;
      case 4 :
        return INT;
      default :
        return null;
    }
  }

  /** Bytes a column of {@code dayCount} values takes in this width. */
  public long bytesRequired(int dayCount) {
    return (long) dayCount * bytesPerValue;
  }
}
