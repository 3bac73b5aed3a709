package dev.sequencer.validate;

/**
 * The validator's own rest-to-rest profile of one rate- and acceleration-limited axis (or of the eigenaxis
 * rotation): accelerate at α, coast at ω, brake at α (trapezoid), or accelerate and brake only (triangle)
 * when the angle is too short to reach ω. Written from the kinematics, not from the planner's slew package.
 *
 * <p>Derivation (constant acceleration from rest): reaching ω takes ω/α seconds and covers ω²/(2α) degrees;
 * braking the same. If θ ≥ ω²/α the coast covers θ − ω²/α at ω, so T = 2ω/α + (θ − ω²/α)/ω = θ/ω + ω/α.
 * Otherwise the peak speed is α·T/2 and θ = 2 · ½α(T/2)², so T = 2√(θ/α). Worked case: ω = 1°/s,
 * α = 0.05°/s², θ = 90°: ω²/α = 20° ≤ 90°, T = 90 + 20 = 110 s; θ = 5°: T = 2√100 = 20 s.
 */
record RestToRestProfile(double rateDegPerS, double accelDegPerS2) {
  RestToRestProfile {
    if (!(rateDegPerS > 0) || !(accelDegPerS2 > 0) || Double.isInfinite(rateDegPerS)
        || Double.isInfinite(accelDegPerS2)) {
      throw new IllegalArgumentException("rate and acceleration must be finite and > 0 (were " + rateDegPerS + ", "
          + accelDegPerS2 + ")");
    }
  }

  /** Seconds to turn {@code angleDeg} from rest to rest; 0 for a zero (or negative) angle. */
  double seconds(double angleDeg) {
    if (!(angleDeg > 0)) {
      return 0;
    }
    double w = rateDegPerS;
    double a = accelDegPerS2;
    return angleDeg >= w * w / a ? angleDeg / w + w / a : 2 * Math.sqrt(angleDeg / a);
  }

  /** Degrees covered {@code tS} seconds after the departure of a turn of {@code angleDeg}, in [0, angleDeg]. */
  double angleAt(double tS, double angleDeg) {
    if (!(angleDeg > 0) || tS <= 0) {
      return 0;
    }
    double total = seconds(angleDeg);
    if (tS >= total) {
      return angleDeg;
    }
    double w = rateDegPerS;
    double a = accelDegPerS2;
    double ramp = angleDeg >= w * w / a ? w / a : total / 2;
    if (tS <= ramp) {
      return 0.5 * a * tS * tS;
    }
    if (tS >= total - ramp) {
      double left = total - tS;
      return angleDeg - 0.5 * a * left * left;
    }
    return 0.5 * a * ramp * ramp + w * (tS - ramp);
  }
}
