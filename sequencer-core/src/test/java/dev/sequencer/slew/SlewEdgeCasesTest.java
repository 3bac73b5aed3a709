package dev.sequencer.slew;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.AzEl;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.SlewSettings;
import java.util.List;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;

/**
 * Edge cases of the slew models, each with its value derived by hand from the formulas of docs/slew.md:
 * the bounds are tight where the tracks really move at their declared rates (so a bound that drops a drift
 * term, or adds one twice, fails), the limits are inclusive, bad tables are refused, and anchored
 * (apparent) fixed targets keep eigenaxis transitions time-independent. Written against the surviving
 * mutants of a PIT run (docs/reliability.md).
 */
class SlewEdgeCasesTest {
  private static final double EPS = 1e-6;

  /** Azimuth and elevation moving linearly at exactly their declared rates (deg/s). */
  private static PointingTrack linear(double az0, double azRate, double el0, double elRate) {
    return new PointingTrack() {
      @Override
      public Vector3D inertialDirection(double tS) {
        throw new UnsupportedOperationException();
      }

      @Override
      public double maxAngularRateDegPerS(double t0S, double t1S) {
        throw new UnsupportedOperationException();
      }

      @Override
      public AzEl azEl(double tS) {
        return new AzEl(az0 + azRate * tS, el0 + elRate * tS);
      }

      @Override
      public double maxAzimuthRateDegPerS(double t0S, double t1S) {
        return Math.abs(azRate);
      }

      @Override
      public double maxElevationRateDegPerS(double t0S, double t1S) {
        return Math.abs(elRate);
      }
    };
  }

  /** A great-circle drift at exactly its declared rate, from (ra, 0) along the equator. */
  private static PointingTrack drifting(double raDeg, double rateDegPerS) {
    return new PointingTrack() {
      @Override
      public Vector3D inertialDirection(double tS) {
        double a = Math.toRadians(raDeg + rateDegPerS * tS);
        return new Vector3D(Math.cos(a), Math.sin(a), 0);
      }

      @Override
      public double maxAngularRateDegPerS(double t0S, double t1S) {
        return Math.abs(rateDegPerS);
      }
    };
  }

  /** Still, no anchor declared (a caller's own track). */
  private static PointingTrack stillWithoutAnchor(double raDeg, double decDeg) {
    Vector3D u = new Vector3D(Math.toRadians(raDeg), Math.toRadians(decDeg));
    return new PointingTrack() {
      @Override
      public Vector3D inertialDirection(double tS) {
        return u;
      }

      @Override
      public double maxAngularRateDegPerS(double t0S, double t1S) {
        return 0;
      }
    };
  }

  /** An anchored track whose direction is its anchor rotated by {@code offsetDeg} about z (within radius). */
  private static PointingTrack anchored(double raDeg, double radiusDeg, double offsetDeg) {
    Vector3D anchor = new Vector3D(Math.toRadians(raDeg), 0);
    Vector3D shown = new Vector3D(Math.toRadians(raDeg + offsetDeg), 0);
    return new PointingTrack() {
      @Override
      public Vector3D inertialDirection(double tS) {
        return shown;
      }

      @Override
      public double maxAngularRateDegPerS(double t0S, double t1S) {
        return 1e-9;
      }

      @Override
      public Anchor anchor() {
        return new Anchor(anchor, radiusDeg);
      }
    };
  }

  private static final SlewSettings.AltAz MOUNT = new SlewSettings.AltAz(2, 1, 1, 1, 10, null);

  @Test
  void altAzBoundIsTightWhenBothAzimuthsDriftApartAtTheirRates() {
    // From: azimuth 100 + 0.1 t; to: 130 + 0.2 t; elevations still at 40 (azimuth is the slower axis).
    // Departures [0, 100] (mid 50, half 50), arrivals [200, 300] (mid 250, half 50): the bound's azimuth is
    // |180 - 105| + 0.1 x 50 + 0.2 x 50 = 90 deg, reached by departing at 0 (az 100) and arriving at 300
    // (az 190). 90 deg at 2 deg/s, 1 deg/s^2: 90/2 + 2 = 47 s + 10 s settle = 57 s.
    PointingTrack from = linear(100, 0.1, 40, 0);
    PointingTrack to = linear(130, 0.2, 40, 0);
    Transitions t = SlewModel.altaz(MOUNT, 0, 90).transitions(List.of(from, to), null);
    double bound = t.boundS(0, 1, 0, 100, 200, 300);
    assertEquals(57.0, bound, EPS);
    double exact = t.exactS(new int[] {0, 1}, new double[] {0, 0}, new double[] {0, 300})[1];
    assertEquals(57.0, exact, EPS);
  }

  @Test
  void altAzBoundIsTightWhenBothElevationsDriftApartAtTheirRates() {
    // From 60 - 0.05 t, to 20 + 0.04 t, azimuths still at 0. Departures [0, 200] (from(100) = 55, half 100),
    // arrivals [400, 600] (to(500) = 40, half 100): |40 - 55| + 0.05 x 100 + 0.04 x 100 = 24 deg, reached by
    // departing at 0 (60) and arriving at 400 (36). Elevation axis 1 deg/s, 1 deg/s^2: 24/1 + 1 = 25 s, + 10.
    PointingTrack from = linear(0, 0, 60, -0.05);
    PointingTrack to = linear(0, 0, 20, 0.04);
    Transitions t = SlewModel.altaz(MOUNT, 0, 90).transitions(List.of(from, to), null);
    assertEquals(35.0, t.boundS(0, 1, 0, 200, 400, 600), EPS);
    assertEquals(35.0, t.exactS(new int[] {0, 1}, new double[] {0, 0}, new double[] {0, 400})[1], EPS);
  }

  @Test
  void altAzElevationLimitsAreInclusiveInTheBound() {
    // Target at 10 + 0.5 (t - 100): elevation 10 at the arrival midpoint 100, +-5 over [90, 110] -> [5, 15].
    // With limits [5, 15] both ends are allowed (finite bound); [5.001, 15] or [5, 14.999] make it infinite.
    PointingTrack from = linear(0, 0, 10, 0);
    PointingTrack to = linear(20, 0, -40, 0.5);
    assertTrue(Double.isFinite(SlewModel.altaz(MOUNT, 5, 15).transitions(List.of(from, to), null)
        .boundS(0, 1, 0, 0, 90, 110)));
    assertEquals(Double.POSITIVE_INFINITY, SlewModel.altaz(MOUNT, 5.001, 15).transitions(List.of(from, to), null)
        .boundS(0, 1, 0, 0, 90, 110));
    assertEquals(Double.POSITIVE_INFINITY, SlewModel.altaz(MOUNT, 5, 14.999).transitions(List.of(from, to), null)
        .boundS(0, 1, 0, 0, 90, 110));
    // The exact leg's limit check is inclusive too: arriving at 90 (elevation exactly 5) is allowed.
    Transitions t = SlewModel.altaz(MOUNT, 5, 15).transitions(List.of(from, to), null);
    assertTrue(Double.isFinite(t.exactS(new int[] {0, 1}, new double[] {0, 0}, new double[] {0, 90})[1]));
    assertEquals(Double.POSITIVE_INFINITY, t.exactS(new int[] {0, 1}, new double[] {0, 0}, new double[] {0, 89})[1]);
  }

  @Test
  void altAzFromTheStartTrackAndWithoutOne() {
    PointingTrack target = linear(30, 0, 40, 0);
    PointingTrack park = PointingTrack.parked(new dev.sequencer.model.AzElPointing(0, 40));
    // No start track: the first leg is 0 s in the bound and the exact legs.
    Transitions none = SlewModel.altaz(MOUNT, 0, 90).transitions(List.of(target), null);
    assertEquals(0.0, none.boundS(Transitions.START, 0, 0, 0, 10, 20));
    assertEquals(0.0, none.exactS(new int[] {0}, new double[] {0}, new double[] {10})[0]);
    // From a parked start at azimuth 0: 30 deg at 2 deg/s, 1 deg/s^2 = 30/2 + 2 = 17 s + 10 s settle.
    Transitions parked = SlewModel.altaz(MOUNT, 0, 90).transitions(List.of(target), park);
    assertEquals(27.0, parked.boundS(Transitions.START, 0, 0, 0, 10, 10), EPS);
    assertEquals(27.0, parked.exactS(new int[] {0}, new double[] {0}, new double[] {10})[0], EPS);
    // Two still pointings at the same azimuth and elevation: no move, 0 s (no settle), bound and exact.
    Transitions same = SlewModel.altaz(MOUNT, 0, 90).transitions(List.of(linear(0, 0, 40, 0)), park);
    assertEquals(0.0, same.boundS(Transitions.START, 0, 0, 50, 10, 60));
    assertEquals(0.0, same.exactS(new int[] {0}, new double[] {0}, new double[] {10})[0]);
  }

  @Test
  void altAzMountFollowsALongObservationAcrossManyTurns() {
    // From turns at 1 deg/s for 1000 s while observed: +1000 deg unwrapped (sampled by the unwrapping in
    // steps of at most 90 deg). With a wrap of [-1200, 1200] the mount is then at 1000 + 10 = 1010; the next
    // target at azimuth 290 is reached on its branch 1010 (= 290 + 720): 0 deg of azimuth, so only the
    // elevation moves, 10 deg at 2 deg/s, 1 deg/s^2: 10/2 + 2 = 7 s + 10 s. Without unwrapping the state would
    // be 10 and the nearest branch of 290 is -70 (80 deg): 80/2 + 2 = 42 s + 10 s.
    PointingTrack spinner = linear(10, 1, 40, 0);
    PointingTrack next = linear(290, 0, 50, 0);
    SlewSettings.AltAz wide = new SlewSettings.AltAz(2, 2, 1, 1, 10, List.of(-1200.0, 1200.0));
    Transitions t = SlewModel.altaz(wide, 0, 90).transitions(List.of(spinner, next), null);
    double[] legs = t.exactS(new int[] {0, 1}, new double[] {0, 1000}, new double[] {0, 1000});
    assertEquals(17.0, legs[1], EPS);
    // Backwards in time the same change has the opposite sign.
    assertEquals(-1000.0, AltAzTransitions.unwrappedChangeDeg(spinner, 1000, 0), EPS);
    assertEquals(1000.0, AltAzTransitions.unwrappedChangeDeg(spinner, 0, 1000), EPS);
    assertEquals(0.0, AltAzTransitions.unwrappedChangeDeg(spinner, 5, 5));
  }

  @Test
  void azimuthBoundOverALimitedWrap() {
    CableWrap wrap = new CableWrap(-270, 270);
    // Still pointings: from 260 (possible states 260 and -100), to 0 (only the branch 0 is inside): from 260
    // the leg is 260 deg, from -100 it is 100; the bound is the worst over the possible states, 260.
    assertEquals(260.0, AltAzTransitions.azimuthBoundDeg(wrap, 260, 0, 0, 0), 1e-9);
    // With drifts of 5 deg each: the same states, branch 0 surely legal: 260 + 10.
    assertEquals(270.0, AltAzTransitions.azimuthBoundDeg(wrap, 260, 5, 0, 5), 1e-9);
    // From 350: only the state -10 is inside the range: 20 deg to 10.
    assertEquals(20.0, AltAzTransitions.azimuthBoundDeg(wrap, 350, 0, 10, 0), 1e-9);
    // A to-branch at the edge: to 268 +- 5 is not surely legal (273 > 270), and -92 is: from 0, 92 + 5 + 5.
    assertEquals(102.0, AltAzTransitions.azimuthBoundDeg(wrap, 0, 5, 268, 5), 1e-9);
    // A range narrower than a turn with no surely legal branch: infinite.
    CableWrap narrow = new CableWrap(0, 100);
    assertEquals(Double.POSITIVE_INFINITY, AltAzTransitions.azimuthBoundDeg(narrow, 50, 1, 98, 5));
    // No possible from state: nothing is promised.
    assertEquals(Double.POSITIVE_INFINITY, AltAzTransitions.azimuthBoundDeg(narrow, 200, 1, 50, 1));
    // Without a wrap: the shorter way plus the drifts, at most 180.
    assertEquals(25.0, AltAzTransitions.azimuthBoundDeg(CableWrap.NONE, 350, 2, 10, 3), 1e-9);
    assertEquals(180.0, AltAzTransitions.azimuthBoundDeg(CableWrap.NONE, 0, 2, 179, 3), 1e-9);
  }

  @Test
  void saturatedAzimuthBoundIsTheSpanOrInfinite() {
    // Drifts of at least the span: the bound is the span when some from state is possible and (a target
    // branch is surely legal, or the range covers a turn), else infinite.
    CableWrap full = new CableWrap(-270, 270);
    assertEquals(540.0, AltAzTransitions.azimuthBoundDeg(full, 0, 600, 10, 600), 1e-9);
    CableWrap narrow = new CableWrap(0, 100);
    assertEquals(Double.POSITIVE_INFINITY, AltAzTransitions.azimuthBoundDeg(narrow, 50, 200, 50, 200));
    assertEquals(100.0, AltAzTransitions.azimuthBoundDeg(narrow, 50, 200, 50, 10), 1e-9);
    // From-state impossible even with the drift: infinite.
    assertEquals(Double.POSITIVE_INFINITY, AltAzTransitions.azimuthBoundDeg(new CableWrap(0, 10), 200, 10, 5, 1));
  }

  @Test
  void cableWrapBranchesTiesAndEnds() {
    CableWrap wrap = new CableWrap(-270, 270);
    // Nearest branch of 90 to 250: 90 (160 away) vs 450 (outside) vs -270 (outside): 90.
    assertEquals(90.0, wrap.nearestLegal(90, 250), 1e-12);
    // Tie: azimuth 180 from 0: branches 180 and -180 are both 180 away; the one nearer the centre (0)...
    // both equally near: the first found, -180, stays (ties keep the branch nearer the centre, then the lower).
    assertEquals(-180.0, wrap.nearestLegal(180, 0), 1e-12);
    // A branch exactly at the range end is legal.
    assertEquals(270.0, wrap.nearestLegal(270, 260), 1e-12);
    assertEquals(-270.0, wrap.nearestLegal(90, -260), 1e-12);
    // Ties broken towards the centre: range [0, 720], azimuth 0 from 360: branches 0 and 720 both 360 away,
    // 360 itself is nearest (0 away). From 180: 0 and 360 are both 180 away; 360 is the centre.
    CableWrap two = new CableWrap(0, 720);
    assertEquals(360.0, two.nearestLegal(0, 180), 1e-12);
    // Initial state: inside the range as given, else the branch nearest the centre.
    assertEquals(-200.0, wrap.initial(-200), 1e-12);
    assertEquals(-60.0, wrap.initial(300 + 360), 1e-12);
    assertEquals(Double.NaN, new CableWrap(0, 10).initial(200));
    // Unlimited: the shorter way.
    assertEquals(370.0, CableWrap.NONE.nearestLegal(10, 350), 1e-12);
    assertEquals(20.0, CableWrap.NONE.initial(20), 1e-12);
    assertThrows(IllegalArgumentException.class, () -> new CableWrap(5, 5));
    assertThrows(IllegalArgumentException.class, () -> new CableWrap(0, Double.POSITIVE_INFINITY));
    assertTrue(wrap.contains(270) && wrap.contains(-270) && !wrap.contains(270.0001));
  }

  @Test
  void altAzModelLimitsAndWorstCase() {
    AltAzModel m = new AltAzModel(MOUNT, -90, 90);
    assertTrue(m.elevationAllowed(-90) && m.elevationAllowed(90) && !m.elevationAllowed(90.0001));
    // Worst case without a wrap: 180 deg of azimuth (180/2 + 2 = 92 s) and 180 of elevation at 1 deg/s
    // (180 + 1 = 181 s): 181 + 10.
    assertEquals(191.0, m.worstS(), EPS);
    // With the range [-270, 270]: 540/2 + 2 = 272 s (slower than the elevation's 181) + 10.
    assertEquals(282.0, new AltAzModel(new SlewSettings.AltAz(2, 1, 1, 1, 10, List.of(-270.0, 270.0)), 0, 90).worstS(),
        EPS);
    assertEquals(0.0, m.seconds(0, 0));
    assertEquals(10.0, m.movingSeconds(0, 0), EPS);
    // Settle 0 is allowed; equal limits and a wrong-sized range are not.
    new AltAzModel(new SlewSettings.AltAz(2, 1, 1, 1, 0, null), 0, 90);
    assertThrows(IllegalArgumentException.class, () -> new AltAzModel(MOUNT, 10, 10));
    assertThrows(IllegalArgumentException.class, () -> new AltAzModel(MOUNT, -91, 10));
    assertThrows(IllegalArgumentException.class,
        () -> new AltAzModel(new SlewSettings.AltAz(2, 1, 1, 1, 10, List.of(0.0)), 0, 90));
    assertThrows(IllegalArgumentException.class,
        () -> new AltAzModel(new SlewSettings.AltAz(2, 1, 1, 1, -1, null), 0, 90));
  }

  @Test
  void eigenaxisFixedAndAnchoredTracksAreTimeIndependent() {
    SlewModel m = SlewModel.eigenaxis(1.0, 0.05, 20);
    PointingTrack a = PointingTrack.fixed(new RaDec(0, 0));
    PointingTrack b = PointingTrack.fixed(new RaDec(90, 0));
    assertFalse(m.transitions(List.of(a, b), a).timeDependent());
    assertFalse(m.transitions(List.of(a, b), null).timeDependent());
    assertFalse(m.transitions(List.of(stillWithoutAnchor(0, 0), b), null).timeDependent());
    assertFalse(m.transitions(List.of(anchored(0, 0.01, 0.005), b), null).timeDependent());
    assertTrue(m.transitions(List.of(a, drifting(10, 0.01)), null).timeDependent());
    assertTrue(m.transitions(List.of(a, b), drifting(10, 0.01)).timeDependent());
    // The table models are time-independent too.
    assertFalse(Transitions.fixed(2, 60).timeDependent());
    assertFalse(Transitions.matrix(new double[][] {{0, 1}, {1, 0}}, null).timeDependent());
  }

  @Test
  void eigenaxisBoundOfAnchoredTracksAddsBothRadii() {
    // Anchors at RA 0 and RA 30 on the equator, radii 0.01 and 0.02 deg: bound = s(30 + 0.03 + 1e-9) at
    // every time; s(30.03) = 30.03/1 + 1/0.05 = 50.03 s + 20 s settle. The exact leg uses the shown
    // directions (offsets 0.005 and -0.01: 29.985 deg): 49.985 + 20 s.
    SlewModel m = SlewModel.eigenaxis(1.0, 0.05, 20);
    PointingTrack f = anchored(0, 0.01, 0.005);
    PointingTrack t = anchored(30, 0.02, -0.01);
    Transitions tr = m.transitions(List.of(f, t), null);
    assertEquals(70.03, tr.boundS(0, 1, 0, 0, 10, 10), 1e-6);
    assertEquals(70.03, tr.boundS(0, 1, 0, 1000, 2000, 9000), 1e-6);
    assertEquals(69.985, tr.exactS(new int[] {0, 1}, new double[] {0, 0}, new double[] {0, 10})[1], 1e-6);
    // Without radii (fixed tracks) the bound is the exact leg: s(30) = 70 s; a caller's still track without
    // an anchor is its own anchor with radius 0.
    Transitions still = m.transitions(List.of(stillWithoutAnchor(0, 0), PointingTrack.fixed(new RaDec(30, 0))), null);
    assertEquals(70.0, still.boundS(0, 1, 0, 500, 600, 900), 1e-6);
    // Two tracks of one catalogue target (equal anchor directions): no slew, 0 s in both.
    Transitions same = m.transitions(List.of(anchored(45, 0.01, 0.004), anchored(45, 0.01, -0.004)), null);
    assertEquals(0.0, same.boundS(0, 1, 0, 100, 200, 300));
    assertEquals(0.0, same.exactS(new int[] {0, 1}, new double[] {0, 0}, new double[] {0, 200})[1]);
    // From the start pointing without a start track: 0 s.
    assertEquals(0.0, tr.boundS(Transitions.START, 1, 0, 0, 10, 10));
    // With a start track (the anchored f itself as start, to t): the same 70.03 s.
    assertEquals(70.03, m.transitions(List.of(f, t), f).boundS(Transitions.START, 1, 0, 0, 10, 10), 1e-6);
  }

  @Test
  void eigenaxisBoundWithAMovingTrackIsTightAndAnchoredDriftIsCapped() {
    // From still at RA 0; to drifting at 0.01 deg/s from RA 20 (away from it). Arrivals [0, 200]: mid 100
    // (RA 21), half 100: bound angle 21 + 0.01 x 100 = 22 deg, the exact leg at arrival 200 (RA 22): equal.
    // s(22) = 22 + 20 = 42 s + 20 s settle = 62 s.
    SlewModel m = SlewModel.eigenaxis(1.0, 0.05, 20);
    PointingTrack from = PointingTrack.fixed(new RaDec(0, 0));
    PointingTrack to = drifting(20, 0.01);
    Transitions tr = m.transitions(List.of(from, to), null);
    assertEquals(62.0, tr.boundS(0, 1, 50, 50, 0, 200), 1e-6);
    assertEquals(62.0, tr.exactS(new int[] {0, 1}, new double[] {0, 50}, new double[] {0, 200})[1], 1e-6);
    // An anchored track in a time-dependent set drifts at most min(rate x half, 2 radius): with a declared
    // rate of 1e-9 deg/s over a 1e9 s half-width the rate allows 1 deg, the anchor 2 x 0.01 = 0.02 deg.
    // The anchored from-track is shown at RA 0.005 (its anchor RA 0): angle to the drifting target at its
    // arrival midpoint (RA 21) is 20.995, + 0.02 + 1 (the drift of the moving one over half-width 100).
    Transitions mixed = m.transitions(List.of(anchored(0, 0.01, 0.005), to), null);
    double expected = 20.995 + 0.02 + 1.0 + 20 + 20; // s(22.015) + settle, cruise regime
    assertEquals(expected, mixed.boundS(0, 1, -1e9, 1e9, 0, 200), 1e-6);
  }

  @Test
  void argumentsAreCheckedForEveryModel() {
    Transitions tr = SlewModel.eigenaxis(1.0, 0.05, 20).transitions(
        List.of(PointingTrack.fixed(new RaDec(0, 0)), PointingTrack.fixed(new RaDec(9, 0))), null);
    Transitions mount = SlewModel.altaz(MOUNT, 0, 90).transitions(List.of(linear(0, 0, 40, 0)), null);
    for (Transitions t : List.of(tr, mount)) {
      assertThrows(IllegalArgumentException.class, () -> t.exactS(new int[] {0, 1}, new double[] {0}, new double[] {0, 1}));
      assertThrows(IllegalArgumentException.class, () -> t.exactS(new int[] {0}, new double[] {0}, new double[] {0, 1}));
      assertThrows(IllegalArgumentException.class, () -> t.exactS(new int[] {5}, new double[] {0}, new double[] {0}));
      assertThrows(IllegalArgumentException.class, () -> t.exactS(new int[] {-1}, new double[] {0}, new double[] {0}));
      assertThrows(IllegalArgumentException.class, () -> t.boundS(0, 0, 10, 5, 0, 1));
      assertThrows(IllegalArgumentException.class, () -> t.boundS(0, 0, 0, 1, Double.NaN, 1));
    }
    // Index = size is out of range; size - 1 is in.
    assertEquals(2, tr.exactS(new int[] {0, 1}, new double[] {0, 0}, new double[] {0, 0}).length);
    assertThrows(IllegalArgumentException.class, () -> tr.exactS(new int[] {2}, new double[] {0}, new double[] {0}));
    // Tables: negative, NaN and infinite entries are refused, 0 is allowed.
    assertThrows(IllegalArgumentException.class, () -> Transitions.matrix(new double[][] {{0, -1}, {1, 0}}, null));
    assertThrows(IllegalArgumentException.class, () -> Transitions.matrix(new double[][] {{0, 1}, {1, 0}},
        new double[] {0, Double.NaN}));
    assertThrows(IllegalArgumentException.class, () -> Transitions.matrix(new double[][] {{0, 1}, {1, 0}},
        new double[] {0}));
    assertThrows(IllegalArgumentException.class, () -> Transitions.matrix(new double[][] {{0, 1}, {1}}, null));
    Transitions table = Transitions.matrix(new double[][] {{0, 7}, {3, 0}}, new double[] {0, 5});
    assertEquals(List.of(5.0, 3.0, 7.0), java.util.Arrays.stream(
        table.exactS(new int[] {1, 0, 1}, new double[3], new double[3])).boxed().toList());
    assertEquals(0.0, Transitions.fixed(2, 0).exactS(new int[] {0}, new double[] {0}, new double[] {0})[0]);
    assertEquals(List.of(60.0, 60.0), java.util.Arrays.stream(
        Transitions.fixed(2, 60).exactS(new int[] {0, 1}, new double[2], new double[2])).boxed().toList());
    assertThrows(IllegalArgumentException.class, () -> Transitions.fixed(2, -1e-9));
    assertThrows(IllegalArgumentException.class, () -> Transitions.fixed(-1, 0));
  }

  @Test
  void smallValuesOfTheModelsAndTracks() {
    EigenaxisModel e = new EigenaxisModel(1.0, 0.05, 20);
    // 90 deg between the pole and the equator: 130 s (docs/slew.md worked example).
    assertEquals(130.0, e.seconds(new Vector3D(0, 0, 1), new Vector3D(1, 0, 0)), 1e-9);
    assertEquals(0.0, e.secondsForAngle(0));
    assertEquals(20.0 + 2 * Math.sqrt(1e-6 / 0.05), e.secondsForAngle(1e-6), 1e-9);
    // PointingTrack.fixed: RA 90, Dec 30 is (0, cos 30, sin 30).
    Vector3D u = PointingTrack.fixed(new RaDec(90, 30)).inertialDirection(0);
    assertEquals(0.0, u.getX(), 1e-15);
    assertEquals(Math.cos(Math.toRadians(30)), u.getY(), 1e-15);
    assertEquals(0.5, u.getZ(), 1e-15);
    assertEquals(0.0, PointingTrack.fixed(new RaDec(90, 30)).anchor().radiusDeg());
    assertEquals(u, PointingTrack.fixed(new RaDec(90, 30)).anchor().direction());
    // Anchor radii: 0 and 180 allowed, outside refused.
    new PointingTrack.Anchor(u, 0);
    new PointingTrack.Anchor(u, 180);
    assertThrows(IllegalArgumentException.class, () -> new PointingTrack.Anchor(u, -1e-9));
    assertThrows(IllegalArgumentException.class, () -> new PointingTrack.Anchor(u, 180.001));
    // The default of a track: no anchor; a parked pointing has no inertial direction.
    assertEquals(null, drifting(0, 1).anchor());
    assertThrows(UnsupportedOperationException.class,
        () -> PointingTrack.parked(new dev.sequencer.model.AzElPointing(0, 40)).inertialDirection(0));
    // Rest-to-rest at the switch angle omega^2/alpha = 20 deg: 40 s by both formulas.
    assertEquals(40.0, new RestToRest(1.0, 0.05).seconds(20), 1e-9);
    assertEquals(0.0, new RestToRest(1.0, 0.05).seconds(-1));
  }
}
