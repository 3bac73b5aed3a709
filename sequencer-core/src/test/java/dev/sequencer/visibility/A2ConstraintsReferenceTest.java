package dev.sequencer.visibility;

import static dev.sequencer.visibility.VisibilityReferenceTest.T0;
import static dev.sequencer.visibility.VisibilityReferenceTest.assertSameWindows;
import static dev.sequencer.visibility.VisibilityReferenceTest.scenario;
import static dev.sequencer.visibility.VisibilityReferenceTest.topo;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import java.util.List;
import java.util.function.ToDoubleFunction;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;
import org.orekit.attitudes.BodyCenterPointing;
import org.orekit.attitudes.FrameAlignedProvider;
import org.orekit.frames.Frame;
import org.orekit.frames.TopocentricFrame;
import org.orekit.orbits.KeplerianOrbit;
import org.orekit.orbits.PositionAngleType;
import org.orekit.propagation.Propagator;
import org.orekit.propagation.SpacecraftState;
import org.orekit.propagation.analytical.KeplerianPropagator;
import org.orekit.propagation.events.BooleanDetector;
import org.orekit.propagation.events.ElevationDetector;
import org.orekit.propagation.events.EventDetector;
import org.orekit.propagation.events.FunctionalDetector;
import org.orekit.propagation.events.GroundAtNightDetector;
import org.orekit.propagation.events.NegateDetector;
import org.orekit.propagation.events.handlers.ContinueOnEvent;
import org.orekit.time.AbsoluteDate;
import org.orekit.utils.Constants;

/**
 * The A2 constraints (airmass, Moon elevation and illumination, daylight, off-nadir) against outside
 * references: Orekit's own detectors and frames on separate propagations, a published example (Meeus),
 * and the scenario format's formulas written again here. Each test also checks that the constraint binds
 * (removes some time but not all). Hour angle and sidereal time are in {@link HourAngleSofaTest}.
 */
class A2ConstraintsReferenceTest {
  private static final AstroContext CTX = AstroContext.offline();
  private static final Frame GCRF = CTX.inertial();
  /** An invented site. */
  private static final GroundSite SITE = new GroundSite(31.0, 20.0, 1200, List.of());

  // ------------------------------------------------------------------------------------------ airmass

  /** The scenario format's formula (Kasten and Young 1989), written again here. */
  private static double airmass(double hDeg) {
    return 1 / (FastMath.sin(FastMath.toRadians(hDeg)) + 0.50572 * FastMath.pow(hDeg + 6.07995, -1.6364));
  }

  @Test
  void airmassFormulaValues() {
    // The formula itself evaluated at given elevations (not Kasten & Young's table, which is not
    // reproduced here). Spec note: X = 0.9997 at the zenith. Hand evaluation (calculator): X(30) = 1.99429,
    // X(0) = 37.9196. Near the zenith X tends to the plane-parallel sec z (common practice): at 60 deg
    // sec z = 1.15470 and X = 1.15399. Tolerances: the printed digits.
    assertEquals(0.9997, Airmass.of(90), 5e-5);
    assertEquals(1.99429, Airmass.of(30), 5e-6);
    assertEquals(37.9196, Airmass.of(0), 5e-5);
    assertEquals(1 / FastMath.sin(FastMath.toRadians(60)), Airmass.of(60), 1e-3);
  }

  @Test
  void airmassFloorInvertsTheFormula() {
    // X(floor(max)) = max on the falling branch; above X(0) the floor is the horizon (the rule h > 0).
    for (double max = 1.0; max < 37.9; max += 0.37) {
      double floor = Airmass.minElevationDeg(max);
      assertEquals(max, airmass(floor), 1e-9 * max, "max " + max);
      assertTrue(airmass(floor - 1e-3) > max && airmass(floor + 1e-3) < max, "max " + max);
    }
    assertEquals(0.0, Airmass.minElevationDeg(40));
  }

  @Test
  void airmassWindowsMatchOrekitElevationAtTheFormulasElevation() {
    // Reference: the elevation where the formula (written here) reaches 2.0, found with a Hipparchus
    // solver, then Orekit's topocentric elevation of the star in a FunctionalDetector on a separate
    // propagation. Edges within 1 s (the visibility tests' tolerance). At each of our edges the airmass
    // from Orekit's elevation is 2.0 to 1e-3 (an edge error of 0.1 s moves a star's elevation by at most
    // 0.0004 deg; dX/dh is 0.07 per deg at 30 deg).
    double max = 2.0;
    double hLimit = new BracketingNthOrderBrentSolver(1e-12, 5).solve(100, h -> airmass(h) - max, 1, 80);
    RaDec star = new RaDec(100, 10);
    Scenario s = scenario(SITE, anyElevation().airmassMax(max).build(), star, 48 * 3600);
    TopocentricFrame topo = topo(SITE.latitudeDeg(), SITE.longitudeDeg(), SITE.altitudeM());
    // The star at its apparent direction (format A1), with the Earth's velocity from SOFA's epv00.
    EventDetector d = detector(st -> topo.getElevation(apparentFar(star, st.getDate()), GCRF, st.getDate())
        - FastMath.toRadians(hLimit));
    assertSameWindows(s, dateOnly(), d);
    RequestVisibility v = new VisibilityCalculator(CTX).compute(s).get(0);
    assertBinds(v, ConstraintFunction.AIRMASS);
    for (TimeWindow w : v.intervals()) {
      for (AbsoluteDate t : List.of(CTX.date(w.start()), CTX.date(w.end()))) {
        if (t.durationFrom(CTX.date(s.horizon().start())) > 1 && CTX.date(s.horizon().end()).durationFrom(t) > 1) {
          assertEquals(max, airmass(FastMath.toDegrees(topo.getElevation(apparentFar(star, t), GCRF, t))), 1e-3);
        }
      }
    }
  }

  @Test
  void airmassAboveTheHorizonValueLeavesOnlyTheRuleHAboveZero() {
    // max = 40 > X(0) = 37.92: the constraint is h > 0, i.e. the geometric horizon (Orekit ElevationDetector
    // semantics on a point at infinity, 1 s).
    RaDec star = new RaDec(230, -5);
    Scenario s = scenario(SITE, anyElevation().airmassMax(40).build(), star, 24 * 3600);
    TopocentricFrame topo = topo(SITE.latitudeDeg(), SITE.longitudeDeg(), SITE.altitudeM());
    assertSameWindows(s, dateOnly(), detector(st -> topo.getElevation(apparentFar(star, st.getDate()), GCRF,
        st.getDate())));
  }

  // ------------------------------------------------------------------------------------------- Moon

  @Test
  void moonIlluminatedFractionMatchesMeeusExample48a() {
    // Meeus, Astronomical Algorithms, 2nd ed., Example 48.a (1992 April 12, 0h TD): phase angle
    // i = 69.0756 deg, illuminated fraction k = 0.6786 (both from memory). Our Sun and Moon are the
    // context's series (arc-second accuracy, docs/astro.md), geometric rather than apparent: the Sun's
    // 20" aberration moves i by at most 20" = 0.006 deg. Tolerances: 0.01 deg on i, 0.0002 on k (4
    // printed decimals plus the series' error, dk = sin(i)/2 di).
    AbsoluteDate t = new AbsoluteDate(1992, 4, 12, 0, 0, 0.0, CTX.timeScales().getTT());
    Scratch s = new Scratch();
    put(s.sun, CTX.sun().getPosition(t, GCRF));
    put(s.moon, CTX.moon().getPosition(t, GCRF));
    double i = ConstraintFunction.moonPhaseAngleDeg(s);
    assertEquals(69.0756, i, 0.01);
    assertEquals(0.6786, (1 + FastMath.cos(FastMath.toRadians(i))) / 2, 2e-4);
  }

  @Test
  void moonIlluminationWindowsMatchAnOrekitTopocentricReference() {
    // Spec: holds when the Moon's centre is below 0 deg at the site, or k = (1 + cos i)/2 <= max with i the
    // geocentric Sun-Moon-Earth angle. Reference written here on Orekit's topocentric frame and vectors, as
    // the larger of the two angle margins (so its zero set is the spec's), on a separate propagation.
    // 10 days: k crosses 0.5 at least once (quarters are 7.4 days apart). Edges within 1 s.
    double max = 0.5;
    double minPhase = FastMath.acos(2 * max - 1);
    TopocentricFrame topo = topo(SITE.latitudeDeg(), SITE.longitudeDeg(), SITE.altitudeM());
    Scenario s = scenario(SITE, anyElevation().moonIlluminationMax(max).build(), new RaDec(10, 10), 10 * 86400);
    EventDetector d = detector(st -> {
      AbsoluteDate t = st.getDate();
      Vector3D moon = CTX.moon().getPosition(t, GCRF);
      Vector3D sun = CTX.sun().getPosition(t, GCRF);
      double phase = Vector3D.angle(sun.subtract(moon), moon.negate());
      return FastMath.max(-topo.getElevation(moon, GCRF, t), phase - minPhase);
    });
    assertSameWindows(s, dateOnly(), d);
    assertBinds(new VisibilityCalculator(CTX).compute(s).get(0), ConstraintFunction.MOON_ILLUMINATION);
  }

  @Test
  void moonElevationWindowsMatchOrekitTopocentricElevation() {
    // Reference: Orekit's topocentric elevation of the Moon's centre (geometric), 2 days, edges within 1 s.
    TopocentricFrame topo = topo(SITE.latitudeDeg(), SITE.longitudeDeg(), SITE.altitudeM());
    Scenario s = scenario(SITE, anyElevation().moonElevationMaxDeg(10).build(), new RaDec(10, 10), 2 * 86400);
    EventDetector d = detector(st -> FastMath.toRadians(10)
        - topo.getElevation(CTX.moon().getPosition(st.getDate(), GCRF), GCRF, st.getDate()));
    assertSameWindows(s, dateOnly(), d);
    assertBinds(new VisibilityCalculator(CTX).compute(s).get(0), ConstraintFunction.MOON_ELEVATION);
  }

  // --------------------------------------------------------------------------------------- daylight

  @Test
  void daylightAtASiteMatchesOrekitGroundAtNightDetector() {
    // Reference: Orekit's GroundAtNightDetector (positive while the Sun is below the dawn/dusk elevation,
    // no refraction model: geometric, as the format says), negated: Sun at least -6 deg. 3 days, 1 s.
    TopocentricFrame topo = topo(-25.0, 135.0, 300);
    GroundSite site = new GroundSite(-25.0, 135.0, 300, List.of());
    Scenario s = scenario(site, anyElevation().sunElevationMinDeg(-6).build(), new RaDec(10, 10), 3 * 86400);
    EventDetector night = new GroundAtNightDetector(topo, CTX.sun(), FastMath.toRadians(-6), null)
        .withMaxCheck(10.0).withThreshold(1e-4);
    assertSameWindows(s, dateOnly(), new NegateDetector(night).withHandler(new ContinueOnEvent()));
    assertBinds(new VisibilityCalculator(CTX).compute(s).get(0), ConstraintFunction.DAYLIGHT);
  }

  @Test
  void daylightAtAnEarthPointSeenFromOrbitMatchesOrekitDetectors() {
    // Spec: sunElevationMinDeg at an Earth point is the Sun's elevation there. Reference: Orekit's
    // ElevationDetector (spacecraft above 0 deg at the point, always applied to Earth points) and the
    // negated GroundAtNightDetector at the point (Sun at least 10 deg), combined with AND, on a separate
    // propagation of the observer. 24 h, 1 s.
    KeplerianElements k = new KeplerianElements(T0, 6_378.137 + 600, 0.001, 97.8, 30, 0, 0);
    OrbitObserver obs = new OrbitObserver(k);
    EarthPoint ep = new EarthPoint(40.0, 15.0, 0);
    TopocentricFrame point = topo(ep.latitudeDeg(), ep.longitudeDeg(), ep.altitudeM());
    Scenario s = scenario(obs, Constraints.builder().sunElevationMinDeg(10).build(), ep, 24 * 3600);
    EventDetector visible = new ElevationDetector(10.0, 1e-4, point).withConstantElevation(0);
    EventDetector day = new NegateDetector(new GroundAtNightDetector(point, CTX.sun(), FastMath.toRadians(10), null));
    EventDetector both = BooleanDetector.andCombine(visible, day).withMaxCheck(10.0).withThreshold(1e-4)
        .withHandler(new ContinueOnEvent());
    assertSameWindows(s, J2Reference.propagator(k, CTX), both);
    assertBinds(new VisibilityCalculator(CTX).compute(s).get(0), ConstraintFunction.DAYLIGHT);
  }

  // -------------------------------------------------------------------------------------- off-nadir

  @Test
  void offNadirWindowsMatchOrekitBodyCenterPointing() {
    // Spec: the angle between the line of sight and the direction to the Earth's centre. Reference: the +Z
    // axis of Orekit's BodyCenterPointing attitude (it points at the body's centre) against the line of sight
    // to the point from Orekit's frames, AND the spacecraft above 0 deg at the point, on a separate
    // propagation. 24 h, 1 s.
    KeplerianElements k = new KeplerianElements(T0, 6_378.137 + 600, 0.001, 97.8, 30, 0, 0);
    OrbitObserver obs = new OrbitObserver(k);
    EarthPoint ep = new EarthPoint(-10.0, 100.0, 0);
    TopocentricFrame point = topo(ep.latitudeDeg(), ep.longitudeDeg(), ep.altitudeM());
    double max = 25;
    Scenario s = scenario(obs, Constraints.builder().offNadirMaxDeg(max).build(), ep, 24 * 3600);
    BodyCenterPointing nadir = new BodyCenterPointing(GCRF, CTX.earth());
    EventDetector offNadir = new FunctionalDetector().withFunction(st -> {
      Vector3D z = nadir.getAttitude(st.getOrbit(), st.getDate(), GCRF).getRotation().applyInverseTo(Vector3D.PLUS_K);
      Vector3D los = point.getPosition(st.getDate(), GCRF).subtract(st.getPosition(GCRF));
      return FastMath.toRadians(max) - Vector3D.angle(z, los);
    });
    EventDetector both = BooleanDetector.andCombine(new ElevationDetector(10.0, 1e-4, point).withConstantElevation(0),
        offNadir).withMaxCheck(10.0).withThreshold(1e-4).withHandler(new ContinueOnEvent());
    assertSameWindows(s, J2Reference.propagator(k, CTX), both);
    assertBinds(new VisibilityCalculator(CTX).compute(s).get(0), ConstraintFunction.OFF_NADIR);
  }

  @Test
  void offNadirIsZeroDirectlyBelowAndFollowsTheTriangleElsewhere() {
    // A point on the line from the spacecraft to the Earth's centre is at 0 deg. Elsewhere, in the plane
    // triangle (Earth centre O, spacecraft S, point P) with central angle theta at O, the angle at S is
    // atan(|OP| sin theta / (|OS| - |OP| cos theta)) (plane geometry, common practice). 1e-9 deg: rounding.
    Scratch s = new Scratch();
    Vector3D sat = new Vector3D(3_000_000, -5_000_000, 4_200_000);
    Vector3D below = sat.normalize().scalarMultiply(6_371_000);
    put(s.obs, sat);
    put(s.los, below.subtract(sat).normalize());
    assertEquals(0.0, ConstraintFunction.offNadirDeg(s), 1e-9);
    Vector3D p = new Vector3D(5_000_000, -2_000_000, 3_500_000);
    put(s.los, p.subtract(sat).normalize());
    double theta = Vector3D.angle(sat, p);
    double expected = FastMath.toDegrees(FastMath.atan2(p.getNorm() * FastMath.sin(theta),
        sat.getNorm() - p.getNorm() * FastMath.cos(theta)));
    assertEquals(expected, ConstraintFunction.offNadirDeg(s), 1e-9);
  }

  // -------------------------------------------------------------------------------------------------

  /** Disables the default elevation >= 0 of ground sites so that only the constraint under test binds. */
  private static Constraints.Builder anyElevation() {
    return Constraints.builder().elevationMinDeg(-90);
  }

  /** A propagation whose states only carry the date (for detectors of the Sun, Moon and stars). */
  private static Propagator dateOnly() {
    KeplerianOrbit orbit = new KeplerianOrbit(7.0e6, 0, 0, 0, 0, 0, PositionAngleType.MEAN, GCRF, CTX.date(T0),
        Constants.EIGEN5C_EARTH_MU);
    return new KeplerianPropagator(orbit, new FrameAlignedProvider(GCRF));
  }

  /** Orekit's event detection on {@code g} (radians), max check 10 s, threshold 0.1 ms. */
  private static EventDetector detector(ToDoubleFunction<SpacecraftState> g) {
    return new FunctionalDetector().withFunction(g).withMaxCheck(10.0).withThreshold(1e-4)
        .withHandler(new ContinueOnEvent());
  }

  /**
   * A point at infinity along the star's apparent direction: first-order annual aberration u + v/c −
   * (u·v/c) u with the Earth's barycentric velocity from SOFA's {@code epv00} (outside reference; diurnal
   * aberration neglected, as the format allows; second-order terms are below 0.001").
   */
  private static Vector3D apparentFar(RaDec rd, AbsoluteDate t) {
    double[] tt = dev.sequencer.astro.Sofa.tt(CTX, t);
    double[][] pvh = new double[2][3];
    double[][] pvb = new double[2][3];
    org.jastronomy.jsofa.JSOFA.jauEpv00(tt[0], tt[1], pvh, pvb);
    Vector3D beta = dev.sequencer.astro.Sofa.vector(pvb[1]).scalarMultiply(1.0 / dev.sequencer.astro.Sofa.C_AU_PER_DAY);
    Vector3D u = direction(rd);
    Vector3D apparent = u.add(beta).subtract(u.dotProduct(beta), u).normalize();
    return apparent.scalarMultiply(1e15);
  }

  private static Vector3D direction(RaDec rd) {
    return new Vector3D(FastMath.toRadians(rd.raDeg()), FastMath.toRadians(rd.decDeg()));
  }

  private static void put(double[] out, Vector3D v) {
    out[0] = v.getX();
    out[1] = v.getY();
    out[2] = v.getZ();
  }

  /** The constraint removes some of the horizon, and the request is still visible some of the time. */
  private static void assertBinds(RequestVisibility v, String constraint) {
    assertTrue(v.removedS().get(constraint) > 60, constraint + " removes " + v.removedS().get(constraint) + " s");
    assertTrue(v.totalS() > 60, constraint + ": never visible");
  }
}
