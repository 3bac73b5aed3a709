package dev.sequencer.slew;

/**
 * The allowed unwrapped azimuth [minDeg, maxDeg] of an alt-az mount; infinite ends mean no cable wrap.
 * An azimuth A can be reached on every branch A + k·360 inside the range.
 */
record CableWrap(double minDeg, double maxDeg) {
  static final CableWrap NONE = new CableWrap(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);

  CableWrap {
    if (Double.isNaN(minDeg) || Double.isNaN(maxDeg) || !(minDeg < maxDeg)) {
      throw new IllegalArgumentException("azimuthRangeDeg: must be [min, max] with min < max (was [" + minDeg + ", " + maxDeg + "])");
    }
    if (Double.isInfinite(minDeg) != Double.isInfinite(maxDeg)) {
      throw new IllegalArgumentException("azimuthRangeDeg: both ends finite or neither (was [" + minDeg + ", " + maxDeg + "])");
    }
  }

  boolean limited() {
    return Double.isFinite(minDeg);
  }

  double spanDeg() {
    return maxDeg - minDeg;
  }

  boolean contains(double unwrappedDeg) {
    return unwrappedDeg >= minDeg && unwrappedDeg <= maxDeg;
  }

  /**
   * The branch of {@code azimuthDeg} nearest {@code fromDeg} inside the range (the quicker legal way
   * round); ties go to the branch nearer the range centre. NaN when no branch is inside.
   */
  double nearestLegal(double azimuthDeg, double fromDeg) {
    if (!limited()) {
      return azimuthDeg + 360 * Math.rint((fromDeg - azimuthDeg) / 360);
    }
    double centre = 0.5 * (minDeg + maxDeg);
    double best = Double.NaN;
    for (long k = (long) Math.ceil((minDeg - azimuthDeg) / 360); azimuthDeg + 360 * k <= maxDeg; k++) {
      double v = azimuthDeg + 360 * k;
      if (!contains(v)) {
        continue; // rounding at an end of the range
      }
      if (Double.isNaN(best)
          || Math.abs(v - fromDeg) < Math.abs(best - fromDeg)
          || (Math.abs(v - fromDeg) == Math.abs(best - fromDeg) && Math.abs(v - centre) < Math.abs(best - centre))) {
        best = v;
      }
    }
    return best;
  }

  /**
   * The initial unwrapped state for an azimuth: itself when inside the range (so a start pointing of -200
   * names that branch), else the legal branch nearest the range centre; NaN when none is legal.
   */
  double initial(double azimuthDeg) {
    if (contains(azimuthDeg)) {
      return azimuthDeg;
    }
    return nearestLegal(azimuthDeg, limited() ? 0.5 * (minDeg + maxDeg) : azimuthDeg);
  }
}
