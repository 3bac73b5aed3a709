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
import dev.sequencer.sequence.cpsat.NativeSolver;
import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.StartRange;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.search.DeadlineOrders;
import dev.sequencer.sequence.search.GreedyPlanner;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.sequence.timing.ExactTimer;
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
 * is proven infeasible too, drop the request for good. The feasibility model uses the sequencer's model
 * transitions ({@link ArcCosts}: upper bounds rounded up to seconds).
 *
 * <p>What is named is checked with the exact legs. Out of reach of the start pointing means the exact
 * leg from the start pointing ({@link ExactTimer}) fits before no allowed start. With time-independent
 * transitions the model's costs are the exact legs rounded up, so a conflict the filter finds is a proof
 * ({@link Explanation#proven()}). With time-dependent ones (alt-az mounts, moving targets) the model's
 * costs are only upper bounds: a conflicting set is then re-checked by planning it alone with exact legs
 * (greedy and the deadline orders), dropped from the explanation when that fits it, and never called
 * proven.
 */
public final class RequiredConflicts {
  /** Starts tried per start range when checking reach from the start pointing with time-dependent legs. */
  static final int REACH_SAMPLES = 64;

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

  /**
   * The conflicts found ({@code minimal} false when the search stopped early; {@code proven} true when each
   * named conflict is a proof, not only the model's finding) and a one-line summary.
   */
  public record Explanation(List<Conflict> conflicts, boolean minimal, boolean proven, String message) {
    public Explanation {
      conflicts = List.copyOf(conflicts);
    }
  }

  /** Feasibility of a set of required requests alone. */
  enum Verdict { FEASIBLE, INFEASIBLE, UNKNOWN }

  private final PlanningProblem problem;
  private final ArcCosts arcs;
  private final ExactTimer timer;
  private final int seed;
  private final boolean reproducible;
  private final boolean timeDependent;

  public RequiredConflicts(PlanningProblem problem, ArcCosts arcs, int seed, boolean reproducible) {
    this.problem = problem;
    this.arcs = arcs;
    this.timer = new ExactTimer(problem);
    this.seed = seed;
    this.reproducible = reproducible;
    this.timeDependent = problem.transitions().timeDependent();
  }

  /**
   * Explains an infeasible required set in at most about {@code budgetS} seconds of solving (or, when
   * {@code reproducible}, a deterministic work budget of the same size, so the answer repeats).
   */
  public static Explanation explain(PlanningProblem problem, double budgetS, int seed, boolean reproducible) {
    return new RequiredConflicts(problem, new ArcCosts(problem), seed, reproducible).explain(budgetS);
  }

  public Explanation explain(double budgetS) {
    List<Conflict> alone = new ArrayList<>();
    boolean aloneProven = true;
    List<Integer> set = new ArrayList<>();
    dev.sequencer.sequence.problem.Sections sec = problem.sections();
    for (int u = 0; sec != null && u < sec.unitCount(); u++) {
      if (sec.unitRequired(u) && java.util.Arrays.stream(sec.options(u)).noneMatch(k -> problem.task(k).schedulable())) {
        List<String> where = new ArrayList<>();
        for (int k : sec.options(u)) {
          where.add("on " + sec.resourceId(sec.sectionOf(k)) + ": " + problem.task(k).emptyReason());
        }
        String id = problem.requestId(sec.options(u)[0]);
        if (alone.stream().noneMatch(c -> c.ids().contains(id))) { // one conflict per request, not per visit
          alone.add(new Conflict(List.of(id), String.join("; ", where)));
        }
      }
    }
    for (int k = 0; k < problem.size(); k++) {
      Task t = problem.task(k);
      if (!t.required() || problem.isMarker(k)) {
        continue;
      }
      Alone a = alone(k);
      if (a != null) {
        alone.add(new Conflict(List.of(t.id()), a.reason()));
        aloneProven &= a.proven();
      } else {
        set.add(k);
      }
    }
    if (!alone.isEmpty()) {
      return new Explanation(alone, true, aloneProven, summary(alone));
    }
    if (set.isEmpty()) {
      return new Explanation(List.of(), true, false, "no request is required");
    }
    long deadline = System.nanoTime() + (long) (budgetS * 1e9);
    double perTestS = Math.max(0.2, budgetS / (set.size() + 1));
    Verdict whole = feasible(set, perTestS);
    if (whole != Verdict.INFEASIBLE) {
      String why = whole == Verdict.FEASIBLE
          ? "the required requests fit together when planned alone; the conflict needs the other requests"
          : "the search for a conflicting set ran out of time";
      return new Explanation(List.of(), false, false, "could not single out conflicting requests: " + why);
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
    if (timeDependent && fitsExactly(set)) {
      return new Explanation(List.of(), false, false, "could not single out conflicting requests: the set the "
          + "model's slew bounds reject (" + String.join(", ", ids(set)) + ") fits with the exact slews");
    }
    List<Conflict> out = List.of(new Conflict(ids(set), setReason(set)));
    return new Explanation(out, minimal, !timeDependent, summary(out)
        + (timeDependent ? " (found with upper bounds of the time-dependent slews: not a proof)" : ""));
  }

  private static String summary(List<Conflict> conflicts) {
    List<String> parts = new ArrayList<>();
    conflicts.forEach(c -> parts.add(c.toString()));
    return String.join("; ", parts);
  }

  private List<String> ids(List<Integer> set) {
    List<String> out = new ArrayList<>();
    set.forEach(k -> out.add(problem.task(k).id()));
    return out;
  }

  /** Why a request cannot be scheduled on its own, and whether that is proven. */
  record Alone(String reason, boolean proven) {}

  /** Why request k cannot be scheduled even with nothing else planned, or null when it can. */
  Alone alone(int k) {
    Task t = problem.task(k);
    if (!t.schedulable()) {
      return new Alone(t.emptyReason(), true);
    }
    if (reachableFromStart(k)) {
      return null;
    }
    if (timeDependent) {
      return new Alone("no start was found in its windows at which the slew from the start pointing fits (the "
          + "slew depends on time; not a proof)", false);
    }
    double leg = timer.legS(timer.start(), k, 0, t.earliestStartS());
    if (!(leg < Double.POSITIVE_INFINITY)) {
      return new Alone("no slew from the start pointing reaches it", true);
    }
    String seconds = leg == Math.rint(leg) ? String.format(Locale.ROOT, "%.0f", leg)
        : String.format(Locale.ROOT, "%.1f", leg);
    return new Alone("the slew from the start pointing takes " + seconds + " s, which ends after its last allowed "
        + "start " + problem.instant(t.latestStartS()), true);
  }

  /**
   * True when the exact leg from the start pointing fits before some allowed start of k: the earliest-start
   * search from 0, and with time-dependent legs also {@link #REACH_SAMPLES} starts spread over each range.
   */
  private boolean reachableFromStart(int k) {
    Task t = problem.task(k);
    long d = t.durationS();
    if (timer.earliestStart(timer.start(), k, 0, 0, d, t.latestStartS()) >= 0) {
      return true;
    }
    if (!timeDependent) {
      return false;
    }
    for (StartRange r : t.starts()) {
      for (int i = 0; i <= REACH_SAMPLES; i++) {
        long s = r.fromS() + (r.toS() - r.fromS()) * i / REACH_SAMPLES;
        if (timer.fitsAt(timer.start(), k, 0, s, d)) {
          return true;
        }
      }
    }
    return false;
  }

  /** True when greedy or a deadline order, with exact legs, fits every request of {@code set} (the others left out). */
  private boolean fitsExactly(List<Integer> set) {
    List<Task> only = new ArrayList<>();
    for (int k = 0; k < problem.size(); k++) {
      Task t = problem.task(k);
      only.add(set.contains(k) ? t : Task.fixedInSpans(t.id(), t.durationS(), t.priority(), false, List.of()));
    }
    PlanningProblem sub = problem.withTasks(only);
    ExactTimer subTimer = new ExactTimer(sub);
    List<Plan> tries = new ArrayList<>(DeadlineOrders.plans(sub, subTimer));
    tries.add(new GreedyPlanner(sub, subTimer).plan());
    return tries.stream().anyMatch(p -> p.requiredMissing(sub) == 0);
  }

  /** "mutual overlap" and, for each request, its duration and the span its windows allow. */
  private String setReason(List<Integer> set) {
    if (set.size() == 1) {
      return "cannot be scheduled after the slew from the start pointing";
    }
    List<String> parts = new ArrayList<>();
    for (int k : set) {
      Task t = problem.task(k);
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
      Task t = problem.task(set.get(a));
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
      Task t = problem.task(k);
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
          BoolVar next = model.newBoolVar("next[" + t.id() + "->" + problem.task(set.get(b)).id() + "]");
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
