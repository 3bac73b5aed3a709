package dev.sequencer.validate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.Observation;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Tle;
import dev.sequencer.planner.FuzzScenarios;
import dev.sequencer.validate.Violation.Kind;
import java.time.Instant;
import java.util.List;
import java.util.function.BiFunction;
import org.hipparchus.geometry.euclidean.threed.Rotation;
import org.hipparchus.geometry.euclidean.threed.RotationConvention;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.propagation.analytical.tle.TLEPropagator;
import org.orekit.time.AbsoluteDate;

/**
 * The worst point of a slew that breaks a keep-out, as the validator reports it (value and instant), against
 * a dense evaluation written here: the observer from Orekit's own TLE propagator, the Sun from the time
 * layer's series (shared with the validator: the Sun's position is not what is tested), the eigenaxis path
 * from the trapezoid profile written out below (rate 1°/s, acceleration 0.05°/s²: 20 s to full rate, 10° in
 * each ramp — the usual rest-to-rest profile, common practice), every 0.01 s of the slew with exact (not
 * tabulated) geometry. The validator samples every 0.25 s, refines each local minimum and interpolates the
 * Sun and the nadir on a 2 s grid; its worst value must match to 0.002° and its instant to 0.5 s. Found
 * needed by PIT (2026-12-03): the path's margins, their refinement and the grid interpolation were not
 * pinned by any test (only the verdicts were).
 */
class SlewKeepOutDenseTest {
  private static final AstroContext CTX = AstroContext.offline();
  static final Scenario LEO = FuzzScenarios.generate(FuzzScenarios.Kind.LEO_TLE_FIELDS, 1, CTX);
  static final double RATE = 1.0;
  static final double ACCEL = 0.05;
  static final double SETTLE = 10;
  static final Instant T = LEO.horizon().start().plusSeconds(3600);
  private static final TLEPropagator ORBIT;

  static {
    Tle t = (Tle) ((OrbitObserver) LEO.observer()).orbit();
    ORBIT = TLEPropagator.selectExtrapolator(new TLE(t.line1(), t.line2(), CTX.utc()),
        CTX.dataContext().getFrames().getTEME());
  }

  static Vector3D observer(AbsoluteDate d) {
    return ORBIT.getPosition(d, CTX.inertial());
  }

  static Vector3D sunFromObserver(AbsoluteDate d) {
    return CTX.sun().getPosition(d, CTX.inertial()).subtract(observer(d)).normalize();
  }

  /** Degrees covered s seconds into a rest-to-rest slew of {@code total} degrees (trapezoid or triangle). */
  static double angleAt(double s, double total) {
    double ramp = RATE / ACCEL;
    double rampDeg = 0.5 * ACCEL * ramp * ramp;
    if (total < 2 * rampDeg) {
      double half = Math.sqrt(total / ACCEL);
      return s <= half ? 0.5 * ACCEL * s * s : total - 0.5 * ACCEL * (2 * half - s) * (2 * half - s);
    }
    double length = total / RATE + ramp;
    if (s <= ramp) {
      return 0.5 * ACCEL * s * s;
    }
    return s <= length - ramp ? rampDeg + (s - ramp) * RATE : total - 0.5 * ACCEL * (length - s) * (length - s);
  }

  static double slewSeconds(double total) {
    double ramp = RATE / ACCEL;
    return total < 0.5 * ACCEL * ramp * ramp * 2 ? 2 * Math.sqrt(total / ACCEL) : total / RATE + ramp;
  }

  static RaDec raDec(Vector3D u) {
    double ra = Math.toDegrees(Math.atan2(u.getY(), u.getX()));
    return new RaDec(ra < 0 ? ra + 360 : ra, Math.toDegrees(Math.asin(u.getZ())));
  }

  static Vector3D turn(Vector3D u, Vector3D axis, double deg) {
    return new Rotation(axis, Math.toRadians(deg), RotationConvention.VECTOR_OPERATOR).applyTo(u);
  }

  /**
   * Plans A (10 s at T) then B, the slew departing 15 s after A's end, checks it, and compares the
   * violation with the dense minimum of {@code margin} (pointing, date) → (value, limit) along the path.
   */
  private static void compare(Constraints c, ConstraintOverrides own, Vector3D a, Vector3D b, Kind kind,
      BiFunction<Vector3D, AbsoluteDate, Double> value) {
    Scenario s = new Scenario(1, "dense", LEO.horizon(), LEO.observer(), c,
        new SlewSettings.Eigenaxis(RATE, ACCEL, SETTLE), null,
        List.of(Request.of("A", raDec(a), 10, 1).withConstraints(own), Request.of("B", raDec(b), 10, 1)
            .withConstraints(own)), null);
    Instant aEnd = T.plusSeconds(10);
    Instant depart = aEnd.plusSeconds(15);
    Observation oa = Observation.of("A", T, aEnd, 0);
    Instant guess = depart.plusSeconds(200);
    // The path's ends as the validator points them (its apparent directions, 20" of aberration from the
    // catalogue ones): taken from its SlewLegs, so that only the path and the margins are compared.
    List<Vector3D> chain = new SlewLegs(new Sky(s, CTX)).legs(List.of(oa, Observation.of("B", guess,
        guess.plusSeconds(10), 0)), s.requests()).get(1).chain();
    Vector3D pa = chain.get(0);
    Vector3D pb = chain.get(chain.size() - 1);
    double totalDeg = Math.toDegrees(Vector3D.angle(pa, pb));
    double slew = slewSeconds(totalDeg) + SETTLE;
    Instant bStart = depart.plusSeconds((long) Math.ceil(slew) + 1);
    Observation ob = new Observation("B", bStart, bStart.plusSeconds(10), slew, null, null, depart, List.of());
    List<Violation> v = PlanValidator.of(s, CTX).check(new Timeline(PlanStatus.FEASIBLE, 2, slew, null,
        List.of(oa, ob), List.of()));
    // Dense: every 0.01 s of the moving part (the rests stay far from both keep-outs by construction).
    AbsoluteDate d0 = CTX.date(depart);
    double worst = Double.POSITIVE_INFINITY;
    double worstS = 0;
    Vector3D axis = Vector3D.crossProduct(pa, pb).normalize();
    for (double t = 0; t <= slewSeconds(totalDeg); t += 0.01) {
      Vector3D p = turn(pa, axis, angleAt(t, totalDeg));
      double x = value.apply(p, d0.shiftedBy(t));
      if (x < worst) {
        worst = x;
        worstS = t;
      }
    }
    assertEquals(1, v.size(), Violation.words(v).toString());
    Violation w = v.get(0);
    assertEquals(kind, w.kind(), w.message());
    assertEquals(worst, w.value(), 0.002, w.message());
    double atS = (w.instant().toEpochMilli() - depart.toEpochMilli()) / 1000.0;
    assertEquals(worstS, atS, 0.5, w.message());
  }

  @Test
  void theSunSeparationAtTheWorstPointOfTheSlewIsTheDenseMinimum() {
    AbsoluteDate d = CTX.date(T);
    Vector3D sun = sunFromObserver(d);
    Vector3D axis = sun.orthogonal();
    Vector3D side = Vector3D.crossProduct(sun, axis);
    // A and B 60° either side of the Sun, both tilted 12° off its great circle: the path passes about 12°
    // from the Sun, inside a 30° keep-out, its closest point 40% along (the tilt differs at each end).
    Vector3D a = turn(turn(sun, axis, 60), side, 12);
    Vector3D b = turn(turn(sun, axis, -40), side, 8);
    compare(Constraints.builder().sunSeparationMinDeg(30.0).build(), ConstraintOverrides.none(), a, b,
        Kind.SLEW_SUN_SEPARATION,
        (p, t) -> Math.toDegrees(Vector3D.angle(p, sunFromObserver(t))));
  }

  @Test
  void theEarthLimbAtTheWorstPointOfTheSlewIsTheDenseMinimum() {
    AbsoluteDate d = CTX.date(T.plusSeconds(25));
    Vector3D r = observer(d);
    Vector3D nadir = r.negate().normalize();
    Vector3D normal = Vector3D.crossProduct(r, observer(d.shiftedBy(1)).subtract(r)).normalize();
    double limb = Math.toDegrees(Math.asin(6_378_137.0 / r.getNorm()));
    // A and B 30° above the limb ahead of and behind nadir, turned 40° about it: the slew between them bulges
    // away from the Earth, while the Earth rises towards the pointing at the orbital rate (0.06°/s). The
    // requests keep 10° above the limb themselves (their own rule, which holds during the rests on them);
    // the scenario's 45° holds along the slew and its settle: broken from the departure on, worst near an end.
    Vector3D a = turn(turn(nadir, normal, limb + 30), nadir, 40);
    Vector3D b = turn(turn(nadir, normal, -(limb + 30)), nadir, -40);
    compare(Constraints.builder().earthLimbMinDeg(45.0).build(),
        ConstraintOverrides.setting(Constraints.builder().earthLimbMinDeg(10.0).build()), a, b, Kind.SLEW_EARTH_LIMB,
        (p, t) -> {
          Vector3D o = observer(t);
          return Math.toDegrees(Vector3D.angle(p, o.negate()) - Math.asin(6_378_137.0 / o.getNorm()));
        });
  }
}
