package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.store.StoreGenerations;
import org.lagmill.store.StoreLock;
import picocli.CommandLine;

class StoreCommandsTest {
  @TempDir
  Path temp;

  private final StringWriter out = new StringWriter();
  private final StringWriter err = new StringWriter();

  private int run(String... args) {
    CommandLine cli = Main.commandLine();
    cli.setOut(new PrintWriter(out, true));
    cli.setErr(new PrintWriter(err, true));
    return cli.execute(args);
  }

  @Test
  void shouldIngestAppendAndInspectAStore() throws Exception {
    Path sales = temp.resolve("sales.csv");
    Files.writeString(sales, "item,store,2024-01-30,2024-01-31\na,s1,0,3\nb,s1,300,\n");
    Path next = temp.resolve("next.csv");
    Files.writeString(next, "store,item,2024-02-01\ns1,b,4\ns2,c,1\n");
    Path store = temp.resolve("store");
    assertEquals(0, run("ingest", "--sales", sales.toString(), "--store", store.toString(), "--quiet"), err.toString());
    assertEquals("", out.toString());
    assertEquals(0, run("append", "--store", store.toString(), "--sales", next.toString()), err.toString());
    assertTrue(out.toString().contains("3 series x 3 days (2024-01-30 .. 2024-02-01)"), out.toString());
    out.getBuffer().setLength(0);
    assertEquals(0, run("inspect", "--store", store.toString(), "--json"), err.toString());
    JsonNode json = new ObjectMapper().readTree(out.toString());
    assertEquals(3, json.get("seriesCount").asInt());
    assertEquals("2024-02-01", json.get("lastDate").asText());
    assertEquals(1, json.get("seriesCountByWidth").get("SHORT").asInt());
    assertEquals(3 * 3 * 8, json.get("int64ColumnBytes").asInt());
    out.getBuffer().setLength(0);
    assertEquals(0, run("inspect", "--store", store.toString()), err.toString());
    assertTrue(out.toString().contains("series by width       1 byte: 2  2 bytes: 1  4 bytes: 0"), out.toString());
  }

  @Test
  void shouldMapFailuresToExitCodes() throws Exception {
    Path bad = temp.resolve("bad.csv");
    Files.writeString(bad, "item,2024-01-01\na,-1\n");
    assertEquals(ExitCodes.BAD_INPUT,
        run("ingest", "--sales", bad.toString(), "--store", temp.resolve("s").toString()));
    assertEquals("lagmill: " + bad + ", line 2, column 2: expected a non-negative integer number of units, found "
        + "\"-1\"", err.toString().trim());
    assertEquals(ExitCodes.IO_ERROR, run("ingest", "--sales", temp.resolve("none.csv").toString(), "--store",
        temp.resolve("s").toString()));
    Path sales = temp.resolve("sales.csv");
    Files.writeString(sales, "item,2024-01-01\na,1\n");
    // A missing calendar or prices file is the same failure as a missing sales file: file not readable.
    for (String option : new String[] {"--calendar", "--prices"}) {
      err.getBuffer().setLength(0);
      Path missing = temp.resolve("none.CSV.GZ");
      assertEquals(ExitCodes.IO_ERROR, run("ingest", "--sales", sales.toString(), option, missing.toString(),
          "--store", temp.resolve("s").toString()), option);
      assertEquals("lagmill: no such file: " + missing, err.toString().trim(), option);
    }
    Path good = temp.resolve("good.csv");
    Files.writeString(good, "item,2024-01-01\na,1\n");
    Path store = temp.resolve("store");
    assertEquals(0, run("ingest", "--sales", good.toString(), "--store", store.toString(), "--quiet"));
    Path unitsFile = StoreGenerations.readableDir(store).resolve("units.bin");
    byte[] units = Files.readAllBytes(unitsFile);
    units[0] ^= 1;
    Files.write(unitsFile, units);
    assertEquals(ExitCodes.CORRUPT_STORE, run("inspect", "--store", store.toString()));
    assertEquals(ExitCodes.USAGE_ERROR,
        run("ingest", "--sales", good.toString(), "--store", temp.resolve("s2").toString(),
            "--memory-limit", "0"));
    assertEquals(0, run("ingest", "--help"));
    assertTrue(out.toString().contains("lagmill ingest --sales sales.csv.gz --store stores/chain"), out.toString());
  }

  @Test
  void shouldRefuseToIngestOverAnythingButAStoreItWasAskedToReplace() throws Exception {
    Path good = temp.resolve("good.csv");
    Files.writeString(good, "sku,2024-01-01\na,1\n");
    Path file = temp.resolve("notes.txt");
    Files.writeString(file, "mine");
    assertEquals(ExitCodes.IO_ERROR, run("ingest", "--sales", good.toString(), "--store", file.toString()));
    assertEquals("lagmill: refusing to write " + file.toAbsolutePath() + ": it is a file, not a store; nothing was "
        + "changed", err.toString().trim());
    assertEquals("mine", Files.readString(file));
    err.getBuffer().setLength(0);
    assertEquals(ExitCodes.IO_ERROR, run("ingest", "--sales", good.toString(), "--store", temp.toString(),
        "--replace"));
    assertTrue(err.toString().startsWith("lagmill: refusing to write " + temp.toAbsolutePath() + ": the folder "
        + "holds files that are not a lagmill store"), err.toString());
    Path store = temp.resolve("store");
    assertEquals(0, run("ingest", "--sales", good.toString(), "--store", store.toString(), "--quiet"));
    err.getBuffer().setLength(0);
    assertEquals(ExitCodes.IO_ERROR, run("ingest", "--sales", good.toString(), "--store", store.toString()));
    assertEquals("lagmill: refusing to write " + store.toAbsolutePath() + ": it already holds a store; nothing was "
        + "changed (replacing it must be asked for); pass --replace to replace it", err.toString().trim());
    assertEquals(0, run("ingest", "--sales", good.toString(), "--store", store.toString(), "--replace", "--quiet"));
  }

  @Test
  void shouldFailFastWithNoWaitWhileAnotherWriterHoldsTheStore() throws Exception {
    Path good = temp.resolve("good.csv");
    Files.writeString(good, "sku,2024-01-01\na,1\n");
    Path next = temp.resolve("next.csv");
    Files.writeString(next, "sku,2024-01-02\na,2\n");
    Path store = temp.resolve("store");
    assertEquals(0, run("ingest", "--sales", good.toString(), "--store", store.toString(), "--quiet"));
    try (StoreLock held = StoreLock.acquire(store, false, text -> {})) {
      assertEquals(ExitCodes.STORE_BUSY, run("append", "--store", store.toString(), "--sales", next.toString(),
          "--no-wait"));
      assertEquals("lagmill: store " + store.toAbsolutePath() + " is being changed by process "
          + ProcessHandle.current().pid() + "; try again when it has finished", err.toString().trim());
    }
    assertEquals(0, run("append", "--store", store.toString(), "--sales", next.toString(), "--no-wait"));
  }

  @Test
  void shouldTakeAWiderDateWindowAndRefuseAMalformedOne() throws Exception {
    Path old = temp.resolve("old.csv");
    Files.writeString(old, "sku,1890-06-01\na,1\n");
    assertEquals(ExitCodes.BAD_INPUT, run("ingest", "--sales", old.toString(), "--store",
        temp.resolve("a").toString()));
    assertEquals(ExitCodes.USAGE_ERROR, run("ingest", "--sales", old.toString(), "--store", temp.resolve("a")
        .toString(), "--date-window", "1800-01-01"));
    assertTrue(err.toString().contains("--date-window must be FROM..TO with ISO dates, e.g. 1800-01-01..2300-12-31, "
        + "got '1800-01-01'"), err.toString());
    assertEquals(0, run("ingest", "--sales", old.toString(), "--store", temp.resolve("a").toString(), "--date-window",
        "1800-01-01..2200-12-31", "--quiet"), err.toString());
  }
}
