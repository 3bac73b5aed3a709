package dev.sequencer.examples;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.sequence.SequencerOptions;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The bundled every-pass station night (format additions A4 with the flexible exposure: ten invented objects
 * wanted on every usable pass, up to four, each pass tracked from 2 up to 10 minutes with the value growing
 * with the time tracked — the objects of the tracking night with at least two windows of 2 min or more —;
 * twenty more on one pass), planned end to end with the work limits by greedy and
 * CP-SAT: the façade's validator passed (it throws otherwise), no two visits of one object share a pass
 * window (one per window), several objects get several passes, and the planner tracks some passes longer
 * than the minimum.
 */
class EveryPassStationTest {
  private static final AstroContext CTX = AstroContext.offline();

  @ParameterizedTest
  @EnumSource(value = SequencerOptions.Solver.class, names = {"GREEDY", "CPSAT"})
  void everyUsablePassIsTrackedOnceAndSomeLongerThanTheMinimum(SequencerOptions.Solver solver) {
    Scenario s = Embedding.bundled("/scenarios/station-every-pass-night.json");
    Embedding.Outcome o = Embedding.plan(s, CTX, Embedding.quick(s, 5).withReproducible(5).withSolver(solver));
    assertTrue(o.result().hasPlan(), o.result().status() + " " + o.result().message());
    int several = 0;
    boolean longer = false;
    for (Request r : s.requests().stream().filter(Request::hasVisits).toList()) {
      List<Observation> mine = o.timeline().observations().stream().filter(x -> x.id().equals(r.id())).toList();
      RequestWindows w = o.windows().stream().filter(x -> x.id().equals(r.id())).findFirst().orElseThrow();
      Set<Integer> passes = new HashSet<>();
      for (Observation x : mine) {
        int pass = -1;
        for (int i = 0; i < w.intervals().size(); i++) {
          TimeWindow t = w.intervals().get(i);
          if (!x.start().isBefore(t.start()) && !x.end().isAfter(t.end())) {
            pass = i;
          }
        }
        assertTrue(pass >= 0, r.id() + ": " + x + " inside one of its windows " + w.intervals());
        assertTrue(passes.add(pass), r.id() + ": two visits in window " + pass + ": " + mine);
        longer |= x.durationS() > r.flexible().minDurationS();
      }
      several += mine.size() >= 2 ? 1 : 0;
    }
    assertTrue(several >= 3, solver + ": at least three objects tracked on several passes, got " + several);
    assertTrue(longer, solver + ": some pass tracked longer than the 2-minute minimum");
  }
}
