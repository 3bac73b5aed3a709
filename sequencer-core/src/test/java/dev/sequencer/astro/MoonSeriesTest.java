package dev.sequencer.astro;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.geometry.euclidean.threed.FieldVector3D;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.util.Binary64;
import org.hipparchus.util.FastMath;
import org.hipparchus.util.MathUtils;
import org.junit.jupiter.api.Test;
import org.orekit.frames.Frame;
import org.orekit.time.AbsoluteDate;
import org.orekit.utils.Constants;
import org.orekit.utils.IERSConventions;
import org.orekit.utils.TimeStampedPVCoordinates;

class MoonSeriesTest {
  private static final AstroContext CTX = AstroContext.offline();
  /** 1992 April 12.0 TD (JDE 2448724.5), Meeus Example 47.a. */
  private static final AbsoluteDate TD_1992_04_12 =
      new AbsoluteDate(1992, 4, 12, 0, 0, 0.0, CTX.timeScales().getTT());

  private static double lambdaDeg(Vector3D ecliptic) {
    return FastMath.toDegrees(MathUtils.normalizeAngle(ecliptic.getAlpha(), FastMath.PI));
  }

  @Test
  void seriesReproducesMeeusExample47a() {
    // Meeus, Astronomical Algorithms, 2nd ed., Example 47.a (from memory of the book): lambda = 133.162655 deg,
    // beta = -3.229126 deg, Delta = 368409.7 km. Same series, so only the example's rounding of its
    // intermediate arguments (to 1e-6 deg, multiplied by up to 4) separates us: tolerance 1e-5 deg (0.04"),
    // and 0.1 km for Delta (printed to 0.1 km).
    // T = (JDE 2448724.5 - 2451545.0) / 36525 by definition (Meeus eq. 22.1).
    double t = TD_1992_04_12.durationFrom(CTX.timeScales().getJ2000Epoch()) / Constants.JULIAN_CENTURY;
    assertEquals((2448724.5 - 2451545.0) / 36525.0, t, 1e-14);
    Vector3D moon = MoonSeries.eclipticPositionM(new Binary64(t), false).toVector3D();
    assertEquals(133.162655, lambdaDeg(moon), 1e-5);
    assertEquals(-3.229126, FastMath.toDegrees(moon.getDelta()), 1e-5);
    assertEquals(368409.7, moon.getNorm() / 1000.0, 0.1);
  }

  @Test
  void providerIsGeometricMeeusPlusConstantLightTime() {
    // Meeus Example 47.a lambda = 133.162655 deg includes the constant light-time term -0.70" of L'
    // (Meeus ch. 47, from memory); the provider removes it, so expect lambda + 0.70". Through Orekit's
    // ecliptic -> GCRF -> ecliptic transforms (round trip at 1e-15 rad). Tolerances as above.
    Frame ecliptic = CTX.dataContext().getFrames().getEcliptic(IERSConventions.IERS_2010);
    Vector3D moon = CTX.moon().getPosition(TD_1992_04_12, ecliptic);
    assertEquals(133.162655 + 0.70 / 3600.0, lambdaDeg(moon), 1e-5);
    assertEquals(-3.229126, FastMath.toDegrees(moon.getDelta()), 1e-5);
    assertEquals(368409.7, moon.getNorm() / 1000.0, 0.1);
  }

  @Test
  void apparentPlaceMatchesMeeusExample47a() {
    // Meeus Example 47.a (from memory of the book): apparent alpha = 134.688470 deg, delta = 13.768368 deg
    // (lambda + nutation 0.004610 deg, true obliquity 23.440636 deg). Differences: our light-time from the
    // actual distance and motion vs the book's constant -0.70" (< 0.05"), IAU 2000A vs 1980 nutation
    // (< 0.05"), IAU 2006 vs 1976 obliquity (0.04"), frame bias (0.02"). Tolerance 0.3" on the sky.
    ApparentPlace moon = ApparentPlace.raDecOfDate(CTX.moon(), TD_1992_04_12, CTX);
    double cosDec = FastMath.cos(FastMath.toRadians(13.768368));
    assertEquals(0.0, (moon.raDeg() - 134.688470) * cosDec * 3600.0, 0.3);
    assertEquals(0.0, (moon.decDeg() - 13.768368) * 3600.0, 0.3);
  }

  @Test
  void distanceStaysBetweenPerigeeAndApogeeLimitsThroughout2031() {
    // Common knowledge (from memory): the Moon's geocentric distance stays within about 356,400-406,700 km;
    // bounds 356,000-407,000 km. Each year reaches perigees below 360,000 km and apogees above 405,000 km,
    // which shows the sampled range is not degenerate. Hourly samples over 2031.
    AbsoluteDate start = new AbsoluteDate(2031, 1, 1, 0, 0, 0.0, CTX.utc());
    double minKm = Double.MAX_VALUE;
    double maxKm = 0.0;
    for (int hour = 0; hour < 365 * 24; hour++) {
      double km = CTX.moon().getPosition(start.shiftedBy(hour * 3600.0), CTX.inertial()).getNorm() / 1000.0;
      minKm = Math.min(minKm, km);
      maxKm = Math.max(maxKm, km);
    }
    assertTrue(minKm > 356_000 && minKm < 360_000, "2031 minimum distance " + minKm + " km");
    assertTrue(maxKm < 407_000 && maxKm > 405_000, "2031 maximum distance " + maxKm + " km");
  }

  @Test
  void fieldEvaluationMatchesRealAndGivesVelocity() {
    // Real and field paths share the series; Binary64 must agree with the double path to rounding
    // (1e-6 m at 4e8 m). The velocity by automatic differentiation must match a central difference with
    // h = 60 s (truncation h^2/6 * |jerk| ~ 600 * 4e-8 m/s^3 ~ 2e-5 m/s; rounding ~1e-8 m / 120 s).
    // Tolerance 1e-4 m/s against a speed of about 1 km/s.
    Frame gcrf = CTX.inertial();
    AbsoluteDate date = new AbsoluteDate(2031, 5, 5, 12, 0, 0.0, CTX.utc());
    FieldVector3D<Binary64> field = CTX.moon().getPosition(
        new org.orekit.time.FieldAbsoluteDate<>(org.hipparchus.util.Binary64Field.getInstance(), date), gcrf);
    assertEquals(0.0, field.toVector3D().subtract(CTX.moon().getPosition(date, gcrf)).getNorm(), 1e-6);
    TimeStampedPVCoordinates pv = CTX.moon().getPVCoordinates(date, gcrf);
    Vector3D difference = CTX.moon().getPosition(date.shiftedBy(60), gcrf)
        .subtract(CTX.moon().getPosition(date.shiftedBy(-60), gcrf)).scalarMultiply(1.0 / 120.0);
    assertEquals(0.0, pv.getVelocity().subtract(difference).getNorm(), 1e-4);
    assertTrue(pv.getVelocity().getNorm() > 900 && pv.getVelocity().getNorm() < 1_100,
        "geocentric Moon speed " + pv.getVelocity().getNorm() + " m/s (about 1.02 km/s)");
  }
}
