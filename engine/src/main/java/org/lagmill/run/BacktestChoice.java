package org.lagmill.run;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.eval.CombinedBacktestResult;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;

/**
 * What a backtest of several members chose, read back from its {@code backtest.json}: the member with the lowest mean
 * WRMSSE, or all of them when their average scored lowest. Training from it ships exactly what the backtest measured.
 *
 * @param memberNames the members to train, as the backtest named them (spec files, optionally {@code @ATTRIBUTE})
 * @param chosenName the chosen member's name, or {@link CombinedBacktestResult#COMBINATION_NAME}
 * @param meanWrmsse the chosen forecaster's mean WRMSSE over the backtest's origins
 */
public record BacktestChoice(List<String> memberNames, String chosenName, double meanWrmsse) {
  public BacktestChoice {
    memberNames = List.copyOf(memberNames);
  }

  /** Reads the choice of the backtest whose report folder is {@code reportDir}. */
  public static BacktestChoice read(Path reportDir) throws IOException {
    Path file = reportDir.resolve(RunReport.BACKTEST_FILE);
    if (!Files.isRegularFile(file)) {
      throw new NoSuchFileException(file.toString(), null, "no backtest result: give the folder "
          + Setting.Command.BACKTEST + " " + Setting.REPORT + " wrote");
    }
    JsonNode root = RunRecord.JSON.readTree(file.toFile());
    JsonNode names = root.path("memberNames");
    if (!names.isArray() || names.size() < 2 || !root.path("chosenName").isTextual()) {
      throw new InvalidRequestException(file + " holds a backtest of one spec, not a choice between members; "
          + "backtest two or more with " + Setting.MEMBER + " SPEC (or train that spec with " + Setting.CONFIG
          + ")");
    }
    List<String> all = new ArrayList<>();
    names.forEach(name -> all.add(name.asText()));
    String chosen = root.path("chosenName").asText();
    JsonNode score;
    List<String> toTrain;
    if (chosen.equals(CombinedBacktestResult.COMBINATION_NAME)) {
      toTrain = all;
      score = root.path("combination").path("meanModelWrmsse");
    } else {
      int index = all.indexOf(chosen);
      if (index < 0) {
        throw new InvalidRequestException(file + ": the chosen member '" + chosen + "' is not among its members "
            + all);
      }
      toTrain = List.of(chosen);
      score = root.path("members").path(index).path("meanModelWrmsse");
    }
    return new BacktestChoice(toTrain, chosen, score.asDouble(Double.NaN));
  }
}
