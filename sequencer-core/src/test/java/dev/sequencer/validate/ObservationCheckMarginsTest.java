package dev.sequencer.validate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.Aberration;
import dev.sequencer.astro.AstroContext;
import dev.sequencer.astro.Topocentric;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Observer;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Refraction;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import java.time.Instant;
import java.util.List;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;
import org.orekit.time.AbsoluteDate;

/**
 * The physics oracle's margins, one constraint at a time, at one instant, against values computed here
 * with the astro package's helpers (Orekit's topocentric frame through {@link Topocentric}, the relativistic
 * {@link Aberration}): the reported "violated by" amount is the limit minus the value, to the 4 printed
 * decimals (tolerance 0.0006 deg: rounding 0.00005 + the oracle's first-order aberration and its own
 * topocentric frame, both within 0.0001 deg of ours, + the 1 s observation's motion 0.0042 deg/s x 0.1 s
 * at most, the amount being taken at the start). Fast enough for mutation testing.
 */
class ObservationCheckMarginsTest {
  private static final AstroContext CTX = AstroContext.offline();
  private static final Instant T = Instant.parse("2031-10-14T20:00:00Z");
  private static final GroundSite SITE = new GroundSite(24.62, 33.91, 820, List.of());
  private static final double TOL = 0.0006;

  /** A fixed target whose apparent direction at T is at this azimuth and elevation from SITE. */
  private static RaDec targetAt(double azimuthDeg, double elevationDeg) {
    AbsoluteDate d = CTX.date(T);
    Vector3D apparent = Topocentric.of(CTX, SITE).gcrfDirection(new AzEl(azimuthDeg, elevationDeg), d);
    // Undo the aberration to first order (exact to 1e-8 rad): catalogue = apparent - beta_perp.
    Vector3D beta = Aberration.earthVelocityMps(CTX, d).scalarMultiply(1 / 299_792_458.0);
    Vector3D u = apparent.subtract(beta.subtract(apparent.scalarMultiply(Vector3D.dotProduct(apparent, beta))))
        .normalize();
    return new RaDec(Math.toDegrees(Math.atan2(u.getY(), u.getX())) + (u.getY() < 0 ? 360 : 0),
        Math.toDegrees(Math.asin(u.getZ())));
  }

  private static List<String> check(Observer site, Constraints c, RaDec target) {
    Request r = Request.of("R", target, 1, 1);
    Scenario s = new Scenario(1, "t", new TimeWindow(T.minusSeconds(3600), T.plusSeconds(3600)), site, c,
        new SlewSettings.Fixed(0), null, List.of(r), null);
    return ObservationCheckTest.words(s, CTX, r, T, T.plusSeconds(1));
  }

  /** The amount of the single violation, degrees, after checking its constraint name. */
  private static double amount(List<String> v, String constraint) {
    assertEquals(1, v.size(), v.toString());
    assertTrue(v.get(0).contains(": " + constraint + " violated by "), v.get(0));
    String tail = v.get(0).substring(v.get(0).indexOf("violated by ") + "violated by ".length());
    return Double.parseDouble(tail.substring(0, tail.indexOf(' ')));
  }

  @Test
  void elevationLimitsMaskAndTolerance() {
    RaDec t = targetAt(200, 40);
    assertEquals(List.of(), check(SITE, Constraints.builder().elevationMinDeg(39.9).elevationMaxDeg(40.1).build(), t));
    assertEquals(5.0, amount(check(SITE, Constraints.builder().elevationMinDeg(45).build(), t), "elevation"), TOL);
    assertEquals(3.0, amount(check(SITE, Constraints.builder().elevationMaxDeg(37).build(), t), "elevation max"), TOL);
    // A mask above the target (50 deg over azimuths 180-220) binds; below it (30 deg) it does not, nor does
    // the mask elsewhere. elevationMinDeg and the mask: the larger one counts.
    GroundSite masked = new GroundSite(24.62, 33.91, 820, List.of(new AzEl(180, 50), new AzEl(220, 50), new AzEl(230, 0),
        new AzEl(170, 0)));
    assertEquals(10.0, amount(check(masked, Constraints.none(), t), "horizon mask"), TOL);
    assertEquals(10.0, amount(check(masked, Constraints.builder().elevationMinDeg(20).build(), t), "horizon mask"),
        TOL);
    assertEquals(12.0, amount(check(masked, Constraints.builder().elevationMinDeg(52).build(), t), "elevation"), TOL);
    GroundSite low = new GroundSite(24.62, 33.91, 820, List.of(new AzEl(0, 30), new AzEl(180, 30)));
    assertEquals(List.of(), check(low, Constraints.none(), t));
    // No limit at all: the horizon (0 deg) for a target below it.
    assertEquals(10.0, amount(check(SITE, Constraints.none(), targetAt(10, -10)), "elevation"), TOL);
    // The target sets by 0.0013 deg in the 1 s observation (39.9987 deg at its end). Inside the tolerance
    // (0.0001 deg + 0.25 s of the margin's rate: 0.0004 deg here) at the end: accepted; beyond it: rejected.
    assertEquals(List.of(), check(SITE, Constraints.builder().elevationMinDeg(39.9989).build(), t));
    assertEquals(0.0006, amount(check(SITE, Constraints.builder().elevationMinDeg(39.9993).build(), t), "elevation"),
        0.0001);
    assertEquals(0.003, amount(check(SITE, Constraints.builder().elevationMinDeg(40.003).build(), t), "elevation"), TOL);
    assertEquals(0.02, amount(check(SITE, Constraints.builder().elevationMinDeg(40.02).build(), t), "elevation"), TOL);
  }

  @Test
  void refractionRaisesTheElevationTheLimitsSee() {
    // At 40 deg, 1013.25 hPa and 10 C the refraction is 58.26" x tan 50 deg = 69.4" = 0.0193 deg (Green's
    // formula, RefractionTest): a limit at 40.015 deg fails without refraction and holds with it.
    RaDec t = targetAt(200, 40);
    Constraints c = Constraints.builder().elevationMinDeg(40.015).build();
    assertEquals(0.015, amount(check(SITE, c, t), "elevation"), TOL);
    double r = new Refraction(1013.25, 10).refractionDeg(40);
    assertEquals(0.0193, r, 0.0002);
    GroundSite refracting = SITE.withRefraction(new Refraction(1013.25, 10));
    assertEquals(List.of(), check(refracting, c, t));
    // The amounts are the limit minus the observed (refracted) elevation.
    assertEquals(0.1 - r, amount(check(refracting, Constraints.builder().elevationMinDeg(40.1).build(), t),
        "elevation"), TOL);
    assertEquals(0.1 + r, amount(check(refracting, Constraints.builder().elevationMaxDeg(39.9).build(), t),
        "elevation max"), TOL);
  }

  @Test
  void darknessSunAndMoonSeparations() {
    AbsoluteDate d = CTX.date(T);
    RaDec t = targetAt(200, 40);
    Topocentric topo = Topocentric.of(CTX, SITE);
    Vector3D sunGcrf = CTX.sun().getPosition(d, CTX.inertial());
    double sunEl = topo.azElOfPosition(sunGcrf, d).elevationDeg();
    assertTrue(sunEl < -30, "night at the site: Sun at " + sunEl);
    assertEquals(List.of(), check(SITE, Constraints.builder().sunElevationMaxDeg(sunEl + 1).build(), t));
    assertEquals(2.0, amount(check(SITE, Constraints.builder().sunElevationMaxDeg(sunEl - 2).build(), t), "darkness"),
        TOL);
    // Separations: the apparent target against the geometric bodies seen from the site.
    Vector3D los = Topocentric.of(CTX, SITE).gcrfDirection(new AzEl(200, 40), d);
    Vector3D sitePos = CTX.earthFixed().getStaticTransformTo(CTX.inertial(), d)
        .transformPosition(CTX.earth().transform(new org.orekit.bodies.GeodeticPoint(Math.toRadians(24.62),
            Math.toRadians(33.91), 820)));
    double sunSep = Math.toDegrees(Vector3D.angle(los, sunGcrf.subtract(sitePos)));
    double moonSep = Math.toDegrees(Vector3D.angle(los, CTX.moon().getPosition(d, CTX.inertial()).subtract(sitePos)));
    assertEquals(1.0, amount(check(SITE, Constraints.builder().sunSeparationMinDeg(sunSep + 1).build(), t),
        "Sun separation"), TOL);
    assertEquals(List.of(), check(SITE, Constraints.builder().sunSeparationMinDeg(sunSep - 1).build(), t));
    assertEquals(1.5, amount(check(SITE, Constraints.builder().moonSeparationMinDeg(moonSep + 1.5).build(), t),
        "Moon separation"), TOL);
    assertEquals(List.of(), check(SITE, Constraints.builder().moonSeparationMinDeg(moonSep - 1).build(), t));
  }

  @Test
  void aberrationIsApplied() {
    // This target's catalogue direction is 0.0018 deg lower than its apparent one (checked below), so an
    // oracle using the catalogue direction would report 0.0218 deg, not 0.02, on a 0.02 deg violation.
    RaDec t = targetAt(200, 40);
    double geometricEl = Topocentric.of(CTX, SITE).azEl(
        new Vector3D(Math.toRadians(t.raDeg()), Math.toRadians(t.decDeg())), CTX.date(T)).elevationDeg();
    assertTrue(Math.abs(geometricEl - 40) > 0.001, "this direction's aberration in elevation: " + (geometricEl - 40));
    double amount = amount(check(SITE, Constraints.builder().elevationMinDeg(40.02).build(), t), "elevation");
    assertEquals(0.02, amount, 0.0002);
  }

  @Test
  void noObserverMeansNoGeometry() {
    Request r = Request.of("R", null, 1, 1).withWindows(List.of(new TimeWindow(T, T.plusSeconds(60))));
    Scenario s = new Scenario(1, "t", new TimeWindow(T.minusSeconds(3600), T.plusSeconds(3600)), null,
        Constraints.builder().elevationMinDeg(80).build(), new SlewSettings.Fixed(0), null, List.of(r), null);
    assertEquals(List.of(), ObservationCheckTest.words(s, CTX, r, T, T.plusSeconds(1)));
  }
}
