package org.lagmill.store;

import java.nio.file.Path;

/** A separate process for {@link StoreLockTest}: takes a store's lock, says so on stdout, then waits to be killed. */
public final class LockHolderMain {
  private LockHolderMain() {}

  public static void main(String[] args) throws Exception {
    StoreLock lock = StoreLock.acquire(Path.of(args[0]), false, text -> {});
    System.out.println("locked");
    System.out.flush();
    Thread.sleep(120_000);
    lock.close();
  }
}
