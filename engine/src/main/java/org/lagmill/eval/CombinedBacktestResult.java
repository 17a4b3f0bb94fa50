package org.lagmill.eval;

import com.fasterxml.jackson.annotation.JsonProperty;
import java.util.List;

/**
 * A backtest of several members on the same origins: each member's scores and those of their plain average.
 *
 * @param memberNames one per member, in the order given
 * @param members each member's backtest, with the same baselines
 * @param combination the backtest of the mean of the members' forecasts
 */
public record CombinedBacktestResult(List<String> memberNames, List<BacktestResult> members,
    BacktestResult combination) {
  /** Name the combination is reported under. */
  public static final String COMBINATION_NAME = "average of members";

  public CombinedBacktestResult {
    memberNames = List.copyOf(memberNames);
    members = List.copyOf(members);
  }

  /** The member, or the combination, with the lowest mean WRMSSE over origins (a tie keeps the earlier; members first). */
  @JsonProperty("chosenName")
  public String chosenName() {
    String best = COMBINATION_NAME;
    double bestScore = combination.meanModelWrmsse();
    for (int m = members.size() - 1; m >= 0; m--) {
      if (members.get(m).meanModelWrmsse() <= bestScore) {
        bestScore = members.get(m).meanModelWrmsse();
        best = memberNames.get(m);
      }
    }
    return best;
  }

  /** The backtest of {@link #chosenName()}. */
  public BacktestResult chosen() {
    String name = chosenName();
    return name.equals(COMBINATION_NAME) ? combination : members.get(memberNames.indexOf(name));
  }
}
