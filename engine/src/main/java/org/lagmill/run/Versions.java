package org.lagmill.run;

/** The lagmill version a run records, from the jar's manifest. */
public final class Versions {
  private Versions() {}

  /** {@code Implementation-Version} of the jar holding the engine, or "development build" outside a released jar. */
  public static String lagmill() {
    String version = Versions.class.getPackage().getImplementationVersion();
    return version == null ? "development build" : version;
  }
}
