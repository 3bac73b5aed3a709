package dev.sequencer.visibility;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.Tle;
import org.hipparchus.util.FastMath;
import org.orekit.orbits.KeplerianOrbit;
import org.orekit.orbits.PositionAngleType;
import org.orekit.propagation.Propagator;
import org.orekit.propagation.analytical.BrouwerLyddanePropagator;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.propagation.analytical.tle.TLEPropagator;
import org.orekit.utils.Constants;

/**
 * Propagators for orbit observers.
 *
 * <p>TLE: SGP4/SDP4 ({@link TLEPropagator}), the only model a TLE is consistent with. Keplerian
 * elements: Brouwer-Lyddane ({@link BrouwerLyddanePropagator}) with the EIGEN-5C zonal terms J2..J5 that
 * Orekit ships as constants (no data file needed) and no drag: it keeps the J2 nodal regression
 * (about 1 deg/day for a sun-synchronous orbit) and the short-period terms that a two-body propagator
 * would miss, is analytical (fast, no step size), and works for any eccentricity below 1 away from
 * the critical inclination. The elements are taken as osculating in EME2000.
 */
final class Observers {
  private Observers() {}

  static Propagator propagator(OrbitObserver observer, AstroContext ctx) {
    if (observer.orbit() instanceof Tle tle) {
      TLE t = new TLE(tle.line1(), tle.line2(), ctx.utc());
      return TLEPropagator.selectExtrapolator(t, ctx.dataContext().getFrames().getTEME());
    }
    KeplerianElements k = (KeplerianElements) observer.orbit();
    KeplerianOrbit orbit = new KeplerianOrbit(
        k.semiMajorAxisKm() * 1000.0,
        k.eccentricity(),
        FastMath.toRadians(k.inclinationDeg()),
        FastMath.toRadians(k.argumentOfPerigeeDeg()),
        FastMath.toRadians(k.raanDeg()),
        FastMath.toRadians(k.meanAnomalyDeg()),
        PositionAngleType.MEAN,
        ctx.dataContext().getFrames().getEME2000(),
        ctx.date(k.epoch()),
        Constants.EIGEN5C_EARTH_MU);
    return new BrouwerLyddanePropagator(
        orbit,
        Constants.EIGEN5C_EARTH_EQUATORIAL_RADIUS,
        Constants.EIGEN5C_EARTH_MU,
        Constants.EIGEN5C_EARTH_C20,
        Constants.EIGEN5C_EARTH_C30,
        Constants.EIGEN5C_EARTH_C40,
        Constants.EIGEN5C_EARTH_C50,
        BrouwerLyddanePropagator.M2);
  }

  /**
   * {perigee radius less 2 %, perigee speed plus 2 %} of the observer's orbit, metres and m/s: bounds for
   * the rate of lines of sight seen from it (see {@link MovingTracks}).
   */
  static double[] perigeeRadiusAndSpeed(OrbitObserver observer, AstroContext ctx) {
    if (observer.orbit() instanceof Tle tle) {
      TLE t = new TLE(tle.line1(), tle.line2(), ctx.utc());
      return new double[] {MovingTracks.perigeeRadius(t), MovingTracks.perigeeSpeed(t)};
    }
    KeplerianElements k = (KeplerianElements) observer.orbit();
    double a = k.semiMajorAxisKm() * 1000.0;
    double rp = a * (1 - k.eccentricity());
    return new double[] {0.98 * rp, 1.02 * Math.sqrt(Constants.EIGEN5C_EARTH_MU * (2 / rp - 1 / a))};
  }
}
