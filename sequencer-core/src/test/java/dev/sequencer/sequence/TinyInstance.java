package dev.sequencer.sequence;

import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.slew.Transitions;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/**
 * A tiny invented test instance: requests, their windows as whole-second [from, to] pairs from
 * {@link #T0}, and a transition table (seconds; {@code fromStart} from the start pointing).
 */
record TinyInstance(long horizonS, List<Request> requests, List<long[][]> windows, double[][] matrix,
    double[] fromStart) {
  static final Instant T0 = Instant.parse("2031-05-04T18:00:00Z");

  PlanningProblem problem() {
    List<RequestWindows> rw = new ArrayList<>();
    for (int k = 0; k < requests.size(); k++) {
      List<TimeWindow> w = new ArrayList<>();
      for (long[] x : windows.get(k)) {
        w.add(new TimeWindow(T0.plusSeconds(x[0]), T0.plusSeconds(x[1])));
      }
      rw.add(new RequestWindows(requests.get(k).id(), w));
    }
    return PlanningProblem.of(new TimeWindow(T0, T0.plusSeconds(horizonS)), requests, rw,
        Transitions.matrix(matrix, fromStart));
  }
}
