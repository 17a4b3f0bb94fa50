package org.lagmill.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

class ProbeResultTest {
  private static final ProbeResult STREAM = new ProbeResult("stream", 8_812_345, 23, 150L << 20, 700L << 20,
      1_200L << 20, 690L << 20, 7.25, 0.5, 30.125, 12.0, 2, 10_500_000, 400_000, 0.375);

  @Test
  void shouldReadBackTheLineItPrints() {
    List<String> log = List.of("[LightGBM] [Warning] something", STREAM.toLine(), "stream: 10 rounds trained");
    assertEquals(STREAM, ProbeResult.findIn(log).orElseThrow());
  }

  @Test
  void shouldTakeTheLastResultLine() {
    ProbeResult later = new ProbeResult("floor", 1, 1, 1, 2, 3, 4, 0.1, 0.2, 0.3, 0.4, 2, 0, 1, 0.05);
    assertEquals(later, ProbeResult.findIn(List.of(STREAM.toLine(), later.toLine())).orElseThrow());
  }

  @Test
  void shouldFindNothingWhenTheProbeDiedEarly() {
    assertTrue(ProbeResult.findIn(List.of("Exception in thread \"main\" java.lang.OutOfMemoryError")).isEmpty());
    assertTrue(ProbeResult.findIn(List.of()).isEmpty());
  }

  @Test
  void shouldRejectACutResultLine() {
    String cut = STREAM.toLine().substring(0, 40);
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> ProbeResult.findIn(List.of("ok", cut)));
    assertTrue(e.getMessage().startsWith("line 2 starts with 'FOOTPRINT' but holds no valid probe result"),
        e.getMessage());
  }

  @Test
  void shouldWriteFieldsByNameWithAPrefix() {
    String line = new ProbeResult("baseline", 0, 0, 5, 6, 7, 8, 0, 0, 0, 0, 0, 0, 0, 0).toLine();
    assertEquals("FOOTPRINT {\"mode\":\"baseline\",\"rowCount\":0,\"featureCount\":0,\"peakBeforeDatasetBytes\":5,"
        + "\"peakAfterDatasetBytes\":6,\"peakAfterTrainingBytes\":7,\"residentAfterDatasetBytes\":8,"
        + "\"sourceSeconds\":0.0,\"sampleSeconds\":0.0,\"datasetSeconds\":0.0,\"trainSeconds\":0.0,"
        + "\"sourcePassCount\":0,\"storeOffHeapBytes\":0,\"samplePassRowCount\":0,\"samplePassSourceSeconds\":0.0}",
        line);
  }
}
