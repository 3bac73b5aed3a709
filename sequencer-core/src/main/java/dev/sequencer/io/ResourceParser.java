package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.Pointing;
import dev.sequencer.model.Reconfiguration;
import dev.sequencer.model.Resource;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Reads the {@code resources} array (A6): each resource's unique id, then its observer, slew, start pointing
 * and change times by the top level's rules for them, and its constraints as overrides of the scenario's.
 */
final class ResourceParser {
  static final List<String> RESOURCE =
      List.of("id", "observer", "slew", "startPointing", "constraints", "reconfiguration");

  /**
   * One element as read: its path ({@code resources[1] (id "south")}), its view for the request rules
   * ({@code null} when its id could not be read) and the resource ({@code null} after a problem).
   */
  record Entry(String path, ObserverView view, Resource resource) {}

  private final Problems p;
  private final TimeWindow horizon;
  private final int requestCount;
  private final Constraints scenarioConstraints;

  /** {@code requestCount} < 0 when the requests could not be counted (then matrix sizes are not checked). */
  ResourceParser(Problems problems, TimeWindow horizon, int requestCount, Constraints scenarioConstraints) {
    this.p = problems;
    this.horizon = horizon;
    this.requestCount = requestCount;
    this.scenarioConstraints = scenarioConstraints;
  }

  /** The elements of {@code top}'s {@code resources}, a non-empty array; empty after reporting anything else. */
  List<Entry> parse(Fields top) {
    List<Entry> out = new ArrayList<>();
    ArrayNode a = top.array("resources", true);
    if (a == null) {
      return out;
    }
    String path = top.path("resources");
    if (a.isEmpty()) {
      p.add(path, "must list at least one resource (omit the field for one observer)", "[]");
    }
    Map<String, Integer> firstIndex = new HashMap<>();
    for (int i = 0; i < a.size(); i++) {
      JsonNode n = a.get(i);
      String label = RequestParser.label(path, i, n);
      Fields f = Fields.of(n, label, p, RESOURCE);
      if (f == null) {
        continue;
      }
      int before = p.count();
      String id = f.get("id", true) == null ? null : Values.id(n.get("id"), f.path("id"), p);
      if (id != null && firstIndex.putIfAbsent(id, i) != null) {
        p.add(f.path("id"), "duplicate resource id, already used by " + path + "[" + firstIndex.get(id) + "]", id);
      }
      out.add(resource(f, id, label, before));
    }
    return out;
  }

  private Entry resource(Fields f, String id, String label, int before) {
    ObserverParser observers = new ObserverParser(p, horizon);
    ObserverParser.Read observer = observers.observer(f);
    ConstraintOverrides own = new ConstraintsParser(p).overrides(f,
        List.of(new ConstraintsParser.Inherited(scenarioConstraints, ConstraintsParser.FROM_SCENARIO)));
    SlewSettings slew = new SlewParser(p, observer.kind(), requestCount).parse(f);
    Pointing startPointing = observers.startPointing(f, observer.kind(), slew);
    Reconfiguration reconfiguration = f.has("reconfiguration") ? new StructureParser(p).reconfiguration(f) : null;
    ObserverView view = id == null ? null
        : new ObserverView(id, observer.kind(), scenarioConstraints.overriddenBy(own));
    Resource r = p.count() != before ? null
        : new Resource(id, observer.observer(), slew, startPointing, own, reconfiguration);
    return new Entry(label, view, r);
  }
}
