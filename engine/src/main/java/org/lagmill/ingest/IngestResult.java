package org.lagmill.ingest;

import java.util.List;
import java.util.Objects;
import org.lagmill.store.StoreManifest;

/**
 * What {@link StoreIngest} or {@link StoreAppend} published, and what the user should be told about the input: rows
 * skipped for unknown price keys, calendar columns keyed by a value no series has. One sentence per warning, without a
 * "warning:" prefix (the caller chooses how to show them).
 */
public record IngestResult(StoreManifest manifest, List<String> warnings) {
  public IngestResult {
    Objects.requireNonNull(manifest, "manifest");
    warnings = List.copyOf(warnings);
  }
}
