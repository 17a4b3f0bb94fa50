package org.lagmill.store;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.MappedByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import org.agrona.IoUtil;
import org.agrona.concurrent.UnsafeBuffer;
import org.lagmill.memory.MemoryBudget;

/**
 * One read-only mapping of a byte range of a file, accounted in a {@link MemoryBudget} from map to unmap. A single
 * mapping is limited to 2 GiB by the JDK; callers map larger files in windows.
 */
final class MappedRegion implements AutoCloseable {
  /** The largest range one mapping may cover. */
  static final long MAX_MAPPING_BYTES = Integer.MAX_VALUE;

  private final MemoryBudget budget;
  private final long fileOffset;
  private final long byteCount;
  private MappedByteBuffer mapped;
  private final UnsafeBuffer buffer;

  private MappedRegion(MemoryBudget budget, long fileOffset, long byteCount, MappedByteBuffer mapped) {
    this.budget = budget;
    this.fileOffset = fileOffset;
    this.byteCount = byteCount;
    this.mapped = mapped;
    this.buffer = new UnsafeBuffer(mapped);
  }

  /** Maps {@code byteCount} bytes of {@code file} from {@code fileOffset}, reserving them first. */
  static MappedRegion map(Path file, long fileOffset, long byteCount, MemoryBudget budget) {
    if (byteCount < 0 || byteCount > MAX_MAPPING_BYTES) {
      throw new IllegalArgumentException("a mapping must cover [0, " + MAX_MAPPING_BYTES + "] bytes, got "
          + byteCount + " of " + file + "; map it in windows");
    }
    budget.reserve(byteCount);
    try {
      MappedByteBuffer mapped;
      try (FileChannel channel = FileChannel.open(file, StandardOpenOption.READ)) {
        mapped = channel.map(FileChannel.MapMode.READ_ONLY, fileOffset, byteCount);
      } catch (IOException e) {
        // Unchecked so callers keep their signatures; SalesStore.open looks for a missing file in it to retry.
        throw new UncheckedIOException(e);
      }
      return new MappedRegion(budget, fileOffset, byteCount, mapped);
    } catch (RuntimeException | Error e) {
      budget.release(byteCount);
      throw e;
    }
  }

  /** The mapped bytes; index 0 is file offset {@link #fileOffset()}. Valid until {@link #close()}. */
  UnsafeBuffer buffer() {
    return buffer;
  }

  long fileOffset() {
    return fileOffset;
  }

  long byteCount() {
    return byteCount;
  }

  @Override
  public void close() {
    if (mapped != null) {
      IoUtil.unmap(mapped);
      mapped = null;
      budget.release(byteCount);
    }
  }
}
