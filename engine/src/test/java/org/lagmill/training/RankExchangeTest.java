package org.lagmill.training;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.ServerSocket;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;

/** Ranks as threads of one JVM on loopback: sums against a plain loop, gathers, refusals and a rank that leaves. */
class RankExchangeTest {
  private static final long MASTER_SEED = Long.getLong("lagmill.seed", 20240611L);
  private static final Duration TIMEOUT = Duration.ofSeconds(10);

  @Test
  void shouldGiveEveryRankTheSumsInRankOrderAndEveryRanksBytes() throws Exception {
    int rankCount = 4;
    ClusterSpec cluster = ClusterSpec.parse(machines(rankCount));
    Random random = new Random(MASTER_SEED);
    double[][] values = new double[rankCount][7];
    for (double[] row : values) {
      for (int i = 0; i < row.length; i++) {
        row[i] = random.nextGaussian() * Math.pow(10, random.nextInt(12));
      }
    }
    double[] expected = new double[7];
    for (int r = 0; r < rankCount; r++) {
      for (int i = 0; i < 7; i++) {
        expected[i] += values[r][i]; // the order rank 0 adds in: its own, then ranks 1, 2, 3
      }
    }
    ExecutorService pool = Executors.newFixedThreadPool(rankCount);
    try {
      List<Future<Object[]>> results = new ArrayList<>();
      for (int r = 0; r < rankCount; r++) {
        int rank = r;
        results.add(pool.submit(() -> {
          try (RankExchange exchange = RankExchange.join(cluster, rank, "same", TIMEOUT, m -> {})) {
            double[] sums = exchange.sum(values[rank], "test sums");
            List<byte[]> all = exchange.gather(("rank " + rank).getBytes(), "test gather");
            return new Object[] {sums, all};
          }
        }));
      }
      for (int r = 0; r < rankCount; r++) {
        Object[] result = results.get(r).get(30, TimeUnit.SECONDS);
        assertArrayEquals(expected, (double[]) result[0], 0, "seed " + MASTER_SEED + ", rank " + r);
        @SuppressWarnings("unchecked") List<byte[]> all = (List<byte[]>) result[1];
        for (int k = 0; k < rankCount; k++) {
          assertEquals("rank " + k, new String(all.get(k)));
        }
      }
    } finally {
      pool.shutdownNow();
    }
  }

  @Test
  void shouldRefuseARankThatTrainsSomethingElse() throws Exception {
    ClusterSpec cluster = ClusterSpec.parse(machines(2));
    ExecutorService pool = Executors.newFixedThreadPool(2);
    try {
      Future<?> zero = pool.submit(() -> RankExchange.join(cluster, 0, "split A\nrounds 10", TIMEOUT, m -> {}));
      Future<?> one = pool.submit(() -> RankExchange.join(cluster, 1, "split A\nrounds 20", TIMEOUT, m -> {}));
      Exception atZero = assertThrows(Exception.class, () -> zero.get(30, TimeUnit.SECONDS));
      assertEquals("rank 1 trains something else than rank 0: rank 0 has rounds 10, this one rounds 20; every rank "
          + "needs a shard of the same split and the same options", atZero.getCause().getMessage());
      Exception atOne = assertThrows(Exception.class, () -> one.get(30, TimeUnit.SECONDS));
      assertTrue(atOne.getCause().getMessage().startsWith("rank 0 refused this rank: rank 1 trains something else"),
          atOne.getCause().getMessage());
    } finally {
      pool.shutdownNow();
    }
  }

  @Test
  void shouldTellTheOthersWhenARankLeavesWithoutFinishing() throws Exception {
    ClusterSpec cluster = ClusterSpec.parse(machines(3));
    List<String> told = new CopyOnWriteArrayList<>();
    ExecutorService pool = Executors.newFixedThreadPool(3);
    try {
      List<Future<RankExchange>> joined = new ArrayList<>();
      for (int r = 0; r < 3; r++) {
        int rank = r;
        joined.add(pool.submit(() -> RankExchange.join(cluster, rank, "same", TIMEOUT,
            m -> told.add(rank + ": " + m))));
      }
      RankExchange zero = joined.get(0).get(30, TimeUnit.SECONDS);
      RankExchange one = joined.get(1).get(30, TimeUnit.SECONDS);
      RankExchange two = joined.get(2).get(30, TimeUnit.SECONDS);
      one.fail("disk full");
      long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
      while (told.size() < 2 && System.nanoTime() < deadline) {
        Thread.sleep(10);
      }
      assertTrue(told.contains("0: rank 1 failed: disk full"), told.toString());
      assertTrue(told.contains("2: rank 1 failed: disk full"), told.toString());
      RankFailureException waiting = assertThrows(RankFailureException.class,
          () -> zero.sum(new double[] {1}, "a sum"));
      assertEquals("rank 1 failed: disk full", waiting.getMessage());
      one.close();
      two.close();
      zero.close();
    } finally {
      pool.shutdownNow();
    }
  }

  @Test
  void shouldRejectMalformedMachineLists() {
    assertEquals("‹machines› entry 'localhost' is not host:port; expected e.g. 10.0.0.5:12400,10.0.0.6:12400",
        assertThrows(IllegalArgumentException.class, () -> ClusterSpec.parse("localhost,h:2000")).getMessage());
    assertEquals("‹machines› entry 'h:12401' repeats the port of rank 0 + 1 (rank 0's exchange port); give each rank "
        + "its own port",
        assertThrows(IllegalArgumentException.class,
            () -> ClusterSpec.parse("h:12400,h:12401")).getMessage());
    assertEquals("‹machines› lists 1 machines; expected 2 to 256 (one machine trains without ‹machines›)",
        assertThrows(IllegalArgumentException.class, () -> ClusterSpec.parse("h:12400")).getMessage());
  }

  private static String machines(int count) throws IOException {
    StringBuilder text = new StringBuilder();
    List<ServerSocket> held = new ArrayList<>();
    try {
      for (int r = 0; r < count; r++) {
        while (true) {
          ServerSocket socket = new ServerSocket(0);
          held.add(socket);
          if (r > 0) {
            text.append(',').append("127.0.0.1:").append(socket.getLocalPort());
            break;
          }
          try {
            held.add(new ServerSocket(socket.getLocalPort() + 1));
            text.append("127.0.0.1:").append(socket.getLocalPort());
            break;
          } catch (IOException taken) {
            // try another
          }
        }
      }
      return text.toString();
    } finally {
      for (ServerSocket socket : held) {
        socket.close();
      }
    }
  }
}
