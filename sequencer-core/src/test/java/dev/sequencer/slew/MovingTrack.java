package dev.sequencer.slew;

import dev.sequencer.model.AzEl;
import org.hipparchus.geometry.euclidean.threed.Vector3D;

/**
 * Test track for a fast-moving object. Inertially it runs along the great circle through the orthonormal
 * {@code u}, {@code v} at {@code rateDegPerS}. On the ground its azimuth moves at {@code azimuthRateDegPerS}
 * plus a wobble and its elevation oscillates:
 * A = A0 + rA·t + wA sin(Ω t), e = e0 + wE sin(Ω t + 1), Ω in rad/s. The azimuth is returned in
 * [0, 360), so consumers must unwrap it. Rate bounds: the derivative of w sin(Ω t) (w in degrees, Ω in
 * rad/s) is at most |w·Ω| deg/s, so |dA/dt| <= |rA| + |wA·Ω| and |de/dt| <= |wE·Ω|.
 */
record MovingTrack(
    Vector3D u, Vector3D v, double rateDegPerS,
    double azimuth0Deg, double azimuthRateDegPerS, double azimuthWobbleDeg,
    double elevation0Deg, double elevationWobbleDeg, double wobbleRadPerS) implements PointingTrack {

  /** A track with only the inertial motion, starting at {@code u} towards {@code v}. */
  static MovingTrack inertial(Vector3D u, Vector3D towards, double rateDegPerS) {
    Vector3D un = u.normalize();
    Vector3D w = towards.subtract(un.scalarMultiply(Vector3D.dotProduct(un, towards)));
    Vector3D vn = w.getNorm() > 1e-6 ? w.normalize() : un.orthogonal(); // any great circle if parallel
    return new MovingTrack(un, vn, rateDegPerS, 0, 0, 0, 45, 0, 0);
  }

  /** A track with only the ground motion. */
  static MovingTrack ground(double azimuth0Deg, double azimuthRateDegPerS, double azimuthWobbleDeg,
      double elevation0Deg, double elevationWobbleDeg, double wobbleRadPerS) {
    return new MovingTrack(Vector3D.PLUS_I, Vector3D.PLUS_J, 0, azimuth0Deg, azimuthRateDegPerS,
        azimuthWobbleDeg, elevation0Deg, elevationWobbleDeg, wobbleRadPerS);
  }

  @Override
  public Vector3D inertialDirection(double tS) {
    double a = Math.toRadians(rateDegPerS * tS);
    return new Vector3D(Math.cos(a), u, Math.sin(a), v);
  }

  @Override
  public double maxAngularRateDegPerS(double t0S, double t1S) {
    return Math.abs(rateDegPerS);
  }

  @Override
  public AzEl azEl(double tS) {
    double a = azimuth0Deg + azimuthRateDegPerS * tS + azimuthWobbleDeg * Math.sin(wobbleRadPerS * tS);
    double wrapped = a - 360 * Math.floor(a / 360);
    return new AzEl(wrapped, elevation0Deg + elevationWobbleDeg * Math.sin(wobbleRadPerS * tS + 1));
  }

  @Override
  public double maxAzimuthRateDegPerS(double t0S, double t1S) {
    return Math.abs(azimuthRateDegPerS) + Math.abs(azimuthWobbleDeg * wobbleRadPerS);
  }

  @Override
  public double maxElevationRateDegPerS(double t0S, double t1S) {
    return Math.abs(elevationWobbleDeg * wobbleRadPerS);
  }
}
