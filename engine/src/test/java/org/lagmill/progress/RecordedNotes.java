package org.lagmill.progress;

import java.util.ArrayList;
import java.util.List;

/**
 * A progress listener for tests that keeps every note in order and ignores stages: the notes are where a training
 * says what it did (e.g. how many starting scores it carried), which tests compare with what they expect.
 */
public final class RecordedNotes implements ProgressListener {
  private final List<String> texts = new ArrayList<>();

  @Override
  public void startStage(String stageName, String unitName, long totalUnits) {}

  @Override
  public void advance(long doneUnits) {}

  @Override
  public void note(String text) {
    texts.add(text);
  }

  @Override
  public void endStage() {}

  /** The notes that start with {@code prefix}, in the order they were given. */
  public List<String> startingWith(String prefix) {
    return texts.stream().filter(t -> t.startsWith(prefix)).toList();
  }
}
