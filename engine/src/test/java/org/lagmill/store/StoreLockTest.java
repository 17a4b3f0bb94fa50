package org.lagmill.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** One writer at a time, within a process and across processes; a killed holder releases the lock. */
class StoreLockTest {
  @TempDir
  Path temp;

  @Test
  void shouldRefuseASecondWriterInTheSameProcessWhenNotWaiting() throws Exception {
    Path dir = temp.resolve("store");
    try (StoreLock first = StoreLock.acquire(dir, false, text -> {})) {
      StoreBusyException e = assertThrows(StoreBusyException.class, () -> StoreLock.acquire(dir, false, t -> {}));
      assertEquals("store " + dir.toAbsolutePath() + " is being changed by process " + ProcessHandle.current().pid()
          + "; try again when it has finished", e.getMessage());
      assertNull(StoreLock.tryAcquire(dir));
    }
    try (StoreLock again = StoreLock.tryAcquire(dir)) {
      assertNotNull(again, "free again once the first writer released it");
    }
  }

  @Test
  void shouldMakeASecondWriterWaitAndSaySo() throws Exception {
    Path dir = temp.resolve("store");
    List<String> notices = new ArrayList<>();
    CountDownLatch waiting = new CountDownLatch(1);
    StoreLock first = StoreLock.acquire(dir, false, text -> {});
    Thread second = new Thread(() -> {
      try (StoreLock lock = StoreLock.acquire(dir, true, text -> {
        notices.add(text);
        waiting.countDown();
      })) {
        notices.add("acquired");
      } catch (Exception e) {
        notices.add("failed: " + e);
      }
    });
    second.start();
    assertTrue(waiting.await(10, TimeUnit.SECONDS));
    first.close();
    second.join(10_000);
    assertEquals(List.of("waiting for another writer to finish with store " + dir.toAbsolutePath() + " (process "
        + ProcessHandle.current().pid() + "); use ‹no-wait› to fail at once instead", "acquired"), notices);
  }

  @Test
  void shouldHoldOffAnotherProcessUntilItIsKilled() throws Exception {
    Path dir = temp.resolve("store");
    Process holder = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-cp",
        System.getProperty("java.class.path"), LockHolderMain.class.getName(), dir.toString())
        .redirectErrorStream(true).start();
    try {
      BufferedReader out = new BufferedReader(new InputStreamReader(holder.getInputStream(), StandardCharsets.UTF_8));
      assertEquals("locked", out.readLine());
      StoreBusyException e = assertThrows(StoreBusyException.class, () -> StoreLock.acquire(dir, false, t -> {}));
      assertTrue(e.getMessage().contains("process " + holder.pid()), e.getMessage());
      assertNull(StoreLock.tryAcquire(dir));
      holder.destroyForcibly();
      assertTrue(holder.waitFor(30, TimeUnit.SECONDS));
      // The kernel dropped the dead process's lock: no stale lock file to clear by hand.
      try (StoreLock lock = StoreLock.acquire(dir, false, t -> {})) {
        assertNotNull(lock);
      }
    } finally {
      holder.destroyForcibly();
    }
  }
}
