package dev.sequencer.sequence;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.slew.Transitions;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * CP-SAT's optimum equals an exhaustive search on small random instances (up to 8 requests, random
 * windows, asymmetric transition tables), on both objective levels: total priority, then total transition.
 * The exhaustive search enumerates every ordered subset and schedules it at earliest starts (optimal for
 * a fixed order with time-independent transitions, since starting earlier never hurts a later request).
 */
class BruteForceProperties {
  private static final Instant T0 = Instant.parse("2031-05-04T18:00:00Z");
  private static final long HORIZON_S = 1000;

  /** A random instance: requests, windows, matrix, and whether priorities are fractional. */
  record Instance(List<Request> requests, List<RequestWindows> windows, double[][] matrix, double[] fromStart) {
    PlanningProblem problem() {
      return PlanningProblem.of(new TimeWindow(T0, T0.plusSeconds(HORIZON_S)), requests, windows,
          Transitions.matrix(matrix, fromStart));
    }
  }

  @Provide
  Arbitrary<Instance> instances() {
    return Arbitraries.longs().map(BruteForceProperties::instance);
  }

  /** The random instance of {@code seed}. */
  static Instance instance(long seed) {
    {
      Random rnd = new Random(seed);
      int n = 1 + rnd.nextInt(8);
      boolean fractional = rnd.nextBoolean();
      List<Request> requests = new ArrayList<>();
      List<RequestWindows> windows = new ArrayList<>();
      for (int k = 0; k < n; k++) {
        String id = "R" + (k + 1);
        double dur = rnd.nextInt(4) == 0 ? 0 : 20 + rnd.nextInt(150);
        double priority = fractional ? 0.25 * (1 + rnd.nextInt(20)) : 1 + rnd.nextInt(5);
        boolean required = rnd.nextInt(10) == 0;
        requests.add(new Request(id, null, dur, priority, required, List.of(), null));
        List<TimeWindow> w = new ArrayList<>();
        long cursor = 0;
        int count = rnd.nextInt(3);
        for (int q = 0; q < count && cursor < HORIZON_S; q++) {
          long a = cursor + rnd.nextInt(400);
          long b = Math.min(HORIZON_S, a + rnd.nextInt(350));
          if (a >= HORIZON_S) {
            break;
          }
          // Fractional edges exercise the inward rounding.
          // (a window of zero length, a == b, keeps its integral start so it is never reversed)
          long startMs = a * 1000 + (b > a ? rnd.nextInt(1000) : 0);
          w.add(new TimeWindow(T0.plusMillis(startMs), T0.plusMillis(b * 1000)));
          cursor = b + 1;
        }
        windows.add(new RequestWindows(id, w));
      }
      double[][] m = new double[n][n];
      double[] fromStart = new double[n];
      for (int i = 0; i < n; i++) {
        fromStart[i] = rnd.nextInt(100);
        for (int j = 0; j < n; j++) {
          m[i][j] = i == j ? 0 : rnd.nextInt(200);
        }
      }
      return new Instance(requests, windows, m, fromStart);
    }
  }

  @Property(tries = 60)
  void cpSatMatchesExhaustiveSearch(@ForAll("instances") Instance inst) {
    PlanningProblem p = inst.problem();
    long[] best = exhaustive(p); // {scaled priority*4, transition} or null
    SequencerResult r = new Sequencer().plan(p, SequencerOptions.defaults().withTimeLimitS(5).withWorkers(2));
    if (best == null) {
      assertEquals(PlanStatus.INFEASIBLE, r.status(), "exhaustive search finds no plan with all required requests");
      return;
    }
    assertEquals(PlanStatus.OPTIMAL, r.status());
    assertEquals(best[0] / 4.0, r.totalPriority(), 1e-9, "total priority");
    assertEquals(best[1], r.totalTransitionS(), 1e-9, "total transition at the best priority");
    assertEquals(List.of(), new SelfCheck(p.horizon(), p.requests(), p.windows(), p.transitions())
        .violations(r.toTimeline()));
  }

  @Property(tries = 40)
  void greedyPlansAreValid(@ForAll("instances") Instance inst) {
    PlanningProblem p = inst.problem();
    SequencerResult r = new Sequencer().plan(p,
        SequencerOptions.defaults().withSolver(SequencerOptions.Solver.GREEDY).withTimeLimitS(2));
    if (r.hasPlan()) {
      assertEquals(List.of(), new SelfCheck(p.horizon(), p.requests(), p.windows(), p.transitions())
          .violations(r.toTimeline()));
      long[] best = exhaustive(p);
      assertEquals(true, r.totalPriority() <= best[0] / 4.0 + 1e-9, "greedy never beats the optimum");
    }
  }

  /** Best (4 × priority, transition) over all ordered subsets containing every required request; null if none. */
  static long[] exhaustive(PlanningProblem p) {
    long[] best = {-1, Long.MAX_VALUE};
    boolean[] used = new boolean[p.size()];
    dfs(p, used, -1, 0, 0, 0, best);
    return best[0] < 0 ? null : best;
  }

  private static void dfs(PlanningProblem p, boolean[] used, int prev, long end, long prio4, long trans, long[] best) {
    boolean allRequired = true;
    for (int k = 0; k < p.size(); k++) {
      allRequired &= !p.tasks().get(k).required() || used[k];
    }
    if (allRequired && (prio4 > best[0] || (prio4 == best[0] && trans < best[1]))) {
      best[0] = prio4;
      best[1] = trans;
    }
    for (int j = 0; j < p.size(); j++) {
      Task t = p.tasks().get(j);
      if (used[j] || !t.schedulable()) {
        continue;
      }
      long c = (long) (prev < 0 ? p.transitions().boundS(Transitions.START, j, 0, 0)
          : p.transitions().boundS(prev, j, end, end));
      long s = t.firstStartAtOrAfter(end + c);
      if (s < 0) {
        continue;
      }
      used[j] = true;
      dfs(p, used, j, s + t.durationS(), prio4 + Math.round(4 * t.priority()), trans + c, best);
      used[j] = false;
    }
  }
}
