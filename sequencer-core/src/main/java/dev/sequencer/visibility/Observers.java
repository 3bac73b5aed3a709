package dev.sequencer.visibility;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.Tle;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.propagation.analytical.tle.TLEPropagator;
import org.orekit.time.AbsoluteDate;
import org.orekit.utils.PVCoordinatesProvider;

/**
 * The motion of orbit observers.
 *
 * <p>TLE: SGP4/SDP4 ({@link TLEPropagator}), the only model a TLE is consistent with. Keplerian
 * elements: the format's reference motion, two-body plus J2 integrated numerically
 * ({@link KeplerianMotion}); the elements are osculating in EME2000.
 */
final class Observers {
  private Observers() {}

  /**
   * The observer's position provider, prepared for [from, to] (a Keplerian motion is integrated over that
   * span once; other dates still work, more slowly).
   */
  static PVCoordinatesProvider motion(OrbitObserver observer, AstroContext ctx, AbsoluteDate from, AbsoluteDate to) {
    if (observer.orbit() instanceof Tle tle) {
      TLE t = new TLE(tle.line1(), tle.line2(), ctx.utc());
      return TLEPropagator.selectExtrapolator(t, ctx.dataContext().getFrames().getTEME());
    }
    return KeplerianMotion.of((KeplerianElements) observer.orbit(), ctx, from, to);
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
    return new double[] {0.98 * rp, 1.02 * Math.sqrt(KeplerianMotion.MU * (2 / rp - 1 / a))};
  }
}
