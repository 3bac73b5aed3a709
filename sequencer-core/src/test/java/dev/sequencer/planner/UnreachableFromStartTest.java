package dev.sequencer.planner;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.problem.Reasons;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * A request no first slew can reach is not "lost to conflicts" when the plan is empty: nothing in the plan
 * took its time. Hand-made: two requests visible in the first hour, a slew table whose start row needs two
 * hours; so no plan holds either, and the reason says why.
 */
class UnreachableFromStartTest {
  @Test
  void anEmptyPlanNamesTheFirstSlewNotConflicts() {
    Instant t0 = Instant.parse("2031-05-01T00:00:00Z");
    TimeWindow horizon = new TimeWindow(t0, t0.plusSeconds(6 * 3600));
    List<TimeWindow> firstHour = List.of(new TimeWindow(t0, t0.plusSeconds(3600)));
    List<Request> requests = List.of(Request.of("A", null, 600, 3).withWindows(firstHour),
        Request.of("B", null, 600, 2).withWindows(firstHour));
    SlewSettings slew = new SlewSettings.Matrix(List.of(List.of(0.0, 30.0), List.of(30.0, 0.0)),
        List.of(7200.0, 7200.0));
    Scenario s = new Scenario(1, "unreachable from start", horizon, null, Constraints.none(), slew, null, requests,
        null);
    for (SequencerOptions.Solver solver : List.of(SequencerOptions.Solver.GREEDY, SequencerOptions.Solver.CPSAT)) {
      PlanOutcome o = Planner.plan(s, AstroContext.offline(), SequencerOptions.defaults().withSolver(solver)
          .withTimeLimitS(5).withWorkers(1));
      assertEquals(0, o.result().observations().size(), solver.toString());
      assertEquals(List.of(Reasons.UNREACHABLE_FROM_START, Reasons.UNREACHABLE_FROM_START),
          o.result().unscheduled().stream().map(Unscheduled::reason).toList(), solver.toString());
    }
  }
}
