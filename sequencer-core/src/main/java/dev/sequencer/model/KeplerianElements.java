package dev.sequencer.model;

import java.time.Instant;
import java.util.Objects;

/**
 * Osculating Keplerian elements in the EME2000 (J2000) frame at {@code epoch}; angles in degrees, the
 * semi-major axis in kilometres.
 */
public record KeplerianElements(
    Instant epoch,
    double semiMajorAxisKm,
    double eccentricity,
    double inclinationDeg,
    double raanDeg,
    double argumentOfPerigeeDeg,
    double meanAnomalyDeg)
    implements OrbitSpec {
  public KeplerianElements {
    Objects.requireNonNull(epoch, "epoch");
    Checks.finite("semiMajorAxisKm", semiMajorAxisKm);
    Checks.finite("eccentricity", eccentricity);
    Checks.finite("inclinationDeg", inclinationDeg);
    Checks.finite("raanDeg", raanDeg);
    Checks.finite("argumentOfPerigeeDeg", argumentOfPerigeeDeg);
    Checks.finite("meanAnomalyDeg", meanAnomalyDeg);
  }
}
