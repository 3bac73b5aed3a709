package dev.sequencer.io;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.Observer;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.Pointing;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Group;
import dev.sequencer.model.Reconfiguration;
import dev.sequencer.model.Request;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Visits;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.SolverSettings;
import dev.sequencer.model.Target;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Tle;
import java.nio.file.Path;
import java.util.List;

/**
 * Writes a scenario as format-1 JSON in the spec's field order, so that {@link ScenarioReader} gives an
 * equal scenario back. Absent parts ({@code null} name, observer, start pointing, solver; no
 * constraints; no windows; {@code required} false; no constraints of a request's own) are omitted. With
 * resources (A6) it writes {@code resources} instead of the top-level {@code slew}, and each request's
 * allowed {@code resources}. It does not validate.
 */
public final class ScenarioWriter {
  private ScenarioWriter() {}

  /** The scenario as pretty, byte-stable JSON text ending in a newline. */
  public static String toJson(Scenario s) {
    ObjectNode o = JsonOut.NODES.objectNode();
    o.put("format", s.format());
    if (s.name() != null) {
      o.put("name", s.name());
    }
    o.set("horizon", window(s.horizon()));
    if (s.observer() != null) {
      o.set("observer", observer(s.observer()));
    }
    if (!s.constraints().equals(Constraints.none())) {
      o.set("constraints", constraints(s.constraints()));
    }
    if (s.hasResources()) {
      ArrayNode resources = o.putArray("resources");
      s.resources().forEach(r -> resources.add(resource(r)));
    } else {
      o.set("slew", slew(s.slew()));
    }
    if (s.startPointing() != null) {
      o.set("startPointing", pointing(s.startPointing()));
    }
    ArrayNode requests = o.putArray("requests");
    s.requests().forEach(r -> requests.add(request(r)));
    if (s.solver() != null) {
      o.set("solver", solver(s.solver()));
    }
    structure(s, o);
    return JsonOut.pretty(o);
  }

  /** Writes the scenario to {@code file} atomically (temporary file, then move). */
  public static void write(Scenario s, Path file) {
    AtomicFiles.writeUtf8(file, toJson(s));
  }

  private static ObjectNode window(TimeWindow w) {
    ObjectNode o = JsonOut.NODES.objectNode();
    o.put("start", JsonOut.instant(w.start()));
    o.put("end", JsonOut.instant(w.end()));
    return o;
  }

  private static ObjectNode observer(Observer observer) {
    ObjectNode o = JsonOut.NODES.objectNode();
    if (observer instanceof GroundSite g) {
      ObjectNode gn = o.putObject("ground");
      gn.set("latitudeDeg", JsonOut.number(g.latitudeDeg()));
      gn.set("longitudeDeg", JsonOut.number(g.longitudeDeg()));
      gn.set("altitudeM", JsonOut.number(g.altitudeM()));
      if (!g.horizonMask().isEmpty()) {
        ArrayNode mask = gn.putArray("horizonMask");
        g.horizonMask().forEach(p -> mask.add(JsonOut.numbers(List.of(p.azimuthDeg(), p.elevationDeg()))));
      }
      if (g.refraction() != null) {
        ObjectNode rn = gn.putObject("refraction");
        rn.set("pressureHPa", JsonOut.number(g.refraction().pressureHPa()));
        rn.set("temperatureC", JsonOut.number(g.refraction().temperatureC()));
      }
    } else if (observer instanceof OrbitObserver orbit) {
      ObjectNode on = o.putObject("orbit");
      if (orbit.orbit() instanceof Tle tle) {
        on.set("tle", tle(tle));
      } else if (orbit.orbit() instanceof KeplerianElements k) {
        ObjectNode kn = on.putObject("keplerian");
        kn.put("epoch", JsonOut.instant(k.epoch()));
        kn.set("semiMajorAxisKm", JsonOut.number(k.semiMajorAxisKm()));
        kn.set("eccentricity", JsonOut.number(k.eccentricity()));
        kn.set("inclinationDeg", JsonOut.number(k.inclinationDeg()));
        kn.set("raanDeg", JsonOut.number(k.raanDeg()));
        kn.set("argumentOfPerigeeDeg", JsonOut.number(k.argumentOfPerigeeDeg()));
        kn.set("meanAnomalyDeg", JsonOut.number(k.meanAnomalyDeg()));
      }
    }
    return o;
  }

  private static ArrayNode tle(Tle tle) {
    ArrayNode a = JsonOut.NODES.arrayNode();
    a.add(tle.line1());
    a.add(tle.line2());
    return a;
  }

  private static ObjectNode constraints(Constraints c) {
    ObjectNode o = JsonOut.NODES.objectNode();
    for (ConstraintField f : ConstraintField.values()) {
      put(o, f, f.valueIn(c));
    }
    return o;
  }

  /** A resource's or a request's own constraints: the fields it gives, and each field it removes as {@code null}. */
  private static ObjectNode constraints(ConstraintOverrides own) {
    ObjectNode o = JsonOut.NODES.objectNode();
    for (ConstraintField f : ConstraintField.values()) {
      if (own.removed().contains(f)) {
        o.putNull(f.key());
      } else {
        put(o, f, f.valueIn(own.given()));
      }
    }
    return o;
  }

  private static void put(ObjectNode o, ConstraintField f, Object v) {
    if (v instanceof Boolean b) {
      o.put(f.key(), b);
    } else if (v instanceof Double d) {
      o.set(f.key(), JsonOut.number(d));
    }
  }

  private static ObjectNode slew(SlewSettings slew) {
    ObjectNode o = JsonOut.NODES.objectNode();
    o.put("model", slew.model());
    if (slew instanceof SlewSettings.Eigenaxis e) {
      o.set("rateDegPerS", JsonOut.number(e.rateDegPerS()));
      o.set("accelDegPerS2", JsonOut.number(e.accelDegPerS2()));
      o.set("settleS", JsonOut.number(e.settleS()));
      if (!e.keepOutDuringSlew()) {
        o.put("keepOutDuringSlew", false);
      }
    } else if (slew instanceof SlewSettings.AltAz a) {
      o.set("azimuthRateDegPerS", JsonOut.number(a.azimuthRateDegPerS()));
      o.set("elevationRateDegPerS", JsonOut.number(a.elevationRateDegPerS()));
      o.set("azimuthAccelDegPerS2", JsonOut.number(a.azimuthAccelDegPerS2()));
      o.set("elevationAccelDegPerS2", JsonOut.number(a.elevationAccelDegPerS2()));
      o.set("settleS", JsonOut.number(a.settleS()));
      if (a.azimuthRangeDeg() != null) {
        o.set("azimuthRangeDeg", JsonOut.numbers(a.azimuthRangeDeg()));
      }
      if (!a.keepOutDuringSlew()) {
        o.put("keepOutDuringSlew", false);
      }
    } else if (slew instanceof SlewSettings.Fixed f) {
      o.set("seconds", JsonOut.number(f.seconds()));
    } else if (slew instanceof SlewSettings.Matrix m) {
      ArrayNode rows = o.putArray("seconds");
      m.seconds().forEach(row -> rows.add(JsonOut.numbers(row)));
      if (m.fromStartSeconds() != null) {
        o.set("fromStartSeconds", JsonOut.numbers(m.fromStartSeconds()));
      }
    }
    return o;
  }

  private static ObjectNode pointing(Pointing p) {
    ObjectNode o = JsonOut.NODES.objectNode();
    if (p instanceof RaDec rd) {
      o.set("raDeg", JsonOut.number(rd.raDeg()));
      o.set("decDeg", JsonOut.number(rd.decDeg()));
    } else if (p instanceof AzElPointing ae) {
      o.set("azimuthDeg", JsonOut.number(ae.azimuthDeg()));
      o.set("elevationDeg", JsonOut.number(ae.elevationDeg()));
    }
    return o;
  }

  private static ObjectNode target(Target t) {
    if (t instanceof RaDec rd) {
      return pointing(rd);
    }
    ObjectNode o = JsonOut.NODES.objectNode();
    if (t instanceof OrbitingTarget ot) {
      o.set("tle", tle(ot.tle()));
    } else if (t instanceof EarthPoint ep) {
      o.set("latitudeDeg", JsonOut.number(ep.latitudeDeg()));
      o.set("longitudeDeg", JsonOut.number(ep.longitudeDeg()));
      o.set("altitudeM", JsonOut.number(ep.altitudeM()));
    }
    return o;
  }

  private static ObjectNode request(Request r) {
    ObjectNode o = JsonOut.NODES.objectNode();
    o.put("id", r.id());
    if (r.target() != null) {
      o.set("target", target(r.target()));
    }
    if (r.isFlexible()) {
      o.set("minDurationS", JsonOut.number(r.flexible().minDurationS()));
      o.set("maxDurationS", JsonOut.number(r.flexible().maxDurationS()));
      o.set("durationStepS", JsonOut.number(r.flexible().durationStepS()));
      ArrayNode u = o.putArray("utility");
      r.flexible().utility().forEach(p -> u.add(JsonOut.numbers(List.of(p.exposureS(), p.value()))));
    } else {
      if (r.durationS() != null) {
        o.set("durationS", JsonOut.number(r.durationS()));
      }
      if (r.priority() != null) {
        o.set("priority", JsonOut.number(r.priority()));
      }
    }
    if (r.required()) {
      o.put("required", true);
    }
    if (!r.windows().isEmpty()) {
      o.set("windows", windows(r.windows()));
    }
    if (!r.constraints().isEmpty()) {
      o.set("constraints", constraints(r.constraints()));
    }
    if (!r.visits().equals(Visits.ONCE)) {
      Visits v = r.visits();
      ObjectNode vo = o.putObject("visits");
      vo.put("count", v.count());
      vo.set("minSeparationS", JsonOut.number(v.minSeparationS()));
      if (v.maxSeparationS() != null) {
        vo.set("maxSeparationS", JsonOut.number(v.maxSeparationS()));
      }
      vo.put("onePerWindow", v.onePerWindow());
      vo.put("allOrNothing", v.allOrNothing());
    }
    if (!r.configuration().isEmpty()) {
      o.put("configuration", r.configuration());
    }
    if (!r.resources().isEmpty()) {
      ArrayNode a = o.putArray("resources");
      r.resources().forEach(a::add);
    }
    return o;
  }

  /** One resource (A6) in the spec's field order; absent parts are omitted. */
  private static ObjectNode resource(Resource r) {
    ObjectNode o = JsonOut.NODES.objectNode();
    o.put("id", r.id());
    if (r.observer() != null) {
      o.set("observer", observer(r.observer()));
    }
    o.set("slew", slew(r.slew()));
    if (r.startPointing() != null) {
      o.set("startPointing", pointing(r.startPointing()));
    }
    if (!r.constraints().isEmpty()) {
      o.set("constraints", constraints(r.constraints()));
    }
    if (r.reconfiguration() != null) {
      o.set("reconfiguration", reconfiguration(r.reconfiguration()));
    }
    return o;
  }

  /** Groups, reconfiguration and start configuration (A5), when the scenario has them. */
  private static void structure(Scenario s, ObjectNode o) {
    if (!s.groups().isEmpty()) {
      ArrayNode a = o.putArray("groups");
      for (Group g : s.groups()) {
        ObjectNode go = a.addObject();
        go.put("id", g.id());
        ArrayNode m = go.putArray("members");
        g.members().forEach(m::add);
        go.put("allOrNothing", g.allOrNothing());
        go.put("ordered", g.ordered());
        if (g.maxGapS() != null) {
          go.set("maxGapS", JsonOut.number(g.maxGapS()));
        }
        if (g.sameResource()) {
          go.put("sameResource", true);
        }
      }
    }
    if (!s.reconfiguration().equals(Reconfiguration.NONE)) {
      o.set("reconfiguration", reconfiguration(s.reconfiguration()));
    }
    if (!s.startConfiguration().isEmpty()) {
      o.put("startConfiguration", s.startConfiguration());
    }
  }

  /** Change times (A5): a constant, or the labels and their table. */
  private static ObjectNode reconfiguration(Reconfiguration re) {
    ObjectNode ro = JsonOut.NODES.objectNode();
    if (re.labels().isEmpty()) {
      ro.set("seconds", JsonOut.number(re.constantS()));
    } else {
      ArrayNode l = ro.putArray("labels");
      re.labels().forEach(l::add);
      ArrayNode rows = ro.putArray("seconds");
      for (double[] row : re.table()) {
        ArrayNode r = rows.addArray();
        for (double v : row) {
          r.add(JsonOut.number(v));
        }
      }
    }
    ro.put("concurrentWithSlew", re.concurrentWithSlew());
    return ro;
  }

  /** Windows as [[start, end], ...]; shared with the windows file. */
  static ArrayNode windows(List<TimeWindow> windows) {
    ArrayNode a = JsonOut.NODES.arrayNode();
    for (TimeWindow w : windows) {
      ArrayNode pair = a.addArray();
      pair.add(JsonOut.instant(w.start()));
      pair.add(JsonOut.instant(w.end()));
    }
    return a;
  }

  private static ObjectNode solver(SolverSettings s) {
    ObjectNode o = JsonOut.NODES.objectNode();
    o.set("timeLimitS", JsonOut.number(s.timeLimitS()));
    o.put("workers", s.workers());
    o.put("seed", s.seed());
    return o;
  }
}
