package dev.sequencer.model;

import java.util.List;

/**
 * The flexible-exposure extension: the planner chooses an exposure in [min, max] on a grid of
 * {@code durationStepS} above the minimum; the value is the linear interpolation of {@code utility}.
 */
public record FlexibleExposure(
    double minDurationS, double maxDurationS, double durationStepS, List<UtilityPoint> utility) {
  /** The default step when the file gives none. */
  public static final double DEFAULT_STEP_S = 60.0;

  public FlexibleExposure {
    Checks.finite("minDurationS", minDurationS);
    Checks.finite("maxDurationS", maxDurationS);
    Checks.finite("durationStepS", durationStepS);
    utility = List.copyOf(utility);
  }

  /** Value collected for an exposure of {@code exposureS}, linear between the curve's points. */
  public double valueAt(double exposureS) {
    if (utility.isEmpty()) {
      return 0.0;
    }
    if (exposureS <= utility.get(0).exposureS()) {
      return utility.get(0).value();
    }
    for (int i = 1; i < utility.size(); i++) {
      UtilityPoint a = utility.get(i - 1);
      UtilityPoint b = utility.get(i);
      if (exposureS <= b.exposureS()) {
        double f = (exposureS - a.exposureS()) / (b.exposureS() - a.exposureS());
        return a.value() + f * (b.value() - a.value());
      }
    }
    return utility.get(utility.size() - 1).value();
  }

  /** The grid exposure nearest {@code exposureS}: min + k·step for the nearest whole k (not clamped to max). */
  public double nearestGridS(double exposureS) {
    return minDurationS + Math.rint((exposureS - minDurationS) / durationStepS) * durationStepS;
  }

  /** True when {@code exposureS} is a grid exposure in [min, max], within {@code toleranceS}. */
  public boolean allows(double exposureS, double toleranceS) {
    return Math.abs(exposureS - nearestGridS(exposureS)) <= toleranceS && exposureS >= minDurationS - toleranceS
        && exposureS <= maxDurationS + toleranceS;
  }

  /** The grid in words, for messages: {@code "600 + k·60 in [600, 1800]"}. */
  public String gridText() {
    return num(minDurationS) + " + k·" + num(durationStepS) + " in [" + num(minDurationS) + ", " + num(maxDurationS)
        + "]";
  }

  private static String num(double v) {
    return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
  }
}
