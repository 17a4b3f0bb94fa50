package org.lagmill.training;

import java.io.BufferedInputStream;
import java.io.BufferedOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.EOFException;
import java.io.IOException;
import java.net.ConnectException;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.net.SocketTimeoutException;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.TimeUnit;
import java.util.function.Consumer;
import org.lagmill.io.Setting;

/**
 * lagmill's own small channel between the ranks of a distributed training, beside LightGBM's network: a star of TCP
 * connections from every rank to rank 0, which listens on {@link ClusterSpec#exchangePort()}. It carries what
 * LightGBM does not: the check that every rank trains the same thing, sums over ranks (row counts, the validation
 * loss after every iteration, pooled dispersion) and gathers (model checksums, dispersion rows).
 *
 * <p>Every collective is rank 0 collecting one message from each rank, computing in rank order and answering, so
 * every rank gets bit-identical sums. Each rank reads its connection on a daemon thread: a connection that closes
 * without the goodbye message (the rank died or was killed) or a rank's failure message is reported at once to the
 * {@code onPeerLost} handler, even while this rank's main thread is blocked inside LightGBM, whose own sockets would
 * otherwise wait (or spin) for the dead rank. Waiting for a collective is bounded by the time-out. Not thread-safe
 * apart from that reader thread; one instance per rank.
 */
public final class RankExchange implements AutoCloseable {
  private static final int HELLO = 1;
  private static final int WELCOME = 2;
  private static final int REFUSED = 3;
  private static final int VALUES = 4;
  private static final int BLOB = 5;
  private static final int FAILED = 6;
  private static final int GOODBYE = 7;
  private static final long CONNECT_RETRY_MILLIS = 200;

  private final int rank;
  private final int rankCount;
  private final Duration timeout;
  private final List<Peer> peers;
  private final ServerSocket server;
  private final Consumer<String> onPeerLost;
  private volatile boolean closing;

  /** One connection: to rank 0 from a worker, or to worker {@code rank} on rank 0. */
  private final class Peer {
    final int peerRank;
    final Socket socket;
    final DataOutputStream out;
    final DataInputStream in;
    final BlockingQueue<Object[]> inbox = new LinkedBlockingQueue<>();
    volatile boolean saidGoodbye;

    Peer(int peerRank, Socket socket) throws IOException {
      this.peerRank = peerRank;
      this.socket = socket;
      this.out = new DataOutputStream(new BufferedOutputStream(socket.getOutputStream()));
      this.in = new DataInputStream(new BufferedInputStream(socket.getInputStream()));
    }

    void startReading() {
      Thread reader = new Thread(this::readLoop, "rank-exchange-" + rank + "-from-" + peerRank);
      reader.setDaemon(true);
      reader.start();
    }

    private void readLoop() {
      try {
        socket.setSoTimeout(0);
        while (true) {
          int type = in.readInt();
          switch (type) {
            case VALUES -> {
              int count = in.readInt();
              double[] values = new double[count];
              for (int i = 0; i < count; i++) {
                values[i] = in.readDouble();
              }
              inbox.add(new Object[] {values});
            }
            case BLOB -> {
              byte[] bytes = new byte[in.readInt()];
              in.readFully(bytes);
              inbox.add(new Object[] {bytes});
            }
            case FAILED -> {
              String message = in.readUTF();
              inbox.add(new Object[] {new RankFailureException(message)});
              lost(message);
              return;
            }
            case GOODBYE -> {
              saidGoodbye = true;
              return;
            }
            default -> throw new IOException("unexpected message type " + type);
          }
        }
      } catch (IOException e) {
        if (closing || saidGoodbye) {
          return;
        }
        String message = "rank " + peerRank + " closed its connection without finishing (it failed or was killed: "
            + (e instanceof EOFException ? "end of stream" : e.getMessage()) + "); see that rank's log";
        inbox.add(new Object[] {new RankFailureException(message)});
        lost(message);
      }
    }

    void send(int type, double[] values, byte[] bytes, String text) throws IOException {
      synchronized (out) {
        out.writeInt(type);
        if (type == VALUES) {
          out.writeInt(values.length);
          for (double v : values) {
            out.writeDouble(v);
          }
        } else if (type == BLOB) {
          out.writeInt(bytes.length);
          out.write(bytes);
        } else if (type == FAILED) {
          out.writeUTF(text.length() > 8000 ? text.substring(0, 8000) : text);
        }
        out.flush();
      }
    }

    Object take(String what) {
      try {
        Object[] message = inbox.poll(timeout.toMillis(), TimeUnit.MILLISECONDS);
        if (message == null) {
          throw new RankFailureException("rank " + peerRank + " sent nothing for " + timeout.toSeconds() + " s while "
              + "this rank waited for " + what + " (time-out; raise " + Setting.RANK_TIMEOUT
              + " for very uneven ranks)");
        }
        if (message[0] instanceof RankFailureException failure) {
          throw failure;
        }
        return message[0];
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        throw new RankFailureException("interrupted while waiting for rank " + peerRank, e);
      }
    }
  }

  private RankExchange(int rank, int rankCount, Duration timeout, List<Peer> peers, ServerSocket server,
      Consumer<String> onPeerLost) {
    this.rank = rank;
    this.rankCount = rankCount;
    this.timeout = timeout;
    this.peers = peers;
    this.server = server;
    this.onPeerLost = onPeerLost;
  }

  /**
   * Connects every rank: rank 0 waits for each other rank's hello (its rank and {@code identity}) and answers all of
   * them once every rank has come, refusing any whose identity differs from its own; the others connect to rank 0,
   * retrying until the time-out.
   *
   * @param identity what every rank must agree on (features, training windows, parameters, split), compared as text
   * @param timeout bound on every wait: the rendezvous and each collective
   * @param onPeerLost told, from a reader thread, when another rank dies or fails; a command ends the process there
   * @throws RankFailureException when a rank does not come within the time-out, or its identity differs
   */
  public static RankExchange join(ClusterSpec cluster, int rank, String identity, Duration timeout,
      Consumer<String> onPeerLost) throws IOException {
    int rankCount = cluster.rankCount();
    long deadline = System.nanoTime() + timeout.toNanos();
    if (rank == 0) {
      ServerSocket server = new ServerSocket();
      server.setReuseAddress(true);
      server.bind(new InetSocketAddress(cluster.host(0), cluster.exchangePort()));
      Peer[] byRank = new Peer[rankCount];
      RankExchange exchange = new RankExchange(0, rankCount, timeout, new ArrayList<>(), server, onPeerLost);
      try {
        for (int connected = 1; connected < rankCount; connected++) {
          int leftMillis = (int) Math.max(1, (deadline - System.nanoTime()) / 1_000_000);
          server.setSoTimeout(leftMillis);
          Socket socket;
          try {
            socket = server.accept();
          } catch (SocketTimeoutException e) {
            List<Integer> missing = new ArrayList<>();
            for (int r = 1; r < rankCount; r++) {
              if (byRank[r] == null) {
                missing.add(r);
              }
            }
            throw new RankFailureException("ranks " + missing + " of " + rankCount + " did not connect to rank 0 ("
                + cluster.host(0) + ":" + cluster.exchangePort() + ") within " + timeout.toSeconds() + " s; start "
                + "every rank with the same " + Setting.MACHINES + " list");
          }
          socket.setSoTimeout(leftMillis);
          socket.setTcpNoDelay(true);
          Peer peer = exchange.new Peer(-1, socket);
          int type = peer.in.readInt();
          int peerRank = peer.in.readInt();
          int peerCount = peer.in.readInt();
          String peerIdentity = peer.in.readUTF();
          if (type != HELLO || peerRank < 1 || peerRank >= rankCount || peerCount != rankCount
              || byRank[peerRank] != null) {
            String why = "a connection announced itself as rank " + peerRank + " of " + peerCount + "; expected "
                + "each of ranks 1.." + (rankCount - 1) + " of " + rankCount + " once";
            peer.send(REFUSED, null, null, null);
            peer.out.writeUTF(why);
            peer.out.flush();
            socket.close();
            throw new RankFailureException(why);
          }
          Peer named = exchange.new Peer(peerRank, socket);
          byRank[peerRank] = named;
          if (!identity.equals(peerIdentity)) {
            String why = "rank " + peerRank + " trains something else than rank 0: " + firstDifference(identity,
                peerIdentity) + "; every rank needs a shard of the same split and the same options";
            named.send(REFUSED, null, null, null);
            named.out.writeUTF(why);
            named.out.flush();
            throw new RankFailureException(why);
          }
        }
        for (int r = 1; r < rankCount; r++) {
          byRank[r].send(WELCOME, null, null, null);
          exchange.peers.add(byRank[r]);
          byRank[r].startReading();
        }
        return exchange;
      } catch (IOException | RuntimeException e) {
        for (Peer peer : byRank) {
          if (peer != null) {
            peer.socket.close();
          }
        }
        server.close();
        throw e;
      }
    }
    Socket socket = connect(cluster, deadline, timeout);
    RankExchange exchange = new RankExchange(rank, rankCount, timeout, new ArrayList<>(), null, onPeerLost);
    try {
      Peer peer = exchange.new Peer(0, socket);
      synchronized (peer.out) {
        peer.out.writeInt(HELLO);
        peer.out.writeInt(rank);
        peer.out.writeInt(rankCount);
        peer.out.writeUTF(identity);
        peer.out.flush();
      }
      socket.setSoTimeout((int) Math.max(1, timeout.toMillis()));
      int answer;
      try {
        answer = peer.in.readInt();
      } catch (SocketTimeoutException e) {
        throw new RankFailureException("rank 0 did not let this rank start within " + timeout.toSeconds() + " s: "
            + "some rank did not connect (see rank 0's log)");
      } catch (EOFException e) {
        throw new RankFailureException("rank 0 closed the connection before training started (see rank 0's log)");
      }
      if (answer == REFUSED) {
        throw new RankFailureException("rank 0 refused this rank: " + peer.in.readUTF());
      }
      if (answer != WELCOME) {
        throw new RankFailureException("rank 0 answered " + answer + ", expected a welcome");
      }
      exchange.peers.add(peer);
      peer.startReading();
      return exchange;
    } catch (IOException | RuntimeException e) {
      socket.close();
      throw e;
    }
  }

  private static Socket connect(ClusterSpec cluster, long deadline, Duration timeout) throws IOException {
    InetSocketAddress address = new InetSocketAddress(cluster.host(0), cluster.exchangePort());
    while (true) {
      Socket socket = new Socket();
      try {
        socket.connect(address, (int) Math.max(1, Math.min(5_000, (deadline - System.nanoTime()) / 1_000_000)));
        socket.setTcpNoDelay(true);
        return socket;
      } catch (ConnectException | SocketTimeoutException e) {
        socket.close();
        if (System.nanoTime() > deadline) {
          throw new RankFailureException("rank 0 (" + address.getHostString() + ":" + address.getPort() + ") did "
              + "not accept a connection within " + timeout.toSeconds() + " s; is it running?");
        }
        try {
          Thread.sleep(CONNECT_RETRY_MILLIS);
        } catch (InterruptedException interrupted) {
          Thread.currentThread().interrupt();
          throw new RankFailureException("interrupted while connecting to rank 0", interrupted);
        }
      }
    }
  }

  private static String firstDifference(String expected, String actual) {
    String[] a = expected.split("\n");
    String[] b = actual.split("\n");
    for (int i = 0; i < Math.max(a.length, b.length); i++) {
      String left = i < a.length ? a[i] : "(nothing)";
      String right = i < b.length ? b[i] : "(nothing)";
      if (!left.equals(right)) {
        return "rank 0 has " + left + ", this one " + right;
      }
    }
    return "the same text";
  }

  public int rank() {
    return rank;
  }

  public int rankCount() {
    return rankCount;
  }

  /**
   * Element-wise sums over every rank, added in rank order on rank 0 and sent back, so every rank gets the same bits.
   *
   * @param what names the collective in a time-out message
   */
  public double[] sum(double[] local, String what) throws IOException {
    if (rank != 0) {
      Peer zero = peers.get(0);
      zero.send(VALUES, local, null, null);
      double[] result = (double[]) zero.take(what);
      if (result.length != local.length) {
        throw new RankFailureException("rank 0 answered " + result.length + " values for " + what + ", expected "
            + local.length);
      }
      return result;
    }
    double[] total = local.clone();
    for (Peer peer : peers) {
      double[] values = (double[]) peer.take(what);
      if (values.length != total.length) {
        throw new RankFailureException("rank " + peer.peerRank + " sent " + values.length + " values for " + what
            + ", expected " + total.length + "; the ranks are out of step");
      }
      for (int i = 0; i < total.length; i++) {
        total[i] += values[i];
      }
    }
    for (Peer peer : peers) {
      peer.send(VALUES, total, null, null);
    }
    return total;
  }

  /**
   * Every rank's bytes, in rank order, on every rank (through rank 0).
   *
   * @param what names the collective in a time-out message
   */
  public List<byte[]> gather(byte[] local, String what) throws IOException {
    if (rank != 0) {
      Peer zero = peers.get(0);
      zero.send(BLOB, null, local, null);
      List<byte[]> all = new ArrayList<>();
      for (int r = 0; r < rankCount; r++) {
        all.add((byte[]) zero.take(what));
      }
      return all;
    }
    List<byte[]> all = new ArrayList<>();
    all.add(local);
    for (Peer peer : peers) {
      all.add((byte[]) peer.take(what));
    }
    for (Peer peer : peers) {
      for (byte[] bytes : all) {
        peer.send(BLOB, null, bytes, null);
      }
    }
    return all;
  }

  /** Tells the other ranks that this one failed (a worker tells rank 0, which passes it on). */
  public void fail(String message) {
    String text = "rank " + rank + " failed: " + message;
    for (Peer peer : peers) {
      try {
        peer.send(FAILED, null, null, text);
      } catch (IOException ignored) {
        // the peer is gone already; its own reader reports that
      }
    }
  }

  private void lost(String message) {
    if (closing) {
      return;
    }
    if (rank == 0) {
      // the other workers hear it from rank 0, so every rank stops with the first cause
      for (Peer peer : peers) {
        try {
          peer.send(FAILED, null, null, message);
        } catch (IOException ignored) {
          // already gone
        }
      }
    }
    onPeerLost.accept(message);
  }

  /**
   * Says goodbye to every connected rank and closes; idempotent. Rank 0 waits (at most 5 s) for each worker's goodbye
   * first, so it leaves last and no worker takes its leaving for a death. Best effort: a peer already gone is skipped.
   */
  @Override
  public void close() throws IOException {
    if (closing) {
      return;
    }
    closing = true;
    for (Peer peer : peers) {
      try {
        peer.send(GOODBYE, null, null, null);
        long until = System.nanoTime() + TimeUnit.SECONDS.toNanos(5);
        while (rank == 0 && !peer.saidGoodbye && System.nanoTime() < until) {
          Thread.sleep(10);
        }
      } catch (IOException e) {
        // the peer left first; nothing to tell it
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      } finally {
        peer.socket.close();
      }
    }
    if (server != null) {
      server.close();
    }
  }
}
