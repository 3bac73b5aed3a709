package dev.sequencer.sequence.cpsat;

import com.google.ortools.sat.CpSolverStatus;
import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Sections;
import dev.sequencer.sequence.problem.StartRange;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Random;

/**
 * Large-neighbourhood search driven by us: repeatedly free a time slice of the plan (a run of
 * consecutive observations plus the unscheduled requests that could start inside it, 30–60 requests),
 * keep everything else fixed, solve that slice with CP-SAT (lexicographic objective, the current slice
 * as hint) and keep strict improvements of (priority, then model transition).
 *
 * <p>The slice is solved between its fixed neighbours: it may start after the previous observation ends
 * and must leave the transition to the next observation before that one starts, so the spliced plan is
 * feasible by construction (and checked). The rules between tasks (visits, groups) are stated with the plan
 * around the slice as constants ({@link RoutingModel.Spec#context}), and a candidate comes with the unplanned
 * tasks of its group and visits, so a chain or a visit sequence can enter in one move and no move breaks one. The slice length adapts: it grows after a sub-problem is
 * proven optimal quickly and shrinks after one times out. Slices are drawn with a seeded
 * {@link Random}, so with reproducible CP-SAT settings and a deterministic budget the search repeats
 * exactly.
 */
public final class NeighbourhoodSearch {
  /** Unscheduled requests offered to one slice, beyond its own observations. */
  private static final int MAX_CANDIDATES = 20;
  private static final int MIN_SLICE = 4;
  private static final int MAX_SLICE = 40;
  private static final double ROUND_TIME_S = 1.0;
  private static final double MIN_ROUND_DET = 0.1;

  private final PlanningProblem problem;
  private final ArcCosts arcs;
  private final RoutingModel model;
  private final Random random;
  private int rounds;
  private int improvements;

  public NeighbourhoodSearch(PlanningProblem problem, ArcCosts arcs, RoutingModel model, int seed) {
    this.problem = problem;
    this.arcs = arcs;
    this.model = model;
    this.random = new Random(seed);
  }

  /** LNS rounds so far. */
  public int rounds() {
    return rounds;
  }

  /** Rounds that improved the plan. */
  public int improvements() {
    return improvements;
  }

  /**
   * Improves {@code current} until the wall-clock deadline (nanoTime) or, in reproducible mode, until
   * {@code deterministicBudget} CP-SAT work units are spent; {@code onImprove} sees each new plan.
   */
  public Plan improve(Plan current, long deadlineNanos, double deterministicBudget, RoutingModel.Params params,
      java.util.function.Consumer<Plan> onImprove) {
    int slice = 8;
    double detUsed = 0;
    while (true) {
      double remaining = (deadlineNanos - System.nanoTime()) * 1e-9;
      if (params.reproducible() ? detUsed >= deterministicBudget : remaining < 0.05) {
        break;
      }
      int m = current.size();
      int len = Math.min(slice, m);
      int a = m - len <= 0 ? 0 : random.nextInt(m - len + 1);
      int b = a + len;
      int from = a == 0 ? Transitions.START : current.order()[a - 1];
      long departS = a == 0 ? 0 : current.endS(a - 1);
      int to = b == m ? -1 : current.order()[b];
      long arriveByS = b == m ? problem.horizonS() : current.startS()[b];
      int[] free = freeRequests(current, a, b, from, departS, arriveByS, to >= 0);
      Plan slicePlan = new Plan(java.util.Arrays.copyOfRange(current.order(), a, b),
          java.util.Arrays.copyOfRange(current.startS(), a, b),
          java.util.Arrays.copyOfRange(current.durationS(), a, b));
      RoutingModel.Spec spec = new RoutingModel.Spec(free, from, departS, to, arriveByS, slicePlan,
          free.length > 30 ? 12 : 0, current);
      double roundDet = Math.min(ROUND_TIME_S, Math.max(0.05, deterministicBudget - detUsed));
      RoutingModel.Outcome o = model.solve(spec,
          params.withTime(Math.min(ROUND_TIME_S, Math.max(0.05, remaining)), roundDet).withSink(null));
      rounds++;
      // Each round is charged at least MIN_ROUND_DET units, so a budget always ends after finitely many
      // rounds even when sub-problems take almost no deterministic time (model building is not counted).
      detUsed += Math.max(MIN_ROUND_DET, o.deterministicTime());
      if (o.status() == CpSolverStatus.OPTIMAL && o.solveS() < ROUND_TIME_S / 2) {
        slice = Math.min(MAX_SLICE, slice + 2);
      } else if (o.status() != CpSolverStatus.OPTIMAL) {
        slice = Math.max(MIN_SLICE, slice - 2);
      }
      if (o.plan() == null) {
        continue;
      }
      Plan next = splice(current, a, b, o.plan());
      // The slice model states every rule between tasks with the plan around it as constants, so a spliced
      // plan keeps them; one that does not is a bug (tests run with assertions) and is never taken.
      boolean keeps = problem.structure().holds(problem, next);
      assert keeps : "an LNS slice broke a rule between tasks (a bug): " + next;
      if (keeps && arcs.score(next).betterThan(arcs.score(current))) {
        if (!arcs.feasible(next)) {
          throw new IllegalStateException("LNS produced an infeasible plan (a bug): " + next);
        }
        current = next;
        improvements++;
        onImprove.accept(current);
      }
    }
    return current;
  }

  /**
   * The slice's observations plus up to {@link #MAX_CANDIDATES} unscheduled requests that could start in
   * it, the best first by priority per second used (duration plus the cheapest model transition into it
   * from the slice's start or one of its observations), each score scaled by a random factor in [0.5, 1.5)
   * so that successive rounds on the same slice try different candidates. With several resources, also the
   * other options of the slice's observations that could start in it.
   */
  private int[] freeRequests(Plan current, int a, int b, int from, long departS, long arriveByS, boolean hasSuccessor) {
    boolean[] planned = new boolean[problem.size()];
    for (int k : current.order()) {
      planned[k] = true;
    }
    List<Integer> free = new ArrayList<>();
    for (int q = a; q < b; q++) {
      free.add(current.order()[q]);
    }
    boolean[] fixedElsewhere = new boolean[problem.size()];
    Sections sections = problem.sections();
    if (sections != null) {
      // Several resources: a request observed outside the slice (on any resource) is not offered again.
      for (int q = 0; q < current.size(); q++) {
        int u = sections.unitOf(current.order()[q]);
        if ((q < a || q >= b) && u >= 0) {
          for (int o : sections.options(u)) {
            fixedElsewhere[o] = true;
          }
        }
      }
    }
    List<Integer> candidates = new ArrayList<>();
    double[] score = new double[problem.size()];
    for (int k = 0; k < problem.size(); k++) {
      Task t = problem.task(k);
      if (planned[k] || fixedElsewhere[k] || !t.schedulable() || (hasSuccessor && k == problem.mustBeLastIndex())
          || !startsBetween(t, departS, arriveByS)) {
        continue;
      }
      long in = nearestInto(k, from, free);
      if (in < 0) {
        continue;
      }
      candidates.add(k);
      score[k] = t.priority() / (double) (t.durationS() + in + 1) * (0.5 + random.nextDouble());
    }
    candidates.sort(Comparator.comparingDouble((Integer k) -> -score[k]).thenComparingInt(k -> k));
    java.util.Set<Integer> offered = new java.util.HashSet<>(candidates);
    int added = 0;
    for (int q = 0; q < candidates.size() && q < MAX_CANDIDATES; q++) {
      int k = candidates.get(q);
      if (free.contains(k)) {
        continue;
      }
      free.add(k);
      // Rules kept whole: a candidate comes with the other unplanned tasks of its group and visits that could
      // start in the slice, so that a chain or a visit sequence can enter the plan in one move.
      for (int o : ruleMates(k)) {
        if (added < MAX_CANDIDATES && offered.contains(o) && !free.contains(o)) {
          free.add(o);
          added++;
        }
      }
    }
    if (sections != null) {
      // A slice across a section marker frees the end of one resource and the start of the next: the other
      // options of its observations there may take them over (the model keeps at most one per request).
      for (int q = a; q < b; q++) {
        int u = sections.unitOf(current.order()[q]);
        for (int o : u < 0 ? new int[0] : sections.options(u)) {
          if (!planned[o] && !free.contains(o) && problem.task(o).schedulable()
              && startsBetween(problem.task(o), departS, arriveByS)) {
            free.add(o);
          }
        }
      }
    }
    return free.stream().mapToInt(Integer::intValue).toArray();
  }

  /** The other tasks of k's visit rule and group (empty without rules). */
  private int[] ruleMates(int k) {
    dev.sequencer.sequence.problem.Structure st = problem.structure();
    java.util.stream.IntStream mates = java.util.stream.IntStream.empty();
    if (st.visitRuleOf(k) != null) {
      mates = java.util.stream.IntStream.concat(mates, java.util.Arrays.stream(st.visitRuleOf(k).tasks()));
    }
    if (st.groupOf(k) != null) {
      mates = java.util.stream.IntStream.concat(mates, java.util.Arrays.stream(st.groupOf(k).members())
          .flatMapToInt(java.util.Arrays::stream));
    }
    return mates.filter(o -> o != k).distinct().toArray();
  }

  private static boolean startsBetween(Task t, long departS, long arriveByS) {
    for (StartRange r : t.starts()) {
      if (r.toS() >= departS && r.fromS() <= arriveByS - t.durationS()) {
        return true;
      }
    }
    return false;
  }

  /** Cheapest model transition into k from {@code from} or one of {@code members}; -1 when none can precede it. */
  private long nearestInto(int k, int from, List<Integer> members) {
    long best = arcs.costFrom(from, k);
    for (int i : members) {
      long c = arcs.cost(i, k);
      if (c >= 0 && (best < 0 || c < best)) {
        best = c;
      }
    }
    return best;
  }

  private Plan splice(Plan p, int a, int b, Plan mid) {
    int m = p.size() - (b - a) + mid.size();
    int[] order = new int[m];
    long[] starts = new long[m];
    long[] durs = new long[m];
    int q = 0;
    for (int k = 0; k < a; k++, q++) {
      order[q] = p.order()[k];
      starts[q] = p.startS()[k];
      durs[q] = p.durationS()[k];
    }
    for (int k = 0; k < mid.size(); k++, q++) {
      order[q] = mid.order()[k];
      starts[q] = mid.startS()[k];
      durs[q] = mid.durationS()[k];
    }
    for (int k = b; k < p.size(); k++, q++) {
      order[q] = p.order()[k];
      starts[q] = p.startS()[k];
      durs[q] = p.durationS()[k];
    }
    return new Plan(order, starts, durs);
  }
}
