package dev.sequencer.io;

/** An allowed numeric interval, with its rule in words ("must be > 0", "must be in [-90, 90]"). */
record Range(double lo, boolean loClosed, double hi, boolean hiClosed) {
  static final Range ANY = new Range(Double.NEGATIVE_INFINITY, false, Double.POSITIVE_INFINITY, false);
  static final Range POSITIVE = new Range(0, false, Double.POSITIVE_INFINITY, false);
  static final Range NON_NEGATIVE = new Range(0, true, Double.POSITIVE_INFINITY, false);
  static final Range LATITUDE = closed(-90, 90);
  /** Longitudes east of Greenwich, either convention: [-180, 180] or [0, 360). */
  static final Range LONGITUDE = new Range(-180, true, 360, false);
  static final Range RIGHT_ASCENSION = new Range(0, true, 360, false);
  static final Range ELEVATION = closed(-90, 90);
  static final Range SEPARATION = closed(0, 180);
  /** Altitudes of ground sites and Earth points, metres; catches kilometres given for metres. */
  static final Range ALTITUDE_M = closed(-1000, 10000);

  static Range closed(double lo, double hi) {
    return new Range(lo, true, hi, true);
  }

  static Range above(double lo) {
    return new Range(lo, false, Double.POSITIVE_INFINITY, false);
  }

  boolean contains(double v) {
    boolean aboveLo = loClosed ? v >= lo : v > lo;
    boolean belowHi = hiClosed ? v <= hi : v < hi;
    return aboveLo && belowHi;
  }

  /** The rule in words. */
  String rule() {
    if (hi == Double.POSITIVE_INFINITY) {
      return lo == Double.NEGATIVE_INFINITY ? "must be finite" : "must be " + (loClosed ? ">= " : "> ") + num(lo);
    }
    return "must be in " + (loClosed ? "[" : "(") + num(lo) + ", " + num(hi) + (hiClosed ? "]" : ")");
  }

  static String num(double v) {
    return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : Double.toString(v);
  }
}
