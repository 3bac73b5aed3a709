package dev.sequencer.cli;

import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
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
    out.add("observer    " + observer(s));
    out.add("constraints " + constraints(s.constraints()));
    out.add("slew        " + s.slew());
    Map<String, Integer> kinds = new LinkedHashMap<>();
    double requested = 0;
    int required = 0;
    int flexible = 0;
    for (Request r : s.requests()) {
      kinds.merge(kind(r.target()), 1, Integer::sum);
      requested += r.isFlexible() ? r.flexible().minDurationS() : r.durationS();
      required += r.required() ? 1 : 0;
      flexible += r.isFlexible() ? 1 : 0;
    }
    out.add("requests    " + s.requests().size() + " " + kinds + (required > 0 ? ", " + required + " required" : "")
        + (flexible > 0 ? ", " + flexible + " flexible" : ""));
    out.add(String.format(Locale.ROOT, "requested   %.0f s of observation (minimum) for a %.0f s horizon: %.0f%%",
        requested, horizonS, 100 * requested / horizonS));
    return out;
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
    add(parts, "Sun >= ", c.sunSeparationMinDeg());
    add(parts, "Moon >= ", c.moonSeparationMinDeg());
    add(parts, "limb >= ", c.earthLimbMinDeg());
    add(parts, "elevation >= ", c.elevationMinDeg());
    add(parts, "elevation <= ", c.elevationMaxDeg());
    add(parts, "Sun elevation <= ", c.sunElevationMaxDeg());
    if (c.sunlitRequired()) {
      parts.add("target sunlit");
    }
    return parts.isEmpty() ? "none" : String.join(", ", parts);
  }

  private static void add(List<String> parts, String label, Double v) {
    if (v != null) {
      parts.add(String.format(Locale.ROOT, "%s%.1f deg", label, v));
    }
  }
}
