package dev.sequencer.astro;

import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.orekit.time.AbsoluteDate;
import org.orekit.utils.Constants;

/**
 * Annual aberration: where a source at infinity in catalogue direction u is seen by an observer moving at
 * velocity v relative to the solar-system barycentre (the scenario format's A1 pointing convention).
 *
 * <p>Formula: the special-relativistic aberration of light, with beta = v / c and
 * g = sqrt(1 - beta^2), u' = (g u + (1 + u.beta / (1 + g)) beta) / (1 + u.beta) (Explanatory Supplement to
 * the Astronomical Almanac, 3rd ed., sec. 7.2.4; common practice; from memory). The gravitational light
 * deflection by the Sun is not applied (under 0.002" at 90 deg from the Sun, 0.05" at 10 deg), nor diurnal
 * aberration (at most 0.32" at the equator), as the format allows.
 *
 * <p>The observer's velocity: the Earth's relative to the barycentre, taken as its heliocentric velocity
 * from the context's Sun ({@link #earthVelocityMps}); the difference, the Sun's own barycentric velocity
 * (at most about 15 m/s), moves the apparent direction by at most 0.011". A spacecraft adds its geocentric
 * velocity. Stateless and thread-safe.
 */
public final class Aberration {
  /**
   * Upper bound on the Earth's speed relative to the barycentre, m/s: 30.29 km/s at perihelion (vis-viva,
   * a = 1 AU, e = 0.0167), plus the Sun's barycentric speed (under 15 m/s) and the Earth's speed about the
   * Earth-Moon barycentre (12.5 m/s), rounded up (common practice).
   */
  public static final double EARTH_SPEED_MAX_MPS = 30_350.0;
  /**
   * Upper bound on the Earth's acceleration relative to the barycentre, m/s^2: the Sun's pull at
   * perihelion, GM/r^2 = 1.3271e20 / (1.4710e11)^2 = 6.13e-3, plus the Moon's (3.4e-5) and the planets'
   * (under 1e-6), rounded up.
   */
  public static final double EARTH_ACCELERATION_MAX_MPS2 = 6.2e-3;

  private Aberration() {}

  /** The apparent direction (unit vector) of catalogue direction {@code u} (unit) for velocity {@code vMps}. */
  public static Vector3D apparent(Vector3D u, Vector3D vMps) {
    double[] out = new double[3];
    apparent(u.getX(), u.getY(), u.getZ(), vMps.getX(), vMps.getY(), vMps.getZ(), out);
    return new Vector3D(out[0], out[1], out[2]);
  }

  /**
   * {@link #apparent(Vector3D, Vector3D)} on plain arrays, for the inner loops of the visibility engine;
   * {@code out} may be {@code u}.
   */
  public static void apparent(double[] u, double[] vMps, double[] out) {
    apparent(u[0], u[1], u[2], vMps[0], vMps[1], vMps[2], out);
  }

  private static void apparent(double ux, double uy, double uz, double vx, double vy, double vz, double[] out) {
    double c = Constants.SPEED_OF_LIGHT;
    double bx = vx / c;
    double by = vy / c;
    double bz = vz / c;
    double g = Math.sqrt(1 - (bx * bx + by * by + bz * bz));
    double p = ux * bx + uy * by + uz * bz;
    double w = 1 + p / (1 + g);
    double x = g * ux + w * bx;
    double y = g * uy + w * by;
    double z = g * uz + w * bz;
    // Dividing by (1 + p) gives a unit vector analytically; normalising instead keeps it unit to rounding.
    double n = Math.sqrt(x * x + y * y + z * z);
    out[0] = x / n;
    out[1] = y / n;
    out[2] = z / n;
  }

  /**
   * The Earth's velocity relative to the solar-system barycentre in GCRF axes, m/s, approximated by its
   * heliocentric velocity: minus the velocity of the context's geocentric Sun (within 15 m/s, 0.011").
   */
  public static Vector3D earthVelocityMps(AstroContext ctx, AbsoluteDate date) {
    return ctx.sun().getPVCoordinates(date, ctx.inertial()).getVelocity().negate();
  }

  /**
   * Upper bound on the angle between a catalogue direction and its apparent direction for an observer no
   * faster than {@code speedMps}, degrees: asin(beta) (the largest displacement, at 90 deg from the apex).
   */
  public static double maxDisplacementDeg(double speedMps) {
    return Math.toDegrees(Math.asin(Math.min(1.0, speedMps / Constants.SPEED_OF_LIGHT)));
  }

  /**
   * Upper bound on the angular rate of an apparent direction whose catalogue direction is fixed, deg/s, for
   * an observer whose acceleration is at most {@code accelerationMps2} and speed at most {@code speedMps}:
   * |du'/dt| <= |d beta/dt| (1 + beta) / (1 - beta)^2 (first-order expansion of the formula above, with the
   * second-order factor rounded up), with |d beta/dt| = acceleration / c.
   */
  public static double maxRateDegPerS(double speedMps, double accelerationMps2) {
    double beta = speedMps / Constants.SPEED_OF_LIGHT;
    return Math.toDegrees(accelerationMps2 / Constants.SPEED_OF_LIGHT * (1 + beta) / ((1 - beta) * (1 - beta)));
  }
}
