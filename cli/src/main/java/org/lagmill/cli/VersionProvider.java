package org.lagmill.cli;

import org.lagmill.run.Versions;
import picocli.CommandLine.IVersionProvider;

/** Reports the jar's implementation version and the Java runtime. */
public final class VersionProvider implements IVersionProvider {
  @Override
  public String[] getVersion() {
    return new String[] {"lagmill " + Versions.lagmill(),
        "Java " + System.getProperty("java.version") + " (" + System.getProperty("java.vendor") + ")"};
  }
}
