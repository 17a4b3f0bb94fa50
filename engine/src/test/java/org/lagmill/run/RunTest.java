package org.lagmill.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.memory.MemoryBudget;
import org.lagmill.memory.MemoryBudgetExceededException;

/** Stages record what they measured; a leak names its stage; run.json holds the stages as recorded. */
class RunTest {
  @TempDir
  Path temp;

  @Test
  void shouldRecordEachStageWithTheRunsPeakWhileItRan() {
    try (Run run = Run.unlimited("test")) {
      MemoryBudget store = run.budget().child("store");
      store.reserve(1_000);
      try (Stage stage = run.stage("ingest")) {
        stage.budget().reserve(300);
        stage.budget().release(300);
        stage.addRows(7).addRows(5);
      }
      try (Stage stage = run.stage("train")) {
        stage.budget().reserve(20);
        stage.budget().release(20);
      }
      store.release(1_000);
      List<StageRecord> stages = run.record().stages();
      assertEquals(List.of("ingest", "train"), stages.stream().map(StageRecord::name).toList());
      assertEquals(1_300, stages.get(0).offHeapBytes());
      assertEquals(12, stages.get(0).rowCount());
      assertEquals(1_020, stages.get(1).offHeapBytes());
      assertEquals(0, stages.get(1).rowCount());
      assertTrue(stages.get(0).seconds() >= 0 && stages.get(1).seconds() >= 0);
    }
  }

  @Test
  void shouldNameTheStageThatLeaks() {
    try (Run run = Run.unlimited("test")) {
      Stage stage = run.stage("features");
      stage.budget().reserve(64);
      IllegalStateException e = assertThrows(IllegalStateException.class, stage::close);
      assertEquals("budget lagmill/features closed while still holding 64 bytes: an owner of off-heap memory in this"
          + " stage was not closed", e.getMessage());
      assertEquals(1, run.record().stages().size());
      stage.budget().release(64);
    }
  }

  @Test
  void shouldHoldAStageToItsOwnLimitAndTheRunToItsLimit() {
    try (Run run = Run.start("test", 1_000)) {
      try (Stage stage = run.stage("learner", 100)) {
        assertThrows(MemoryBudgetExceededException.class, () -> stage.budget().reserve(101));
      }
      try (Stage stage = run.stage("other")) {
        assertThrows(MemoryBudgetExceededException.class, () -> stage.budget().reserve(1_001));
      }
    }
  }

  @Test
  void shouldFailClosingARunThatStillHoldsBytes() {
    Run run = Run.unlimited("test");
    MemoryBudget store = run.budget().child("store");
    store.reserve(8);
    IllegalStateException e = assertThrows(IllegalStateException.class, run::close);
    assertEquals("budget lagmill closed while still holding 8 bytes: an owner of off-heap memory in this stage was"
        + " not closed", e.getMessage());
  }

  @Test
  void shouldWriteTheRecordedStagesAndTheLightGbmVersionFromTheJar() throws IOException {
    try (Run run = Run.unlimited("test")) {
      try (Stage stage = run.stage("only")) {
        stage.addRows(3);
      }
      run.record().configure("k", "v").result("r", 1);
      run.record().write(temp);
    }
    JsonNode json = RunRecord.JSON.readTree(temp.resolve(RunRecord.FILE_NAME).toFile());
    assertEquals("test", json.path("command").asText());
    assertEquals("only", json.path("stages").path(0).path("name").asText());
    assertEquals(3, json.path("stages").path(0).path("rowCount").asLong());
    assertEquals("v", json.path("configuration").path("k").asText());
    // lightgbm4j's release numbers are LightGBM's plus a build suffix: 4.3.0-1 bundles LightGBM 4.3.0.
    assertTrue(json.path("versions").path("lightgbm").asText().matches("\\d+\\.\\d+\\.\\d+ \\(lightgbm4j "
        + "\\d+\\.\\d+\\.\\d+-\\d+\\)"), json.path("versions").toString());
  }
}
