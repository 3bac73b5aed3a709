package dev.sequencer.model;

import java.util.Objects;

/** A spacecraft observer whose orbit is a TLE (SGP4/SDP4) or Keplerian elements. */
public record OrbitObserver(OrbitSpec orbit) implements Observer {
  public OrbitObserver {
    Objects.requireNonNull(orbit, "orbit");
  }
}
