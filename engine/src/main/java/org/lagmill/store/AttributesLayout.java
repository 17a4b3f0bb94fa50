package org.lagmill.store;

import java.nio.file.Path;

/**
 * Layout of {@code attributes.bin}: header, seriesCount int, attributeCount int, then per attribute its name and its
 * dictionary (valueCount int, then each value as int byte length + UTF-8 bytes, in code order), zero padding to a
 * multiple of 4, then the codes: attributeCount runs of seriesCount ints (attribute-major), then the footer. The
 * dictionary part has variable length, so its end ({@code codesOffset}) is found by decoding it.
 */
final class AttributesLayout {
  static final int SERIES_COUNT_OFFSET = StoreFileFormat.HEADER_BYTES;
  static final int ATTRIBUTE_COUNT_OFFSET = SERIES_COUNT_OFFSET + 4;
  static final int FIRST_DICTIONARY_OFFSET = ATTRIBUTE_COUNT_OFFSET + 4;

  private AttributesLayout() {}

  static long codeOffset(long codesOffset, int seriesCount, int seriesIndex, int attributeIndex) {
    return codesOffset + ((long) attributeIndex * seriesCount + seriesIndex) * Integer.BYTES;
  }

  static long fileBytes(long codesOffset, int seriesCount, int attributeCount) {
    return codesOffset + (long) attributeCount * seriesCount * Integer.BYTES + StoreFileFormat.FOOTER_BYTES;
  }

  static void checkFileSize(Path file, long codesOffset, int seriesCount, int attributeCount, long actualBytes) {
    long expected = fileBytes(codesOffset, seriesCount, attributeCount);
    if (expected != actualBytes) {
      throw new CorruptStoreException(file, "wrong size for " + seriesCount + " series and " + attributeCount
          + " attributes: expected " + expected + " bytes, actual " + actualBytes + " bytes");
    }
  }
}
