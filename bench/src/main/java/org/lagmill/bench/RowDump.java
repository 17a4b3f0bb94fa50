package org.lagmill.bench;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;
import org.lagmill.features.FeatureBatch;
import org.lagmill.features.FeatureSchema;
import org.lagmill.features.RowStream;
import org.lagmill.memory.MemoryBudget;

/**
 * Training rows written once to disk so a later process can push exactly the same rows into LightGBM without holding a
 * store or running the feature pass: the footprint harness's "LightGBM floor". A scratch format for benchmarks only:
 * {@code features.f32} (row-major float32, native byte order), {@code labels.f32} (float32 per row) and
 * {@code schema.json} (row count, feature names and categorical flags).
 */
final class RowDump {
  static final String FEATURES_FILE = "features.f32";
  static final String LABELS_FILE = "labels.f32";
  static final String SCHEMA_FILE = "schema.json";

  private static final ObjectMapper JSON = new ObjectMapper();

  /** The sidecar describing a dump. */
  record Header(long rowCount, List<String> names, List<Boolean> categorical, String byteOrder) {
    FeatureSchema schema() {
      return new FeatureSchema(names, categorical);
    }
  }

  private RowDump() {}

  /** Writes every row of {@code rows} into {@code folder} (created when missing) in batches of {@code batchRows}. */
  static Header write(RowStream rows, Path folder, MemoryBudget budget, int batchRows) throws IOException {
    Files.createDirectories(folder);
    FeatureSchema schema = rows.schema();
    int featureCount = schema.featureCount();
    int capacityRows = (int) Math.max(1, Math.min(batchRows, rows.rowCount()));
    ByteBuffer values = ByteBuffer.allocateDirect(capacityRows * featureCount * Float.BYTES)
        .order(ByteOrder.nativeOrder());
    ByteBuffer labels = ByteBuffer.allocateDirect(capacityRows * Float.BYTES).order(ByteOrder.nativeOrder());
    long[] written = {0};
    try (FileChannel featureOut = FileChannel.open(folder.resolve(FEATURES_FILE), StandardOpenOption.CREATE,
        StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING);
        FileChannel labelOut = FileChannel.open(folder.resolve(LABELS_FILE), StandardOpenOption.CREATE,
            StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING);
        FeatureBatch batch = new FeatureBatch(budget, capacityRows, featureCount)) {
      rows.stream(batch, full -> {
        values.clear();
        labels.clear();
        for (int row = 0; row < full.rowCount(); row++) {
          for (int feature = 0; feature < featureCount; feature++) {
            values.putFloat(full.get(row, feature));
          }
          labels.putFloat(full.labels()[row]);
        }
        writeFully(featureOut, values.flip());
        writeFully(labelOut, labels.flip());
        written[0] += full.rowCount();
      });
    }
    if (written[0] != rows.rowCount()) {
      throw new IllegalStateException("row stream promised " + rows.rowCount() + " rows but produced " + written[0]);
    }
    Header header = new Header(written[0], schema.names(), schema.categorical(), ByteOrder.nativeOrder().toString());
    JSON.writeValue(folder.resolve(SCHEMA_FILE).toFile(), header);
    return header;
  }

  static Header readHeader(Path folder) throws IOException {
    Header header = JSON.readValue(folder.resolve(SCHEMA_FILE).toFile(), Header.class);
    if (!ByteOrder.nativeOrder().toString().equals(header.byteOrder())) {
      throw new IllegalArgumentException("row dump " + folder + " was written in " + header.byteOrder()
          + " byte order, this machine is " + ByteOrder.nativeOrder());
    }
    long expectedBytes = header.rowCount() * header.names().size() * Float.BYTES;
    long actualBytes = Files.size(folder.resolve(FEATURES_FILE));
    if (actualBytes != expectedBytes) {
      throw new IllegalArgumentException("row dump " + folder.resolve(FEATURES_FILE) + ": expected " + expectedBytes
          + " bytes for " + header.rowCount() + " rows x " + header.names().size() + " features, actual "
          + actualBytes);
    }
    return header;
  }

  private static void writeFully(FileChannel channel, ByteBuffer buffer) {
    try {
      while (buffer.hasRemaining()) {
        channel.write(buffer);
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /**
   * Streams a dump back in chunks of the batch's capacity: each chunk is read with a FileChannel into one reused
   * direct buffer and copied into the batch, so the process holds one chunk, never the matrix.
   */
  static final class FileRowStream implements RowStream, AutoCloseable {
    private final Header header;
    private final FeatureSchema schema;
    private final FileChannel features;
    private final FileChannel labels;
    private ByteBuffer valueChunk;
    private ByteBuffer labelChunk;

    FileRowStream(Path folder) throws IOException {
      this.header = readHeader(folder);
      this.schema = header.schema();
      this.features = FileChannel.open(folder.resolve(FEATURES_FILE), StandardOpenOption.READ);
      this.labels = FileChannel.open(folder.resolve(LABELS_FILE), StandardOpenOption.READ);
    }

    @Override
    public FeatureSchema schema() {
      return schema;
    }

    @Override
    public long rowCount() {
      return header.rowCount();
    }

    @Override
    public void stream(FeatureBatch batch, BatchConsumer consumer) {
      int featureCount = schema.featureCount();
      int capacityRows = batch.capacityRows();
      if (labelChunk == null || labelChunk.capacity() != capacityRows * Float.BYTES) {
        // allocated once per batch size and reused by every later pass
        valueChunk = ByteBuffer.allocateDirect(capacityRows * featureCount * Float.BYTES)
            .order(ByteOrder.nativeOrder());
        labelChunk = ByteBuffer.allocateDirect(capacityRows * Float.BYTES).order(ByteOrder.nativeOrder());
      }
      long rowIndex = 0;
      while (rowIndex < header.rowCount()) {
        int chunkRows = (int) Math.min(capacityRows, header.rowCount() - rowIndex);
        readFully(features, valueChunk, chunkRows * featureCount * Float.BYTES,
            rowIndex * featureCount * Float.BYTES);
        readFully(labels, labelChunk, chunkRows * Float.BYTES, rowIndex * Float.BYTES);
        batch.reset(rowIndex);
        for (int row = 0; row < chunkRows; row++) {
          int added = batch.addRow(0, 0, labelChunk.getFloat(row * Float.BYTES), 1f);
          int base = row * featureCount * Float.BYTES;
          for (int feature = 0; feature < featureCount; feature++) {
            batch.set(added, feature, valueChunk.getFloat(base + feature * Float.BYTES));
          }
        }
        consumer.accept(batch);
        rowIndex += chunkRows;
      }
    }

    private static void readFully(FileChannel channel, ByteBuffer buffer, int byteCount, long position) {
      buffer.clear().limit(byteCount);
      try {
        long at = position;
        while (buffer.hasRemaining()) {
          int read = channel.read(buffer, at);
          if (read < 0) {
            throw new IllegalStateException("row dump ended at byte " + at + ", expected " + byteCount
                + " bytes from " + position);
          }
          at += read;
        }
      } catch (IOException e) {
        throw new UncheckedIOException(e);
      }
    }

    @Override
    public void close() throws IOException {
      features.close();
      labels.close();
    }
  }
}
