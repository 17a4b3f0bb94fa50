package org.lagmill.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.lagmill.TestSeeds;

/**
 * Renders the report in a real headless browser (Debian's chromium; skipped where it is not installed, CI installs
 * it) and checks the screenshot: the page is drawn and every chart shows. The negative cases prove the check fails
 * when the charts are missing. The screenshot of the full report is kept in target/report-render/ for a human look.
 */
class ReportRenderBrowserTest {
  private static final Path CHROMIUM = Path.of("/usr/bin/chromium");
  private static final long SEED = TestSeeds.master(20240527L);
  private static final long TIMEOUT_SECONDS = 60;
  private static final Pattern SVG = Pattern.compile("<svg .*?</svg>", Pattern.DOTALL);

  @BeforeAll
  static void requireChromium() {
    Assumptions.assumeTrue(Files.isExecutable(CHROMIUM), "chromium is not installed at " + CHROMIUM);
  }

  @Test
  void shouldShowEveryChartOfTheReport(@TempDir Path dir) throws Exception {
    ReportData report = SampleReports.full(SEED);
    Path html = dir.resolve("report.html");
    HtmlReportWriter.write(report, html);
    int chartCount = svgCount(Files.readString(html));
    assertEquals(10, chartCount, "storage, memory, validation, importance, horizon, three series and two driver "
        + "charts");
    Path png = screenshot(html, dir);
    Path kept = Path.of("target", "report-render", "report.png");
    Files.createDirectories(kept.getParent());
    Files.copy(png, kept, StandardCopyOption.REPLACE_EXISTING);
    // driver charts keep the model's blue out of their bars (it would read as a forecast line), so only the others
    // are counted by their model-colour pixels
    ScreenshotCheck.assertReportRendered(read(png), chartCount - report.drivers().size(), report.series().size());
  }

  @Test
  void shouldFailTheCheckWhenChartsAreMissing(@TempDir Path dir) throws Exception {
    ReportData report = SampleReports.full(SEED);
    String full = HtmlReportWriter.render(report);
    int chartCount = svgCount(full) - report.drivers().size();
    Path none = dir.resolve("no-charts.html");
    Files.writeString(none, SVG.matcher(full).replaceAll(""));
    BufferedImage withoutCharts = read(screenshot(none, dir));
    AssertionError e = assertThrows(AssertionError.class,
        () -> ScreenshotCheck.assertReportRendered(withoutCharts, chartCount, 3));
    assertTrue(e.getMessage().startsWith("expected 8 charts drawn in the model colour"), e.getMessage());

    Matcher m = SVG.matcher(full);
    int lastStart = -1;
    int lastEnd = -1;
    while (m.find()) {
      lastStart = m.start();
      lastEnd = m.end();
    }
    Path oneMissing = dir.resolve("one-chart-missing.html");
    Files.writeString(oneMissing, full.substring(0, lastStart) + full.substring(lastEnd));
    BufferedImage withoutLast = read(screenshot(oneMissing, dir));
    e = assertThrows(AssertionError.class, () -> ScreenshotCheck.assertReportRendered(withoutLast, chartCount, 3));
    assertTrue(e.getMessage().contains("chart clusters 7"), e.getMessage());
  }

  private static int svgCount(String html) {
    return (int) SVG.matcher(html).results().count();
  }

  private static BufferedImage read(Path png) throws IOException {
    BufferedImage image = ImageIO.read(png.toFile());
    if (image == null) {
      throw new AssertionError("not a readable PNG: " + png);
    }
    return image;
  }

  /** Runs chromium once, bounded by a timeout, and returns the screenshot it wrote. */
  static Path screenshot(Path html, Path workDir) throws IOException, InterruptedException {
    Path profile = Files.createTempDirectory(workDir, "chromium-profile");
    Path png = workDir.resolve(html.getFileName() + ".png");
    Path log = workDir.resolve(html.getFileName() + ".chromium.log");
    // the window is tall enough for the whole sample report; the check verifies the page's end is inside it
    List<String> command = List.of(CHROMIUM.toString(), "--headless", "--no-sandbox", "--disable-gpu",
        "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update",
        "--disable-sync", "--user-data-dir=" + profile, "--hide-scrollbars", "--window-size=1200,14000",
        "--screenshot=" + png, html.toAbsolutePath().toUri().toString());
    ProcessBuilder pb = new ProcessBuilder(command).redirectErrorStream(true).redirectOutput(log.toFile());
    pb.environment().put("HOME", profile.toString());
    pb.environment().put("XDG_CONFIG_HOME", profile.resolve("config").toString());
    pb.environment().put("XDG_CACHE_HOME", profile.resolve("cache").toString());
    Process process = pb.start();
    try {
      if (!process.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS)) {
        throw new AssertionError("chromium did not finish within " + TIMEOUT_SECONDS + " s; log: " + tail(log));
      }
      if (process.exitValue() != 0 || !Files.isRegularFile(png)) {
        throw new AssertionError("chromium exited with " + process.exitValue() + " and wrote "
            + (Files.isRegularFile(png) ? "a" : "no") + " screenshot; log: " + tail(log));
      }
    } finally {
      process.descendants().forEach(ProcessHandle::destroyForcibly);
      process.destroyForcibly();
      process.waitFor(10, TimeUnit.SECONDS);
    }
    return png;
  }

  private static String tail(Path log) throws IOException {
    String text = Files.exists(log) ? Files.readString(log) : "(none)";
    return text.length() > 2000 ? text.substring(text.length() - 2000) : text;
  }
}
