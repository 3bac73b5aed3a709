package dev.sequencer.validate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.UtilityPoint;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The validator's checks of the flexible-exposure extension: grid exposure, value, totals. */
class FlexibleValidatorTest {
  private static final Instant T0 = Instant.parse("2031-05-04T18:00:00Z");
  // The spec's example curve: [[300, 1.0], [900, 2.2], [1800, 3.0], [3600, 3.4]], step 60 s.
  private static final FlexibleExposure CURVE = new FlexibleExposure(300, 3600, 60, List.of(
      new UtilityPoint(300, 1.0), new UtilityPoint(900, 2.2), new UtilityPoint(1800, 3.0),
      new UtilityPoint(3600, 3.4)));
  private final PlanValidator validator = NoObserver.validator(new TimeWindow(T0, T0.plusSeconds(7200)),
      List.of(new Request("R9", null, null, null, false, List.of(), CURVE)),
      List.of(new RequestWindows("R9", List.of(new TimeWindow(T0, T0.plusSeconds(7200))))), new double[][] {{0}},
      new double[] {0});

  private static Timeline timeline(double durationS, Double value, double total) {
    Observation o = new Observation("R9", T0, T0.plusMillis((long) (durationS * 1000)), 0, value, null);
    return new Timeline(PlanStatus.FEASIBLE, total, 0, null, List.of(o), List.of());
  }

  @Test
  void gridExposureWithInterpolatedValueIsValid() {
    // 600 s lies halfway between the points at 300 s (1.0) and 900 s (2.2): 1.6 by linear interpolation.
    assertEquals(List.of(), validator.violations(timeline(600, 1.6, 1.6)));
  }

  @Test
  void exposureOffTheGridIsReported() {
    List<String> v = validator.violations(timeline(630, CURVE.valueAt(630), CURVE.valueAt(630)));
    assertEquals(1, v.size(), v.toString());
    assertTrue(v.get(0).contains("not a grid exposure 300 + k·60 in [300, 3600]"), v.get(0));
  }

  @Test
  void exposureAboveTheMaximumIsReported() {
    List<String> v = validator.violations(timeline(3660, 3.4, 3.4));
    assertEquals(1, v.size(), v.toString());
    assertTrue(v.get(0).contains("lasts 3660.000 s"), v.get(0));
  }

  @Test
  void valueDifferentFromTheCurveIsReported() {
    // 2e-6 above the curve: beyond the 1e-6 tolerance.
    List<String> v = validator.violations(timeline(600, 1.6 + 2e-6, 1.6 + 2e-6));
    assertEquals(1, v.size(), v.toString());
    assertTrue(v.get(0).contains("the utility curve gives 1.6"), v.get(0));
  }

  @Test
  void missingValueIsReported() {
    List<String> v = validator.violations(timeline(600, null, 0));
    assertEquals(List.of("observation R9: a flexible request's observation must carry its value"), v);
  }

  @Test
  void totalPriorityMustBeTheSumOfValues() {
    List<String> v = validator.violations(timeline(600, 1.6, 1.7));
    assertEquals(1, v.size(), v.toString());
    assertTrue(v.get(0).startsWith("total priority: timeline says 1.7, observations sum to 1.6"), v.get(0));
  }
}
