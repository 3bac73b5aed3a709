package dev.sequencer.visibility;

import static dev.sequencer.visibility.VisibilityReferenceTest.T0;
import static dev.sequencer.visibility.VisibilityReferenceTest.leoTle;
import static dev.sequencer.visibility.VisibilityReferenceTest.scenario;
import static dev.sequencer.visibility.VisibilityReferenceTest.topo;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Tle;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.ode.events.Action;
import org.jastronomy.jsofa.JSOFA;
import org.junit.jupiter.api.Test;
import org.orekit.bodies.GeodeticPoint;
import org.orekit.frames.TopocentricFrame;
import org.orekit.propagation.Propagator;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.propagation.analytical.tle.TLEPropagator;
import org.orekit.propagation.events.ElevationDetector;
import org.orekit.propagation.events.ElevationExtremumDetector;
import org.orekit.propagation.events.EventsLogger;
import org.orekit.time.AbsoluteDate;

/**
 * {@link SkyValues}, the numbers shown in reports, against references the project did not write: SOFA
 * (jsofa, test scope) for sidereal time, Orekit's own event detectors for pass times, Orekit's topocentric
 * frame for elevation and Moon separation, Meeus for the Moon's illuminated fraction.
 */
class SkyValuesReferenceTest {
  private static final AstroContext CTX = AstroContext.offline();
  /** An invented site. */
  private static final GroundSite SITE = new GroundSite(-24.5, -70.2, 2400, List.of());

  @Test
  void localSiderealTimeIsSofaGst06aPlusLongitude() {
    // Reference: SOFA gst06a (GAST, IAU 2006/2000A) with UT1 = UTC, plus the east longitude. Tolerance
    // 1e-6 h (3.6 ms of time): both implement the same model (see HourAngleSofaTest for the agreement).
    Scenario s = scenario(SITE, Constraints.builder().build(), new RaDec(10, 10), 3 * 86400);
    SkyValues v = SkyValues.of(s, CTX);
    for (int k = 0; k < 30; k++) {
      Instant t = T0.plusSeconds(8643L * k + 17);
      AbsoluteDate d = CTX.date(t);
      double[] tt = {2451545.0, d.durationFrom(CTX.timeScales().getJ2000Epoch()) / 86400.0};
      double[] ut = {2440587.5, (t.getEpochSecond() + t.getNano() * 1e-9) / 86400.0};
      double lastH = (Math.toDegrees(JSOFA.jauGst06a(ut[0], ut[1], tt[0], tt[1])) + SITE.longitudeDeg()) / 15.0;
      double diff = v.localSiderealTimeH(t) - lastH;
      diff -= 24 * Math.rint(diff / 24);
      assertEquals(0.0, diff, 1e-6, "at " + t);
      assertTrue(v.localSiderealTimeH(t) >= 0 && v.localSiderealTimeH(t) < 24);
    }
  }

  @Test
  void passesMatchOrekitElevationDetectorAndExtremumDetector() {
    // Reference: Orekit's ElevationDetector (0 deg, geometric) and ElevationExtremumDetector on the TLE's own
    // SGP4 propagation, not our 30 s grid. Tolerance 0.05 s for rise/set: our bisection stops at 1 ms and
    // the grid's cubic interpolation moves a LEO position by under a metre (about 1e-3 s at the horizon);
    // culmination 1 s in time (the golden section stops at 0.1 s, the elevation is flat there) and 1e-3
    // deg in elevation (measured worst 3.2e-4 deg: the grid's interpolated position, a few metres at the
    // 500-700 km range of a high pass).
    Random rnd = new Random(21);
    int passes = 0;
    for (int trial = 0; trial < 3; trial++) {
      TLE tle = leoTle(91001 + trial, 50 + 45 * rnd.nextDouble(), 360 * rnd.nextDouble(), 360 * rnd.nextDouble(),
          14.5 + rnd.nextDouble());
      Scenario s = scenario(SITE, Constraints.builder().build(), new OrbitingTarget(new Tle(tle.getLine1(),
          tle.getLine2())), 24 * 3600);
      List<SkyValues.Pass> ours = SkyValues.of(s, CTX).passes(s.requests().get(0), 0.0);
      Propagator p = TLEPropagator.selectExtrapolator(tle, CTX.dataContext().getFrames().getTEME());
      TopocentricFrame topo = topo(SITE.latitudeDeg(), SITE.longitudeDeg(), SITE.altitudeM());
      EventsLogger log = new EventsLogger();
      p.addEventDetector(log.monitorDetector(new ElevationDetector(10.0, 1e-5, topo)
          .withHandler((st, det, inc) -> Action.CONTINUE)));
      p.addEventDetector(log.monitorDetector(new ElevationExtremumDetector(10.0, 1e-5, topo)
          .withHandler((st, det, inc) -> Action.CONTINUE)));
      AbsoluteDate start = CTX.date(s.horizon().start());
      p.propagate(start, CTX.date(s.horizon().end()));
      List<double[]> ref = new ArrayList<>(); // rise, culmination, culmination elevation, set
      double[] open = null;
      for (EventsLogger.LoggedEvent e : log.getLoggedEvents()) {
        double t = e.getState().getDate().durationFrom(start);
        if (e.getEventDetector() instanceof ElevationDetector) {
          if (e.isIncreasing()) {
            open = new double[] {t, Double.NaN, Double.NaN, Double.NaN};
          } else if (open != null) {
            open[3] = t;
            ref.add(open);
            open = null;
          }
        } else if (open != null && !e.isIncreasing()) { // a maximum while above the horizon
          open[1] = t;
          open[2] = Math.toDegrees(topo.getElevation(e.getState().getPosition(), e.getState().getFrame(),
              e.getState().getDate()));
        }
      }
      List<SkyValues.Pass> complete = ours.stream().filter(x -> !x.risesBeforeHorizon() && !x.setsAfterHorizon()).toList();
      assertEquals(ref.size(), complete.size(), "trial " + trial + ": number of complete passes");
      for (int i = 0; i < ref.size(); i++) {
        SkyValues.Pass o = complete.get(i);
        assertEquals(ref.get(i)[0], CTX.date(o.rise()).durationFrom(start), 0.05, "rise " + i);
        assertEquals(ref.get(i)[3], CTX.date(o.set()).durationFrom(start), 0.05, "set " + i);
        assertEquals(ref.get(i)[1], CTX.date(o.culmination()).durationFrom(start), 1.0, "culmination " + i);
        assertEquals(ref.get(i)[2], o.culminationElevationDeg(), 1e-3, "culmination elevation " + i);
        passes++;
      }
    }
    assertTrue(passes >= 6, "too few passes to mean anything: " + passes);
  }

  @Test
  void elevationAirmassAndMoonSeparationMatchOrekitTopocentricFrame() {
    // Reference: Orekit's TopocentricFrame elevation of the star's GCRF direction, and the angle to the
    // context's Moon position minus the site's GCRF position (Orekit frames; the Moon series is shared with
    // the code under test). Our line of sight carries annual aberration (format A1, at most 20.5"), so the
    // tolerance is 0.006 deg in angle. Airmass: the Kasten and Young formula written out here (spec), on the
    // reference elevation; tolerance from d X / d h (at most 0.35 per deg above 20 deg) times 0.006 deg.
    Scenario s = scenario(SITE, Constraints.builder().build(), new RaDec(83.6, -5.4), 86400);
    SkyValues v = SkyValues.of(s, CTX);
    TopocentricFrame topo = topo(SITE.latitudeDeg(), SITE.longitudeDeg(), SITE.altitudeM());
    Vector3D star = new Vector3D(Math.toRadians(83.6), Math.toRadians(-5.4));
    Vector3D siteItrf = CTX.earth().transform(new GeodeticPoint(Math.toRadians(SITE.latitudeDeg()),
        Math.toRadians(SITE.longitudeDeg()), SITE.altitudeM()));
    int checked = 0;
    for (int k = 0; k < 48; k++) {
      Instant t = T0.plusSeconds(1800L * k + 7);
      AbsoluteDate d = CTX.date(t);
      // Sun and Moon first, on a fresh object, so that a horizon frame left over from a target would show.
      SkyValues fresh = SkyValues.of(s, CTX);
      Vector3D sunPos = CTX.sun().getPosition(d, CTX.inertial());
      assertEquals(Math.toDegrees(topo.getElevation(sunPos, CTX.inertial(), d)), fresh.sunElevationDeg(t), 1e-4,
          "Sun elevation at " + t);
      double el = Math.toDegrees(topo.getElevation(star.scalarMultiply(1e22), CTX.inertial(), d)); // a point at infinity
      assertEquals(el, v.elevationDeg(s.requests().get(0), t), 0.006, "elevation at " + t);
      Vector3D site = CTX.earthFixed().getStaticTransformTo(CTX.inertial(), d).transformPosition(siteItrf);
      double moonSep = Math.toDegrees(Vector3D.angle(star, CTX.moon().getPosition(d, CTX.inertial()).subtract(site)));
      assertEquals(moonSep, v.moonSeparationDeg(s.requests().get(0), t), 0.006, "Moon separation at " + t);
      if (el > 20) {
        double x = 1 / (Math.sin(Math.toRadians(el)) + 0.50572 * Math.pow(el + 6.07995, -1.6364));
        assertEquals(x, v.airmass(s.requests().get(0), t), 0.35 * 0.006, "airmass at " + t);
        checked++;
      } else if (el < -0.1) {
        assertTrue(Double.isNaN(v.airmass(s.requests().get(0), t)), "no airmass below the horizon");
      }
      double moonEl = Math.toDegrees(topo.getElevation(CTX.moon().getPosition(d, CTX.inertial()), CTX.inertial(), d));
      assertEquals(moonEl, v.moonElevationDeg(t), 1e-4, "Moon elevation at " + t);
    }
    assertTrue(checked > 5, "the star must be well up part of the day");
  }

  @Test
  void moonIlluminatedFractionMatchesMeeusExample() {
    // Meeus, Astronomical Algorithms, 2nd ed., Example 48.a: 1992 April 12, 0h TD, k = 0.6786 (from memory).
    // TD - UTC was about 59 s then. Tolerance 0.002: our Moon and Sun series versus Meeus's truncated
    // ones; the fraction changes by about 0.004 per hour at that phase, so a minute of time is negligible.
    Instant t = Instant.parse("1992-04-11T23:59:01Z");
    Scenario s = new Scenario(1, "meeus", new dev.sequencer.model.TimeWindow(t.minusSeconds(60), t.plusSeconds(60)),
        SITE, Constraints.builder().build(), new dev.sequencer.model.SlewSettings.Fixed(0), null,
        List.of(dev.sequencer.model.Request.of("R1", new RaDec(0, 0), 60, 1)), null);
    assertEquals(0.6786, SkyValues.of(s, CTX).moonIlluminatedFraction(t), 0.002);
  }

  @Test
  void subObserverPointMatchesOrekitGeodeticTransform() {
    // Reference: the observer's orbit propagated by the J2 reference (J2Reference, Orekit's numerical
    // propagator), its position turned into geodetic coordinates by Orekit's ellipsoid. Tolerance 0.01 deg
    // (about 1 km): our integration of the same J2 motion and the 30 s grid interpolation agree far better.
    KeplerianElements k = new KeplerianElements(T0, 6_378.137 + 600, 0.001, 97.8, 30, 0, 0);
    Scenario s = scenario(new OrbitObserver(k), Constraints.builder().build(), new RaDec(0, 0), 6 * 3600);
    SkyValues v = SkyValues.of(s, CTX);
    assertTrue(v.inOrbit());
    assertFalse(v.atGroundSite());
    Propagator p = J2Reference.propagator(k, CTX);
    for (int i = 0; i < 20; i++) {
      Instant t = T0.plusSeconds(1000L * i + 3);
      AbsoluteDate d = CTX.date(t);
      GeodeticPoint gp = CTX.earth().transform(p.propagate(d).getPosition(CTX.earthFixed()), CTX.earthFixed(), d);
      double[] ours = v.subObserverLatLonDeg(t);
      assertEquals(Math.toDegrees(gp.getLatitude()), ours[0], 0.01, "latitude at " + t);
      double dl = Math.toDegrees(gp.getLongitude()) - ours[1];
      assertEquals(0, dl - 360 * Math.rint(dl / 360), 0.01, "longitude at " + t);
    }
    assertTrue(Double.isNaN(v.localSiderealTimeH(T0)), "no sidereal time without a site");
  }
}
