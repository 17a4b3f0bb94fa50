package org.lagmill.run;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.lagmill.store.SalesStore;
import org.lagmill.store.SeriesAttributes;
import org.lagmill.store.SeriesSelection;

/**
 * The listing of a store's series, as the {@code series} command runs it: each series' id and attribute values,
 * optionally only those matching a text ({@link SeriesSelection#matching}). Writes nothing.
 */
public final class SeriesJob {
  private SeriesJob() {}

  /**
   * The series listed.
   *
   * @param attributeNames the store's attributes, in the order of every series' values
   * @param series the matching series in store order
   * @param storeSeriesCount every series of the store, matching or not
   */
  public record Listing(List<String> attributeNames, List<Series> series, int storeSeriesCount) {}

  /**
   * One series.
   *
   * @param id the name other commands take for it ({@link SeriesAttributes#seriesId})
   * @param attributeValues its value of each attribute, in {@link Listing#attributeNames()} order
   */
  public record Series(String id, List<String> attributeValues) {}

  /**
   * Lists the series.
   *
   * @param match text a series' id or one of its values contains, ignoring case; null or blank for every series
   */
  public static Listing run(Path storeDir, String match) throws IOException {
    try (Run run = Run.unlimited("series");
        SalesStore opened = SalesStore.open(storeDir, run.budget().child("store"))) {
      SeriesAttributes attributes = opened.attributes();
      List<Series> series = new ArrayList<>();
      for (int s : SeriesSelection.matching(opened, match)) {
        String[] values = new String[attributes.attributeCount()];
        for (int a = 0; a < values.length; a++) {
          values[a] = attributes.value(a, attributes.code(s, a));
        }
        series.add(new Series(attributes.seriesId(s), List.of(values)));
      }
      return new Listing(attributes.attributeNames(), series, opened.seriesCount());
    }
  }
}
