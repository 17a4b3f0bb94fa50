package org.lagmill.learner;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.net.InetAddress;
import java.net.ServerSocket;
import java.net.Socket;
import org.junit.jupiter.api.Test;

/** The port check before a distributed training refuses what LightGBM's own bind would refuse. */
class LearnerNetworkPortTest {
  @Test
  void aPortHeldByAListenerIsRefusedAndNamed() throws IOException {
    try (ServerSocket held = new ServerSocket(0, 1, InetAddress.getLoopbackAddress())) {
      int port = held.getLocalPort();
      LearnerNetwork.PortUnavailableException e = assertThrows(LearnerNetwork.PortUnavailableException.class,
          () -> LearnerNetwork.requireBindable(port));
      assertEquals(port, e.port());
    }
  }

  @Test
  void aPortWhoseConnectionWasJustClosedByItsListenerIsRefused() throws IOException {
    // The side that closes first keeps its end in TIME-WAIT: the state a re-run of a finished training meets.
    int port;
    try (ServerSocket listener = new ServerSocket(0, 1, InetAddress.getLoopbackAddress());
        Socket client = new Socket(InetAddress.getLoopbackAddress(), listener.getLocalPort())) {
      port = listener.getLocalPort();
      try (Socket accepted = listener.accept()) {
        accepted.getOutputStream().write(1);
      }
      client.getInputStream().read();
    }
    int closedPort = port;
    assertThrows(LearnerNetwork.PortUnavailableException.class, () -> LearnerNetwork.requireBindable(closedPort));
  }

  @Test
  void aFreePortPasses() throws IOException {
    int port;
    try (ServerSocket probe = new ServerSocket(0, 1, InetAddress.getLoopbackAddress())) {
      port = probe.getLocalPort();
    }
    assertDoesNotThrow(() -> LearnerNetwork.requireBindable(port));
  }
}
