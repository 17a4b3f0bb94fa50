package org.lagmill.report;

import java.util.Arrays;
import java.util.List;

/**
 * Error by horizon day: how the error grows from the first forecast day to the last.
 *
 * @param metricName the error measure, e.g. "RMSSE"
 * @param model the model's error on horizon day {@code h + 1} at index {@code h}
 * @param baselines each baseline's errors, same length as {@code model}, in display order
 */
public record HorizonErrors(String metricName, double[] model, List<NamedCurve> baselines) {

  public HorizonErrors {
    metricName = ReportData.requireText(metricName, "metricName");
    if (model == null) {
      throw new IllegalArgumentException("model errors must not be null");
    }
    baselines = baselines == null ? List.of() : List.copyOf(baselines);
    for (NamedCurve b : baselines) {
      if (b.values().length != model.length) {
        throw new IllegalArgumentException("baseline " + b.name() + " has " + b.values().length
            + " horizon days but the model has " + model.length + "; all curves must cover the same days");
      }
    }
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof HorizonErrors h && metricName.equals(h.metricName) && Arrays.equals(model, h.model)
        && baselines.equals(h.baselines);
  }

  @Override
  public int hashCode() {
    return 31 * (31 * metricName.hashCode() + Arrays.hashCode(model)) + baselines.hashCode();
  }

  @Override
  public String toString() {
    return "HorizonErrors[" + metricName + ", model=" + Arrays.toString(model) + ", baselines=" + baselines + "]";
  }

  /**
   * A named curve of values.
   *
   * @param name the curve's label, not blank
   * @param values the values, NaN where unknown
   */
  public record NamedCurve(String name, double[] values) {
    public NamedCurve {
      name = ReportData.requireText(name, "name");
      if (values == null) {
        throw new IllegalArgumentException("values of curve " + name + " must not be null");
      }
    }

    @Override
    public boolean equals(Object o) {
      return o instanceof NamedCurve c && name.equals(c.name) && Arrays.equals(values, c.values);
    }

    @Override
    public int hashCode() {
      return 31 * name.hashCode() + Arrays.hashCode(values);
    }

    @Override
    public String toString() {
      return name + "=" + Arrays.toString(values);
    }
  }
}
