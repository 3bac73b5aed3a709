package dev.sequencer.slew;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.AzEl;
import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.SlewSettings;
import java.util.List;
import java.util.Random;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;

/**
 * The Sun keep-out along alt-az slews (spec A3: each axis moves with its own rest-to-rest profile, both
 * starting at the departure; then the mount rests at the end direction). The path is re-derived here with
 * this test's own trapezoid profile and its own separation formula (spherical law of cosines), sampled every
 * 0.01 s; it shares with the code under test only the spec's reading of what the path is.
 */
class AltAzKeepOutPropertyTest {
  private static final double SETTLE_S = 2;
  private static final double AZ_RATE = 3;
  private static final double EL_RATE = 1.5;
  private static final double AZ_ACCEL = 1;
  private static final double EL_ACCEL = 0.5;

  /** A Sun cone fixed in the site's frame, or turning in azimuth at {@code azRateDegPerS}. */
  private static SiteKeepOut sun(double azDeg, double elDeg, double radiusDeg, double azRateDegPerS) {
    return new SiteKeepOut() {
      @Override
      public AzEl azEl(double tS) {
        return new AzEl(azDeg + azRateDegPerS * tS, elDeg);
      }

      @Override
      public double maxSiteDriftDegPerS() {
        return Math.abs(azRateDegPerS) * Math.cos(Math.toRadians(elDeg)) + 1e-12;
      }

      @Override
      public Vector3D axis(double tS) {
        throw new UnsupportedOperationException("site frame only in this test");
      }

      @Override
      public double radiusDeg(double tS) {
        return radiusDeg;
      }

      @Override
      public double maxDriftDegPerS() {
        return maxSiteDriftDegPerS();
      }

      @Override
      public String name() {
        return "Sun";
      }
    };
  }

  private static Transitions transitions(List<PointingTrack> tracks, PointingTrack start, List<Double> wrap,
      SiteKeepOut cone) {
    AltAzModel model = new AltAzModel(new SlewSettings.AltAz(AZ_RATE, EL_RATE, AZ_ACCEL, EL_ACCEL, SETTLE_S, wrap),
        -10, 90);
    KeepOuts k = cone == null ? KeepOuts.NONE
        : new KeepOuts(List.of(cone), List.of(), new boolean[tracks.size()], true, -1e6, 1e6);
    return model.transitions(tracks, start, k);
  }

  /** This test's own rest-to-rest profile: the angle covered t seconds into a move of {@code angle}. */
  private static double covered(double angle, double rate, double accel, double t) {
    double ramp = rate / accel;
    double total = angle >= rate * ramp ? angle / rate + ramp : 2 * Math.sqrt(angle / accel);
    double half = Math.min(ramp, total / 2);
    if (t <= 0) {
      return 0;
    }
    if (t >= total) {
      return angle;
    }
    if (t <= half) {
      return 0.5 * accel * t * t;
    }
    if (t >= total - half) {
      return angle - 0.5 * accel * (total - t) * (total - t);
    }
    return 0.5 * accel * half * half + rate * (t - half);
  }

  private static double separation(double az1, double el1, double az2, double el2) {
    double a = Math.toRadians(el1);
    double b = Math.toRadians(el2);
    double c = Math.sin(a) * Math.sin(b) + Math.cos(a) * Math.cos(b) * Math.cos(Math.toRadians(az1 - az2));
    return Math.toDegrees(Math.acos(Math.max(-1, Math.min(1, c))));
  }

  /** The least clearance of the path's samples (both azimuth directions' shorter way, as the mount takes it). */
  private static double leastClearance(double fromAz, double fromEl, double toAz, double toEl, double legS,
      SiteKeepOut cone, double departS) {
    double dAz = toAz - fromAz;
    double dEl = toEl - fromEl;
    double least = Double.POSITIVE_INFINITY;
    for (double t = 0; t <= legS + 1e-9; t += 0.01) {
      double az = fromAz + Math.signum(dAz) * covered(Math.abs(dAz), AZ_RATE, AZ_ACCEL, t);
      double el = fromEl + Math.signum(dEl) * covered(Math.abs(dEl), EL_RATE, EL_ACCEL, t);
      AzEl s = cone.azEl(departS + t);
      least = Math.min(least, separation(az, el, s.azimuthDeg(), s.elevationDeg()) - cone.radiusDeg(departS + t));
    }
    return least;
  }

  @Test
  void aSlewThroughTheSunIsImpossibleAtThatDeparture() {
    // The Sun at azimuth 180, elevation 10, keep-out 20 deg; from azimuth 150 to 210 at elevation 10 the
    // shorter way (60 deg through south) passes the Sun's centre; the other way (300 deg through north) does not.
    SiteKeepOut cone = sun(180, 10, 20, 0);
    PointingTrack from = PointingTrack.parked(new AzElPointing(150, 10));
    PointingTrack to = PointingTrack.parked(new AzElPointing(210, 10));
    double direct = transitions(List.of(to), from, null, null).exactS(new int[] {0}, new double[] {0},
        new double[] {1000})[0];
    double round = transitions(List.of(to), from, null, cone).exactS(new int[] {0}, new double[] {0},
        new double[] {1000})[0];
    // Hand derivation: 60 deg of azimuth at 3 deg/s with 1 deg/s^2 ramps: 60/3 + 3 = 23 s, plus 2 s settle.
    // The mount takes the nearest branch (as the validator does); blocked, the leg is impossible.
    assertEquals(25, direct, 1e-9);
    assertEquals(Double.POSITIVE_INFINITY, round);
    // A cable wrap [90, 450] allows only the way through south: no slew keeps the Sun out.
    double wrapped = transitions(List.of(to), from, List.of(90.0, 450.0), cone).exactS(new int[] {0},
        new double[] {0}, new double[] {1000})[0];
    assertEquals(Double.POSITIVE_INFINITY, wrapped);
  }

  @Test
  void randomSlewsNearTheSunKeepItAndTheBoundCoversThem() {
    Random r = new Random(20261202);
    int detours = 0;
    int impossible = 0;
    int clear = 0;
    for (int i = 0; i < 600; i++) {
      double sunAz = r.nextDouble() * 360;
      double sunEl = -5 + r.nextDouble() * 50;
      double radius = 5 + r.nextDouble() * 40;
      double drift = r.nextBoolean() ? 0 : 0.0042; // still, or turning at the Earth's rate
      SiteKeepOut cone = sun(sunAz, sunEl, radius, drift);
      double fromAz = sunAz + (r.nextDouble() - 0.5) * 240;
      double toAz = sunAz + (r.nextDouble() - 0.5) * 240;
      double fromEl = Math.max(-10, Math.min(89, sunEl + (r.nextDouble() - 0.5) * 80));
      double toEl = Math.max(-10, Math.min(89, sunEl + (r.nextDouble() - 0.5) * 80));
      if (separation(fromAz, fromEl, sunAz, sunEl) < radius + 1 || separation(toAz, toEl, sunAz, sunEl) < radius + 1) {
        continue; // the observations themselves must keep the Sun out (their windows say so)
      }
      List<Double> wrap = r.nextBoolean() ? null : List.of(fromAz - 270, fromAz + 270);
      PointingTrack from = PointingTrack.parked(new AzElPointing(fromAz, fromEl));
      PointingTrack to = PointingTrack.parked(new AzElPointing(toAz, toEl));
      Transitions plain = transitions(List.of(to), from, wrap, null);
      Transitions kept = transitions(List.of(to), from, wrap, cone);
      double departure = r.nextDouble() * 100;
      double arrival = departure + 400;
      double p = plain.exactS(new int[] {0}, new double[] {departure}, new double[] {arrival})[0];
      double k = kept.exactS(new int[] {0}, new double[] {departure}, new double[] {arrival})[0];
      assertTrue(k >= p - 1e-9, "the keep-out never makes a slew quicker: " + k + " < " + p);
      double plainTarget = Math.IEEEremainder(toAz - fromAz, 360) + fromAz;
      if (wrap == null) {
        double directClearance = leastClearance(fromAz, fromEl, plainTarget, toEl, p - SETTLE_S, cone, departure);
        if (directClearance > 0.5) {
          assertEquals(p, k, 1e-9, "a clear direct path is kept (clearance " + directClearance + ")");
          clear++;
        }
      }
      if (Double.isFinite(k)) {
        // Find which branch the mount took from the leg's length, and sample it densely.
        double taken = Double.NaN;
        for (double w : new double[] {plainTarget, plainTarget - 360, plainTarget + 360}) {
          double s = new AltAzModel(new SlewSettings.AltAz(AZ_RATE, EL_RATE, AZ_ACCEL, EL_ACCEL, SETTLE_S, null),
              -10, 90).seconds(Math.abs(w - fromAz), Math.abs(toEl - fromEl));
          if (Math.abs(s - k) < 1e-9 && leastClearance(fromAz, fromEl, w, toEl, k - SETTLE_S, cone, departure) >= -1e-6) {
            taken = w;
          }
        }
        assertTrue(!Double.isNaN(taken), "no branch of length " + k + " s keeps the Sun out (case " + i + ")");
        if (k > p + 1e-9) {
          detours++;
        }
        double bound = kept.boundS(Transitions.START, 0, departure, departure, arrival, arrival);
        assertTrue(bound >= k - 1e-9, "bound " + bound + " below the exact leg " + k);
      } else {
        impossible++;
        assertEquals(Double.POSITIVE_INFINITY, kept.boundS(Transitions.START, 0, departure, departure, arrival,
            arrival), "an impossible leg has no finite bound");
      }
    }
    assertEquals(0, detours, "only the nearest branch is taken");
    assertTrue(impossible > 5 && clear > 100,
        "the cases cover impossible slews and clear ones: " + impossible + ", " + clear);
  }

  @Test
  void theSunWellBelowTheHorizonChangesNothing() {
    // At night (Sun at -30 deg) with a 45 deg keep-out no path above 20 deg elevation comes within 50 deg:
    // legs and bounds are those without the keep-out (the pairwise proofs of MountKeepOut.mayBind), over
    // short ranges (the box against the Sun's direction) and over an hour (the elevation gap alone: the
    // Sun's azimuth turns by 15 deg, its elevation stays at -30 in this test's cone).
    SiteKeepOut cone = sun(0, -30, 45, 0.0042);
    Random r = new Random(7);
    for (int i = 0; i < 200; i++) {
      PointingTrack from = PointingTrack.parked(new AzElPointing(r.nextDouble() * 360, 20 + r.nextDouble() * 60));
      PointingTrack to = PointingTrack.parked(new AzElPointing(r.nextDouble() * 360, 20 + r.nextDouble() * 60));
      Transitions plain = transitions(List.of(to), from, null, null);
      Transitions kept = transitions(List.of(to), from, null, cone);
      assertEquals(plain.exactS(new int[] {0}, new double[] {0}, new double[] {500})[0],
          kept.exactS(new int[] {0}, new double[] {0}, new double[] {500})[0], 0);
      // Over 400 s the Sun moves at most 1.7 deg, so 50 - 1.7 > 45 still proves it.
      assertEquals(plain.boundS(Transitions.START, 0, 0, 100, 100, 400),
          kept.boundS(Transitions.START, 0, 0, 100, 100, 400), 0);
    }
    PointingTrack low = PointingTrack.parked(new AzElPointing(10, 20));
    PointingTrack high = PointingTrack.parked(new AzElPointing(200, 30));
    assertEquals(transitions(List.of(high), low, null, null).boundS(Transitions.START, 0, 0, 100, 100, 3600),
        transitions(List.of(high), low, null, cone).boundS(Transitions.START, 0, 0, 100, 100, 3600), 0);
    // A Sun 5 deg up: neither proof holds for a slew that passes 15 deg above it; no finite bound is promised.
    SiteKeepOut dusk = sun(100, 5, 45, 0.0042);
    assertEquals(Double.POSITIVE_INFINITY, transitions(List.of(high), low, null, dusk).boundS(Transitions.START, 0,
        0, 100, 100, 3600));
  }
}
