package dev.sequencer.slew;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The contract every {@link SlewModel} keeps, run against each model by a subclass: sizes, non-negative
 * times, and a bound over departure and arrival intervals that is never below the exact time at any
 * sampled departure and arrival inside them, from the start pointing and from every request.
 */
abstract class SlewModelContract {
  /** Departure intervals probed by the bound checks, seconds from the horizon start. */
  private static final double[][] INTERVALS = {{0, 0}, {0, 300}, {1000, 1600}, {3000, 3060}};
  private static final int SAMPLES = 13;

  abstract SlewModel model();

  /** At least three tracks; for stateful models they must keep the mount state legal while tracked. */
  abstract List<PointingTrack> tracks();

  abstract PointingTrack startTrack();

  private Transitions transitions() {
    return model().transitions(tracks(), startTrack());
  }

  @Test
  void sizeIsTheNumberOfTracks() {
    assertEquals(tracks().size(), transitions().size());
  }

  @Test
  void exactTimesAreNonNegativeAlongEveryOrder() {
    Transitions t = transitions();
    int[][] orders = {{0, 1, 2}, {2, 1, 0}, {1, 0, 2}, {0, 2, 1}};
    for (int[] order : orders) {
      double[] legs = t.exactS(order, new double[] {0, 900, 1800}, new double[] {100, 1000, 1900});
      for (double leg : legs) {
        assertTrue(leg >= 0, () -> "negative leg " + leg);
      }
    }
  }

  @Test
  void boundIsNeverBelowExactAtSampledDepartures() {
    Transitions t = transitions();
    for (double[] interval : INTERVALS) {
      for (int to = 0; to < t.size(); to++) {
        for (int from = Transitions.START; from < t.size(); from++) {
          if (from == to) {
            continue;
          }
          // Arrivals: from 60 s after the earliest departure to 400 s after the latest.
          double arrivalMin = interval[0] + 60;
          double arrivalMax = interval[1] + 400;
          double bound = t.boundS(from, to, interval[0], interval[1], arrivalMin, arrivalMax);
          for (int s = 0; s < SAMPLES; s++) {
            double departure = interval[0] + (interval[1] - interval[0]) * s / (SAMPLES - 1);
            for (int r = 0; r < SAMPLES; r++) {
              double arrival = arrivalMin + (arrivalMax - arrivalMin) * r / (SAMPLES - 1);
              double exact = from == Transitions.START
                  ? t.exactS(new int[] {to}, new double[] {departure}, new double[] {arrival})[0]
                  : t.exactS(new int[] {from, to}, new double[] {departure - 500, departure},
                      new double[] {departure - 400, arrival})[1];
              int f = from;
              int g = to;
              assertTrue(exact <= bound, () -> "from " + f + " to " + g + " leaving at " + departure
                  + " arriving at " + arrival + ": exact " + exact + " s > bound " + bound + " s");
            }
          }
        }
      }
    }
  }

  @Test
  void timeIndependentModelsIgnoreTheDeparture() {
    Transitions t = transitions();
    if (!t.timeDependent()) {
      int[] order = {2, 0, 1};
      assertArrayEquals(t.exactS(order, new double[] {0, 10, 20}, new double[] {5, 15, 25}),
          t.exactS(order, new double[] {500, 4000, 9000}, new double[] {600, 4100, 9100}));
    }
  }
}
