package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.Request;
import dev.sequencer.model.Target;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Tle;
import dev.sequencer.model.UtilityPoint;
import dev.sequencer.model.Visits;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Reads the {@code requests} array: ids, the resources allowed to observe each (A6), targets (checked
 * against the kind of each observer that may observe the request), fixed or flexible durations, priorities,
 * allowed windows (clipped to the horizon with a warning), the request's own constraints, its visits and
 * configuration (A4, A5).
 */
final class RequestParser {
  static final List<String> REQUEST =
      List.of("id", "target", "durationS", "priority", "required", "windows", "minDurationS", "maxDurationS",
          "durationStepS", "utility", "constraints", "visits", "configuration", "resources");
  static final List<String> FLEXIBLE = List.of("minDurationS", "maxDurationS", "durationStepS", "utility");
  static final List<String> TLE_TARGET = List.of("tle");
  static final List<String> EARTH_POINT = List.of("latitudeDeg", "longitudeDeg", "altitudeM");

  private final Problems p;
  private final TimeWindow horizon;
  private final List<ObserverView> views;
  private final boolean several;

  /**
   * {@code horizon} is null when it was invalid (then windows are not clipped). {@code views}: the one
   * observer, or with {@code several} the resources whose id was read (empty when the {@code resources}
   * array itself was not); each request must be valid for every one allowed to observe it.
   */
  RequestParser(Problems problems, TimeWindow horizon, List<ObserverView> views, boolean several) {
    this.p = problems;
    this.horizon = horizon;
    this.views = List.copyOf(views);
    this.several = several;
  }

  List<Request> parse(ArrayNode nodes, String path) {
    if (nodes.isEmpty()) {
      p.add(path, "must list at least one request", "[]");
    }
    List<Request> out = new ArrayList<>();
    Map<String, Integer> firstIndex = new HashMap<>();
    for (int i = 0; i < nodes.size(); i++) {
      JsonNode n = nodes.get(i);
      Fields f = Fields.of(n, label(path, i, n), p, REQUEST);
      if (f == null) {
        continue;
      }
      int before = p.count();
      String id = f.get("id", true) == null ? null : Values.id(n.get("id"), f.path("id"), p);
      if (id != null) {
        Integer first = firstIndex.putIfAbsent(id, i);
        if (first != null) {
          p.add(f.path("id"), "duplicate id, already used by " + path + "[" + first + "]", id);
        }
      }
      Request r = request(f, id);
      if (p.count() == before) {
        out.add(r);
      }
    }
    return out;
  }

  /** {@code requests[3] (id "R4")} when the id is a string, else {@code requests[3]}. */
  static String label(String arrayPath, int i, JsonNode n) {
    String base = arrayPath + "[" + i + "]";
    JsonNode id = n.isObject() ? n.get("id") : null;
    return id != null && id.isTextual() ? base + " (id \"" + id.textValue() + "\")" : base;
  }

  private Request request(Fields f, String id) {
    List<String> resources = resources(f);
    List<ObserverView> allowed = several && f.has("resources")
        ? views.stream().filter(v -> resources.contains(v.resource())).toList() : views;
    Target target = target(f, allowed);
    boolean flexible = FLEXIBLE.stream().anyMatch(f::has);
    Double durationS = null;
    Double priority = null;
    FlexibleExposure flex = null;
    if (flexible) {
      for (String name : List.of("durationS", "priority")) {
        JsonNode v = f.get(name, false);
        if (v != null) {
          p.invalid(f.path(name), "must be absent for a flexible request (it gives " + String.join("/", FLEXIBLE)
              + "; the utility replaces " + name + ")", v);
        }
      }
      flex = flexible(f);
    } else {
      durationS = f.number("durationS", true, Range.NON_NEGATIVE);
      priority = f.number("priority", true, Range.POSITIVE);
    }
    Boolean required = f.bool("required", false);
    List<TimeWindow> windows = windows(f, allowed);
    ConstraintOverrides constraints =
        new ConstraintsParser(p).overrides(f, allowed.stream().map(ObserverView::inherited).toList());
    StructureParser structure = new StructureParser(p);
    Visits visits = structure.visits(f);
    String configuration = structure.configuration(f);
    if (id == null) {
      return null;
    }
    return new Request(id, target, durationS, priority, Boolean.TRUE.equals(required), windows, flex, constraints,
        visits, configuration, resources);
  }

  /**
   * {@code resources} (A6): a non-empty array of known resource ids, none twice; only in a scenario with
   * resources. The ids read (empty when absent: every resource may observe the request).
   */
  private List<String> resources(Fields f) {
    List<String> out = new ArrayList<>();
    JsonNode n = f.get("resources", false);
    String path = f.path("resources");
    if (n == null) {
      return out;
    }
    if (!several) {
      p.add(path, "is only for a scenario with \"resources\" (A6); this one has one observer", Problems.text(n));
      return out;
    }
    ArrayNode a = f.array("resources", false);
    if (a == null) {
      return out;
    }
    if (a.isEmpty()) {
      p.add(path, "must list at least one resource id (omit the field to allow every resource)", "[]");
    }
    List<String> known = views.stream().map(ObserverView::resource).toList();
    Set<String> seen = new HashSet<>();
    for (int j = 0; j < a.size(); j++) {
      String rp = path + "[" + j + "]";
      String rid = Values.id(a.get(j), rp, p);
      if (rid == null) {
        continue;
      }
      if (!seen.add(rid)) {
        p.add(rp, "resource listed twice", rid);
      } else if (!known.isEmpty() && !known.contains(rid)) {
        p.add(rp, "no resource has this id" + Suggest.hint(rid, known), rid);
      } else {
        out.add(rid);
      }
    }
    return out;
  }

  /** The first of {@code allowed} of this kind, or null. */
  private static ObserverView first(List<ObserverView> allowed, ObserverKind... kinds) {
    return allowed.stream().filter(v -> List.of(kinds).contains(v.kind())).findFirst().orElse(null);
  }

  /**
   * The target: required when an observer allowed to observe the request has one, absent when one has none
   * (so one request cannot be for both), and of a kind each can observe (a point on the Earth from orbit
   * only). Observers that could not be read impose nothing.
   */
  private Target target(Fields f, List<ObserverView> allowed) {
    JsonNode t = f.get("target", false);
    String path = f.path("target");
    if (t == null) {
      ObserverView seeing = first(allowed, ObserverKind.GROUND, ObserverKind.ORBIT);
      if (seeing != null && seeing.resource() == null) {
        p.missing(path);
      } else if (seeing != null) {
        p.add(path, "is required when " + seeing.subject("the scenario") + " has an observer", null);
      }
      return null;
    }
    ObserverView none = first(allowed, ObserverKind.NONE);
    if (none != null) {
      p.invalid(path, "must be absent when " + none.subject("the scenario") + " has no observer", t);
      return null;
    }
    if (!t.isObject()) {
      p.invalid(path, "must be an object", t);
      return null;
    }
    if (t.has("tle")) {
      Fields tf = Fields.of(t, path, p, TLE_TARGET);
      Tle tle = TleCheck.read(tf.get("tle", true), tf.path("tle"), p, horizon);
      return tle == null ? null : new OrbitingTarget(tle);
    }
    if (t.has("raDeg") || t.has("decDeg")) {
      return ScenarioParser.raDec(t, path, p);
    }
    if (EARTH_POINT.stream().anyMatch(t::has)) {
      Fields ef = Fields.of(t, path, p, EARTH_POINT);
      Double lat = ef.number("latitudeDeg", true, Range.LATITUDE);
      Double lon = ef.number("longitudeDeg", true, Range.LONGITUDE);
      Double alt = ef.number("altitudeM", true, Range.ALTITUDE_M);
      ObserverView ground = first(allowed, ObserverKind.GROUND);
      if (ground != null) {
        p.add(path, "a point on the Earth can only be observed from an orbit observer, and "
            + ground.subject("this one") + " is on the ground", Problems.text(t));
        return null;
      }
      return lat == null || lon == null || alt == null ? null : new EarthPoint(lat, lon, alt);
    }
    p.invalid(path, "must be {raDeg, decDeg}, {tle} or {latitudeDeg, longitudeDeg, altitudeM}", t);
    return null;
  }

  private FlexibleExposure flexible(Fields f) {
    int before = p.count();
    Double min = f.number("minDurationS", true, Range.NON_NEGATIVE);
    Double max = f.number("maxDurationS", true, Range.NON_NEGATIVE);
    Double step = f.number("durationStepS", false, Range.POSITIVE);
    if (min != null && max != null && max < min) {
      p.add(f.path("maxDurationS"), "must be >= minDurationS " + Range.num(min) + " (was " + Range.num(max) + ")",
          Range.num(max));
    }
    List<UtilityPoint> utility = utility(f, min, max);
    if (p.count() != before) {
      return null;
    }
    return new FlexibleExposure(min, max, step == null ? FlexibleExposure.DEFAULT_STEP_S : step, utility);
  }

  /** Points with increasing seconds from minDurationS to maxDurationS and finite values >= 0. */
  private List<UtilityPoint> utility(Fields f, Double min, Double max) {
    List<UtilityPoint> out = new ArrayList<>();
    ArrayNode a = f.array("utility", true);
    if (a == null) {
      return out;
    }
    String path = f.path("utility");
    if (a.isEmpty()) {
      p.add(path, "must list at least one [seconds, value] point", "[]");
      return out;
    }
    boolean complete = true;
    for (int i = 0; i < a.size(); i++) {
      String pp = path + "[" + i + "]";
      if (!Values.isArray(a.get(i), pp, p, 2, "a [seconds, value] pair")) {
        complete = false;
        continue;
      }
      Double s = Values.number(a.get(i).get(0), pp + "[0]", p, Range.NON_NEGATIVE);
      Double v = Values.number(a.get(i).get(1), pp + "[1]", p, Range.NON_NEGATIVE);
      if (s == null || v == null) {
        complete = false;
        continue;
      }
      if (!out.isEmpty() && s <= out.get(out.size() - 1).exposureS()) {
        p.add(pp + "[0]", "seconds must increase: " + Range.num(s) + " is not after "
            + Range.num(out.get(out.size() - 1).exposureS()), Range.num(s));
        complete = false;
        continue;
      }
      out.add(new UtilityPoint(s, v));
    }
    if (complete && min != null && out.get(0).exposureS() != min) {
      p.add(path + "[0][0]", "the first point must be at minDurationS " + Range.num(min) + " (was "
          + Range.num(out.get(0).exposureS()) + ")", Range.num(out.get(0).exposureS()));
    }
    double last = out.isEmpty() ? Double.NaN : out.get(out.size() - 1).exposureS();
    if (complete && max != null && last != max) {
      p.add(path + "[" + (a.size() - 1) + "][0]", "the last point must be at maxDurationS " + Range.num(max)
          + " (was " + Range.num(last) + ")", Range.num(last));
    }
    return out;
  }

  /**
   * Allowed windows: each with end after start, in order and apart (a window must start after the
   * previous one ends), and overlapping the horizon; a window partly outside is clipped with a warning.
   * Required when an observer {@code allowed} to observe the request has none.
   */
  private List<TimeWindow> windows(Fields f, List<ObserverView> allowed) {
    List<TimeWindow> out = new ArrayList<>();
    ArrayNode a = f.array("windows", false);
    String path = f.path("windows");
    if (a == null) {
      ObserverView none = first(allowed, ObserverKind.NONE);
      if (none != null && !f.has("windows")) {
        p.add(path, "is required when " + none.subject("the scenario") + " has no observer", null);
      }
      return out;
    }
    if (a.isEmpty()) {
      p.add(path, "must list at least one window (omit the field to allow any time)", "[]");
      return out;
    }
    Instant previousEnd = null;
    for (int i = 0; i < a.size(); i++) {
      String wp = path + "[" + i + "]";
      TimeWindow w = Values.window(a.get(i), wp, p, true);
      if (w == null) {
        previousEnd = null;
        continue;
      }
      if (previousEnd != null && !w.start().isAfter(previousEnd)) {
        p.add(wp, "starts at " + w.start() + ", not after the previous window's end " + previousEnd
            + "; windows must be in time order and apart (merge overlapping ones)", Problems.text(a.get(i)));
      }
      previousEnd = w.end();
      TimeWindow clipped = clip(w, wp, a.get(i));
      if (clipped != null) {
        out.add(clipped);
      }
    }
    return out;
  }

  private TimeWindow clip(TimeWindow w, String path, JsonNode node) {
    if (horizon == null) {
      return w;
    }
    if (!w.end().isAfter(horizon.start()) || !w.start().isBefore(horizon.end())) {
      p.add(path, "lies entirely outside the horizon [" + horizon.start() + ", " + horizon.end() + "]",
          Problems.text(node));
      return null;
    }
    Instant start = w.start().isBefore(horizon.start()) ? horizon.start() : w.start();
    Instant end = w.end().isAfter(horizon.end()) ? horizon.end() : w.end();
    if (!start.equals(w.start()) || !end.equals(w.end())) {
      p.warn(path, "clipped to the horizon: [" + w.start() + ", " + w.end() + "] became [" + start + ", " + end + "]");
    }
    return new TimeWindow(start, end);
  }
}
