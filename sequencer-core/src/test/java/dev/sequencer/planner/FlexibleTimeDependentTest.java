package dev.sequencer.planner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.sequence.SequencerOptions;
import java.util.List;
import java.util.Map;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Flexible exposures where the slews depend on time: an alt-az ground telescope (the mount follows the sky)
 * and a LEO telescope with the Earth-limb keep-out during slews (the limb moves with the orbit). Until
 * 2026-12-03 such scenarios were refused at input (exit 2); the CP-SAT model's time buckets now bound each
 * transition over every exposure the request may take. The verdict is the façade's independent validator
 * (its own slews, keep-outs along each slew path, the flexible grid and value curve): an invalid plan would
 * throw. The scenarios are the fuzz generator's (invented sites, orbits and fields).
 */
class FlexibleTimeDependentTest {
  private static final AstroContext CTX = AstroContext.offline();

  @ParameterizedTest(name = "{0} seed {1}")
  @CsvSource({"GROUND_FIELDS_ALTAZ, 9", "GROUND_FIELDS_ALTAZ, 4", "LEO_TLE_FIELDS, 6", "LEO_TLE_FIELDS, 8"})
  void flexibleRequestsPlanWithTimeDependentSlews(FuzzScenarios.Kind kind, long seed) {
    Scenario s = FuzzScenarios.generate(kind, seed, CTX);
    assertTrue(s.requests().stream().anyMatch(Request::isFlexible), "the scenario has flexible requests");
    SequencerOptions o = SequencerOptions.defaults().withWorkers(1).withSeed(1).withReproducible(3);
    PlanOutcome cp = Planner.plan(s, CTX, o);
    assertTrue(cp.geometry().transitions().timeDependent(), "the slews depend on time here");
    assertTrue(cp.result().hasPlan(), cp.result().status() + " " + cp.result().message());
    assertTrue(cp.result().stats().phaseS().containsKey("cp-sat"), cp.result().stats().phaseS().toString());
    Map<String, Request> byId = s.requests().stream().collect(Collectors.toMap(Request::id, Function.identity()));
    List<Observation> flexible = cp.timeline().observations().stream()
        .filter(x -> byId.get(x.id()).isFlexible()).toList();
    assertTrue(!flexible.isEmpty(), "some flexible request is observed: " + cp.timeline().observations());
    for (Observation x : flexible) {
      Request r = byId.get(x.id());
      assertTrue(x.durationS() >= r.flexible().minDurationS() - 1e-9
          && x.durationS() <= r.flexible().maxDurationS() + 1e-9, x.id() + " exposure " + x.durationS());
    }
    // The validator was run by the façade; running it again on the written timeline gives no violation.
    assertEquals(List.of(), Planner.validator(cp.geometry(), CTX).violations(cp.timeline()));
    PlanOutcome greedy = Planner.plan(s, CTX, o.withSolver(SequencerOptions.Solver.GREEDY));
    assertTrue(cp.result().totalPriority() >= greedy.result().totalPriority() - 1e-6,
        "CP-SAT " + cp.result().totalPriority() + " below greedy " + greedy.result().totalPriority());
  }
}
