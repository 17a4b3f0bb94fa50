package org.lagmill.cli;

import picocli.CommandLine;

/**
 * Converters for options that count things (periods, rounds, series, threads): the value is checked while the
 * command line is parsed, so {@code --horizon -5} is a usage error naming the option (exit code 2) before any file is
 * opened, never an internal error deep in a computation.
 */
final class Counts {
  private Counts() {}

  /** A count of at least 1. */
  static final class Positive implements CommandLine.ITypeConverter<Integer> {
    @Override
    public Integer convert(String value) {
      return parse(value, 1);
    }
  }

  /** A count of at least 0 (0 switches the feature off where the option says so). */
  static final class NonNegative implements CommandLine.ITypeConverter<Integer> {
    @Override
    public Integer convert(String value) {
      return parse(value, 0);
    }
  }

  static int parse(String value, int min) {
    int count;
    try {
      count = Integer.parseInt(value.trim());
    } catch (NumberFormatException e) {
      throw new CommandLine.TypeConversionException("expected a whole number of at least " + min + ", found '"
          + org.lagmill.io.Excerpts.of(value) + "'");
    }
    if (count < min) {
      throw new CommandLine.TypeConversionException("expected a whole number of at least " + min + ", found "
          + count);
    }
    return count;
  }
}
