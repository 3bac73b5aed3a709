package dev.sequencer.examples;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.sequence.SequencerOptions;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The bundled several-resource examples (format addition A6: a two-site telescope network sharing one queue,
 * a station with two dishes sharing the passes of 60 objects), planned end to end with the work limits by
 * greedy (each resource in turn) and CP-SAT: the façade's independent validator passed per resource (it
 * throws otherwise), each request is observed at most once and only where it may be, both resources work,
 * at the same time, and CP-SAT is not below greedy.
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
    }
    assertTrue(cp.timeline().priority() >= greedy.timeline().priority() - 1e-9, "CP-SAT " + cp.timeline().priority()
        + " below greedy's " + greedy.timeline().priority());
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
