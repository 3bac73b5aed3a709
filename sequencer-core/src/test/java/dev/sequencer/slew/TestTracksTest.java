package dev.sequencer.slew;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.AzEl;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The analytic test tracks are themselves checked: geometry at known points, rate bounds by sampling. */
class TestTracksTest {

  @Test
  void starCulminatesSouthAtNinetyMinusLatitudeMinusDeclination() {
    // Upper culmination (H = 0) of a star south of the zenith: elevation 90 - (phi - delta) = 60 deg for
    // phi = 40, delta = 10, azimuth 180 (due south); textbook geometry, from memory. Tolerance: rounding.
    AzEl p = new StarTrack(40, 10, 0, 0).azEl(0);
    assertEquals(60, p.elevationDeg(), 1e-9);
    assertEquals(180, p.azimuthDeg(), 1e-9);
  }

  @Test
  void starRisesInTheEastOnTheEquator() {
    // On the equator a star of declination 0 rises due east (azimuth 90) at hour angle -90 deg, elevation 0.
    AzEl p = new StarTrack(0, 0, 0, -90).azEl(0);
    assertEquals(0, p.elevationDeg(), 1e-9);
    assertEquals(90, p.azimuthDeg(), 1e-9);
  }

  @Test
  void rateBoundsHoldByFiniteDifferences() {
    List<PointingTrack> tracks = List.of(
        new StarTrack(40, 10, 0, -30), new StarTrack(-30, -60, 0, 100), new StarTrack(52, 80, 0, 10),
        new StarTrack(20, 15, 0, -5), MovingTrack.ground(350, 0.5, 3, 40, 10, 0.05));
    double dt = 0.5;
    for (PointingTrack t : tracks) {
      for (double t0 = 0; t0 < 3600; t0 += 300) {
        double azBound = t.maxAzimuthRateDegPerS(t0, t0 + 300);
        double elBound = t.maxElevationRateDegPerS(t0, t0 + 300);
        for (double s = t0; s + dt <= t0 + 300; s += dt) {
          AzEl a = t.azEl(s);
          AzEl b = t.azEl(s + dt);
          double azRate = Math.abs(Math.IEEEremainder(b.azimuthDeg() - a.azimuthDeg(), 360)) / dt;
          double elRate = Math.abs(b.elevationDeg() - a.elevationDeg()) / dt;
          // A mean rate over a step never exceeds the maximum rate; 1e-9 absorbs rounding.
          assertTrue(azRate <= azBound + 1e-9, t + " azimuth rate " + azRate + " > " + azBound + " at " + s);
          assertTrue(elRate <= elBound + 1e-9, t + " elevation rate " + elRate + " > " + elBound + " at " + s);
        }
      }
    }
  }

  @Test
  void unwrappingFollowsTwoFullTurns() {
    // 1 deg/s for 720 s: two full turns, although the track reports azimuths in [0, 360).
    MovingTrack t = MovingTrack.ground(10, 1, 0, 40, 0, 0);
    assertEquals(720, AltAzTransitions.unwrappedChangeDeg(t, 0, 720), 1e-9);
    assertEquals(-720, AltAzTransitions.unwrappedChangeDeg(t, 720, 0), 1e-9);
  }
}
