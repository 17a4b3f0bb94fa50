package org.lagmill.store;

import java.nio.file.Path;
import java.util.function.Function;
import org.agrona.concurrent.UnsafeBuffer;
import org.lagmill.memory.MemoryBudget;

/**
 * What every reader of one whole mapped store file shares: the {@link MappedRegion} it owns, the open/closed state and
 * the budget accounting. Subclasses decode their own layout in their constructor and call {@link #checkOpen()} before
 * each read.
 */
abstract class MappedStoreFile implements AutoCloseable {
  /** The mapped file; index 0 is the file's first byte. */
  final UnsafeBuffer buffer;
  private final MappedRegion region;
  private volatile boolean closed;

  MappedStoreFile(MappedRegion region) {
    this.region = region;
    this.buffer = region.buffer();
  }

  /**
   * Maps the whole file and hands the mapping to {@code reader}; when the reader fails (a corrupt layout), the mapping
   * is unmapped and its bytes released before the exception goes on.
   */
  static <T extends MappedStoreFile> T openMapped(Path file, long fileBytes, MemoryBudget budget,
      Function<MappedRegion, T> reader) {
    MappedRegion region = MappedRegion.map(file, 0, fileBytes, budget);
    try {
      return reader.apply(region);
    } catch (RuntimeException e) {
      region.close();
      throw e;
    }
  }

  /** A sequential reader of the file's variable-length part, from {@code startOffset} up to the footer. */
  final MappedFileReads readsFrom(Path file, long startOffset) {
    return new MappedFileReads(file, buffer, startOffset, region.byteCount() - StoreFileFormat.FOOTER_BYTES);
  }

  /** Size of the mapped file in bytes. */
  final long fileBytes() {
    return region.byteCount();
  }

  /** Rejects a file whose series count differs from the manifest's. */
  static void checkSeriesCount(Path file, int expectedSeriesCount, int seriesCount) {
    if (seriesCount != expectedSeriesCount) {
      throw new CorruptStoreException(file, "wrong series count: expected " + expectedSeriesCount + " (manifest), "
          + "actual " + seriesCount);
    }
  }

  /** Bytes mapped, 0 after close. */
  final long offHeapBytes() {
    return closed ? 0 : region.byteCount();
  }

  final void checkOpen() {
    if (closed) {
      throw new IllegalStateException("the store is closed");
    }
  }

  @Override
  public final void close() {
    closed = true;
    region.close();
  }
}
