package dev.sequencer.sequence.search;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPObjective;
import com.google.ortools.linearsolver.MPSolver;
import com.google.ortools.linearsolver.MPVariable;
import dev.sequencer.sequence.cpsat.NativeSolver;
import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Span;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.Function;

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
public final class TwoStagePlanner {
  private final PlanningProblem problem;
  private final ArcCosts arcs;

  public TwoStagePlanner(PlanningProblem problem, ArcCosts arcs) {
    this.problem = problem;
    this.arcs = arcs;
  }

  /**
   * The two-stage plan; {@code stage1} solves the fixed-duration problem (the sequencer with CP-SAT) and
   * returns its plan ({@link Plan#EMPTY} when none).
   */
  public Plan plan(Function<PlanningProblem, Plan> stage1) {
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
  public Plan polish(Plan plan) {
    if (plan.size() == 0) {
      return plan;
    }
    Plan out = roundToGrid(plan, reallocate(plan));
    return out.size() == plan.size() && out.priority(problem) > plan.priority(problem) + 1e-9 ? out : plan;
  }

  /** The knee of flexible request k (see the class comment), seconds. */
  public long knee(int k) {
    Task e = problem.task(k);
    double meanIn = meanTransitionInto(k);
    long best = e.durationS();
    double bestScore = -1;
    for (int g = 0; g < e.optionCount(); g++) {
      double score = e.value(g) / (e.durationS(g) + meanIn);
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

  /** Stage 1: the fixed-duration problem with every flexible request at its knee, solved by {@code stage1}. */
  private Plan selectWithPresetExposures(Function<PlanningProblem, Plan> stage1) {
    List<Task> fixed = new ArrayList<>();
    for (int k = 0; k < problem.size(); k++) {
      Task t = problem.task(k);
      if (t.optionCount() == 1 || !t.schedulable()) {
        fixed.add(t.optionCount() == 1 ? t : Task.fixedInSpans(t.id(), t.durationS(), t.priority(), t.required(),
            t.spans()));
        continue;
      }
      long preset = knee(k);
      fixed.add(Task.fixedInSpans(t.id(), preset, Math.max(t.valueFor(preset), 1e-9), t.required(), t.spans()));
    }
    Plan chosen = stage1.apply(problem.withTasks(fixed));
    return chosen.size() == 0 ? Plan.EMPTY : chosen;
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
      Task e = problem.task(k);
      String id = e.id();
      long s = plan.startS()[q];
      long d = plan.durationS()[q];
      Span span = e.spanHolding(s, d);
      boolean fixedDuration = e.optionCount() == 1;
      long lo = fixedDuration ? d : e.durationS();
      long hi = fixedDuration ? d : e.maxDurationS();
      start[q] = lp.makeNumVar(span.fromS(), span.toS() - lo, "startS[" + id + "]");
      dur[q] = lp.makeNumVar(lo, hi, "exposureS[" + id + "]");
      MPConstraint inside = lp.makeConstraint(Double.NEGATIVE_INFINITY, span.toS(), "inWindow[" + id + "]");
      inside.setCoefficient(start[q], 1);
      inside.setCoefficient(dur[q], 1);
      long c = arcs.costFrom(q == 0 ? Transitions.START : plan.order()[q - 1], k);
      MPConstraint after = lp.makeConstraint(c, Double.POSITIVE_INFINITY, "after[" + id + "]");
      after.setCoefficient(start[q], 1);
      if (q > 0) {
        after.setCoefficient(start[q - 1], -1);
        after.setCoefficient(dur[q - 1], -1);
      }
      if (!fixedDuration) {
        addEnvelope(lp, objective, e, dur[q], id);
      }
    }
    MPSolver.ResultStatus status = lp.solve();
    long[] out = plan.durations();
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
  private static void addEnvelope(MPSolver lp, MPObjective objective, Task e, MPVariable dur, String id) {
    MPVariable u = lp.makeNumVar(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, "value[" + id + "]");
    objective.setCoefficient(u, 1);
    List<Integer> hull = upperHull(e);
    if (hull.size() == 1) {
      MPConstraint c = lp.makeConstraint(Double.NEGATIVE_INFINITY, e.value(hull.get(0)), "chord[" + id + "]");
      c.setCoefficient(u, 1);
      return;
    }
    for (int h = 0; h + 1 < hull.size(); h++) {
      int a = hull.get(h);
      int b = hull.get(h + 1);
      double slope = (e.value(b) - e.value(a)) / (e.durationS(b) - e.durationS(a));
      // u - slope·d <= v_a - slope·d_a
      MPConstraint c = lp.makeConstraint(Double.NEGATIVE_INFINITY, e.value(a) - slope * e.durationS(a),
          "chord[" + id + "][" + h + "]");
      c.setCoefficient(u, 1);
      c.setCoefficient(dur, -slope);
    }
  }

  /** Grid indices of the upper concave hull of (durationS(g), values[g]) (monotone chain). */
  static List<Integer> upperHull(Task e) {
    List<Integer> hull = new ArrayList<>();
    for (int g = 0; g < e.optionCount(); g++) {
      while (hull.size() >= 2) {
        int a = hull.get(hull.size() - 2);
        int b = hull.get(hull.size() - 1);
        double cross = (e.durationS(b) - e.durationS(a)) * (e.value(g) - e.value(a))
            - (e.value(b) - e.value(a)) * (e.durationS(g) - e.durationS(a));
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

  /** Rounds exposures down to the grid, re-times the sequence, then hands out the spare steps (best gain first). */
  private Plan roundToGrid(Plan chosen, long[] continuous) {
    int m = chosen.size();
    long[] durs = new long[m];
    for (int q = 0; q < m; q++) {
      Task e = problem.task(chosen.order()[q]);
      if (e.optionCount() == 1) {
        durs[q] = chosen.durationS()[q];
        continue;
      }
      long g = Math.max(0, Math.min(e.optionCount() - 1, (continuous[q] - e.durationS()) / e.stepS()));
      durs[q] = e.durationS((int) g);
    }
    Plan plan = arcs.retime(chosen.order(), durs);
    if (plan.size() != m) {
      return arcs.retime(chosen.order(), chosen.durations()); // stage 1 as it was
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
        next[q] += problem.task(chosen.order()[q]).stepS();
        Plan trial = arcs.retime(chosen.order(), next);
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
    Task e = problem.task(k);
    if (e.optionCount() == 1) {
      return Double.NEGATIVE_INFINITY;
    }
    int g = e.option(d);
    return g + 1 < e.optionCount() ? e.value(g + 1) - e.value(g) : Double.NEGATIVE_INFINITY;
  }
}
