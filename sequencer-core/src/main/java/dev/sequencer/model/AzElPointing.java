package dev.sequencer.model;

/** A mount pointing in azimuth (north through east) and elevation, degrees. */
public record AzElPointing(double azimuthDeg, double elevationDeg) implements Pointing {
  public AzElPointing {
    Checks.finite("azimuthDeg", azimuthDeg);
    Checks.finite("elevationDeg", elevationDeg);
  }
}
