package dev.sequencer.examples;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.sequence.SequencerOptions;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The bundled several-resource examples (format addition A6: a two-site telescope network sharing one queue,
 * a station with two dishes sharing the passes of 60 objects), planned end to end with the work limits by
 * greedy (each resource in turn) and CP-SAT: the façade's independent validator passed per resource (it
 * throws otherwise), each request is observed at most once and only where it may be, both resources work,
 * at the same time, CP-SAT is not below greedy, and every "lost to conflicts" reason names observations on the
 * resource it names.
 */
class ResourceExamplesTest {
  private static final AstroContext CTX = AstroContext.offline();

  private static Embedding.Outcome plan(String file, SequencerOptions.Solver solver) {
    Scenario s = Embedding.bundled(file);
    return Embedding.plan(s, CTX, Embedding.quick(s, 5).withReproducible(5).withSolver(solver));
  }

  @ParameterizedTest
  @ValueSource(strings = {"/scenarios/network-two-sites-night.json", "/scenarios/station-two-antennas-night.json"})
  void bothResourcesShareTheQueueAndCpSatIsNotBelowGreedy(String file) {
    Embedding.Outcome greedy = plan(file, SequencerOptions.Solver.GREEDY);
    Embedding.Outcome cp = plan(file, SequencerOptions.Solver.CPSAT);
    for (Embedding.Outcome o : List.of(greedy, cp)) {
      assertTrue(o.result().hasPlan(), o.result().status() + " " + o.result().message());
      assertTrue(o.result().stats().phaseS().containsKey("check"), "the façade ran the independent validator");
      Scenario s = o.scenario();
      Set<String> seen = new HashSet<>();
      Set<String> used = new HashSet<>();
      for (Observation ob : o.timeline().observations()) {
        assertTrue(seen.add(ob.id()), ob.id() + " observed twice");
        Request r = s.request(ob.id()).orElseThrow();
        assertTrue(r.allows(ob.resource()), ob.id() + " on " + ob.resource() + ", allowed " + r.resources());
        used.add(ob.resource());
      }
      assertEquals(2, used.size(), "both resources observe: " + used);
      for (Request r : s.requests()) {
        assertTrue(!r.required() || seen.contains(r.id()), "required " + r.id() + " is planned");
      }
      assertTrue(sameTime(o.timeline().observations()), "the two resources observe at the same time");
      // The network holds more fields than its nights; the station loses passes to visibility only.
      assertReasonsNameObservationsOnTheirResource(o.timeline(), file.contains("network"));
    }
    assertTrue(cp.timeline().priority() >= greedy.timeline().priority() - 1e-9, "CP-SAT " + cp.timeline().priority()
        + " below greedy's " + greedy.timeline().priority());
  }

  /**
   * "lost to conflicts: on R its windows are taken by A, B and 3 more; on S …": every named request is
   * observed on the resource named before it (request ids, not the planner's per-resource task names).
   */
  private static void assertReasonsNameObservationsOnTheirResource(Timeline t, boolean someLost) {
    Map<String, String> where = new HashMap<>();
    t.observations().forEach(o -> where.put(o.id(), o.resource()));
    Pattern part = Pattern.compile("on (\\S+) its windows are taken by ([^;]+)");
    int named = 0;
    for (Unscheduled u : t.unscheduled()) {
      assertTrue(!u.reason().contains("@"), u.id() + ": " + u.reason());
      Matcher m = part.matcher(u.reason());
      while (m.find()) {
        for (String id : m.group(2).replaceAll(" and \\d+ more$", "").split(", ")) {
          assertEquals(m.group(1), where.get(id.trim()), u.id() + ": " + u.reason());
          named++;
        }
      }
    }
    assertTrue(!someLost || named > 0, "requests are lost to conflicts on named resources: " + t.unscheduled());
  }

  private static boolean sameTime(List<Observation> obs) {
    for (Observation a : obs) {
      for (Observation b : obs) {
        if (!a.resource().equals(b.resource()) && a.start().isBefore(b.end()) && b.start().isBefore(a.end())) {
          return true;
        }
      }
    }
    return false;
  }
}
