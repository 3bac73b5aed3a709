package dev.sequencer.sequence;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Request;
import dev.sequencer.sequence.problem.PlanningProblem;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The joint model's value equals an exhaustive search on tiny mixed instances (up to 4 requests, fixed and
 * flexible with 3 grid exposures, 1–2 windows each, asymmetric transition tables). The search enumerates
 * every ordered subset and every combination of exposures and schedules each at earliest starts, the
 * whole observation inside one window (optimal for a fixed order and exposures with time-independent
 * transitions: starting earlier never hurts a later request).
 */
class FlexibleBruteForceTest {
  private static final long HORIZON_S = 900;

  private static TinyInstance instance(long seed) {
    Random rnd = new Random(seed);
    int n = 2 + rnd.nextInt(3);
    List<Request> requests = new ArrayList<>();
    List<long[][]> windows = new ArrayList<>();
    for (int k = 0; k < n; k++) {
      String id = "R" + k;
      // Grid 60, 120, 180 s; values with two decimals, so the midpoint has three and scales exactly.
      requests.add(TinyInstance.randomRequest(rnd, id, k == 0, 180, 0.01, 300));
      int count = 1 + rnd.nextInt(2);
      long[][] w = new long[count][];
      long cursor = 0;
      for (int q = 0; q < count; q++) {
        long a = Math.min(HORIZON_S - 60, cursor + rnd.nextInt(300));
        long b = Math.min(HORIZON_S, a + 60 + rnd.nextInt(300));
        w[q] = new long[] {a, b};
        cursor = b + 1;
        if (cursor >= HORIZON_S - 60) {
          w = java.util.Arrays.copyOf(w, q + 1);
          break;
        }
      }
      windows.add(w);
    }
    return TinyInstance.withRandomTable(HORIZON_S, requests, windows, rnd, 150);
  }

  /** Exposures request k may take. */
  private static long[] exposures(Request r) {
    if (!r.isFlexible()) {
      return new long[] {r.durationS().longValue()};
    }
    return new long[] {60, 120, 180};
  }

  /** Best value over every ordered subset and every choice of exposures. */
  private static double bruteForce(TinyInstance in) {
    int n = in.requests().size();
    double[] best = {0};
    search(in, new int[n], new long[n], 0, new boolean[n], -1, 0, 0.0, best);
    return best[0];
  }

  private static void search(TinyInstance in, int[] order, long[] dur, int depth, boolean[] used, int prev, long end,
      double value, double[] best) {
    best[0] = Math.max(best[0], value);
    for (int k = 0; k < in.requests().size(); k++) {
      if (used[k]) {
        continue;
      }
      Request r = in.requests().get(k);
      double slew = prev < 0 ? in.fromStart()[k] : in.matrix()[prev][k];
      long ready = end + (long) Math.ceil(slew);
      for (long d : exposures(r)) {
        long start = -1;
        for (long[] w : in.windows().get(k)) {
          long s = Math.max(ready, w[0]);
          if (s + d <= w[1] && (start < 0 || s < start)) {
            start = s;
          }
        }
        if (start < 0) {
          continue;
        }
        double v = r.isFlexible() ? r.flexible().valueAt(d) : r.priority();
        used[k] = true;
        search(in, order, dur, depth + 1, used, k, start + d, value + v, best);
        used[k] = false;
      }
    }
  }

  @Test
  void jointModelMatchesExhaustiveSearchOnTinyMixedInstances() {
    for (long seed = 1; seed <= 25; seed++) {
      TinyInstance in = instance(seed);
      PlanningProblem p = in.problem();
      SequencerResult r = new Sequencer().plan(p, SequencerOptions.defaults().withTimeLimitS(2).withWorkers(2)
          .withSeed(1));
      assertEquals(PlanStatus.OPTIMAL, r.status(), "seed " + seed + ": " + r.message());
      // Values have at most three decimals, so scaling by 1000 is exact: the optimum must match to 1e-9.
      assertEquals(bruteForce(in), r.totalPriority(), 1e-9, "seed " + seed + " " + in.requests());
      FlexibleExposureTest.assertValidAndValuesAddUp(p, r);
    }
  }
}
