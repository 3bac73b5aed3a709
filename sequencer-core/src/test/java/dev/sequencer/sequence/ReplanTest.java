package dev.sequencer.sequence;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.io.ScenarioException;
import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Timeline;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.StartRange;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.replan.ReplanOptions;
import dev.sequencer.sequence.replan.ReplanResult;
import dev.sequencer.sequence.replan.Replanner;
import dev.sequencer.slew.Transitions;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** Re-planning: frozen history, nothing before now, the tail as warm start and fallback, failed and new requests. */
class ReplanTest {
  private static final SequencerOptions FAST = SequencerOptions.defaults().withTimeLimitS(2).withWorkers(2);
  private static final Instant T0 = Instant.parse("2031-05-04T20:00:00Z");

  private static Timeline plan(PlanningProblem p, SequencerOptions o) {
    SequencerResult r = new Sequencer().plan(p, o);
    assertTrue(r.hasPlan(), r.message());
    return r.toTimeline();
  }

  private static ReplanResult replan(PlanningProblem p, Timeline previous, Instant now, Set<String> done,
      Set<String> failed, ReplanOptions o) {
    ReplanResult r = new Replanner().replan(p, previous, now, done, failed, o);
    if (r.hasPlan()) {
      List<String> v = new SelfCheck(p.horizon(), p.requests(), p.windows(), p.transitions()).withNow(now)
          .violations(r.timeline());
      assertEquals(List.of(), v, "every re-plan passes the validator");
    }
    return r;
  }

  private static List<Observation> planned(Timeline t) {
    return t.observations().stream().filter(o -> Observation.PLANNED.equals(o.state())).toList();
  }

  private static List<String> ids(List<Observation> obs) {
    return obs.stream().map(Observation::id).toList();
  }

  /** Tasks with one window each over a fixed 30 s transition. */
  private static PlanningProblem fixed(long horizonS, Task... tasks) {
    return PlanningProblem.ofTasks(T0, horizonS, List.of(tasks), Transitions.fixed(tasks.length, 30));
  }

  private static Task task(String id, long dur, double prio, long from, long to) {
    return Task.fixed(id, dur, prio, false, List.of(new StartRange(from, to)));
  }

  @Test
  void noChangeReproducesTheRemainingTailInOrderAndTime() {
    PlanningProblem p = NightScenario.generate(12, 3);
    SequencerResult first = new Sequencer().plan(p, FAST);
    assertEquals(PlanStatus.OPTIMAL, first.status(), "precondition: an optimal previous plan");
    Timeline prev = first.toTimeline();
    // (a) now = horizon start, nothing done; (b) now = end of the 3rd observation, the first 3 done.
    for (int doneCount : new int[] {0, 3}) {
      Instant now = doneCount == 0 ? T0 : prev.observations().get(doneCount - 1).end();
      ReplanResult r = replan(p, prev, now, Set.of(), Set.of(), ReplanOptions.defaults().withSequencer(FAST));
      List<Observation> tail = prev.observations().subList(doneCount, prev.observations().size());
      assertEquals(ids(tail), ids(planned(r.timeline())), "same requests, same order");
      for (int k = 0; k < tail.size(); k++) {
        assertEquals(tail.get(k).start(), planned(r.timeline()).get(k).start(), tail.get(k).id());
      }
      assertEquals(tail.size(), r.keptRequests());
      assertEquals(tail.size(), r.keptArcs());
      assertEquals(r.tailPriority(), r.newPriority(), 1e-9);
    }
  }

  @Test
  void frozenPartIsUnchangedAndNothingStartsBeforeNowOrTheRunningEnd() {
    PlanningProblem p = NightScenario.generate(40, 11);
    Timeline prev = plan(p, FAST.withSolver(SequencerOptions.Solver.GREEDY));
    Observation running = prev.observations().get(5);
    Instant now = running.start().plusSeconds(60);
    String failed = prev.observations().get(3).id();
    ReplanResult r = replan(p, prev, now, Set.of(), Set.of(failed), ReplanOptions.defaults().withSequencer(FAST));
    List<Observation> obs = r.timeline().observations();
    List<Observation> before = new ArrayList<>(prev.observations().subList(0, 6));
    before.remove(3);
    for (int k = 0; k < before.size(); k++) {
      Observation a = before.get(k);
      Observation b = obs.get(k);
      assertEquals(List.of(a.id(), a.start(), a.end(), a.slewSeconds()), List.of(b.id(), b.start(), b.end(),
          b.slewSeconds()), "frozen observation " + k);
      assertEquals(k == 4 ? Observation.RUNNING : Observation.DONE, b.state(), b.id());
    }
    assertEquals(running.end(), r.departure());
    for (Observation o : planned(r.timeline())) {
      assertFalse(o.start().isBefore(running.end()), o.id() + " starts before the running observation ends");
    }
    Observation first = planned(r.timeline()).get(0);
    assertTrue(first.slewSeconds() > 0, "first leg departs from the running observation's pointing");
    assertFalse(first.start().isBefore(running.end().plusMillis((long) (first.slewSeconds() * 1000))),
        "first start >= running end + its transition");
  }

  @Test
  void failedRequestIsRetriedOrDroppedPerOption() {
    PlanningProblem p = fixed(14_400, task("A", 600, 5, 0, 13_000), task("B", 600, 3, 0, 13_000),
        task("C", 600, 1, 0, 13_000));
    Timeline prev = plan(p, FAST);
    Observation firstObs = prev.observations().get(0);
    Instant now = firstObs.end();
    ReplanResult retry = replan(p, prev, now, Set.of(), Set.of(firstObs.id()), ReplanOptions.defaults()
        .withSequencer(FAST));
    assertTrue(ids(planned(retry.timeline())).contains(firstObs.id()), "retried while still visible");
    assertEquals(9.0, retry.timeline().priority(), 1e-9);
    ReplanResult drop = replan(p, prev, now, Set.of(), Set.of(firstObs.id()), ReplanOptions.defaults()
        .withSequencer(FAST).withDropFailed(true));
    assertFalse(ids(drop.timeline().observations()).contains(firstObs.id()));
    assertTrue(drop.timeline().unscheduled().stream()
        .anyMatch(u -> u.id().equals(firstObs.id()) && u.reason().equals(Replanner.FAILED_DROPPED)));
  }

  @Test
  void newRequestOfTheScenarioIsConsidered() {
    Task a = task("A", 600, 2, 0, 13_000);
    Task b = task("B", 600, 2, 0, 13_000);
    Task urgent = task("URGENT", 900, 50, 7_200, 9_000);
    Timeline prev = plan(fixed(14_400, a, b), FAST);
    PlanningProblem now = fixed(14_400, a, b, urgent);
    ReplanResult r = replan(now, prev, T0.plusSeconds(3_600), Set.of(), Set.of(), ReplanOptions.defaults()
        .withSequencer(FAST));
    assertTrue(ids(planned(r.timeline())).contains("URGENT"), r.timeline().toString());
  }

  @Test
  void largeNightReachesTheTailPriorityWithTheTailAsWarmStart() {
    // 200 requests; the previous plan is CP-SAT's after 2 s; re-plan after 10 done observations with 2 s.
    PlanningProblem p = NightScenario.generate(200, 7);
    Timeline prev = plan(p, FAST);
    Instant now = prev.observations().get(9).end();
    ReplanResult r = replan(p, prev, now, Set.of(), Set.of(), ReplanOptions.defaults().withSequencer(FAST));
    assertTrue(r.newPriority() >= r.tailPriority() - 1e-9, r.newPriority() + " < tail " + r.tailPriority());
    assertTrue(r.notes().contains("warm start: the given plan (" + (prev.observations().size() - 10)), r.notes());
  }

  @Test
  void tailIsTheFallbackWhenTheSolverPlanIsWorse() {
    // Y (priority 10, 3000 s) and X (3, 600 s) can both only start in [0, 100] s: CP-SAT plans Y; greedy takes X
    // first (3 / 630 s beats 10 / 3030 s per second used) and then Y no longer fits. Without warm start the
    // greedy re-plan collects 3, so the re-plan must fall back to the previous tail [Y].
    PlanningProblem p = fixed(7_200, task("X", 600, 3, 0, 100), task("Y", 3_000, 10, 0, 100));
    Timeline prev = plan(p, FAST);
    assertEquals(List.of("Y"), ids(prev.observations()), "precondition");
    ReplanOptions o = ReplanOptions.defaults().withWarmStart(false).withStabilityWeight(0)
        .withSequencer(FAST.withSolver(SequencerOptions.Solver.GREEDY));
    ReplanResult r = replan(p, prev, T0, Set.of(), Set.of(), o);
    assertEquals(3.0, r.solverPriority(), 1e-9, "precondition: greedy alone takes X");
    assertEquals(ReplanResult.Source.PREVIOUS_TAIL, r.source());
    assertEquals(List.of("Y"), ids(planned(r.timeline())));
    // With warm start the sequencer itself starts from the tail: greedy mode then returns it too.
    ReplanResult warm = replan(p, prev, T0, Set.of(), Set.of(), o.withWarmStart(true));
    assertEquals(10.0, warm.solverPriority(), 1e-9);
  }

  @Test
  void stabilityWeightTradesPriorityForKeptRequests() {
    // Previous: A then B (priority 2 each, fixed 30 s slews). New request N (priority 3) can only start where B
    // does ([660, 700] s), so one of them: A + N = 5 beats A + B = 4 on priority. With weight 2 per unit of
    // stability, A + B scores 4 + 2 x (2 kept requests + 2 kept arcs START->A, A->B) = 12 against
    // A + N at 5 + 2 x (1 + 1) = 9: the previous plan is kept.
    Task a = task("A", 600, 2, 0, 40);
    Task b = task("B", 600, 2, 660, 700);
    Timeline prev = plan(fixed(3_600, a, b), FAST);
    assertEquals(List.of("A", "B"), ids(prev.observations()), "precondition");
    PlanningProblem now = fixed(3_600, a, b, task("N", 600, 3, 660, 700));
    ReplanResult off = replan(now, prev, T0, Set.of(), Set.of(), ReplanOptions.defaults().withSequencer(FAST)
        .withStabilityWeight(0));
    assertEquals(List.of("A", "N"), ids(planned(off.timeline())));
    ReplanResult on = replan(now, prev, T0, Set.of(), Set.of(), ReplanOptions.defaults().withSequencer(FAST)
        .withStabilityWeight(2));
    assertEquals(List.of("A", "B"), ids(planned(on.timeline())));
    ReplanResult lexicographic = replan(now, prev, T0, Set.of(), Set.of(), ReplanOptions.defaults()
        .withSequencer(FAST));
    assertEquals(List.of("A", "N"), ids(planned(lexicographic.timeline())), "priority comes first by default");
  }

  @Test
  void badIdsNameTheirField() {
    PlanningProblem p = fixed(3_600, task("A", 600, 2, 0, 600), task("B", 600, 2, 630, 1_300));
    Timeline prev = plan(p, FAST);
    ScenarioException e = assertThrows(ScenarioException.class,
        () -> new Replanner().replan(p, prev, T0.plusSeconds(700), Set.of("Z"), Set.of(), ReplanOptions.defaults()));
    assertEquals("done", e.path());
    assertTrue(e.getMessage().contains("\"Z\" is not an observation of the previous timeline"), e.getMessage());
    ScenarioException later = assertThrows(ScenarioException.class,
        () -> new Replanner().replan(p, prev, T0.plusSeconds(10), Set.of(), Set.of("B"), ReplanOptions.defaults()));
    assertEquals("failed", later.path());
  }
}
