package dev.sequencer.sequence.timing;

import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Score;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.List;

/**
 * The model's transition seconds and the timing of plans under them (one owner for "model-feasible").
 *
 * <p>{@code cost(i, j) = ceil(boundS(i, j, D, A))} with D the ends of i that can precede a start of j
 * ([earliest end of i, min(latest end of i, latest start of j)]) and A the starts of j that can follow an
 * end of i ([max(earliest start of j, earliest end of i), latest start of j]); and
 * {@code fromStart(j) = ceil(boundS(START, j, [0, 0], [earliest, latest start of j]))}; -1 where the bound
 * is infinite or the arc can never be used. The bound covers every departure the model can choose, so a
 * model arc is never optimistic: a model-feasible plan is exact-feasible. Ceiling to whole seconds keeps
 * the model integral; {@link #CEIL_SLACK_S} keeps a bound of 12.0000000001 s (floating-point noise) from
 * costing 13 s. The validator's 1 ms tolerance covers that slack.
 */
public final class ArcCosts {
  /** Bounds within this much above a whole second are rounded down to it, seconds. */
  public static final double CEIL_SLACK_S = 1e-6;

  private final PlanningProblem problem;
  private final int n;
  private final int[] cost;
  private final long[] fromStart;
  private final long[] minIn;

  public ArcCosts(PlanningProblem problem) {
    this.problem = problem;
    this.n = problem.size();
    this.cost = new int[n * n];
    this.fromStart = new long[n];
    this.minIn = new long[n];
    Transitions tr = problem.transitions();
    for (int j = 0; j < n; j++) {
      Task tj = problem.task(j);
      fromStart[j] = tj.schedulable()
          ? ceilS(tr.boundS(Transitions.START, j, 0, 0, tj.earliestStartS(), tj.latestStartS())) : -1;
    }
    for (int i = 0; i < n; i++) {
      Task ti = problem.task(i);
      for (int j = 0; j < n; j++) {
        Task tj = problem.task(j);
        if (i == j || !ti.schedulable() || !tj.schedulable()) {
          cost[i * n + j] = -1;
          continue;
        }
        long endMin = ti.earliestStartS() + ti.durationS();
        long endMax = Math.min(ti.latestStartS() + ti.maxDurationS(), tj.latestStartS()); // flexible: longest exposure
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
      minIn[j] = tr.timeDependent() && problem.task(j).schedulable() ? 0 : m;
    }
  }

  /** Whole seconds of a transition bound, rounded up; -1 when infinite or undefined. */
  public static long ceilS(double boundS) {
    if (!(boundS < Double.POSITIVE_INFINITY) || Double.isNaN(boundS)) {
      return -1;
    }
    return Math.max(0, (long) Math.ceil(boundS - CEIL_SLACK_S));
  }

  /** The problem these costs belong to. */
  public PlanningProblem problem() {
    return problem;
  }

  /** Model seconds from i to j, -1 when impossible. */
  public long cost(int i, int j) {
    return cost[i * n + j];
  }

  /** Model seconds from the start pointing (departing at 0) to j, -1 when impossible. */
  public long fromStart(int j) {
    return fromStart[j];
  }

  /** Model seconds from {@code from} (a request or {@link Transitions#START}) to j. */
  public long costFrom(int from, int j) {
    return from == Transitions.START ? fromStart(j) : cost(from, j);
  }

  /**
   * Smallest model transition into j over all time-feasible predecessors; {@code Long.MAX_VALUE} if none; 0
   * for every schedulable request when transitions are time-dependent (then the model costs bound the
   * exact legs from above only).
   */
  public long minIn(int j) {
    return minIn[j];
  }

  /** True when i then j can both be scheduled: earliest end of i + cost(i, j) <= latest start of j. */
  public boolean feasible(int i, int j) {
    long c = cost(i, j);
    if (c < 0) {
      return false;
    }
    Task ti = problem.task(i);
    return ti.earliestStartS() + ti.durationS() + c <= latestStart(j);
  }

  private long latestStart(int j) {
    Task t = problem.task(j);
    return t.schedulable() ? t.latestStartS() : -1;
  }

  /** Count of time-feasible arcs (request pairs, from the start pointing, to the end). */
  public long feasibleArcCount() {
    long count = 0;
    for (int j = 0; j < n; j++) {
      if (!problem.task(j).schedulable()) {
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

  /** Sum of model arc costs along the plan's order (from the start pointing; -1 terms when an arc is impossible). */
  public long transitionS(Plan plan) {
    long sum = 0;
    int prev = Transitions.START;
    for (int k : plan.order()) {
      sum += costFrom(prev, k);
      prev = k;
    }
    return sum;
  }

  /** The plan's rank under the model's transitions. */
  public Score score(Plan plan) {
    return new Score(plan.requiredMissing(problem), plan.prize(problem), 1000 * transitionS(plan));
  }

  /** True when the plan respects spans, exposure options and model transitions. */
  public boolean feasible(Plan plan) {
    long end = 0;
    int prev = Transitions.START;
    for (int q = 0; q < plan.size(); q++) {
      int k = plan.order()[q];
      Task t = problem.task(k);
      long c = costFrom(prev, k);
      long s = plan.startS()[q];
      long d = plan.durationS()[q];
      if (c < 0 || s < end + c || !t.fits(s, d) || !isOption(t, d)) {
        return false;
      }
      end = s + d;
      prev = k;
    }
    return true;
  }

  private static boolean isOption(Task t, long d) {
    try {
      t.option(d);
      return true;
    } catch (IllegalStateException e) {
      return false;
    }
  }

  /**
   * Earliest-start schedule of {@code order} under model transitions at the exposures {@code durS}
   * (parallel to {@code order}; {@code null} = each task's shortest): each request starts at the first
   * second after the previous end plus the arc cost at which one span holds it; requests that no longer
   * fit are dropped.
   */
  public Plan retime(int[] order, long[] durS) {
    List<long[]> kept = new ArrayList<>(); // {k, start, duration}
    long end = 0;
    int prev = Transitions.START;
    for (int q = 0; q < order.length; q++) {
      int k = order[q];
      long c = costFrom(prev, k);
      if (c < 0) {
        continue;
      }
      long d = durS == null ? problem.task(k).durationS() : durS[q];
      long s = problem.task(k).firstFittingStart(end + c, d);
      if (s < 0) {
        continue;
      }
      kept.add(new long[] {k, s, d});
      end = s + d;
      prev = k;
    }
    int[] o = new int[kept.size()];
    long[] st = new long[kept.size()];
    long[] du = new long[kept.size()];
    for (int q = 0; q < o.length; q++) {
      o[q] = (int) kept.get(q)[0];
      st[q] = kept.get(q)[1];
      du[q] = kept.get(q)[2];
    }
    return new Plan(o, st, du);
  }

  /** {@link #retime(int[], long[])} keeping the plan's exposures. */
  public Plan retime(Plan plan) {
    return retime(plan.order(), plan.durationS());
  }
}
