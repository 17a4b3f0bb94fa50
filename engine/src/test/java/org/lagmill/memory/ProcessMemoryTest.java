package org.lagmill.memory;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

class ProcessMemoryTest {
  @Test
  void shouldParseKibFieldsOfProcStatus() {
    // layout as in proc(5): "VmRSS:" then spaces or a tab, the number, " kB"
    List<String> status = List.of("Name:\tjava", "VmHWM:\t  204800 kB", "VmRSS:\t  102400 kB");
    assertEquals(102_400L * 1024, ProcessMemory.parseKibField(status, "VmRSS:"));
    assertEquals(204_800L * 1024, ProcessMemory.parseKibField(status, "VmHWM:"));
    assertEquals(ProcessMemory.UNAVAILABLE, ProcessMemory.parseKibField(status, "VmSwap:"));
  }

  @Test
  void shouldReadThisProcessesResidentMemory() {
    long resident = ProcessMemory.residentBytes();
    long peak = ProcessMemory.peakResidentBytes();
    if (resident == ProcessMemory.UNAVAILABLE) {
      return;
    }
    // a running JVM holds at least a few MB, and the peak is never below the current size
    assertTrue(resident > 4L << 20, "resident " + resident);
    assertTrue(peak >= resident, "peak " + peak + " < resident " + resident);
  }
}
