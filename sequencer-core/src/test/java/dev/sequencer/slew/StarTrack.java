package dev.sequencer.slew;

import dev.sequencer.model.AzEl;
import org.hipparchus.geometry.euclidean.threed.Vector3D;

/**
 * Test track: a fixed star (declination {@code decDeg}) seen from a site at {@code latitudeDeg}, its hour
 * angle growing at the sidereal rate from {@code hourAngle0Deg}; spherical formulas, no refraction,
 * precession or nutation. Formulas from memory (standard spherical astronomy):
 * sin e = sin φ sin δ + cos φ cos δ cos H, and azimuth from north through east
 * A = atan2(-cos δ sin H, sin δ cos φ - cos δ cos H sin φ).
 *
 * <p>Rate bounds, derived here and checked by finite differences in {@code TestTracksTest}:
 * differentiating sin e gives de/dt = ω cos φ sin A, so |de/dt| <= ω cos φ; and
 * |dA/dt| = ω |sin φ - cos φ cos A tan e| <= ω (|sin φ| + cos φ |tan e|), with |e| over the interval at
 * most its larger end value plus half the interval times the elevation rate bound.
 */
record StarTrack(double latitudeDeg, double decDeg, double raDeg, double hourAngle0Deg) implements PointingTrack {
  /** Sidereal rotation rate: 360° per sidereal day of 86164.0905 s (value from memory). */
  static final double SIDEREAL_DEG_PER_S = 360.0 / 86164.0905;

  @Override
  public Vector3D inertialDirection(double tS) {
    double ra = Math.toRadians(raDeg);
    double dec = Math.toRadians(decDeg);
    return new Vector3D(Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec));
  }

  @Override
  public double maxAngularRateDegPerS(double t0S, double t1S) {
    return 0;
  }

  @Override
  public AzEl azEl(double tS) {
    double phi = Math.toRadians(latitudeDeg);
    double dec = Math.toRadians(decDeg);
    double h = Math.toRadians(hourAngle0Deg + SIDEREAL_DEG_PER_S * tS);
    double sinE = Math.sin(phi) * Math.sin(dec) + Math.cos(phi) * Math.cos(dec) * Math.cos(h);
    double e = Math.asin(Math.max(-1, Math.min(1, sinE)));
    double a = Math.atan2(-Math.cos(dec) * Math.sin(h),
        Math.sin(dec) * Math.cos(phi) - Math.cos(dec) * Math.cos(h) * Math.sin(phi));
    double azimuthDeg = Math.toDegrees(a);
    return new AzEl(azimuthDeg < 0 ? azimuthDeg + 360 : azimuthDeg, Math.toDegrees(e));
  }

  @Override
  public double maxElevationRateDegPerS(double t0S, double t1S) {
    return SIDEREAL_DEG_PER_S * Math.cos(Math.toRadians(latitudeDeg));
  }

  @Override
  public double maxAzimuthRateDegPerS(double t0S, double t1S) {
    double maxAbsElevationDeg = Math.max(Math.abs(azEl(t0S).elevationDeg()), Math.abs(azEl(t1S).elevationDeg()))
        + 0.5 * Math.abs(t1S - t0S) * maxElevationRateDegPerS(t0S, t1S);
    if (maxAbsElevationDeg >= 90) {
      return Double.POSITIVE_INFINITY;
    }
    double phi = Math.toRadians(latitudeDeg);
    return SIDEREAL_DEG_PER_S
        * (Math.abs(Math.sin(phi)) + Math.cos(phi) * Math.tan(Math.toRadians(maxAbsElevationDeg)));
  }
}
