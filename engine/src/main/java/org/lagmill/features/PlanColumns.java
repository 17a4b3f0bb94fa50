package org.lagmill.features;

import java.util.List;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;
import org.lagmill.store.PlanTable;

/** The one rule for which plan columns a feature spec reads from a history's plan, and the error when one is gone. */
public final class PlanColumns {
  private PlanColumns() {}

  /** The spec's plan columns, or every column of {@code plan} when the spec leaves them unset. */
  public static List<String> of(FeatureSpec spec, PlanTable plan) {
    return spec.planColumns() == null ? plan.columnNames() : spec.planColumns();
  }

  /**
   * The plan's index of each column, in the given order.
   *
   * @throws InvalidRequestException naming the first column the plan lacks, its columns and what to do
   */
  public static int[] indexesIn(PlanTable plan, List<String> columns) {
    int[] indexes = new int[columns.size()];
    for (int k = 0; k < indexes.length; k++) {
      indexes[k] = plan.columnIndex(columns.get(k));
      if (indexes[k] >= 0) {
        continue;
      }
      if (plan.isEmpty()) {
        throw new InvalidRequestException("the features read plan columns " + String.join(", ", columns)
            + " but the store holds no plan; ingest or append one with those columns ("
            + Setting.Command.APPEND + " " + Setting.STORE + " DIR " + Setting.PLAN + " FILE)");
      }
      throw new InvalidRequestException("the features read plan column '" + columns.get(k) + "', which the "
          + "store's plan does not have (its columns: " + String.join(", ", plan.columnNames()) + "); append a plan"
          + " with that column (" + Setting.Command.APPEND + " " + Setting.STORE + " DIR " + Setting.PLAN
          + " FILE) or train again");
    }
    return indexes;
  }
}
