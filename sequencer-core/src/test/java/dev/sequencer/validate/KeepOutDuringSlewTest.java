package dev.sequencer.validate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.Timeline;
import dev.sequencer.planner.FuzzScenarios;
import dev.sequencer.validate.Violation.Kind;
import java.time.Instant;
import java.util.List;
import org.hipparchus.geometry.euclidean.threed.Rotation;
import org.hipparchus.geometry.euclidean.threed.RotationConvention;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;
import org.orekit.time.AbsoluteDate;

/**
 * Keep-outs during slews (A3) on hand-made timelines carrying {@code slewVia} and {@code slewStart}, from a
 * LEO observer (a generated TLE), eigenaxis 1°/s, 0.05°/s², settle 10 s. The geometry is built around the
 * Sun's and the nadir's directions at the gap, so the expected verdict follows from the construction.
 */
class KeepOutDuringSlewTest {
  private static final AstroContext CTX = AstroContext.offline();
  private static final Scenario LEO = FuzzScenarios.generate(FuzzScenarios.Kind.LEO_TLE_FIELDS, 1, CTX);
  private static final SlewSettings.Eigenaxis SLEW = new SlewSettings.Eigenaxis(1.0, 0.05, 10);

  private static Scenario scenario(Constraints c, SlewSettings slew, RaDec a, RaDec b) {
    return new Scenario(1, "keep-outs", LEO.horizon(), LEO.observer(), c, slew, null,
        List.of(Request.of("A", a, 10, 1), Request.of("B", b, 10, 1)), null);
  }

  private static RaDec raDec(Vector3D u) {
    double ra = Math.toDegrees(Math.atan2(u.getY(), u.getX()));
    return new RaDec(ra < 0 ? ra + 360 : ra, Math.toDegrees(Math.asin(u.getZ())));
  }

  private static Vector3D turn(Vector3D u, Vector3D axis, double deg) {
    return new Rotation(axis, Math.toRadians(deg), RotationConvention.VECTOR_OPERATOR).applyTo(u);
  }

  /** The slew seconds the validator computes for the leg into B (checked against the planner elsewhere). */
  private static double slewS(Scenario s, Observation a, Observation b) {
    Sky sky = new Sky(s, CTX);
    return new SlewLegs(sky).legs(List.of(a, b), s.requests()).get(1).seconds();
  }

  private static Timeline plan(Observation a, Observation b) {
    return new Timeline(PlanStatus.FEASIBLE, 2, a.slewSeconds() + b.slewSeconds(), null, List.of(a, b), List.of());
  }

  private static final Instant T = LEO.horizon().start().plusSeconds(3600);

  @Test
  void aGreatCircleThroughTheSunFailsAndADetourPasses() {
    Sky sky = new Sky(LEO, CTX);
    AbsoluteDate d = CTX.date(T);
    Vector3D sun = sky.sun(d).subtract(sky.observer(d)).normalize();
    Vector3D axis = sun.orthogonal();
    // A and B 50 deg either side of the Sun on one great circle: the short arc between them crosses the Sun.
    RaDec a = raDec(turn(sun, axis, 50));
    RaDec b = raDec(turn(sun, axis, -50));
    Scenario s = scenario(Constraints.builder().sunSeparationMinDeg(30.0).build(), SLEW, a, b);
    Observation oa = Observation.of("A", T, T.plusSeconds(10), 0);
    Instant bStart = T.plusSeconds(400);
    double direct = slewS(s, oa, Observation.of("B", bStart, bStart.plusSeconds(10), 0));
    assertEquals(100 + 20 + 10, direct, 0.1); // ~100 deg: 100/1 + 1/0.05 + settle
    Observation ob = Observation.of("B", bStart, bStart.plusSeconds(10), direct);
    List<Violation> v = PlanValidator.of(s, CTX).check(plan(oa, ob));
    assertEquals(1, v.size(), Violation.words(v).toString());
    assertEquals(Kind.SLEW_SUN_SEPARATION, v.get(0).kind());
    assertEquals("B", v.get(0).requestId());
    assertTrue(v.get(0).value() < 1, "the path crosses the Sun: " + v.get(0).message());
    assertEquals(30.0, v.get(0).limit());
    assertTrue(!v.get(0).instant().isBefore(oa.end()) && !v.get(0).instant().isAfter(bStart), v.get(0).message());
    // Keep-outs off (A3's switch): the same plan is valid.
    assertEquals(List.of(), PlanValidator.of(s.withSlew(SLEW.withKeepOutDuringSlew(false)), CTX).check(plan(oa, ob)));

    // A detour through the pole of that great circle: legs of 90 deg each, never nearer the Sun than 50 deg.
    RaDec pole = raDec(axis);
    Observation via = ob.withSlew(null, List.of(pole));
    double chain = slewS(s, oa, via);
    assertEquals(2 * (90 + 20) + 10, chain, 0.2); // two legs of ~90 deg plus one settle
    Observation viaOk = new Observation("B", bStart, bStart.plusSeconds(10), chain, null, null, null, List.of(pole));
    assertEquals(List.of(), PlanValidator.of(s, CTX).check(plan(oa, viaOk)));
    // The detour with the direct slew's seconds written: the reported time is wrong.
    List<Violation> wrong = PlanValidator.of(s, CTX).check(plan(oa, via));
    assertEquals(List.of(Kind.SLEW_SECONDS), wrong.stream().map(Violation::kind).toList());
    assertEquals(chain, wrong.get(0).limit(), 1e-9);
  }

  @Test
  void earthLimbRestsChooseTheDeparture() {
    Sky sky = new Sky(LEO, CTX);
    Instant g0 = T.plusSeconds(10);
    AbsoluteDate d0 = CTX.date(g0);
    Vector3D r0 = sky.observer(d0);
    Vector3D n0 = r0.negate().normalize();
    Vector3D v0 = sky.observer(d0.shiftedBy(1)).subtract(r0);
    Vector3D orbitNormal = Vector3D.crossProduct(r0, v0).normalize();
    double limb0 = Math.toDegrees(Math.asin(Sky.EARTH_RADIUS_M / r0.getNorm()));
    // A: 12 deg above the limb ahead of nadir (towards the motion): the Earth comes up towards it at the
    // orbital rate (about 0.063 deg/s), so resting on A keeps 10 deg for about 30 s only.
    RaDec a = raDec(turn(n0, orbitNormal, limb0 + 12));
    RaDec zenith = raDec(turn(n0, orbitNormal, 180));
    Constraints limb10 = Constraints.builder().earthLimbMinDeg(10.0).build();
    Observation oa = Observation.of("A", T, g0, 0);
    Instant g1 = g0.plusSeconds(300);
    RaDec b = null;
    double slew = 0;
    for (int it = 0; it < 3; it++) {
      // B: 12 deg above the limb behind nadir at B's start: the Earth sinks away from it, so resting on B
      // keeps 10 deg only for about the last 30 s before its start. Slew via the zenith, 40 s to spare.
      AbsoluteDate d1 = CTX.date(g1);
      Vector3D r1 = sky.observer(d1);
      double limb1 = Math.toDegrees(Math.asin(Sky.EARTH_RADIUS_M / r1.getNorm()));
      b = raDec(turn(r1.negate().normalize(), orbitNormal, -(limb1 + 12)));
      Scenario s = scenario(limb10, SLEW, a, b);
      slew = slewS(s, oa, new Observation("B", g1, g1.plusSeconds(10), 0, null, null, null, List.of(zenith)));
      g1 = g0.plusMillis(Math.round((slew + 40) * 1000));
    }
    Scenario s = scenario(limb10, SLEW, a, b);
    PlanValidator v = PlanValidator.of(s, CTX);
    Observation free = new Observation("B", g1, g1.plusSeconds(10), slew, null, null, null, List.of(zenith));
    // No slewStart: some departure in the gap (about 8-32 s after A ends) keeps the limb: valid.
    assertEquals(List.of(), v.check(plan(oa, free)), "slew " + slew);
    // Departing as soon as A ends: the rest on B before its start is too long.
    List<Violation> early = v.check(plan(oa, free.withSlew(g0, List.of(zenith))));
    assertEquals(List.of(Kind.SLEW_EARTH_LIMB), early.stream().map(Violation::kind).toList(), early.toString());
    assertEquals("B", early.get(0).requestId());
    // Departing at the latest moment: the rest on A is too long.
    List<Violation> late = v.check(plan(oa, free.withSlew(g0.plusSeconds(40), List.of(zenith))));
    assertEquals(List.of(Kind.SLEW_EARTH_LIMB), late.stream().map(Violation::kind).toList(), late.toString());
    // Departing 20 s after A ends: valid.
    assertEquals(List.of(), v.check(plan(oa, free.withSlew(g0.plusSeconds(20), List.of(zenith)))));
    // slewStart outside the gap, or too late for the slew to end in time.
    List<Violation> before = v.check(plan(oa, free.withSlew(g0.minusSeconds(5), List.of(zenith))));
    assertEquals(List.of(Kind.SLEW_START), before.stream().map(Violation::kind).toList());
    List<Violation> tooLate = v.check(plan(oa, free.withSlew(g0.plusSeconds(45), List.of(zenith))));
    assertEquals(List.of(Kind.SLEW_START), tooLate.stream().map(Violation::kind).toList());
  }
}
