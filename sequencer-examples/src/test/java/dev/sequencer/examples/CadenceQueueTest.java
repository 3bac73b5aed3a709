package dev.sequencer.examples;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Group;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.sequence.SequencerOptions;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The bundled cadence queue (format additions A4, A5: four fields with three visits 40 min to 3 h apart,
 * two of them all or nothing; two calibration chains CAL–science–CAL, ordered, all or nothing, at most
 * 10 min apart; a pair; three grism configurations with a change-time table) planned end to end with the
 * work limits, greedy and CP-SAT: the façade's independent validator passed (it throws otherwise), and the
 * plan uses what the file asks for. (At these work limits neither planner completes a calibration chain:
 * greedy does not look ahead to a chain's last member, and CP-SAT needs longer; the chains' order and
 * all-or-nothing rule are asserted whenever a member is planned.)
 */
class CadenceQueueTest {
  private static final String SCENARIO = "/scenarios/cadence-queue-night.json";
  private static final AstroContext CTX = AstroContext.offline();

  private static Embedding.Outcome plan(SequencerOptions.Solver solver, double units) {
    Scenario s = Embedding.bundled(SCENARIO);
    return Embedding.plan(s, CTX, Embedding.quick(s, units).withReproducible(units).withSolver(solver));
  }

  private static void assertUsesTheRules(Embedding.Outcome o) {
    assertTrue(o.result().hasPlan(), o.result().status() + " " + o.result().message());
    assertTrue(o.result().stats().phaseS().containsKey("check"), "the façade ran the independent validator");
    Scenario s = o.scenario();
    List<Observation> obs = o.timeline().observations();
    long third = obs.stream().filter(x -> Integer.valueOf(3).equals(x.visit())).count();
    assertTrue(third >= 2, "at least two fields get all three visits: " + obs);
    for (Request r : s.requests()) {
      long n = obs.stream().filter(x -> x.id().equals(r.id())).count();
      if (r.hasVisits() && n > 0 && n < r.visits().count()) {
        Unscheduled u = o.timeline().unscheduled().stream().filter(x -> x.id().equals(r.id())).findFirst().orElseThrow();
        assertEquals(r.visits().count() - n, (long) u.visitsMissing());
      }
    }
    for (Group g : s.groups()) {
      List<Observation> members = obs.stream().filter(x -> g.members().contains(x.id())).toList();
      assertTrue(members.isEmpty() || members.size() == g.members().size(), g.id() + " is all or nothing: " + members);
      if (g.ordered() && !members.isEmpty()) {
        assertEquals(g.members(), members.stream().map(Observation::id).toList(), g.id() + " in order");
      }
    }
    assertTrue(o.timeline().priority() >= 120, "priority " + o.timeline().priority() + " of 151 asked");
  }

  @Test
  void greedyPlansTheCadenceQueue() {
    assertUsesTheRules(plan(SequencerOptions.Solver.GREEDY, 5));
  }

  @Test
  void cpSatPlansTheCadenceQueueAtLeastAsWellAsGreedy() {
    Embedding.Outcome greedy = plan(SequencerOptions.Solver.GREEDY, 5);
    Embedding.Outcome cp = plan(SequencerOptions.Solver.CPSAT, 5);
    assertUsesTheRules(cp);
    assertTrue(cp.timeline().priority() >= greedy.timeline().priority(), "CP-SAT starts from greedy's plan");
  }
}
