package dev.sequencer.sequence;

import com.google.ortools.sat.BoolVar;
import com.google.ortools.sat.CircuitConstraint;
import com.google.ortools.sat.CpModel;
import com.google.ortools.sat.CpSolver;
import com.google.ortools.sat.CpSolverStatus;
import com.google.ortools.sat.IntVar;
import com.google.ortools.sat.IntervalVar;
import com.google.ortools.sat.LinearExpr;
import com.google.ortools.util.Domain;
import dev.sequencer.sequence.PlanningProblem.StartRange;
import dev.sequencer.sequence.PlanningProblem.Task;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Says why the required requests cannot all be scheduled: first every required request that cannot be
 * scheduled on its own account (never visible, windows shorter than its duration, out of reach of the
 * start pointing), else a small set of required requests that cannot all fit together ("mutual
 * overlap"), found by a deletion filter.
 *
 * <p>Deletion filter: start from all schedulable required requests; for each in file order, solve the
 * feasibility model of the set without it (CP-SAT, no objective, stops at the first solution); when that
 * is proven infeasible too, drop the request for good. The result is always a proven infeasible set; it
 * is minimal (every request in it is needed for the conflict) unless a test ran out of time, then
 * {@link Explanation#minimal()} is false. The feasibility model uses only the required requests and the
 * same model transition times as the sequencer ({@link ArcCosts}: upper bounds rounded up to seconds).
 */
public final class RequiredConflicts {
  /** Requests (ids, file order) that cannot all be scheduled, and why in words. */
  public record Conflict(List<String> ids, String reason) {
    public Conflict {
      ids = List.copyOf(ids);
    }

    @Override
    public String toString() {
      return ids.size() == 1 ? "required request " + ids.get(0) + " cannot be scheduled: " + reason
          : "required requests " + String.join(", ", ids) + " cannot all be scheduled: " + reason;
    }
  }

  /** The conflicts found ({@code minimal} false when the search stopped early) and a one-line summary. */
  public record Explanation(List<Conflict> conflicts, boolean minimal, String message) {
    public Explanation {
      conflicts = List.copyOf(conflicts);
    }
  }

  /** Feasibility of a set of required requests alone. */
  enum Verdict { FEASIBLE, INFEASIBLE, UNKNOWN }

  private final PlanningProblem problem;
  private final ArcCosts arcs;
  private final int seed;
  private final boolean reproducible;

  RequiredConflicts(PlanningProblem problem, ArcCosts arcs, int seed, boolean reproducible) {
    this.problem = problem;
    this.arcs = arcs;
    this.seed = seed;
    this.reproducible = reproducible;
  }

  /**
   * Explains an infeasible required set in at most about {@code budgetS} seconds of solving (or, when
   * {@code reproducible}, a deterministic work budget of the same size, so the answer repeats).
   */
  public static Explanation explain(PlanningProblem problem, double budgetS, int seed, boolean reproducible) {
    return new RequiredConflicts(problem, new ArcCosts(problem), seed, reproducible).explain(budgetS);
  }

  Explanation explain(double budgetS) {
    List<Conflict> alone = new ArrayList<>();
    List<Integer> set = new ArrayList<>();
    for (int k = 0; k < problem.size(); k++) {
      Task t = problem.tasks().get(k);
      if (!t.required()) {
        continue;
      }
      String reason = aloneReason(k);
      if (reason != null) {
        alone.add(new Conflict(List.of(t.id()), reason));
      } else {
        set.add(k);
      }
    }
    if (!alone.isEmpty()) {
      return new Explanation(alone, true, summary(alone));
    }
    if (set.isEmpty()) {
      return new Explanation(List.of(), true, "no request is required");
    }
    long deadline = System.nanoTime() + (long) (budgetS * 1e9);
    double perTestS = Math.max(0.2, budgetS / (set.size() + 1));
    Verdict whole = feasible(set, perTestS);
    if (whole != Verdict.INFEASIBLE) {
      String why = whole == Verdict.FEASIBLE
          ? "the required requests fit together when planned alone; the conflict needs the other requests"
          : "the search for a conflicting set ran out of time";
      return new Explanation(List.of(), false, "could not single out conflicting requests: " + why);
    }
    boolean minimal = true;
    for (int k : new ArrayList<>(set)) {
      if (set.size() == 1) {
        break;
      }
      double left = (deadline - System.nanoTime()) * 1e-9;
      if (left <= 0 && !reproducible) {
        minimal = false;
        break;
      }
      List<Integer> without = new ArrayList<>(set);
      without.remove(Integer.valueOf(k));
      Verdict v = feasible(without, reproducible ? perTestS : Math.min(perTestS, Math.max(0.05, left)));
      if (v == Verdict.INFEASIBLE) {
        set = without;
      } else if (v == Verdict.UNKNOWN) {
        minimal = false;
      }
    }
    List<Conflict> out = List.of(new Conflict(ids(set), setReason(set)));
    return new Explanation(out, minimal, summary(out));
  }

  private static String summary(List<Conflict> conflicts) {
    List<String> parts = new ArrayList<>();
    conflicts.forEach(c -> parts.add(c.toString()));
    return String.join("; ", parts);
  }

  private List<String> ids(List<Integer> set) {
    List<String> out = new ArrayList<>();
    set.forEach(k -> out.add(problem.tasks().get(k).id()));
    return out;
  }

  /** Why request k cannot be scheduled even with nothing else planned, or null when it can. */
  String aloneReason(int k) {
    Task t = problem.tasks().get(k);
    if (!t.schedulable()) {
      return t.emptyReason();
    }
    long c0 = arcs.fromStart(k);
    if (c0 < 0) {
      return "no slew from the start pointing reaches it";
    }
    if (t.firstStartAtOrAfter(c0) < 0) {
      return String.format(Locale.ROOT, "the slew from the start pointing takes %d s, which ends after its last "
          + "allowed start %s", c0, problem.instant(t.latestStartS()));
    }
    return null;
  }

  /** "mutual overlap" and, for each request, its duration and the span its windows allow. */
  private String setReason(List<Integer> set) {
    if (set.size() == 1) {
      return "cannot be scheduled after the slew from the start pointing";
    }
    List<String> parts = new ArrayList<>();
    for (int k : set) {
      Task t = problem.tasks().get(k);
      parts.add(String.format(Locale.ROOT, "%s needs %d s within %s .. %s", t.id(), t.durationS(),
          problem.instant(t.earliestStartS()), problem.instant(t.latestStartS() + t.durationS())));
    }
    return "mutual overlap: they cannot all fit in their windows with the slews between them (" + String.join(
        "; ", parts) + ")";
  }

  /**
   * Feasibility of scheduling exactly the requests in {@code set}: startS[R] in R's start ranges, a circuit
   * through the depot (node 0) and every request, next[A->B] implies startS[B] >= startS[A] + dur(A) +
   * cost(A, B), next[START->B] implies startS[B] >= fromStart(B). No objective: CP-SAT stops at the
   * first solution.
   */
  Verdict feasible(List<Integer> set, double timeLimitS) {
    NativeSolver.ensureLoaded();
    CpModel model = new CpModel();
    int m = set.size();
    IntVar[] start = new IntVar[m];
    List<IntervalVar> intervals = new ArrayList<>();
    for (int a = 0; a < m; a++) {
      Task t = problem.tasks().get(set.get(a));
      long[][] dom = new long[t.starts().size()][];
      for (int q = 0; q < dom.length; q++) {
        StartRange r = t.starts().get(q);
        dom[q] = new long[] {r.fromS(), r.toS()};
      }
      start[a] = model.newIntVarFromDomain(Domain.fromIntervals(dom), "startS[" + t.id() + "]");
      intervals.add(model.newFixedSizeIntervalVar(start[a], t.durationS(), "obs[" + t.id() + "]"));
    }
    model.addNoOverlap(intervals); // redundant with the circuit; prunes overloads early
    CircuitConstraint circuit = model.addCircuit();
    for (int a = 0; a < m; a++) {
      int k = set.get(a);
      Task t = problem.tasks().get(k);
      long c0 = arcs.fromStart(k);
      if (c0 >= 0) {
        BoolVar first = model.newBoolVar("next[START->" + t.id() + "]");
        circuit.addArc(0, a + 1, first);
        model.addGreaterOrEqual(start[a], c0).onlyEnforceIf(first);
      }
      circuit.addArc(a + 1, 0, model.newBoolVar("next[" + t.id() + "->END]"));
      if (k == problem.mustBeLastIndex()) {
        continue;
      }
      for (int b = 0; b < m; b++) {
        if (b != a && arcs.feasible(k, set.get(b))) {
          BoolVar next = model.newBoolVar("next[" + t.id() + "->" + problem.tasks().get(set.get(b)).id() + "]");
          circuit.addArc(a + 1, b + 1, next);
          model.addGreaterOrEqual(LinearExpr.newBuilder().add(start[b]).addTerm(start[a], -1).build(),
              t.durationS() + arcs.cost(k, set.get(b))).onlyEnforceIf(next);
        }
      }
    }
    CpSolver solver = new CpSolver();
    solver.getParameters().setNumWorkers(1).setRandomSeed(seed);
    if (reproducible) {
      solver.getParameters().setMaxDeterministicTime(timeLimitS).setMaxTimeInSeconds(Math.max(10, 10 * timeLimitS));
    } else {
      solver.getParameters().setMaxTimeInSeconds(timeLimitS);
    }
    CpSolverStatus status = solver.solve(model);
    return switch (status) {
      case OPTIMAL, FEASIBLE -> Verdict.FEASIBLE;
      case INFEASIBLE -> Verdict.INFEASIBLE;
      case MODEL_INVALID -> throw new IllegalStateException(
          "CP-SAT rejected the conflict model (a bug in the sequencer): " + model.validate());
      default -> Verdict.UNKNOWN;
    };
  }
}
