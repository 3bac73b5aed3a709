package dev.sequencer.slew;

import static org.junit.jupiter.api.Assertions.assertEquals;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import org.junit.jupiter.api.Test;

/** The alt-az azimuth bound's shortcut for drifts of at least the wrap span agrees with the branch loops. */
class AzimuthBoundTest {

  /** The branch loops as they stood before the shortcut (commit dfc1777), kept here as the reference. */
  private static double loops(CableWrap wrap, double fromDeg, double fromDriftDeg, double toDeg, double toDriftDeg) {
    double worstDeg = Double.NaN;
    for (long k = (long) Math.floor((wrap.minDeg() - fromDriftDeg - fromDeg) / 360);
        fromDeg + 360 * k - fromDriftDeg <= wrap.maxDeg(); k++) {
      double u = fromDeg + 360 * k;
      if (u + fromDriftDeg < wrap.minDeg()) {
        continue;
      }
      double surelyDeg = Double.POSITIVE_INFINITY;
      double possiblyDeg = Double.NaN;
      for (long j = (long) Math.floor((wrap.minDeg() - toDriftDeg - toDeg) / 360);
          toDeg + 360 * j - toDriftDeg <= wrap.maxDeg(); j++) {
        double v = toDeg + 360 * j;
        if (v + toDriftDeg < wrap.minDeg()) {
          continue;
        }
        double distanceDeg = Math.min(wrap.spanDeg(), Math.abs(v - u) + fromDriftDeg + toDriftDeg);
        possiblyDeg = Double.isNaN(possiblyDeg) ? distanceDeg : Math.max(possiblyDeg, distanceDeg);
        if (v - toDriftDeg >= wrap.minDeg() && v + toDriftDeg <= wrap.maxDeg()) {
          surelyDeg = Math.min(surelyDeg, distanceDeg);
        }
      }
      double stateDeg = Double.isFinite(surelyDeg) ? surelyDeg
          : wrap.spanDeg() >= 360 && !Double.isNaN(possiblyDeg) ? possiblyDeg
          : Double.POSITIVE_INFINITY;
      worstDeg = Double.isNaN(worstDeg) ? stateDeg : Math.max(worstDeg, stateDeg);
    }
    return Double.isNaN(worstDeg) ? Double.POSITIVE_INFINITY : worstDeg;
  }

  @Property(tries = 2000)
  void agreesWithTheBranchLoops(
      @ForAll @DoubleRange(min = -400, max = 400) double minDeg,
      @ForAll @DoubleRange(min = 10, max = 800) double spanDeg,
      @ForAll @DoubleRange(min = 0, max = 360) double fromDeg,
      @ForAll @DoubleRange(min = 0, max = 360) double toDeg,
      @ForAll @DoubleRange(min = 0, max = 3) double fromDriftSpans,
      @ForAll @DoubleRange(min = 0, max = 3) double toDriftSpans) {
    CableWrap wrap = new CableWrap(minDeg, minDeg + spanDeg);
    double fd = fromDriftSpans * spanDeg;
    double td = toDriftSpans * spanDeg;
    assertEquals(loops(wrap, fromDeg, fd, toDeg, td), AltAzTransitions.azimuthBoundDeg(wrap, fromDeg, fd, toDeg, td),
        () -> wrap + " from " + fromDeg + "+-" + fd + " to " + toDeg + "+-" + td);
  }

  @Test
  void driftOfHoursAtTheNoBoundRateGivesTheSpanForAFullTurnWrap() {
    // 360 deg/s (the "no useful bound" rate near the zenith) over a 5 h departure interval: the loops would
    // visit about 1.8e4 x 1.8e4 branches; the bound is the whole [-270, 270] range.
    double drift = 360.0 * 5 * 3600;
    assertEquals(540.0, AltAzTransitions.azimuthBoundDeg(new CableWrap(-270, 270), 10, drift, 200, drift), 0.0);
  }

  @Test
  void driftOfTheSpanOnAPartialTurnWrapIsImpossible() {
    // [0, 300] covers less than a turn: with the target's azimuth drifting over the whole range, no branch
    // is surely legal and not every state has one, so nothing is promised.
    assertEquals(Double.POSITIVE_INFINITY,
        AltAzTransitions.azimuthBoundDeg(new CableWrap(0, 300), 10, 5, 200, 300), 0.0);
  }
}
