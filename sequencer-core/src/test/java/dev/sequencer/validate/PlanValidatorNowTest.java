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
 * The re-planning instant check ({@link PlanValidator#withNow}) on a hand-made valid plan: R1 [10, 110] s
 * (10 s from the start pointing), R2 [130, 180] s (20 s from R1); R3 unscheduled.
 */
class PlanValidatorNowTest {
  private static final Instant T0 = Instant.parse("2031-05-04T18:00:00Z");
  private static final PlanValidator VALIDATOR = NoObserver.validator(new TimeWindow(T0, T0.plusSeconds(1000)),
      List.of(new Request("R1", null, 100.0, 2.0, false, List.of(), null),
          new Request("R2", null, 50.0, 3.0, false, List.of(), null),
          new Request("R3", null, 60.0, 1.0, false, List.of(), null)),
      List.of(new RequestWindows("R1", List.of(new TimeWindow(T0, T0.plusSeconds(500)))),
          new RequestWindows("R2", List.of(new TimeWindow(T0.plusSeconds(100), T0.plusSeconds(300))))),
      new double[][] {{0, 20, 30}, {25, 0, 15}, {35, 15, 0}}, new double[] {10, 10, 10});

  private static Timeline plan(String r1State, String r2State) {
    return new Timeline(PlanStatus.FEASIBLE, 5, 30, null,
        List.of(new Observation("R1", T0.plusSeconds(10), T0.plusSeconds(110), 10, null, r1State),
            new Observation("R2", T0.plusSeconds(130), T0.plusSeconds(180), 20, null, r2State)),
        List.of(new Unscheduled("R3", "lost to conflicts")));
  }

  @Test
  void doneBeforeAndPlannedAfterNowIsValid() {
    assertEquals(List.of(), VALIDATOR.withNow(T0.plusSeconds(120)).violations(plan("done", "planned")));
    assertEquals(List.of(), VALIDATOR.withNow(T0.plusSeconds(130)).violations(plan("done", null)));
  }

  @Test
  void plannedObservationBeforeNowIsRejected() {
    List<String> v = VALIDATOR.withNow(T0.plusSeconds(131)).violations(plan("done", "planned"));
    assertEquals(1, v.size(), v.toString());
    assertTrue(v.get(0).contains("R2 is planned but starts at 2031-05-04T18:02:10Z, before now"), v.get(0));
  }

  @Test
  void runningObservationAfterNowIsRejected() {
    List<String> v = VALIDATOR.withNow(T0.plusSeconds(5)).violations(plan("running", null));
    assertEquals(1, v.size(), v.toString());
    assertTrue(v.get(0).contains("R1 is running but starts at"), v.get(0));
  }

  @Test
  void withoutNowStatesAreNotChecked() {
    assertEquals(List.of(), VALIDATOR.violations(plan("planned", "done")));
  }
}
