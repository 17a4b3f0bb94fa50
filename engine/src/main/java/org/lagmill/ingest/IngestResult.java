package org.lagmill.ingest;

import java.util.List;
import java.util.Objects;
import org.lagmill.store.StoreManifest;

/**
 * What {@link StoreIngest} or {@link StoreAppend} published, and what the user should be told about the input: rows
 * skipped for unknown price keys, calendar columns keyed by a value no series has. One sentence per warning, without a
 * "warning:" prefix (the caller chooses how to show them). {@code periodNote} says which period an ingest gave the
 * store and where it came from (detected from the dates, or given); null for an append.
 */
public record IngestResult(StoreManifest manifest, List<String> warnings, String periodNote) {
  public IngestResult {
    Objects.requireNonNull(manifest, "manifest");
    warnings = List.copyOf(warnings);
  }

  /** A result with nothing to say about the period (an append keeps the store's). */
  public IngestResult(StoreManifest manifest, List<String> warnings) {
    this(manifest, warnings, null);
  }
}
