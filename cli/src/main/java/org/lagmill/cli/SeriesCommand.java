package org.lagmill.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.lagmill.run.Run;
import org.lagmill.run.RunRecord;
import org.lagmill.store.SalesStore;
import org.lagmill.store.SeriesAttributes;
import org.lagmill.store.SeriesSelection;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code lagmill series}: lists a store's series ids and attributes, optionally those matching a text. */
@Command(name = "series", header = "List a store's series ids and attributes.", mixinStandardHelpOptions = true,
    description = {"List the series of a store: the id other commands take (--series, --show) and every attribute,",
        "one series per line, tab-separated with a header; --match keeps the series whose id or any attribute value",
        "contains the text, ignoring case."},
    footer = {"", "Example:", "  lagmill series --store stores/chain --match bakery"})
final class SeriesCommand implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Mixin
  StoreOption store;

  @Option(names = "--match", paramLabel = "TEXT", description = "only series whose id or attribute values contain "
      + "this text (case ignored)")
  String match;

  @Option(names = "--json", description = "print a JSON array: each series' id and attributes")
  boolean json;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    try (Run run = Run.unlimited("series");
        SalesStore opened = SalesStore.open(store.dir, run.budget().child("store"))) {
      SeriesAttributes attributes = opened.attributes();
      int[] chosen = SeriesSelection.matching(opened, match);
      List<String> columns = new ArrayList<>();
      for (int a = 0; a < attributes.attributeCount(); a++) {
        columns.add(attributes.attributeName(a));
      }
      if (json) {
        List<Map<String, Object>> rows = new ArrayList<>();
        for (int s : chosen) {
          Map<String, String> values = new LinkedHashMap<>();
          for (String column : columns) {
            int a = attributes.attributeIndex(column);
            values.put(column, attributes.value(a, attributes.code(s, a)));
          }
          Map<String, Object> row = new LinkedHashMap<>();
          row.put(ID_COLUMN, attributes.seriesId(s));
          row.put("attributes", values);
          rows.add(row);
        }
        out.println(RunRecord.JSON.writeValueAsString(rows));
        return ExitCodes.OK;
      }
      out.println(ID_COLUMN + "\t" + String.join("\t", columns));
      StringBuilder line = new StringBuilder();
      for (int s : chosen) {
        line.setLength(0);
        line.append(attributes.seriesId(s));
        for (String column : columns) {
          int a = attributes.attributeIndex(column);
          line.append('\t').append(attributes.value(a, attributes.code(s, a)));
        }
        out.println(line);
      }
      // the count goes to stderr so the listing itself stays a clean table to pipe on
      System.err.printf("%,d of %,d series%s%n", chosen.length, opened.seriesCount(),
          match == null ? "" : " contain \"" + match + "\"");
    }
    return ExitCodes.OK;
  }

  /** Heads the id column: the name --series and --show take, which may repeat an attribute's value. */
  private static final String ID_COLUMN = "series";
}
