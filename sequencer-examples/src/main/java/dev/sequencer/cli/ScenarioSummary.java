package dev.sequencer.cli;

import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Target;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/** Short human-readable descriptions of a scenario's parts, for {@code inspect} and other commands. */
final class ScenarioSummary {
  private ScenarioSummary() {}

  static List<String> lines(Scenario s) {
    List<String> out = new ArrayList<>();
    double horizonS = s.horizon().durationS();
    out.add("name        " + (s.name() == null ? "(none)" : s.name()));
    out.add(String.format(Locale.ROOT, "horizon     %s .. %s (%.2f h)", s.horizon().start(), s.horizon().end(),
        horizonS / 3600));
    if (s.hasResources()) {
      // Several resources (A6): each one's observer, own constraints, slew model and keep-outs during slews.
      for (dev.sequencer.model.Resource r : s.resources()) {
        Scenario view = s.forResource(r);
        long restricted = s.requests().stream().filter(q -> !q.resources().isEmpty() && q.allows(r.id())).count();
        out.add("resource    " + r.id() + ": observer " + observer(view) + "; slew " + slew(view.slew())
            + "; keep-outs " + duringSlews(view) + (r.constraints().equals(dev.sequencer.model.ConstraintOverrides.none())
                ? "" : "; constraints " + constraints(view.constraints()))
            + (restricted > 0 ? "; " + restricted + " request(s) restricted to a list naming it" : ""));
      }
      out.add("constraints " + constraints(s.constraints()));
      out.addAll(ownConstraints(s, 10));
    } else {
      out.add("observer    " + observer(s));
      out.add("constraints " + constraints(s.constraints()));
      out.addAll(ownConstraints(s, 10));
      out.add("slew        " + slew(s.slew()));
      out.add("keep-outs   " + duringSlews(s));
    }
    Map<String, Integer> kinds = new LinkedHashMap<>();
    double requested = 0;
    int required = 0;
    int flexible = 0;
    for (Request r : s.requests()) {
      kinds.merge(kind(r.target()), 1, Integer::sum);
      requested += r.minDurationS() * r.visits().count();
      required += r.required() ? 1 : 0;
      flexible += r.isFlexible() ? 1 : 0;
    }
    out.add("requests    " + s.requests().size() + " " + kinds + (required > 0 ? ", " + required + " required" : "")
        + (flexible > 0 ? ", " + flexible + " flexible" : ""));
    out.addAll(structure(s));
    int m = Math.max(1, s.resources().size());
    out.add(String.format(Locale.ROOT, "requested   %.0f s of observation (minimum) for a %.0f s horizon%s: %.0f%%",
        requested, horizonS, m > 1 ? " on each of " + m + " resources" : "", 100 * requested / (m * horizonS)));
    return out;
  }

  /**
   * The rules on top of the requests (format additions A4, A5): visits (how many, all or nothing, one per
   * window, the separations), each group (at most 10: its rules and members), configurations (labels in use,
   * the change times, the start set-up). Empty when the scenario has none.
   */
  static List<String> structure(Scenario s) {
    List<String> out = new ArrayList<>();
    List<Request> repeated = s.requests().stream().filter(Request::hasVisits).toList();
    if (!repeated.isEmpty()) {
      int visits = repeated.stream().mapToInt(r -> r.visits().count()).sum();
      long aon = repeated.stream().filter(r -> r.visits().allOrNothing()).count();
      long perWindow = repeated.stream().filter(r -> r.visits().onePerWindow()).count();
      double minSep = repeated.stream().mapToDouble(r -> r.visits().minSeparationS()).min().orElse(0);
      boolean anyMax = repeated.stream().anyMatch(r -> r.visits().maxSeparationS() != null);
      double maxSep = repeated.stream().filter(r -> r.visits().maxSeparationS() != null)
          .mapToDouble(r -> r.visits().maxSeparationS()).max().orElse(0);
      out.add(String.format(Locale.ROOT, "visits      %d request(s) with %d visits in all%s%s; separations from %.0f s%s",
          repeated.size(), visits, aon > 0 ? ", " + aon + " all or nothing" : "",
          perWindow > 0 ? ", " + perWindow + " one per window" : "", minSep,
          anyMax ? String.format(Locale.ROOT, ", at most %.0f s", maxSep) : ", no maximum"));
    }
    int shown = 0;
    for (dev.sequencer.model.Group g : s.groups()) {
      if (shown++ == 10) {
        out.add("group       ... and " + (s.groups().size() - 10) + " more");
        break;
      }
      List<String> rules = new ArrayList<>();
      if (g.ordered()) {
        rules.add("ordered");
      }
      if (g.allOrNothing()) {
        rules.add("all or nothing");
      }
      if (g.maxGapS() != null) {
        rules.add(String.format(Locale.ROOT, "gap <= %.0f s", g.maxGapS()));
      }
      if (g.sameResource()) {
        rules.add("same resource");
      }
      out.add("group       " + g.id() + ": " + (rules.isEmpty() ? "no rule" : String.join(", ", rules)) + ": "
          + String.join(g.ordered() ? " -> " : ", ", g.members()));
    }
    Map<String, Integer> labels = new java.util.TreeMap<>();
    s.requests().forEach(r -> labels.merge(r.configuration().isEmpty() ? "(none)" : r.configuration(), 1,
        Integer::sum));
    dev.sequencer.model.Reconfiguration rc = s.reconfiguration();
    if (labels.size() > 1 || !labels.containsKey("(none)") || rc != null) {
      String change = rc == null ? "no change time" : (rc.labels().isEmpty()
          ? String.format(Locale.ROOT, "change %.0f s", rc.constantS())
          : "change times for " + rc.labels().size() + " labels (matrix)")
          + (rc.concurrentWithSlew() ? ", concurrent with the slew" : ", added to the slew");
      out.add("configs     " + labels + "; " + change + "; start \"" + s.startConfiguration() + "\"");
    }
    return out;
  }

  /** Seconds of observation requested (each request's shortest exposure, once per visit). */
  static double requestedS(Scenario s) {
    return s.requests().stream().mapToDouble(r -> r.minDurationS() * r.visits().count()).sum();
  }

  /**
   * The requested time against the time the constraints leave: the seconds in which at least one request
   * is observable (the union of all windows; at a ground site, darkness and elevation included).
   */
  static String requestedAgainstObservable(Scenario s, List<RequestWindows> windows) {
    List<TimeWindow> all = new ArrayList<>();
    windows.forEach(w -> all.addAll(w.intervals()));
    all.sort((a, b) -> a.start().compareTo(b.start()));
    double union = 0;
    java.time.Instant end = null;
    for (TimeWindow w : all) {
      java.time.Instant from = end == null || w.start().isAfter(end) ? w.start() : end;
      if (w.end().isAfter(from)) {
        union += java.time.Duration.between(from, w.end()).toNanos() * 1e-9;
      }
      end = end == null || w.end().isAfter(end) ? w.end() : end;
    }
    double requested = requestedS(s);
    return union <= 0 ? String.format(Locale.ROOT, "observable  no request is ever observable (%.0f s requested)",
        requested) : String.format(Locale.ROOT, "observable  %.0f s in which some request is observable (the "
        + "constraints' time, e.g. darkness); requested %.0f s: %.0f%% of it", union, requested, 100 * requested / union);
  }

  /**
   * Which keep-outs hold during slews (spec A3): the Sun's for every observer and, from orbit, the Earth
   * limb's, for slews that follow a path (eigenaxis, alt-az); said plainly when off or when nothing applies.
   */
  static String duringSlews(Scenario s) {
    boolean path = s.slew() instanceof SlewSettings.Eigenaxis || s.slew() instanceof SlewSettings.AltAz;
    if (!path) {
      return "during slews: none (a " + s.slew().model() + " slew has no path; the constraints hold during "
          + "observations)";
    }
    if (!s.slew().keepOutDuringSlew()) {
      return "during slews: off (\"keepOutDuringSlew\": false): a slew may pass through the Sun's keep-out";
    }
    List<String> on = new ArrayList<>();
    dev.sequencer.model.Constraints c = s.constraints();
    if (s.observer() != null && c != null && c.sunSeparationMinDeg() != null) {
      on.add("Sun >= " + num(c.sunSeparationMinDeg()) + " deg");
    }
    if (s.observer() instanceof dev.sequencer.model.OrbitObserver && c != null && c.earthLimbMinDeg() != null
        && s.slew() instanceof SlewSettings.Eigenaxis) {
      on.add("Earth limb >= " + num(c.earthLimbMinDeg()) + " deg");
    }
    return on.isEmpty() ? "during slews: on, but the scenario sets no Sun separation"
        + (s.observer() instanceof dev.sequencer.model.OrbitObserver ? " or Earth limb" : "") + " to keep"
        : "during slews: " + String.join(", ", on) + " along every slew path (detours where needed)";
  }

  /** The slew model in the file's own terms. */
  static String slew(SlewSettings slew) {
    if (slew instanceof SlewSettings.Eigenaxis e) {
      return String.format(Locale.ROOT, "eigenaxis, rate %s deg/s, acceleration %s deg/s², settle %s s",
          num(e.rateDegPerS()), num(e.accelDegPerS2()), num(e.settleS()));
    } else if (slew instanceof SlewSettings.AltAz a) {
      return String.format(Locale.ROOT, "altaz, azimuth %s deg/s (%s deg/s²), elevation %s deg/s (%s deg/s²), "
          + "settle %s s, %s", num(a.azimuthRateDegPerS()), num(a.azimuthAccelDegPerS2()),
          num(a.elevationRateDegPerS()), num(a.elevationAccelDegPerS2()), num(a.settleS()),
          a.azimuthRangeDeg() == null ? "azimuth unlimited"
              : "azimuth range [" + num(a.azimuthRangeDeg().get(0)) + ", " + num(a.azimuthRangeDeg().get(1)) + "] deg");
    } else if (slew instanceof SlewSettings.Fixed f) {
      return "fixed, " + num(f.seconds()) + " s between any two requests";
    } else if (slew instanceof SlewSettings.Matrix m) {
      return "matrix, " + m.seconds().size() + " x " + m.seconds().size() + " table"
          + (m.fromStartSeconds() == null ? "" : " with a row from the start state");
    }
    return slew.model();
  }

  private static String num(double v) {
    return v == Math.rint(v) && Math.abs(v) < 1e15 ? String.format(Locale.ROOT, "%.0f", v)
        : String.format(Locale.ROOT, "%s", v);
  }

  static String kind(Target t) {
    if (t == null) {
      return "no target";
    } else if (t instanceof RaDec) {
      return "fixed RA/Dec";
    } else if (t instanceof OrbitingTarget) {
      return "orbiting (TLE)";
    } else if (t instanceof EarthPoint) {
      return "Earth point";
    }
    return t.getClass().getSimpleName();
  }

  static String observer(Scenario s) {
    if (s.observer() == null) {
      return "none (windows given by each request)";
    }
    if (s.observer() instanceof GroundSite g) {
      return String.format(Locale.ROOT, "ground site lat %.4f lon %.4f alt %.0f m, horizon mask of %d points",
          g.latitudeDeg(), g.longitudeDeg(), g.altitudeM(), g.horizonMask().size());
    }
    OrbitObserver o = (OrbitObserver) s.observer();
    if (o.orbit() instanceof KeplerianElements k) {
      return String.format(Locale.ROOT, "orbit, Keplerian a = %.1f km, e = %.4f, i = %.2f deg",
          k.semiMajorAxisKm(), k.eccentricity(), k.inclinationDeg());
    }
    return "orbit, TLE";
  }

  static String constraints(Constraints c) {
    List<String> parts = new ArrayList<>();
    for (ConstraintField f : ConstraintField.values()) {
      Object v = f.valueIn(c);
      if (v != null && !Boolean.FALSE.equals(v)) {
        parts.add(describe(f, v));
      }
    }
    return parts.isEmpty() ? "none" : String.join(", ", parts);
  }

  /** A request's own constraints: each field it gives, and each one it removes. */
  static String constraints(ConstraintOverrides own) {
    List<String> parts = new ArrayList<>();
    for (ConstraintField f : ConstraintField.values()) {
      Object v = f.valueIn(own.given());
      if (v != null) {
        parts.add(describe(f, v));
      } else if (own.removed().contains(f)) {
        parts.add(f.key() + " removed");
      }
    }
    return String.join(", ", parts);
  }

  /** One constraint in words, e.g. "airmass <= 1.50". */
  static String describe(ConstraintField f, Object v) {
    if (v instanceof Boolean b) {
      return b ? "target sunlit" : "target sunlit not required";
    }
    double x = (Double) v;
    return switch (f) {
      case SUN_SEPARATION_MIN_DEG -> deg("Sun >= ", x);
      case MOON_SEPARATION_MIN_DEG -> deg("Moon >= ", x);
      case EARTH_LIMB_MIN_DEG -> deg("limb >= ", x);
      case ELEVATION_MIN_DEG -> deg("elevation >= ", x);
      case ELEVATION_MAX_DEG -> deg("elevation <= ", x);
      case SUN_ELEVATION_MAX_DEG -> deg("Sun elevation <= ", x);
      case AIRMASS_MAX -> String.format(Locale.ROOT, "airmass <= %.2f", x);
      case HOUR_ANGLE_MIN_H -> String.format(Locale.ROOT, "hour angle >= %.2f h", x);
      case HOUR_ANGLE_MAX_H -> String.format(Locale.ROOT, "hour angle <= %.2f h", x);
      case MOON_ELEVATION_MAX_DEG -> deg("Moon elevation <= ", x);
      case MOON_ILLUMINATION_MAX -> String.format(Locale.ROOT, "Moon illumination <= %.2f or Moon down", x);
      case SUN_ELEVATION_MIN_DEG -> deg("Sun elevation >= ", x);
      case OFF_NADIR_MAX_DEG -> deg("off-nadir <= ", x);
      case TARGET_SUNLIT_REQUIRED -> throw new IllegalStateException("boolean field " + f);
    };
  }

  private static String deg(String label, double v) {
    return String.format(Locale.ROOT, "%s%.1f deg", label, v);
  }

  /** One line per request with constraints of its own (at most {@code max}, then a count of the rest). */
  static List<String> ownConstraints(Scenario s, int max) {
    List<Request> own = s.requests().stream().filter(r -> !r.constraints().isEmpty()).toList();
    List<String> out = new ArrayList<>();
    for (int i = 0; i < Math.min(max, own.size()); i++) {
      out.add((i == 0 ? "own rules   " : "            ") + own.get(i).id() + ": " + constraints(own.get(i).constraints()));
    }
    if (own.size() > max) {
      out.add("            ... and " + (own.size() - max) + " more requests with constraints of their own");
    }
    return out;
  }

  /**
   * Constraint fields of the A2 addition that no request of this scenario can use (the format says what
   * each applies to), one line each: they are accepted but change nothing.
   */
  static List<String> unusedConstraints(Scenario s) {
    boolean ground = s.observer() instanceof GroundSite;
    boolean orbit = s.observer() instanceof OrbitObserver;
    boolean earthPoints = s.requests().stream().anyMatch(r -> r.target() instanceof EarthPoint);
    boolean stars = s.requests().stream().anyMatch(r -> r.target() instanceof RaDec);
    List<String> out = new ArrayList<>();
    for (ConstraintField f : List.of(ConstraintField.AIRMASS_MAX, ConstraintField.HOUR_ANGLE_MIN_H,
        ConstraintField.HOUR_ANGLE_MAX_H, ConstraintField.MOON_ELEVATION_MAX_DEG, ConstraintField.MOON_ILLUMINATION_MAX,
        ConstraintField.SUN_ELEVATION_MIN_DEG, ConstraintField.OFF_NADIR_MAX_DEG)) {
      boolean given = f.valueIn(s.constraints()) != null
          || s.requests().stream().anyMatch(r -> f.valueIn(r.constraints().given()) != null);
      if (!given) {
        continue;
      }
      String appliesTo = switch (f) {
        case HOUR_ANGLE_MIN_H, HOUR_ANGLE_MAX_H -> ground && stars ? null : "ground observers, fixed RA/Dec targets";
        case SUN_ELEVATION_MIN_DEG -> ground || (orbit && earthPoints) ? null
            : "ground observers and Earth points seen from orbit";
        case OFF_NADIR_MAX_DEG -> orbit && earthPoints ? null : "Earth points seen from orbit";
        default -> ground ? null : "ground observers";
      };
      if (appliesTo != null) {
        out.add(f.key() + " applies to " + appliesTo + " only; it changes nothing in this scenario");
      }
    }
    return out;
  }
}
