package org.lagmill.features;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.store.AttributeNesting;
import org.lagmill.store.Periods;
import org.lagmill.store.SalesHistory;
import org.lagmill.store.SeriesAttributes;
import org.lagmill.store.SeriesIdentity;

/**
 * Streams feature rows of a {@link SalesHistory} under a {@link FeatureSpec}: series by series in the order of the
 * selection, each series' rows by ascending day. Each series' units (and prices) are read once into buffers sized once
 * per pass, then every feature family ({@link FeatureKernel}) fills its columns with running state, so nothing is
 * allocated per row or per series.
 *
 * <p>Two row selections:
 * <ul>
 *   <li>{@link #training}: every series, days of a window, label = units; rows whose units are unknown are skipped,
 *       and with {@link FeatureSpec#skipPreLaunch()} a series' rows start at its first sale plus the longest lag; a
 *       {@link ZeroRowSampling} may keep only a hashed share of the rows with label 0, weighting each kept one up;
 *   <li>{@link #prediction}: chosen series, a run of target days that may pass the end of the history; the label is the
 *       units when known and NaN otherwise, and no row is skipped.
 * </ul>
 * Features read units only from days before the history's {@link SalesHistory#dayCount()}; a recursive forecast
 * passes a history view whose {@code dayCount()} grows by one forecast day per step (the forecast package's
 * {@code ForecastScratch}), so earlier forecasts become readable without copying the history.
 *
 * <p>{@link #rowCount()} is exact and known at construction; streaming again yields the same rows in the same order.
 * Not thread-safe: one {@link #stream} at a time.
 */
public final class FeaturePass implements RowStream {
  /**
   * Rows the kernels fill on the heap before one bulk copy into the batch's native matrix: small enough that the strip
   * stays in the core's cache (256 rows × 29 features ≈ 30 KB), large enough that the per-chunk kernel calls cost
   * nothing per row.
   */
  static final int STRIP_ROWS = 256;

  private final SalesHistory history;
  private final FeatureSpec spec;
  private final boolean training;
  private final int[] seriesIndexes;
  private final int firstDayIndex;
  private final int lastDayIndex;
  private final float[] weightBySeries;
  private final ZeroRowSampling zeroSampling;
  private final List<FeatureKernel> kernelList = new ArrayList<>();
  private final FeatureKernel[] kernels;
  private final int[] firstFeatureIndexes;
  private final FeatureSchema schema;
  private final boolean withPrices;
  private final SeriesContext context;
  private final int[] rowDays;
  private final float[] rowLabels;
  /** Row-major heap staging of up to {@link #STRIP_ROWS} rows, copied into the batch in bulk. */
  private final float[] strip;
  /** Rows of each listed series, by position in {@link #seriesIndexes}: what {@link #sampleSource} chooses by. */
  private final int[] rowCountBySeries;
  /** Label-0 rows of each listed series before sampling, and those the {@link #zeroSampling} dropped. */
  private final int[] zeroRowCountBySeries;
  private final int[] droppedZeroRowCountBySeries;
  private final long rowCount;
  private final long zeroRowCount;
  private final long droppedZeroRowCount;
  /** Set by {@link #selectRows} for the series it last selected: its label-0 rows, and those dropped. */
  private int selectedZeroRowCount;
  private int selectedDroppedRowCount;
  private final long tableHeapBytes;

  private FeaturePass(SalesHistory history, FeatureSpec spec, boolean training, int[] seriesIndexes, int firstDayIndex,
      int lastDayIndex, float[] weightBySeries, ZeroRowSampling zeroSampling) {
    this.history = history;
    this.spec = spec;
    this.training = training;
    this.seriesIndexes = seriesIndexes;
    this.firstDayIndex = firstDayIndex;
    this.lastDayIndex = lastDayIndex;
    this.weightBySeries = weightBySeries;
    this.zeroSampling = zeroSampling;
    int dayCount = history.dayCount();
    for (int window : spec.rollingWindowDays()) {
      if (window > dayCount) {
        throw new InvalidRequestException("rolling window " + window + " days is longer than the history of "
            + dayCount + " days; use windows of at most " + dayCount + " days");
      }
    }
    SeriesAttributes attributes = history.attributes();
    int endDayIndex = Math.max(firstDayIndex, lastDayIndex + 1);
    this.withPrices = !history.prices().isEmpty() && !spec.priceFeatures().isEmpty();
    LagKernel lags = new LagKernel(spec.lagDays());
    addKernel(lags);
    RollingKernel rolling = new RollingKernel(spec.rollingWindowDays(), spec.rollingShiftDays(), spec.rollingStats());
    addKernel(rolling);
    CalendarKernel calendar = new CalendarKernel(history, spec.calendarFeatures(), spec.calendarColumns(),
        firstDayIndex, endDayIndex);
    addKernel(calendar);
    long tables = calendar.heapBytes();
    if (withPrices) {
      PriceKernel price = new PriceKernel(history, spec.priceFeatures(), priceGroupAttributes(spec, attributes,
          history.nesting()), firstDayIndex, endDayIndex);
      addKernel(price);
      tables += price.heapBytes();
    }
    PlanKernel plan = new PlanKernel(history.plan(), spec.planColumns());
    addKernel(plan);
    tables += plan.heapBytes();
    SeriesKernel series = new SeriesKernel(attributes, categoricalAttributes(spec, attributes), spec.seriesFeatures(),
        spec.shortestShiftDays());
    addKernel(series);
    this.kernels = kernelList.toArray(new FeatureKernel[0]);
    List<String> names = new ArrayList<>();
    List<Boolean> categorical = new ArrayList<>();
    firstFeatureIndexes = new int[kernels.length];
    for (int k = 0; k < kernels.length; k++) {
      firstFeatureIndexes[k] = names.size();
      kernels[k].describe(names, categorical);
    }
    if (names.isEmpty()) {
      throw new InvalidRequestException("the feature spec selects no feature for this history; enable lags, rolling"
          + " windows, calendar, price, plan or series features");
    }
    this.schema = new FeatureSchema(names, categorical);
    int lookbackDays = Math.max(lags.lookbackDays(), Math.max(rolling.lookbackDays(), series.lookbackDays()));
    this.context = new SeriesContext(dayCount, withPrices ? endDayIndex : 0, attributes.attributeCount(),
        endDayIndex, lookbackDays);
    this.rowDays = new int[Math.max(0, endDayIndex - firstDayIndex)];
    this.rowLabels = new float[rowDays.length];
    this.strip = new float[STRIP_ROWS * names.size()];
    tables += rolling.allocate(context.readableUnits.length);
    this.tableHeapBytes = tables;
    this.rowCountBySeries = new int[seriesIndexes.length];
    this.zeroRowCountBySeries = new int[seriesIndexes.length];
    this.droppedZeroRowCountBySeries = new int[seriesIndexes.length];
    for (int i = 0; i < seriesIndexes.length; i++) {
      rowCountBySeries[i] = selectRows(seriesIndexes[i]);
      zeroRowCountBySeries[i] = selectedZeroRowCount;
      droppedZeroRowCountBySeries[i] = selectedDroppedRowCount;
    }
    this.rowCount = sum(rowCountBySeries);
    this.zeroRowCount = sum(zeroRowCountBySeries);
    this.droppedZeroRowCount = sum(droppedZeroRowCountBySeries);
  }

  private static long sum(int[] counts) {
    long total = 0;
    for (int count : counts) {
      total += count;
    }
    return total;
  }

  /**
   * The same pass over a subset of its series: shares the kernels, their tables (calendar, group mean prices) and
   * the scratch buffers with {@code full}, so it costs no setup and its rows are exactly {@code full}'s rows of those
   * series. Only one of the two may stream at a time.
   */
  private FeaturePass(FeaturePass full, int[] seriesIndexes, int[] rowCountBySeries, int[] zeroRowCountBySeries,
      int[] droppedZeroRowCountBySeries) {
    this.history = full.history;
    this.spec = full.spec;
    this.training = full.training;
    this.seriesIndexes = seriesIndexes;
    this.firstDayIndex = full.firstDayIndex;
    this.lastDayIndex = full.lastDayIndex;
    this.weightBySeries = full.weightBySeries;
    this.zeroSampling = full.zeroSampling;
    this.kernels = full.kernels;
    this.firstFeatureIndexes = full.firstFeatureIndexes;
    this.schema = full.schema;
    this.withPrices = full.withPrices;
    this.context = full.context;
    this.rowDays = full.rowDays;
    this.rowLabels = full.rowLabels;
    this.strip = full.strip;
    this.tableHeapBytes = full.tableHeapBytes;
    this.rowCountBySeries = rowCountBySeries;
    this.zeroRowCountBySeries = zeroRowCountBySeries;
    this.droppedZeroRowCountBySeries = droppedZeroRowCountBySeries;
    this.rowCount = sum(rowCountBySeries);
    this.zeroRowCount = sum(zeroRowCountBySeries);
    this.droppedZeroRowCount = sum(droppedZeroRowCountBySeries);
  }

  /**
   * Training rows of every series over days {@code [firstDayIndex, lastDayIndex]} intersected with the spec's
   * {@code fromDate}/{@code untilDate}.
   *
   * @param lastDayIndex inclusive, {@code < history.dayCount()}
   */
  public static FeaturePass training(SalesHistory history, FeatureSpec spec, int firstDayIndex, int lastDayIndex) {
    return training(history, spec, null, firstDayIndex, lastDayIndex);
  }

  /**
   * Training rows of the listed series (in the given order; null for every series) over days
   * {@code [firstDayIndex, lastDayIndex]} intersected with the spec's window: one model partition's rows.
   */
  public static FeaturePass training(SalesHistory history, FeatureSpec spec, int[] seriesIndexes, int firstDayIndex,
      int lastDayIndex) {
    return training(history, spec, seriesIndexes, firstDayIndex, lastDayIndex, ZeroRowSampling.KEEP_ALL);
  }

  /**
   * As {@link #training(SalesHistory, FeatureSpec, int[], int, int)}, keeping only the zero-label rows
   * {@code zeroSampling} keeps, each weighted by its {@link ZeroRowSampling#zeroRowWeight()} (times the series weight
   * when there is one); rows with sales are all kept. {@link #rowCount()} counts the kept rows.
   */
  public static FeaturePass training(SalesHistory history, FeatureSpec spec, int[] seriesIndexes, int firstDayIndex,
      int lastDayIndex, ZeroRowSampling zeroSampling) {
    if (firstDayIndex < 0 || lastDayIndex >= history.dayCount() || lastDayIndex < firstDayIndex) {
      throw new IllegalArgumentException("training days [" + firstDayIndex + ", " + lastDayIndex
          + "] are out of range: need 0 <= firstDayIndex <= lastDayIndex <= " + (history.dayCount() - 1)
          + " (the history's last day)");
    }
    int first = firstDayIndex;
    int last = lastDayIndex;
    if (spec.fromDate() != null) {
      first = (int) Math.max(first, dayIndexOf(history, spec.fromDate()));
    }
    if (spec.untilDate() != null) {
      last = (int) Math.min(last, dayIndexOf(history, spec.untilDate()));
    }
    if (last < first) {
      last = first - 1;
    }
    return new FeaturePass(history, spec, true, checkedSeries(history, seriesIndexes), first, last, null,
        zeroSampling);
  }

  /** Training rows over the spec's window ({@code fromDate}..{@code untilDate}, the whole history by default). */
  public static FeaturePass training(SalesHistory history, FeatureSpec spec) {
    return training(history, spec, 0, history.dayCount() - 1);
  }

  /**
   * Prediction rows: each listed series (in the given order) on days {@code [firstDayIndex, firstDayIndex + dayCount)},
   * which may reach past the history's last day.
   *
   * @param seriesIndexes series to predict, or null for every series in index order
   */
  public static FeaturePass prediction(SalesHistory history, FeatureSpec spec, int[] seriesIndexes, int firstDayIndex,
      int dayCount) {
    if (firstDayIndex < 0 || dayCount < 1) {
      throw new IllegalArgumentException("prediction days: firstDayIndex " + firstDayIndex + " and dayCount "
          + dayCount + " are out of range: need firstDayIndex >= 0 and dayCount >= 1");
    }
    return new FeaturePass(history, spec, false, checkedSeries(history, seriesIndexes), firstDayIndex,
        firstDayIndex + dayCount - 1, null, ZeroRowSampling.KEEP_ALL);
  }

  private static int[] checkedSeries(SalesHistory history, int[] seriesIndexes) {
    int[] series = seriesIndexes == null ? allSeries(history) : seriesIndexes.clone();
    for (int s : series) {
      if (s < 0 || s >= history.seriesCount()) {
        throw new IllegalArgumentException("series index " + s + " is out of range [0, " + history.seriesCount()
            + ")");
      }
    }
    return series;
  }

  /** The same rows with each row's weight taken from {@code weightBySeries[seriesIndex]} (default weight 1). */
  public FeaturePass withSeriesWeights(float[] weightBySeries) {
    if (weightBySeries.length != history.seriesCount()) {
      throw new IllegalArgumentException("weightBySeries has " + weightBySeries.length + " entries, need one per"
          + " series: " + history.seriesCount());
    }
    return new FeaturePass(history, spec, training, seriesIndexes, firstDayIndex, lastDayIndex,
        weightBySeries.clone(), zeroSampling);
  }

  /** The period holding the date (its day index in a daily store). */
  private static long dayIndexOf(SalesHistory history, LocalDate date) {
    return Periods.periodIndexOf(history.firstDate(), history.periodDays(), date.toEpochDay());
  }

  private static int[] allSeries(SalesHistory history) {
    int[] all = new int[history.seriesCount()];
    for (int s = 0; s < all.length; s++) {
      all[s] = s;
    }
    return all;
  }

  private static int[] priceGroupAttributes(FeatureSpec spec, SeriesAttributes attributes, AttributeNesting nesting) {
    List<String> names = spec.priceGroupAttributes();
    if (names == null) {
      // Never by attribute name: the group comes from how the data nest.
      names = nesting.siblingGroupAttributes();
    }
    return attributeIndexes("price group", names, attributes);
  }

  private static int[] categoricalAttributes(FeatureSpec spec, SeriesAttributes attributes) {
    List<String> names = spec.categoricalAttributes();
    if (names == null) {
      List<Integer> all = new ArrayList<>();
      for (int a = 0; a < attributes.attributeCount(); a++) {
        if (!attributes.attributeName(a).equals(SeriesIdentity.SERIES_ID)) {
          all.add(a);
        }
      }
      return all.stream().mapToInt(Integer::intValue).toArray();
    }
    return attributeIndexes("categorical", names, attributes);
  }

  private static int[] attributeIndexes(String what, List<String> names, SeriesAttributes attributes) {
    int[] indexes = new int[names.size()];
    for (int i = 0; i < indexes.length; i++) {
      indexes[i] = attributes.attributeIndex(names.get(i));
      if (indexes[i] < 0) {
        throw new InvalidRequestException(what + " attribute '" + names.get(i) + "' does not exist; the series have: "
            + String.join(", ", attributes.attributeNames()));
      }
    }
    return indexes;
  }

  private void addKernel(FeatureKernel kernel) {
    if (kernel.featureCount() > 0) {
      kernelList.add(kernel);
    }
  }

  /**
   * Loads series {@code s} into the context and fills {@link #rowDays}/{@link #rowLabels} with its rows; sets
   * {@link #selectedZeroRowCount} and {@link #selectedDroppedRowCount} for it.
   *
   * @return the series' row count
   */
  private int selectRows(int s) {
    selectedZeroRowCount = 0;
    selectedDroppedRowCount = 0;
    int first = firstDayIndex;
    if (training && spec.skipPreLaunch()) {
      int firstSale = history.firstSaleDayIndex(s);
      if (firstSale == SalesHistory.NO_SALE) {
        return 0;
      }
      first = (int) Math.max(first, (long) firstSale + spec.launchSkipDays());
    }
    if (first > lastDayIndex) {
      return 0;
    }
    int dayCount = history.dayCount();
    context.load(history, s, Math.min(dayCount, lastDayIndex + 1), lastDayIndex + 1, withPrices);
    int[] units = context.units;
    int rows = 0;
    for (int day = first; day <= lastDayIndex; day++) {
      int label = day < dayCount ? units[day] : SalesHistory.UNKNOWN_UNITS;
      if (training && label <= 0) {
        if (label < 0) {
          continue;
        }
        selectedZeroRowCount++;
        if (!zeroSampling.keepsZeroRow(s, day)) {
          selectedDroppedRowCount++;
          continue;
        }
      }
      rowDays[rows] = day;
      rowLabels[rows] = label < 0 ? Float.NaN : label;
      rows++;
    }
    return rows;
  }

  /**
   * A two-stage sample source: whole series drawn in a seeded random order until their rows reach
   * {@code minimumRowCount}, then streamed in this pass's series order (so the store is read front to back). Series
   * without rows are never drawn. Returns this pass when it holds at most {@code 2 × minimumRowCount} rows, where a
   * subset would save little and the bin sample should stay uniform over all rows.
   *
   * <p>The subset shares this pass's kernels and buffers (no setup cost, rows identical to this pass's rows of those
   * series); stream one of the two at a time.
   *
   * @param minimumRowCount at least 1
   * @throws IllegalArgumentException when {@code minimumRowCount < 1}
   */
  @Override
  public RowStream sampleSource(long minimumRowCount, long seed) {
    if (minimumRowCount < 1) {
      throw new IllegalArgumentException("minimumRowCount " + minimumRowCount + " is out of range: need at least 1"
          + " (ask for a few times the sample size)");
    }
    if (rowCount <= 2 * minimumRowCount) {
      return this;
    }
    int[] positions = new int[seriesIndexes.length];
    int candidateCount = 0;
    for (int i = 0; i < seriesIndexes.length; i++) {
      if (rowCountBySeries[i] > 0) {
        positions[candidateCount++] = i;
      }
    }
    SplittableRandom random = new SplittableRandom(seed);
    long chosenRows = 0;
    int chosenCount = 0;
    // a partial Fisher-Yates shuffle: positions[0 .. chosenCount) are the first series of a seeded random order
    while (chosenRows < minimumRowCount) {
      int pick = chosenCount + random.nextInt(candidateCount - chosenCount);
      int position = positions[pick];
      positions[pick] = positions[chosenCount];
      positions[chosenCount++] = position;
      chosenRows += rowCountBySeries[position];
    }
    int[] chosen = Arrays.copyOf(positions, chosenCount);
    Arrays.sort(chosen);
    int[] subsetSeries = new int[chosenCount];
    int[] subsetRows = new int[chosenCount];
    int[] subsetZeroRows = new int[chosenCount];
    int[] subsetDroppedRows = new int[chosenCount];
    for (int i = 0; i < chosenCount; i++) {
      subsetSeries[i] = seriesIndexes[chosen[i]];
      subsetRows[i] = rowCountBySeries[chosen[i]];
      subsetZeroRows[i] = zeroRowCountBySeries[chosen[i]];
      subsetDroppedRows[i] = droppedZeroRowCountBySeries[chosen[i]];
    }
    return new FeaturePass(this, subsetSeries, subsetRows, subsetZeroRows, subsetDroppedRows);
  }

  /** The series this pass streams, in stream order (a copy). */
  public int[] seriesIndexes() {
    return seriesIndexes.clone();
  }

  @Override
  public FeatureSchema schema() {
    return schema;
  }

  @Override
  public long rowCount() {
    return rowCount;
  }

  /** Rows with label 0 this pass selected before zero-row sampling, kept or dropped (0 for a prediction pass). */
  public long zeroRowCount() {
    return zeroRowCount;
  }

  /** Rows with label 0 the zero-row sampling dropped: {@link #rowCount()} plus these is the count before it. */
  public long droppedZeroRowCount() {
    return droppedZeroRowCount;
  }

  /** Which zero-label rows this pass keeps ({@link ZeroRowSampling#KEEP_ALL} unless a training factory said). */
  public ZeroRowSampling zeroSampling() {
    return zeroSampling;
  }

  /**
   * Heap bytes held for the whole pass: date and calendar tables, group mean prices, the per-series buffers and the
   * staging strip.
   */
  public long heapBytes() {
    return tableHeapBytes + context.heapBytes()
        + 4L * (rowDays.length + rowLabels.length + strip.length + 3L * rowCountBySeries.length);
  }

  @Override
  public void stream(FeatureBatch batch, BatchConsumer consumer) {
    if (batch.featureCount() != schema.featureCount()) {
      throw new IllegalArgumentException("batch has " + batch.featureCount() + " features, the schema has "
          + schema.featureCount() + "; create the batch with schema().featureCount()");
    }
    batch.reset(0);
    FeatureKernel[] kernels = this.kernels;
    int featureCount = schema.featureCount();
    for (int s : seriesIndexes) {
      int seriesRows = selectRows(s);
      if (seriesRows == 0) {
        continue;
      }
      float weight = weightBySeries == null ? 1f : weightBySeries[s];
      // 1 when every zero row is kept, so today's weights stay bit for bit
      float zeroRowWeight = weight * zeroSampling.zeroRowWeight();
      for (FeatureKernel kernel : kernels) {
        kernel.beginSeries(context);
      }
      int offset = 0;
      while (offset < seriesRows) {
        if (batch.isFull()) {
          consumer.accept(batch);
          batch.reset(batch.firstRowIndex() + batch.rowCount());
        }
        int batchRow = batch.rowCount();
        int chunkRows = Math.min(Math.min(seriesRows - offset, batch.capacityRows() - batchRow), STRIP_ROWS);
        for (int i = 0; i < chunkRows; i++) {
          float label = rowLabels[offset + i];
          batch.addRow(s, rowDays[offset + i], label, label == 0f ? zeroRowWeight : weight);
        }
        for (int k = 0; k < kernels.length; k++) {
          kernels[k].compute(context, strip, featureCount, rowDays, offset, chunkRows, firstFeatureIndexes[k]);
        }
        batch.setRows(batchRow, strip, chunkRows);
        offset += chunkRows;
      }
    }
    if (batch.rowCount() > 0) {
      consumer.accept(batch);
    }
  }
}
