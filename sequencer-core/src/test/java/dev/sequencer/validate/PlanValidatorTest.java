package dev.sequencer.validate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Hand-made timelines on three requests: R1 (100 s, priority 2, required), R2 (50 s, priority 3),
 * R3 (60 s, priority 1). Transitions: 10 s from the start pointing to anything, table below between
 * requests. The valid plan is R1 at 10 s, R2 at 130 s (R1 ends 110 + 20 s), R3 unscheduled.
 */
class PlanValidatorTest {
  private static final Instant T0 = Instant.parse("2031-05-04T18:00:00Z");
  private static final List<Request> REQUESTS = List.of(
      new Request("R1", null, 100.0, 2.0, true, List.of(), null),
      new Request("R2", null, 50.0, 3.0, false, List.of(), null),
      new Request("R3", null, 60.0, 1.0, false, List.of(), null));
  private static final List<RequestWindows> WINDOWS = List.of(
      new RequestWindows("R1", List.of(win(0, 500))),
      new RequestWindows("R2", List.of(win(100, 300))),
      new RequestWindows("R3", List.of(win(0, 1000))));
  private static final PlanValidator VALIDATOR = NoObserver.validator(new TimeWindow(T0, T0.plusSeconds(1000)),
      REQUESTS, WINDOWS, new double[][] {{0, 20, 30}, {25, 0, 15}, {35, 15, 0}}, new double[] {10, 10, 10});

  private static TimeWindow win(long a, long b) {
    return new TimeWindow(T0.plusSeconds(a), T0.plusSeconds(b));
  }

  private static Observation obs(String id, long start, long dur, double slew) {
    return Observation.of(id, T0.plusSeconds(start), T0.plusSeconds(start + dur), slew);
  }

  private static Timeline timeline(double priority, double slew, Observation... o) {
    List<String> observed = java.util.Arrays.stream(o).map(Observation::id).toList();
    List<Unscheduled> un = REQUESTS.stream().map(Request::id).filter(id -> !observed.contains(id))
        .map(id -> new Unscheduled(id, "lost to conflicts")).toList();
    return new Timeline(PlanStatus.FEASIBLE, priority, slew, null, List.of(o), un);
  }

  private static void assertOneViolationContaining(Timeline t, String... fragments) {
    List<String> v = VALIDATOR.violations(t);
    assertEquals(1, v.size(), "violations: " + v);
    for (String f : fragments) {
      assertTrue(v.get(0).contains(f), "'" + v.get(0) + "' should contain '" + f + "'");
    }
  }

  @Test
  void validPlanHasNoViolations() {
    assertEquals(List.of(), VALIDATOR.violations(timeline(5, 30, obs("R1", 10, 100, 10), obs("R2", 130, 50, 20))));
  }

  @Test
  void overlapIsRejected() {
    // R2 at 100 s starts 10 s before R1 ends (110 s); the missing transition is reported too.
    List<String> v = VALIDATOR.violations(timeline(5, 30, obs("R1", 10, 100, 10), obs("R2", 100, 50, 20)));
    assertTrue(v.stream().anyMatch(s -> s.contains("R2") && s.contains("10.000 s before R1 ends")), v.toString());
  }

  @Test
  void missingTransitionIsRejected() {
    // Gap 10 s after R1 (ends 110 s), but R1 -> R2 takes 20 s.
    assertOneViolationContaining(timeline(5, 30, obs("R1", 10, 100, 10), obs("R2", 120, 50, 20)),
        "R2", "gap after R1 is 10.000 s", "shorter than the slew 20.000 s");
  }

  @Test
  void wrongSlewSecondsIsRejected() {
    assertOneViolationContaining(timeline(5, 29, obs("R1", 10, 100, 10), obs("R2", 130, 50, 19)),
        "R2", "slewSeconds is 19.000", "20.000 s");
  }

  @Test
  void outsideWindowIsRejected() {
    // R2's window is [100, 300] s; [260, 310] ends 10 s too late.
    assertOneViolationContaining(timeline(5, 30, obs("R1", 10, 100, 10), obs("R2", 260, 50, 20)),
        "R2", "lies inside none of the request's own windows");
  }

  @Test
  void missingRequiredIsRejected() {
    assertOneViolationContaining(timeline(3, 10, obs("R2", 100, 50, 10)), "required request R1 is not observed");
  }

  @Test
  void wrongPriorityTotalIsRejected() {
    assertOneViolationContaining(timeline(6, 30, obs("R1", 10, 100, 10), obs("R2", 130, 50, 20)),
        "total priority", "says 6.0", "sum to 5.0");
  }

  @Test
  void wrongSlewTotalIsRejected() {
    assertOneViolationContaining(timeline(5, 31, obs("R1", 10, 100, 10), obs("R2", 130, 50, 20)),
        "total slewSeconds", "31.000", "30.000");
  }

  @Test
  void wrongDurationIsRejected() {
    assertOneViolationContaining(timeline(5, 30, obs("R1", 10, 99, 10), obs("R2", 130, 50, 20)),
        "R1 lasts 99.000 s", "durationS is 100.000");
  }

  @Test
  void requestListedTwiceIsRejected() {
    Timeline t = new Timeline(PlanStatus.FEASIBLE, 2, 10, null, List.of(obs("R1", 10, 100, 10)),
        List.of(new Unscheduled("R1", "x"), new Unscheduled("R2", "x"), new Unscheduled("R3", "x")));
    assertOneViolationContaining(t, "R1 appears 2 times");
  }

}
