package dev.sequencer.sequence.search;

import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Score;
import dev.sequencer.sequence.problem.Sections;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.timing.ArcCosts;
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
 * <p>The plan is a {@link TimedSequence}, always at earliest starts under the model transitions, so every
 * plan it holds is model-feasible, and a request that must be last stays last. Plans rank by their
 * {@link Score} under the model transitions.
 * Fitting required requests are inserted before any optional one; while the best plan still misses one,
 * perturbations may remove required requests too (so the search also looks for a complete plan, e.g. a
 * tour with every customer); once it is complete they are never removed, except when every request is
 * required (a routing problem with time windows, where the search then shortens the tour).
 * Fixed-duration requests only (the caller uses other moves for flexible exposures). The random
 * generator is seeded and the budget can be an iteration or evaluation count, so with the same seed and
 * count the search repeats exactly.
 */
public final class InsertionSearch {
  static final int RESTART_AFTER = 60;
  /** One perturbation in this many removes the observations with the least priority per second instead of a run. */
  static final int WORST_ONE_IN = 3;
  /** The search ends after this many iterations without a better plan. */
  static final int STALL_LIMIT = 3000;
  /** One perturbation in this many keeps the removed requests out of the first insertion round. */
  static final int TABU_ONE_IN = 4;
  /** Farthest position an observation is moved by {@link #tighten()}. */
  static final int MOVE_REACH = 6;

  private final PlanningProblem problem;
  private final ArcCosts arcs;
  private final Random random;
  private final int n;
  private final TimedSequence seq;
  /** Requests removed by the current perturbation. */
  private final boolean[] tabu;
  private final boolean[] schedulable;
  private final long[] latest;
  private final long[] earliestEnd;
  private final double[] priority;
  private final boolean[] required;
  /** Every schedulable request is required (a routing problem): perturbations remove required ones too. */
  private final boolean allRequired;
  private int iterations;
  private int improvements;

  public InsertionSearch(PlanningProblem problem, ArcCosts arcs, int seed) {
    this.problem = problem;
    this.arcs = arcs;
    this.random = new Random(seed);
    this.n = problem.size();
    this.seq = new TimedSequence(problem, arcs);
    this.tabu = new boolean[n];
    this.schedulable = new boolean[n];
    this.latest = new long[n];
    this.earliestEnd = new long[n];
    this.priority = new double[n];
    this.required = new boolean[n];
    boolean anyOptional = false;
    for (int k = 0; k < n; k++) {
      Task t = problem.task(k);
      schedulable[k] = t.schedulable();
      latest[k] = schedulable[k] ? t.latestStartS() : -1;
      earliestEnd[k] = schedulable[k] ? t.earliestStartS() + t.durationS() : Long.MAX_VALUE;
      priority[k] = problem.prizes().prize(k, 0);
      required[k] = t.required();
      anyOptional |= schedulable[k] && !required[k];
    }
    this.allRequired = !anyOptional;
  }

  /** Insertion and move evaluations so far (the work measure of reproducible runs). */
  public long evaluations() {
    return seq.evaluations;
  }

  /** Perturbation rounds so far. */
  public int iterations() {
    return iterations;
  }

  /** Rounds that found a better plan. */
  public int improvements() {
    return improvements;
  }

  /**
   * Improves {@code initial} (fixed durations; re-timed under the model transitions first) until
   * {@code deadlineNanos} (System.nanoTime) or {@code maxIterations} perturbations or
   * {@link #STALL_LIMIT} perturbations without a better plan, whichever comes first; returns the best
   * plan found.
   */
  public Plan improve(Plan initial, long deadlineNanos, long maxIterations) {
    return improve(initial, deadlineNanos, maxIterations, Long.MAX_VALUE, p -> { });
  }

  /**
   * As {@link #improve(Plan, long, long)}, also ending once {@code maxEvaluations} insertion and move
   * evaluations are spent (a machine-independent work budget for reproducible runs); {@code onBetter} sees
   * each new best plan.
   */
  public Plan improve(Plan initial, long deadlineNanos, long maxIterations, long maxEvaluations,
      java.util.function.Consumer<Plan> onBetter) {
    // The start may hold exact transitions shorter than the model's bounds: keep what fits under the model.
    seq.load(arcs.retime(initial.order(), null).order());
    insertAll(null);
    Plan best = seq.toPlan();
    Score bestKey = arcs.score(best);
    onBetter.accept(best);
    int r = 1;
    int s = 0;
    int sinceBest = 0;
    while (iterations < maxIterations && seq.evaluations < maxEvaluations && System.nanoTime() < deadlineNanos
        && sinceBest < STALL_LIMIT && removableCount(!bestKey.complete() || allRequired) > 0) {
      iterations++;
      int m = seq.size();
      s = m == 0 ? 0 : s % m;
      boolean anyRequest = !bestKey.complete() || allRequired;
      boolean[] drop = random.nextInt(WORST_ONE_IN) == 0 ? worst(r, anyRequest) : run(s, r, anyRequest);
      Arrays.fill(tabu, false);
      for (int q = 0; q < m; q++) {
        tabu[seq.requestAt(q)] = drop[q];
      }
      if (!seq.remove(drop)) {
        Arrays.fill(tabu, false); // a new neighbour pair did not fit: the sequence is unchanged
      }
      if (random.nextInt(TABU_ONE_IN) == 0) {
        insertAll(tabu); // now and then the removed requests wait one round, so others get their place
      }
      insertAll(null);
      if (tighten()) {
        insertAll(null);
      }
      Plan current = seq.toPlan();
      Score k = arcs.score(current);
      if (k.betterThan(bestKey)) {
        best = current;
        bestKey = k;
        onBetter.accept(best);
        r = 1;
        sinceBest = 0;
        improvements++;
      } else {
        r++;
        sinceBest++;
        if (sinceBest % RESTART_AFTER == 0) {
          seq.load(best.order());
        }
      }
      s += r;
      if (r > Math.max(1, seq.size() / 3)) {
        r = 1;
      }
      if (random.nextInt(8) == 0) {
        s = random.nextInt(Math.max(1, seq.size()));
      }
    }
    return best;
  }

  /**
   * Moves single observations up to {@link #MOVE_REACH} positions earlier or later while that lowers the
   * total model transition and the sequence still fits; true when something moved. Less transition
   * leaves more time for the next insertions.
   */
  private boolean tighten() {
    boolean any = false;
    boolean moved = true;
    int last = problem.mustBeLastIndex();
    while (moved) {
      moved = false;
      for (int q = 0; q < seq.size(); q++) {
        int m = seq.size();
        if (seq.requestAt(q) == last) {
          continue;
        }
        for (int p = Math.max(0, q - MOVE_REACH); p <= Math.min(m - 1, q + MOVE_REACH); p++) {
          if (p == q || (last >= 0 && p == m - 1 && seq.requestAt(m - 1) == last) || seq.moveDelta(q, p) >= 0) {
            continue;
          }
          if (seq.relocate(q, p)) {
            moved = true;
            any = true;
            break;
          }
        }
      }
    }
    return any;
  }

  /** True when another option of k's request (several resources, {@link Sections}) is planned. */
  private boolean mateHeld(int k) {
    Sections sections = problem.sections();
    if (sections == null || sections.unitOf(k) < 0) {
      return false;
    }
    for (int o : sections.options(sections.unitOf(k))) {
      if (o != k && seq.planned(o)) {
        return true;
      }
    }
    return false;
  }

  /** Inserts the best (priority² / time used) fitting pair until none fits; requests marked in {@code skip} wait. */
  private void insertAll(boolean[] skip) {
    int last = problem.mustBeLastIndex();
    while (true) {
      int m = seq.size();
      int bestK = -1;
      int bestPos = -1;
      double bestScore = -1;
      boolean bestRequired = false; // a fitting required request goes before any optional one
      int maxPos = last >= 0 && seq.planned(last) ? seq.positionOf(last) : m;
      for (int k = 0; k < n; k++) {
        if (seq.planned(k) || !schedulable[k] || (skip != null && skip[k]) || (bestRequired && !required[k])
            || mateHeld(k)) {
          continue;
        }
        double p = priority[k];
        for (int pos = k == last ? m : 0; pos <= maxPos; pos++) {
          if (pos > 0 && latest[k] < seq.startAt(pos - 1)) {
            break; // every later position starts after k's last allowed start
          }
          if (pos < m && earliestEnd[k] > seq.startAt(pos) + seq.slackAt(pos)) {
            continue; // k cannot end before the next observation's latest start
          }
          long used = seq.insertionCost(k, pos);
          if (used < 0) {
            continue;
          }
          double score = p * p / (used + 0.01 * seq.consumed(k, pos) + 1.0);
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
      seq.insert(bestK, bestPos);
    }
  }

  /** Positions of up to r consecutive removable observations from position s on. */
  private boolean[] run(int s, int r, boolean anyRequest) {
    boolean[] drop = new boolean[seq.size()];
    int removed = 0;
    for (int q = s; q < seq.size() && removed < r; q++) {
      if (removable(seq.requestAt(q), anyRequest)) {
        drop[q] = true;
        removed++;
      }
    }
    return drop;
  }

  /**
   * Positions of the r removable observations with the least priority per second used (duration plus
   * the transition into it), each ratio scaled by a random factor in [0.75, 1.25).
   */
  private boolean[] worst(int r, boolean anyRequest) {
    int m = seq.size();
    Integer[] byRatio = new Integer[m];
    double[] ratio = new double[m];
    int count = 0;
    for (int q = 0; q < m; q++) {
      int k = seq.requestAt(q);
      if (removable(k, anyRequest)) {
        long in = arcs.costFrom(q == 0 ? Transitions.START : seq.requestAt(q - 1), k);
        ratio[q] = priority[k] / (problem.task(k).durationS() + in + 1.0) * (0.75 + 0.5 * random.nextDouble());
        byRatio[count++] = q;
      }
    }
    Arrays.sort(byRatio, 0, count, (a, b) -> Double.compare(ratio[a], ratio[b]));
    boolean[] drop = new boolean[m];
    for (int i = 0; i < Math.min(r, count); i++) {
      drop[byRatio[i]] = true;
    }
    return drop;
  }

  /** A perturbation may remove k: optional (or any when {@code anyRequest}), and not the must-be-last one. */
  private boolean removable(int k, boolean anyRequest) {
    return (anyRequest || !required[k]) && k != problem.mustBeLastIndex();
  }

  /** Observations a perturbation may remove. */
  private int removableCount(boolean anyRequest) {
    int count = 0;
    for (int q = 0; q < seq.size(); q++) {
      count += removable(seq.requestAt(q), anyRequest) ? 1 : 0;
    }
    return count;
  }
}
