package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.Function;
import java.util.stream.Stream;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The bad-input corpus: one row per case (the kind of file, the file's bytes, the command, the exit code and a
 * fragment of the message), run through {@link Main#run} as a user would. Every case also checks that the message
 * is one short line without a stack trace, and that the shared store and model are unchanged afterwards, so a
 * failed run never damages them. Part of the reliability suite ({@code -Dgroups=reliability}).
 */
@Tag("reliability")
class BadInputCorpusTest {
  private static final Path TINY = Path.of("..", "testdata", "tiny");
  private static final String TINY_HEADER = "series_id,item,department,category,store,region";

  @TempDir
  static Path shared;
  private static Path store;
  private static Path model;
  private static String storeListing;
  private static String modelListing;

  /**
   * One case. In {@code command}, {@code FILE} is replaced by the written input file, {@code STORE} and
   * {@code MODEL} by the shared store and model, {@code OUT} by a fresh path in the case's own folder and
   * {@code TINY} by the tiny fixture folder.
   */
  record Case(String kind, String name, String fileName, byte[] content, String command, int exitCode,
      String fragment) {
    @Override
    public String toString() {
      return kind + ": " + name;
    }
  }

  private static Case text(String kind, String name, String fileName, String content, String command, int exitCode,
      String fragment) {
    return new Case(kind, name, fileName, content.getBytes(StandardCharsets.UTF_8), command, exitCode, fragment);
  }

  private static Case bytes(String kind, String name, String fileName, byte[] content, String command, int exitCode,
      String fragment) {
    return new Case(kind, name, fileName, content, command, exitCode, fragment);
  }

  /** The tiny fixture's wide sales with a row or cell changed. */
  private static String tinySales(Function<String, String> change) {
    try {
      return change.apply(Files.readString(TINY.resolve("sales.csv")));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  private static byte[] gzip(byte[] plain) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    try (GZIPOutputStream gz = new GZIPOutputStream(out)) {
      gz.write(plain);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out.toByteArray();
  }

  private static byte[] concat(byte[] a, byte[] b) {
    byte[] joined = Arrays.copyOf(a, a.length + b.length);
    System.arraycopy(b, 0, joined, a.length, b.length);
    return joined;
  }

  /** A long sales file of {@code rowCount} rows, varied enough that its deflate stream has many blocks. */
  private static String longSalesText(int rowCount) {
    StringBuilder b = new StringBuilder("sku,date,units\n");
    for (int i = 0; i < rowCount; i++) {
      b.append("s").append(i / 40).append(",2024-01-").append(String.format("%02d", 1 + i % 28)).append(',')
          .append((i * 7919) % 13).append('\n');
    }
    return b.toString();
  }

  /** Twenty compressed bytes in the middle of a gzip file flipped: damage gzip finds only at the member's end. */
  private static byte[] flippedInTheMiddle(byte[] gz) {
    byte[] damaged = gz.clone();
    for (int i = damaged.length / 2; i < damaged.length / 2 + 20; i++) {
      damaged[i] ^= 0x55;
    }
    return damaged;
  }

  private static byte[] oneLineOfColumns(int columnCount) {
    byte[] line = new byte[2 * columnCount];
    for (int c = 0; c < columnCount; c++) {
      line[2 * c] = 'x';
      line[2 * c + 1] = (byte) (c == columnCount - 1 ? '\n' : ',');
    }
    return line;
  }

  static Stream<Case> cases() {
    List<Case> c = new ArrayList<>();
    String ingest = "ingest --sales FILE --store OUT";
    // sales, wide
    c.add(text("sales wide", "letters as units", "w.csv", "item,2024-03-01,2024-03-02\na,1,x\n", ingest, 3,
        "w.csv, line 2, column 3: expected a non-negative integer number of units, found \"x\""));
    c.add(text("sales wide", "negative units", "w.csv", "item,2024-03-01\na,-1\n", ingest, 3, "line 2, column 2"));
    c.add(text("sales wide", "short row", "w.csv", "item,2024-03-01,2024-03-02\na,1\n", ingest, 3,
        "w.csv, line 2: expected 3 cells as in the header, found 2"));
    c.add(text("sales wide", "a date outside the plausible window", "w.csv", "item,9024-01-05\na,1\n", ingest, 3,
        "9024-01-05"));
    c.add(text("sales wide", "header only", "w.csv", "item,2024-03-01\n", ingest, 3, "w.csv"));
    c.add(text("sales wide", "empty file", "w.csv", "", ingest, 3, "w.csv: empty file"));
    c.add(text("sales wide", "duplicate series", "w.csv", "item,2024-03-01\na,1\na,2\n", ingest, 3,
        "duplicate series"));
    c.add(text("sales wide", "an empty series id", "w.csv", "series_id,item,2024-03-01\n,a,1\n", ingest, 3,
        "w.csv, line 2, column 1: series_id is empty: expected a value naming the series"));
    c.add(text("sales wide", "a NUL character", "w.csv", "item,2024-03-01\na\0b,1\n", ingest, 3,
        "w.csv, line 2, column 1: item 'a\\0b' holds a NUL character: expected text"));
    c.add(text("sales wide", "a 100,000-character cell quoted as an excerpt", "w.csv", "item,2024-03-01\na,"
        + "9".repeat(100_000) + "\n", ingest, 3, "w.csv, line 2, column 2: expected a number of units of at most"));
    c.add(text("sales wide", "append moves a known series", "w.csv", TINY_HEADER + ",2026-01-19\n"
        + "PNT-D1-0001@NV-01,PNT-D1-0001,PNT-D1,Pantry,NV-02,Northvale,1\n", "append --store COPY --sales FILE", 3,
        "w.csv, line 2, column 5: series 'PNT-D1-0001@NV-01' has store=NV-02: expected store=NV-01 as in the"
            + " store"));
    c.add(text("sales wide", "units past the int range", "w.csv", "item,2024-03-01\na,99999999999\n", ingest, 3,
        "line 2, column 2"));
    // sales, long
    String ingestLong = "ingest --sales FILE --store OUT --sales-format long";
    c.add(text("sales long", "decimal units", "l.csv", "sku,shop,date,units\nA,s1,2024-03-01,1.5\n", ingestLong,
        3, "l.csv, line 2, column 4"));
    c.add(text("sales long", "no units column", "l.csv", "sku,date,qty\nA,2024-03-01,1\n", ingestLong, 3,
        "no column 'units'"));
    c.add(text("sales long", "duplicate row", "l.csv", "sku,date,units\nA,2024-03-01,1\nA,2024-03-01,2\n",
        ingestLong, 3, "duplicate row"));
    c.add(text("sales long", "a bad date", "l.csv", "sku,date,units\nA,2024-02-30,1\n", ingestLong, 3,
        "l.csv, line 2, column 2"));
    c.add(text("sales long", "a series whose attribute changes", "l.csv",
        "sku,shop,date,units\nA,s1,2024-03-01,1\nA,s2,2024-03-02,1\n", "ingest --sales FILE --store OUT"
            + " --sales-format long --series-id-column sku",
        3, "line 3"));
    c.add(text("sales long", "append moves a known series", "l.csv", TINY_HEADER + ",date,units\n"
        + "PNT-D1-0001@NV-01,PNT-D1-0001,PNT-D1,Pantry,NV-02,Northvale,2026-01-19,1\n",
        "append --store COPY --sales FILE", 3, "l.csv, line 2, column 5: series 'PNT-D1-0001@NV-01' has store=NV-02:"
            + " expected store=NV-01 as in the store"));
    c.add(text("sales long", "an empty series id", "l.csv", "series_id,sku,date,units\n,A,2024-03-01,1\n",
        ingestLong, 3, "l.csv, line 2, column 1: series_id is empty: expected a value naming the series"));
    c.add(text("sales long", "a NUL character", "l.csv", "sku,date,units\nA\0,2024-03-01,1\n", ingestLong, 3,
        "l.csv, line 2, column 1: sku 'A\\0' holds a NUL character"));
    // gzip
    byte[] plainSales = tinySales(s -> s).getBytes(StandardCharsets.UTF_8);
    c.add(bytes("sales gzip", "not gzip data", "w.csv.gz", plainSales, ingest, 3, "not gzip data"));
    c.add(bytes("sales gzip", "cut short", "w.csv.gz", Arrays.copyOf(gzip(plainSales), 40), ingest, 3,
        "truncated gzip stream"));
    byte[] longPlain = longSalesText(4000).getBytes(StandardCharsets.UTF_8);
    c.add(bytes("sales gzip", "corrupted mid-stream, long", "l.csv.gz", flippedInTheMiddle(gzip(longPlain)), ingest
        + " --sales-format long", 3, "compressed data is corrupt ("));
    c.add(bytes("sales gzip", "corrupted mid-stream, wide", "w.csv.gz", flippedInTheMiddle(gzip(plainSales)), ingest,
        3, "compressed data is corrupt ("));
    c.add(bytes("sales gzip", "bytes after the end", "w.csv.gz", concat(gzip(plainSales), "garbage\n".getBytes(
        StandardCharsets.UTF_8)), ingest, 3, "8 bytes after the end of the gzip data at byte "));
    c.add(bytes("calendar gzip", "zero bytes after the end", "cal.csv.gz", concat(gzip(
        "date,x\n2026-01-05,1\n".getBytes(StandardCharsets.UTF_8)), new byte[4]), "ingest --sales TINY/sales.csv"
            + " --calendar FILE --store OUT",
        3, "4 bytes after the end of the gzip data"));
    c.add(bytes("sales wide", "more columns than the limit", "w.csv", oneLineOfColumns(1_048_577), ingest, 3,
        "w.csv, line 1: more than 1,048,576 columns: expected at most 1,048,576 columns in a line"));
    // calendar
    String ingestCal = "ingest --sales TINY/sales.csv --calendar FILE --store OUT";
    c.add(text("calendar", "a gap", "cal.csv", "date,x\n2026-01-05,1\n2026-01-07,1\n", ingestCal, 3,
        "cal.csv, line 3, column 1: calendar gap: expected 2026-01-06, found 2026-01-07"));
    c.add(text("calendar", "NaN in a numeric column", "cal.csv", "date,temp\n2026-01-05,1\n2026-01-06,NaN\n",
        ingestCal, 3, "cal.csv, line 3, column 2: calendar column 'temp' value 'NaN': expected a finite number"));
    c.add(text("calendar", "a number beyond float32", "cal.csv", "date,temp\n2026-01-05,1e39\n", ingestCal, 3,
        "value '1e39': expected a number of at most 3.4028235E38 in size"));
    c.add(text("calendar", "separated by semicolons", "cal.csv", "date;x\n2026-01-05;1\n", ingestCal, 3,
        "cal.csv, line 1: the header is one column holding ';' between its names: expected comma-separated values"));
    c.add(text("calendar", "a NUL character", "cal.csv", "date,x\n2026-01-05,1\0\n", ingestCal, 3,
        "cal.csv, line 2, column 2: x '1\\0' holds a NUL character: expected text"));
    c.add(text("calendar", "a UTF-16 header", "cal.csv", "d\0a\0t\0e\0\n2026-01-05\n", ingestCal, 3,
        "cal.csv, line 1, column 1: header cell 'd\\0a\\0t\\0e\\0' holds a NUL character"));
    c.add(text("calendar", "keyed by an unknown attribute", "cal.csv", "date,p[color=red]\n2026-01-05,1\n",
        ingestCal, 3, "is keyed by 'color', which is not a series attribute"));
    // prices
    String ingestPrices = "ingest --sales TINY/sales.csv --prices FILE --store OUT";
    c.add(text("prices", "zero price", "p.csv", "item,from,price\nPNT-D1-0001,2026-01-05,0\n", ingestPrices, 3,
        "p.csv, line 2, column 3: price '0': expected a decimal number > 0"));
    c.add(text("prices", "infinite price", "p.csv", "item,from,price\nPNT-D1-0001,2026-01-05,Infinity\n",
        ingestPrices, 3, "price 'Infinity': expected a decimal number > 0"));
    c.add(text("prices", "a price beyond float32", "p.csv", "item,from,price\nPNT-D1-0001,2026-01-05,1e39\n",
        ingestPrices, 3, "price '1e39': expected a decimal number > 0 and at most 3.4028235E38"));
    c.add(text("prices", "a NUL character", "p.csv", "item,from,price\nPNT-D1-0001\0,2026-01-05,1\n", ingestPrices,
        3, "p.csv, line 2, column 1: item 'PNT-D1-0001\\0' holds a NUL character: expected text"));
    c.add(text("prices", "a price below float32", "p.csv", "item,from,price\nPNT-D1-0001,2026-01-05,1e-50\n",
        ingestPrices, 3, "price '1e-50': expected a decimal number of at least 1.4E-45 (the smallest price the store"
            + " holds)"));
    c.add(text("prices", "no key columns", "p.csv", "from,price\n2026-01-05,1\n", ingestPrices, 3,
        "no key columns"));
    // closures
    String ingestClosures = "ingest --sales TINY/sales.csv --closures FILE --store OUT";
    c.add(text("closures", "until before from", "x.csv", "store,from,until\nNV-01,2026-01-09,2026-01-07\n",
        ingestClosures, 3, "x.csv, line 2"));
    c.add(text("closures", "not a date", "x.csv", "store,from,until\nNV-01,soon,2026-01-07\n", ingestClosures, 3,
        "x.csv, line 2, column 2"));
    c.add(text("closures", "a NUL character", "x.csv", "store,from,until\nNV-01,2026-01-07,2026-01-08\0\n",
        ingestClosures, 3, "x.csv, line 2, column 3: until '2026-01-08\\0' holds a NUL character: expected text"));
    // plan
    c.add(text("plan", "a NUL character", "plan.csv", "item,date,promo\nPNT-D1-0001,2026-01-06,\0\n",
        "ingest --sales TINY/sales.csv --plan FILE --store OUT", 3,
        "plan.csv, line 2, column 3: promo '\\0' holds a NUL character: expected text"));
    // YAML feature spec
    String check = "config --check FILE";
    c.add(text("config", "a fractional lag", "f.yaml", "horizonDays: 2\nlagDays: [2, 28.5]\n", check, 2,
        "f.yaml line 2: key 'lagDays': expected a list of whole numbers, e.g. [28, 35], found '28.5'"));
    c.add(text("config", "a repeated key", "f.yaml", "horizonDays: 2\nhorizonDays: 3\n", check, 2,
        "f.yaml line 2: key 'horizonDays' appears twice: expected each key once"));
    c.add(text("config", "a word as a number", "f.yaml", "horizonDays: two\n", check, 2,
        "f.yaml line 1: key 'horizonDays': expected a whole number, found 'two'"));
    c.add(text("config", "a key without a value", "f.yaml", "horizonDays: 2\nlagDays:\n", check, 2,
        "f.yaml line 2: key 'lagDays': expected a list of whole numbers, e.g. [28, 35], found an empty value"));
    c.add(text("config", "an unknown key", "f.yaml", "lags: [2]\n", check, 2, "f.yaml line 1: unknown key 'lags'"));
    c.add(text("config", "broken YAML", "f.yaml", "horizonDays: 2: 3\n", check, 2,
        "f.yaml line 1: not valid YAML (mapping values are not allowed here)"));
    c.add(text("config", "a lag shorter than the horizon", "f.yaml", "strategy: direct\nhorizonDays: 7\nlagDays: [1]\n",
        "train --store STORE --model OUT --config FILE", 2, "lag 1 is shorter than the horizon"));
    // forecast files read by evaluate
    String evaluate = "evaluate --store STORE --forecast FILE";
    String forecastHeader = "series_id,date,forecast\n";
    c.add(text("forecast", "NaN forecast", "fc.csv", forecastHeader + "PNT-D1-0001@NV-01,2026-01-18,NaN\n",
        evaluate, 3, "fc.csv, line 2, column 3: expected a non-negative number of units, found \"NaN\""));
    c.add(text("forecast", "infinite forecast", "fc.csv", forecastHeader
        + "PNT-D1-0001@NV-01,2026-01-18,Infinity\n", evaluate, 3, "found \"Infinity\""));
    c.add(text("forecast", "crossing quantiles", "fc.csv", "series_id,date,forecast,q0.25,q0.75\n"
        + "PNT-D1-0001@NV-01,2026-01-18,2,3,1\n", evaluate, 3,
        "fc.csv, line 2, column 5: q0.25 is 3.0 but q0.75 is 1.0: expected quantiles that do not decrease"));
    c.add(text("forecast", "a NUL character", "fc.csv", forecastHeader + "PNT-D1-0001@NV-01\0,2026-01-18,1\n",
        evaluate, 3, "fc.csv, line 2, column 1: series_id 'PNT-D1-0001@NV-01\\0' holds a NUL character"));
    c.add(text("forecast", "a quantile level given twice", "fc.csv", "series_id,date,forecast,q0.5,q0.50\n"
        + "PNT-D1-0001@NV-01,2026-01-18,2,2,2\n", evaluate, 3,
        "fc.csv, line 1, column 5: quantile column q0.50"
            + " repeats the level of q0.5 (column 4): expected each level once"));
    c.add(text("forecast", "unknown series", "fc.csv", forecastHeader + "nobody,2026-01-18,1\n", evaluate, 3,
        "expected a series of the store, found 'nobody'"));
    c.add(text("forecast", "no date column", "fc.csv", "series_id,forecast\nx,1\n", evaluate, 3,
        "expected a 'date' column"));
    // model and store folders given to the wrong option
    c.add(text("model folder", "a store given as the model", "unused.txt", "", "forecast --store STORE --model STORE"
        + " --out OUT", 6,
        "STORE: not a model: it holds a sales store; give the folder train wrote (a store folder"
            + " goes to --store)"));
    c.add(text("model folder", "a store given as the model to train", "unused.txt", "", "train --store STORE --model"
        + " STORE --horizon 2 --lags 2,3 --windows 2 --rounds 3", 6,
        "refusing to write STORE: it holds a sales store,"
            + " not a model"));
    c.add(text("model folder", "an empty folder as the model", "unused.txt", "", "forecast --store STORE --model"
        + " CASEDIR --out OUT", 6, "CASEDIR"));
    c.add(text("store folder", "a model given as the store", "unused.txt", "", "forecast --store MODEL --model"
        + " MODEL --out OUT", 6, "not a store: it holds a trained model"));
    c.add(text("store folder", "a file given as the store", "notes.txt", "mine", "inspect --store FILE", 6,
        "notes.txt: is a file, not a store: give the folder ingest wrote"));
    c.add(text("model folder", "a file given as the model", "notes.txt", "mine", "forecast --store STORE --model FILE"
        + " --out OUT", 6, "notes.txt: is a file, not a model: give the folder train wrote"));
    c.add(text("store folder", "an empty folder as the store", "unused.txt", "", "inspect --store CASEDIR", 6,
        "CASEDIR"));
    c.add(text("store folder", "a replace of something not a store", "notes.txt", "mine",
        "ingest --sales TINY/sales.csv --store CASEDIR --replace", 6, "CASEDIR"));
    // counts on the command line and paths that are not what they should be
    c.add(text("options", "a negative horizon", "unused.txt", "", "forecast --store STORE --model MODEL --out OUT"
        + " --horizon -5", 2, "Invalid value for option '--horizon': expected a whole number of at least 1, found -5"));
    c.add(text("options", "a horizon past the plausible dates", "unused.txt", "", "forecast --store STORE --model"
        + " MODEL --out OUT --horizon 2147483647", 2,
        "--horizon 2147483647 reaches past 2200-12-31, the last plausible"
            + " date: expected at most 63899 periods from 2026-01-19"));
    c.add(text("options", "a horizon and lag of 2147483647 to train", "unused.txt", "", "train --store STORE --model"
        + " OUT --horizon 2147483647 --lags 2147483647", 2,
        "the validation window of 2147483647 days (the horizon)"
            + " leaves no day of the 14 days of history up to the cut to train on; use a shorter --horizon"));
    c.add(text("options", "a zero horizon to train", "unused.txt", "", "train --store STORE --model OUT --horizon 0",
        2, "Invalid value for option '--horizon': expected a whole number of at least 1, found 0"));
    c.add(text("options", "a negative lag", "unused.txt", "", "train --store STORE --model OUT --lags 2,-3", 2,
        "Invalid value for option '--lags'"));
    c.add(text("options", "zero rounds", "unused.txt", "", "train --store STORE --model OUT --rounds 0", 2,
        "Invalid value for option '--rounds'"));
    c.add(text("options", "negative origins", "unused.txt", "", "backtest --store STORE --origins -1 --out OUT",
        2, "Invalid value for option '--origins'"));
    c.add(text("options", "negative series to generate", "unused.txt", "", "generate --out OUT --series -3"
        + " --days 10", 2, "series count must be in [1, 50000000], got -3"));
    c.add(text("sales wide", "a folder given as the sales file", "unused.txt", "", "ingest --sales CASEDIR"
        + " --sales-format wide --store OUT", 6, "CASEDIR: is a folder: expected a file"));
    c.add(text("calendar", "a folder given as the calendar", "unused.txt", "", "ingest --sales TINY/sales.csv"
        + " --calendar CASEDIR --store OUT", 6, "CASEDIR: is a folder: expected a file"));
    return c.stream();
  }

  @BeforeAll
  static void buildStoreAndModel() throws IOException {
    store = shared.resolve("store");
    model = shared.resolve("model");
    MainRun ingest = MainRun.of("ingest", "--sales", TINY.resolve("sales.csv").toString(), "--calendar",
        TINY.resolve("calendar.csv").toString(), "--prices", TINY.resolve("prices.csv").toString(), "--store",
        store.toString(), "--quiet");
    assertEquals(0, ingest.exitCode(), ingest.err());
    MainRun train = MainRun.of("train", "--store", store.toString(), "--model", model.toString(), "--horizon", "2",
        "--lags", "2,3", "--windows", "2", "--rounds", "3", "--quiet");
    assertEquals(0, train.exitCode(), train.err());
    storeListing = listing(store);
    modelListing = listing(model);
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("cases")
  void shouldRefuseWithTheDocumentedExitCodeAndMessage(Case c) throws IOException {
    Path caseDir = Files.createDirectories(shared.resolve("case-" + Integer.toHexString(c.toString().hashCode())));
    Path file = caseDir.resolve(c.fileName());
    Files.write(file, c.content());
    if (c.command().contains("COPY")) {
      copyTree(store, caseDir.resolve("copy"));
    }
    List<String> args = new ArrayList<>();
    for (String word : c.command().split(" ")) {
      args.add(word.replace("FILE", file.toString()).replace("STORE", store.toString())
          .replace("MODEL", model.toString()).replace("COPY", caseDir.resolve("copy").toString())
          .replace("OUT", caseDir.resolve("out").toString())
          .replace("TINY", TINY.toString()).replace("CASEDIR", caseDir.toString()));
    }
    MainRun run = MainRun.of(args.toArray(new String[0]));
    String fragment = c.fragment().replace("CASEDIR", caseDir.toString()).replace("STORE", store.toString());
    assertEquals(c.exitCode(), run.exitCode(), c + "\n" + run.err());
    assertTrue(run.err().contains(fragment), c + ": expected the message to contain\n  " + fragment + "\nfound\n  "
        + run.err());
    // picocli reports a bad option value itself, without the "lagmill: " prefix
    String message = run.err().lines().filter(l -> l.startsWith("lagmill: ") || l.startsWith("Invalid value"))
        .findFirst().orElse("");
    assertFalse(message.isEmpty(), "one 'lagmill: ' line: " + run.err());
    assertFalse(run.err().contains("\tat "), "no stack trace: " + run.err());
    assertFalse(message.contains("internal error"), message);
    assertTrue(message.length() < 600, "a bounded message: " + message.length() + " characters");
    assertEquals(storeListing, listing(store), "the shared store is unchanged");
    assertEquals(modelListing, listing(model), "the shared model is unchanged");
  }

  private static void copyTree(Path from, Path to) throws IOException {
    try (Stream<Path> paths = Files.walk(from)) {
      for (Path p : paths.sorted().toList()) {
        Files.copy(p, to.resolve(from.relativize(p).toString()));
      }
    }
  }

  /** Every file under a folder with its size and CRC32, in name order. */
  private static String listing(Path dir) throws IOException {
    StringBuilder b = new StringBuilder();
    try (Stream<Path> files = Files.walk(dir)) {
      for (Path f : files.filter(Files::isRegularFile).sorted().toList()) {
        java.util.zip.CRC32 crc = new java.util.zip.CRC32();
        crc.update(Files.readAllBytes(f));
        b.append(dir.relativize(f)).append(' ').append(Files.size(f)).append(' ')
            .append(Long.toHexString(crc.getValue())).append('\n');
      }
    }
    return b.toString();
  }
}
