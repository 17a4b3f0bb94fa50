package org.lagmill.run;

import java.io.IOException;
import java.nio.file.Path;
import org.lagmill.store.SalesStore;
import org.lagmill.store.StoreSummary;

/**
 * The check and summary of a store, as the {@code inspect} command runs it: opening the store verifies its sizes and
 * checksums, then {@link StoreSummary} reads its extent, widths and bytes. Writes nothing.
 */
public final class InspectJob {
  private InspectJob() {}

  /**
   * @throws org.lagmill.io.CorruptFileException when a file of the store does not verify
   */
  public static StoreSummary run(Path storeDir) throws IOException {
    try (Run run = Run.unlimited("inspect");
        SalesStore opened = SalesStore.open(storeDir, run.budget().child("store"))) {
      return StoreSummary.of(opened);
    }
  }
}
