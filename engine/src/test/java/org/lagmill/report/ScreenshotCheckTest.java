package org.lagmill.report;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Color;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import org.junit.jupiter.api.Test;

/** The screenshot check on drawn images, without a browser: blank pages and missing charts fail. */
class ScreenshotCheckTest {

  @Test
  void shouldFailOnABlankPage() {
    BufferedImage white = page();
    AssertionError e = assertThrows(AssertionError.class, () -> ScreenshotCheck.assertReportRendered(white, 1, 0));
    assertTrue(e.getMessage().startsWith("the page looks blank"), e.getMessage());
  }

  @Test
  void shouldCountOneClusterPerChart() {
    BufferedImage image = page();
    Graphics2D g = image.createGraphics();
    g.setColor(new Color(0x1a1a1a));
    g.fillRect(100, 100, 1000, 400);
    g.setColor(Color.WHITE);
    g.fillRect(110, 110, 980, 380);
    g.setColor(Color.decode(SvgCharts.MODEL_COLOUR));
    g.fillRect(750, 200, 200, 14);
    g.fillRect(750, 400, 200, 3);
    g.setColor(new Color(199, 224, 238));
    g.fillRect(760, 300, 200, 40);
    g.fillRect(760, 420, 200, 5);
    g.dispose();
    ScreenshotCheck.assertReportRendered(image, 2, 1);
    AssertionError e = assertThrows(AssertionError.class, () -> ScreenshotCheck.assertReportRendered(image, 3, 1));
    assertTrue(e.getMessage().contains("chart clusters 2 [200-213 400-402 ]"), e.getMessage());
  }

  private static BufferedImage page() {
    BufferedImage image = new BufferedImage(1200, 1000, BufferedImage.TYPE_INT_RGB);
    Graphics2D g = image.createGraphics();
    g.setColor(Color.WHITE);
    g.fillRect(0, 0, 1200, 1000);
    g.dispose();
    return image;
  }
}
