package org.lagmill.store;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.LocalDate;
import java.util.Collections;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.lagmill.io.SealedJson;

/**
 * The {@code manifest.json} of a store directory: what the binary files hold and how to check them.
 *
 * @param formatVersion store format version, {@link #FORMAT_VERSION_OLDEST} to {@link #FORMAT_VERSION_CURRENT}
 * @param firstDate ISO date of day index 0
 * @param dayCount periods of sales held per series
 * @param periodDays days per period (7 weekly); null, and absent from the file, for a daily store, so daily stores
 *     keep the bytes they had before stores recorded a period and older stores open as daily
 * @param seriesCount number of series
 * @param attributeNames series attribute names, in code order
 * @param sources the input files the store was built from, with their byte sizes
 * @param files every binary file with its byte size and CRC32C (8 hex digits)
 * @param fingerprint 16 hex digits of SHA-256 over the files' names, sizes and checksums; model files record it
 * @param fill how many item-days were filled or are unknown; null in stores written before it was recorded
 * @param nesting each attribute name to the attribute it lies directly under, or null for a root, as
 *     {@link AttributeNesting#parents()} found it when the store was written; null in stores written before it was
 *     recorded (readers compute it from the attributes, see {@link SalesHistory#nesting()})
 * @param shard which part of which store this store is, when {@code lagmill shard} or {@code ingest --shard} wrote
 *     it; null, and absent from the file, for a whole store
 */
public record StoreManifest(int formatVersion, String firstDate, int dayCount,
    @JsonInclude(JsonInclude.Include.NON_NULL) Integer periodDays, int seriesCount,
    List<String> attributeNames, List<SourceFile> sources, List<StoreFile> files, String fingerprint, Fill fill,
    Map<String, String> nesting, @JsonInclude(JsonInclude.Include.NON_NULL) Shard shard) {

  public static final String FILE_NAME = "manifest.json";
  /**
   * Store format version written now: 2 = the manifest carries its own CRC32C and the store lives in generations
   * behind a pointer. Version 1 (no manifest checksum, files at the top of the store folder) is still read.
   */
  public static final int FORMAT_VERSION_CURRENT = 2;
  /** Oldest store format version a reader accepts. */
  public static final int FORMAT_VERSION_OLDEST = 1;
  /** First version whose manifest must carry its checksum. */
  static final int FORMAT_VERSION_SEALED = 2;

  private static final ObjectMapper JSON = new ObjectMapper()
      .enable(SerializationFeature.INDENT_OUTPUT)
      .disable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES);

  /** An input file the store was built from: its file name and size in bytes. */
  public record SourceFile(String name, long bytes) {}

  /** A binary store file: its name, size in bytes and CRC32C as 8 hex digits. */
  public record StoreFile(String name, long bytes, String crc32c) {
    int checksum() {
      return Integer.parseUnsignedInt(crc32c, 16);
    }
  }

  /**
   * Item-days the store holds that were not read as a count from the input.
   *
   * @param zeroFilledItemDays item-days with no row in long sales, read as zero ({@code --missing-rows zero})
   * @param unknownItemDays item-days whose units are unknown (an empty cell, no row under
   *     {@code --missing-rows unknown}, days before a series' first row or after it left the file)
   * @param closedItemDays item-days declared closed, counted apart from the unknown ones
   * @param partlyClosedItemDays item-periods (of a store whose period is longer than a day) that the closures cover
   *     on some days but not all, from the first period on, the forecast horizon included: they stay open (a period
   *     is closed only when every day of it is); absent from the file when 0, so daily stores keep their bytes
   */
  public record Fill(long zeroFilledItemDays, long unknownItemDays, long closedItemDays,
      @JsonInclude(JsonInclude.Include.NON_DEFAULT) long partlyClosedItemDays) {
    public static final Fill NONE = new Fill(0, 0, 0);

    /** A fill with no partly closed periods (every daily store). */
    public Fill(long zeroFilledItemDays, long unknownItemDays, long closedItemDays) {
      this(zeroFilledItemDays, unknownItemDays, closedItemDays, 0);
    }
  }

  /**
   * The part of a sharded store this store holds ({@link ShardAssignment} is the rule).
   *
   * @param part this shard's number, {@code 0 .. partCount-1}
   * @param partCount how many shards the store was split into
   * @param attribute the attribute whose value chose each series' shard
   * @param hash the name of the hash rule, {@link ShardAssignment#HASH_NAME}
   * @param sourceName what the shards were split from: the source store's fingerprint, or the sales file's name and
   *     size for {@code ingest --shard}; every shard of one split carries the same text
   * @param sourceSeriesCount series in the whole store (the sum over every shard)
   */
  public record Shard(int part, int partCount, String attribute, String hash, String sourceName,
      int sourceSeriesCount) {
    /** Text {@link #sourceName} starts with when the shards were split from a store. */
    public static final String STORE_SOURCE_PREFIX = "store ";

    /** The fingerprint of the store the shards were split from, or null when they were not split from a store. */
    public String sourceFingerprint() {
      return sourceName.startsWith(STORE_SOURCE_PREFIX) ? sourceName.substring(STORE_SOURCE_PREFIX.length()) : null;
    }
  }

  public StoreManifest {
    attributeNames = List.copyOf(attributeNames);
    sources = List.copyOf(sources);
    files = List.copyOf(files);
    // Map.copyOf refuses the null that marks a root.
    nesting = nesting == null ? null : Collections.unmodifiableMap(new LinkedHashMap<>(nesting));
  }

  public LocalDate firstLocalDate() {
    return LocalDate.parse(firstDate);
  }

  /** First date of the last period held. */
  public LocalDate lastLocalDate() {
    return firstLocalDate().plusDays((long) (dayCount - 1) * periodDaysOrDaily());
  }

  /** Days per period: the recorded {@code periodDays}, or 1 (daily) when absent. */
  public int periodDaysOrDaily() {
    return periodDays == null ? Periods.DAILY : periodDays;
  }

  /** The manifest entry of one file, or null. */
  public StoreFile file(String name) {
    for (StoreFile f : files) {
      if (f.name().equals(name)) {
        return f;
      }
    }
    return null;
  }

  /** Total bytes of the binary files (the manifest itself excluded). */
  public long binaryBytes() {
    long total = 0;
    for (StoreFile f : files) {
      total += f.bytes();
    }
    return total;
  }

  /** Total bytes of the source files. */
  public long sourceBytes() {
    long total = 0;
    for (SourceFile f : sources) {
      total += f.bytes();
    }
    return total;
  }

  /** Decoded values the checksum cannot vouch for (a version-1 manifest has none, a writer may have erred). */
  private static void checkValues(Path file, StoreManifest manifest) {
    try {
      LocalDate.parse(manifest.firstDate());
    } catch (RuntimeException e) {
      throw new CorruptStoreException(file, "firstDate: expected an ISO date, actual \"" + manifest.firstDate()
          + "\"");
    }
    if (manifest.dayCount() < 1) {
      throw new CorruptStoreException(file, "dayCount: expected at least 1, actual " + manifest.dayCount());
    }
    if (manifest.seriesCount() < 0) {
      throw new CorruptStoreException(file, "seriesCount: expected at least 0, actual " + manifest.seriesCount());
    }
  }

  static String fingerprintOf(List<StoreFile> files) {
    try {
      MessageDigest sha = MessageDigest.getInstance("SHA-256");
      for (StoreFile f : files) {
        sha.update((f.name() + "\n" + f.bytes() + "\n" + f.crc32c() + "\n").getBytes(StandardCharsets.UTF_8));
      }
      return HexFormat.of().formatHex(sha.digest(), 0, 8);
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every Java runtime provides SHA-256", e);
    }
  }

  void write(Path dir) throws IOException {
    Files.write(dir.resolve(FILE_NAME), SealedJson.seal(JSON.writeValueAsBytes(this)));
  }

  /** Reads and sanity-checks a store's manifest. */
  public static StoreManifest read(Path dir) throws IOException {
    Path file = dir.resolve(FILE_NAME);
    SealedJson.Unsealed unsealed = SealedJson.unseal(file, Files.readAllBytes(file));
    StoreManifest manifest;
    try {
      manifest = JSON.readValue(unsealed.bytes(), StoreManifest.class);
    } catch (JsonProcessingException e) {
      throw new CorruptStoreException(file, "not a valid manifest: " + e.getOriginalMessage(), e);
    }
    if (manifest.formatVersion() < FORMAT_VERSION_OLDEST || manifest.formatVersion() > FORMAT_VERSION_CURRENT) {
      throw new CorruptStoreException(file, "unsupported format version: expected " + FORMAT_VERSION_OLDEST
          + " to " + FORMAT_VERSION_CURRENT + ", actual " + manifest.formatVersion());
    }
    if (manifest.periodDays() != null
        && (manifest.periodDays() < 1 || manifest.periodDays() > Periods.MAX_PERIOD_DAYS)) {
      throw new CorruptStoreException(file, "periodDays " + manifest.periodDays() + ": expected 1 to "
          + Periods.MAX_PERIOD_DAYS);
    }
    if (manifest.formatVersion() >= FORMAT_VERSION_SEALED && !unsealed.sealed()) {
      throw new CorruptStoreException(file, "no " + SealedJson.MEMBER + " member: expected one in format version "
          + manifest.formatVersion() + ", actual none (the line was removed)");
    }
    checkValues(file, manifest);
    String fingerprint = fingerprintOf(manifest.files());
    if (!fingerprint.equals(manifest.fingerprint())) {
      throw new CorruptStoreException(file, "fingerprint mismatch: expected " + fingerprint + " (from the files "
          + "listed), actual " + manifest.fingerprint());
    }
    return manifest;
  }
}
