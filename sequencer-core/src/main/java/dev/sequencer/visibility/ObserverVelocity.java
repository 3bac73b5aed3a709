package dev.sequencer.visibility;

import dev.sequencer.astro.Aberration;
import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.Observer;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.orekit.time.AbsoluteDate;
import org.orekit.utils.Constants;
import org.orekit.utils.PVCoordinatesProvider;

/**
 * The observer's velocity relative to the solar-system barycentre (GCRF axes, m/s), for the annual
 * aberration of fixed targets: the Earth's ({@link Aberration#earthVelocityMps}) for a ground site (diurnal
 * aberration neglected, as the format allows), plus the spacecraft's geocentric velocity for an orbit
 * observer.
 *
 * <p>Tabulated over [t0S, t1S] (seconds from {@code origin}) and interpolated linearly, since the pointing
 * tracks of the slew models ask for it very often: every {@value #GROUND_STEP_S} s for a ground site (the
 * Earth's velocity turns 0.01 deg in that time, so the chord error is 30 km/s x (1.7e-4 rad)^2 / 8 = 1e-4 m/s)
 * and every {@value #ORBIT_STEP_S} s for an orbit (a LEO velocity turns 2 deg: 7.5 km/s x (0.035)^2 / 8 =
 * 1.2 m/s, i.e. 0.0008" of aberration). Outside the table it is computed directly. Thread-safe (the
 * propagator is used under a lock).
 */
final class ObserverVelocity {
  static final double GROUND_STEP_S = 600.0;
  static final double ORBIT_STEP_S = 30.0;

  private final AstroContext ctx;
  private final AbsoluteDate origin;
  private final PVCoordinatesProvider orbit;
  private final double t0S;
  private final double stepS;
  private final double[] xyz;
  private final double maxSpeedMps;
  private final double maxAccelerationMps2;

  private ObserverVelocity(AstroContext ctx, AbsoluteDate origin, PVCoordinatesProvider orbit, double t0S, double t1S,
      double stepS, double maxSpeedMps, double maxAccelerationMps2) {
    this.ctx = ctx;
    this.origin = origin;
    this.orbit = orbit;
    this.t0S = t0S;
    this.stepS = stepS;
    int n = Math.max(2, (int) Math.ceil((t1S - t0S) / stepS) + 1);
    this.xyz = new double[3 * n];
    for (int k = 0; k < n; k++) {
      Vector3D v = direct(t0S + k * stepS);
      xyz[3 * k] = v.getX();
      xyz[3 * k + 1] = v.getY();
      xyz[3 * k + 2] = v.getZ();
    }
    this.maxSpeedMps = maxSpeedMps;
    this.maxAccelerationMps2 = maxAccelerationMps2;
  }

  /**
   * The velocity of a ground site or an orbit observer, tabulated over [t0S, t1S]; its own
   * propagator instance is used, so sharing it with other tracks is safe.
   */
  static ObserverVelocity of(Observer observer, AstroContext ctx, AbsoluteDate origin, double t0S, double t1S) {
    if (observer instanceof OrbitObserver o) {
      double[] rv = Observers.perigeeRadiusAndSpeed(o, ctx);
      // Perigee radius (less 2 %) and speed (plus 2 %) bound the spacecraft's speed and gravity.
      double scAcceleration = 1.02 * Constants.EIGEN5C_EARTH_MU / (rv[0] * rv[0]);
      return new ObserverVelocity(ctx, origin, Observers.motion(o, ctx, origin.shiftedBy(t0S), origin.shiftedBy(t1S)), t0S, t1S, ORBIT_STEP_S,
          Aberration.EARTH_SPEED_MAX_MPS + rv[1], Aberration.EARTH_ACCELERATION_MAX_MPS2 + scAcceleration);
    }
    return new ObserverVelocity(ctx, origin, null, t0S, t1S, GROUND_STEP_S, Aberration.EARTH_SPEED_MAX_MPS,
        Aberration.EARTH_ACCELERATION_MAX_MPS2);
  }

  /** The velocity at {@code tS}, m/s. */
  Vector3D at(double tS) {
    double u = (tS - t0S) / stepS;
    int n = xyz.length / 3;
    if (!(u >= 0) || u > n - 1) {
      return direct(tS);
    }
    int k = Math.min(n - 2, (int) Math.floor(u));
    double f = u - k;
    int b = 3 * k;
    return new Vector3D((1 - f) * xyz[b] + f * xyz[b + 3], (1 - f) * xyz[b + 1] + f * xyz[b + 4],
        (1 - f) * xyz[b + 2] + f * xyz[b + 5]);
  }

  /** Upper bound on the observer's speed, m/s. */
  double maxSpeedMps() {
    return maxSpeedMps;
  }

  /** Upper bound on the observer's acceleration, m/s^2. */
  double maxAccelerationMps2() {
    return maxAccelerationMps2;
  }

  private Vector3D direct(double tS) {
    AbsoluteDate date = origin.shiftedBy(tS);
    Vector3D earth = Aberration.earthVelocityMps(ctx, date);
    if (orbit == null) {
      return earth;
    }
    synchronized (orbit) {
      return earth.add(orbit.getPVCoordinates(date, ctx.inertial()).getVelocity());
    }
  }
}
