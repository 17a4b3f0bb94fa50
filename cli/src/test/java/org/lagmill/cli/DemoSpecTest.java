package org.lagmill.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import org.lagmill.features.FeatureSpec;
import org.lagmill.features.FeatureSpecYaml;
import org.junit.jupiter.api.Test;

class DemoSpecTest {
  @Test
  void shouldMatchTheExampleConfigurationTheDocsPointTo() throws Exception {
    FeatureSpec documented = FeatureSpecYaml.read(Path.of("../docs/examples/recursive-short-lags.yaml"), 1);
    assertEquals(documented, org.lagmill.run.DemoJob.spec());
  }

  @Test
  void shouldRefuseAnUnknownSize() {
    assertEquals(ExitCodes.USAGE_ERROR, Main.run("demo", "--size", "huge", "--out", "target/never-written"));
  }
}
