package org.lagmill.run;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Set;
import org.lagmill.io.OutputTargets;
import org.lagmill.report.HtmlReportWriter;
import org.lagmill.report.ReportData;
import org.lagmill.report.ReportJson;
import org.lagmill.report.RunInfo;
import org.lagmill.report.StageStats;

/** Writes a run's {@code report.json} and {@code report.html} side by side, its stage figures from the run's stages. */
public final class RunReport {
  public static final String JSON_FILE = "report.json";
  public static final String HTML_FILE = "report.html";
  /** Written by {@code backtest} into its report folder just before the report. */
  public static final String BACKTEST_FILE = "backtest.json";

  private RunReport() {}

  /** A report builder with the run's facts (time, version, command line, machine, store) filled in. */
  public static ReportData.Builder start(String title, String commandLine, String storePath) {
    return ReportData.builder(title).run(new RunInfo(Instant.now(), Versions.lagmill(), commandLine,
        Runtime.getRuntime().availableProcessors(), Runtime.getRuntime().maxMemory(), storePath));
  }

  /**
   * Adds the run's finished stages to the report.
   *
   * @param datasetBytesPerRow LightGBM Dataset bytes per row, shown beside training and backtest stages; or null
   */
  public static void addStages(ReportData.Builder report, RunRecord run, Double datasetBytesPerRow) {
    List<StageRecord> stages = run.stages();
    for (StageRecord stage : stages) {
      boolean training = stage.name().startsWith("train") || stage.name().startsWith("backtest");
      report.stage(new StageStats(stage.name(), stage.seconds(), stage.peakResidentBytes(), stage.offHeapBytes(),
          stage.rowCount() > 0 ? stage.rowCount() : null, stage.rowCount() > 0 ? stage.rowsPerSecond() : null,
          training ? datasetBytesPerRow : null));
    }
  }

  /**
   * Refuses a report folder that holds anything but a report lagmill wrote; call it before writing anything there.
   *
   * @throws org.lagmill.io.OutputRefusedException naming the folder and one of its files
   */
  public static void checkTarget(Path dir) throws IOException {
    OutputTargets.checkFolder(dir.toAbsolutePath().normalize(), "report folder",
        d -> Files.isRegularFile(d.resolve(JSON_FILE)) || Files.isRegularFile(d.resolve(HTML_FILE))
            || Files.isRegularFile(d.resolve(BACKTEST_FILE)),
        Set.of());
  }

  /** Writes both files into {@code dir} and returns the HTML path. */
  public static Path write(ReportData report, Path dir) throws IOException {
    checkTarget(dir);
    ReportJson.write(report, dir.resolve(JSON_FILE));
    Path html = dir.resolve(HTML_FILE);
    HtmlReportWriter.write(report, html);
    return html;
  }
}
