package dev.sequencer.sequence;

import dev.sequencer.sequence.PlanningProblem.Task;
import dev.sequencer.slew.Transitions;

/**
 * Model transition seconds: {@code cost(i, j) = ceil(boundS(i, j, D, A))} with D the ends of i that can
 * precede a start of j ([earliest end of i, min(latest end of i, latest start of j)]) and A the starts of j
 * that can follow an end of i ([max(earliest start of j, earliest end of i), latest start of j]); and
 * {@code fromStart(j) = ceil(boundS(START, j, [0, 0], [earliest, latest start of j]))}; -1 where the bound
 * is infinite or the arc can never be used.
 *
 * <p>The bound covers every departure the model can choose, so a model arc is never optimistic. Ceiling
 * to whole seconds keeps the model integral; {@link #CEIL_SLACK_S} keeps a bound of 12.0000000001 s
 * (floating-point noise) from costing 13 s. The validator's 1 ms tolerance covers that slack.
 */
final class ArcCosts {
  /** Bounds within this much above a whole second are rounded down to it, seconds. */
  static final double CEIL_SLACK_S = 1e-6;

  private final PlanningProblem problem;
  private final int n;
  private final int[] cost;
  private final long[] fromStart;
  private final long[] minIn;

  ArcCosts(PlanningProblem problem) {
    this.problem = problem;
    this.n = problem.size();
    this.cost = new int[n * n];
    this.fromStart = new long[n];
    this.minIn = new long[n];
    Transitions tr = problem.transitions();
    for (int j = 0; j < n; j++) {
      Task tj = problem.tasks().get(j);
      fromStart[j] = tj.schedulable()
          ? ceilS(tr.boundS(Transitions.START, j, 0, 0, tj.earliestStartS(), tj.latestStartS())) : -1;
    }
    for (int i = 0; i < n; i++) {
      Task ti = problem.tasks().get(i);
      for (int j = 0; j < n; j++) {
        Task tj = problem.tasks().get(j);
        if (i == j || !ti.schedulable() || !tj.schedulable()) {
          cost[i * n + j] = -1;
          continue;
        }
        long endMin = ti.earliestStartS() + ti.durationS();
        long endMax = Math.min(ti.latestStartS() + problem.maxDurationS(i), tj.latestStartS()); // flexible: longest exposure
        long arrivalMin = Math.max(tj.earliestStartS(), endMin);
        if (endMax < endMin || tj.latestStartS() < arrivalMin) {
          cost[i * n + j] = -1; // i cannot end before j's last start
          continue;
        }
        long c = ceilS(tr.boundS(i, j, endMin, endMax, arrivalMin, tj.latestStartS()));
        cost[i * n + j] = c > Integer.MAX_VALUE ? -1 : (int) c;
      }
    }
    for (int j = 0; j < n; j++) {
      long m = fromStart[j] >= 0 && fromStart[j] <= latestStart(j) ? fromStart[j] : Long.MAX_VALUE;
      for (int i = 0; i < n; i++) {
        if (feasible(i, j)) {
          m = Math.min(m, cost(i, j));
        }
      }
      // With time-dependent transitions the model costs are upper bounds, not lower bounds, on the exact
      // transition: only 0 is a valid least transition into j there.
      minIn[j] = tr.timeDependent() && problem.tasks().get(j).schedulable() ? 0 : m;
    }
  }

  /** Whole seconds of a transition bound, rounded up; -1 when infinite or undefined. */
  static long ceilS(double boundS) {
    if (!(boundS < Double.POSITIVE_INFINITY) || Double.isNaN(boundS)) {
      return -1;
    }
    return Math.max(0, (long) Math.ceil(boundS - CEIL_SLACK_S));
  }

  /** Model seconds from i to j, -1 when impossible. */
  long cost(int i, int j) {
    return cost[i * n + j];
  }

  /** Model seconds from the start pointing (departing at 0) to j, -1 when impossible. */
  long fromStart(int j) {
    return fromStart[j];
  }

  /** Model seconds from {@code from} (a request or {@link Transitions#START}) to j. */
  long costFrom(int from, int j) {
    return from == Transitions.START ? fromStart(j) : cost(from, j);
  }

  /** Smallest model transition into j over all time-feasible predecessors; {@code Long.MAX_VALUE} if none. */
  long minIn(int j) {
    return minIn[j];
  }

  /** True when i then j can both be scheduled: earliest end of i + cost(i, j) <= latest start of j. */
  boolean feasible(int i, int j) {
    long c = cost(i, j);
    if (c < 0) {
      return false;
    }
    Task ti = problem.tasks().get(i);
    return ti.earliestStartS() + ti.durationS() + c <= latestStart(j);
  }

  private long latestStart(int j) {
    Task t = problem.tasks().get(j);
    return t.schedulable() ? t.latestStartS() : -1;
  }

  /** Count of time-feasible arcs (request pairs, from the start pointing, to the end). */
  long feasibleArcCount() {
    long count = 0;
    for (int j = 0; j < n; j++) {
      if (!problem.tasks().get(j).schedulable()) {
        continue;
      }
      count += 2;
      for (int i = 0; i < n; i++) {
        if (feasible(i, j)) {
          count++;
        }
      }
    }
    return count;
  }
}
