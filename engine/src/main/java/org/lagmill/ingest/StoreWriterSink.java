package org.lagmill.ingest;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.store.SeriesIdentity;
import org.lagmill.store.StoreWriter;

/**
 * Feeds the series of a long sales file into a {@link StoreWriter} it opens once the file's shape is known. The
 * series-id column is stored as the attribute {@code series_id}, as the wide reader does. The caller closes
 * {@link #writer()} (also after a failure) and deletes the directory when the ingest fails.
 */
final class StoreWriterSink implements SeriesSink {
  private final Path salesFile;
  private final Path dir;
  private final String seriesIdColumn;
  private final MemoryBudget budget;
  private StoreWriter writer;

  StoreWriterSink(Path salesFile, Path dir, String seriesIdColumn, MemoryBudget budget) {
    this.salesFile = salesFile;
    this.dir = dir;
    this.seriesIdColumn = seriesIdColumn;
    this.budget = budget;
  }

  /** The writer opened by {@link #begin}, or null before it. */
  StoreWriter writer() {
    return writer;
  }

  @Override
  public void begin(LongSalesHeader header) {
    List<String> names = new ArrayList<>(header.attributeNames());
    int idColumn = names.indexOf(seriesIdColumn);
    if (idColumn >= 0 && !seriesIdColumn.equals(SeriesIdentity.SERIES_ID)) {
      int clash = names.indexOf(SeriesIdentity.SERIES_ID);
      if (clash >= 0) {
        throw new InputFormatException(salesFile, 1, 0, "column \"series_id\" clashes with the series id column \""
            + seriesIdColumn + "\": expected one of them, found both; rename one");
      }
      names.set(idColumn, SeriesIdentity.SERIES_ID);
    }
    try {
      writer = new StoreWriter(dir, header.firstDate(), header.periodDays(), header.dayCount(), names, budget);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  @Override
  public void accept(String[] attributeValues, int[] units) {
    try {
      writer.addSeries(attributeValues, units);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } catch (IllegalArgumentException e) {
      // The reader keys series by their cells; the store names them by values joined with '/', which can collide.
      throw new InputFormatException(salesFile, 0, 0, e.getMessage(), e);
    }
  }
}
