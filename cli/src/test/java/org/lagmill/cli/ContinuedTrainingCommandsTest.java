package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.run.RunRecord;

/**
 * The weekly job on the continued route, end to end on a small store: a backtest whose origins continue from the
 * previous origin's model saves its last model, and {@code train --continue-from} adds the newest days to it; a
 * model of another spec and combined models are refused.
 */
class ContinuedTrainingCommandsTest {
  private static final String[] QUICK = {"--rounds", "30", "--deterministic", "--threads", "1"};

  @Test
  void shouldContinueTheFinalFitFromTheBacktestsLastModel(@TempDir Path dir) throws Exception {
    Path store = GeneratedScenario.generateAndIngest(dir.resolve("data"), dir.resolve("store"), 12, 420, 7, false);

    Path last = dir.resolve("last-origin");
    MainRun continued = MainRun.of(args("backtest", "--store", store.toString(), "--origins", "2", "--report",
        dir.resolve("bt-continued").toString(), "--continue-origins", "--save-last-model", last.toString(),
        "--json"));
    continued.expectOk();
    MainRun scratch = MainRun.of(args("backtest", "--store", store.toString(), "--origins", "2", "--report",
        dir.resolve("bt-scratch").toString(), "--json"));
    scratch.expectOk();
    JsonNode continuedOrigins = RunRecord.JSON.readTree(continued.out()).get("origins");
    JsonNode scratchOrigins = RunRecord.JSON.readTree(scratch.out()).get("origins");
    // the first origin has nothing to continue from: the same training, the same score
    assertEquals(scratchOrigins.get(0).get("model").get("wrmsse").asDouble(),
        continuedOrigins.get(0).get("model").get("wrmsse").asDouble(), continued.out());
    JsonNode first = continuedOrigins.get(0).get("partitions").get(0);
    JsonNode second = continuedOrigins.get(1).get("partitions").get(0);
    assertTrue(first.get("continuedFrom").isNull(), first.toString());
    assertEquals("the model of origin " + continuedOrigins.get(0).get("originDate").asText(),
        second.get("continuedFrom").asText(), second.toString());
    assertEquals(first.get("iterationCount").asInt(), second.get("startingRounds").asInt(), second.toString());
    assertEquals(second.get("startingRounds").asInt() + second.get("addedRounds").asInt(),
        second.get("iterationCount").asInt(), second.toString());

    String page = Files.readString(dir.resolve("bt-continued").resolve("report.html"));
    assertTrue(page.contains("This model continued from the model of origin " + continuedOrigins.get(0).get(
        "originDate").asText() + " (" + first.get("iterationCount").asInt() + " rounds)"), "the report says so");
    assertTrue(Files.isRegularFile(last.resolve("manifest.json")), "the last origin's model is saved");
    JsonNode lastManifest = RunRecord.JSON.readTree(last.resolve("manifest.json").toFile());
    assertEquals(second.get("iterationCount").asInt(), lastManifest.get("partitions").get(0).get("iterationCount")
        .asInt());

    Path finalModel = dir.resolve("final");
    MainRun trained = MainRun.of(args("train", "--store", store.toString(), "--model", finalModel.toString(),
        "--continue-from", last.toString()));
    trained.expectOk();
    int startingRounds = second.get("iterationCount").asInt();
    assertTrue(trained.out().contains("continued from " + last + " (" + startingRounds + " rounds), added "),
        trained.out());
    JsonNode run = RunRecord.JSON.readTree(finalModel.resolve("run.json").toFile());
    assertTrue(run.toString().contains("\"continueFrom\":\"" + last + "\""), run.toString());
    assertTrue(run.toString().contains("\"startingRounds\":" + startingRounds), run.toString());
    // the backtest saved the scores of the last origin's rows beside its model, and the final fit read them
    assertTrue(Files.isRegularFile(last.resolve("model.txt.row-scores")), "row scores saved beside the model");
    String scoresLine = run.path("results").path("startingRowScores").get(0).asText();
    assertTrue(scoresLine.matches("partition all: [1-9][0-9]* saved row scores read"), scoresLine);
    JsonNode finalManifest = RunRecord.JSON.readTree(finalModel.resolve("manifest.json").toFile());
    JsonNode finalPartition = finalManifest.get("partitions").get(0);
    assertEquals(last.toString(), finalPartition.get("continuedFrom").asText());
    assertEquals(startingRounds, finalPartition.get("startingRounds").asInt());
    // the saved model holds the starting model's trees first, unchanged
    List<String> startingTrees = trees(Files.readString(last.resolve("model.txt")));
    List<String> finalTrees = trees(Files.readString(finalModel.resolve("model.txt")));
    assertEquals(startingRounds, startingTrees.size());
    assertEquals(finalPartition.get("iterationCount").asInt(), finalTrees.size());
    assertEquals(startingTrees, finalTrees.subList(0, startingRounds));
    MainRun.of("forecast", "--store", store.toString(), "--model", finalModel.toString(), "--out",
        dir.resolve("f.csv").toString(), "--quiet").expectOk();
    MainRun described = MainRun.of("model", "--model", finalModel.toString());
    described.expectOk();
    assertTrue(described.out().contains("  continued from " + last + " (" + startingRounds + " rounds), added "),
        described.out());

    // another feature spec is refused before anything is written
    Path otherSpec = Files.writeString(dir.resolve("other.yaml"), "horizonDays: 28\nlagDays: [28, 35]\n"
        + "rollingWindowDays: [7]\n");
    MainRun refused = MainRun.of(args("train", "--store", store.toString(), "--model", dir.resolve("never")
        .toString(), "--continue-from", last.toString(), "--config", otherSpec.toString()));
    assertEquals(ExitCodes.USAGE_ERROR, refused.exitCode(), refused.err());
    assertTrue(refused.err().contains("the model to continue from (" + last + ") was trained on another feature "
        + "spec"), refused.err());
    assertFalse(Files.exists(dir.resolve("never")));

    // combined models are refused in words
    MainRun members = MainRun.of(args("backtest", "--store", store.toString(), "--origins", "2", "--report",
        dir.resolve("bt-members").toString(), "--continue-origins", "--member", otherSpec.toString(), "--member",
        otherSpec.toString()));
    assertEquals(ExitCodes.USAGE_ERROR, members.exitCode(), members.err());
    assertTrue(members.err().contains("--continue-origins works on one plan: combined models (members)"),
        members.err());
  }

  /** The model text's tree blocks, in order. */
  private static List<String> trees(String modelText) {
    String trees = modelText.substring(modelText.indexOf("\nTree=0"), modelText.indexOf("\nend of trees"));
    return Arrays.stream(trees.split("\nTree=")).filter(block -> !block.isBlank()).map(String::strip).toList();
  }

  private static String[] args(String... first) {
    String[] all = Arrays.copyOf(first, first.length + QUICK.length);
    System.arraycopy(QUICK, 0, all, first.length, QUICK.length);
    return all;
  }
}
