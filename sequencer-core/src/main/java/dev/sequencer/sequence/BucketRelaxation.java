package dev.sequencer.sequence;

import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPObjective;
import com.google.ortools.linearsolver.MPSolver;
import com.google.ortools.linearsolver.MPVariable;
import dev.sequencer.sequence.PlanningProblem.StartRange;
import dev.sequencer.sequence.PlanningProblem.Task;

/**
 * An upper bound on total priority from a time-bucket LP relaxation that keeps each time span's capacity
 * but drops the order.
 *
 * <p>Why it is valid. In any plan the model accepts, give request j the occupancy interval
 * [start_j − minIn_j, end_j], where minIn_j is the smallest model transition into j over all its
 * time-feasible predecessors (the start pointing included). Its predecessor i ends no later than
 * start_j − cost(i, j) ≤ start_j − minIn_j (and the first request's transition departs at 0), so
 * occupancy intervals of a plan do not overlap and lie inside [0, H]; each has length L_j = dur_j +
 * minIn_j, and lies inside the union of j's start ranges widened to [from − minIn_j, to + dur_j]. Cut
 * [0, H] into buckets b. Let y_j = 1 when j is planned and z_jb the length of j's occupancy inside b.
 * Then Σ_b z_jb = L_j·y_j, Σ_j z_jb ≤ |b| and 0 ≤ z_jb ≤ |b ∩ widened ranges of j|; required requests
 * have y_j = 1. Every plan gives a feasible point of this LP with the same priority Σ p_j·y_j, so the
 * LP maximum is an upper bound. Finer buckets give a tighter bound; the bucket count is chosen to keep
 * the LP near 150,000 bucket-entries. The bound is relative to the model's transitions (bounds rounded
 * up), as is CP-SAT's own bound; for time-independent tables that is every valid plan.
 */
final class BucketRelaxation {
  private static final int TARGET_ENTRIES = 150_000;

  static {
    NativeSolver.ensureLoaded();
  }

  private BucketRelaxation() {}

  /** The LP bound on total (unscaled) priority, or {@code Double.NaN} when GLOP does not finish in {@code timeLimitS}. */
  static double bound(PlanningProblem p, ArcCosts arcs, double timeLimitS) {
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
    double prioritySum = 0;
    for (int j = 0; j < n; j++) {
      Task t = p.tasks().get(j);
      long minIn = arcs.minIn(j);
      if (!t.schedulable() || minIn == Long.MAX_VALUE) {
        continue;
      }
      prioritySum += t.priority();
      MPVariable y = solver.makeNumVar(t.required() ? 1 : 0, 1, "present[" + t.id() + "]");
      objective.setCoefficient(y, t.priority());
      long length = t.durationS() + minIn;
      if (length == 0) {
        continue;
      }
      MPConstraint link = solver.makeConstraint(0, 0, "occupancy[" + t.id() + "]");
      link.setCoefficient(y, -length);
      double[] cap = new double[buckets];
      for (StartRange r : t.starts()) {
        double lo = Math.max(0, r.fromS() - minIn);
        double hi = Math.min(h, r.toS() + t.durationS());
        int b0 = (int) Math.min(buckets - 1, Math.floor(lo / width));
        int b1 = (int) Math.min(buckets - 1, Math.floor(hi / width));
        for (int b = b0; b <= b1; b++) {
          double overlap = Math.min(hi, (b + 1) * width) - Math.max(lo, b * width);
          cap[b] = Math.min(width, cap[b] + Math.max(0, overlap));
        }
      }
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
}
