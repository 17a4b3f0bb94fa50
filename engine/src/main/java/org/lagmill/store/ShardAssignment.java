package org.lagmill.store;

import java.nio.charset.StandardCharsets;
import org.lagmill.io.InvalidRequestException;

/**
 * The one rule that puts a series into a shard: the 64-bit FNV-1a hash of the UTF-8 bytes of the series' value of the
 * shard attribute, taken as an unsigned number modulo the part count. It depends on nothing but the value's text, so
 * it is the same in every run, JVM and machine, and every series sharing the value (all stores of one item) lands in
 * the same shard.
 *
 * <p>FNV-1a (Fowler, Noll, Vo): start from the offset basis {@code 0xcbf29ce484222325}; for each byte, XOR it into the
 * hash, then multiply by the prime {@code 0x100000001b3} modulo 2^64. Immutable.
 */
public final class ShardAssignment {
  /** The hash rule's name, recorded in each shard's manifest. */
  public static final String HASH_NAME = "fnv1a64-utf8-mod";
  /** Largest part count a split accepts. */
  public static final int MAX_PART_COUNT = 4096;

  private static final long OFFSET_BASIS = 0xcbf29ce484222325L;
  private static final long PRIME = 0x100000001b3L;

  private final int partCount;

  /** @param partCount in {@code [1, MAX_PART_COUNT]} */
  public ShardAssignment(int partCount) {
    if (partCount < 1 || partCount > MAX_PART_COUNT) {
      throw new InvalidRequestException("part count must be in [1, " + MAX_PART_COUNT + "], got " + partCount);
    }
    this.partCount = partCount;
  }

  public int partCount() {
    return partCount;
  }

  /** The shard, {@code 0 .. partCount()-1}, of every series whose shard attribute reads {@code value}. */
  public int partOf(String value) {
    return (int) Long.remainderUnsigned(hash(value), partCount);
  }

  /** 64-bit FNV-1a of the value's UTF-8 bytes. */
  public static long hash(String value) {
    long hash = OFFSET_BASIS;
    for (byte b : value.getBytes(StandardCharsets.UTF_8)) {
      hash ^= b & 0xff;
      hash *= PRIME;
    }
    return hash;
  }
}
