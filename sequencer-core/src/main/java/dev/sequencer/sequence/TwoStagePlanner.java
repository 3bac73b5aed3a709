package dev.sequencer.sequence;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPObjective;
import com.google.ortools.linearsolver.MPSolver;
import com.google.ortools.linearsolver.MPVariable;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The two-stage baseline for flexible exposures, kept for comparison with the joint model.
 *
 * <p>Stage 1: every flexible request gets a preset exposure, its "knee" = the grid exposure with the best
 * value per second used, v(d) / (d + c̄), where c̄ is the mean model transition into it; the fixed-duration
 * sequencer (CP-SAT, the given share of the time) then selects and orders the requests. Stage 2: with
 * that order and each observation's window kept, a linear program (GLOP) re-allocates the time among the
 * chosen flexible requests: maximise Σ u_i subject to u_i below every chord of the upper concave envelope
 * of i's grid values, d_i in [min_i, max_i], start_i ≥ end_{i−1} + model transition, start and end inside
 * the kept window. Exposures are rounded down to the grid (so the sequence stays feasible), then the time
 * left over is handed out one grid step at a time to the member with the largest value gain that still
 * fits. For concave curves the LP is the exact continuous optimum of stage 2; for others it optimises the
 * envelope, and the rounding evaluates the true curve.
 */
final class TwoStagePlanner {
  private final PlanningProblem problem;
  private final ArcCosts arcs;

  TwoStagePlanner(PlanningProblem problem, ArcCosts arcs) {
    this.problem = problem;
    this.arcs = arcs;
  }

  /** The two-stage plan; stage 1 runs the sequencer with {@code stage1}. */
  Plan plan(SequencerOptions stage1) {
    Plan chosen = selectWithPresetExposures(stage1);
    if (chosen.size() == 0) {
      return chosen;
    }
    long[] continuous = reallocate(chosen);
    return roundToGrid(chosen, continuous);
  }

  /**
   * Stage 2 alone on any plan: keeps its order and windows, re-allocates the exposures by the LP and
   * rounds them to the grid; returns the result only when its value is larger, else {@code plan}.
   */
  Plan polish(Plan plan) {
    if (plan.size() == 0) {
      return plan;
    }
    Plan out = roundToGrid(plan, reallocate(plan));
    return out.size() == plan.size() && out.priority(problem) > plan.priority(problem) + 1e-9 ? out : plan;
  }

  /** The knee of flexible request k (see the class comment), seconds. */
  long knee(int k) {
    Exposure e = problem.exposure(k);
    double meanIn = meanTransitionInto(k);
    long best = e.minS();
    double bestScore = -1;
    for (int g = 0; g < e.count(); g++) {
      double score = e.values()[g] / (e.durationS(g) + meanIn);
      if (score > bestScore + 1e-15) {
        bestScore = score;
        best = e.durationS(g);
      }
    }
    return best;
  }

  private double meanTransitionInto(int k) {
    double sum = 0;
    int count = 0;
    for (int i = Transitions.START; i < problem.size(); i++) {
      long c = i == Transitions.START ? arcs.fromStart(k) : i == k ? -1 : arcs.cost(i, k);
      if (c >= 0) {
        sum += c;
        count++;
      }
    }
    return count == 0 ? 0 : sum / count;
  }

  /** Stage 1: the fixed-duration sequencer with every flexible request at its knee. */
  private Plan selectWithPresetExposures(SequencerOptions options) {
    List<Request> fixed = new ArrayList<>();
    Map<String, Integer> index = new HashMap<>();
    long[] preset = new long[problem.size()];
    for (int k = 0; k < problem.size(); k++) {
      Request r = problem.requests().get(k);
      index.put(r.id(), k);
      Exposure e = problem.exposure(k);
      if (e == null || !problem.tasks().get(k).schedulable()) {
        preset[k] = problem.tasks().get(k).durationS();
        fixed.add(e == null ? r : new Request(r.id(), r.target(), (double) e.minS(),
            PlanningProblem.MIN_FLEXIBLE_PRIORITY, r.required(), r.windows(), null));
        continue;
      }
      preset[k] = knee(k);
      double v = Math.max(e.values()[e.index(preset[k])], PlanningProblem.MIN_FLEXIBLE_PRIORITY);
      fixed.add(new Request(r.id(), r.target(), (double) preset[k], v, r.required(), r.windows(), null));
    }
    List<RequestWindows> windows = problem.windows();
    PlanningProblem stage1 = PlanningProblem.of(problem.horizon(), fixed, windows, problem.transitions());
    SequencerResult result = new Sequencer().plan(stage1, options.withSolver(SequencerOptions.Solver.CPSAT));
    if (!result.hasPlan()) {
      return Plan.EMPTY;
    }
    int m = result.observations().size();
    int[] order = new int[m];
    long[] starts = new long[m];
    long[] durs = new long[m];
    for (int q = 0; q < m; q++) {
      SequencerResult.Planned p = result.observations().get(q);
      order[q] = index.get(p.id());
      starts[q] = p.startS();
      durs[q] = p.endS() - p.startS();
    }
    return new Plan(order, starts, durs);
  }

  /** Stage 2: the LP re-allocation; returns the continuous exposures (whole seconds, rounded down). */
  private long[] reallocate(Plan plan) {
    NativeSolver.ensureLoaded();
    MPSolver lp = MPSolver.createSolver("GLOP");
    if (lp == null) {
      throw new IllegalStateException("GLOP is not available (a packaging bug)");
    }
    int m = plan.size();
    MPVariable[] start = new MPVariable[m];
    MPVariable[] dur = new MPVariable[m];
    MPObjective objective = lp.objective();
    objective.setMaximization();
    for (int q = 0; q < m; q++) {
      int k = plan.order()[q];
      Exposure e = problem.exposure(k);
      String id = problem.tasks().get(k).id();
      long s = plan.startS()[q];
      long d = plan.durationS(problem, q);
      long[] span = spanHolding(k, s, d);
      long lo = e == null ? d : e.minS();
      long hi = e == null ? d : e.maxS();
      start[q] = lp.makeNumVar(span[0], span[1] - lo, "startS[" + id + "]");
      dur[q] = lp.makeNumVar(lo, hi, "exposureS[" + id + "]");
      MPConstraint inside = lp.makeConstraint(Double.NEGATIVE_INFINITY, span[1], "inWindow[" + id + "]");
      inside.setCoefficient(start[q], 1);
      inside.setCoefficient(dur[q], 1);
      long c = arcs.costFrom(q == 0 ? Transitions.START : plan.order()[q - 1], k);
      MPConstraint after = lp.makeConstraint(c, Double.POSITIVE_INFINITY, "after[" + id + "]");
      after.setCoefficient(start[q], 1);
      if (q > 0) {
        after.setCoefficient(start[q - 1], -1);
        after.setCoefficient(dur[q - 1], -1);
      }
      if (e != null) {
        addEnvelope(lp, objective, e, dur[q], id);
      }
    }
    MPSolver.ResultStatus status = lp.solve();
    long[] out = plan.durations(problem);
    if (status != MPSolver.ResultStatus.OPTIMAL) {
      return out; // the stage-1 exposures stay (they are feasible)
    }
    for (int q = 0; q < m; q++) {
      out[q] = (long) Math.floor(dur[q].solutionValue() + 1e-6);
    }
    lp.delete();
    return out;
  }

  /** Adds u ≤ each chord of the upper concave envelope of the grid values (u maximised with weight 1). */
  private static void addEnvelope(MPSolver lp, MPObjective objective, Exposure e, MPVariable dur, String id) {
    MPVariable u = lp.makeNumVar(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, "value[" + id + "]");
    objective.setCoefficient(u, 1);
    List<Integer> hull = upperHull(e);
    if (hull.size() == 1) {
      MPConstraint c = lp.makeConstraint(Double.NEGATIVE_INFINITY, e.values()[hull.get(0)], "chord[" + id + "]");
      c.setCoefficient(u, 1);
      return;
    }
    for (int h = 0; h + 1 < hull.size(); h++) {
      int a = hull.get(h);
      int b = hull.get(h + 1);
      double slope = (e.values()[b] - e.values()[a]) / (e.durationS(b) - e.durationS(a));
      // u - slope·d <= v_a - slope·d_a
      MPConstraint c = lp.makeConstraint(Double.NEGATIVE_INFINITY, e.values()[a] - slope * e.durationS(a),
          "chord[" + id + "][" + h + "]");
      c.setCoefficient(u, 1);
      c.setCoefficient(dur, -slope);
    }
  }

  /** Grid indices of the upper concave hull of (durationS(g), values[g]) (monotone chain). */
  static List<Integer> upperHull(Exposure e) {
    List<Integer> hull = new ArrayList<>();
    for (int g = 0; g < e.count(); g++) {
      while (hull.size() >= 2) {
        int a = hull.get(hull.size() - 2);
        int b = hull.get(hull.size() - 1);
        double cross = (e.durationS(b) - e.durationS(a)) * (e.values()[g] - e.values()[a])
            - (e.values()[b] - e.values()[a]) * (e.durationS(g) - e.durationS(a));
        if (cross >= 0) {
          hull.remove(hull.size() - 1); // b lies on or below the chord a-g
        } else {
          break;
        }
      }
      hull.add(g);
    }
    return hull;
  }

  /** The [from, to] window (seconds) that holds the observation [s, s + d] of request k. */
  private long[] spanHolding(int k, long s, long d) {
    Exposure e = problem.exposure(k);
    if (e != null) {
      for (Exposure.Span sp : e.spans()) {
        if (s >= sp.fromS() && s + d <= sp.toS()) {
          return new long[] {sp.fromS(), sp.toS()};
        }
      }
      throw new IllegalStateException("observation of " + problem.tasks().get(k).id() + " at " + s + " s lies in no "
          + "window (a bug)");
    }
    for (PlanningProblem.StartRange r : problem.tasks().get(k).starts()) {
      if (s >= r.fromS() && s <= r.toS()) {
        return new long[] {r.fromS(), r.toS() + d};
      }
    }
    throw new IllegalStateException("observation of " + problem.tasks().get(k).id() + " at " + s + " s has no "
        + "allowed start (a bug)");
  }

  /** Rounds exposures down to the grid, re-times the sequence, then hands out the spare steps (best gain first). */
  private Plan roundToGrid(Plan chosen, long[] continuous) {
    int m = chosen.size();
    long[] durs = new long[m];
    for (int q = 0; q < m; q++) {
      Exposure e = problem.exposure(chosen.order()[q]);
      if (e == null) {
        durs[q] = chosen.durationS(problem, q);
        continue;
      }
      long g = Math.max(0, Math.min(e.count() - 1, (continuous[q] - e.minS()) / e.stepS()));
      durs[q] = e.durationS((int) g);
    }
    Plan plan = Plan.retime(problem, arcs, chosen.order(), durs);
    if (plan.size() != m) {
      return Plan.retime(problem, arcs, chosen.order(), chosen.durations(problem)); // stage 1 as it was
    }
    boolean grown = true;
    while (grown) {
      grown = false;
      Integer[] byGain = new Integer[m];
      for (int q = 0; q < m; q++) {
        byGain[q] = q;
      }
      final long[] cur = durs;
      Arrays.sort(byGain, (a, b) -> Double.compare(gain(chosen.order()[b], cur[b]), gain(chosen.order()[a], cur[a])));
      for (int q : byGain) {
        if (!(gain(chosen.order()[q], durs[q]) > 0)) {
          break;
        }
        long[] next = durs.clone();
        next[q] += problem.exposure(chosen.order()[q]).stepS();
        Plan trial = Plan.retime(problem, arcs, chosen.order(), next);
        if (trial.size() == m) {
          durs = next;
          plan = trial;
          grown = true;
          break;
        }
      }
    }
    return plan;
  }

  /** Value gained by one more grid step of request k at exposure d (−∞ when fixed or at its maximum). */
  private double gain(int k, long d) {
    Exposure e = problem.exposure(k);
    if (e == null) {
      return Double.NEGATIVE_INFINITY;
    }
    int g = e.index(d);
    return g + 1 < e.count() ? e.values()[g + 1] - e.values()[g] : Double.NEGATIVE_INFINITY;
  }
}
