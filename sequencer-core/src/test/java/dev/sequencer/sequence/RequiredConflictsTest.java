package dev.sequencer.sequence;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Reasons;
import dev.sequencer.slew.Transitions;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Explanations of impossible required sets on hand-built problems (times in seconds from T0). */
class RequiredConflictsTest {
  private static final Instant T0 = Instant.parse("2031-05-04T18:00:00Z");
  private static final TimeWindow HORIZON = win(0, 10_000);

  private static TimeWindow win(double a, double b) {
    return new TimeWindow(T0.plusMillis((long) (a * 1000)), T0.plusMillis((long) (b * 1000)));
  }

  /** Request id with duration, required flag and one window [a, b] (no window when a < 0). */
  private record R(String id, double durS, boolean required, double a, double b) {}

  private static PlanningProblem problem(Transitions tr, R... rs) {
    List<Request> requests = new ArrayList<>();
    List<RequestWindows> windows = new ArrayList<>();
    for (R r : rs) {
      requests.add(new Request(r.id(), null, r.durS(), 1.0, r.required(), List.of(), null));
      if (r.a() >= 0) {
        windows.add(new RequestWindows(r.id(), List.of(win(r.a(), r.b()))));
      }
    }
    return PlanningProblem.of(HORIZON, requests, windows, tr);
  }

  private static RequiredConflicts.Explanation explain(PlanningProblem p) {
    return RequiredConflicts.explain(p, 5, 1, true);
  }

  @Test
  void neverVisibleAndTooShortAreNamedOneByOne() {
    PlanningProblem p = problem(Transitions.fixed(3, 0), new R("N", 60, true, -1, -1),
        new R("S", 60, true, 0, 50), new R("OK", 60, true, 100, 400));
    RequiredConflicts.Explanation e = explain(p);
    assertEquals(List.of(new RequiredConflicts.Conflict(List.of("N"), Reasons.NEVER_VISIBLE),
        new RequiredConflicts.Conflict(List.of("S"), Reasons.WINDOWS_TOO_SHORT)), e.conflicts());
    assertEquals("required request N cannot be scheduled: never visible; required request S cannot be scheduled: "
        + "windows shorter than its duration", e.message());
  }

  @Test
  void startPointingTooFarIsAReasonOnItsOwn() {
    // From the start pointing the table says 500 s; the only window closes at 300 s (latest start 200 s).
    PlanningProblem p = problem(Transitions.matrix(new double[][] {{0}}, new double[] {500}),
        new R("FAR", 100, true, 0, 300));
    RequiredConflicts.Explanation e = explain(p);
    assertEquals(1, e.conflicts().size());
    assertEquals(List.of("FAR"), e.conflicts().get(0).ids());
    assertTrue(e.message().contains("the slew from the start pointing takes 500 s"), e.message());
  }

  @Test
  void twoOfFourRequiredOverlapAndOnlyTheyAreNamed() {
    // A and B: 100 s each, both only in [1000, 1150]: 200 s of work in 150 s. C and D fit anywhere later.
    PlanningProblem p = problem(Transitions.fixed(4, 5), new R("C", 100, true, 2000, 9000),
        new R("A", 100, true, 1000, 1150), new R("D", 100, true, 2000, 9000), new R("B", 100, true, 1000, 1150));
    RequiredConflicts.Explanation e = explain(p);
    assertTrue(e.minimal());
    assertEquals(1, e.conflicts().size());
    assertEquals(List.of("A", "B"), e.conflicts().get(0).ids());
    assertTrue(e.message().startsWith("required requests A, B cannot all be scheduled: mutual overlap"), e.message());
    assertTrue(e.message().contains("A needs 100 s within 2031-05-04T18:16:40Z .. 2031-05-04T18:19:10Z"),
        e.message());
  }

  @Test
  void everyPairFitsButTheTripleDoesNot() {
    // 3 x 100 s in [0, 250] with 5 s slews: any two need 205 s (fit), all three 310 s (do not).
    PlanningProblem p = problem(Transitions.fixed(3, 5), new R("A", 100, true, 0, 250),
        new R("B", 100, true, 0, 250), new R("C", 100, true, 0, 250));
    RequiredConflicts.Explanation e = explain(p);
    assertEquals(List.of("A", "B", "C"), e.conflicts().get(0).ids());
    assertTrue(e.minimal());
  }

  @Test
  void theSlewAloneMakesThePairImpossible() {
    // A: 50 s in [0, 100]; B: 100 s in [0, 200]. With no slew A then B fits (0-50, 50-150); with 60 s
    // slews neither order does: A, B ends at 50 + 60 + 100 = 210 > 200; B, A starts A at 160 > 50.
    R a = new R("A", 50, true, 0, 100);
    R b = new R("B", 100, true, 0, 200);
    assertEquals(List.of(), explain(problem(Transitions.fixed(2, 0), a, b)).conflicts());
    RequiredConflicts.Explanation e = explain(problem(
        Transitions.matrix(new double[][] {{0, 60}, {60, 0}}, new double[] {0, 0}), a, b));
    assertEquals(List.of("A", "B"), e.conflicts().get(0).ids());
  }

  @Test
  void optionalRequestsAreNeverBlamed() {
    PlanningProblem p = problem(Transitions.fixed(3, 0), new R("A", 100, true, 0, 150),
        new R("X", 100, false, 0, 150), new R("B", 100, true, 0, 150));
    assertEquals(List.of("A", "B"), explain(p).conflicts().get(0).ids());
  }

  @Test
  void sequencerCarriesTheConflictsOfAnInfeasibleResult() {
    PlanningProblem p = problem(Transitions.fixed(4, 5), new R("C", 100, true, 2000, 9000),
        new R("A", 100, true, 1000, 1150), new R("D", 100, false, 2000, 9000), new R("B", 100, true, 1000, 1150));
    SequencerResult r = new Sequencer().plan(p, SequencerOptions.defaults().withTimeLimitS(5).withWorkers(1));
    assertEquals(PlanStatus.INFEASIBLE, r.status());
    assertEquals(1, r.conflicts().size());
    assertEquals(List.of("A", "B"), r.conflicts().get(0).ids());
    assertTrue(r.message().startsWith("CP-SAT proved that the required requests cannot all be scheduled; "
        + "required requests A, B cannot all be scheduled: mutual overlap"), r.message());
  }

  @Test
  void sequencerNamesEveryRequiredRequestWithoutWindows() {
    PlanningProblem p = problem(Transitions.fixed(3, 5), new R("N1", 100, true, -1, -1),
        new R("OK", 100, true, 0, 900), new R("N2", 100, true, -1, -1));
    SequencerResult r = new Sequencer().plan(p, SequencerOptions.defaults().withTimeLimitS(5).withWorkers(1));
    assertEquals(PlanStatus.INFEASIBLE, r.status());
    assertEquals(List.of(List.of("N1"), List.of("N2")), r.conflicts().stream().map(c -> c.ids()).toList());
  }
}
