package org.lagmill.ingest;

import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.util.Locale;
import java.util.zip.CRC32;
import java.util.zip.DataFormatException;
import java.util.zip.Inflater;
import java.util.zip.ZipException;

/**
 * The decompressed bytes of a gzip file (RFC 1952): one or more members back to back, each a header, deflate data and a
 * trailer holding the CRC-32 and length of its data, checked at the member's end. Unlike the JDK's
 * {@code GZIPInputStream}, which stops quietly at bytes after the last member that do not start a new one, anything
 * after the last member is refused: a file with bytes appended is not the file that was compressed.
 *
 * <p>Failures are {@link Damage} (a {@link ZipException}) naming the byte offset in the compressed file, or an
 * {@link EOFException} for a file cut short. Not thread-safe.
 */
final class GzipMembers extends InputStream {
  static final int ID1 = 0x1F;
  static final int ID2 = 0x8B;
  private static final int CM_DEFLATE = 8;
  private static final int FHCRC = 0x02;
  private static final int FEXTRA = 0x04;
  private static final int FNAME = 0x08;
  private static final int FCOMMENT = 0x10;
  private static final int RESERVED_FLAGS = 0xE0;
  private static final int INPUT_BYTES = 1 << 16;

  /** What is wrong with a damaged gzip file. */
  enum DamageKind {
    /** The file does not start with a gzip header. */
    NOT_GZIP,
    /** A header, the deflate data or a member's check value or length is wrong. */
    CORRUPT,
    /** Bytes follow the last member that do not start another one. */
    TRAILING_BYTES
  }

  /** A damaged gzip stream, with the problem in words and where in the compressed file it showed. */
  static final class Damage extends ZipException {
    private static final long serialVersionUID = 1L;
    private final DamageKind kind;
    private final long compressedOffset;

    Damage(DamageKind kind, String problem, long compressedOffset) {
      super(problem);
      this.kind = kind;
      this.compressedOffset = compressedOffset;
    }

    DamageKind kind() {
      return kind;
    }

    /** Bytes from the start of the compressed file to where the damage showed. */
    long compressedOffset() {
      return compressedOffset;
    }
  }

  private final InputStream raw;
  private final byte[] input = new byte[INPUT_BYTES];
  /** Valid bytes in {@link #input}: [inputPosition, inputLimit). */
  private int inputPosition;
  private int inputLimit;
  /** Compressed-file offset of input[0]. */
  private long inputStartOffset;
  private final Inflater inflater = new Inflater(true);
  private final CRC32 crc = new CRC32();
  private long memberOutputBytes;
  private boolean inMember;
  private boolean ended;
  private final byte[] single = new byte[1];

  /** Reads the first member's header; {@code raw} is owned and closed by this stream. */
  GzipMembers(InputStream raw) throws IOException {
    this.raw = raw;
    int first = readRawByte();
    int second = first < 0 ? -1 : readRawByte();
    if (first != ID1 || second != ID2) {
      throw new Damage(DamageKind.NOT_GZIP, "not gzip data", 0);
    }
    startMember();
  }

  @Override
  public int read() throws IOException {
    int n = read(single, 0, 1);
    return n < 0 ? -1 : single[0] & 0xFF;
  }

  @Override
  public int read(byte[] buffer, int offset, int length) throws IOException {
    if (length == 0) {
      return 0;
    }
    while (!ended) {
      if (!inMember) {
        nextMemberOrEnd();
        continue;
      }
      int produced;
      try {
        produced = inflater.inflate(buffer, offset, length);
      } catch (DataFormatException e) {
        throw new Damage(DamageKind.CORRUPT, "corrupt deflate data (" + e.getMessage() + ")", inflaterOffset());
      }
      if (produced > 0) {
        crc.update(buffer, offset, produced);
        memberOutputBytes += produced;
        return produced;
      }
      if (inflater.finished()) {
        inputPosition = inputLimit - inflater.getRemaining();
        checkTrailer();
      } else if (inflater.needsInput()) {
        inputPosition = inputLimit;
        if (!refill()) {
          throw new EOFException("gzip data ends inside a member");
        }
        inflater.setInput(input, inputPosition, inputLimit - inputPosition);
      } else if (inflater.needsDictionary()) {
        throw new Damage(DamageKind.CORRUPT, "deflate data asks for a preset dictionary", inflaterOffset());
      }
    }
    return -1;
  }

  private long inflaterOffset() {
    return inputStartOffset + inputLimit - inflater.getRemaining();
  }

  private void startMember() throws IOException {
    long headerOffset = offset() - 2;
    int method = readHeaderByte();
    int flags = readHeaderByte();
    if (method != CM_DEFLATE || (flags & RESERVED_FLAGS) != 0) {
      throw new Damage(DamageKind.CORRUPT,
          String.format(Locale.ROOT, "a gzip header with method %d and flags 0x%02X: expected"
              + " deflate (8) and no reserved flag", method, flags),
          headerOffset);
    }
    skipHeaderBytes(6); // modification time, extra flags, operating system
    if ((flags & FEXTRA) != 0) {
      int extraLength = readHeaderByte() | (readHeaderByte() << 8);
      skipHeaderBytes(extraLength);
    }
    if ((flags & FNAME) != 0) {
      skipZeroTerminated();
    }
    if ((flags & FCOMMENT) != 0) {
      skipZeroTerminated();
    }
    if ((flags & FHCRC) != 0) {
      skipHeaderBytes(2);
    }
    inflater.reset();
    crc.reset();
    memberOutputBytes = 0;
    inflater.setInput(input, inputPosition, inputLimit - inputPosition);
    inMember = true;
  }

  private void checkTrailer() throws IOException {
    long trailerOffset = offset();
    long expectedCrc = readTrailerWord();
    long expectedSize = readTrailerWord();
    if (expectedCrc != crc.getValue()) {
      throw new Damage(DamageKind.CORRUPT,
          String.format(Locale.ROOT, "the check value of a member is %08X, its data's is %08X",
              expectedCrc, crc.getValue()),
          trailerOffset);
    }
    if (expectedSize != (memberOutputBytes & 0xFFFFFFFFL)) {
      throw new Damage(DamageKind.CORRUPT, "a member's recorded length is " + expectedSize + " bytes, its data holds "
          + memberOutputBytes, trailerOffset);
    }
    inMember = false;
  }

  private void nextMemberOrEnd() throws IOException {
    long memberOffset = offset();
    int first = readRawByte();
    if (first < 0) {
      ended = true;
      return;
    }
    int second = readRawByte();
    if (first != ID1 || second != ID2) {
      throw new Damage(DamageKind.TRAILING_BYTES, "bytes after the end of the gzip data", memberOffset);
    }
    startMember();
  }

  private long offset() {
    return inputStartOffset + inputPosition;
  }

  /** Refills {@link #input} keeping nothing (every byte before inputPosition is consumed); false at the file's end. */
  private boolean refill() throws IOException {
    if (inputPosition < inputLimit) {
      return true;
    }
    inputStartOffset += inputLimit;
    inputPosition = 0;
    inputLimit = 0;
    int n = raw.read(input, 0, input.length);
    if (n <= 0) {
      return false;
    }
    inputLimit = n;
    return true;
  }

  private int readRawByte() throws IOException {
    if (!refill()) {
      return -1;
    }
    return input[inputPosition++] & 0xFF;
  }

  private int readHeaderByte() throws IOException {
    int b = readRawByte();
    if (b < 0) {
      throw new EOFException("gzip data ends inside a header");
    }
    return b;
  }

  private void skipHeaderBytes(int count) throws IOException {
    for (int i = 0; i < count; i++) {
      readHeaderByte();
    }
  }

  private void skipZeroTerminated() throws IOException {
    while (readHeaderByte() != 0) {
      // a name or comment ends at its zero byte
    }
  }

  private long readTrailerWord() throws IOException {
    long value = 0;
    for (int i = 0; i < 4; i++) {
      int b = readRawByte();
      if (b < 0) {
        throw new EOFException("gzip data ends inside a trailer");
      }
      value |= (long) b << (8 * i);
    }
    return value;
  }

  @Override
  public void close() throws IOException {
    inflater.end();
    raw.close();
  }
}
