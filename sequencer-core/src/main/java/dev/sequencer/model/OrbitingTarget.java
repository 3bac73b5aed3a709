package dev.sequencer.model;

import java.util.Objects;

/** An orbiting object given by a TLE; the pointing follows the object. */
public record OrbitingTarget(Tle tle) implements Target {
  public OrbitingTarget {
    Objects.requireNonNull(tle, "tle");
  }
}
