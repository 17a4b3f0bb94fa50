package org.lagmill.training;

import java.util.ArrayList;
import java.util.List;
import org.lagmill.io.InvalidRequestException;
import org.lagmill.io.Setting;

/**
 * The machines of a distributed training, in rank order, as {@code --machines host:port,host:port,…} gives them:
 * rank {@code k} listens for LightGBM's network on the {@code k}-th entry's port, and rank 0 also listens for
 * lagmill's own {@link RankExchange} on its port + 1. Immutable.
 */
public final class ClusterSpec {
  /** Most ranks one training accepts. */
  public static final int MAX_RANK_COUNT = 256;

  private final List<String> hosts;
  private final int[] ports;

  private ClusterSpec(List<String> hosts, int[] ports) {
    this.hosts = hosts;
    this.ports = ports;
  }

  /**
   * @param machines {@code host:port} entries joined by commas, at least 2, each port in {@code [1024, 65534]}
   * @throws InvalidRequestException for a malformed entry, a repeated entry, or fewer than 2 entries
   */
  public static ClusterSpec parse(String machines) {
    List<String> hosts = new ArrayList<>();
    List<Integer> ports = new ArrayList<>();
    for (String entry : machines.split(",", -1)) {
      String text = entry.strip();
      int colon = text.lastIndexOf(':');
      if (colon <= 0 || colon == text.length() - 1) {
        throw new InvalidRequestException(Setting.MACHINES + " entry '" + text + "' is not host:port; expected e.g. "
            + "10.0.0.5:12400,10.0.0.6:12400");
      }
      int port;
      try {
        port = Integer.parseInt(text.substring(colon + 1));
      } catch (NumberFormatException e) {
        throw new InvalidRequestException(
            Setting.MACHINES + " entry '" + text + "' has port '" + text.substring(colon + 1)
                + "'; expected a number in [1024, 65534]");
      }
      if (port < 1024 || port > 65534) {
        throw new InvalidRequestException(Setting.MACHINES + " entry '" + text + "' has port " + port + "; expected "
            + "[1024, 65534] (rank 0 also uses the next port)");
      }
      String host = text.substring(0, colon);
      for (int i = 0; i < hosts.size(); i++) {
        if (hosts.get(i).equals(host) && (ports.get(i) == port || ports.get(i) + 1 == port && i == 0)) {
          throw new InvalidRequestException(Setting.MACHINES + " entry '" + text + "' repeats the port of rank " + i
              + (ports.get(i) == port ? "" : " + 1 (rank 0's exchange port)") + "; give each rank its own port");
        }
      }
      hosts.add(host);
      ports.add(port);
    }
    if (hosts.size() < 2 || hosts.size() > MAX_RANK_COUNT) {
      throw new InvalidRequestException(Setting.MACHINES + " lists " + hosts.size() + " machines; expected 2 to "
          + MAX_RANK_COUNT + " (one machine trains without " + Setting.MACHINES + ")");
    }
    return new ClusterSpec(List.copyOf(hosts), ports.stream().mapToInt(Integer::intValue).toArray());
  }

  public int rankCount() {
    return hosts.size();
  }

  public String host(int rank) {
    return hosts.get(rank);
  }

  /** The port rank {@code rank} listens on for LightGBM's network. */
  public int port(int rank) {
    return ports[rank];
  }

  /** The port rank 0 listens on for the {@link RankExchange}: its LightGBM port + 1. */
  public int exchangePort() {
    return ports[0] + 1;
  }

  /** The list as LightGBM's {@code machines} parameter takes it. */
  public String machines() {
    StringBuilder text = new StringBuilder();
    for (int r = 0; r < hosts.size(); r++) {
      text.append(r == 0 ? "" : ",").append(hosts.get(r)).append(':').append(ports[r]);
    }
    return text.toString();
  }

  /** @throws InvalidRequestException when {@code rank} is outside the list */
  public void checkRank(int rank) {
    if (rank < 0 || rank >= hosts.size()) {
      throw new InvalidRequestException(Setting.RANK + " " + rank + " is outside 0.." + (hosts.size() - 1) + " of the "
          + hosts.size() + " machines listed");
    }
  }
}
