package dev.sequencer.sequence;

import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.UtilityPoint;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.slew.Transitions;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/**
 * A tiny invented test instance: requests, their windows as whole-second [from, to] pairs from
 * {@link #T0}, and a transition table (seconds; {@code fromStart} from the start pointing).
 */
public record TinyInstance(long horizonS, List<Request> requests, List<long[][]> windows, double[][] matrix,
    double[] fromStart) {
  public static final Instant T0 = Instant.parse("2031-05-04T18:00:00Z");

  /**
   * A random request: the first one fixed, the others fixed with chance 1/3 (60–180 s, priority 1–4),
   * else flexible from 60 s to {@code maxS} on a 60 s grid with a value line from v0 (two decimals, below
   * 2) to v0 + valueStep·[0, valueDraws).
   */
  public static Request randomRequest(Random rnd, String id, boolean first, long maxS, double valueStep, int valueDraws) {
    if (first || rnd.nextInt(3) == 0) {
      return new Request(id, null, (double) (60 + 30 * rnd.nextInt(5)), 1.0 + rnd.nextInt(4), false, List.of(), null);
    }
    double v0 = 0.01 * rnd.nextInt(200);
    double top = v0 + valueStep * rnd.nextInt(valueDraws);
    return new Request(id, null, null, null, false, List.of(), new FlexibleExposure(60, maxS, 60,
        List.of(new UtilityPoint(60, v0), new UtilityPoint(maxS, top))));
  }

  /** The instance with a random table: start transitions in [0, 60) s, others in [0, maxCostS) s. */
  public static TinyInstance withRandomTable(long horizonS, List<Request> requests, List<long[][]> windows, Random rnd,
      int maxCostS) {
    int n = requests.size();
    double[][] m = new double[n][n];
    double[] fromStart = new double[n];
    for (int i = 0; i < n; i++) {
      fromStart[i] = rnd.nextInt(60);
      for (int j = 0; j < n; j++) {
        m[i][j] = i == j ? 0 : rnd.nextInt(maxCostS);
      }
    }
    return new TinyInstance(horizonS, requests, windows, m, fromStart);
  }

  public PlanningProblem problem() {
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
