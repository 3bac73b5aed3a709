package dev.sequencer.model;

/**
 * Observing constraints; every field is optional and an absent ({@code null}) field is no constraint.
 *
 * <p>Angles in degrees. See the scenario format for the exact meaning of each.
 */
public record Constraints(
    Double sunSeparationMinDeg,
    Double moonSeparationMinDeg,
    Double earthLimbMinDeg,
    Double elevationMinDeg,
    Double elevationMaxDeg,
    Double sunElevationMaxDeg,
    Boolean targetSunlitRequired) {
  public Constraints {
    Checks.finiteOrNull("sunSeparationMinDeg", sunSeparationMinDeg);
    Checks.finiteOrNull("moonSeparationMinDeg", moonSeparationMinDeg);
    Checks.finiteOrNull("earthLimbMinDeg", earthLimbMinDeg);
    Checks.finiteOrNull("elevationMinDeg", elevationMinDeg);
    Checks.finiteOrNull("elevationMaxDeg", elevationMaxDeg);
    Checks.finiteOrNull("sunElevationMaxDeg", sunElevationMaxDeg);
  }

  /** No constraint at all. */
  public static Constraints none() {
    return new Constraints(null, null, null, null, null, null, null);
  }

  /** A builder starting from no constraint. */
  public static Builder builder() {
    return new Builder();
  }

  /** True when target sunlight is required (absent means false). */
  public boolean sunlitRequired() {
    return Boolean.TRUE.equals(targetSunlitRequired);
  }

  /** Builder for {@link Constraints}; unset fields stay absent. */
  public static final class Builder {
    private Double sunSep;
    private Double moonSep;
    private Double limb;
    private Double elMin;
    private Double elMax;
    private Double sunElMax;
    private Boolean sunlit;

    private Builder() {}

    public Builder sunSeparationMinDeg(double v) { sunSep = v; return this; }
    public Builder moonSeparationMinDeg(double v) { moonSep = v; return this; }
    public Builder earthLimbMinDeg(double v) { limb = v; return this; }
    public Builder elevationMinDeg(double v) { elMin = v; return this; }
    public Builder elevationMaxDeg(double v) { elMax = v; return this; }
    public Builder sunElevationMaxDeg(double v) { sunElMax = v; return this; }
    public Builder targetSunlitRequired(boolean v) { sunlit = v; return this; }

    public Constraints build() {
      return new Constraints(sunSep, moonSep, limb, elMin, elMax, sunElMax, sunlit);
    }
  }
}
