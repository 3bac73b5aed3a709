package dev.sequencer.planner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.sequence.Note;
import dev.sequencer.sequence.SequencerOptions;
import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * The planner on scenarios of every kind a user writes ({@link FuzzScenarios}) spread over 2–3 resources
 * ({@link FuzzScenarios#withResources}: a network of ground sites, twin spacecraft, tables without an
 * observer), with random required requests, some requests restricted to one resource, short time limits:
 * through the façade, so every returned plan has passed the independent validator per resource. Each try
 * checks that greedy and CP-SAT return plans when the required requests come from a first plan, that CP-SAT
 * is never below greedy, that each request is observed at most once and only by a resource that may observe
 * it, and that every required request is in the plan; then re-plans CP-SAT's plan at a random instant with
 * random done and failed observations, one resource lost one time in two
 * ({@link PlannerFuzzProperties#replan}).
 */
class ResourcesFuzzProperties {
  private static final AstroContext CTX = AstroContext.offline();

  /** One try's settings. */
  record Try(FuzzScenarios.Kind kind, long seed, double timeLimitS, int workers) {}

  @Provide
  Arbitrary<Try> tries() {
    return Combinators.combine(Arbitraries.of(FuzzScenarios.Kind.class), Arbitraries.longs().between(1, 1_000_000),
        Arbitraries.integers().between(1, 3), Arbitraries.integers().between(1, 2))
        .as((k, s, t, w) -> new Try(k, s, t, w));
  }

  @Property(tries = 18, shrinking = net.jqwik.api.ShrinkingMode.OFF)
  void plansOnSeveralResourcesAreValidAndNeverBelowGreedy(@ForAll("tries") Try t) {
    check(t);
  }

  static void check(Try t) {
    Random rnd = new Random(t.seed());
    Scenario plain = FuzzScenarios.withResources(FuzzScenarios.generate(t.kind(), t.seed(), CTX), rnd);
    SequencerOptions base = SequencerOptions.defaults().withTimeLimitS(t.timeLimitS()).withWorkers(t.workers());
    PlanOutcome first = Planner.plan(plain, CTX, base.withSolver(SequencerOptions.Solver.GREEDY));
    List<String> inFirst = first.timeline().observations().stream().map(Observation::id).toList();
    Scenario s = FuzzScenarios.withRequired(plain, inFirst, new Random(t.seed() + 17));
    String what = t + ": " + FuzzScenarios.describe(s) + ", required "
        + s.requests().stream().filter(Request::required).map(Request::id).toList();
    PlanOutcome greedy = Planner.plan(s, CTX, base.withSolver(SequencerOptions.Solver.GREEDY));
    PlanOutcome cp = Planner.plan(s, CTX, base);
    boolean exists = s.requests().stream().filter(Request::required).allMatch(q -> inFirst.contains(q.id()));
    for (PlanOutcome o : exists ? List.of(greedy, cp) : List.<PlanOutcome>of()) {
      assertTrue(o.result().hasPlan() || o.result().stats().has(Note.Kind.BASELINE_CUT), what + ": the first plan "
          + inFirst + " holds every required request, but " + o.result().status() + " " + o.result().message());
    }
    if (greedy.result().hasPlan() && !cp.result().stats().has(Note.Kind.BASELINE_CUT)) {
      assertTrue(cp.result().hasPlan(), what + ": greedy has a plan, CP-SAT " + cp.result().status());
      assertTrue(cp.result().totalPriority() >= greedy.result().totalPriority() - 1e-6, what + ": priority "
          + cp.result().totalPriority() + " below greedy's " + greedy.result().totalPriority());
    }
    for (PlanOutcome o : List.of(greedy, cp)) {
      Set<String> seen = new HashSet<>();
      for (Observation ob : o.timeline().observations()) {
        assertTrue(seen.add(ob.id()), what + ": " + ob.id() + " observed twice");
        Request q = s.request(ob.id()).orElseThrow();
        assertTrue(ob.resource() != null && q.allows(ob.resource()), what + ": " + ob.id() + " on " + ob.resource());
      }
      if (o.result().hasPlan()) {
        for (Request q : s.requests()) {
          assertTrue(!q.required() || seen.contains(q.id()), what + ": required " + q.id() + " missing");
        }
        assertEquals(s.requests().size(), seen.size() + o.timeline().unscheduled().size(), what + ": every request "
            + "observed or listed");
      }
    }
    if (cp.result().hasPlan()) {
      PlannerFuzzProperties.replan(s, cp.timeline(), base, new Random(t.seed() + 29), what);
    }
  }
}
