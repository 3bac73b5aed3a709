package dev.sequencer.sequence;

import dev.sequencer.sequence.PlanningProblem.Task;
import dev.sequencer.slew.Transitions;
import java.util.Arrays;
import java.util.Random;

/**
 * An iterated insertion search for the prize-collecting problem, run before CP-SAT to give it a better
 * warm start: insert, tighten, perturb, repeat.
 *
 * <ul>
 *   <li>Insertion: among all (unplanned request, position) pairs that fit, insert the one with the largest
 *       priority² / time used, where the time used is how much later the next observation must start (0
 *       when the request fits in idle time) or, at the end, how much later the plan ends; repeat until
 *       nothing fits. Squaring the priority favours valuable requests over merely short ones.</li>
 *   <li>Tightening: move single observations up to {@link #MOVE_REACH} positions while that lowers the
 *       total model transition and the plan still fits, then insert again into the time freed.</li>
 *   <li>Perturbation: remove {@code r} observations — a run of consecutive ones from position {@code s},
 *       or (one time in {@link #WORST_ONE_IN}) those with the least priority per second used — move the
 *       rest to earliest starts and insert again, now and then (one time in {@link #TABU_ONE_IN}) first
 *       without the removed requests so that others get their place. {@code r} grows by one after each
 *       iteration that does not improve the best plan and falls back to 1 when it does (or reaches a
 *       third of the plan); {@code s} advances by {@code r} and one time in eight jumps to a random
 *       position. After {@link #RESTART_AFTER} iterations without improvement the search continues from
 *       the best plan; after {@link #STALL_LIMIT} it ends.</li>
 * </ul>
 *
 * <p>The plan is always kept at earliest starts under the model transitions (as {@link Plan#retime}), so
 * every plan it holds is model-feasible, and a request that must be last stays last. Plans rank by the
 * number of required requests missing (fewer first), then scaled priority, then model transition.
 * Fitting required requests are inserted before any optional one; while the best plan still misses one,
 * perturbations may remove required requests too (so the search also looks for a complete plan, e.g. a
 * tour with every customer); once it is complete they are never removed, except when every request is
 * required (a routing problem with time windows, where the search then shortens the tour).
 * Fixed-duration requests only (the caller uses other moves for flexible exposures). The random
 * generator is seeded and the budget can be an iteration or evaluation count, so with the same seed and
 * count the search repeats exactly.
 */
final class InsertionSearch {
  static final int RESTART_AFTER = 60;
  /** One perturbation in this many removes the observations with the least priority per second instead of a run. */
  static final int WORST_ONE_IN = 3;
  /** The search ends after this many iterations without a better plan. */
  static final int STALL_LIMIT = 3000;
  /** Observations re-timed one by one when an insertion exceeds the slack; beyond, the insertion is refused. */
  static final int PROPAGATION_REACH = 2;
  /** One perturbation in this many keeps the removed requests out of the first insertion round. */
  static final int TABU_ONE_IN = 4;

  private final PlanningProblem problem;
  private final ArcCosts arcs;
  private final PriorityScale scale;
  private final Random random;
  private final int n;
  private final int[] order;
  private final long[] start;
  /** How much each observation's start can be delayed with every later one still in its start range. */
  private final long[] maxShift;
  private int m;
  private final boolean[] planned;
  /** Requests removed by the current perturbation. */
  private final boolean[] tabu;
  private final boolean[] schedulable;
  private final long[] latest;
  private final long[] earliestEnd;
  private final double[] priority;
  private final boolean[] required;
  /** Every schedulable request is required (a routing problem): perturbations remove required ones too. */
  private final boolean allRequired;
  int iterations;
  int improvements;
  /** Insertion and move evaluations so far (the work measure of reproducible runs). */
  long evaluations;

  InsertionSearch(PlanningProblem problem, ArcCosts arcs, PriorityScale scale, int seed) {
    this.problem = problem;
    this.arcs = arcs;
    this.scale = scale;
    this.random = new Random(seed);
    this.n = problem.size();
    this.order = new int[n];
    this.start = new long[n];
    this.maxShift = new long[n];
    this.schedulable = new boolean[n];
    this.latest = new long[n];
    this.earliestEnd = new long[n];
    this.priority = new double[n];
    this.required = new boolean[n];
    for (int k = 0; k < n; k++) {
      Task t = problem.tasks().get(k);
      schedulable[k] = t.schedulable();
      latest[k] = schedulable[k] ? t.latestStartS() : -1;
      earliestEnd[k] = schedulable[k] ? t.earliestStartS() + t.durationS() : Long.MAX_VALUE;
      priority[k] = scale.scaledFor(problem, k, t.durationS());
      required[k] = t.required();
    }
    this.planned = new boolean[n];
    this.tabu = new boolean[n];
    boolean anyOptional = false;
    for (int k = 0; k < n; k++) {
      anyOptional |= schedulable[k] && !required[k];
    }
    this.allRequired = !anyOptional;
  }

  /**
   * Improves {@code initial} (fixed durations; re-timed under the model transitions first) until {@code deadlineNanos} (System.nanoTime)
   * or {@code maxIterations} perturbations or {@link #STALL_LIMIT} perturbations without a better plan,
   * whichever comes first; returns the best plan found.
   */
  Plan improve(Plan initial, long deadlineNanos, long maxIterations) {
    return improve(initial, deadlineNanos, maxIterations, Long.MAX_VALUE);
  }

  /**
   * As {@link #improve(Plan, long, long)}, also ending once {@code maxEvaluations} insertion and move
   * evaluations are spent (a machine-independent work budget for reproducible runs).
   */
  Plan improve(Plan initial, long deadlineNanos, long maxIterations, long maxEvaluations) {
    // The start may hold exact transitions shorter than the model's bounds: keep what fits under the model.
    load(Plan.retime(problem, arcs, initial.order()).order());
    insertAll(null);
    Plan best = snapshot();
    long[] bestKey = key(best);
    int r = 1;
    int s = 0;
    int sinceBest = 0;
    while (iterations < maxIterations && evaluations < maxEvaluations && System.nanoTime() < deadlineNanos
        && sinceBest < STALL_LIMIT
        && removableCount(bestKey[0] < 0 || allRequired) > 0) {
      iterations++;
      s = m == 0 ? 0 : s % m;
      int[] before = Arrays.copyOf(order, m);
      Arrays.fill(tabu, false);
      boolean anyRequest = bestKey[0] < 0 || allRequired;
      boolean removedOk = WORST_ONE_IN > 0 && random.nextInt(WORST_ONE_IN) == 0
          ? removeWorst(r, anyRequest) : removeRun(s, r, anyRequest);
      if (!removedOk) {
        load(before); // a new neighbour pair may not fit (tables without the triangle inequality)
        Arrays.fill(tabu, false);
      }
      if (random.nextInt(TABU_ONE_IN) == 0) {
        insertAll(tabu); // now and then the removed requests wait one round, so others get their place
      }
      insertAll(null);
      if (tighten()) {
        insertAll(null);
      }
      Plan current = snapshot();
      long[] k = key(current);
      if (Arrays.compare(k, bestKey) > 0) {
        best = current;
        bestKey = k;
        r = 1;
        sinceBest = 0;
        improvements++;
      } else {
        r++;
        sinceBest++;
        if (sinceBest % RESTART_AFTER == 0) {
          load(best.order());
        }
      }
      s += r;
      if (r > Math.max(1, m / 3)) {
        r = 1;
      }
      if (random.nextInt(8) == 0) {
        s = random.nextInt(Math.max(1, m));
      }
    }
    return best;
  }

  /** Comparison key, larger is better: (−missing required requests, scaled priority, −model transition). */
  private long[] key(Plan p) {
    boolean[] in = new boolean[n];
    for (int k : p.order()) {
      in[k] = true;
    }
    long missing = 0;
    for (int k = 0; k < n; k++) {
      missing += problem.tasks().get(k).required() && !in[k] ? 1 : 0;
    }
    return new long[] {-missing, p.scaledPriority(problem, scale), -p.modelTransitionS(arcs)};
  }

  static final int MOVE_REACH = 6;

  /**
   * Moves single observations up to {@link #MOVE_REACH} positions earlier or later while that lowers the
   * total model transition and the sequence still fits; true when something moved. Less transition
   * leaves more time for the next insertions.
   */
  private boolean tighten() {
    boolean any = false;
    boolean moved = true;
    int last = problem.mustBeLastIndex();
    int[] trial = new int[n];
    while (moved) {
      moved = false;
      for (int q = 0; q < m; q++) {
        if (order[q] == last) {
          continue;
        }
        for (int p = Math.max(0, q - MOVE_REACH); p <= Math.min(m - 1, q + MOVE_REACH); p++) {
          if (p == q || (last >= 0 && p == m - 1 && order[m - 1] == last) || moveDelta(q, p) >= 0) {
            continue;
          }
          relocated(q, p, trial);
          if (accept(trial)) {
            moved = true;
            any = true;
            break;
          }
        }
      }
    }
    return any;
  }

  /** Change of total model transition when the observation at q moves to position p (q != p); +∞ if impossible. */
  private long moveDelta(int q, int p) {
    evaluations++;
    int k = order[q];
    int before = q == 0 ? Transitions.START : order[q - 1];
    long removed = arcs.costFrom(before, k) + (q + 1 < m ? arcs.cost(k, order[q + 1]) : 0)
        - (q + 1 < m ? arcs.costFrom(before, order[q + 1]) : 0);
    // After removal, k goes between a and b: positions shift by one when p > q.
    int a = p < q ? (p == 0 ? Transitions.START : order[p - 1]) : order[p];
    int b = p < q ? order[p] : (p + 1 < m ? order[p + 1] : -1);
    long added = arcs.costFrom(a, k) + (b >= 0 ? arcs.cost(k, b) : 0) - (b >= 0 ? arcs.costFrom(a, b) : 0);
    if (arcs.costFrom(a, k) < 0 || (b >= 0 && arcs.cost(k, b) < 0)
        || (q + 1 < m && arcs.costFrom(before, order[q + 1]) < 0)) {
      return Long.MAX_VALUE;
    }
    return added - removed;
  }

  /** Writes the current sequence with the observation at q moved to position p into {@code out}. */
  private void relocated(int q, int p, int[] out) {
    int k = order[q];
    int w = 0;
    for (int i = 0; i < m; i++) {
      if (i == q) {
        continue;
      }
      if (w == p && p < q) {
        out[w++] = k;
      }
      out[w++] = order[i];
      if (w == p && p > q) {
        out[w++] = k;
      }
    }
  }

  /** Takes {@code seq[0..m)} as the current sequence when it fits at earliest starts; else keeps the current one. */
  private boolean accept(int[] seq) {
    long[] saved = Arrays.copyOf(start, m);
    int[] savedOrder = Arrays.copyOf(order, m);
    System.arraycopy(seq, 0, order, 0, m);
    if (retimeFrom(0)) {
      return true;
    }
    System.arraycopy(savedOrder, 0, order, 0, m);
    System.arraycopy(saved, 0, start, 0, m);
    retimeFrom(0);
    return false;
  }

  /** Takes {@code seq} as the current sequence at earliest starts (it must fit: it comes from a plan). */
  private void load(int[] seq) {
    Arrays.fill(planned, false);
    m = 0;
    for (int k : seq) {
      order[m] = k;
      planned[k] = true;
      m++;
    }
    if (!retimeFrom(0)) {
      throw new IllegalStateException("insertion search was given a sequence that does not fit (a bug)");
    }
  }

  private Plan snapshot() {
    return new Plan(Arrays.copyOf(order, m), Arrays.copyOf(start, m));
  }

  private long end(int q) {
    return start[q] + problem.tasks().get(order[q]).durationS();
  }

  /**
   * Recomputes earliest starts from position q on, then every position's slack; false when some
   * observation no longer fits.
   */
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
      if (i == m - 1) {
        maxShift[i] = own;
        continue;
      }
      long wait = start[i + 1] - (end(i) + arcs.cost(order[i], order[i + 1]));
      maxShift[i] = Math.min(own, wait + maxShift[i + 1]);
    }
    return true;
  }

  /** The last allowed start of k in the start range holding {@code s}. */
  private long latestInRange(int k, long s) {
    for (PlanningProblem.StartRange r : problem.tasks().get(k).starts()) {
      if (s >= r.fromS() && s <= r.toS()) {
        return r.toS();
      }
    }
    throw new IllegalStateException("start " + s + " s of " + problem.tasks().get(k).id() + " is not allowed (a bug)");
  }

  /** Earliest start of k after {@code prev} ending at {@code prevEnd}; -1 when k cannot follow. */
  private long earliestAfter(int prev, long prevEnd, int k) {
    long c = arcs.costFrom(prev, k);
    return c < 0 ? -1 : problem.tasks().get(k).firstStartAtOrAfter(prevEnd + c);
  }

  /**
   * Time used by inserting k before position pos: how much later the observation at pos must start (0
   * when k fits in the idle time before it), or at the end how much later the plan ends; -1 when k does
   * not fit there or a later observation would no longer fit. The slack of the later observations in
   * their current start ranges answers most cases at once; beyond it up to {@link #PROPAGATION_REACH} of
   * them are re-timed one by one.
   */
  private long insertionCost(int k, int pos) {
    evaluations++;
    long prevEnd = pos == 0 ? 0 : end(pos - 1);
    long sk = earliestAfter(pos == 0 ? Transitions.START : order[pos - 1], prevEnd, k);
    if (sk < 0) {
      return -1;
    }
    long endK = sk + problem.tasks().get(k).durationS();
    if (pos == m) {
      return endK - prevEnd;
    }
    long c = arcs.cost(k, order[pos]);
    if (c < 0) {
      return -1;
    }
    long shift = endK + c - start[pos];
    if (shift <= 0 || shift <= maxShift[pos]) {
      return Math.max(0, shift);
    }
    return start[pos] + shift > latest[order[pos]] ? -1 : propagatedShift(k, endK, pos);
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
      beforeEnd = s + problem.tasks().get(order[q]).durationS();
    }
    return Math.max(0, first);
  }

  /** Seconds from the previous end to the end of k's transition into position pos (tie-breaker). */
  private long consumed(int k, int pos) {
    long prevEnd = pos == 0 ? 0 : end(pos - 1);
    long sk = earliestAfter(pos == 0 ? Transitions.START : order[pos - 1], prevEnd, k);
    long out = pos == m ? 0 : Math.max(0, arcs.cost(k, order[pos]));
    return sk + problem.tasks().get(k).durationS() + out - prevEnd;
  }

  /** Inserts the best (priority² / time used) fitting pair until none fits; requests marked in {@code skip} wait. */
  private void insertAll(boolean[] skip) {
    int last = problem.mustBeLastIndex();
    while (true) {
      int bestK = -1;
      int bestPos = -1;
      double bestScore = -1;
      boolean bestRequired = false; // a fitting required request goes before any optional one
      int maxPos = last >= 0 && planned[last] ? positionOf(last) : m;
      for (int k = 0; k < n; k++) {
        if (planned[k] || !schedulable[k] || (skip != null && skip[k]) || (bestRequired && !required[k])) {
          continue;
        }
        double p = priority[k];
        for (int pos = k == last ? m : 0; pos <= maxPos; pos++) {
          if (pos > 0 && latest[k] < start[pos - 1]) {
            break; // every later position starts after k's last allowed start
          }
          if (pos < m && earliestEnd[k] > start[pos] + maxShift[pos]) {
            continue; // k cannot end before the next observation's latest start
          }
          long used = insertionCost(k, pos);
          if (used < 0) {
            continue;
          }
          double score = p * p / (used + 0.01 * consumed(k, pos) + 1.0);
          if (score > bestScore || (required[k] && !bestRequired)) {
            bestScore = score;
            bestK = k;
            bestPos = pos;
            bestRequired = required[k];
          }
        }
      }
      if (bestK < 0) {
        return;
      }
      insert(bestK, bestPos);
    }
  }

  private int positionOf(int k) {
    for (int q = 0; q < m; q++) {
      if (order[q] == k) {
        return q;
      }
    }
    return m;
  }

  private void insert(int k, int pos) {
    System.arraycopy(order, pos, order, pos + 1, m - pos);
    System.arraycopy(start, pos, start, pos + 1, m - pos);
    order[pos] = k;
    m++;
    planned[k] = true;
    if (!retimeFrom(pos)) {
      throw new IllegalStateException("insertion of " + problem.tasks().get(k).id() + " broke the plan (a bug)");
    }
  }

  /**
   * Removes up to r consecutive optional observations from position s on (required ones stay unless
   * {@code anyRequest}; a request that must be last always stays) and moves the rest to earliest starts;
   * false when that breaks the plan (the caller restores it).
   */
  private boolean removeRun(int s, int r, boolean anyRequest) {
    int write = s;
    int removed = 0;
    for (int q = s; q < m; q++) {
      int k = order[q];
      if (removed < r && (anyRequest || !required[k]) && k != problem.mustBeLastIndex()) {
        planned[k] = false;
        tabu[k] = true;
        removed++;
        continue;
      }
      order[write] = k;
      start[write] = start[q];
      write++;
    }
    m = write;
    return retimeFrom(s);
  }

  /**
   * Removes the r removable observations with the least priority per second used (duration plus the
   * transition into it), each ratio scaled by a random factor in [0.75, 1.25), and moves the rest to
   * earliest starts; false when that breaks the plan (the caller restores it).
   */
  private boolean removeWorst(int r, boolean anyRequest) {
    Integer[] byRatio = new Integer[m];
    double[] ratio = new double[m];
    int count = 0;
    for (int q = 0; q < m; q++) {
      int k = order[q];
      if ((anyRequest || !required[k]) && k != problem.mustBeLastIndex()) {
        long in = arcs.costFrom(q == 0 ? Transitions.START : order[q - 1], k);
        ratio[q] = priority[k] / (problem.tasks().get(k).durationS() + in + 1.0) * (0.75 + 0.5 * random.nextDouble());
        byRatio[count++] = q;
      }
    }
    Arrays.sort(byRatio, 0, count, (a, b) -> Double.compare(ratio[a], ratio[b]));
    boolean[] drop = new boolean[m];
    int first = m;
    for (int i = 0; i < Math.min(r, count); i++) {
      drop[byRatio[i]] = true;
      first = Math.min(first, byRatio[i]);
    }
    int write = 0;
    for (int q = 0; q < m; q++) {
      if (drop[q]) {
        planned[order[q]] = false;
        tabu[order[q]] = true;
        continue;
      }
      order[write] = order[q];
      start[write] = start[q];
      write++;
    }
    m = write;
    return retimeFrom(Math.min(first, m));
  }

  /** Observations a perturbation may remove (all but the must-be-last one when {@code anyRequest}). */
  private int removableCount(boolean anyRequest) {
    int count = 0;
    for (int q = 0; q < m; q++) {
      count += (anyRequest || !required[order[q]]) && order[q] != problem.mustBeLastIndex() ? 1 : 0;
    }
    return count;
  }
}
