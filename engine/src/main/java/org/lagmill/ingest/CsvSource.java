package org.lagmill.ingest;

import de.siegmar.fastcsv.reader.CloseableIterator;
import de.siegmar.fastcsv.reader.CsvParseException;
import de.siegmar.fastcsv.reader.CsvReader;
import de.siegmar.fastcsv.reader.CsvRecord;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * One CSV input file opened for reading: gzip-compressed when its name ends in {@code .gz} (any case, see {@link InputFiles}), decoded as strict UTF-8
 * (an invalid byte is an error naming its line, never a replacement character), tokenized by fastcsv. Blank lines are
 * skipped; a UTF-8 byte order mark before the header is dropped. Every problem surfaces as an
 * {@link InputFormatException} naming the file.
 *
 * <p>Usage: {@link #open(Path)}, {@link #readHeader()} once, then {@link #next()} until it returns null. Not
 * thread-safe; close it (try-with-resources).
 */
public final class CsvSource implements AutoCloseable {
  static {
    ColumnLimit.raiseParserLimit();
  }

  private final Path file;
  private final CsvReader<CsvRecord> reader;
  private final CloseableIterator<CsvRecord> records;
  private int headerFieldCount = -1;
  private String[] header;
  private long lineNumber;

  private CsvSource(Path file, CsvReader<CsvRecord> reader) {
    this.file = file;
    this.reader = reader;
    this.records = reader.iterator();
  }

  /**
   * Opens a file as {@link InputFiles} says: a missing file is an {@link UncheckedIOException} around the
   * {@link NoSuchFileException}; a {@code .gz} file (any case) that is not gzip data is an
   * {@link InputFormatException}.
   */
  public static CsvSource open(Path file) {
    InputStream bytes = openBytes(file);
    CharsetDecoder decoder = strictUtf8();
    CsvReader<CsvRecord> reader = CsvReader.builder()
        .ignoreDifferentFieldCount(true)
        .skipEmptyLines(true)
        .ofCsvRecord(new InputStreamReader(bytes, decoder));
    return new CsvSource(file, reader);
  }

  public Path file() {
    return file;
  }

  /** 1-based line on which the record last returned starts (0 before the header is read). */
  public long lineNumber() {
    return lineNumber;
  }

  /**
   * Reads the first non-blank line as the header.
   *
   * @throws InputFormatException "empty file: expected a header line" when the file holds no line, or a header cell
   *     holds a NUL character
   */
  public String[] readHeader() {
    if (headerFieldCount >= 0) {
      throw new IllegalStateException("header of " + file + " already read");
    }
    CsvRecord record = fetch();
    if (record == null) {
      throw new InputFormatException(file, 0, 0, "empty file: expected a header line");
    }
    String[] header = record.getFields().toArray(new String[0]);
    if (header.length > 0 && header[0].startsWith("\uFEFF")) {
      header[0] = header[0].substring(1);
    }
    for (int c = 0; c < header.length; c++) {
      Cells.requireNoNul(file, lineNumber, c + 1, Cells.HEADER_CELL, header[c]);
    }
    Cells.requireCommaSeparated(file, header);
    headerFieldCount = header.length;
    this.header = header.clone();
    return header;
  }

  /**
   * The next data record, or null at the end of the file. Its field count equals the header's.
   *
   * @throws InputFormatException on a record with another field count, a NUL character, invalid UTF-8 or a damaged
   *     gzip stream
   */
  public CsvRecord next() {
    if (headerFieldCount < 0) {
      throw new IllegalStateException("read the header of " + file + " first");
    }
    CsvRecord record = fetch();
    if (record == null) {
      return null;
    }
    if (record.getFieldCount() != headerFieldCount) {
      throw new InputFormatException(file, lineNumber, 0, "found " + record.getFieldCount() + " fields, expected "
          + headerFieldCount + " as in the header");
    }
    for (int c = 0; c < headerFieldCount; c++) {
      Cells.requireNoNul(file, lineNumber, c + 1, header[c], record.getField(c));
    }
    return record;
  }

  private CsvRecord fetch() {
    try {
      if (!records.hasNext()) {
        return null;
      }
      CsvRecord record = records.next();
      lineNumber = record.getStartingLineNumber();
      if (ColumnLimit.exceeds(record.getFieldCount())) {
        throw ColumnLimit.refusal(file, lineNumber);
      }
      return record;
    } catch (UncheckedIOException e) {
      throw translate(e.getCause());
    } catch (CsvParseException e) {
      Throwable cause = e.getCause();
      if (cause instanceof UncheckedIOException u) {
        throw translate(u.getCause());
      }
      if (cause instanceof IOException io) {
        throw translate(io);
      }
      if (ColumnLimit.isParserRefusal(e)) {
        throw ColumnLimit.refusal(file, lineNumber + 1);
      }
      throw new InputFormatException(file, lineNumber + 1, 0, "unreadable CSV after this line: " + e.getMessage(), e);
    }
  }

  private RuntimeException translate(IOException e) {
    if (e instanceof CharacterCodingException) {
      return locateInvalidUtf8(e);
    }
    return InputFiles.failure(file, lineNumber, e);
  }

  /**
   * fastcsv and the stream decoder read ahead by thousands of bytes, so the decoding error arrives far from its line;
   * a second, character-by-character decode of the file finds the exact line. Runs only on the error path.
   */
  private InputFormatException locateInvalidUtf8(IOException original) {
    CharsetDecoder decoder = strictUtf8();
    ByteBuffer in = ByteBuffer.allocate(1 << 16);
    CharBuffer out = CharBuffer.allocate(1 << 16);
    long line = 1;
    try (InputStream bytes = openBytes(file)) {
      boolean endOfInput = false;
      while (true) {
        int n = endOfInput ? -1 : bytes.read(in.array(), in.position(), in.remaining());
        if (n < 0) {
          endOfInput = true;
        } else {
          in.position(in.position() + n);
        }
        in.flip();
        CoderResult result = decoder.decode(in, out, endOfInput);
        out.flip();
        while (out.hasRemaining()) {
          if (out.get() == '\n') {
            line++;
          }
        }
        out.clear();
        if (result.isError()) {
          int badByte = in.get(in.position()) & 0xFF;
          return new InputFormatException(file, line, 0,
              String.format("invalid UTF-8 byte 0x%02X: expected UTF-8 text", badByte), original);
        }
        if (endOfInput && !in.hasRemaining()) {
          break;
        }
        in.compact();
      }
    } catch (IOException e) {
      original.addSuppressed(e);
    }
    return new InputFormatException(file, 0, 0, "invalid UTF-8: expected UTF-8 text", original);
  }

  private static CharsetDecoder strictUtf8() {
    return StandardCharsets.UTF_8.newDecoder()
        .onMalformedInput(CodingErrorAction.REPORT)
        .onUnmappableCharacter(CodingErrorAction.REPORT);
  }

  private static InputStream openBytes(Path file) {
    try {
      return InputFiles.open(file);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  @Override
  public void close() {
    try {
      reader.close();
    } catch (IOException e) {
      throw new UncheckedIOException("cannot close " + file, e);
    }
  }
}
