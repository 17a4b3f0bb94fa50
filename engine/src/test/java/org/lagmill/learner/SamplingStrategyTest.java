package org.lagmill.learner;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;
import org.lagmill.memory.MemoryBudget;

/**
 * Gradient-based one-side sampling reaches LightGBM: the parameters section LightGBM writes into the saved model
 * (its own record of what it trained with, LightGBM 4.3.0's model text format) names the strategy and drops bagging.
 */
class SamplingStrategyTest {
  private static final long MASTER_SEED = TestSeeds.master(77_313L);

  @TempDir
  Path folder;

  @Test
  void shouldTrainWithGossInsteadOfBaggingWhenAsked() throws Exception {
    for (boolean goss : new boolean[] {false, true}) {
      MatrixRowStream rows = MatrixRowStream.random(MASTER_SEED, 2_000, 4, 0);
      try (MemoryBudget budget = MemoryBudget.unlimited("test");
          TrainingDataset dataset = new DatasetBuilder(budget, DatasetParameters.defaults()).build(rows);
          TrainedModel model = new Trainer(TrainParameters.defaults().withObjective(Objective.REGRESSION)
              .withRounds(5, 0).withThreadCount(1).withGoss(goss)).train(dataset, TrainingListener.NONE)) {
        Path file = folder.resolve("model-" + goss + ".txt");
        model.saveTo(file);
        String text = Files.readString(file);
        assertTrue(text.contains("[data_sample_strategy: " + (goss ? "goss" : "bagging") + "]"), text.substring(
            text.indexOf("parameters:")));
        assertTrue(text.contains(goss ? "[bagging_freq: 0]" : "[bagging_freq: 1]"), "bagging only without goss");
        assertFalse(text.contains("tree_sizes=\n"), "trees were grown");
      }
    }
  }
}
