package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Group;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.Observer;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitSpec;
import dev.sequencer.model.Pointing;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Reconfiguration;
import dev.sequencer.model.Refraction;
import dev.sequencer.model.Request;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.SolverSettings;
import dev.sequencer.model.TimeWindow;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/** Reads the scenario's top level, horizon, observer (or resources, A6), constraints, start pointing and solver settings. */
final class ScenarioParser {
  static final List<String> TOP =
      List.of("format", "name", "horizon", "observer", "constraints", "slew", "startPointing", "requests", "solver",
          "groups", "reconfiguration", "startConfiguration", "resources");
  static final List<String> RESOURCE =
      List.of("id", "observer", "slew", "startPointing", "constraints", "reconfiguration");
  static final List<String> HORIZON = List.of("start", "end");
  static final List<String> OBSERVER = List.of("ground", "orbit");
  static final List<String> GROUND = List.of("latitudeDeg", "longitudeDeg", "altitudeM", "horizonMask", "refraction");
  static final List<String> REFRACTION = List.of("pressureHPa", "temperatureC");
  static final List<String> ORBIT = List.of("tle", "keplerian");
  static final List<String> KEPLERIAN =
      List.of("epoch", "semiMajorAxisKm", "eccentricity", "inclinationDeg", "raanDeg", "argumentOfPerigeeDeg",
          "meanAnomalyDeg");
  static final List<String> RA_DEC = List.of("raDeg", "decDeg");
  static final List<String> AZ_EL = List.of("azimuthDeg", "elevationDeg");
  static final List<String> SOLVER = List.of("timeLimitS", "workers", "seed");
  /** Equatorial radius of the Earth (WGS-84), km: the smallest allowed semi-major axis and perigee. */
  static final double EARTH_RADIUS_KM = 6378.137;

  private final Problems p;

  ScenarioParser(Problems problems) {
    this.p = problems;
  }

  /** The scenario, or null when anything was reported. */
  Scenario parse(JsonNode root) {
    Fields top = Fields.of(root, "", p, TOP);
    Integer format = top.integer("format", true, Range.ANY);
    if (format != null && format != Scenario.FORMAT) {
      p.invalid("format", "must be " + Scenario.FORMAT, root.get("format"));
    }
    String name = top.text("name", false);
    TimeWindow horizon = horizon(top);
    ObserverKind[] kind = {ObserverKind.NONE};
    Constraints constraints = new ConstraintsParser(p).scenario(top);
    ArrayNode requestNodes = top.array("requests", true);
    int requestCount = requestNodes == null ? -1 : requestNodes.size();
    StructureParser structure = new StructureParser(p);
    Observer observer = null;
    SlewSettings slew = null;
    Pointing startPointing = null;
    List<Resource> resources = List.of();
    if (top.has("resources")) {
      for (String own : List.of("observer", "slew", "startPointing")) {
        if (top.has(own)) {
          p.add(top.path(own), "not allowed with \"resources\": each resource gives its own (A6)",
              Problems.text(top.get(own, false)));
        }
      }
      resources = resources(top, horizon, constraints, requestCount, structure, kind);
      slew = resources.isEmpty() ? null : resources.get(0).slew();
    } else {
      observer = observer(top, horizon, kind);
      slew = new SlewParser(p, kind[0], requestCount).parse(top);
      startPointing = startPointing(top, kind[0], slew);
    }
    List<Request> requests = requestNodes == null ? null : new RequestParser(p, horizon, kind[0], constraints)
        .withResources(resources.stream().map(Resource::id).toList()).parse(requestNodes, top.path("requests"));
    SolverSettings solver = solver(top);
    List<Group> groups = structure.groups(top, requests);
    Reconfiguration reconfiguration = structure.reconfiguration(top);
    String startConfiguration = top.text("startConfiguration", false);
    String start = startConfiguration == null ? "" : startConfiguration;
    structure.checkLabels(top, reconfiguration, start, requests);
    for (int i = 0; i < resources.size(); i++) {
      if (resources.get(i).reconfiguration() != null) {
        structure.checkLabels(top, resources.get(i).reconfiguration(), start, requests,
            "resources[" + i + "].reconfiguration.labels");
      }
    }
    if (p.count() > 0) {
      return null;
    }
    return new Scenario(format, name, horizon, observer, constraints, slew, startPointing, requests, solver, groups,
        reconfiguration, startConfiguration, resources);
  }

  /**
   * The {@code resources} array (A6): each with a unique non-empty {@code id}, its own observer, slew model
   * (required) and start pointing under the same rules as the top level, its own {@code constraints} read as
   * field-by-field overrides of the scenario's, and its own {@code reconfiguration} (absent: the scenario's).
   * Every resource must have the same kind of observer (ground, orbit or none): the requests are checked
   * against that kind, which {@code kind} returns.
   */
  private List<Resource> resources(Fields top, TimeWindow horizon, Constraints constraints, int requestCount,
      StructureParser structure, ObserverKind[] kind) {
    ArrayNode nodes = top.array("resources", true);
    if (nodes == null) {
      kind[0] = ObserverKind.INVALID;
      return List.of();
    }
    String path = top.path("resources");
    if (nodes.isEmpty()) {
      p.add(path, "must list at least one resource (or give the top-level observer instead)", "[]");
      kind[0] = ObserverKind.INVALID;
      return List.of();
    }
    List<Resource> out = new ArrayList<>();
    java.util.Map<String, Integer> firstIndex = new java.util.HashMap<>();
    ObserverKind first = null;
    for (int i = 0; i < nodes.size(); i++) {
      Fields r = Fields.of(nodes.get(i), path + "[" + i + "]", p, RESOURCE);
      if (r == null) {
        continue;
      }
      int before = p.count();
      String id = r.text("id", true);
      if (id != null && id.isBlank()) {
        p.add(r.path("id"), "must not be empty", id);
      } else if (id != null && firstIndex.putIfAbsent(id, i) != null) {
        p.add(r.path("id"), "duplicate id, already used by " + path + "[" + firstIndex.get(id) + "]", id);
      }
      ObserverKind[] own = {ObserverKind.NONE};
      Observer observer = observer(r, horizon, own);
      if (first == null) {
        first = own[0];
      } else if (own[0] != first && own[0] != ObserverKind.INVALID && first != ObserverKind.INVALID) {
        p.add(r.has("observer") ? r.path("observer") : r.path(), "every resource has the same kind of observer as "
            + path + "[0] (" + describe(first) + "); mixing kinds is not supported yet", describe(own[0]));
      }
      SlewSettings slew = new SlewParser(p, own[0], requestCount).parse(r);
      Pointing start = startPointing(r, own[0], slew);
      dev.sequencer.model.ConstraintOverrides overrides = new ConstraintsParser(p).request(r, constraints);
      Reconfiguration reconfiguration = r.has("reconfiguration") ? structure.reconfiguration(r) : null;
      if (p.count() == before && id != null && slew != null) {
        out.add(new Resource(id, observer, slew, start, overrides, reconfiguration));
      }
    }
    kind[0] = first == null ? ObserverKind.INVALID : first;
    return out;
  }

  private static String describe(ObserverKind k) {
    return switch (k) {
      case NONE -> "none";
      case GROUND -> "ground";
      case ORBIT -> "orbit";
      case INVALID -> "invalid";
    };
  }

  private TimeWindow horizon(Fields top) {
    Fields h = top.object("horizon", true, HORIZON);
    if (h == null) {
      return null;
    }
    Instant start = h.instant("start", true);
    Instant end = h.instant("end", true);
    if (start == null || end == null) {
      return null;
    }
    if (!end.isAfter(start)) {
      String how = end.equals(start) ? "equals start " + start + "; the horizon must have a positive length"
          : "is before start " + start;
      p.add(h.path("end"), "end " + end + " " + how, end.toString());
      return null;
    }
    return new TimeWindow(start, end);
  }

  private Observer observer(Fields top, TimeWindow horizon, ObserverKind[] kind) {
    Fields o = top.object("observer", false, OBSERVER);
    if (o == null) {
      kind[0] = top.has("observer") ? ObserverKind.INVALID : ObserverKind.NONE;
      return null;
    }
    if (o.has("ground") == o.has("orbit")) {
      p.add(o.path(), "must have exactly one of \"ground\" or \"orbit\"", Problems.text(top.get("observer", false)));
      kind[0] = ObserverKind.INVALID;
      return null;
    }
    int before = p.count();
    Observer result;
    if (o.has("ground")) {
      kind[0] = ObserverKind.GROUND;
      result = ground(o.object("ground", true, GROUND));
    } else {
      kind[0] = ObserverKind.ORBIT;
      Fields orbit = o.object("orbit", true, ORBIT);
      OrbitSpec spec = orbit == null ? null : orbit(orbit, horizon);
      result = spec == null ? null : new OrbitObserver(spec);
    }
    return p.count() == before ? result : null;
  }

  private GroundSite ground(Fields g) {
    if (g == null) {
      return null;
    }
    Double lat = g.number("latitudeDeg", true, Range.LATITUDE);
    Double lon = g.number("longitudeDeg", true, Range.LONGITUDE);
    Double alt = g.number("altitudeM", true, Range.ALTITUDE_M);
    List<AzEl> mask = new ArrayList<>();
    ArrayNode maskNode = g.array("horizonMask", false);
    if (maskNode != null) {
      for (int i = 0; i < maskNode.size(); i++) {
        String path = g.path("horizonMask") + "[" + i + "]";
        JsonNode pt = maskNode.get(i);
        if (Values.isArray(pt, path, p, 2, "an [azimuthDeg, elevationDeg] pair")) {
          Double az = Values.number(pt.get(0), path + "[0]", p, Range.closed(0, 360));
          Double el = Values.number(pt.get(1), path + "[1]", p, Range.ELEVATION);
          if (az != null && el != null) {
            mask.add(new AzEl(az, el));
          }
        }
      }
    }
    Refraction refraction = null;
    Fields r = g.object("refraction", false, REFRACTION);
    if (r != null) {
      Double pressure = r.number("pressureHPa", true, Range.closed(0, 1200));
      Double temperature = r.number("temperatureC", true, Range.closed(-90, 60));
      refraction = pressure == null || temperature == null ? null : new Refraction(pressure, temperature);
    }
    return lat == null || lon == null || alt == null ? null : new GroundSite(lat, lon, alt, mask, refraction);
  }

  private OrbitSpec orbit(Fields orbit, TimeWindow horizon) {
    if (orbit.has("tle") == orbit.has("keplerian")) {
      p.add(orbit.path(), "must have exactly one of \"tle\" or \"keplerian\"", null);
      return null;
    }
    if (orbit.has("tle")) {
      return TleCheck.read(orbit.get("tle", true), orbit.path("tle"), p, horizon);
    }
    Fields k = orbit.object("keplerian", true, KEPLERIAN);
    if (k == null) {
      return null;
    }
    int before = p.count();
    Instant epoch = k.instant("epoch", true);
    Double a = k.number("semiMajorAxisKm", true, Range.above(EARTH_RADIUS_KM));
    Double e = k.number("eccentricity", true, new Range(0, true, 1, false));
    Double i = k.number("inclinationDeg", true, Range.closed(0, 180));
    Double raan = k.number("raanDeg", true, Range.ANY);
    Double argp = k.number("argumentOfPerigeeDeg", true, Range.ANY);
    Double m = k.number("meanAnomalyDeg", true, Range.ANY);
    if (a != null && e != null && a * (1 - e) <= EARTH_RADIUS_KM) {
      p.add(k.path("eccentricity"), String.format(java.util.Locale.ROOT,
          "perigee radius %.3f km (semiMajorAxisKm * (1 - eccentricity)) is inside the Earth (radius %.3f km)",
          a * (1 - e), EARTH_RADIUS_KM), Range.num(e));
    }
    if (epoch != null) {
      Epochs.check(epoch, horizon, k.path("epoch"), epoch.toString(), p, "elements",
          "the motion is integrated from it (two-body + J2, no drag), slower and further from the real orbit");
    }
    return p.count() == before ? new KeplerianElements(epoch, a, e, i, raan, argp, m) : null;
  }

  private Pointing startPointing(Fields top, ObserverKind kind, SlewSettings slew) {
    JsonNode n = top.get("startPointing", false);
    if (n == null) {
      return null;
    }
    String path = top.path("startPointing");
    if (n.isObject() && (n.has("azimuthDeg") || n.has("elevationDeg"))) {
      Fields f = Fields.of(n, path, p, AZ_EL);
      Range azRange = new Range(0, true, 360, false);
      if (slew instanceof SlewSettings.AltAz altaz && altaz.azimuthRangeDeg() != null) {
        azRange = Range.closed(altaz.azimuthRangeDeg().get(0), altaz.azimuthRangeDeg().get(1));
      }
      Double az = f.number("azimuthDeg", true, azRange);
      Double el = f.number("elevationDeg", true, Range.ELEVATION);
      if (kind != ObserverKind.GROUND && kind != ObserverKind.INVALID) {
        p.add(path, "an azimuth/elevation pointing needs a ground observer", null);
        return null;
      }
      return az == null || el == null ? null : new AzElPointing(az, el);
    }
    return raDec(n, path, p);
  }

  /** A fixed direction {raDeg in [0, 360), decDeg in [-90, 90]}. */
  static RaDec raDec(JsonNode n, String path, Problems p) {
    Fields f = Fields.of(n, path, p, RA_DEC);
    if (f == null) {
      return null;
    }
    Double ra = f.number("raDeg", true, Range.RIGHT_ASCENSION);
    Double dec = f.number("decDeg", true, Range.closed(-90, 90));
    return ra == null || dec == null ? null : new RaDec(ra, dec);
  }

  private SolverSettings solver(Fields top) {
    Fields s = top.object("solver", false, SOLVER);
    if (s == null) {
      return null;
    }
    SolverSettings d = SolverSettings.defaults();
    Double limit = s.number("timeLimitS", false, Range.POSITIVE);
    Integer workers = s.integer("workers", false, Range.NON_NEGATIVE);
    Integer seed = s.integer("seed", false, Range.ANY);
    return new SolverSettings(
        limit == null ? d.timeLimitS() : limit,
        workers == null ? d.workers() : workers,
        seed == null ? d.seed() : seed);
  }
}
