package dev.sequencer.sequence;

import com.google.ortools.sat.CpSolverStatus;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.sequence.PlanningProblem.Task;
import dev.sequencer.sequence.SequencerResult.Planned;
import dev.sequencer.sequence.SequencerResult.Stats;
import dev.sequencer.slew.Transitions;
import dev.sequencer.validate.PlanValidator;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Plans observations: first the largest total priority, then the smallest total transition time.
 *
 * <p>Steps: greedy plan (the baseline, warm start and fallback); for CP-SAT, the LP bucket bound, the
 * routing model (all time-feasible arcs up to {@link #LARGE} requests; above, the K best successor arcs
 * per request united with the greedy plan's arcs, and CP-SAT probing and symmetry detection off) and, on
 * large models, our large-neighbourhood search for the rest of the time; then compaction at the exact
 * transitions and an independent validation. Every returned plan passes {@link PlanValidator}; a plan
 * that does not is a bug and raises {@link IllegalStateException}. Stateless: one instance may serve
 * several threads.
 */
public final class Sequencer {
  /** Above this many schedulable requests the model is "large" (K-best arcs, probing off, LNS). */
  static final int LARGE = 120;
  /** Successor arcs kept per request on large models when {@code kBest} is automatic. */
  static final int AUTO_K_BEST = 10;
  /**
   * On large models (wall-clock mode, complete warm start), the whole-model solve is skipped when less
   * than this many seconds are left: building it alone can take seconds at 1,000 requests.
   */
  static final double MIN_MAIN_S_LARGE = 3.0;
  /** Share of the time limit the whole-model solve gets on large models before LNS takes over. */
  static final double MAIN_SHARE_LARGE = 0.35;
  /** Share of the time limit the insertion search gets to improve the warm start (fixed durations). */
  static final double INSERTION_SHARE = 0.5;
  /**
   * Insertion-search evaluations per CP-SAT deterministic unit in reproducible mode: about what one core
   * of this project's machine evaluates per second (a rough calibration, not a measured constant).
   */
  static final double INSERTION_EVALUATIONS_PER_UNIT = 6e6;
  /** Flexible exposures: largest share of the time limit the exposure-aware moves get for the warm start. */
  static final double MOVES_START_SHARE = 0.4;

  /** Plans {@code problem} with {@code options}. */
  public SequencerResult plan(PlanningProblem problem, SequencerOptions options) {
    return new Run(problem, options, null).execute();
  }

  /**
   * Plans with a preferred order (request indices, e.g. the rest of a previous plan): it is re-timed and,
   * unless the greedy plan is strictly better (more priority, then less model transition) or it misses a
   * required request, it replaces the greedy plan as warm start and fallback.
   */
  SequencerResult plan(PlanningProblem problem, SequencerOptions options, int[] preferredOrder) {
    return new Run(problem, options, preferredOrder).execute();
  }

  /** The state of one call. */
  private static final class Run {
    private final PlanningProblem problem;
    private final SequencerOptions options;
    private final int[] preferredOrder;
    private final long t0 = System.nanoTime();
    private final long deadline;
    private final StringBuilder notes = new StringBuilder();
    private ArcCosts arcs;
    private PriorityScale scale;
    private int solutions;
    private long bestReportedP = Long.MIN_VALUE;
    private long bestReportedT = Long.MAX_VALUE;
    private double knownBound = Double.NaN;

    Run(PlanningProblem problem, SequencerOptions options, int[] preferredOrder) {
      this.problem = problem;
      this.options = options;
      this.preferredOrder = preferredOrder;
      this.deadline = t0 + (long) (options.timeLimitS() * 1e9);
    }

    private double elapsedS() {
      return (System.nanoTime() - t0) * 1e-9;
    }

    private double remainingS() {
      return Math.max(0.0, (deadline - System.nanoTime()) * 1e-9);
    }

    SequencerResult execute() {
      if (options.solver() == SequencerOptions.Solver.CPSAT) {
        NativeSolver.ensureLoaded(); // fails with a clear message on an unsupported platform
      }
      if (problem.tasks().stream().anyMatch(t -> t.required() && !t.schedulable())) {
        return infeasible("", 0, 0);
      }
      long b0 = System.nanoTime();
      arcs = new ArcCosts(problem);
      scale = new PriorityScale(problem);
      Plan greedy = preferred(new GreedyPlanner(problem).plan());
      if (!hasAllRequired(greedy)) {
        greedy = deadlineOrderIfComplete(greedy);
      }
      double buildS = (System.nanoTime() - b0) * 1e-9;
      boolean greedyComplete = hasAllRequired(greedy);
      if (options.solver() == SequencerOptions.Solver.TWO_STAGE) {
        return twoStage(buildS);
      }
      if (options.solver() == SequencerOptions.Solver.CPSAT && problem.hasFlexible()) {
        greedy = withMovesStart(greedy);
        greedyComplete = hasAllRequired(greedy);
      } else if (options.solver() == SequencerOptions.Solver.CPSAT && options.hint()) {
        greedy = withInsertionSearch(greedy);
        greedyComplete = hasAllRequired(greedy);
      }
      if (options.solver() == SequencerOptions.Solver.GREEDY) {
        double bound = options.relaxationBound() ? relaxation(Math.min(5, remainingS())) : Double.NaN;
        if (!greedyComplete) {
          return noPlan("the greedy planner could not fit every required request (this proves nothing)",
              arcs.feasibleArcCount(), buildS, 0);
        }
        return finish(PlanStatus.FEASIBLE, greedy, minIgnoringNaN(bound, trivialBound()), bound, arcs.feasibleArcCount(), buildS, 0, 0, 0);
      }
      return solveCpSat(greedy, greedyComplete, buildS);
    }

    private SequencerResult solveCpSat(Plan greedy, boolean greedyComplete, double buildS) {
      Plan hint = Plan.retime(problem, arcs, greedy.order(), greedy.durations(problem));
      boolean hintComplete = hasAllRequired(hint);
      int[] nodes = java.util.stream.IntStream.range(0, problem.size())
          .filter(k -> problem.tasks().get(k).schedulable()).toArray();
      boolean large = nodes.length > LARGE;
      int k = options.kBest() < 0 ? 0 : options.kBest() == 0 ? (large ? AUTO_K_BEST : 0) : options.kBest();
      boolean allArcs = k == 0;
      double relaxationBound = Double.NaN;
      if (options.relaxationBound()) {
        relaxationBound = relaxation(Math.min(5, 0.15 * options.timeLimitS()));
        knownBound = relaxationBound;
      }
      boolean runLns = options.lns() && large;
      double mainTime = runLns ? Math.max(0.5, MAIN_SHARE_LARGE * remainingS()) : remainingS();
      double mainDet = runLns ? MAIN_SHARE_LARGE * options.deterministicLimit() : options.deterministicLimit();
      RoutingModel model = new RoutingModel(problem, arcs, scale);
      RoutingModel.Params params = new RoutingModel.Params(mainTime, options.effectiveWorkers(), options.seed(),
          options.reproducible(), mainDet, large, this::report);
      if (options.hint() && hintComplete) {
        report(hint.scaledPriority(problem, scale), hint.modelTransitionS(arcs), -1);
      }
      RoutingModel.Spec spec = new RoutingModel.Spec(nodes, Transitions.START, 0, -1, problem.horizonS(),
          options.hint() ? hint : null, k);
      boolean skipMain = runLns && options.hint() && hintComplete && !options.reproducible()
          && remainingS() < MIN_MAIN_S_LARGE;
      RoutingModel.Outcome main;
      if (skipMain) {
        // Too little time left to build and solve the whole large model: the LNS starts from the hint.
        notes.append("whole-model solve skipped (").append(String.format(java.util.Locale.ROOT, "%.1f", remainingS()))
            .append(" s left); the LNS starts from the warm start. ");
        main = new RoutingModel.Outcome(CpSolverStatus.UNKNOWN, hint, hint.scaledPriority(problem, scale),
            hint.modelTransitionS(arcs), -1, 0, 0, 0, 0, 0);
      } else {
        main = model.solve(spec, params);
      }
      long arcsKept = main.arcsKept();
      double solveS = main.solveS();
      buildS += main.buildS();
      if (main.status() == CpSolverStatus.INFEASIBLE && !allArcs && remainingS() > 0.05) {
        notes.append("K-best model infeasible; re-solved with all arcs. ");
        allArcs = true;
        spec = new RoutingModel.Spec(nodes, Transitions.START, 0, -1, problem.horizonS(), null, 0);
        main = model.solve(spec, params.withTime(remainingS(), mainDet));
        solveS += main.solveS();
        buildS += main.buildS();
      }
      if (main.status() == CpSolverStatus.INFEASIBLE && allArcs) {
        if (problem.transitions().timeDependent()) {
          // Infeasible under upper bounds of the transitions only: no proof for the exact transitions.
          return hintComplete
              ? finish(PlanStatus.FEASIBLE, hint, trivialBound(), Double.NaN, arcsKept, buildS, solveS, 0, 0)
              : noPlan("the required requests could not all be fitted under the conservative time-dependent "
                  + "transition bounds (this proves nothing about the exact transitions)", arcsKept, buildS, solveS);
        }
        return infeasible("CP-SAT proved that the required requests cannot all be scheduled", arcsKept, solveS);
      }
      Plan current = main.plan();
      if (current == null && hintComplete) {
        current = hint;
        notes.append("CP-SAT found no plan in time; returning the greedy plan. ");
      }
      double cpBound = Double.NaN;
      if (allArcs && main.priorityBound() >= 0) {
        cpBound = main.priorityBound() / (double) scale.factor() + scale.boundSlack(nodes.length);
      }
      int lnsRounds = 0;
      int lnsImprovements = 0;
      if (current != null && runLns && main.status() != CpSolverStatus.OPTIMAL) {
        NeighbourhoodSearch lns = new NeighbourhoodSearch(problem, arcs, scale, model, options.seed());
        long ls = System.nanoTime();
        RoutingModel.Params lnsParams = new RoutingModel.Params(0, options.effectiveWorkers(), options.seed(),
            options.reproducible(), 0, false, null);
        java.util.function.Consumer<Plan> onImprove =
            p -> report(p.scaledPriority(problem, scale), p.modelTransitionS(arcs), -1);
        if (problem.hasFlexible()) {
          FlexibleSearch search = new FlexibleSearch(problem, arcs, scale);
          current = search.improve(current, lns, deadline, options.deterministicLimit() - mainDet, lnsParams,
              onImprove);
          lnsImprovements += search.moveCount();
          notes.append("exposure-aware moves: ").append(search.moveCount()).append(" accepted. ");
        } else {
          current = lns.improve(current, deadline, options.deterministicLimit() - mainDet, lnsParams, onImprove);
        }
        solveS += (System.nanoTime() - ls) * 1e-9;
        lnsRounds = lns.rounds;
        lnsImprovements += lns.improvements;
      }
      if (current == null) {
        return noPlan("CP-SAT found no plan in the time limit", arcsKept, buildS, solveS);
      }
      boolean polished = false;
      if (problem.hasFlexible() && main.status() != CpSolverStatus.OPTIMAL) {
        // Flexible exposures: the exact fixed-order allocation and the exposure-aware moves on the found
        // plan; kept only when they add value.
        Plan better = new FlexibleSearch(problem, arcs, scale).moves(current, deadline, options.reproducible(), 0);
        polished = better.scaledPriority(problem, scale) > current.scaledPriority(problem, scale);
        if (polished) {
          notes.append("exposures re-allocated exactly (and moves) after the search. ");
          current = better;
        }
      }
      boolean timeDependent = problem.transitions().timeDependent();
      if (timeDependent) {
        // The model's transitions are upper bounds of the exact ones: its optimum and its bound hold for
        // plans under those bounds only, not for every valid plan. Only the relaxation (built with zero
        // least transitions) and the trivial bound remain proven, and optimality is never claimed.
        cpBound = Double.NaN;
      }
      boolean optimal = !timeDependent && main.status() == CpSolverStatus.OPTIMAL && allArcs && lnsImprovements == 0
          && !polished;
      double bound = minIgnoringNaN(minIgnoringNaN(cpBound, relaxationBound), trivialBound());
      SequencerResult result = finish(optimal ? PlanStatus.OPTIMAL : PlanStatus.FEASIBLE, current, bound,
          relaxationBound, arcsKept, buildS, solveS, lnsRounds, lnsImprovements);
      if (greedyComplete && !optimal) {
        SequencerResult fallback = finish(PlanStatus.FEASIBLE, greedy, bound, relaxationBound, arcsKept, buildS,
            solveS, lnsRounds, lnsImprovements);
        if (better(fallback, result)) {
          notes.append("the greedy plan beat CP-SAT's (under the model's transition bounds) and is returned. ");
          return finish(PlanStatus.FEASIBLE, greedy, bound, relaxationBound, arcsKept, buildS, solveS, lnsRounds,
              lnsImprovements);
        }
      }
      return result;
    }

    /** The re-timed preferred order when given, complete and not worse than {@code greedy}; else greedy. */
    private Plan preferred(Plan greedy) {
      if (preferredOrder == null) {
        return greedy;
      }
      Plan p = Plan.retime(problem, arcs, preferredOrder);
      long gp = greedy.scaledPriority(problem, scale);
      long pp = p.scaledPriority(problem, scale);
      boolean notWorse = pp > gp || (pp == gp && p.modelTransitionS(arcs) <= greedy.modelTransitionS(arcs));
      if (hasAllRequired(p) && (notWorse || !hasAllRequired(greedy))) {
        notes.append("warm start: the preferred order (").append(p.size()).append(" of ")
            .append(preferredOrder.length).append(" requests fit) replaces the greedy plan. ");
        return p;
      }
      notes.append("warm start: the greedy plan beats the preferred order. ");
      return greedy;
    }

    /**
     * Flexible exposures: the joint model's warm start (and fallback) is the greedy plan improved by the
     * exposure-aware moves (exact re-allocation, insertions, replacements), given at most
     * {@link #MOVES_START_SHARE} of the time; the joint search then can only improve on it.
     */
    private Plan withMovesStart(Plan greedy) {
      long until = System.nanoTime() + (long) (MOVES_START_SHARE * remainingS() * 1e9);
      Plan moved = new FlexibleSearch(problem, arcs, scale).moves(greedy, until, options.reproducible(),
          MOVES_START_SHARE * options.deterministicLimit());
      long gp = greedy.scaledPriority(problem, scale);
      long mp = moved.scaledPriority(problem, scale);
      if (mp > gp && hasAllRequired(moved)) {
        notes.append("warm start: exposure-aware moves raise the greedy plan from ").append(gp).append(" to ")
            .append(mp).append(" (scaled value). ");
        return moved;
      }
      return greedy;
    }

    /**
     * Improves the warm start by {@link InsertionSearch} for {@link #INSERTION_SHARE} of the time limit
     * (in reproducible mode, for {@link #INSERTION_EVALUATIONS_PER_UNIT} evaluations per deterministic
     * unit instead); kept when better, or when it holds every required request and {@code start} does not.
     */
    private Plan withInsertionSearch(Plan start) {
      InsertionSearch search = new InsertionSearch(problem, arcs, scale, options.seed());
      long budgetNanos = (long) (INSERTION_SHARE * options.timeLimitS() * 1e9);
      long deadlineNanos = options.reproducible() ? Long.MAX_VALUE : System.nanoTime() + budgetNanos;
      long evaluations = options.reproducible()
          ? Math.max(1, (long) (INSERTION_SHARE * INSERTION_EVALUATIONS_PER_UNIT * options.deterministicLimit()))
          : Long.MAX_VALUE;
      Plan out = search.improve(start, deadlineNanos, Long.MAX_VALUE, evaluations);
      long sp = start.scaledPriority(problem, scale);
      long op = out.scaledPriority(problem, scale);
      notes.append("insertion search: ").append(search.iterations).append(" iterations (")
          .append(search.evaluations()).append(" evaluations), ").append(search.improvements)
          .append(" improving; warm start ")
          .append(String.format(java.util.Locale.ROOT, "%.6g -> %.6g", start.priority(problem), out.priority(problem)))
          .append(". ");
      boolean better = op > sp || (op == sp && out.modelTransitionS(arcs) < start.modelTransitionS(arcs));
      if (hasAllRequired(out) && (better || !hasAllRequired(start))) {
        return out;
      }
      return start;
    }

    /**
     * When greedy misses required requests (tight windows, as in routing benchmarks with every request
     * required), tries three deadline orders (by latest start, by window midpoint, by earliest start),
     * re-timed with the model's transitions: classic constructions for time windows that often fit them
     * all; the first that does serves as warm start instead.
     */
    private Plan deadlineOrderIfComplete(Plan greedy) {
      List<java.util.function.ToLongFunction<Task>> keys = List.of(
          Task::latestStartS, t -> t.earliestStartS() + t.latestStartS(), Task::earliestStartS);
      for (java.util.function.ToLongFunction<Task> key : keys) {
        int[] order = java.util.stream.IntStream.range(0, problem.size())
            .filter(k -> problem.tasks().get(k).schedulable() && k != problem.mustBeLastIndex())
            .boxed()
            .sorted(java.util.Comparator.comparingLong((Integer k) -> key.applyAsLong(problem.tasks().get(k)))
                .thenComparingInt(k -> k))
            .mapToInt(Integer::intValue).toArray();
        if (problem.mustBeLastIndex() >= 0) {
          order = java.util.stream.IntStream.concat(java.util.Arrays.stream(order),
              java.util.stream.IntStream.of(problem.mustBeLastIndex())).toArray();
        }
        Plan candidate = Plan.retime(problem, arcs, order);
        if (hasAllRequired(candidate)) {
          notes.append("warm start: a deadline order fits every required request (greedy did not). ");
          return candidate;
        }
      }
      return greedy;
    }

    /** The two-stage baseline (flexible exposures): stage 1 gets the whole time limit, stage 2 is one LP. */
    private SequencerResult twoStage(double buildS) {
      long s0 = System.nanoTime();
      Plan plan = new TwoStagePlanner(problem, arcs).plan(options.withTimeLimitS(Math.max(0.5, remainingS())));
      double solveS = (System.nanoTime() - s0) * 1e-9;
      if (!hasAllRequired(plan)) {
        return noPlan("the two-stage baseline could not fit every required request (this proves nothing)",
            arcs.feasibleArcCount(), buildS, solveS);
      }
      notes.append("two-stage baseline: preset exposures, then continuous re-allocation. ");
      return finish(PlanStatus.FEASIBLE, plan, trivialBound(), Double.NaN, arcs.feasibleArcCount(), buildS, solveS,
          0, 0);
    }

    /** Lexicographic: more priority, then less total exact transition. */
    private boolean better(SequencerResult a, SequencerResult b) {
      double eps = 1e-9 * Math.max(1, Math.abs(b.totalPriority()));
      if (a.totalPriority() > b.totalPriority() + eps) {
        return true;
      }
      return Math.abs(a.totalPriority() - b.totalPriority()) <= eps && a.totalTransitionS() < b.totalTransitionS() - 1e-6;
    }

    /** Sum of the priorities of all schedulable requests: always a valid bound. */
    private double trivialBound() {
      return problem.tasks().stream().filter(Task::schedulable).mapToDouble(Task::priority).sum();
    }

    private double relaxation(double timeLimitS) {
      if (timeLimitS <= 0) {
        return Double.NaN;
      }
      try {
        NativeSolver.ensureLoaded();
      } catch (NativeSolver.Unavailable e) {
        notes.append("no LP bound: the native solver is unavailable on this platform. ");
        return Double.NaN;
      }
      return BucketRelaxation.bound(problem, arcs, timeLimitS);
    }

    private static double minIgnoringNaN(double a, double b) {
      if (Double.isNaN(a)) {
        return b;
      }
      if (Double.isNaN(b)) {
        return a;
      }
      return Math.min(a, b);
    }

    private boolean hasAllRequired(Plan p) {
      boolean[] in = new boolean[problem.size()];
      for (int k : p.order()) {
        in[k] = true;
      }
      for (int k = 0; k < problem.size(); k++) {
        if (problem.tasks().get(k).required() && !in[k]) {
          return false;
        }
      }
      return true;
    }

    /**
     * For slew models whose exact legs may exceed the model bound (see
     * {@link Transitions#exactMayExceedBound}): drops, in time order, every optional observation whose exact
     * leg at the model times does not fit before its start, re-evaluating the later legs without it.
     */
    private Plan dropLegsBeyondMountLimits(Plan plan) {
      List<Integer> order = new ArrayList<>();
      List<Long> starts = new ArrayList<>();
      int dropped = 0;
      for (int q = 0; q < plan.size(); q++) {
        order.add(plan.order()[q]);
        starts.add(plan.startS()[q]);
        if (lastLegFits(order, starts)) {
          continue;
        }
        // The mount may have run out of cable wrap while following the previous observation: try without
        // that one first (when it is optional), else without the new one.
        int n = order.size();
        if (n >= 2 && !problem.tasks().get(order.get(n - 2)).required()) {
          List<Integer> o2 = new ArrayList<>(order);
          List<Long> s2 = new ArrayList<>(starts);
          o2.remove(n - 2);
          s2.remove(n - 2);
          if (lastLegFits(o2, s2)) {
            order = o2;
            starts = s2;
            dropped++;
            continue;
          }
        }
        if (!problem.tasks().get(order.get(n - 1)).required()) {
          order.remove(n - 1);
          starts.remove(n - 1);
          dropped++;
        }
      }
      if (dropped > 0) {
        notes.append(dropped).append(" observation(s) dropped: the mount's cable wrap could not follow them "
            + "at the model's times. ");
      }
      return new Plan(order.stream().mapToInt(Integer::intValue).toArray(),
          starts.stream().mapToLong(Long::longValue).toArray());
    }

    /** True when the exact leg into the last observation of the sequence fits before its start. */
    private boolean lastLegFits(List<Integer> order, List<Long> starts) {
      int n = order.size();
      double[] dep = new double[n];
      double[] arr = new double[n];
      for (int i = 0; i < n; i++) {
        dep[i] = i == 0 ? 0 : starts.get(i - 1) + problem.tasks().get(order.get(i - 1)).durationS();
        arr[i] = starts.get(i);
      }
      double leg = problem.transitions().exactS(order.stream().mapToInt(Integer::intValue).toArray(), dep, arr)[n - 1];
      return dep[n - 1] + leg <= arr[n - 1] + 1e-9;
    }

    /** The exact leg q of the plan's prefix when request q starts at {@code startS}. */
    private double legAt(Transitions tr, int[] order, double[] departure, double[] arrival, int q, long startS) {
      arrival[q] = startS;
      return tr.exactS(Arrays.copyOf(order, q + 1), Arrays.copyOf(departure, q + 1),
          Arrays.copyOf(arrival, q + 1))[q];
    }

    /** Forwards a new incumbent to the listener when it improves (priority, then transition). */
    private synchronized void report(long scaledPriority, long transitionS, long scaledBound) {
      solutions++;
      if (scaledPriority < bestReportedP || (scaledPriority == bestReportedP && transitionS >= bestReportedT)) {
        return;
      }
      bestReportedP = scaledPriority;
      bestReportedT = transitionS;
      if (options.listener() != null) {
        options.listener().onProgress(solutions, scaledPriority / (double) scale.factor(), transitionS,
            knownBound, elapsedS());
      }
    }

    /**
     * Compaction at exact transitions, result assembly and validation. Each start moves to the earliest
     * allowed second s with s >= previous end + ceil(exact transition(previous end, s)), departing at the
     * compacted previous end. The model start is always such a second (exact <= bound over the arc's
     * intervals, and the compacted end is never later than the model's), so compaction only moves starts
     * earlier: from the model start, it steps to the first allowed second after end + exact(current) and
     * keeps the step while the exact transition there still fits (checked: a violation is a bug).
     */
    private SequencerResult finish(PlanStatus status, Plan plan, double bound, double relaxationBound,
        long arcsKept, double buildS, double solveS, int lnsRounds, int lnsImprovements) {
      Transitions tr = problem.transitions();
      if (tr.exactMayExceedBound()) {
        plan = dropLegsBeyondMountLimits(plan);
      }
      int m = plan.size();
      int[] keptOrder = new int[m];
      long[] dur = new long[m];
      long[] start = new long[m];
      double[] exact = new double[m];
      double[] departure = new double[m];
      double[] arrival = new double[m];
      long prevEnd = 0;
      long shift = 0;
      int kept = 0;
      int lost = 0;
      for (int q = 0; q < m; q++) {
        Task t = problem.tasks().get(plan.order()[q]);
        keptOrder[kept] = plan.order()[q];
        departure[kept] = prevEnd;
        long s = plan.startS()[q];
        long d = plan.durationS(problem, q);
        double leg = legAt(tr, keptOrder, departure, arrival, kept, s);
        if (!(prevEnd + leg <= s + 1e-9)) {
          if (tr.exactMayExceedBound() && !t.required()) {
            lost++; // the mount cannot follow (cable wrap): leave this one out
            continue;
          }
          throw new IllegalStateException("request " + t.id() + ": exact transition " + leg + " s departing at "
              + prevEnd + " s does not fit before the model start " + s + " s (a bug: the transition bound "
              + "must never be below the exact time)");
        }
        for (int step = 0; step < 32; step++) {
          long candidate = Plan.firstFittingStart(problem, plan.order()[q], prevEnd + ArcCosts.ceilS(leg), d);
          if (candidate < 0 || candidate >= s) {
            break;
          }
          double candidateLeg = legAt(tr, keptOrder, departure, arrival, kept, candidate);
          if (!(prevEnd + candidateLeg <= candidate + 1e-9)) {
            break;
          }
          s = candidate;
          leg = candidateLeg;
        }
        shift += plan.startS()[q] - s;
        start[kept] = s;
        arrival[kept] = s;
        exact[kept] = leg;
        dur[kept] = d;
        prevEnd = s + d;
        kept++;
      }
      if (lost > 0) {
        notes.append(lost).append(" observation(s) left out after compaction: the mount's cable wrap could not "
            + "follow them. ");
      }
      m = kept;
      plan = new Plan(Arrays.copyOf(keptOrder, m), Arrays.copyOf(start, m), Arrays.copyOf(dur, m));
      List<Planned> planned = new ArrayList<>();
      double totalPriority = 0;
      double totalTransition = 0;
      boolean[] in = new boolean[problem.size()];
      for (int q = 0; q < m; q++) {
        Task t = problem.tasks().get(plan.order()[q]);
        in[plan.order()[q]] = true;
        long d = plan.durationS(problem, q);
        Double value = problem.exposure(plan.order()[q]) == null ? null : plan.value(problem, q);
        planned.add(new Planned(t.id(), problem.instant(start[q]), problem.instant(start[q] + d),
            start[q], start[q] + d, exact[q], value));
        totalPriority += plan.value(problem, q);
        totalTransition += exact[q];
      }
      double modelTransition = plan.modelTransitionS(arcs);
      if (!Double.isNaN(bound) && bound < totalPriority) {
        if (bound < totalPriority - 1e-6 * Math.max(1, totalPriority)) {
          throw new IllegalStateException("proven bound " + bound + " is below the plan's priority "
              + totalPriority + " (a bug)");
        }
        bound = totalPriority;
      }
      if (status == PlanStatus.OPTIMAL) {
        bound = totalPriority;
      }
      double gap = Double.isNaN(bound) ? Double.NaN : bound <= 0 ? 0 : (bound - totalPriority) / bound;
      Stats stats = new Stats(arcsKept, arcs.feasibleArcCount(), buildS, solveS, solutions, lnsRounds,
          lnsImprovements, relaxationBound, modelTransition - totalTransition, shift, notes.toString().trim());
      SequencerResult result = new SequencerResult(status, planned, totalPriority, totalTransition, bound, gap,
          unscheduled(in, null), stats, "");
      List<String> violations = new PlanValidator(problem.horizon(), problem.requests(), problem.windows(), tr)
          .violations(result.toTimeline());
      if (!violations.isEmpty()) {
        throw new IllegalStateException("the sequencer produced an invalid plan (a bug): " + violations);
      }
      return result;
    }

    private List<Unscheduled> unscheduled(boolean[] in, String lostReason) {
      List<Unscheduled> out = new ArrayList<>();
      for (int k = 0; k < problem.size(); k++) {
        Task t = problem.tasks().get(k);
        if (!in[k]) {
          String reason = t.schedulable() ? (lostReason != null ? lostReason : PlanningProblem.LOST_TO_CONFLICTS)
              : t.emptyReason();
          out.add(new Unscheduled(t.id(), reason));
        }
      }
      return out;
    }

    /**
     * INFEASIBLE with the conflicting required requests ({@link RequiredConflicts}) in the message, which
     * starts with {@code proof} when given. The search gets the time left, at least 1 s, at most 10 s.
     */
    private SequencerResult infeasible(String proof, long arcsKept, double solveS) {
      if (arcs == null) {
        arcs = new ArcCosts(problem);
      }
      double budgetS = Math.min(10, Math.max(1, remainingS()));
      RequiredConflicts.Explanation why = new RequiredConflicts(problem, arcs, options.seed(), options.reproducible())
          .explain(options.reproducible() ? Math.min(budgetS, options.deterministicLimit()) : budgetS);
      String message = proof.isEmpty() ? why.message() : proof + "; " + why.message();
      Stats stats = new Stats(arcsKept, arcs == null ? 0 : arcs.feasibleArcCount(), 0, solveS, solutions, 0, 0,
          Double.NaN, 0, 0, notes.toString().trim());
      return new SequencerResult(PlanStatus.INFEASIBLE, List.of(), 0, 0, Double.NaN, Double.NaN,
          unscheduled(new boolean[problem.size()], "not planned: the required requests are infeasible"), stats,
          message, why.conflicts());
    }

    private SequencerResult noPlan(String message, long arcsKept, double buildS, double solveS) {
      Stats stats = new Stats(arcsKept, arcs.feasibleArcCount(), buildS, solveS, solutions, 0, 0, Double.NaN, 0, 0,
          notes.toString().trim());
      return new SequencerResult(PlanStatus.NO_SOLUTION_IN_TIME, List.of(), 0, 0, knownBound, Double.NaN,
          unscheduled(new boolean[problem.size()], "not planned: no plan found in time"), stats, message);
    }
  }
}
