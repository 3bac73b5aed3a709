package dev.sequencer.model;

/** One point of a flexible request's value curve: exposure seconds and the value collected. */
public record UtilityPoint(double exposureS, double value) {
  public UtilityPoint {
    Checks.finite("exposureS", exposureS);
    Checks.finite("value", value);
  }
}
