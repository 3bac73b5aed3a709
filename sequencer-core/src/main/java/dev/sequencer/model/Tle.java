package dev.sequencer.model;

import java.util.Objects;

/** A two-line element set, kept as its two 69-character lines; the checksum is verified by the reader. */
public record Tle(String line1, String line2) implements OrbitSpec {
  public Tle {
    Objects.requireNonNull(line1, "line1");
    Objects.requireNonNull(line2, "line2");
  }
}
