package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class FeatureSpecTemplateTest {
  @Test
  void shouldReadBackAsTheDefaults() {
    assertEquals(FeatureSpec.defaults(), FeatureSpecYaml.parse(FeatureSpecTemplate.text(), "template"));
  }

  @Test
  void shouldDescribeEveryKeyInTheFileOrder() {
    assertEquals(FeatureSpecYaml.KEYS, FeatureSpecTemplate.KEYS.stream().map(FeatureSpecTemplate.Key::name).toList());
    String text = FeatureSpecTemplate.text();
    for (String key : FeatureSpecYaml.KEYS) {
      assertTrue(text.contains("\n" + key + ":") || text.contains("\n# " + key + ":\n"), key);
    }
    assertTrue(text.contains("\nlagDays: [28, 35, 42, 49, 56]\n") || !FeatureSpec.defaults().toString()
        .contains("lagDays=[28, 35, 42, 49, 56]"), text);
  }

  @Test
  void shouldUncommentAnUnsetKeyIntoAValidSpec() {
    String text = FeatureSpecTemplate.text().replace("# rollingShiftDays:", "rollingShiftDays: 30");
    assertEquals(30, FeatureSpecYaml.parse(text, "template").rollingShiftDays());
  }
}
