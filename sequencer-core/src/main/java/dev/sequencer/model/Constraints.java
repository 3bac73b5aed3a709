package dev.sequencer.model;

import static dev.sequencer.model.ConstraintField.AIRMASS_MAX;
import static dev.sequencer.model.ConstraintField.EARTH_LIMB_MIN_DEG;
import static dev.sequencer.model.ConstraintField.ELEVATION_MAX_DEG;
import static dev.sequencer.model.ConstraintField.ELEVATION_MIN_DEG;
import static dev.sequencer.model.ConstraintField.HOUR_ANGLE_MAX_H;
import static dev.sequencer.model.ConstraintField.HOUR_ANGLE_MIN_H;
import static dev.sequencer.model.ConstraintField.MOON_ELEVATION_MAX_DEG;
import static dev.sequencer.model.ConstraintField.MOON_ILLUMINATION_MAX;
import static dev.sequencer.model.ConstraintField.MOON_SEPARATION_MIN_DEG;
import static dev.sequencer.model.ConstraintField.OFF_NADIR_MAX_DEG;
import static dev.sequencer.model.ConstraintField.SUN_ELEVATION_MAX_DEG;
import static dev.sequencer.model.ConstraintField.SUN_ELEVATION_MIN_DEG;
import static dev.sequencer.model.ConstraintField.SUN_SEPARATION_MIN_DEG;
import static dev.sequencer.model.ConstraintField.TARGET_SUNLIT_REQUIRED;

/**
 * Observing constraints; every field is optional and an absent ({@code null}) field is no constraint.
 *
 * <p>Angles in degrees, hour angles in hours, airmass and Moon illumination dimensionless. See the
 * scenario format (including its A2 addition) for the exact meaning of each; {@link ConstraintField}
 * lists them with their JSON names.
 */
public record Constraints(
    Double sunSeparationMinDeg,
    Double moonSeparationMinDeg,
    Double earthLimbMinDeg,
    Double elevationMinDeg,
    Double elevationMaxDeg,
    Double sunElevationMaxDeg,
    Boolean targetSunlitRequired,
    Double airmassMax,
    Double hourAngleMinH,
    Double hourAngleMaxH,
    Double moonElevationMaxDeg,
    Double moonIlluminationMax,
    Double sunElevationMinDeg,
    Double offNadirMaxDeg) {
  private static final Constraints NONE = new Builder().build();

  public Constraints {
    Checks.finiteOrNull("sunSeparationMinDeg", sunSeparationMinDeg);
    Checks.finiteOrNull("moonSeparationMinDeg", moonSeparationMinDeg);
    Checks.finiteOrNull("earthLimbMinDeg", earthLimbMinDeg);
    Checks.finiteOrNull("elevationMinDeg", elevationMinDeg);
    Checks.finiteOrNull("elevationMaxDeg", elevationMaxDeg);
    Checks.finiteOrNull("sunElevationMaxDeg", sunElevationMaxDeg);
    Checks.finiteOrNull("airmassMax", airmassMax);
    Checks.finiteOrNull("hourAngleMinH", hourAngleMinH);
    Checks.finiteOrNull("hourAngleMaxH", hourAngleMaxH);
    Checks.finiteOrNull("moonElevationMaxDeg", moonElevationMaxDeg);
    Checks.finiteOrNull("moonIlluminationMax", moonIlluminationMax);
    Checks.finiteOrNull("sunElevationMinDeg", sunElevationMinDeg);
    Checks.finiteOrNull("offNadirMaxDeg", offNadirMaxDeg);
  }

  /** No constraint at all. */
  public static Constraints none() {
    return NONE;
  }

  /** A builder starting from no constraint. */
  public static Builder builder() {
    return new Builder();
  }

  /** True when target sunlight is required (absent means false). */
  public boolean sunlitRequired() {
    return Boolean.TRUE.equals(targetSunlitRequired);
  }

  /**
   * These constraints with one level's own fields applied: each field {@code o} gives replaces this
   * one's, each field it removes becomes absent, the others are kept. Levels chain from the most general
   * to the most specific (scenario, then a resource's, then a request's).
   */
  public Constraints overriddenBy(ConstraintOverrides o) {
    Constraints g = o.given();
    return new Constraints(
        pick(o, SUN_SEPARATION_MIN_DEG, sunSeparationMinDeg, g.sunSeparationMinDeg),
        pick(o, MOON_SEPARATION_MIN_DEG, moonSeparationMinDeg, g.moonSeparationMinDeg),
        pick(o, EARTH_LIMB_MIN_DEG, earthLimbMinDeg, g.earthLimbMinDeg),
        pick(o, ELEVATION_MIN_DEG, elevationMinDeg, g.elevationMinDeg),
        pick(o, ELEVATION_MAX_DEG, elevationMaxDeg, g.elevationMaxDeg),
        pick(o, SUN_ELEVATION_MAX_DEG, sunElevationMaxDeg, g.sunElevationMaxDeg),
        pick(o, TARGET_SUNLIT_REQUIRED, targetSunlitRequired, g.targetSunlitRequired),
        pick(o, AIRMASS_MAX, airmassMax, g.airmassMax),
        pick(o, HOUR_ANGLE_MIN_H, hourAngleMinH, g.hourAngleMinH),
        pick(o, HOUR_ANGLE_MAX_H, hourAngleMaxH, g.hourAngleMaxH),
        pick(o, MOON_ELEVATION_MAX_DEG, moonElevationMaxDeg, g.moonElevationMaxDeg),
        pick(o, MOON_ILLUMINATION_MAX, moonIlluminationMax, g.moonIlluminationMax),
        pick(o, SUN_ELEVATION_MIN_DEG, sunElevationMinDeg, g.sunElevationMinDeg),
        pick(o, OFF_NADIR_MAX_DEG, offNadirMaxDeg, g.offNadirMaxDeg));
  }

  private static <T> T pick(ConstraintOverrides o, ConstraintField f, T inherited, T given) {
    if (given != null) {
      return given;
    }
    return o.removed().contains(f) ? null : inherited;
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
    private Double airmass;
    private Double haMin;
    private Double haMax;
    private Double moonElMax;
    private Double moonIllum;
    private Double sunElMin;
    private Double offNadir;

    private Builder() {}

    public Builder sunSeparationMinDeg(double v) { sunSep = v; return this; }
    public Builder moonSeparationMinDeg(double v) { moonSep = v; return this; }
    public Builder earthLimbMinDeg(double v) { limb = v; return this; }
    public Builder elevationMinDeg(double v) { elMin = v; return this; }
    public Builder elevationMaxDeg(double v) { elMax = v; return this; }
    public Builder sunElevationMaxDeg(double v) { sunElMax = v; return this; }
    public Builder targetSunlitRequired(boolean v) { sunlit = v; return this; }
    public Builder airmassMax(double v) { airmass = v; return this; }
    public Builder hourAngleMinH(double v) { haMin = v; return this; }
    public Builder hourAngleMaxH(double v) { haMax = v; return this; }
    public Builder moonElevationMaxDeg(double v) { moonElMax = v; return this; }
    public Builder moonIlluminationMax(double v) { moonIllum = v; return this; }
    public Builder sunElevationMinDeg(double v) { sunElMin = v; return this; }
    public Builder offNadirMaxDeg(double v) { offNadir = v; return this; }

    public Constraints build() {
      return new Constraints(sunSep, moonSep, limb, elMin, elMax, sunElMax, sunlit, airmass, haMin, haMax,
          moonElMax, moonIllum, sunElMin, offNadir);
    }
  }
}
