package dev.sequencer.validate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The validator's closed forms anchored on hand-derived worked cases (derivations beside each; none of these
 * numbers comes from the planner's slew package).
 */
class SlewWorkedCasesTest {
  @Test
  void trapezoidAndTriangleProfiles() {
    RestToRestProfile p = new RestToRestProfile(1.0, 0.05);
    // omega = 1 deg/s, alpha = 0.05 deg/s^2: the ramps take omega/alpha = 20 s each and cover
    // omega^2/(2 alpha) = 10 deg each, so the profile is a trapezoid from 20 deg on.
    // 90 deg: 20 s up (10 deg), 70 deg at 1 deg/s (70 s), 20 s down (10 deg): 110 s = 90/1 + 1/0.05.
    assertEquals(110.0, p.seconds(90), 1e-12);
    // 20 deg exactly: no coast, 20 + 20 = 40 s (both formulas: 20/1 + 20 = 40 and 2 sqrt(20/0.05) = 40).
    assertEquals(40.0, p.seconds(20), 1e-12);
    // 5 deg: a triangle, half the angle (2.5 deg) in t with 0.5 alpha t^2 = 2.5, t = 10 s: 20 s in all.
    assertEquals(20.0, p.seconds(5), 1e-12);
    assertEquals(0.0, p.seconds(0), 0);
    assertEquals(0.0, p.seconds(-1), 0);
    // Positions along the 90 deg trapezoid: 0.5 x 0.05 x 10^2 = 2.5 deg at 10 s; 10 deg at the end of the
    // ramp (20 s); 10 + 30 = 40 deg at 50 s; 90 - 2.5 = 87.5 deg 10 s before the end (100 s); 90 after.
    assertEquals(2.5, p.angleAt(10, 90), 1e-12);
    assertEquals(10.0, p.angleAt(20, 90), 1e-12);
    assertEquals(40.0, p.angleAt(50, 90), 1e-12);
    assertEquals(87.5, p.angleAt(100, 90), 1e-12);
    assertEquals(90.0, p.angleAt(200, 90), 0);
    assertEquals(0.0, p.angleAt(-1, 90), 0);
    // Along the 5 deg triangle: 0.5 x 0.05 x 5^2 = 0.625 deg at 5 s, half (2.5) at 10 s, 5 - 0.625 at 15 s.
    assertEquals(0.625, p.angleAt(5, 5), 1e-12);
    assertEquals(2.5, p.angleAt(10, 5), 1e-12);
    assertEquals(4.375, p.angleAt(15, 5), 1e-12);
  }

  @Test
  void altAzTheSlowerAxisWins() {
    // Azimuth 3 deg/s at 1 deg/s^2, elevation 2 deg/s at 1 deg/s^2 (the format's example mount).
    // 120 deg of azimuth: ramps 3 s each covering 4.5 deg; T = 120/3 + 3 = 43 s.
    // 30 deg of elevation: ramps 2 s covering 2 deg each; T = 30/2 + 2 = 17 s. The slower axis: 43 s.
    RestToRestProfile az = new RestToRestProfile(3, 1);
    RestToRestProfile el = new RestToRestProfile(2, 1);
    assertEquals(43.0, az.seconds(120), 1e-12);
    assertEquals(17.0, el.seconds(30), 1e-12);
    // 1 deg of azimuth never reaches 3 deg/s (ramps need 9 deg): 2 sqrt(1/1) = 2 s.
    assertEquals(2.0, az.seconds(1), 1e-12);
  }

  @Test
  void cableWrapBranches() {
    SlewLegs.Wrap wrap = new SlewLegs.Wrap(-270, 270);
    // From unwrapped 200 deg, azimuth 10 deg: branches 10 and -350 (outside) and 370 (outside): 10 it is.
    assertEquals(10.0, wrap.nearestLegal(10, 200), 0);
    // From 250 deg, azimuth 260 deg: 260 is inside and 10 deg away; -100 is 350 deg away.
    assertEquals(260.0, wrap.nearestLegal(260, 250), 0);
    // From 100 deg, azimuth 280 deg: 280 is outside, so -80 (180 deg away) though the short way is +180.
    assertEquals(-80.0, wrap.nearestLegal(280, 100), 0);
    // A tie: from 0 deg, azimuth 180 deg: 180 and -180 both 180 deg away; -180 and 180 are equally near
    // the centre 0, so the first found (-180) stays. From 90, azimuth 270: -90 (180 away) vs 270 (180 away):
    // -90 is nearer the centre.
    assertEquals(-90.0, wrap.nearestLegal(270, 90), 0);
    // Start pointing inside the range names its branch; outside, the branch nearest the centre.
    assertEquals(-200.0, wrap.initial(-200), 0);
    assertEquals(-60.0, wrap.initial(300), 0);
    // A narrow range [0, 90]: azimuth 180 has no legal branch.
    assertTrue(Double.isNaN(new SlewLegs.Wrap(0, 90).nearestLegal(180, 45)));
    // No wrap: the short way round.
    assertEquals(370.0, SlewLegs.Wrap.NONE.nearestLegal(10, 350), 1e-12);
    assertEquals(-10.0, SlewLegs.Wrap.NONE.nearestLegal(350, 0), 1e-12);
  }

  @Test
  void greatCircleInterpolation() {
    // Halfway between the x and y axes along the great circle: (1, 1, 0)/sqrt 2.
    var a = org.hipparchus.geometry.euclidean.threed.Vector3D.PLUS_I;
    var b = org.hipparchus.geometry.euclidean.threed.Vector3D.PLUS_J;
    var m = SlewKeepOut.slerp(a, b, 90, 0.5);
    assertEquals(Math.sqrt(0.5), m.getX(), 1e-15);
    assertEquals(Math.sqrt(0.5), m.getY(), 1e-15);
    assertEquals(90.0, SlewLegs.angleDeg(a, b), 1e-12);
    // One third of the way: 30 deg from x.
    assertEquals(30.0, SlewLegs.angleDeg(a, SlewKeepOut.slerp(a, b, 90, 1.0 / 3)), 1e-12);
  }
}
