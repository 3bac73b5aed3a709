package dev.sequencer.sequence.search;

import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.search.ExposureAllocator.Front;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Exposure-aware local search: changes the set of observed requests one at a time and scores every
 * candidate order exactly with {@link ExposureAllocator} (each exposure and start re-chosen), keeping
 * only strict gains of total scaled value.
 *
 * <p>Moves (first improvement, scanning the unscheduled requests cyclically): insert an unscheduled
 * request in its best gap, or let it replace one optional observation; failing both, remove one of the
 * optional observations that lose the least value and insert any request (itself elsewhere included)
 * in the shortened order. A move is scored
 * from the forward lists of the prefix and the backward lists of the suffix, so its score is exact
 * without re-running the whole allocation. Deterministic: a budget of evaluated (state, exposure) pairs
 * bounds the work, the wall-clock deadline is a safety net.
 */
final class ExposureMoves {
  /** Optional observations tried for removal per round (those that lose the least value first). */
  static final int REMOVALS_PER_ROUND = 8;

  private final PlanningProblem problem;
  private final ArcCosts arcs;
  private final ExposureAllocator allocator;
  private long evaluations;
  /** Where the next scan of unscheduled requests starts (cyclic), so scans do not favour low indices. */
  private int cursor;
  int moves;

  /** Work done by the last {@link #improve} call: evaluated (state, exposure) pairs and profile points. */
  long evaluations() {
    return evaluations;
  }

  /** A candidate order and its exact value. */
  record Move(int[] order, long value) {}

  ExposureMoves(PlanningProblem problem, ArcCosts arcs) {
    this.problem = problem;
    this.arcs = arcs;
    this.allocator = new ExposureAllocator(problem, arcs);
  }

  /**
   * The best plan reached from {@code plan} by re-allocation and improving moves, never worse in scaled
   * value; stops at a local optimum, after {@code maxEvaluations} or at {@code deadlineNanos}.
   */
  Plan improve(Plan plan, long deadlineNanos, long maxEvaluations) {
    evaluations = 0;
    Plan current = reallocated(plan);
    while (evaluations < maxEvaluations && System.nanoTime() < deadlineNanos) {
      long value = current.optionPrize(problem);
      Move move = firstImproving(current.order(), value, deadlineNanos, maxEvaluations);
      if (move == null) {
        move = bestRelocation(current.order(), value, deadlineNanos, maxEvaluations);
      }
      if (move == null) {
        break;
      }
      Plan next = allocator.allocate(move.order());
      if (next == null || next.optionPrize(problem) != move.value()) {
        throw new IllegalStateException("move scored " + move.value() + " but allocates to "
            + (next == null ? "nothing" : next.optionPrize(problem)) + " (a bug)");
      }
      current = next;
      moves++;
    }
    return current;
  }

  /** {@code plan} with its exposures re-allocated when that adds value; else {@code plan}. */
  Plan reallocated(Plan plan) {
    Plan best = allocator.allocate(plan.order());
    return best != null && best.optionPrize(problem) > plan.optionPrize(problem) ? best : plan;
  }

  /**
   * The first request (scanning the unscheduled ones cyclically from where the last scan stopped) whose
   * best insertion or replacement beats {@code value}, at its best position; null when none does or the
   * budget ran out.
   */
  Move firstImproving(int[] order, long value, long deadlineNanos, long maxEvaluations) {
    Front[] forward = allocator.forward(order);
    Front[] backward = allocator.backward(order);
    if (forward == null) {
      return null;
    }
    List<Integer> candidates = unplanned(order);
    Front[][] profiles = new Front[2][order.length + 1];
    for (int r = 0; r < candidates.size(); r++) {
      if (evaluations >= maxEvaluations || System.nanoTime() >= deadlineNanos) {
        return null;
      }
      int x = candidates.get((cursor + r) % candidates.size());
      Move m = bestPlacement(order, forward, backward, profiles, x, value);
      if (m != null) {
        cursor = (cursor + r + 1) % candidates.size();
        return m;
      }
    }
    return null;
  }

  /** The best insertion or replacement of request x with a value above {@code value}, or null. */
  private Move bestPlacement(int[] order, Front[] forward, Front[] backward, Front[][] profiles, int x, long value) {
    Move best = null;
    long bestValue = value;
    for (int q = 0; q <= order.length; q++) {
      for (int b = q; b <= Math.min(q + 1, order.length); b++) {
        boolean allowed = b == q ? insertable(order, x, q) : replaceable(order, x, q);
        if (!allowed || upperBound(order, forward, backward, profiles, q, x, b) <= bestValue) {
          continue;
        }
        long v = through(order, forward, backward, q, x, b);
        if (v > bestValue) {
          bestValue = v;
          best = new Move(b == q ? inserted(order, q, x) : replaced(order, q, x), v);
        }
      }
    }
    return best;
  }

  /**
   * An upper bound of {@link #through}: the windows of x are ignored, so only the room between the prefix
   * and the suffix counts: max over exposures of value + slack profile at (transition in + exposure +
   * transition out).
   */
  private long upperBound(int[] order, Front[] forward, Front[] backward, Front[][] profiles, int a, int x, int b) {
    Front profile = profiles[b - a][a];
    if (profile == null) {
      profile = slackProfile(a == 0 ? Front.ORIGIN : forward[a - 1], backward[b]);
      profiles[b - a][a] = profile;
    }
    int from = a == 0 ? Transitions.START : order[a - 1];
    int next = b < order.length ? order[b] : -1;
    long cIn = arcs.costFrom(from, x);
    long cOut = next < 0 ? 0 : arcs.cost(x, next);
    if (cIn < 0 || cOut < 0) {
      return ExposureAllocator.INFEASIBLE;
    }
    long best = ExposureAllocator.INFEASIBLE;
    for (int g = 0; g < allocator.optionCount(x); g++) {
      long rest = profile.bestFrom(cIn + allocator.durationS(x, g) + cOut);
      if (rest != ExposureAllocator.INFEASIBLE) {
        best = Math.max(best, allocator.valueAt(x, g) + rest);
      }
    }
    return best;
  }

  /**
   * For a prefix (ends, values) and a suffix (latest arrivals, values): the largest prefix + suffix value
   * for each room (arrival − end) they leave, as a list of (room, value), room increasing.
   */
  Front slackProfile(Front before, Front after) {
    int n = before.size() * after.size();
    long[] room = new long[n];
    long[] value = new long[n];
    int used = 0;
    for (int i = 0; i < before.size(); i++) {
      for (int j = 0; j < after.size(); j++) {
        if (after.timeS()[j] >= before.timeS()[i]) {
          room[used] = after.timeS()[j] == Long.MAX_VALUE ? Long.MAX_VALUE : after.timeS()[j] - before.timeS()[i];
          value[used] = before.value()[i] + after.value()[j];
          used++;
        }
      }
    }
    evaluations += n;
    return allocator.paretoBackward(room, value, used);
  }

  /**
   * Removes one of the {@link #REMOVALS_PER_ROUND} optional observations that lose the least value and
   * returns the best insertion into the shortened order when it beats {@code value}; else null.
   */
  Move bestRelocation(int[] order, long value, long deadlineNanos, long maxEvaluations) {
    Front[] forward = allocator.forward(order);
    Front[] backward = allocator.backward(order);
    if (forward == null) {
      return null;
    }
    List<long[]> losses = new ArrayList<>(); // {position, value without it}
    for (int q = 0; q < order.length; q++) {
      if (!problem.task(order[q]).required()) {
        losses.add(new long[] {q, withoutPosition(order, forward, backward, q)});
      }
    }
    losses.sort(Comparator.comparingLong((long[] a) -> -a[1]).thenComparingLong(a -> a[0]));
    for (int r = 0; r < Math.min(REMOVALS_PER_ROUND, losses.size()); r++) {
      if (evaluations >= maxEvaluations || System.nanoTime() >= deadlineNanos) {
        return null;
      }
      int q = (int) losses.get(r)[0];
      Move m = firstImproving(removed(order, q), value, deadlineNanos, maxEvaluations);
      if (m != null) {
        return m;
      }
    }
    return null;
  }

  /** Value of {@code order} without position q (exact), or INFEASIBLE. */
  private long withoutPosition(int[] order, Front[] forward, Front[] backward, int q) {
    Front before = q == 0 ? Front.ORIGIN : forward[q - 1];
    int from = q == 0 ? Transitions.START : order[q - 1];
    int next = q + 1 < order.length ? order[q + 1] : -1;
    long c = next < 0 ? 0 : arcs.costFrom(from, next);
    if (c < 0) {
      return ExposureAllocator.INFEASIBLE;
    }
    long best = ExposureAllocator.INFEASIBLE;
    for (int i = 0; i < before.size(); i++) {
      long after = backward[q + 1].bestFrom(before.timeS()[i] + c);
      if (after != ExposureAllocator.INFEASIBLE) {
        best = Math.max(best, before.value()[i] + after);
      }
    }
    return best;
  }

  /**
   * Exact value of {@code order[0 .. a)}, then x, then {@code order[b ..]} (b = a: insertion; b = a + 1:
   * replacement of position a), or INFEASIBLE.
   */
  private long through(int[] order, Front[] forward, Front[] backward, int a, int x, int b) {
    Front before = a == 0 ? Front.ORIGIN : forward[a - 1];
    Front after = backward[b];
    int from = a == 0 ? Transitions.START : order[a - 1];
    int next = b < order.length ? order[b] : -1;
    long cIn = arcs.costFrom(from, x);
    long cOut = next < 0 ? 0 : arcs.cost(x, next);
    Task t = problem.task(x);
    if (cIn < 0 || cOut < 0 || after.size() == 0 || before.timeS()[0] + cIn > t.latestStartS()
        || (next >= 0 && t.earliestStartS() + t.durationS() + cOut > after.timeS()[after.size() - 1])) {
      return ExposureAllocator.INFEASIBLE;
    }
    long best = ExposureAllocator.INFEASIBLE;
    long latestReady = next < 0 ? t.latestStartS()
        : Math.min(t.latestStartS(), after.timeS()[after.size() - 1] - t.durationS() - cOut);
    for (int i = lastReadyBy(before, t.earliestStartS() - cIn); i < before.size()
        && before.timeS()[i] + cIn <= latestReady; i++) {
      for (int g = 0; g < allocator.optionCount(x); g++) {
        evaluations++;
        long d = allocator.durationS(x, g);
        long s = t.firstFittingStart(before.timeS()[i] + cIn, d);
        long rest = s < 0 ? ExposureAllocator.INFEASIBLE : after.bestFrom(s + d + cOut);
        if (rest != ExposureAllocator.INFEASIBLE) {
          best = Math.max(best, before.value()[i] + allocator.valueAt(x, g) + rest);
        }
      }
    }
    return best;
  }

  /**
   * Index of the last state ending by {@code timeS} (0 when none): every earlier state is ready before
   * the request's earliest start too, so it gets the same start and, being earlier, no more value.
   */
  private static int lastReadyBy(Front before, long timeS) {
    int i = java.util.Arrays.binarySearch(before.timeS(), timeS);
    int at = i >= 0 ? i : -i - 2;
    return Math.max(0, at);
  }

  /** Schedulable requests not in {@code order}, in index order. */
  private List<Integer> unplanned(int[] order) {
    boolean[] in = new boolean[problem.size()];
    for (int k : order) {
      in[k] = true;
    }
    List<Integer> out = new ArrayList<>();
    for (int k = 0; k < problem.size(); k++) {
      if (!in[k] && problem.task(k).schedulable()) {
        out.add(k);
      }
    }
    return out;
  }

  /** True when x may go in gap q (before position q): the must-be-last request stays last. */
  private boolean insertable(int[] order, int x, int q) {
    int last = problem.mustBeLastIndex();
    if (x == last) {
      return q == order.length;
    }
    return !(q == order.length && order.length > 0 && order[order.length - 1] == last);
  }

  /** True when x may replace position q: q is optional and the must-be-last request stays last. */
  private boolean replaceable(int[] order, int x, int q) {
    if (problem.task(order[q]).required()) {
      return false;
    }
    int last = problem.mustBeLastIndex();
    return x != last || q == order.length - 1;
  }

  private static int[] inserted(int[] order, int q, int x) {
    int[] out = new int[order.length + 1];
    System.arraycopy(order, 0, out, 0, q);
    out[q] = x;
    System.arraycopy(order, q, out, q + 1, order.length - q);
    return out;
  }

  private static int[] replaced(int[] order, int q, int x) {
    int[] out = order.clone();
    out[q] = x;
    return out;
  }

  private static int[] removed(int[] order, int q) {
    int[] out = new int[order.length - 1];
    System.arraycopy(order, 0, out, 0, q);
    System.arraycopy(order, q + 1, out, q, order.length - q - 1);
    return out;
  }
}
