package dev.sequencer.model;

/** Argument checks shared by the records; they throw {@link IllegalArgumentException}. */
final class Checks {
  private Checks() {}

  static void finite(String name, double value) {
    if (!Double.isFinite(value)) {
      throw new IllegalArgumentException(name + ": must be a finite number (was " + value + ")");
    }
  }

  static void finiteOrNull(String name, Double value) {
    if (value != null) {
      finite(name, value);
    }
  }
}
