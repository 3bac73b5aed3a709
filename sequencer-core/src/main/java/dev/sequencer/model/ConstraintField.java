package dev.sequencer.model;

import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.function.Function;

/**
 * The fields of {@link Constraints}, in the scenario format's order, each with its JSON name: one list for
 * the reader, the writer, the per-request merge and the summaries.
 */
public enum ConstraintField {
  SUN_SEPARATION_MIN_DEG("sunSeparationMinDeg", Constraints::sunSeparationMinDeg),
  MOON_SEPARATION_MIN_DEG("moonSeparationMinDeg", Constraints::moonSeparationMinDeg),
  EARTH_LIMB_MIN_DEG("earthLimbMinDeg", Constraints::earthLimbMinDeg),
  ELEVATION_MIN_DEG("elevationMinDeg", Constraints::elevationMinDeg),
  ELEVATION_MAX_DEG("elevationMaxDeg", Constraints::elevationMaxDeg),
  SUN_ELEVATION_MAX_DEG("sunElevationMaxDeg", Constraints::sunElevationMaxDeg),
  TARGET_SUNLIT_REQUIRED("targetSunlitRequired", Constraints::targetSunlitRequired),
  AIRMASS_MAX("airmassMax", Constraints::airmassMax),
  HOUR_ANGLE_MIN_H("hourAngleMinH", Constraints::hourAngleMinH),
  HOUR_ANGLE_MAX_H("hourAngleMaxH", Constraints::hourAngleMaxH),
  MOON_ELEVATION_MAX_DEG("moonElevationMaxDeg", Constraints::moonElevationMaxDeg),
  MOON_ILLUMINATION_MAX("moonIlluminationMax", Constraints::moonIlluminationMax),
  SUN_ELEVATION_MIN_DEG("sunElevationMinDeg", Constraints::sunElevationMinDeg),
  OFF_NADIR_MAX_DEG("offNadirMaxDeg", Constraints::offNadirMaxDeg);

  private final String key;
  private final Function<Constraints, Object> getter;

  ConstraintField(String key, Function<Constraints, Object> getter) {
    this.key = key;
    this.getter = getter;
  }

  /** The field's name in the scenario file, e.g. {@code "airmassMax"}. */
  public String key() {
    return key;
  }

  /** This field's value in {@code c}: a {@link Double}, a {@link Boolean} for the sunlit flag, or null. */
  public Object valueIn(Constraints c) {
    return getter.apply(c);
  }

  /** True for the one boolean field ({@code targetSunlitRequired}); every other field is a number. */
  public boolean isBoolean() {
    return this == TARGET_SUNLIT_REQUIRED;
  }

  /** Every JSON name, in the format's order. */
  public static List<String> keys() {
    return Arrays.stream(values()).map(ConstraintField::key).toList();
  }

  /** The field with this JSON name, if any. */
  public static Optional<ConstraintField> ofKey(String key) {
    return Arrays.stream(values()).filter(f -> f.key.equals(key)).findFirst();
  }
}
