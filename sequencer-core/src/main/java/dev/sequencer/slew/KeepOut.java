package dev.sequencer.slew;

import org.hipparchus.geometry.euclidean.threed.Vector3D;

/**
 * A cone the line of sight must stay out of during slews (spec A3): the Sun keep-out
 * ({@code sunSeparationMinDeg} about the Sun) or, from orbit, the Earth's disc widened by
 * {@code earthLimbMinDeg}. The line of sight u keeps it at {@code tS} when
 * angle(u, {@link #axis}(tS)) &gt;= {@link #radiusDeg}(tS).
 *
 * <p>{@link #maxDriftDegPerS} bounds how fast the cone can close in on a fixed direction: the axis's
 * great-circle rate plus the rate of change of the radius. Every check along a slew path leans on it, so
 * it must be an upper bound, never an estimate.
 */
public interface KeepOut {
  /** Unit vector of the cone's axis in GCRF at {@code tS} (seconds from the horizon start). */
  Vector3D axis(double tS);

  /** Half-angle of the cone at {@code tS}, degrees, in [0, 180]. */
  double radiusDeg(double tS);

  /** Upper bound on |d axis/dt| + |d radius/dt| at any time, deg/s; 0 for a cone that does not move. */
  double maxDriftDegPerS();

  /** What the cone is, for explanations: "Sun" or "Earth limb". */
  String name();

  /** A cone that does not move. */
  static KeepOut fixed(String name, Vector3D axis, double radiusDeg) {
    Vector3D u = axis.normalize();
    if (!(radiusDeg >= 0 && radiusDeg <= 180)) {
      throw new IllegalArgumentException(name + " keep-out radius must be in [0, 180] deg (was " + radiusDeg + ")");
    }
    return new KeepOut() {
      @Override
      public Vector3D axis(double tS) {
        return u;
      }

      @Override
      public double radiusDeg(double tS) {
        return radiusDeg;
      }

      @Override
      public double maxDriftDegPerS() {
        return 0;
      }

      @Override
      public String name() {
        return name;
      }

      @Override
      public String toString() {
        return name + " keep-out " + radiusDeg + " deg about " + u;
      }
    };
  }

  /** Clearance of {@code u} at {@code tS}: angle to the axis minus the radius, degrees (negative inside). */
  default double clearanceDeg(Vector3D u, double tS) {
    return EigenaxisModel.angleDeg(u, axis(tS)) - radiusDeg(tS);
  }
}
