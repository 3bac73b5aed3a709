package dev.sequencer.visibility;

import static dev.sequencer.visibility.VisibilityReferenceTest.T0;
import static dev.sequencer.visibility.VisibilityReferenceTest.describe;
import static dev.sequencer.visibility.VisibilityReferenceTest.scenario;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.jastronomy.jsofa.JSOFA;
import org.junit.jupiter.api.Test;
import org.orekit.frames.StaticTransform;
import org.orekit.time.AbsoluteDate;

/**
 * Hour angle and sidereal time against SOFA (jsofa, the Java translation of the IAU SOFA library, at
 * test scope). UT1 = UTC on both sides: the offline context has no Earth-orientation data.
 */
class HourAngleSofaTest {
  private static final AstroContext CTX = AstroContext.offline();
  /** An invented site. */
  private static final GroundSite SITE = new GroundSite(31.0, 20.0, 1200, List.of());
  private static final double SIDEREAL_DEG_PER_S = 360.98564736629 / 86400.0;

  @Test
  void hourAngleOfTheTrueEquinoxIsLocalApparentSiderealTime() {
    // SOFA gst06a (GAST, IAU 2006/2000A) + east longitude = LAST, the hour angle of the true equinox of
    // date, whose GCRS direction is the first row of SOFA's pnm06a matrix. Our hour angle uses Orekit's
    // Earth-fixed axes (IERS 2010, same precession-nutation model). Tolerance 1e-6 deg (3.6 mas): the two
    // implement the same model and agree to about 4e-9 deg; Orekit interpolates its precession-nutation.
    for (int day = 0; day < 400; day += 37) {
      AbsoluteDate t = CTX.date(T0).shiftedBy(day * 86400.0 + 3600.0 * (day % 24));
      double[] tt = ttJd(t);
      double[] ut = utJd(t);
      double[] equinox = JSOFA.jauTrxp(JSOFA.jauPnm06a(tt[0], tt[1]), new double[] {1, 0, 0});
      double last = Math.toDegrees(JSOFA.jauGst06a(ut[0], ut[1], tt[0], tt[1])) + SITE.longitudeDeg();
      assertEquals(0.0, ConstraintFunction.wrapDeg(ours(equinox, t) - last), 1e-6, "day " + day);
    }
  }

  @Test
  void hourAngleOfTheCioIsTheEarthRotationAngle() {
    // SOFA era00 (Earth rotation angle) + east longitude is the hour angle of the CIO, whose GCRS direction
    // is the first row of SOFA's c2i06a matrix. Same tolerance and reason as above.
    for (int day = 0; day < 400; day += 41) {
      AbsoluteDate t = CTX.date(T0).shiftedBy(day * 86400.0 + 1800.0 * (day % 48));
      double[] tt = ttJd(t);
      double[] ut = utJd(t);
      double[] cio = JSOFA.jauTrxp(JSOFA.jauC2i06a(tt[0], tt[1]), new double[] {1, 0, 0});
      double era = Math.toDegrees(JSOFA.jauEra00(ut[0], ut[1])) + SITE.longitudeDeg();
      assertEquals(0.0, ConstraintFunction.wrapDeg(ours(cio, t) - era), 1e-6, "day " + day);
    }
  }

  @Test
  void hourAngleWindowsMatchSofaApparentPlaces() {
    // Reference: HA = ERA + longitude - RA of the star's apparent place in CIRS (SOFA atci13: precession,
    // nutation, light deflection and annual aberration), edges found here by bisection on SOFA alone.
    // Tolerance 0.1 s: the engine's 0.05 s edge refinement, plus what our apparent place leaves out
    // (light deflection and diurnal aberration, well under 0.5", i.e. under 0.04 s of hour angle).
    RaDec star = new RaDec(80, 20);
    double minH = -2;
    double maxH = 3;
    Scenario s = scenario(SITE, Constraints.builder().elevationMinDeg(-90).hourAngleMinH(minH).hourAngleMaxH(maxH)
        .build(), star, 3 * 86400);
    AbsoluteDate origin = CTX.date(s.horizon().start());
    double centre = 15 * (minH + maxH) / 2;
    double half = 15 * (maxH - minH) / 2;
    List<double[]> ref = positive(tS -> half - Math.abs(ConstraintFunction.wrapDeg(sofaHourAngleDeg(star,
        origin.shiftedBy(tS)) - centre)), 3 * 86400);
    RequestVisibility v = new VisibilityCalculator(CTX).compute(s).get(0);
    List<TimeWindow> w = v.intervals();
    assertEquals(ref.size(), w.size(), w + " vs " + describe(ref));
    assertEquals(3, w.size());
    for (int i = 0; i < ref.size(); i++) {
      assertEquals(ref.get(i)[0], CTX.date(w.get(i).start()).durationFrom(origin), 0.1, w + " vs " + describe(ref));
      assertEquals(ref.get(i)[1], CTX.date(w.get(i).end()).durationFrom(origin), 0.1, w + " vs " + describe(ref));
    }
    assertTrue(v.removedS().get(ConstraintFunction.HOUR_ANGLE) > 3600);
  }

  @Test
  void anHourAngleWindowShorterThanTheGridStepIsFound() {
    // Edge case: a constraint that flips faster than the 30 s grid step. The hour angle's rate is known
    // (the sidereal rate), so the slope test is a proof down to 1 s: a range of 20 s of hour angle gives a
    // window of 20 / 1.0027379 = 19.95 s of time once per sidereal day (common practice: 1.0027379 sidereal
    // seconds per solar second). 0.2 s: the refined edges' accuracy (0.05 s) on both sides plus the
    // inward millisecond rounding, with margin.
    double minH = 1.0;
    double maxH = 1.0 + 20.0 / 3600;
    Scenario s = scenario(SITE, Constraints.builder().elevationMinDeg(-90).hourAngleMinH(minH).hourAngleMaxH(maxH)
        .build(), new RaDec(45, 0), 2 * 86400);
    List<TimeWindow> w = new VisibilityCalculator(CTX).compute(s).get(0).intervals();
    assertEquals(2, w.size(), w.toString());
    for (TimeWindow x : w) {
      assertEquals(20 / 1.0027379, x.durationS(), 0.2, w.toString());
    }
  }

  // -------------------------------------------------------------------------------------------------

  /** Our hour angle of a GCRS direction at t (Orekit's Earth-fixed axes). */
  private static double ours(double[] dir, AbsoluteDate t) {
    StaticTransform toGcrf = CTX.earthFixed().getStaticTransformTo(CTX.inertial(), t);
    Vector3D x = toGcrf.transformVector(Vector3D.PLUS_I);
    Vector3D y = toGcrf.transformVector(Vector3D.PLUS_J);
    return ConstraintFunction.hourAngleDeg(dir, x.toArray(), y.toArray(), SITE.longitudeDeg());
  }

  /** Hour angle from SOFA: ERA + longitude - CIRS right ascension of the apparent place (atci13). */
  private static double sofaHourAngleDeg(RaDec star, AbsoluteDate t) {
    double[] tt = ttJd(t);
    double[] ut = utJd(t);
    JSOFA.SphericalCoordinateEO apparent = JSOFA.jauAtci13(Math.toRadians(star.raDeg()),
        Math.toRadians(star.decDeg()), 0, 0, 0, 0, tt[0], tt[1]);
    return Math.toDegrees(JSOFA.jauEra00(ut[0], ut[1]) - apparent.pos.alpha) + SITE.longitudeDeg();
  }

  /** TT as a two-part Julian date (J2000 epoch and days since). TDB differs by under 2 ms: negligible. */
  private static double[] ttJd(AbsoluteDate t) {
    return new double[] {2451545.0, t.durationFrom(CTX.timeScales().getJ2000Epoch()) / 86400.0};
  }

  /** UT1 (= UTC here) as a two-part Julian date. */
  private static double[] utJd(AbsoluteDate t) {
    double s = CTX.instant(t).getEpochSecond() + CTX.instant(t).getNano() * 1e-9;
    return new double[] {2440587.5, s / 86400.0};
  }

  /** Where g >= 0 on [0, lengthS]: 60 s scan, each sign change bisected to 1e-4 s. */
  private static List<double[]> positive(DoubleUnaryOperator g, double lengthS) {
    List<double[]> out = new ArrayList<>();
    double open = g.applyAsDouble(0) >= 0 ? 0 : Double.NaN;
    double prevT = 0;
    double prevG = g.applyAsDouble(0);
    for (double t = 60; t <= lengthS + 1e-9; t += 60) {
      double gt = g.applyAsDouble(t);
      if ((prevG >= 0) != (gt >= 0)) {
        double a = prevT;
        double b = t;
        while (b - a > 1e-4) {
          double m = (a + b) / 2;
          if ((g.applyAsDouble(m) >= 0) == (prevG >= 0)) {
            a = m;
          } else {
            b = m;
          }
        }
        if (gt >= 0) {
          open = b;
        } else {
          out.add(new double[] {open, a});
          open = Double.NaN;
        }
      }
      prevT = t;
      prevG = gt;
    }
    if (!Double.isNaN(open)) {
      out.add(new double[] {open, lengthS});
    }
    return out;
  }
}
