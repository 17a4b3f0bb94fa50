package org.lagmill.store;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import it.unimi.dsi.fastutil.objects.ObjectArrayList;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.lagmill.memory.MemoryBudget;

/**
 * Builds the attribute dictionaries while series are added (codes in order of first appearance) and writes
 * {@code attributes.bin} (layout in {@link AttributesLayout}). Holds the dictionaries and one int code per series and
 * attribute on the heap; doubles as a {@link SeriesAttributes} view of the series added so far, so a price or calendar
 * reader can map its keys to series before the store is finished.
 */
public final class AttributeDictionaryBuilder implements SeriesAttributes {
  private final String[] names;
  private final int seriesIdAttribute;
  private final Object2IntOpenHashMap<String>[] codeByValue;
  private final ObjectArrayList<String>[] values;
  private final IntArrayList[] codes;
  private final Object2IntOpenHashMap<String> seriesIndexById = new Object2IntOpenHashMap<>();
  private final ObjectArrayList<String> seriesIds = new ObjectArrayList<>();

  @SuppressWarnings("unchecked")
  public AttributeDictionaryBuilder(List<String> attributeNames) {
    names = attributeNames.toArray(new String[0]);
    for (int a = 0; a < names.length; a++) {
      for (int b = 0; b < a; b++) {
        if (names[a].equals(names[b])) {
          throw new IllegalArgumentException("attribute names must be distinct, got \"" + names[a] + "\" twice");
        }
      }
    }
    seriesIdAttribute = SeriesIdentity.idIndex(attributeNames);
    codeByValue = new Object2IntOpenHashMap[names.length];
    values = new ObjectArrayList[names.length];
    codes = new IntArrayList[names.length];
    for (int a = 0; a < names.length; a++) {
      codeByValue[a] = new Object2IntOpenHashMap<>();
      codeByValue[a].defaultReturnValue(-1);
      values[a] = new ObjectArrayList<>();
      codes[a] = new IntArrayList();
    }
    seriesIndexById.defaultReturnValue(-1);
  }

  /**
   * Adds one series' attribute values.
   *
   * @throws IllegalArgumentException when the series id is already taken
   */
  public void add(String[] attributeValues) {
    if (attributeValues.length != names.length) {
      throw new IllegalArgumentException("expected " + names.length + " attribute values, got "
          + attributeValues.length);
    }
    String seriesId = SeriesIdentity.seriesId(attributeValues, seriesIdAttribute);
    int seriesIndex = seriesIds.size();
    if (seriesIndexById.putIfAbsent(seriesId, seriesIndex) != -1) {
      throw new IllegalArgumentException("duplicate series \"" + seriesId + "\": each series may appear once");
    }
    seriesIds.add(seriesId);
    for (int a = 0; a < names.length; a++) {
      String value = attributeValues[a];
      int code = codeByValue[a].getInt(value);
      if (code < 0) {
        code = values[a].size();
        codeByValue[a].put(value, code);
        values[a].add(value);
      }
      codes[a].add(code);
    }
  }

  public int seriesCount() {
    return seriesIds.size();
  }

  /**
   * Gives every value of every attribute of {@code source} (but {@code series_id}) the same code it has there, before
   * any series is added: a shard then codes each value as its whole store does (categorical features and calendar
   * rows agree).
   *
   * @throws IllegalStateException when a series or value was added already
   * @throws IllegalArgumentException when the attribute names differ
   */
  void seed(SeriesAttributes source) {
    if (!seriesIds.isEmpty()) {
      throw new IllegalStateException("attribute values can only be seeded before the first series");
    }
    if (source.attributeCount() != names.length) {
      throw new IllegalArgumentException("seeding " + names.length + " attributes from " + source.attributeCount());
    }
    for (int a = 0; a < names.length; a++) {
      if (!source.attributeName(a).equals(names[a]) || !values[a].isEmpty()) {
        throw new IllegalArgumentException("attribute " + a + " is \"" + names[a] + "\", the source's is \""
            + source.attributeName(a) + "\"");
      }
      if (a == seriesIdAttribute) {
        continue; // one value per series, never a feature: each shard keeps only its own ids
      }
      for (int code = 0; code < source.cardinality(a); code++) {
        String value = source.value(a, code);
        codeByValue[a].put(value, code);
        values[a].add(value);
      }
    }
  }

  /** @return the finished file's size in bytes and checksum, through the writer */
  ChecksummedFileWriter write(Path file, MemoryBudget budget) throws IOException {
    int seriesCount = seriesCount();
    ChecksummedFileWriter out = new ChecksummedFileWriter(file, FileKind.ATTRIBUTES, budget);
    try {
      out.putInt(seriesCount);
      out.putInt(names.length);
      for (int a = 0; a < names.length; a++) {
        out.putString(names[a]);
        out.putInt(values[a].size());
        for (String value : values[a]) {
          out.putString(value);
        }
      }
      out.padTo(Integer.BYTES);
      for (int a = 0; a < names.length; a++) {
        int[] attributeCodes = codes[a].elements();
        for (int s = 0; s < seriesCount; s++) {
          out.putInt(attributeCodes[s]);
        }
      }
      out.finish();
      return out;
    } finally {
      out.close();
    }
  }

  @Override
  public int attributeCount() { return names.length; }
  @Override
  public String attributeName(int attributeIndex) { return names[attributeIndex]; }
  @Override
  public List<String> attributeNames() { return List.of(names); }

  @Override
  public int cardinality(int attributeIndex) { return values[attributeIndex].size(); }
  @Override
  public int code(int seriesIndex, int attributeIndex) { return codes[attributeIndex].getInt(seriesIndex); }
  @Override
  public String value(int attributeIndex, int code) { return values[attributeIndex].get(code); }
  @Override
  public int codeOf(int attributeIndex, String value) { return codeByValue[attributeIndex].getInt(value); }
  @Override
  public String seriesId(int seriesIndex) { return seriesIds.get(seriesIndex); }
  @Override
  public int seriesIndexOf(String seriesId) { return seriesIndexById.getInt(seriesId); }
}
