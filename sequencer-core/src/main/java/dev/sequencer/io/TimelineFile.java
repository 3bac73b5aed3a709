package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The timeline (plan) file: status, {@code objective: {priority, slewSeconds}}, {@code bound},
 * observations in time order (with {@code value}, {@code state} and, with several resources (A6), the
 * {@code resource} that makes each, when present) and unscheduled requests with a reason. {@code bound} is
 * omitted when unknown; the reader also accepts {@code null}. Every id appears once across observations and
 * unscheduled, or once per visit (A4): observing one request on two resources takes two visits.
 */
public final class TimelineFile {
  static final List<String> TOP = List.of("format", "status", "objective", "bound", "observations", "unscheduled");
  static final List<String> OBJECTIVE = List.of("priority", "slewSeconds");
  static final List<String> OBSERVATION =
      List.of("id", "start", "end", "slewSeconds", "value", "state", "slewStart", "slewVia", "visit", "resource");
  static final List<String> UNSCHEDULED = List.of("id", "reason", "visitsMissing");
  static final List<String> STATES = List.of(Observation.DONE, Observation.RUNNING, Observation.PLANNED);

  private TimelineFile() {}

  /** The timeline as pretty, byte-stable JSON text. */
  public static String toJson(Timeline t) {
    ObjectNode o = JsonOut.NODES.objectNode();
    o.put("format", 1);
    o.put("status", t.status().name());
    ObjectNode objective = o.putObject("objective");
    objective.set("priority", JsonOut.number(t.priority()));
    objective.set("slewSeconds", JsonOut.number(t.slewSeconds()));
    if (t.bound() != null) {
      o.set("bound", JsonOut.number(t.bound()));
    }
    ArrayNode obs = o.putArray("observations");
    for (Observation ob : t.observations()) {
      ObjectNode e = obs.addObject();
      e.put("id", ob.id());
      if (ob.resource() != null) {
        e.put("resource", ob.resource());
      }
      if (ob.visit() != null) {
        e.put("visit", ob.visit());
      }
      e.put("start", JsonOut.instant(ob.start()));
      e.put("end", JsonOut.instant(ob.end()));
      e.set("slewSeconds", JsonOut.number(ob.slewSeconds()));
      if (ob.value() != null) {
        e.set("value", JsonOut.number(ob.value()));
      }
      if (ob.state() != null) {
        e.put("state", ob.state());
      }
      if (ob.slewStart() != null) {
        e.put("slewStart", JsonOut.instant(ob.slewStart()));
      }
      if (!ob.slewVia().isEmpty()) {
        ArrayNode via = e.putArray("slewVia");
        for (RaDec d : ob.slewVia()) {
          via.addArray().add(JsonOut.number(d.raDeg())).add(JsonOut.number(d.decDeg()));
        }
      }
    }
    ArrayNode uns = o.putArray("unscheduled");
    for (Unscheduled u : t.unscheduled()) {
      ObjectNode e = uns.addObject();
      e.put("id", u.id());
      e.put("reason", u.reason());
      if (u.visitsMissing() != null) {
        e.put("visitsMissing", u.visitsMissing());
      }
    }
    return JsonOut.pretty(o);
  }

  /** Writes the timeline atomically. */
  public static void write(Timeline t, Path file) {
    AtomicFiles.writeUtf8(file, toJson(t));
  }

  public static Timeline read(Path file) {
    return parse(Json.read(file), file.toString());
  }

  /** Reads timeline JSON text; {@code source} names it in the exception message. */
  public static Timeline parse(String json, String source) {
    Problems p = new Problems();
    JsonNode root = Json.parseObject(json, source, p);
    Timeline t = root == null ? null : parse(root, p);
    p.throwIfAny(source);
    return t;
  }

  private static Timeline parse(JsonNode root, Problems p) {
    Fields top = Fields.of(root, "", p, TOP);
    Integer format = top.integer("format", true, Range.ANY);
    if (format != null && format != 1) {
      p.invalid("format", "must be 1", root.get("format"));
    }
    PlanStatus status = status(top, p);
    Fields objective = top.object("objective", true, OBJECTIVE);
    Double priority = objective == null ? null : objective.number("priority", true, Range.NON_NEGATIVE);
    Double slew = objective == null ? null : objective.number("slewSeconds", true, Range.NON_NEGATIVE);
    Double bound = top.number("bound", false, Range.ANY);
    Map<String, String> seen = new HashMap<>();
    List<Observation> observations = observations(top.array("observations", true), p, seen);
    List<Unscheduled> unscheduled = unscheduled(top.array("unscheduled", true), p, seen);
    if (p.count() > 0) {
      return null;
    }
    return new Timeline(status, priority, slew, bound, observations, unscheduled);
  }

  private static PlanStatus status(Fields top, Problems p) {
    String s = top.text("status", true);
    if (s == null) {
      return null;
    }
    List<String> names = Arrays.stream(PlanStatus.values()).map(Enum::name).toList();
    if (!names.contains(s)) {
      p.invalid(top.path("status"), "must be one of " + String.join(", ", names) + Suggest.hint(s, names),
          top.get("status", true));
      return null;
    }
    return PlanStatus.valueOf(s);
  }

  private static List<Observation> observations(ArrayNode a, Problems p, Map<String, String> seen) {
    List<Observation> out = new ArrayList<>();
    if (a == null) {
      return out;
    }
    Instant previousStart = null;
    for (int i = 0; i < a.size(); i++) {
      Fields f = Fields.of(a.get(i), RequestParser.label("observations", i, a.get(i)), p, OBSERVATION);
      if (f == null) {
        continue;
      }
      int before = p.count();
      Integer visit = f.integer("visit", false, Range.closed(1, Integer.MAX_VALUE));
      String id = id(f, "observations[" + i + "]", p, seen, visit == null ? "" : "#" + visit);
      JsonNode resourceNode = f.get("resource", false);
      String resource = resourceNode == null ? null : Values.id(resourceNode, f.path("resource"), p);
      Instant start = f.instant("start", true);
      Instant end = f.instant("end", true);
      Double slew = f.number("slewSeconds", true, Range.NON_NEGATIVE);
      Double value = f.number("value", false, Range.NON_NEGATIVE);
      String state = f.text("state", false);
      Instant slewStart = f.instant("slewStart", false);
      List<RaDec> via = slewVia(f, p);
      if (slewStart != null && start != null && slewStart.isAfter(start)) {
        p.add(f.path("slewStart"), "slew departs at " + slewStart + ", after the observation's start " + start,
            slewStart.toString());
      }
      if (state != null && !STATES.contains(state)) {
        p.invalid(f.path("state"), "must be one of " + String.join(", ", STATES) + Suggest.hint(state, STATES),
            f.get("state", true));
      }
      if (start != null && end != null && end.isBefore(start)) {
        p.add(f.path("end"), "end " + end + " is before start " + start, end.toString());
      }
      if (start != null && previousStart != null && start.isBefore(previousStart)) {
        p.add(f.path("start"), "starts at " + start + ", before the previous observation's start " + previousStart
            + "; observations must be in time order", start.toString());
      }
      if (start != null) {
        previousStart = start;
      }
      if (p.count() == before) {
        out.add(new Observation(id, start, end, slew, value, state, slewStart, via, visit, resource));
      }
    }
    return out;
  }

  /** {@code slewVia}: an array of [raDeg, decDeg] pairs, RA in [0, 360), Dec in [-90, 90] (spec A3). */
  private static List<RaDec> slewVia(Fields f, Problems p) {
    JsonNode a = f.get("slewVia", false);
    List<RaDec> out = new ArrayList<>();
    if (a == null) {
      return out;
    }
    String path = f.path("slewVia");
    if (!a.isArray()) {
      p.invalid(path, "must be an array of [raDeg, decDeg] pairs", a);
      return out;
    }
    for (int i = 0; i < a.size(); i++) {
      String at = path + "[" + i + "]";
      if (!Values.isArray(a.get(i), at, p, 2, "a pair [raDeg, decDeg]")) {
        continue;
      }
      Double ra = Values.number(a.get(i).get(0), at + "[0]", p, Range.RIGHT_ASCENSION);
      Double dec = Values.number(a.get(i).get(1), at + "[1]", p, Range.LATITUDE);
      if (ra != null && dec != null) {
        out.add(new RaDec(ra, dec));
      }
    }
    return out;
  }

  private static List<Unscheduled> unscheduled(ArrayNode a, Problems p, Map<String, String> seen) {
    List<Unscheduled> out = new ArrayList<>();
    if (a == null) {
      return out;
    }
    for (int i = 0; i < a.size(); i++) {
      Fields f = Fields.of(a.get(i), RequestParser.label("unscheduled", i, a.get(i)), p, UNSCHEDULED);
      if (f == null) {
        continue;
      }
      int before = p.count();
      Integer missing = f.integer("visitsMissing", false, Range.closed(1, Integer.MAX_VALUE));
      String id = id(f, "unscheduled[" + i + "]", p, seen, missing == null ? "" : "#unscheduled");
      String reason = f.text("reason", true);
      if (p.count() == before) {
        out.add(new Unscheduled(id, reason, missing));
      }
    }
    return out;
  }

  /**
   * The entry's id, reported when missing, empty or already used elsewhere in the file; {@code part}
   * tells entries of one request apart that may share its id (visits {@code "#2"}, the unscheduled entry of
   * a request with visits missing).
   */
  private static String id(Fields f, String where, Problems p, Map<String, String> seen, String part) {
    JsonNode n = f.get("id", true);
    String id = n == null ? null : Values.id(n, f.path("id"), p);
    if (id != null) {
      String first = seen.putIfAbsent(id + part, where);
      if (first != null) {
        p.add(f.path("id"), "duplicate id, already used by " + first, id);
      }
    }
    return id;
  }
}
