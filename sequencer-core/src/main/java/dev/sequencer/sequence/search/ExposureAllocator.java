package dev.sequencer.sequence.search;

import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Prizes;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.slew.Transitions;
import java.util.Arrays;

/**
 * Exact exposure allocation for a fixed order: chooses every grid exposure and start that maximise the
 * total prize while the whole sequence stays model-feasible (allowed starts, a flexible observation
 * whole inside one span, {@code start ≥ previous end + ArcCosts.costFrom}, horizon); fixed requests keep
 * their duration.
 *
 * <p>Method: dynamic programming over the positions of the order with a Pareto list of (end second, value)
 * after each prefix. For a given exposure the earliest fitting start dominates every later one (with
 * time-independent model transitions, ending earlier never hurts what follows), so a prefix state is
 * fully described by its end and its value, and a state that ends later with no more value can be
 * dropped. The list holds at most one point per distinct end second. The backward lists (latest arrival,
 * value of the suffix) serve the insertion and replacement checks of {@link ExposureMoves}.
 */
final class ExposureAllocator {
  /** No state: the sequence cannot be completed. */
  static final long INFEASIBLE = Long.MIN_VALUE;

  private final PlanningProblem problem;
  private final ArcCosts arcs;
  private final Prizes prizes;
  /** Scratch for the counting passes: one slot per second of the horizon plus "any time"; -1 = empty. */
  private final int[] buckets;

  /** Not thread-safe (scratch buckets): one instance per run. */
  ExposureAllocator(PlanningProblem problem, ArcCosts arcs) {
    this.problem = problem;
    this.arcs = arcs;
    this.prizes = problem.prizes();
    this.buckets = new int[Math.toIntExact(problem.horizonS() + 2)];
    Arrays.fill(buckets, -1);
  }

  /**
   * A Pareto list: {@code timeS} strictly increasing. Forward lists (ends after a prefix) have strictly
   * increasing {@code value}; backward lists (latest arrivals before a suffix) strictly decreasing.
   * {@code parent} and {@code grid} record the choice that made each point (forward lists only).
   */
  record Front(long[] timeS, long[] value, int[] parent, int[] grid) {
    /** The state before the first observation: at second 0 with no value. */
    static final Front ORIGIN = new Front(new long[] {0}, new long[] {0}, new int[] {-1}, new int[] {-1});
    /** The state after the last observation: any arrival is fine, nothing more to collect. */
    static final Front OPEN_END = new Front(new long[] {Long.MAX_VALUE}, new long[] {0}, null, null);

    int size() {
      return timeS.length;
    }

    /** Backward lists: the largest value reachable when arriving at {@code arrivalS}; INFEASIBLE if none. */
    long bestFrom(long arrivalS) {
      int i = Arrays.binarySearch(timeS, arrivalS);
      int at = i >= 0 ? i : -i - 1;
      return at < timeS.length ? value[at] : INFEASIBLE;
    }
  }

  /** The plan of largest scaled value with exactly this order; {@code null} when no allocation fits. */
  Plan allocate(int[] order) {
    Front[] forward = forward(order);
    if (forward == null) {
      return null;
    }
    return readBack(order, forward);
  }

  /** The largest scaled value of {@code order} (all kept), or INFEASIBLE. */
  long bestValue(int[] order) {
    Front[] forward = forward(order);
    if (forward == null) {
      return INFEASIBLE;
    }
    Front last = forward.length == 0 ? Front.ORIGIN : forward[forward.length - 1];
    return last.value()[last.size() - 1];
  }

  /** Forward lists after each position; {@code null} when some prefix cannot be completed. */
  Front[] forward(int[] order) {
    Front[] out = new Front[order.length];
    Front prev = Front.ORIGIN;
    for (int q = 0; q < order.length; q++) {
      prev = step(prev, q == 0 ? Transitions.START : order[q - 1], order[q]);
      if (prev == null) {
        return null;
      }
      out[q] = prev;
    }
    return out;
  }

  /** Adds request k after the states of {@code before} (ending with request {@code from}). */
  Front step(Front before, int from, int k) {
    long c = arcs.costFrom(from, k);
    if (c < 0) {
      return null;
    }
    int options = optionCount(k);
    int n = before.size() * options;
    long[] end = new long[n];
    long[] value = new long[n];
    int[] parent = new int[n];
    int[] grid = new int[n];
    int used = 0;
    for (int i = 0; i < before.size(); i++) {
      for (int g = 0; g < options; g++) {
        long d = durationS(k, g);
        long s = problem.task(k).firstFittingStart(before.timeS()[i] + c, d);
        if (s >= 0) {
          end[used] = s + d;
          value[used] = before.value()[i] + valueAt(k, g);
          parent[used] = i;
          grid[used] = g;
          used++;
        }
      }
    }
    return used == 0 ? null : paretoForward(end, value, parent, grid, used);
  }

  /**
   * Keeps the points no other point beats (earlier or equal end with at least the value). Ends are whole
   * seconds in [0, horizon], so a counting pass replaces a comparison sort (these lists are built very often).
   */
  private Front paretoForward(long[] end, long[] value, int[] parent, int[] grid, int used) {
    int[] at = bucketsFor(end, value, used, false);
    long[] t = new long[used];
    long[] v = new long[used];
    int[] p = new int[used];
    int[] g = new int[used];
    int kept = 0;
    for (int s = 0; s < at.length; s++) {
      int i = at[s];
      if (i < 0) {
        continue;
      }
      at[s] = -1;
      if (kept == 0 || value[i] > v[kept - 1]) {
        t[kept] = end[i];
        v[kept] = value[i];
        p[kept] = parent[i];
        g[kept] = grid[i];
        kept++;
      }
    }
    return new Front(Arrays.copyOf(t, kept), Arrays.copyOf(v, kept), Arrays.copyOf(p, kept), Arrays.copyOf(g, kept));
  }

  /**
   * The scratch buckets filled with, per second, the index of the point of largest value there; the
   * second {@code horizon + 1} stands for "any time" ({@code Long.MAX_VALUE}) when {@code openEnd}.
   */
  private int[] bucketsFor(long[] time, long[] value, int used, boolean openEnd) {
    for (int i = 0; i < used; i++) {
      int s = slot(time[i], openEnd);
      if (buckets[s] < 0 || value[i] > value[buckets[s]]) {
        buckets[s] = i;
      }
    }
    return buckets;
  }

  private int slot(long timeS, boolean openEnd) {
    if (openEnd && timeS == Long.MAX_VALUE) {
      return buckets.length - 1;
    }
    if (timeS < 0 || timeS > problem.horizonS()) {
      throw new IllegalStateException("time " + timeS + " s outside the horizon [0, " + problem.horizonS() + "] (a bug)");
    }
    return (int) timeS;
  }

  /**
   * Backward lists: entry q holds, for the suffix starting at position q, each latest arrival second
   * with the largest value the suffix still collects; entry {@code order.length} is {@link Front#OPEN_END}.
   * An empty list marks a suffix that cannot be completed.
   */
  Front[] backward(int[] order) {
    Front[] out = new Front[order.length + 1];
    out[order.length] = Front.OPEN_END;
    for (int q = order.length - 1; q >= 0; q--) {
      out[q] = stepBack(order[q], q + 1 < order.length ? order[q + 1] : -1, out[q + 1]);
    }
    return out;
  }

  /** Puts request k before the suffix states {@code after} (starting with request {@code next}, or -1). */
  Front stepBack(int k, int next, Front after) {
    long c = next < 0 ? 0 : arcs.cost(k, next);
    if (c < 0 || after.size() == 0) {
      return new Front(new long[0], new long[0], null, null);
    }
    int options = optionCount(k);
    int n = after.size() * options;
    long[] arrive = new long[n];
    long[] value = new long[n];
    int used = 0;
    for (int i = 0; i < after.size(); i++) {
      long endBy = after.timeS()[i] == Long.MAX_VALUE ? Long.MAX_VALUE : after.timeS()[i] - c;
      for (int g = 0; g < options; g++) {
        long d = durationS(k, g);
        long s = latestFittingStart(k, endBy == Long.MAX_VALUE ? Long.MAX_VALUE : endBy - d, d);
        if (s >= 0) {
          arrive[used] = s;
          value[used] = after.value()[i] + valueAt(k, g);
          used++;
        }
      }
    }
    return paretoBackward(arrive, value, used);
  }

  /**
   * Keeps the points no other point beats (later or equal time with at least the value); times are whole
   * seconds in [0, horizon] or {@code Long.MAX_VALUE} ("any time"). Result: times increasing, values
   * decreasing.
   */
  Front paretoBackward(long[] time, long[] value, int used) {
    int[] at = bucketsFor(time, value, used, true);
    long[] t = new long[used];
    long[] v = new long[used];
    int kept = 0;
    for (int s = at.length - 1; s >= 0; s--) {
      int i = at[s];
      if (i < 0) {
        continue;
      }
      at[s] = -1;
      if (kept == 0 || value[i] > v[kept - 1]) {
        t[kept] = time[i];
        v[kept] = value[i];
        kept++;
      }
    }
    long[] ts = new long[kept];
    long[] vs = new long[kept];
    for (int i = 0; i < kept; i++) { // reverse: times increasing, values decreasing
      ts[i] = t[kept - 1 - i];
      vs[i] = v[kept - 1 - i];
    }
    return new Front(ts, vs, null, null);
  }

  /** Latest start ≤ {@code latestS} of request k for which [s, s + d] fits in one window; -1 when none. */
  long latestFittingStart(int k, long latestS, long d) {
    return problem.task(k).latestFittingStart(latestS, d);
  }

  /** Rebuilds the plan from the best point of the last forward list. */
  private Plan readBack(int[] order, Front[] forward) {
    int m = order.length;
    long[] starts = new long[m];
    long[] durs = new long[m];
    int at = m == 0 ? 0 : forward[m - 1].size() - 1;
    for (int q = m - 1; q >= 0; q--) {
      Front f = forward[q];
      durs[q] = durationS(order[q], f.grid()[at]);
      starts[q] = f.timeS()[at] - durs[q];
      at = f.parent()[at];
    }
    Plan plan = new Plan(order.clone(), starts, durs);
    if (!arcs.feasible(plan)) {
      throw new IllegalStateException("exposure allocation produced an infeasible plan (a bug): " + plan);
    }
    return plan;
  }

  /** Number of exposures request k may take (1 when fixed). */
  int optionCount(int k) {
    return problem.task(k).optionCount();
  }

  /** Exposure option g of request k, seconds. */
  long durationS(int k, int g) {
    return problem.task(k).durationS(g);
  }

  /** Prize of option g of request k. */
  long valueAt(int k, int g) {
    return prizes.prize(k, g);
  }
}
