package org.lagmill.report;

import java.time.LocalDate;
import java.util.List;

/**
 * Why one forecast is what it is: per forecast period, the forecast split into a base level and the share of each
 * family of drivers (recent level, weekly pattern, season, events and holidays, price, plan, launch, …), in units.
 * The parts of a period add up to its forecast.
 *
 * @param title what is explained, e.g. "total", "store: north-3", "series k2/north/dry"
 * @param seriesCount series summed into it (1 for a single series)
 * @param dates the date of each forecast period
 * @param forecast forecast units per period
 * @param parts the base level first, then each family with a non-zero share, then the zero floor if any
 */
public record DriverChart(String title, int seriesCount, List<LocalDate> dates, double[] forecast,
    List<Part> parts) {

  public DriverChart {
    title = ReportData.requireText(title, "title");
    dates = List.copyOf(dates);
    parts = List.copyOf(parts);
    for (Part part : parts) {
      if (part.units().length != dates.size()) {
        throw new IllegalArgumentException("part " + part.name() + " of " + title + " has " + part.units().length
            + " values for " + dates.size() + " dates");
      }
    }
    if (forecast.length != dates.size()) {
      throw new IllegalArgumentException("forecast of " + title + " has " + forecast.length + " values for "
          + dates.size() + " dates");
    }
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof DriverChart c && title.equals(c.title) && seriesCount == c.seriesCount
        && dates.equals(c.dates) && java.util.Arrays.equals(forecast, c.forecast) && parts.equals(c.parts);
  }

  @Override
  public int hashCode() {
    return java.util.Objects.hash(title, seriesCount, dates, java.util.Arrays.hashCode(forecast), parts);
  }

  @Override
  public String toString() {
    return "DriverChart[" + title + ", " + seriesCount + " series, " + dates.size() + " periods, parts "
        + parts.stream().map(Part::name).toList() + "]";
  }

  /** One part of the forecast: units per period (negative when it pulls the forecast down). */
  public record Part(String name, double[] units) {
    @Override
    public boolean equals(Object o) {
      return o instanceof Part p && name.equals(p.name) && java.util.Arrays.equals(units, p.units);
    }

    @Override
    public int hashCode() {
      return 31 * name.hashCode() + java.util.Arrays.hashCode(units);
    }

    @Override
    public String toString() {
      return "Part[" + name + ", " + units.length + " periods]";
    }

    /** The part's units over every period. */
    public double totalUnits() {
      double sum = 0;
      for (double v : units) {
        sum += v;
      }
      return sum;
    }
  }
}
