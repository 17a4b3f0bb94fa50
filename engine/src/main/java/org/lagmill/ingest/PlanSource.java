package org.lagmill.ingest;

import java.nio.file.Path;
import java.util.Objects;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;

/**
 * A plan file and the names of its time columns ({@link PlanFileReader}).
 *
 * @param file the plan CSV (optionally {@code .gz})
 * @param dateColumn the column of a plan whose rows hold for one period ({@code --plan-date-column})
 * @param fromColumn the column of a plan whose rows hold until the next row ({@code --plan-from-column})
 */
public record PlanSource(Path file, String dateColumn, String fromColumn) {
  public PlanSource {
    Objects.requireNonNull(file, "file");
    ColumnNames.requireName(dateColumn, Setting.PLAN_DATE_COLUMN, PlanFileReader.DEFAULT_DATE_COLUMN);
    ColumnNames.requireName(fromColumn, Setting.PLAN_FROM_COLUMN, PlanFileReader.DEFAULT_FROM_COLUMN);
    if (dateColumn.equals(fromColumn)) {
      throw new InvalidRequestException(Setting.PLAN_DATE_COLUMN + " and " + Setting.PLAN_FROM_COLUMN
          + " both name '" + dateColumn
          + "'; they must differ, since the column's name tells how long a row holds");
    }
  }

  /** A plan file with the default column names {@code date} and {@code from}. */
  public static PlanSource of(Path file) {
    return new PlanSource(file, PlanFileReader.DEFAULT_DATE_COLUMN, PlanFileReader.DEFAULT_FROM_COLUMN);
  }
}
