package dev.sequencer.sequence.search;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.Request;
import dev.sequencer.model.UtilityPoint;
import dev.sequencer.sequence.search.ExposureAllocator.Front;
import dev.sequencer.sequence.TinyInstance;
import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.search.GreedyPlanner;
import dev.sequencer.sequence.search.TwoStagePlanner;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.sequence.timing.ExactTimer;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.LongRange;
import org.junit.jupiter.api.Test;

/**
 * The exact fixed-order exposure allocator ({@link ExposureAllocator}) and the moves built on it
 * ({@link ExposureMoves}) against exhaustive enumeration on tiny mixed instances, against the LP polish
 * of the two-stage baseline, and on named edge cases.
 */
class ExposureAllocatorTest {
  private static final long HORIZON_S = 1200;
  private static final long[] GRID_S = {60, 120, 180, 240};

  /** 2–5 requests (the first fixed, others flexible on GRID_S with 2/3 chance), 1–2 windows, whole-second slews. */
  private static TinyInstance instance(long seed) {
    Random rnd = new Random(seed);
    int n = 2 + rnd.nextInt(4);
    List<Request> requests = new ArrayList<>();
    List<long[][]> windows = new ArrayList<>();
    for (int k = 0; k < n; k++) {
      String id = "R" + k;
      // Values with two decimals at 60 and 240 s: interpolated grid values have at most three decimals,
      // so the scale factor 1000 is exact and the comparison below can be to 1e-9.
      requests.add(TinyInstance.randomRequest(rnd, id, k == 0, 240, 0.04, 100));
      windows.add(randomWindows(rnd));
    }
    return TinyInstance.withRandomTable(HORIZON_S, requests, windows, rnd, 120);
  }

  private static long[][] randomWindows(Random rnd) {
    int count = 1 + rnd.nextInt(2);
    List<long[]> w = new ArrayList<>();
    long cursor = 0;
    for (int q = 0; q < count && cursor < HORIZON_S - 60; q++) {
      long a = Math.min(HORIZON_S - 60, cursor + rnd.nextInt(400));
      long b = Math.min(HORIZON_S, a + 60 + rnd.nextInt(500));
      w.add(new long[] {a, b});
      cursor = b + 1;
    }
    return w.toArray(new long[0][]);
  }

  /** Exposures request r may take. */
  private static long[] exposures(Request r) {
    return r.isFlexible() ? GRID_S : new long[] {r.durationS().longValue()};
  }

  /**
   * Exhaustive enumeration: best value of {@code order} (all kept) over every combination of exposures,
   * each scheduled at earliest starts with whole observations in one window; NaN when none fits.
   */
  private static double bruteForceFixedOrder(TinyInstance in, int[] order, int q, int prev, long end, double value) {
    if (q == order.length) {
      return value;
    }
    int k = order[q];
    Request r = in.requests().get(k);
    long ready = end + (long) Math.ceil(prev < 0 ? in.fromStart()[k] : in.matrix()[prev][k]);
    double best = Double.NaN;
    for (long d : exposures(r)) {
      long start = earliestStart(in.windows().get(k), ready, d);
      if (start >= 0) {
        double v = bruteForceFixedOrder(in, order, q + 1, k, start + d,
            value + (r.isFlexible() ? r.flexible().valueAt(d) : r.priority()));
        best = Double.isNaN(best) ? v : Double.isNaN(v) ? best : Math.max(best, v);
      }
    }
    return best;
  }

  /** Exhaustive enumeration over every ordered subset and every exposure combination. */
  private static double bruteForceAny(TinyInstance in, boolean[] used, int prev, long end, double value) {
    double best = value;
    for (int k = 0; k < in.requests().size(); k++) {
      if (used[k]) {
        continue;
      }
      Request r = in.requests().get(k);
      long ready = end + (long) Math.ceil(prev < 0 ? in.fromStart()[k] : in.matrix()[prev][k]);
      for (long d : exposures(r)) {
        long start = earliestStart(in.windows().get(k), ready, d);
        if (start >= 0) {
          used[k] = true;
          best = Math.max(best, bruteForceAny(in, used, k, start + d,
              value + (r.isFlexible() ? r.flexible().valueAt(d) : r.priority())));
          used[k] = false;
        }
      }
    }
    return best;
  }

  private static long earliestStart(long[][] windows, long ready, long d) {
    long start = -1;
    for (long[] w : windows) {
      long s = Math.max(ready, w[0]);
      if (s + d <= w[1] && (start < 0 || s < start)) {
        start = s;
      }
    }
    return start;
  }

  private static int[] randomOrder(Random rnd, int n) {
    List<Integer> all = new ArrayList<>();
    for (int k = 0; k < n; k++) {
      all.add(k);
    }
    java.util.Collections.shuffle(all, rnd);
    int m = 1 + rnd.nextInt(n);
    return all.subList(0, m).stream().mapToInt(Integer::intValue).toArray();
  }

  @Property(tries = 300)
  void allocationMatchesExhaustiveEnumerationForAFixedOrder(@ForAll @LongRange(min = 1, max = 1_000_000) long seed) {
    TinyInstance in = instance(seed);
    PlanningProblem p = in.problem();
    int[] order = randomOrder(new Random(seed), p.size());
    Plan plan = new ExposureAllocator(p, new ArcCosts(p)).allocate(order);
    // Exhaustive enumeration over the exposures of this order (see bruteForceFixedOrder).
    double expected = bruteForceFixedOrder(in, order, 0, -1, 0, 0.0);
    if (Double.isNaN(expected)) {
      assertNull(plan, "seed " + seed + ": no allocation fits, but the allocator found " + plan);
      return;
    }
    assertNotNull(plan, "seed " + seed + ": exhaustive enumeration fits value " + expected);
    assertTrue(new ArcCosts(p).feasible(plan), "seed " + seed);
    assertEquals(expected, plan.priority(p), 1e-9, "seed " + seed);
    assertEquals(plan.prize(p), new ExposureAllocator(p, new ArcCosts(p)).bestValue(order));
  }

  @Property(tries = 200)
  void allocationIsNeverBelowTheLpPolish(@ForAll @LongRange(min = 1, max = 1_000_000) long seed) {
    TinyInstance in = instance(seed);
    PlanningProblem p = in.problem();
    ArcCosts arcs = new ArcCosts(p);
    Plan greedy = new GreedyPlanner(p, new ExactTimer(p)).plan();
    Plan polished = new TwoStagePlanner(p, arcs).polish(greedy);
    Plan allocated = new ExposureAllocator(p, arcs).allocate(greedy.order());
    // The LP polish keeps the order and each window; the allocator searches every grid exposure and
    // window for the same order, a superset, so its optimum cannot be lower.
    assertNotNull(allocated, "seed " + seed);
    assertTrue(allocated.prize(p) >= polished.prize(p),
        "seed " + seed + ": allocation " + allocated + " below polish " + polished);
  }

  @Property(tries = 200)
  void movesNeverLoseValueNorBeatTheExhaustiveOptimum(@ForAll @LongRange(min = 1, max = 1_000_000) long seed) {
    TinyInstance in = instance(seed);
    PlanningProblem p = in.problem();
    ArcCosts arcs = new ArcCosts(p);
    Plan greedy = new GreedyPlanner(p, new ExactTimer(p)).plan();
    Plan moved = new ExposureMoves(p, arcs).improve(greedy, Long.MAX_VALUE, Long.MAX_VALUE);
    assertTrue(arcs.feasible(moved), "seed " + seed);
    assertTrue(moved.prize(p) >= greedy.prize(p), "seed " + seed);
    // Exhaustive enumeration over every ordered subset and exposure: no plan can beat it.
    assertTrue(moved.priority(p) <= bruteForceAny(in, new boolean[p.size()], -1, 0, 0.0) + 1e-9, "seed " + seed);
  }

  @Property(tries = 200)
  void slackProfileIsTheBestPairForEveryRoom(@ForAll @LongRange(min = 1, max = 1_000_000) long seed) {
    TinyInstance in = instance(seed);
    PlanningProblem p = in.problem();
    ArcCosts arcs = new ArcCosts(p);
    ExposureAllocator allocator = new ExposureAllocator(p, arcs);
    int[] order = randomOrder(new Random(seed), p.size());
    Front[] forward = allocator.forward(order);
    Front[] backward = allocator.backward(order);
    if (forward == null || order.length < 2) {
      return;
    }
    Front before = forward[0];
    Front after = backward[1];
    Front profile = new ExposureMoves(p, arcs).slackProfile(before, after);
    for (long room = 0; room <= HORIZON_S; room += 7) {
      // Exhaustive enumeration over all (prefix, suffix) pairs that leave at least this room.
      long expected = ExposureAllocator.INFEASIBLE;
      for (int i = 0; i < before.size(); i++) {
        for (int j = 0; j < after.size(); j++) {
          if (after.timeS()[j] - before.timeS()[i] >= room) {
            expected = Math.max(expected, before.value()[i] + after.value()[j]);
          }
        }
      }
      assertEquals(expected, profile.bestFrom(room), "seed " + seed + " room " + room);
    }
  }

  @Test
  void anOrderThatCannotFitHasNoAllocation() {
    // R1's only window closes before R0 (fixed 300 s, window from 0) can end: no exposure helps.
    TinyInstance in = new TinyInstance(HORIZON_S,
        List.of(new Request("R0", null, 300.0, 1.0, false, List.of(), null), flexible("R1", 1.0, 2.0)),
        List.of(new long[][] {{0, 400}}, new long[][] {{0, 250}}), new double[][] {{0, 10}, {10, 0}},
        new double[] {0, 0});
    PlanningProblem p = in.problem();
    assertNull(new ExposureAllocator(p, new ArcCosts(p)).allocate(new int[] {0, 1}));
  }

  @Test
  void timeFlowsToTheSteeperCurve() {
    // Two flexible requests in one 450 s window, 20 s slew between: 430 s of exposure in all. Hand
    // calculation: R0 gains 0.5 per extra 60 s step, R1 0.1 (linear curves), so R0 takes 240 s (the
    // grid maximum) and R1 the remaining 430 − 240 = 190 s, rounded down to the grid: 180 s (value 1.2).
    TinyInstance in = new TinyInstance(HORIZON_S, List.of(flexible("R0", 1.0, 2.5), flexible("R1", 1.0, 1.3)),
        List.of(new long[][] {{0, 450}}, new long[][] {{0, 450}}), new double[][] {{0, 20}, {20, 0}},
        new double[] {0, 0});
    PlanningProblem p = in.problem();
    Plan plan = new ExposureAllocator(p, new ArcCosts(p)).allocate(new int[] {0, 1});
    assertEquals(240, plan.durationS()[0]);
    assertEquals(180, plan.durationS()[1]);
    assertEquals(2.5 + 1.2, plan.priority(p), 1e-9);
  }

  @Test
  void anInsertionShortensItsNeighbour() {
    // R0 alone takes 240 s of its 300 s window (value 2.5). R1 (fixed 120 s, priority 3) fits only when R0
    // shrinks to 180 s: 180 s + 0 slew + 120 s = 300 s. Hand calculation: 2.0 + 3 = 5.0 > 2.5.
    TinyInstance in = new TinyInstance(HORIZON_S,
        List.of(flexible("R0", 1.0, 2.5), new Request("R1", null, 120.0, 3.0, false, List.of(), null)),
        List.of(new long[][] {{0, 300}}, new long[][] {{0, 300}}), new double[][] {{0, 0}, {0, 0}},
        new double[] {0, 0});
    PlanningProblem p = in.problem();
    ArcCosts arcs = new ArcCosts(p);
    Plan start = new ExposureAllocator(p, arcs).allocate(new int[] {0});
    assertEquals(2.5, start.priority(p), 1e-9);
    Plan moved = new ExposureMoves(p, arcs).improve(start, Long.MAX_VALUE, Long.MAX_VALUE);
    assertEquals(5.0, moved.priority(p), 1e-9);
    assertEquals(2, moved.size());
  }

  /** A flexible request on GRID_S whose value is linear from v60 at 60 s to v240 at 240 s. */
  private static Request flexible(String id, double v60, double v240) {
    return new Request(id, null, null, null, false, List.of(), new FlexibleExposure(60, 240, 60,
        List.of(new UtilityPoint(60, v60), new UtilityPoint(240, v240))));
  }
}
