package org.lagmill.store;

/** The binary files of a store directory; the kind number is written into each file's header. */
enum FileKind {
  UNITS(1, "units.bin"),
  SERIES(2, "series.bin"),
  ATTRIBUTES(3, "attributes.bin"),
  PRICES(4, "prices.bin"),
  CALENDAR(5,
      "calendar.bin"),
  CLOSURES(6, "closures.bin"),
  PLAN(7, "plan.bin");

  private final int kindNumber;
  private final String fileName;

  FileKind(int kindNumber, String fileName) {
    this.kindNumber = kindNumber;
    this.fileName = fileName;
  }

  int kindNumber() {
    return kindNumber;
  }

  String fileName() {
    return fileName;
  }

  /**
   * Whether a store may lack the file: stores written before closures were kept have no {@code closures.bin}, and a
   * store without a plan has no {@code plan.bin}; the manifest lists what a store has.
   */
  boolean optional() {
    return this == CLOSURES || this == PLAN;
  }
}
