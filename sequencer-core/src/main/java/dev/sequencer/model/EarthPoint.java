package dev.sequencer.model;

/** A point on the Earth (WGS-84 geodetic), for orbit observers. */
public record EarthPoint(double latitudeDeg, double longitudeDeg, double altitudeM) implements Target {
  public EarthPoint {
    Checks.finite("latitudeDeg", latitudeDeg);
    Checks.finite("longitudeDeg", longitudeDeg);
    Checks.finite("altitudeM", altitudeM);
  }
}
