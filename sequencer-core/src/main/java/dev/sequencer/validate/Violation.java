package dev.sequencer.validate;

import java.time.Instant;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * One thing wrong with a plan: its {@link Kind}, the request it concerns ({@code null} for the plan's
 * totals), the instant where it was found ({@code null} when it has none), the value found and the limit it
 * broke, in the kind's {@link Kind#unit() unit} ({@code NaN} when the kind has no number), and the same in
 * words for people.
 */
public record Violation(Kind kind, String requestId, Instant instant, double value, double limit, String message) {
  public Violation {
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(message, "message");
  }

  /** What kind of rule a plan broke. */
  public enum Kind {
    /** An observation or unscheduled entry names no request of the scenario. */
    UNKNOWN_REQUEST(""),
    /** A request is not listed exactly once in observations and unscheduled (value: times listed). */
    NOT_LISTED_ONCE("times"),
    /** A required request is not observed. */
    REQUIRED_MISSING(""),
    /** An observation reaches outside the horizon (value: seconds outside). */
    OUTSIDE_HORIZON("s"),
    /** An observation lies inside none of the request's own windows. */
    OUTSIDE_REQUEST_WINDOW(""),
    /** A fixed request's observation lasts another time than its durationS (value and limit: seconds). */
    DURATION("s"),
    /** A flexible observation's exposure is not min + k x step within [min, max] (value: seconds). */
    EXPOSURE_GRID("s"),
    /** A flexible observation's value is missing or differs from the utility curve's. */
    EXPOSURE_VALUE(""),
    /** An observation starts before the previous one ends (value: seconds of overlap). */
    OVERLAP("s"),
    /** The gap before an observation is shorter than its slew (value: gap, limit: slew seconds). */
    GAP_TOO_SHORT("s"),
    /** The observation's slewSeconds differs from the slew time (value: written, limit: computed). */
    SLEW_SECONDS("s"),
    /** No slew of the model reaches the observation (elevation outside the mount's range, no legal azimuth branch). */
    SLEW_IMPOSSIBLE("deg"),
    /** The alt-az mount's unwrapped azimuth left azimuthRangeDeg while tracking (value: azimuth, limit: range end). */
    CABLE_WRAP("deg"),
    /** slewStart is before the previous observation's end or too late for the slew to finish (value: seconds). */
    SLEW_START("s"),
    /** slewVia given for a model other than eigenaxis. */
    SLEW_VIA(""),
    /** A re-planned timeline: a done or running observation after now, or a planned one before it (value: seconds). */
    REPLAN_NOW("s"),
    /** objective.priority differs from the sum over observations. */
    TOTAL_PRIORITY(""),
    /** objective.slewSeconds differs from the sum over observations (seconds). */
    TOTAL_SLEW_SECONDS("s"),
    /** Target elevation below elevationMinDeg (or 0 deg); for an Earth point, the spacecraft's elevation there. */
    ELEVATION_MIN("deg"),
    /** Target elevation below the site's horizon mask at its azimuth (the mask is higher than elevationMinDeg there). */
    HORIZON_MASK("deg"),
    /** Target elevation above elevationMaxDeg. */
    ELEVATION_MAX("deg"),
    /** Airmass above airmassMax (or the target at or below the horizon). */
    AIRMASS(""),
    /** Local hour angle outside [hourAngleMinH, hourAngleMaxH]. */
    HOUR_ANGLE("h"),
    /** Line of sight closer to the Sun than sunSeparationMinDeg during an observation. */
    SUN_SEPARATION("deg"),
    /** Line of sight closer to the Moon than moonSeparationMinDeg. */
    MOON_SEPARATION("deg"),
    /** The Moon higher than moonElevationMaxDeg. */
    MOON_ELEVATION("deg"),
    /** The Moon up and more illuminated than moonIlluminationMax. */
    MOON_ILLUMINATION(""),
    /** The Sun higher than sunElevationMaxDeg (darkness, twilight). */
    SUN_ELEVATION_MAX("deg"),
    /** The Sun lower than sunElevationMinDeg (daylight). */
    SUN_ELEVATION_MIN("deg"),
    /** Line of sight closer to the Earth's limb than earthLimbMinDeg during an observation. */
    EARTH_LIMB("deg"),
    /** Line of sight farther from nadir than offNadirMaxDeg. */
    OFF_NADIR("deg"),
    /** An orbiting target in the Earth's umbra when targetSunlitRequired (value: degrees inside). */
    TARGET_SUNLIT("deg"),
    /** Keep-outs during slews (A3): the slew's path comes closer to the Sun than sunSeparationMinDeg. */
    SLEW_SUN_SEPARATION("deg"),
    /** Keep-outs during slews (A3): the slew's path comes closer to the Earth's limb than earthLimbMinDeg. */
    SLEW_EARTH_LIMB("deg"),
    /** Visits (A4): more observations than visits.count, a missing or wrong visit number, or visits of a request observed once. */
    VISIT_COUNT(""),
    /** Visits (A4): a visit starts too soon or too late after the previous visit's start (value and limit: seconds). */
    VISIT_SEPARATION("s"),
    /** Visits (A4): two visits in one visibility window when onePerWindow. */
    VISIT_SAME_WINDOW(""),
    /** Visits (A4): some but not all visits of an all-or-nothing request, or of a required one (value: visits held). */
    VISITS_INCOMPLETE(""),
    /** Visits (A4): a request with visits missing is not listed as unscheduled with the right visitsMissing. */
    VISITS_MISSING_LISTED(""),
    /** Groups (A5): an all-or-nothing group with some members (or visits) scheduled and some not. */
    GROUP_INCOMPLETE(""),
    /** Groups (A5): an ordered group's member starts before the previous scheduled member ends (value: seconds early). */
    GROUP_ORDER("s"),
    /** Groups (A5): an ordered group's member starts more than maxGapS after the previous member's end (value, limit: s). */
    GROUP_GAP("s"),
    /** Groups (A5, A6): a sameResource group's members are observed on more than one resource. */
    GROUP_RESOURCE(""),
    /** Resources (A6): an observation names no resource although the scenario has resources. */
    RESOURCE_MISSING(""),
    /** Resources (A6): an observation names a resource the scenario does not have (or any, with one observer). */
    RESOURCE_UNKNOWN(""),
    /** Resources (A6): an observation is made by a resource its request's {@code resources} does not list. */
    RESOURCE_NOT_ALLOWED(""),
    /** Resources (A6): an observation is listed after one that starts later (value: seconds earlier). */
    TIME_ORDER("s");

    private final String unit;

    Kind(String unit) {
      this.unit = unit;
    }

    /** The unit of {@link Violation#value()} and {@link Violation#limit()}; empty when dimensionless or none. */
    public String unit() {
      return unit;
    }
  }

  /** The same violation found on resource {@code resourceId} (A6): its message names the resource first. */
  Violation onResource(String resourceId) {
    return new Violation(kind, requestId, instant, value, limit, "resource " + resourceId + ": " + message);
  }

  /** A violation with no numbers. */
  static Violation of(Kind kind, String requestId, Instant instant, String message) {
    return new Violation(kind, requestId, instant, Double.NaN, Double.NaN, message);
  }

  /** A violation with a value and its limit; the message is {@code text} followed by both. */
  static Violation of(Kind kind, String requestId, Instant instant, double value, double limit, String text) {
    String u = kind.unit().isEmpty() ? "" : " " + kind.unit();
    return new Violation(kind, requestId, instant, value, limit,
        String.format(Locale.ROOT, "%s (%s%s, limit %s%s)", text, num(value), u, num(limit), u));
  }

  private static String num(double v) {
    if (Double.isNaN(v) || Double.isInfinite(v)) {
      return Double.toString(v);
    }
    return String.format(Locale.ROOT, Math.abs(v) >= 1000 ? "%.3f" : "%.6g", v);
  }

  /** The violations in words, one sentence each (what the CLI prints). */
  public static List<String> words(List<Violation> violations) {
    return violations.stream().map(Violation::message).toList();
  }
}
