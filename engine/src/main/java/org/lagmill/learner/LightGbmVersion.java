package org.lagmill.learner;

import io.github.metarank.lightgbm4j.LGBMBooster;
import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;

/**
 * The LightGBM version a run uses, read from the binding's jar ({@code META-INF/maven/.../pom.properties}) instead of
 * being written down by hand. lightgbm4j numbers its releases after the LightGBM release it bundles plus a build
 * suffix ({@code 4.3.0-1} bundles LightGBM 4.3.0).
 */
public final class LightGbmVersion {
  private static final String POM_PROPERTIES = "/META-INF/maven/io.github.metarank/lightgbm4j/pom.properties";

  private LightGbmVersion() {}

  /** The lightgbm4j version, or "unknown" when the jar carries no Maven properties (a repackaged jar). */
  public static String binding() {
    try (InputStream in = LGBMBooster.class.getResourceAsStream(POM_PROPERTIES)) {
      if (in == null) {
        return "unknown";
      }
      Properties properties = new Properties();
      properties.load(in);
      return properties.getProperty("version", "unknown");
    } catch (IOException e) {
      return "unknown";
    }
  }

  /** "LightGBM version (lightgbm4j version)", e.g. "4.3.0 (lightgbm4j 4.3.0-1)". */
  public static String describe() {
    String binding = binding();
    int dash = binding.indexOf('-');
    String lightGbm = dash > 0 ? binding.substring(0, dash) : binding;
    return lightGbm + " (lightgbm4j " + binding + ")";
  }
}
