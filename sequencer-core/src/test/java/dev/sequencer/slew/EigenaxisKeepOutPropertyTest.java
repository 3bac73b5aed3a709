package dev.sequencer.slew;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.RaDec;
import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import org.hipparchus.geometry.euclidean.threed.Rotation;
import org.hipparchus.geometry.euclidean.threed.RotationConvention;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;

/**
 * Keep-outs during eigenaxis slews (spec A3), checked by sampling written here: each leg is sampled densely
 * with this file's own slerp and bang-coast-bang position (not {@link Detour}'s or {@link RestToRest#angleAt}),
 * at the instants the leg is flown, against the cone at that instant. Shared with the code under test: the
 * {@link KeepOut} cones themselves and {@link RestToRest#seconds} (the legs' durations, which the timeline's
 * slewSeconds is defined by); the lower bound {@link Detour#shortestAroundDeg} is a separate formula
 * (tangent-arc-tangent) in the same class.
 */
class EigenaxisKeepOutPropertyTest {
  private static final int SAMPLES_PER_LEG = 400;

  private static Vector3D dir(double raDeg, double decDeg) {
    double ra = Math.toRadians(raDeg);
    double dec = Math.toRadians(decDeg);
    return new Vector3D(Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec));
  }

  private static RaDec raDec(Vector3D u) {
    return new RaDec(Math.toDegrees(Math.atan2(u.getY(), u.getX())), Math.toDegrees(Math.asin(u.getZ())));
  }

  private static double angleDeg(Vector3D a, Vector3D b) {
    return Math.toDegrees(Vector3D.angle(a, b));
  }

  /** Own bang-coast-bang: angle covered t seconds into a move of total degrees. */
  private static double covered(double rate, double accel, double total, double t) {
    double rampDeg = rate * rate / accel;
    if (total >= rampDeg) {
      double tr = rate / accel;
      double tt = total / rate + tr;
      if (t <= tr) {
        return 0.5 * accel * t * t;
      }
      if (t >= tt - tr) {
        return total - 0.5 * accel * (tt - t) * (tt - t);
      }
      return 0.5 * accel * tr * tr + rate * (t - tr);
    }
    double tt = 2 * Math.sqrt(total / accel);
    return t <= tt / 2 ? 0.5 * accel * t * t : total - 0.5 * accel * (tt - t) * (tt - t);
  }

  private static Vector3D slerp(Vector3D p, Vector3D q, double angleDeg) {
    double total = Vector3D.angle(p, q);
    if (total < 1e-15) {
      return p;
    }
    double a = Math.toRadians(angleDeg);
    return new Vector3D(Math.sin(total - a) / Math.sin(total), p, Math.sin(a) / Math.sin(total), q);
  }

  /** Least clearance (angle to the axis minus the radius) along the slew as flown, degrees. */
  private static double leastClearance(Vector3D from, List<Vector3D> via, Vector3D to, double departS, double rate,
      double accel, double settleS, KeepOut cone) {
    List<Vector3D> points = new ArrayList<>(via);
    points.add(to);
    double t = departS;
    Vector3D p = from;
    double least = Double.POSITIVE_INFINITY;
    RestToRest profile = new RestToRest(rate, accel);
    for (Vector3D q : points) {
      double total = angleDeg(p, q);
      double legS = profile.seconds(total);
      for (int i = 0; i <= SAMPLES_PER_LEG; i++) {
        double ti = legS * i / SAMPLES_PER_LEG;
        Vector3D u = slerp(p, q, covered(rate, accel, total, ti));
        least = Math.min(least, angleDeg(u, cone.axis(t + ti)) - cone.radiusDeg(t + ti));
      }
      t += legS;
      p = q;
    }
    for (int i = 0; i <= 20; i++) {
      double ti = t + settleS * i / 20;
      least = Math.min(least, angleDeg(to, cone.axis(ti)) - cone.radiusDeg(ti));
    }
    return least;
  }

  private static double pathLengthDeg(Vector3D from, List<Vector3D> via, Vector3D to) {
    double sum = 0;
    Vector3D p = from;
    List<Vector3D> points = new ArrayList<>(via);
    points.add(to);
    for (Vector3D q : points) {
      sum += angleDeg(p, q);
      p = q;
    }
    return sum;
  }

  /** A direction at {@code distDeg} from s, at bearing {@code bearingDeg} about it. */
  private static Vector3D around(Vector3D s, double distDeg, double bearingDeg) {
    Vector3D e1 = s.orthogonal();
    Vector3D e2 = Vector3D.crossProduct(s, e1);
    double b = Math.toRadians(bearingDeg);
    Vector3D radial = new Vector3D(Math.cos(b), e1, Math.sin(b), e2);
    double d = Math.toRadians(distDeg);
    return new Vector3D(Math.cos(d), s, Math.sin(d), radial).normalize();
  }

  private static KeepOuts still(KeepOut cone) {
    return new KeepOuts(List.of(cone), List.of(), new boolean[] {true, true}, true, 0, 86400);
  }

  @Property(tries = 400)
  void stillConeDetourKeepsOutIsNoShorterThanDirectAndEqualsItWhenClear(
      @ForAll @DoubleRange(min = -90, max = 90) double sunDecDeg, @ForAll @DoubleRange(min = 0, max = 360) double sunRaDeg,
      @ForAll @DoubleRange(min = 5, max = 80) double radiusDeg,
      @ForAll @DoubleRange(min = 0.3, max = 60) double gapADeg, @ForAll @DoubleRange(min = 0.3, max = 60) double gapBDeg,
      @ForAll @DoubleRange(min = 0, max = 360) double bearingADeg, @ForAll @DoubleRange(min = 0, max = 360) double bearingBDeg,
      @ForAll @DoubleRange(min = 0.05, max = 3) double rate, @ForAll @DoubleRange(min = 0.01, max = 1) double accel,
      @ForAll @DoubleRange(min = 0, max = 60) double settleS) {
    Vector3D sun = dir(sunRaDeg, sunDecDeg);
    double da = Math.min(radiusDeg + gapADeg, 179.5 - radiusDeg);
    double db = Math.min(radiusDeg + gapBDeg, 179.5 - radiusDeg);
    if (da <= radiusDeg + 0.2 || db <= radiusDeg + 0.2) {
      return; // the cone leaves no room there
    }
    Vector3D a = around(sun, da, bearingADeg);
    Vector3D b = around(sun, db, bearingBDeg);
    KeepOut cone = KeepOut.fixed("Sun", sun, radiusDeg);
    EigenaxisModel model = new EigenaxisModel(rate, accel, settleS);
    Transitions tr = model.transitions(List.of(PointingTrack.fixed(raDec(a)), PointingTrack.fixed(raDec(b))), null,
        still(cone));
    Vector3D ua = PointingTrack.fixed(raDec(a)).inertialDirection(0);
    Vector3D ub = PointingTrack.fixed(raDec(b)).inertialDirection(0);
    Transitions.Slew s = tr.slew(0, 1, 100, 1e7);
    double direct = model.seconds(ua, ub);
    double directClearance = leastClearance(ua, List.of(), ub, 100, rate, accel, settleS, cone);
    if (directClearance > 1e-5) {
      assertTrue(s.via().isEmpty(), "a clear direct arc is taken as it is");
      assertEquals(direct, s.seconds(), 1e-9);
    }
    assertTrue(s.seconds() < Double.POSITIVE_INFINITY,
        "one cone narrower than 80 deg with both ends outside (and not near its antipode) always has a detour");
    assertTrue(s.seconds() >= direct - 1e-9, "never quicker than the direct slew");
    assertTrue(leastClearance(ua, s.via(), ub, s.departureS(), rate, accel, settleS, cone) >= -1e-9,
        "the slew keeps out of the cone at every sample");
    // Lower bound: no path around the cone is shorter than tangent-arc-tangent (Detour class comment).
    double lengthDeg = pathLengthDeg(ua, s.via(), ub);
    double shortest = Detour.shortestAroundDeg(ua, ub, sun, radiusDeg);
    assertTrue(lengthDeg >= shortest - 1e-6, "shorter than the shortest path around: " + lengthDeg + " < " + shortest);
    assertTrue(s.seconds() >= model.profile().seconds(shortest) + (shortest > 0 ? settleS : 0) - 1e-6,
        "the lower bound T(L*) + settle is never above the exact slew");
    // Proven time bound (Detour class comment): the 8-waypoint polygon is at most 2.35 deg longer than the
    // shortest path around the widened cone, and 9 legs of total length L take at most 9 T(L/9) (T concave).
    double widened = Detour.shortestAroundDeg(ua, ub, sun, radiusDeg + Detour.CONSTRUCTION_MARGIN_DEG + 0.01);
    double proven = 9 * model.profile().seconds((widened + 2.35) / 9) + settleS;
    assertTrue(s.via().isEmpty() || s.seconds() <= proven + 1e-6,
        "detour " + s.seconds() + " s above the proven " + proven + " s");
    // The model's bound is never below the exact slew (time-independent here: one bound for all times).
    assertTrue(tr.boundS(0, 1, 0, 80000, 0, 1e7) >= s.seconds() - 1e-9, "bound below exact");
    assertEquals(false, tr.timeDependent(), "still cone and fixed targets stay time-independent");
  }

  @Property(tries = 150)
  void movingConeIsKeptAtTheLegsOwnTimesAndTheBoundCoversTheExactLeg(
      @ForAll @DoubleRange(min = 40, max = 85) double radiusDeg,
      @ForAll @DoubleRange(min = 0.01, max = 0.08) double turnDegPerS,
      @ForAll @DoubleRange(min = 0, max = 360) double bearingADeg, @ForAll @DoubleRange(min = 0, max = 360) double bearingBDeg,
      @ForAll @DoubleRange(min = 2, max = 40) double gapADeg, @ForAll @DoubleRange(min = 2, max = 40) double gapBDeg,
      @ForAll @DoubleRange(min = 0.2, max = 2) double rate, @ForAll @DoubleRange(min = 0.01, max = 0.2) double accel,
      @ForAll @IntRange(min = 0, max = 4000) int departS) {
    // A cone whose axis turns about +z at turnDegPerS from +x, like the Earth seen from a circular orbit.
    Vector3D pole = Vector3D.PLUS_K;
    KeepOut cone = new KeepOut() {
      @Override
      public Vector3D axis(double tS) {
        return new Rotation(pole, Math.toRadians(turnDegPerS * tS), RotationConvention.VECTOR_OPERATOR)
            .applyTo(Vector3D.PLUS_I);
      }

      @Override
      public double radiusDeg(double tS) {
        return radiusDeg;
      }

      @Override
      public double maxDriftDegPerS() {
        return turnDegPerS;
      }

      @Override
      public String name() {
        return "Earth limb";
      }
    };
    Vector3D axis = cone.axis(departS);
    Vector3D a = around(axis, Math.min(radiusDeg + gapADeg, 179 - radiusDeg), bearingADeg);
    Vector3D b = around(axis, Math.min(radiusDeg + gapBDeg, 179 - radiusDeg), bearingBDeg);
    double settleS = 10;
    EigenaxisModel model = new EigenaxisModel(rate, accel, settleS);
    KeepOuts k = new KeepOuts(List.of(), List.of(cone), new boolean[] {true, true}, true, -3600, 90000);
    Transitions tr = model.transitions(List.of(PointingTrack.fixed(raDec(a)), PointingTrack.fixed(raDec(b))), null, k);
    assertTrue(tr.timeDependent(), "a moving cone makes transitions time-dependent");
    for (double wait : new double[] {0, 30, 600}) {
      double arrival = departS + model.seconds(a, b) * 3 + 2 * settleS + 400 + wait;
      Transitions.Slew s = tr.slew(0, 1, departS, arrival);
      if (s.seconds() < Double.POSITIVE_INFINITY) {
        assertTrue(s.departureS() >= departS && s.departureS() + s.seconds() <= arrival + 1e-9 || s.departureS() == departS);
        assertTrue(leastClearance(a, s.via(), b, s.departureS(), rate, accel, settleS, cone) >= -1e-9,
            "the slew keeps out of the moving cone at every sample");
        assertTrue(s.seconds() >= model.seconds(a, b) - 1e-9, "never quicker than the direct slew");
      }
      double bound = tr.boundS(0, 1, departS, departS, arrival, arrival);
      if (bound < Double.POSITIVE_INFINITY && departS + bound <= arrival) {
        assertTrue(bound >= s.seconds() - 1e-9, "bound " + bound + " below exact " + s.seconds());
      }
    }
  }

  @Test
  void slewThroughTheSunGoesAroundIt() {
    // Worked case: Sun at RA 0, Dec 0, keep-out 30 deg; targets at RA -40 and +40 on the equator: the
    // direct arc runs through the Sun. Shortest way round: tangents of acos(cos 40 / cos 30) = 27.8 deg each
    // and a boundary arc, so the detour is longer than the direct 80 deg and keeps 30 deg from the Sun.
    Vector3D sun = dir(0, 0);
    KeepOut cone = KeepOut.fixed("Sun", sun, 30);
    EigenaxisModel model = new EigenaxisModel(1, 0.1, 5);
    Transitions tr = model.transitions(List.of(PointingTrack.fixed(new RaDec(-40, 0)), PointingTrack.fixed(new RaDec(40, 0))),
        null, still(cone));
    Transitions.Slew s = tr.slew(0, 1, 0, 1e6);
    assertTrue(!s.via().isEmpty(), "detour");
    double length = pathLengthDeg(dir(-40, 0), s.via(), dir(40, 0));
    assertTrue(length > 80 && length < 80 + 30, "length " + length);
    assertTrue(leastClearance(dir(-40, 0), s.via(), dir(40, 0), 0, 1, 0.1, 5, cone) >= 0);
    Transitions off = model.transitions(List.of(PointingTrack.fixed(new RaDec(-40, 0)), PointingTrack.fixed(new RaDec(40, 0))), null);
    assertTrue(s.seconds() > off.exactS(new int[] {0, 1}, new double[] {0, 0}, new double[] {0, 1e6})[1]);
  }
}
