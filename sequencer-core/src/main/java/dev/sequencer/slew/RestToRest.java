package dev.sequencer.slew;

/**
 * Rest-to-rest time over an angle for one rate- and acceleration-limited axis: bang-coast-bang, or
 * bang-bang when the angle is shorter than the two ramps.
 *
 * <p>Accelerating to {@code rateDegPerS} and braking back takes 2·ω/α seconds and covers ω²/α degrees.
 * Longer angles cruise the rest at ω: T = θ/ω + ω/α. Shorter angles never reach ω: T = 2·√(θ/α). Both
 * branches give 2·ω/α at θ = ω²/α, so T is continuous, non-decreasing and concave with T(0) = 0, hence
 * subadditive.
 */
record RestToRest(double rateDegPerS, double accelDegPerS2) {
  RestToRest {
    if (!(rateDegPerS > 0) || Double.isInfinite(rateDegPerS)) {
      throw new IllegalArgumentException("rateDegPerS: must be a finite number > 0 (was " + rateDegPerS + ")");
    }
    if (!(accelDegPerS2 > 0) || Double.isInfinite(accelDegPerS2)) {
      throw new IllegalArgumentException("accelDegPerS2: must be a finite number > 0 (was " + accelDegPerS2 + ")");
    }
  }

  /** Seconds to move {@code angleDeg} (>= 0) from rest to rest; 0 for 0, infinite for infinite. */
  double seconds(double angleDeg) {
    if (angleDeg <= 0) {
      return 0;
    }
    double rampsDeg = rateDegPerS * rateDegPerS / accelDegPerS2;
    if (angleDeg >= rampsDeg) {
      return angleDeg / rateDegPerS + rateDegPerS / accelDegPerS2;
    }
    return 2 * Math.sqrt(angleDeg / accelDegPerS2);
  }

  /** Angle covered {@code tS} seconds into a rest-to-rest move of {@code angleDeg} (clamped to [0, angle]). */
  double angleAt(double angleDeg, double tS) {
    double total = seconds(angleDeg);
    if (tS <= 0 || total == 0) {
      return 0;
    }
    if (tS >= total) {
      return angleDeg;
    }
    double rampS = Math.min(rateDegPerS / accelDegPerS2, total / 2);
    if (tS <= rampS) {
      return 0.5 * accelDegPerS2 * tS * tS;
    }
    if (tS >= total - rampS) {
      double left = total - tS;
      return angleDeg - 0.5 * accelDegPerS2 * left * left;
    }
    return 0.5 * accelDegPerS2 * rampS * rampS + rateDegPerS * (tS - rampS);
  }
}
