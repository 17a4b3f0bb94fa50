package org.lagmill.cli;

import java.util.List;
import picocli.CommandLine.Option;

/** {@code --show SERIES_ID,…}: the series a report charts besides its aggregates. */
final class ShownSeriesOption {
  @Option(names = "--show", split = ",", paramLabel = "SERIES_ID", description = "series to chart in the report")
  List<String> seriesIds = List.of();
}
