package org.lagmill.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.store.CorruptStoreException;

/** report.json: what is written reads back equal, is strict JSON, and a wrong file is refused by name. */
class ReportJsonTest {
  private static final long SEED = TestSeeds.master(77L);

  @Test
  void shouldReadBackAnEqualReport(@TempDir Path dir) throws Exception {
    ReportData report = SampleReports.full(SEED);
    Path file = dir.resolve("run/report.json");
    ReportJson.write(report, file);
    ReportData read = ReportJson.read(file);
    assertEquals(report, read, "seed " + SEED);
    assertEquals(HtmlReportWriter.render(report), HtmlReportWriter.render(read), "the HTML rebuilds identically");
    try (Stream<Path> files = Files.list(file.getParent())) {
      assertEquals(List.of(file), files.toList(), "no temporary file is left behind");
    }
  }

  @Test
  void shouldReadBackAnEmptyReportAndSpecialValues(@TempDir Path dir) throws Exception {
    ReportData empty = ReportData.builder("empty").caution("Review before use.").build();
    Path file = dir.resolve("empty.json");
    ReportJson.write(empty, file);
    assertEquals(empty, ReportJson.read(file));

    double[] values = {Double.NaN, 0.0, -0.0, 1e-300, Double.MAX_VALUE, Double.POSITIVE_INFINITY,
        Double.NEGATIVE_INFINITY, Double.NaN};
    ReportData special = ReportData.builder("special")
        .horizon(new HorizonErrors("RMSSE", values, List.of(new HorizonErrors.NamedCurve("naive", values.clone()))))
        .series(new SeriesChart("one day", List.of(LocalDate.of(2024, 2, 29)), new double[] {Double.NaN},
            new double[] {3.5}, null, null, null, null, 0))
        .build();
    ReportJson.write(special, file);
    ReportData read = ReportJson.read(file);
    assertEquals(special, read);
    assertEquals(Double.doubleToRawLongBits(-0.0), Double.doubleToRawLongBits(read.horizon().model()[2]),
        "negative zero survives");
  }

  @Test
  void shouldWriteStrictJsonWithNullForUnknownDays() throws Exception {
    ReportData report = SampleReports.full(SEED);
    String json = ReportJson.toJson(report);
    assertFalse(json.contains("NaN"), "NaN is not JSON");
    // a mapper with jackson's defaults refuses non-standard tokens such as NaN: the file is strict JSON
    JsonNode tree = new ObjectMapper().readTree(json);
    assertEquals(1, tree.get("formatVersion").asInt());
    JsonNode actual = tree.get("report").get("series").get(0).get("actual");
    assertTrue(actual.get(report.series().get(0).dates().size() - 1).isNull(), "a future day is null");
    assertEquals("2024-05-26", tree.get("report").get("data").get("lastDate").asText());
    assertEquals("2024-05-27T06:15:00Z", tree.get("report").get("run").get("created").asText());
    assertTrue(json.contains("\n  \"report\""), "pretty printed");
  }

  @Test
  void shouldRefuseAnotherFormatVersion(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("report.json");
    Files.writeString(file, "{\"formatVersion\": 2, \"report\": {\"title\": \"t\", \"caution\": \"c\"}}");
    CorruptStoreException e = assertThrows(CorruptStoreException.class, () -> ReportJson.read(file));
    assertEquals(file + ": report format version: expected 1, actual 2", e.getMessage());
  }

  @Test
  void shouldRefuseBrokenJsonNamingFileAndLine(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("report.json");
    Files.writeString(file, "{\n  \"formatVersion\": 1,\n  \"report\": {\"title\": \"t\",, }\n}");
    CorruptStoreException e = assertThrows(CorruptStoreException.class, () -> ReportJson.read(file));
    assertTrue(e.getMessage().startsWith(file + ": not a readable lagmill report: "), e.getMessage());
    assertTrue(e.getMessage().contains("(line 3, column"), e.getMessage());
  }

  @Test
  void shouldRefuseAReportWithoutTitle(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("report.json");
    Files.writeString(file, "{\"formatVersion\": 1, \"report\": {\"caution\": \"c\"}}");
    CorruptStoreException e = assertThrows(CorruptStoreException.class, () -> ReportJson.read(file));
    assertTrue(e.getMessage().contains("title must be a non-blank text, got null"), e.getMessage());
  }
}
