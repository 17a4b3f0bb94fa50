package org.lagmill.cli;

import picocli.CommandLine.IVersionProvider;

/** Reports the jar's implementation version and the Java runtime. */
public final class VersionProvider implements IVersionProvider {
  @Override
  public String[] getVersion() {
    String version = Main.class.getPackage().getImplementationVersion();
    return new String[] {"lagmill " + (version == null ? "development build" : version),
        "Java " + System.getProperty("java.version") + " (" + System.getProperty("java.vendor") + ")"};
  }
}
