package org.lagmill.cli;

import java.nio.file.Path;
import org.lagmill.ingest.SalesInputs;
import org.lagmill.ingest.SalesInputs.SideFile;
import picocli.CommandLine.Mixin;

/**
 * The options {@code ingest} and {@code append} share about their input files: column names, the sales file's shape
 * and the plan file. Each command declares the sales, calendar, prices and closures files itself, since what they do
 * differs (create versus replace).
 */
final class InputOptions {
  @Mixin
  ColumnOptions columns;

  @Mixin
  SalesShapeOptions shape;

  @Mixin
  PlanOptions plan;

  /** The files given (each may be null) and how to read them. */
  SalesInputs inputs(Path sales, Path calendar, Path prices, Path closures) {
    return SalesInputs.of(sales).withColumns(columns.names()).withSalesFormat(shape.format())
        .withMissingRows(shape.missingRows()).with(SideFile.CALENDAR, calendar).with(SideFile.PRICES, prices)
        .with(SideFile.CLOSURES, closures).withPlan(plan.source());
  }
}
