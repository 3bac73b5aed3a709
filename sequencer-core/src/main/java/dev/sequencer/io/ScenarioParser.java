package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.Group;
import dev.sequencer.model.Pointing;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Reconfiguration;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.SolverSettings;
import dev.sequencer.model.TimeWindow;
import java.time.Instant;
import java.util.List;
import java.util.Objects;

/**
 * Reads the scenario's top level: horizon, then each part with its own reader, and the solver settings. A
 * file gives one observer ({@code observer}, {@code slew}, {@code startPointing}) or {@code resources} (A6);
 * with resources the scenario's own {@code slew} is the first resource's (the model needs one; each
 * resource's own applies).
 */
final class ScenarioParser {
  static final List<String> TOP =
      List.of("format", "name", "horizon", "observer", "constraints", "slew", "startPointing", "requests", "solver",
          "groups", "reconfiguration", "startConfiguration", "resources");
  static final List<String> HORIZON = List.of("start", "end");
  static final List<String> RA_DEC = List.of("raDeg", "decDeg");
  static final List<String> SOLVER = List.of("timeLimitS", "workers", "seed");

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
    boolean several = top.has("resources");
    ObserverParser observers = new ObserverParser(p, horizon);
    ObserverParser.Read observer = several ? new ObserverParser.Read(null, ObserverKind.NONE) : observers.observer(top);
    Constraints constraints = new ConstraintsParser(p).scenario(top);
    ArrayNode requestNodes = top.array("requests", true);
    int requestCount = requestNodes == null ? -1 : requestNodes.size();
    List<ResourceParser.Entry> resources = List.of();
    SlewSettings slew;
    Pointing startPointing = null;
    List<ObserverView> views;
    if (several) {
      refuseOneObserverFields(top);
      resources = new ResourceParser(p, horizon, requestCount, constraints).parse(top);
      views = resources.stream().map(ResourceParser.Entry::view).filter(Objects::nonNull).toList();
      slew = resources.isEmpty() || resources.get(0).resource() == null ? null : resources.get(0).resource().slew();
    } else {
      slew = new SlewParser(p, observer.kind(), requestCount).parse(top);
      startPointing = observers.startPointing(top, observer.kind(), slew);
      views = List.of(ObserverView.single(observer.kind(), constraints));
    }
    List<Request> requests = requestNodes == null ? null
        : new RequestParser(p, horizon, views, several).parse(requestNodes, top.path("requests"));
    SolverSettings solver = solver(top);
    StructureParser structure = new StructureParser(p);
    List<Group> groups = structure.groups(top, requests);
    Reconfiguration reconfiguration = structure.reconfiguration(top);
    String startConfiguration = top.text("startConfiguration", false);
    String start = startConfiguration == null ? "" : startConfiguration;
    if (several) {
      structure.checkLabels(top, reconfiguration, start, requests, resources);
    } else {
      structure.checkLabels(top, reconfiguration, start, requests);
    }
    if (p.count() > 0) {
      return null;
    }
    return new Scenario(format, name, horizon, observer.observer(), constraints, slew, startPointing, requests, solver,
        groups, reconfiguration, startConfiguration, resources.stream().map(ResourceParser.Entry::resource).toList());
  }

  /** With {@code resources} (A6) the top level gives no observer, slew or start pointing: each resource has its own. */
  private void refuseOneObserverFields(Fields top) {
    for (String field : List.of("observer", "slew", "startPointing")) {
      JsonNode n = top.get(field, false);
      if (n != null) {
        p.add(top.path(field), "must be absent when the file gives \"resources\" (each resource has its own "
            + field + ")", Problems.text(n));
      }
    }
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
