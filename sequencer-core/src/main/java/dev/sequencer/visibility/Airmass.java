package dev.sequencer.visibility;

/**
 * Relative optical airmass of Kasten and Young (1989), exactly as the scenario format gives it:
 * X(h) = 1 / (sin h + 0.50572 (h + 6.07995)^-1.6364), h the elevation in degrees. It gives 37.92 at the
 * horizon, 1.9943 at 30 deg and 0.99971 at the zenith.
 *
 * <p>X falls strictly from h = 0 to about h = 89.98 deg and rises by under 1e-9 from there to the zenith;
 * it drops below 1 at h = 88.61 deg and stays below. So for a limit max >= 1 the set where X &lt;= max
 * and h &gt; 0 (the format's rule) is the elevations at or above one floor: the root of X(h) = max on
 * the falling branch, or 0 deg when max >= X(0). {@link #minElevationDeg} finds that floor once, and
 * the visibility margin is then an elevation margin like the others.
 */
final class Airmass {
  private Airmass() {}

  /** X(h) of the formula above; defined for h > -6.07995 deg. */
  static double of(double elevationDeg) {
    return 1.0 / (Math.sin(Math.toRadians(elevationDeg)) + 0.50572 * Math.pow(elevationDeg + 6.07995, -1.6364));
  }

  /**
   * The lowest elevation, degrees, at which the airmass is at most {@code airmassMax} (>= 1): X there
   * equals the limit to 1e-12 deg of elevation, or 0 when the limit is at least X(0).
   */
  static double minElevationDeg(double airmassMax) {
    if (!(airmassMax >= 1.0)) {
      throw new IllegalArgumentException("airmassMax must be >= 1, got " + airmassMax);
    }
    if (airmassMax >= of(0.0)) {
      return 0.0;
    }
    double lo = 0.0; // X(lo) > max
    double hi = 88.61; // X(hi) < 1 <= max
    while (hi - lo > 1e-12) {
      double mid = 0.5 * (lo + hi);
      if (of(mid) > airmassMax) {
        lo = mid;
      } else {
        hi = mid;
      }
    }
    return hi;
  }
}
