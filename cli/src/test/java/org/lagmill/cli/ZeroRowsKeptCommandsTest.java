package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code --zero-rows-kept} on train and backtest: what was dropped and the weight reach the console, run.json, the
 * manifest and the report; a share outside (0, 1] is refused before anything is written.
 */
class ZeroRowsKeptCommandsTest {
  private static final ObjectMapper JSON = new ObjectMapper();

  @Test
  void shouldSayWhatItDroppedEverywhereAndRefuseBadShares(@TempDir Path dir) throws IOException {
    Path store = GeneratedScenario.generateAndIngest(dir.resolve("scenario"), dir.resolve("S"), 30, 300, 5, false);

    Path model = dir.resolve("M");
    MainRun trained = MainRun.of("train", "--store", store.toString(), "--model", model.toString(), "--rounds", "5",
        "--deterministic", "--threads", "1", "--zero-rows-kept", "0.25");
    trained.expectOk();
    assertTrue(trained.out().contains("training rows with zero sales") && trained.out().contains("each kept one "
        + "weighs 4.0"), trained.out());
    JsonNode manifest = JSON.readTree(Files.readString(model.resolve("manifest.json")));
    assertEquals(0.25, manifest.get("zeroRowsKept").asDouble());
    JsonNode partition = JSON.readTree(model.resolve("run.json").toFile()).get("results").get("partitions").get(0);
    assertTrue(partition.get("droppedZeroRowCount").asLong() > 0, partition.toString());
    assertEquals(4.0, partition.get("zeroRowWeight").asDouble(), partition.toString());
    MainRun described = MainRun.of("model", "--model", model.toString());
    described.expectOk();
    assertTrue(described.out().contains("zero-sales rows kept 0.25 (each weighted 4.0)"), described.out());

    Path backtest = dir.resolve("BT");
    MainRun backtested = MainRun.of("backtest", "--store", store.toString(), "--origins", "2", "--rounds", "5",
        "--deterministic", "--threads", "1", "--report", backtest.toString(), "--zero-rows-kept", "0.5");
    backtested.expectOk();
    assertTrue(backtested.out().contains("training over the 2 origins dropped "), backtested.out());
    JsonNode report = JSON.readTree(backtest.resolve("report.json").toFile()).get("report").get("training");
    assertTrue(report.get("rowNotice").asText().startsWith("Training dropped "), report.toString());
    assertTrue(Files.readString(backtest.resolve("report.html")).contains("Training dropped "));

    for (String bad : new String[] {"0", "-0.5", "1.5", "NaN"}) {
      Path refused = dir.resolve("refused");
      MainRun run = MainRun.of("train", "--store", store.toString(), "--model", refused.toString(),
          "--zero-rows-kept", bad);
      assertEquals(2, run.exitCode(), run.err());
      assertTrue(run.err().contains("--zero-rows-kept must be a share in (0, 1] of the training rows with zero sales"
          + " to keep, got "), run.err());
      assertFalse(Files.exists(refused.resolve("manifest.json")), bad);
    }
  }
}
