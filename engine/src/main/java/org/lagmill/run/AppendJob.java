package org.lagmill.run;

import java.io.IOException;
import org.lagmill.ingest.AppendOptions;
import org.lagmill.ingest.IngestResult;
import org.lagmill.ingest.StoreAppend;
import org.lagmill.store.StoreManifest;
import org.lagmill.store.StoreUpdate;

/**
 * The adding of new periods (or newer calendar, prices, closures or plan) to a store, as the {@code append} command
 * runs it: {@link StoreAppend} in one stage, then {@code run.json} into the store.
 */
public final class AppendJob {
  private AppendJob() {}

  /**
   * Runs the append.
   *
   * @param waitForLock wait for another writer of the store; false fails at once
   * @return the appended store's manifest and the warnings about the input (engine text with setting mentions)
   */
  public static IngestResult run(AppendOptions options, boolean waitForLock) throws IOException {
    try (Run run = Run.unlimited("append")) {
      run.record().configure("store", options.storeDir().toString())
          .configure("sales", IngestJob.pathText(options.inputs().salesFile()))
          .configure("missingRows", options.inputs().missingRows().optionValue())
          .configure("plan", IngestJob.planText(options.inputs()));
      IngestResult result;
      try (Stage stage = run.stage("append")) {
        result = StoreAppend.append(options, new StoreUpdate.Policy(StoreUpdate.Mode.CHANGE, waitForLock),
            stage.budget());
        stage.addRows(IngestJob.itemPeriods(result.manifest()));
      }
      StoreManifest appended = result.manifest();
      run.record().result("seriesCount", appended.seriesCount()).result("dayCount", appended.dayCount())
          .result("fill", appended.fill()).result("warnings", IngestJob.shown(result));
      run.record().write(options.storeDir());
      return result;
    }
  }
}
