package org.lagmill.cli;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.PrintStream;
import java.lang.management.ManagementFactory;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.TimeUnit;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.store.StoreDirectories;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code lagmill cluster-local}: runs N ranks of a distributed command on this machine, for trying it out and for
 * tests. Each rank is a fresh JVM of the same build with its own temporary folder (lightgbm4j extracts its native
 * library under a fixed name there), the command's {@code {rank}} replaced by its rank and
 * {@code --machines 127.0.0.1:P0,… --rank K} appended; its output lines are prefixed {@code [rank K]}.
 */
@Command(name = "cluster-local", header = "Run N ranks of a distributed command on this machine (loopback).",
    mixinStandardHelpOptions = true,
    description = {"Start N ranks of COMMAND on 127.0.0.1, each in its own JVM: {rank} in COMMAND becomes the",
        "rank, and --machines (free ports) and --rank are appended. Output lines are prefixed with the rank; the",
        "exit code is 0 when every rank succeeds, else the first failing rank's code."},
    footer = {"", "Example:", "  lagmill cluster-local --workers 3 -- train --store shards/shard-{rank} \\",
        "      --model model --rounds 200"})
final class ClusterLocalCommand implements Callable<Integer> {
  /** What a rank's {@code {rank}} placeholder reads. */
  static final String RANK_PLACEHOLDER = "{rank}";

  @Option(names = "--workers", required = true, paramLabel = "N", description = "ranks to start, 2 to 16")
  int workers;

  @Option(names = "--grace-seconds", paramLabel = "S", defaultValue = "60", description = {"after a rank fails,",
      "how long the others may take to stop on their own before they are killed (default: ${DEFAULT-VALUE})"})
  int graceSeconds;

  @Parameters(arity = "1..*", paramLabel = "COMMAND", description = "the lagmill command each rank runs, after --")
  List<String> command;

  @Override
  public Integer call() throws Exception {
    if (workers < 2 || workers > 16) {
      throw new InvalidRequestException("--workers " + workers + " is outside 2..16");
    }
    if (graceSeconds < 1) {
      throw new InvalidRequestException("--grace-seconds must be >= 1, got " + graceSeconds);
    }
    String machines = freeLoopbackMachines(workers);
    Path temp = Files.createTempDirectory("lagmill-cluster-");
    List<Process> ranks = new ArrayList<>();
    List<Thread> pumps = new ArrayList<>();
    Thread killer = new Thread(() -> ranks.forEach(Process::destroyForcibly));
    Runtime.getRuntime().addShutdownHook(killer);
    try {
      for (int rank = 0; rank < workers; rank++) {
        List<String> args = new ArrayList<>();
        for (String arg : command) {
          args.add(arg.replace(RANK_PLACEHOLDER, Integer.toString(rank)));
        }
        args.addAll(List.of("--machines", machines, "--rank", Integer.toString(rank)));
        Path rankTemp = Files.createDirectories(temp.resolve("rank-" + rank));
        ProcessBuilder builder = new ProcessBuilder(childJvm(rankTemp, args));
        builder.environment().putIfAbsent("OMP_WAIT_POLICY", "PASSIVE");
        Process process = builder.start();
        ranks.add(process);
        pumps.add(pump(process.getInputStream(), System.out, rank));
        pumps.add(pump(process.getErrorStream(), System.err, rank));
      }
      int firstFailure = -1;
      int firstCode = ExitCodes.OK;
      boolean[] done = new boolean[workers];
      int running = workers;
      long killAt = Long.MAX_VALUE;
      while (running > 0) {
        for (int rank = 0; rank < workers; rank++) {
          if (!done[rank] && ranks.get(rank).waitFor(50, TimeUnit.MILLISECONDS)) {
            done[rank] = true;
            running--;
            int code = ranks.get(rank).exitValue();
            if (code != ExitCodes.OK && firstFailure < 0) {
              firstFailure = rank;
              firstCode = code;
              killAt = System.nanoTime() + TimeUnit.SECONDS.toNanos(graceSeconds);
            }
          }
        }
        if (System.nanoTime() > killAt) {
          for (int rank = 0; rank < workers; rank++) {
            if (!done[rank]) {
              System.err.println("lagmill: rank " + rank + " did not stop within " + graceSeconds + " s of rank "
                  + firstFailure + "'s failure; killing it");
              ranks.get(rank).destroyForcibly();
            }
          }
          killAt = Long.MAX_VALUE;
        }
      }
      for (Thread pump : pumps) {
        pump.join(5_000);
      }
      System.out.flush();
      if (firstFailure >= 0) {
        System.err.println("lagmill: rank " + firstFailure + " failed first, with exit code " + firstCode);
        return firstCode;
      }
      return ExitCodes.OK;
    } finally {
      for (Process process : ranks) {
        process.destroyForcibly();
        process.waitFor(10, TimeUnit.SECONDS);
      }
      Runtime.getRuntime().removeShutdownHook(killer);
      StoreDirectories.deleteRecursively(temp);
    }
  }

  /**
   * {@code 127.0.0.1:P,…}: ports the system handed out as free, each still free when chosen (held open until all are
   * chosen); rank 0's port + 1 (its exchange port) is checked free too. Another program may still take one before a
   * rank binds it: the rank then fails to bind and says so.
   */
  static String freeLoopbackMachines(int count) throws IOException {
    InetAddress loopback = InetAddress.getByName("127.0.0.1");
    List<ServerSocket> held = new ArrayList<>();
    try {
      StringBuilder machines = new StringBuilder();
      for (int rank = 0; rank < count; rank++) {
        while (true) {
          ServerSocket socket = new ServerSocket();
          socket.bind(new InetSocketAddress(loopback, 0));
          int port = socket.getLocalPort();
          if (port > 65533) {
            socket.close();
            continue;
          }
          held.add(socket);
          if (rank == 0) {
            try {
              ServerSocket next = new ServerSocket();
              next.bind(new InetSocketAddress(loopback, port + 1));
              held.add(next);
            } catch (IOException taken) {
              continue;
            }
          }
          machines.append(rank == 0 ? "" : ",").append("127.0.0.1:").append(port);
          break;
        }
      }
      return machines.toString();
    } finally {
      for (ServerSocket socket : held) {
        socket.close();
      }
    }
  }

  /** The command line of a JVM like this one (same java, flags and class path) running {@code lagmill args}. */
  static List<String> childJvm(Path tempDir, List<String> args) {
    List<String> line = new ArrayList<>();
    line.add(ProcessHandle.current().info().command().orElse(Path.of(System.getProperty("java.home"), "bin", "java")
        .toString()));
    for (String flag : ManagementFactory.getRuntimeMXBean().getInputArguments()) {
      if (!flag.startsWith("-Djava.io.tmpdir=") && !flag.startsWith("-agentlib:jdwp")
          && !flag.startsWith("-javaagent")) {
        line.add(flag);
      }
    }
    line.add("-Djava.io.tmpdir=" + tempDir);
    line.add("-cp");
    line.add(System.getProperty("java.class.path"));
    line.add(Main.class.getName());
    line.addAll(args);
    return line;
  }

  private static Thread pump(InputStream stream, PrintStream target, int rank) {
    Thread thread = new Thread(() -> {
      try (BufferedReader in = new BufferedReader(new InputStreamReader(stream, StandardCharsets.UTF_8))) {
        String line;
        while ((line = in.readLine()) != null) {
          synchronized (target) {
            target.println("[rank " + rank + "] " + line);
          }
        }
      } catch (IOException e) {
        synchronized (target) {
          target.println("[rank " + rank + "] (output ended: " + e.getMessage() + ")");
        }
      }
    }, "rank-" + rank + "-output");
    thread.setDaemon(true);
    thread.start();
    return thread;
  }
}
