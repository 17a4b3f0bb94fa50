package org.lagmill.scenario;

import java.nio.file.Path;
import java.util.List;

/**
 * What one {@link ScenarioGenerator#write} produced.
 *
 * @param files the files written, in the order sales, calendar, prices, plan, closures
 * @param seriesCount number of sales rows
 * @param dayCount number of sales days simulated per row
 * @param periodDays days per written period (1 daily, 7 weekly)
 * @param itemDayCount item-days simulated (series times days)
 * @param fileBytes total size of the files on disk in bytes (compressed size when gzipped)
 */
public record ScenarioSummary(List<Path> files, int seriesCount, int dayCount, int periodDays, long itemDayCount,
    long fileBytes) {
  public ScenarioSummary {
    files = List.copyOf(files);
  }
}
