package dev.sequencer.sequence.bound;

import dev.sequencer.sequence.cpsat.NativeSolver;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.StartRange;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.timing.ArcCosts;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPObjective;
import com.google.ortools.linearsolver.MPSolver;
import com.google.ortools.linearsolver.MPVariable;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.List;

/**
 * An upper bound on total priority from a time-bucket LP relaxation that keeps each time span's capacity
 * and each request's predecessor, but drops the order.
 *
 * <p>Why it is valid. In any plan the model accepts, give request j the occupancy interval
 * [start_j − c(pred_j, j), end_j], where pred_j is the observation before j (or the start pointing) and
 * c the model transition. Since pred_j ends no later than start_j − c(pred_j, j) (and the first request's
 * transition departs at 0), the occupancy intervals of a plan do not overlap and lie inside [0, H]; each
 * lies inside j's start ranges widened to [from − maxIn_j, to + dur_j], maxIn_j being the largest model
 * transition into j. Cut [0, H] into buckets b. Let y_j = 1 when j is planned, x_ij = 1 when i directly
 * precedes j, and z_jb the length of j's occupancy inside b. Then
 * <ul>
 *   <li>Σ_i x_ij = y_j (every planned request has one predecessor, the start pointing included) and
 *       Σ_j x_ij ≤ y_i (it precedes at most one), Σ_j x_START,j ≤ 1;</li>
 *   <li>Σ_b z_jb = dur_j·y_j + Σ_i c_ij·x_ij, Σ_j z_jb ≤ |b|, 0 ≤ z_jb ≤ |b ∩ widened ranges of j|;</li>
 *   <li>required requests have y_j = 1.</li>
 * </ul>
 * Every plan gives a feasible point with the same priority Σ p_j·y_j, so the LP maximum is an upper
 * bound. To keep the LP small only the {@link #ARCS_PER_REQUEST} cheapest predecessors of j get their own
 * x_ij; every other predecessor is pooled in one variable o_j whose cost is the cheapest among them (a
 * lower bound on each) and which has no out-degree row (dropping rows only relaxes). The predecessor rows
 * are what this adds over a capacity-only relaxation (which charges each request its least transition
 * minIn_j): here no two requests can both be charged the same cheap predecessor.
 *
 * <p>With time-dependent transitions the model costs are upper bounds of the exact ones, not lower
 * bounds, so the transition terms are dropped (costs 0: a pure capacity relaxation of the durations).
 * The bound is relative to the model's transitions (whole seconds, rounded up), as is CP-SAT's own bound;
 * for time-independent tables that is every valid plan with integral starts. Finer buckets give a
 * tighter bound; the bucket count is chosen to keep the LP near {@link #TARGET_ENTRIES} bucket entries.
 */
public final class BucketRelaxation {
  private static final int TARGET_ENTRIES = 150_000;
  /** Explicit predecessor variables per request; the rest are pooled. */
  static final int ARCS_PER_REQUEST = 12;

  static {
    NativeSolver.ensureLoaded();
  }

  private BucketRelaxation() {}

  /** The LP bound on total (unscaled) priority, or {@code Double.NaN} when GLOP does not finish in {@code timeLimitS}. */
  public static double bound(PlanningProblem p, ArcCosts arcs, double timeLimitS) {
    if (p.transitions().timeDependent()) {
      return bound(p, arcs, timeLimitS, false);
    }
    double tight = bound(p, arcs, timeLimitS, true);
    // The capacity-only LP is several times smaller: the fallback when the full one runs out of time.
    return Double.isNaN(tight) ? bound(p, arcs, timeLimitS, false) : tight;
  }

  /** As {@link #bound(PlanningProblem, ArcCosts, double)}; {@code withPredecessors} false drops the predecessor rows. */
  public static double bound(PlanningProblem p, ArcCosts arcs, double timeLimitS, boolean withPredecessors) {
    long h = p.horizonS();
    int n = p.size();
    int schedulable = 0;
    for (Task t : p.tasks()) {
      schedulable += t.schedulable() ? 1 : 0;
    }
    int buckets = (int) Math.max(1, Math.min(h, Math.min(400, Math.max(24, TARGET_ENTRIES / Math.max(1, schedulable)))));
    double width = (double) h / buckets;
    MPSolver solver = MPSolver.createSolver("GLOP");
    if (solver == null) {
      return Double.NaN;
    }
    solver.setTimeLimit((long) (timeLimitS * 1000));
    MPConstraint[] capacity = new MPConstraint[buckets];
    for (int b = 0; b < buckets; b++) {
      capacity[b] = solver.makeConstraint(Double.NEGATIVE_INFINITY, width, "capacity[" + b + "]");
    }
    MPObjective objective = solver.objective();
    objective.setMaximization();
    MPVariable[] present = new MPVariable[n];
    double prioritySum = 0;
    for (int j = 0; j < n; j++) {
      Task t = p.task(j);
      if (t.schedulable() && arcs.minIn(j) != Long.MAX_VALUE) {
        present[j] = solver.makeNumVar(t.required() ? 1 : 0, 1, "present[" + t.id() + "]");
        objective.setCoefficient(present[j], t.priority());
        prioritySum += t.priority();
      }
    }
    Predecessors pred = withPredecessors ? new Predecessors(solver, present) : null;
    for (int j = 0; j < n; j++) {
      if (present[j] == null) {
        continue;
      }
      Task t = p.task(j);
      MPConstraint link = solver.makeConstraint(0, 0, "occupancy[" + t.id() + "]");
      link.setCoefficient(present[j], -t.durationS());
      long widen = pred == null ? arcs.minIn(j) : pred.addInto(j, p, arcs, link);
      if (pred == null) {
        link.setCoefficient(present[j], -(t.durationS() + widen));
      }
      double[] cap = capacities(t, widen, h, buckets, width);
      for (int b = 0; b < buckets; b++) {
        if (cap[b] > 0) {
          MPVariable z = solver.makeNumVar(0, cap[b], "z[" + t.id() + "," + b + "]");
          link.setCoefficient(z, 1);
          capacity[b].setCoefficient(z, 1);
        }
      }
    }
    MPSolver.ResultStatus status = solver.solve();
    double value = status == MPSolver.ResultStatus.OPTIMAL ? objective.value() : Double.NaN;
    solver.delete();
    // GLOP's feasibility tolerance is about 1e-7 relative: widen the bound so rounding never makes it optimistic.
    return Double.isNaN(value) ? value : Math.min(prioritySum, value + 1e-6 * Math.max(1, prioritySum));
  }

  /** Per bucket, the length of j's start ranges widened by {@code widen} before and its duration after. */
  private static double[] capacities(Task t, long widen, long h, int buckets, double width) {
    double[] cap = new double[buckets];
    for (StartRange r : t.starts()) {
      double lo = Math.max(0, r.fromS() - widen);
      double hi = Math.min(h, r.toS() + t.durationS());
      int b0 = (int) Math.min(buckets - 1, Math.floor(lo / width));
      int b1 = (int) Math.min(buckets - 1, Math.floor(hi / width));
      for (int b = b0; b <= b1; b++) {
        double overlap = Math.min(hi, (b + 1) * width) - Math.max(lo, b * width);
        cap[b] = Math.min(width, cap[b] + Math.max(0, overlap));
      }
    }
    return cap;
  }

  /** The predecessor variables x_ij and their in- and out-degree rows. */
  private static final class Predecessors {
    private final MPSolver solver;
    private final MPVariable[] present;
    private final MPConstraint[] outDegree;
    private final MPConstraint fromStart;

    Predecessors(MPSolver solver, MPVariable[] present) {
      this.solver = solver;
      this.present = present;
      this.outDegree = new MPConstraint[present.length];
      for (int i = 0; i < present.length; i++) {
        if (present[i] != null) {
          outDegree[i] = solver.makeConstraint(Double.NEGATIVE_INFINITY, 0, "outDegree[" + i + "]");
          outDegree[i].setCoefficient(present[i], -1);
        }
      }
      this.fromStart = solver.makeConstraint(Double.NEGATIVE_INFINITY, 1, "outDegree[start]");
    }

    /**
     * Adds j's predecessor variables, their in-degree row Σ x_ij = y_j and their transition seconds to
     * {@code link}; returns maxIn_j, the largest model transition into j (the widening of its ranges).
     */
    long addInto(int j, PlanningProblem p, ArcCosts arcs, MPConstraint link) {
      List<long[]> in = new ArrayList<>(); // {predecessor, cost}
      Task t = p.task(j);
      if (arcs.fromStart(j) >= 0 && arcs.fromStart(j) <= t.latestStartS()) {
        in.add(new long[] {Transitions.START, arcs.fromStart(j)});
      }
      for (int i = 0; i < p.size(); i++) {
        if (present[i] != null && arcs.feasible(i, j)) {
          in.add(new long[] {i, arcs.cost(i, j)});
        }
      }
      in.sort((a, b) -> a[1] != b[1] ? Long.compare(a[1], b[1]) : Long.compare(a[0], b[0]));
      MPConstraint inDegree = solver.makeConstraint(0, 0, "inDegree[" + t.id() + "]");
      inDegree.setCoefficient(present[j], -1);
      int explicit = Math.min(ARCS_PER_REQUEST, in.size());
      for (int q = 0; q < explicit; q++) {
        int i = (int) in.get(q)[0];
        MPVariable x = solver.makeNumVar(0, 1, "x[" + i + "," + t.id() + "]");
        inDegree.setCoefficient(x, 1);
        link.setCoefficient(x, -in.get(q)[1]);
        (i == Transitions.START ? fromStart : outDegree[i]).setCoefficient(x, 1);
      }
      if (in.size() > explicit) {
        MPVariable other = solver.makeNumVar(0, 1, "otherPredecessor[" + t.id() + "]");
        inDegree.setCoefficient(other, 1);
        link.setCoefficient(other, -in.get(explicit)[1]);
      }
      return in.isEmpty() ? 0 : in.get(in.size() - 1)[1];
    }
  }
}
