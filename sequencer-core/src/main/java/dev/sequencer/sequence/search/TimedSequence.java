package dev.sequencer.sequence.search;

import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.StartRange;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.slew.Transitions;
import java.util.Arrays;

/**
 * A sequence of fixed-duration requests kept at earliest starts under the model transitions (as
 * {@link ArcCosts#retime}), with each position's slack: how much its start can be delayed with every later
 * observation still in its current start range. The slack answers most insertion checks in O(1).
 * Changes that would break the sequence are refused (insertions are checked before, removals and
 * relocations report failure and leave the sequence as it was).
 */
final class TimedSequence {
  /** Observations re-timed one by one when an insertion exceeds the slack; beyond, the insertion is refused. */
  static final int PROPAGATION_REACH = 2;

  private final PlanningProblem problem;
  private final ArcCosts arcs;
  private final int[] order;
  private final long[] start;
  private final long[] slack;
  private final boolean[] planned;
  private int m;
  /** Insertion and move evaluations so far (the work measure of reproducible runs). */
  long evaluations;

  TimedSequence(PlanningProblem problem, ArcCosts arcs) {
    this.problem = problem;
    this.arcs = arcs;
    int n = problem.size();
    this.order = new int[n];
    this.start = new long[n];
    this.slack = new long[n];
    this.planned = new boolean[n];
  }

  int size() {
    return m;
  }

  int requestAt(int q) {
    return order[q];
  }

  long startAt(int q) {
    return start[q];
  }

  long slackAt(int q) {
    return slack[q];
  }

  boolean planned(int k) {
    return planned[k];
  }

  /** The requests in order (a copy). */
  int[] order() {
    return Arrays.copyOf(order, m);
  }

  Plan toPlan() {
    return Plan.atShortest(problem, Arrays.copyOf(order, m), Arrays.copyOf(start, m));
  }

  /** Position of request k, or {@link #size()} when it is not planned. */
  int positionOf(int k) {
    for (int q = 0; q < m; q++) {
      if (order[q] == k) {
        return q;
      }
    }
    return m;
  }

  /** Takes {@code seq} at earliest starts; throws when it does not fit (callers pass sequences of plans). */
  void load(int[] seq) {
    Arrays.fill(planned, false);
    m = 0;
    for (int k : seq) {
      order[m++] = k;
      planned[k] = true;
    }
    if (!retimeFrom(0)) {
      throw new IllegalStateException("a sequence that does not fit under the model transitions (a bug)");
    }
  }

  long end(int q) {
    return start[q] + problem.task(order[q]).durationS();
  }

  /** Earliest start of k after {@code prev} ending at {@code prevEnd}; -1 when k cannot follow. */
  long earliestAfter(int prev, long prevEnd, int k) {
    long c = arcs.costFrom(prev, k);
    return c < 0 ? -1 : problem.task(k).firstStartAtOrAfter(prevEnd + c);
  }

  /**
   * Time used by inserting k before position pos: how much later the observation at pos must start (0
   * when k fits in the idle time before it), or at the end how much later the sequence ends; -1 when k
   * does not fit there or a later observation would no longer fit. The slack answers most cases at
   * once; beyond it up to {@link #PROPAGATION_REACH} later observations are re-timed one by one.
   */
  long insertionCost(int k, int pos) {
    evaluations++;
    long prevEnd = pos == 0 ? 0 : end(pos - 1);
    long sk = earliestAfter(pos == 0 ? Transitions.START : order[pos - 1], prevEnd, k);
    if (sk < 0) {
      return -1;
    }
    long endK = sk + problem.task(k).durationS();
    if (pos == m) {
      return endK - prevEnd;
    }
    long c = arcs.cost(k, order[pos]);
    if (c < 0) {
      return -1;
    }
    long shift = endK + c - start[pos];
    if (shift <= 0 || shift <= slack[pos]) {
      return Math.max(0, shift);
    }
    return start[pos] + shift > problem.task(order[pos]).latestStartS() ? -1 : propagatedShift(k, endK, pos);
  }

  /** Seconds from the previous end to the end of k's transition into position pos (a tie-breaker). */
  long consumed(int k, int pos) {
    long prevEnd = pos == 0 ? 0 : end(pos - 1);
    long sk = earliestAfter(pos == 0 ? Transitions.START : order[pos - 1], prevEnd, k);
    long out = pos == m ? 0 : Math.max(0, arcs.cost(k, order[pos]));
    return sk + problem.task(k).durationS() + out - prevEnd;
  }

  /** Inserts k before position pos (checked by {@link #insertionCost} first). */
  void insert(int k, int pos) {
    System.arraycopy(order, pos, order, pos + 1, m - pos);
    System.arraycopy(start, pos, start, pos + 1, m - pos);
    order[pos] = k;
    m++;
    planned[k] = true;
    if (!retimeFrom(pos)) {
      throw new IllegalStateException("insertion of " + problem.task(k).id() + " broke the plan (a bug)");
    }
  }

  /**
   * Removes the positions marked in {@code drop} and moves the rest to earliest starts; false (and the
   * sequence as it was) when a new neighbour pair does not fit (tables without the triangle inequality).
   */
  boolean remove(boolean[] drop) {
    int[] before = order();
    int write = 0;
    int first = m;
    for (int q = 0; q < m; q++) {
      if (drop[q]) {
        planned[order[q]] = false;
        first = Math.min(first, q);
        continue;
      }
      order[write] = order[q];
      start[write] = start[q];
      write++;
    }
    m = write;
    if (retimeFrom(Math.min(first, m))) {
      return true;
    }
    load(before);
    return false;
  }

  /** Change of total model transition when the observation at q moves to position p (q != p); MAX_VALUE if impossible. */
  long moveDelta(int q, int p) {
    evaluations++;
    int k = order[q];
    int before = q == 0 ? Transitions.START : order[q - 1];
    if (q + 1 < m && arcs.costFrom(before, order[q + 1]) < 0) {
      return Long.MAX_VALUE;
    }
    long removed = arcs.costFrom(before, k) + (q + 1 < m ? arcs.cost(k, order[q + 1]) - arcs.costFrom(before, order[q + 1]) : 0);
    // After the removal k goes between a and b (positions after q shift down by one when p > q).
    int a = p < q ? (p == 0 ? Transitions.START : order[p - 1]) : order[p];
    int b = p < q ? order[p] : (p + 1 < m ? order[p + 1] : -1);
    if (arcs.costFrom(a, k) < 0 || (b >= 0 && arcs.cost(k, b) < 0)) {
      return Long.MAX_VALUE;
    }
    long added = arcs.costFrom(a, k) + (b >= 0 ? arcs.cost(k, b) - arcs.costFrom(a, b) : 0);
    return added - removed;
  }

  /** Moves the observation at q to position p when the result fits at earliest starts; else leaves it. */
  boolean relocate(int q, int p) {
    int[] saved = order();
    int k = order[q];
    int w = 0;
    for (int i = 0; i < saved.length; i++) {
      if (i == q) {
        continue;
      }
      if (w == p && p < q) {
        order[w++] = k;
      }
      order[w++] = saved[i];
      if (w == p && p > q) {
        order[w++] = k;
      }
    }
    if (retimeFrom(0)) {
      return true;
    }
    load(saved);
    return false;
  }

  /** Recomputes earliest starts from position q on, then every slack; false when some observation no longer fits. */
  private boolean retimeFrom(int q) {
    for (int i = q; i < m; i++) {
      long s = earliestAfter(i == 0 ? Transitions.START : order[i - 1], i == 0 ? 0 : end(i - 1), order[i]);
      if (s < 0) {
        return false;
      }
      start[i] = s;
    }
    for (int i = m - 1; i >= 0; i--) {
      long own = latestInRange(order[i], start[i]) - start[i];
      slack[i] = i == m - 1 ? own
          : Math.min(own, start[i + 1] - (end(i) + arcs.cost(order[i], order[i + 1])) + slack[i + 1]);
    }
    return true;
  }

  /** The last allowed start of k in the start range holding {@code s}. */
  private long latestInRange(int k, long s) {
    for (StartRange r : problem.task(k).starts()) {
      if (s >= r.fromS() && s <= r.toS()) {
        return r.toS();
      }
    }
    throw new IllegalStateException("start " + s + " s of " + problem.task(k).id() + " is not allowed (a bug)");
  }

  /**
   * The delay of position pos when k, ending at {@code endK}, precedes it, found by re-timing the later
   * observations one by one (they may move to later start ranges); -1 when one no longer fits.
   */
  private long propagatedShift(int k, long endK, int pos) {
    int before = k;
    long beforeEnd = endK;
    long first = -1;
    for (int q = pos; q < m; q++) {
      long s = earliestAfter(before, beforeEnd, order[q]);
      if (s < 0 || q - pos >= PROPAGATION_REACH) {
        return -1; // beyond the reach: treated as not fitting (conservative)
      }
      if (q == pos) {
        first = s - start[q];
      }
      if (s <= start[q]) {
        break; // unchanged from here on
      }
      before = order[q];
      beforeEnd = s + problem.task(order[q]).durationS();
    }
    return Math.max(0, first);
  }
}
