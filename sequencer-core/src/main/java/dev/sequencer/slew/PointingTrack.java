package dev.sequencer.slew;

import dev.sequencer.model.AzEl;
import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.RaDec;
import org.hipparchus.geometry.euclidean.threed.Vector3D;

/**
 * Where the instrument must point to follow one request's target, as a function of time; {@code tS} is
 * seconds from the horizon start and may lie outside the horizon (a slew can end after it).
 *
 * <p>The {@code max...RateDegPerS} methods are upper bounds, never estimates: the slew bounds of
 * {@link Transitions#boundS} are only as safe as they are. They may be infinite (for example the azimuth
 * rate of a target that passes through the zenith), which makes the bound infinite.
 */
public interface PointingTrack {

  /** Unit vector of the line of sight in GCRF at {@code tS}; used by the eigenaxis model. */
  Vector3D inertialDirection(double tS);

  /** An upper bound on the great-circle rate of {@link #inertialDirection} over [t0S, t1S], deg/s. */
  double maxAngularRateDegPerS(double t0S, double t1S);

  /**
   * Topocentric azimuth (north through east) and elevation at {@code tS}, degrees; ground mounts only.
   * The azimuth may be any real number; the mount's unwrapped state is tracked by the slew model.
   */
  default AzEl azEl(double tS) {
    throw new UnsupportedOperationException("this track has no azimuth and elevation (not a ground mount)");
  }

  /** An upper bound on |d azimuth / dt| over [t0S, t1S], deg/s; ground mounts only. */
  default double maxAzimuthRateDegPerS(double t0S, double t1S) {
    throw new UnsupportedOperationException("this track has no azimuth and elevation (not a ground mount)");
  }

  /** An upper bound on |d elevation / dt| over [t0S, t1S], deg/s; ground mounts only. */
  default double maxElevationRateDegPerS(double t0S, double t1S) {
    throw new UnsupportedOperationException("this track has no azimuth and elevation (not a ground mount)");
  }

  /**
   * A cone that holds {@link #inertialDirection} at every instant, whatever the time, or {@code null} when
   * the track has none (a moving target). A fixed RA/Dec target pointed at its apparent direction has one:
   * its catalogue direction, with the largest annual aberration as radius. Slew models whose tracks all
   * have one treat their transitions as time-independent (see {@link Transitions#timeDependent}).
   */
  default Anchor anchor() {
    return null;
  }

  /**
   * The line of sight is never farther than {@code radiusDeg} from {@code direction} (GCRF unit vector).
   * Two tracks with the same anchor direction follow the same catalogue target: the mount keeps tracking
   * it, so going from one to the other is no slew.
   */
  record Anchor(Vector3D direction, double radiusDeg) {
    public Anchor {
      if (!(radiusDeg >= 0 && radiusDeg <= 180)) {
        throw new IllegalArgumentException("anchor radius must be in [0, 180] deg (was " + radiusDeg + ")");
      }
    }
  }

  /**
   * A fixed ICRS direction taken as still (GCRF and ICRS axes agree to milliarcseconds; parallax is ignored,
   * as the scenario format says). The scenario's tracks point fixed targets at their apparent direction
   * instead (annual aberration, see {@code dev.sequencer.visibility.PointingTracks}); this one is for
   * tests and for callers that bring their own directions.
   */
  static PointingTrack fixed(RaDec direction) {
    double ra = Math.toRadians(direction.raDeg());
    double dec = Math.toRadians(direction.decDeg());
    Vector3D u = new Vector3D(Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec));
    return new PointingTrack() {
      @Override
      public Vector3D inertialDirection(double tS) {
        return u;
      }

      @Override
      public double maxAngularRateDegPerS(double t0S, double t1S) {
        return 0;
      }

      @Override
      public Anchor anchor() {
        return new Anchor(u, 0);
      }
    };
  }

  /**
   * A ground mount parked at a fixed azimuth and elevation (a start pointing). Its azimuth is returned as
   * given, so a value such as -200 names the unwrapped mount state. It has no inertial direction.
   */
  static PointingTrack parked(AzElPointing pointing) {
    AzEl azEl = new AzEl(pointing.azimuthDeg(), pointing.elevationDeg());
    return new PointingTrack() {
      @Override
      public Vector3D inertialDirection(double tS) {
        throw new UnsupportedOperationException("a parked alt-az pointing has no fixed inertial direction");
      }

      @Override
      public double maxAngularRateDegPerS(double t0S, double t1S) {
        throw new UnsupportedOperationException("a parked alt-az pointing has no fixed inertial direction");
      }

      @Override
      public AzEl azEl(double tS) {
        return azEl;
      }

      @Override
      public double maxAzimuthRateDegPerS(double t0S, double t1S) {
        return 0;
      }

      @Override
      public double maxElevationRateDegPerS(double t0S, double t1S) {
        return 0;
      }
    };
  }
}
