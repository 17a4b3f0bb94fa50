package org.lagmill.ingest;

import it.unimi.dsi.fastutil.ints.IntArrays;
import it.unimi.dsi.fastutil.ints.IntComparator;

/**
 * The rows of a keyed, dated file (prices, plan) put in key order: sorted once by key, then by date, and handed out one
 * key's run of rows at a time. Both readers build their per-key change points this way.
 */
final class KeyRuns {
  private KeyRuns() {}

  /** Receives one key's rows: positions {@code [start, end)} of the sorted order. */
  @FunctionalInterface
  interface KeyRun {
    void accept(int keyId, int start, int end);
  }

  /**
   * Row indexes {@code 0 .. rowCount-1} sorted by key id, then by {@code byDate}.
   *
   * @param keyIds each row's key id
   * @param byDate compares two row indexes by their date
   */
  static int[] sortedRows(int rowCount, int[] keyIds, IntComparator byDate) {
    int[] order = new int[rowCount];
    for (int r = 0; r < rowCount; r++) {
      order[r] = r;
    }
    IntArrays.quickSort(order, (a, b) -> {
      int byKey = Integer.compare(keyIds[a], keyIds[b]);
      return byKey != 0 ? byKey : byDate.compare(a, b);
    });
    return order;
  }

  /** Calls {@code run} once per key, in key order, with the positions in {@code order} of that key's rows. */
  static void forEachKey(int[] order, int[] keyIds, KeyRun run) {
    int rowCount = order.length;
    int start = 0;
    while (start < rowCount) {
      int keyId = keyIds[order[start]];
      int end = start;
      while (end < rowCount && keyIds[order[end]] == keyId) {
        end++;
      }
      run.accept(keyId, start, end);
      start = end;
    }
  }
}
