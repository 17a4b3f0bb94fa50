package org.lagmill.learner;

import com.microsoft.ml.lightgbm.SWIGTYPE_p_long_long;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.zip.CRC32C;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_void;
import com.microsoft.ml.lightgbm.lightgbmlib;
import org.lagmill.features.FeatureBatch;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.memory.NativeDoubleArray;
import org.lagmill.memory.NativeIntArray;

/**
 * The raw scores a trained model gave the rows it was trained and validated on, each keyed by its series and day: what
 * a training continued from that model starts its rows from, instead of predicting every row again with every
 * starting tree ({@link StartingScores}). LightGBM keeps every training and validation row's score while it boosts,
 * so taking them costs one copy; predicting them again cost 40–60 ns per tree and row (docs/benchmarks.md, "The final
 * fit continued from the last origin's trees").
 *
 * <p>A row's score carries over only because a training row's features do not depend on the cut it was trained for
 * (each reads the days before its own); {@link StartingScoreFiller} checks that by predicting one carried row per
 * batch.
 *
 * <p>Memory: 16 bytes per row (series and day as int32, score as float64), reserved from the budget of the builder
 * that recorded the rows, owned here and freed by {@link #close()}. Not thread-safe.
 */
public final class RowScores implements AutoCloseable {
  private final Rows training;
  private final Rows validation;

  /**
   * @param training the training Dataset's rows, their scores filled
   * @param validation the validation Dataset's rows, their scores filled, or null when there were none
   */
  RowScores(Rows training, Rows validation) {
    this.training = training;
    this.validation = validation;
  }

  /** Rows with a score: training and validation rows together. */
  public long rowCount() {
    return training.length() + (validation == null ? 0 : validation.length());
  }

  /** Native bytes held (0 after close). */
  public long offHeapBytes() {
    return training.offHeapBytes() + (validation == null ? 0 : validation.offHeapBytes());
  }

  /**
   * A reader of these scores for rows that come series by series in {@code seriesOrder} and day by day within a
   * series, as a feature pass produces them; rows must be asked for in that order.
   *
   * @param seriesOrder the series in the order the rows come, each once
   */
  public Cursor cursor(int[] seriesOrder) {
    return new Cursor(seriesOrder);
  }

  /**
   * Writes these scores to {@code file} (created; it must not exist): a header, each run's series, days and scores in
   * native byte order, then a CRC-32C of everything before it. {@link #read} opens it again.
   */
  public void write(Path file) throws IOException {
    try (FileChannel out = FileChannel.open(file, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE)) {
      CRC32C checksum = new CRC32C();
      ByteBuffer header = ByteBuffer.allocate(HEADER_BYTES).order(ByteOrder.LITTLE_ENDIAN);
      header.putInt(MAGIC).putInt(FORMAT_VERSION).putInt(ByteOrder.nativeOrder() == ByteOrder.LITTLE_ENDIAN ? 0 : 1)
          .putInt(training.length()).putInt(validation == null ? -1 : validation.length()).flip();
      writeChecked(out, header, checksum);
      training.write(out, checksum);
      if (validation != null) {
        validation.write(out, checksum);
      }
      ByteBuffer trailer = ByteBuffer.allocate(Long.BYTES).order(ByteOrder.LITTLE_ENDIAN);
      trailer.putLong(checksum.getValue()).flip();
      writeFully(out, trailer);
      out.force(true);
    }
  }

  /**
   * Reads scores {@link #write} wrote, into memory reserved from {@code budget}.
   *
   * @throws IOException when the file is missing, cut short, of another format or byte order, or its checksum
   *     does not match (the message says which)
   */
  public static RowScores read(Path file, MemoryBudget budget) throws IOException {
    try (FileChannel in = FileChannel.open(file, StandardOpenOption.READ)) {
      CRC32C checksum = new CRC32C();
      ByteBuffer header = ByteBuffer.allocate(HEADER_BYTES).order(ByteOrder.LITTLE_ENDIAN);
      readChecked(in, header, checksum, file);
      header.flip();
      int magic = header.getInt();
      int version = header.getInt();
      int bigEndian = header.getInt();
      int trainingLength = header.getInt();
      int validationLength = header.getInt();
      if (magic != MAGIC || version != FORMAT_VERSION) {
        throw new IOException(file + " is not a row scores file of format " + FORMAT_VERSION);
      }
      if ((bigEndian == 1) != (ByteOrder.nativeOrder() == ByteOrder.BIG_ENDIAN)) {
        throw new IOException(file + " was written on a machine of the other byte order");
      }
      long expectedBytes = HEADER_BYTES + ROW_BYTES * ((long) trainingLength + Math.max(0, validationLength))
          + Long.BYTES;
      if (trainingLength < 0 || Files.size(file) != expectedBytes) {
        throw new IOException(file + " holds " + Files.size(file) + " bytes, its header promises " + expectedBytes);
      }
      Rows trainingRows = new Rows(budget, trainingLength);
      Rows validationRows = null;
      try {
        trainingRows.read(in, checksum, file);
        if (validationLength >= 0) {
          validationRows = new Rows(budget, validationLength);
          validationRows.read(in, checksum, file);
        }
        ByteBuffer trailer = ByteBuffer.allocate(Long.BYTES).order(ByteOrder.LITTLE_ENDIAN);
        readFully(in, trailer, file);
        if (trailer.flip().getLong() != checksum.getValue()) {
          throw new IOException(file + " is damaged: its checksum does not match its contents");
        }
        return new RowScores(trainingRows, validationRows);
      } catch (IOException | RuntimeException | Error e) {
        trainingRows.close();
        if (validationRows != null) {
          validationRows.close();
        }
        throw e;
      }
    }
  }

  private static final int MAGIC = 0x5352_4D4C;
  private static final int FORMAT_VERSION = 1;
  private static final int HEADER_BYTES = 5 * Integer.BYTES;
  private static final long ROW_BYTES = 2L * Integer.BYTES + Double.BYTES;

  private static void writeChecked(FileChannel out, ByteBuffer bytes, CRC32C checksum) throws IOException {
    checksum.update(bytes.duplicate());
    writeFully(out, bytes);
  }

  private static void writeFully(FileChannel out, ByteBuffer bytes) throws IOException {
    while (bytes.hasRemaining()) {
      out.write(bytes);
    }
  }

  private static void readChecked(FileChannel in, ByteBuffer into, CRC32C checksum, Path file) throws IOException {
    readFully(in, into, file);
    checksum.update(into.duplicate().flip());
  }

  private static void readFully(FileChannel in, ByteBuffer into, Path file) throws IOException {
    while (into.hasRemaining()) {
      if (in.read(into) < 0) {
        throw new IOException(file + " ends early");
      }
    }
  }

  @Override
  public void close() {
    training.close();
    if (validation != null) {
      validation.close();
    }
  }

  /**
   * Walks both row runs forward: each is ordered like the rows asked for (the same series order, days ascending), so
   * one pass over the asked rows reads each stored row at most once.
   */
  public final class Cursor {
    private final int[] positionBySeries;
    private int trainingNext;
    private int validationNext;

    private Cursor(int[] seriesOrder) {
      int largest = -1;
      for (int s : seriesOrder) {
        largest = Math.max(largest, s);
      }
      positionBySeries = new int[largest + 1];
      java.util.Arrays.fill(positionBySeries, -1);
      for (int position = 0; position < seriesOrder.length; position++) {
        positionBySeries[seriesOrder[position]] = position;
      }
    }

    /**
     * The stored raw score of series {@code seriesIndex} on day {@code dayIndex}, or NaN when no stored row has that
     * key (a row of days the model never saw, or one asked for out of order).
     */
    public double find(int seriesIndex, int dayIndex) {
      long key = key(seriesIndex, dayIndex);
      if (key < 0) {
        return Double.NaN;
      }
      trainingNext = advance(training, trainingNext, key);
      if (trainingNext < training.length() && key(training, trainingNext) == key) {
        return training.score(trainingNext);
      }
      if (validation != null) {
        validationNext = advance(validation, validationNext, key);
        if (validationNext < validation.length() && key(validation, validationNext) == key) {
          return validation.score(validationNext);
        }
      }
      return Double.NaN;
    }

    /** The first stored row at or after {@code from} whose key is not below {@code key}. */
    private int advance(Rows rows, int from, long key) {
      int at = from;
      while (at < rows.length() && key(rows, at) < key) {
        at++;
      }
      return at;
    }

    private long key(Rows rows, int row) {
      return key(rows.series(row), rows.day(row));
    }

    /** (position of the series, day) as one ordered number; -1 for a series outside the order. */
    private long key(int seriesIndex, int dayIndex) {
      if (seriesIndex < 0 || seriesIndex >= positionBySeries.length || positionBySeries[seriesIndex] < 0) {
        return -1;
      }
      return ((long) positionBySeries[seriesIndex] << Integer.SIZE) | (dayIndex & 0xFFFF_FFFFL);
    }
  }

  /**
   * One Dataset's rows in the order they were pushed: each row's series and day, recorded as the rows stream, then
   * the raw score the trained Booster holds for each. Owned by its {@link TrainingDataset} until a trainer takes it.
   */
  static final class Rows implements AutoCloseable {
    private final int length;
    private final NativeIntArray series;
    private final NativeIntArray days;
    private final NativeDoubleArray scores;

    Rows(MemoryBudget budget, int length) {
      this.length = length;
      NativeIntArray seriesArray = new NativeIntArray(budget, length);
      NativeIntArray dayArray = null;
      try {
        dayArray = new NativeIntArray(budget, length);
        this.scores = new NativeDoubleArray(budget, length);
      } catch (RuntimeException | Error e) {
        seriesArray.close();
        if (dayArray != null) {
          dayArray.close();
        }
        throw e;
      }
      this.series = seriesArray;
      this.days = dayArray;
    }

    int length() {
      return length;
    }

    int series(int row) {
      return series.get(row);
    }

    int day(int row) {
      return days.get(row);
    }

    double score(int row) {
      return scores.get(row);
    }

    long offHeapBytes() {
      return series.offHeapBytes() + days.offHeapBytes() + scores.offHeapBytes();
    }

    /** Records the keys of {@code batch}'s rows, which the Dataset holds from row {@code firstRow}. */
    void record(FeatureBatch batch, int firstRow) {
      int[] seriesIndexes = batch.seriesIndexes();
      int[] dayIndexes = batch.dayIndexes();
      for (int i = 0; i < batch.rowCount(); i++) {
        series.set(firstRow + i, seriesIndexes[i]);
        days.set(firstRow + i, dayIndexes[i]);
      }
    }

    /**
     * Copies the Booster's current score of every row of its Dataset number {@code dataIndex} (0 training, 1 the
     * first validation Dataset). LightGBM hands them out on the response scale; a log link's raw score is their log.
     */
    void fillScores(SWIGTYPE_p_void booster, int dataIndex, boolean logLink) {
      SWIGTYPE_p_long_long count = lightgbmlib.new_int64_tp();
      try {
        Native.check(lightgbmlib.LGBM_BoosterGetNumPredict(booster, dataIndex, count), "LGBM_BoosterGetNumPredict");
        if (lightgbmlib.int64_tp_value(count) != length) {
          throw new LearnerException("LightGBM holds " + lightgbmlib.int64_tp_value(count) + " scores for Dataset "
              + dataIndex + " but " + length + " rows were recorded");
        }
        Native.check(lightgbmlib.LGBM_BoosterGetPredict(booster, dataIndex, count, Native.doublePointer(scores
            .address(0))), "LGBM_BoosterGetPredict");
      } finally {
        lightgbmlib.delete_int64_tp(count);
      }
      if (logLink) {
        for (int row = 0; row < length; row++) {
          scores.set(row, Math.log(scores.get(row)));
        }
      }
    }

    void write(FileChannel out, CRC32C checksum) throws IOException {
      writeChecked(out, series.bytes(), checksum);
      writeChecked(out, days.bytes(), checksum);
      writeChecked(out, scores.bytes(), checksum);
    }

    void read(FileChannel in, CRC32C checksum, Path file) throws IOException {
      readChecked(in, series.bytes(), checksum, file);
      readChecked(in, days.bytes(), checksum, file);
      readChecked(in, scores.bytes(), checksum, file);
    }

    @Override
    public void close() {
      series.close();
      days.close();
      scores.close();
    }
  }
}
