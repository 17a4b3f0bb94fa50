package org.lagmill.features;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class FeatureSpecTemplateTest {
  @ParameterizedTest
  @ValueSource(ints = {1, 7, 14})
  void shouldReadBackAsThePeriodsDefaults(int periodDays) {
    assertEquals(FeatureSpec.defaultsFor(periodDays),
        FeatureSpecYaml.parse(FeatureSpecTemplate.text(periodDays), "template", periodDays));
  }

  @ParameterizedTest
  @ValueSource(ints = {1, 7})
  void shouldDescribeEveryKeyInTheFileOrder(int periodDays) {
    assertEquals(FeatureSpecYaml.KEYS, FeatureSpecTemplate.KEYS.stream().map(FeatureSpecTemplate.Key::name).toList());
    String text = FeatureSpecTemplate.text(periodDays);
    for (String key : FeatureSpecYaml.KEYS) {
      assertTrue(text.contains("\n" + key + ":") || text.contains("\n# " + key + ":\n"), key);
    }
    assertTrue(text.contains(periodDays == 1 ? "\nlagDays: [1, 2, 3, 4, 5, 6, 7, 14, 21, 28, 35]\n"
        : "\nlagDays: [1, 2, 3, 4, 8, 13, 26]\n"), text);
    assertTrue(text.startsWith("# lagmill feature spec for a store whose periods are " + periodDays + " day"), text);
  }

  @ParameterizedTest
  @ValueSource(ints = {1, 7})
  void shouldUncommentAnUnsetKeyIntoAValidSpec(int periodDays) {
    String text = FeatureSpecTemplate.text(periodDays).replace("# fromDate:", "fromDate: 2024-01-01");
    assertEquals(LocalDate.of(2024, 1, 1), FeatureSpecYaml.parse(text, "template", periodDays).fromDate());
  }
}
