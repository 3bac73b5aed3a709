package dev.sequencer.visibility;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Tle;
import dev.sequencer.slew.PointingTrack;
import java.time.Instant;
import java.util.List;
import java.util.Random;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;
import org.orekit.propagation.analytical.tle.TLE;

/**
 * The rate bounds of moving pointing tracks are upper bounds: over random intervals the sampled rates
 * (finite differences at 1 s) never exceed them. The slew bounds of the sequencer are only as safe as these.
 */
class MovingTracksTest {
  private static final AstroContext CTX = AstroContext.offline();
  private static final Instant T0 = Instant.parse("2031-03-10T00:00:00Z");

  @Test
  void orbitingObjectFromGroundSiteRatesAreBounds() {
    Random rnd = new Random(7);
    for (int trial = 0; trial < 6; trial++) {
      TLE tle = VisibilityReferenceTest.leoTle(90100 + trial, 40 + 60 * rnd.nextDouble(), 360 * rnd.nextDouble(),
          360 * rnd.nextDouble(), 14 + 1.5 * rnd.nextDouble());
      GroundSite site = new GroundSite(-50 + 100 * rnd.nextDouble(), 360 * rnd.nextDouble() - 180, 300, List.of());
      Scenario s = scenario(site, new OrbitingTarget(new Tle(tle.getLine1(), tle.getLine2())));
      PointingTrack track = PointingTracks.of(s, CTX).get(0);
      checkRates(track, rnd, true);
    }
  }

  @Test
  void earthPointFromOrbitRatesAreBounds() {
    Random rnd = new Random(8);
    KeplerianElements k = new KeplerianElements(T0, 6_378.137 + 500, 0.001, 97.4, 20, 0, 0);
    for (int trial = 0; trial < 6; trial++) {
      EarthPoint p = new EarthPoint(-70 + 140 * rnd.nextDouble(), 360 * rnd.nextDouble() - 180, 0);
      PointingTrack track = PointingTracks.of(scenario(new OrbitObserver(k), p), CTX).get(0);
      checkRates(track, rnd, false);
    }
  }

  private static void checkRates(PointingTrack track, Random rnd, boolean ground) {
    for (int i = 0; i < 20; i++) {
      double t0 = 43_000 * rnd.nextDouble();
      double t1 = t0 + 600 * rnd.nextDouble();
      double ang = track.maxAngularRateDegPerS(t0, t1);
      double el = ground ? track.maxElevationRateDegPerS(t0, t1) : 0;
      double az = ground ? track.maxAzimuthRateDegPerS(t0, t1) : 0;
      for (double t = t0; t + 1 <= t1; t += Math.max(1, (t1 - t0) / 50)) {
        Vector3D a = track.inertialDirection(t);
        Vector3D b = track.inertialDirection(t + 1);
        double sampled = Math.toDegrees(Vector3D.angle(a, b));
        double tt = t;
        assertTrue(sampled <= ang, () -> "angular rate " + sampled + " > bound " + ang + " at " + tt);
        if (ground) {
          double dEl = Math.abs(track.azEl(t + 1).elevationDeg() - track.azEl(t).elevationDeg());
          double dAz = Math.abs(Math.IEEEremainder(track.azEl(t + 1).azimuthDeg() - track.azEl(t).azimuthDeg(), 360));
          assertTrue(dEl <= el, () -> "elevation rate " + dEl + " > bound " + el + " at " + tt);
          assertTrue(dAz <= az, () -> "azimuth rate " + dAz + " > bound " + az + " at " + tt);
        }
      }
    }
  }

  private static Scenario scenario(dev.sequencer.model.Observer o, dev.sequencer.model.Target target) {
    return new Scenario(1, "t", new TimeWindow(T0, T0.plusSeconds(43_200)), o, Constraints.none(),
        new SlewSettings.Eigenaxis(1, 0.1, 5), null, List.of(Request.of("R", target, 60, 1)), null);
  }
}
