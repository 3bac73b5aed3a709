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
 * The validator's 1 ms tolerance ({@link PlanValidator#TOLERANCE_S}) on each time comparison, from both
 * sides: 0.9 ms short is accepted, 1.1 ms short is rejected (transition gaps, reported slew seconds,
 * durations, window edges, the horizon start). One request R1 (100 s, priority 2), window [0, 500] s, 10 s
 * from the start pointing; R2 (50 s), 20 s from R1.
 */
class PlanValidatorToleranceTest {
  private static final Instant T0 = Instant.parse("2031-05-04T18:00:00Z");
  private static final List<Request> REQUESTS = List.of(
      new Request("R1", null, 100.0, 2.0, false, List.of(), null),
      new Request("R2", null, 50.0, 3.0, false, List.of(), null));
  private static final List<RequestWindows> WINDOWS = List.of(
      new RequestWindows("R1", List.of(new TimeWindow(T0, T0.plusSeconds(500)))),
      new RequestWindows("R2", List.of(new TimeWindow(T0, T0.plusSeconds(500)))));
  private static final PlanValidator VALIDATOR = NoObserver.validator(new TimeWindow(T0, T0.plusSeconds(1000)),
      REQUESTS, WINDOWS, new double[][] {{0, 20}, {20, 0}}, new double[] {10, 10});

  private static Instant at(double s) {
    return T0.plusNanos(Math.round(s * 1e9));
  }

  private static List<String> check(double start1, double end1, double slew1, double start2, double end2, double slew2) {
    Observation a = Observation.of("R1", at(start1), at(end1), slew1);
    Observation b = Observation.of("R2", at(start2), at(end2), slew2);
    return VALIDATOR.violations(new Timeline(PlanStatus.FEASIBLE, 5, slew1 + slew2, null, List.of(a, b), List.of()));
  }

  @Test
  void validPlanAndTheToleranceOnTheGap() {
    assertEquals(List.of(), check(10, 110, 10, 130, 180, 20));
    assertEquals(List.of(), check(10, 110, 10, 129.9991, 179.9991, 20));
    List<String> v = check(10, 110, 10, 129.9989, 179.9989, 20);
    assertEquals(1, v.size(), v.toString());
    assertTrue(v.get(0).contains("shorter than the slew 20.000 s"), v.get(0));
  }

  @Test
  void toleranceFromTheHorizonStart() {
    assertEquals(List.of(), check(9.9991, 109.9991, 10, 130, 180, 20));
    assertTrue(check(9.9989, 109.9989, 10, 130, 180, 20).stream().anyMatch(s -> s.contains("gap after the start pointing")));
  }

  @Test
  void toleranceOnReportedSlewSecondsAndDuration() {
    assertEquals(List.of(), check(10, 110, 10, 130, 180, 20.0009));
    assertTrue(check(10, 110, 10, 130, 180, 20.0011).stream().anyMatch(s -> s.contains("slewSeconds")));
    assertEquals(List.of(), check(10, 110.0009, 10, 130.0009, 180.0009, 20));
    assertTrue(check(10, 110.0011, 10, 131, 181, 20).stream().anyMatch(s -> s.contains("lasts 100.001 s")));
  }

  @Test
  void toleranceOnTheWindowEdge() {
    // R2's window ends at 500 s: ending 0.9 ms after it is accepted, 1.1 ms after it is not.
    assertEquals(List.of(), check(10, 110, 10, 450.0009, 500.0009, 20));
    assertTrue(check(10, 110, 10, 450.0011, 500.0011, 20).stream().anyMatch(s -> s.contains("inside none of the request's own windows")));
  }
}
