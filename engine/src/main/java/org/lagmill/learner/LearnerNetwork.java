package org.lagmill.learner;

import com.microsoft.ml.lightgbm.lightgbmlib;

/**
 * LightGBM's own socket network between the ranks of one distributed training ({@code LGBM_NetworkInit}): while it is
 * open, Datasets built here agree their bin boundaries with every rank and Boosters with a distributed tree learner
 * ({@link TreeLearner}) reduce their histograms over it. LightGBM keeps one network per process, so at most one
 * instance is open at a time.
 *
 * <p>Lifetime: open before building the Datasets, close ({@code LGBM_NetworkFree}) after the last Booster is done;
 * idempotent. Not thread-safe.
 */
public final class LearnerNetwork implements AutoCloseable {
  private static final java.util.concurrent.atomic.AtomicBoolean ANY_OPEN = new java.util.concurrent.atomic.AtomicBoolean();
  private boolean closed;

  private LearnerNetwork() {}

  /** The port LightGBM would listen on cannot be bound now; {@link #port()} names it. */
  public static final class PortUnavailableException extends RuntimeException {
    private static final long serialVersionUID = 1L;
    private final int port;

    PortUnavailableException(int port, java.io.IOException cause) {
      super("port " + port + " cannot be bound: " + cause.getMessage(), cause);
      this.port = port;
    }

    public int port() {
      return port;
    }
  }

  /**
   * Fails fast when {@code localPort} cannot be bound the way LightGBM binds it: without address reuse, so a port
   * whose last connection closed less than about a minute ago (TCP TIME-WAIT) counts as taken, as it does for
   * LightGBM. Checked before the minutes of feature pass that precede {@link #join}, whose own failure would only
   * say "Binding port failed" after them.
   *
   * @throws PortUnavailableException when the bind fails
   */
  public static void requireBindable(int localPort) {
    try (java.net.ServerSocket socket = new java.net.ServerSocket()) {
      socket.setReuseAddress(false);
      socket.bind(new java.net.InetSocketAddress(localPort));
    } catch (java.io.IOException e) {
      throw new PortUnavailableException(localPort, e);
    }
  }

  /**
   * Joins the network; returns once every listed machine is connected (LightGBM retries for up to
   * {@code timeoutMinutes}).
   *
   * @param machines {@code host:port,host:port,…} of every rank, in rank order; LightGBM finds this process's own
   *     entry by its local address and {@code localPort}
   * @param localPort the port this rank listens on (its own entry's port)
   * @param timeoutMinutes LightGBM's socket time-out in minutes (at least 1), for connecting and for every receive
   * @param machineCount the number of entries, at least 2
   * @throws LearnerException when LightGBM cannot bind the port or reach the others
   */
  public static LearnerNetwork join(String machines, int localPort, int timeoutMinutes,
      int machineCount) {
    if (machineCount < 2) {
      throw new IllegalArgumentException("a network needs at least 2 machines, got " + machineCount);
    }
    if (timeoutMinutes < 1) {
      throw new IllegalArgumentException("timeoutMinutes must be >= 1, got " + timeoutMinutes);
    }
    if (!ANY_OPEN.compareAndSet(false, true)) {
      throw new IllegalStateException("LightGBM keeps one network per process and one is open already");
    }
    try {
      NativeLibrary.load();
      Native.check(lightgbmlib.LGBM_NetworkInit(machines, localPort, timeoutMinutes, machineCount),
          "LGBM_NetworkInit(" + machines + ", local port " + localPort + ")");
    } catch (RuntimeException | Error e) {
      ANY_OPEN.set(false);
      throw e;
    }
    return new LearnerNetwork();
  }

  @Override
  public synchronized void close() {
    if (!closed) {
      closed = true;
      try {
        Native.check(lightgbmlib.LGBM_NetworkFree(), "LGBM_NetworkFree");
      } finally {
        ANY_OPEN.set(false);
      }
    }
  }
}
