package org.lagmill.run;

import java.io.IOException;
import java.util.List;
import org.lagmill.training.TrainingPlan;

/**
 * The training plans of a run, once the store's period and the training cut are known: one plan without a name for a
 * single model, or the named members of a combination (each scored on its own and averaged by a backtest, trained one
 * after another and averaged by a forecast).
 */
@FunctionalInterface
public interface MemberPlans {
  /** One training plan, named as the user gave it (null for a single plan). */
  record Member(String name, TrainingPlan plan) {}

  /**
   * @param periodDays the store's step in days: specs left to defaults take the period's
   * @param cutIndex the store period index training may read up to
   */
  List<Member> plansFor(int periodDays, int cutIndex) throws IOException;

  /** Whether {@code members} is a combination rather than one plain plan. */
  static boolean combined(List<Member> members) {
    return members.size() > 1 || members.get(0).name() != null;
  }
}
