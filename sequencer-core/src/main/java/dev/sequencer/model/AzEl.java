package dev.sequencer.model;

/** An azimuth (from north through east) and an elevation, both in degrees. */
public record AzEl(double azimuthDeg, double elevationDeg) {
  public AzEl {
    Checks.finite("azimuthDeg", azimuthDeg);
    Checks.finite("elevationDeg", elevationDeg);
  }
}
