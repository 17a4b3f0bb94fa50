package org.lagmill.store;

/** {@link PriceTable} from plain arrays of change points per series (each sorted by day). */
public final class ArrayPriceTable implements PriceTable {
  private final int[][] changeDays;
  private final float[][] changePrices;

  public ArrayPriceTable(int[][] changeDays, float[][] changePrices) {
    this.changeDays = changeDays;
    this.changePrices = changePrices;
  }

  @Override
  public boolean isEmpty() { return false; }
  @Override
  public int changeCount(int seriesIndex) { return changeDays[seriesIndex].length; }
  @Override
  public int changeDayIndex(int seriesIndex, int changeIndex) { return changeDays[seriesIndex][changeIndex]; }
  @Override
  public float changePrice(int seriesIndex, int changeIndex) { return changePrices[seriesIndex][changeIndex]; }
}
