package dev.sequencer.sequence;

import com.google.ortools.sat.CpSolverStatus;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Request;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.sequence.Incumbent.Source;
import dev.sequencer.sequence.SequencerResult.Planned;
import dev.sequencer.sequence.SequencerResult.Stats;
import dev.sequencer.sequence.bound.BucketRelaxation;
import dev.sequencer.sequence.bound.NgRouteRelaxation;
import dev.sequencer.sequence.cpsat.NativeSolver;
import dev.sequencer.sequence.cpsat.NeighbourhoodSearch;
import dev.sequencer.sequence.cpsat.RoutingModel;
import dev.sequencer.sequence.cpsat.TimeBuckets;
import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Reasons;
import dev.sequencer.sequence.problem.Sections;
import dev.sequencer.sequence.problem.Structure;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.search.DeadlineOrders;
import dev.sequencer.sequence.search.ExactRepair;
import dev.sequencer.sequence.search.FlexibleSearch;
import dev.sequencer.sequence.search.GreedyPlanner;
import dev.sequencer.sequence.search.InsertionSearch;
import dev.sequencer.sequence.search.TwoStagePlanner;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.sequence.timing.ExactTimer;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.IntStream;

/**
 * Plans observations: first every required request, then the largest total priority, then the smallest
 * total transition time.
 *
 * <p>One run: model transitions ({@link ArcCosts}) and the exact timer; the greedy plan, any given seeds
 * (a re-plan's previous tail) and, when those miss required requests, the deadline orders; then, for
 * CP-SAT, the insertion search (or, with flexible exposures, the exposure moves), the LP bound, the
 * routing model (all time-feasible arcs up to {@link #LARGE} requests; above, the K best successor arcs
 * per request united with the warm start's arcs, probing and symmetry detection off) and, on large models,
 * our large-neighbourhood search; finally exact repair ({@link ExactRepair}) and one validation. Every
 * producer offers its plans to one {@link Incumbent}, which times them exactly and keeps the best by one
 * score; progress reports the incumbent and the incumbent is returned, so the result is never worse than
 * any plan reported during the run, nor than the greedy plan.
 *
 * <p>Budget: {@code timeLimitS} is the wall clock of the whole run from {@link SequencerOptions#clock}
 * (the façade starts it before the visibility windows). Each phase takes its share from what is left and
 * leaves a reserve for exact repair and the final check, so a phase that runs long takes from the later
 * ones. Reproducible mode replaces the clock by deterministic work limits. Stateless: one instance may
 * serve several threads.
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
  /** Share of the solve time the whole-model solve gets on large models before LNS takes over. */
  static final double MAIN_SHARE_LARGE = 0.35;
  /**
   * The insertion search runs only while fewer than this share of the schedulable tasks are bound by visits or
   * groups: its moves do not keep those rules, and on the 200-request cadence night (about half the tasks
   * bound) none of its improvements survived the prune (docs/benchmarks.md).
   */
  static final double INSERTION_RULES_MAX = 0.25;
  /** Share of the time left (before the end reserve) the insertion search gets to improve the warm start (fixed durations). */
  static final double INSERTION_SHARE = 0.5;
  /**
   * Insertion-search evaluations per CP-SAT deterministic unit in reproducible mode: about what one core
   * of this project's machine evaluates per second (a rough calibration, not a measured constant).
   */
  static final double INSERTION_EVALUATIONS_PER_UNIT = 6e6;
  /** Flexible exposures: share of the time left (before the end reserve) the exposure-aware moves get for the warm start. */
  static final double MOVES_START_SHARE = 0.4;
  /** Share of the time left (before the end reserve), and most seconds, the LP bound gets. */
  static final double LP_SHARE = 0.15;
  static final double LP_MAX_S = 5.0;
  /** Share of the time limit, and most seconds, the ng-route DP bound gets (after the LP). */
  static final double NG_SHARE = 0.3;
  static final double NG_MAX_S = 30.0;
  /** Memory (neighbourhood) size of the ng-route DP's first round. */
  static final int NG_SIZE = 8;
  /**
   * ng-route DP labels per CP-SAT deterministic unit in reproducible mode (a work limit instead of the clock;
   * the DP gets {@link #NG_SHARE} of the units, over all its rounds). Measured on this project's machine: 26,000
   * (150-request ground night) to 55,000 (300-request LEO day) labels per second on one core, so a unit of
   * labels is about a second.
   */
  static final long NG_LABELS_PER_UNIT = 40_000;
  /** Several resources: share of the time left (before the end reserve) for planning them one after the other. */
  static final double IN_TURN_SHARE = 0.4;
  /** Share of the time limit (and most seconds) kept for exact repair, and kept for the final check. */
  static final double REPAIR_SHARE = 0.1;
  static final double REPAIR_MAX_S = 2.0;
  static final double FINISH_SHARE = 0.1;
  static final double FINISH_MAX_S = 2.0;
  /** A search or bound phase with less than this left is skipped (its set-up alone would overrun). */
  static final long MIN_PHASE_NANOS = 10_000_000L;

  /** Plans {@code problem} with {@code options}. */
  public SequencerResult plan(PlanningProblem problem, SequencerOptions options) {
    return new Run(problem, options, Seeds.NONE, true).execute();
  }

  /** Plans with plans the caller already has ({@link Seeds}: warm starts and fallbacks). */
  public SequencerResult plan(PlanningProblem problem, SequencerOptions options, Seeds seeds) {
    return new Run(problem, options, seeds, true).execute();
  }

  /** The state of one call. */
  private static final class Run {
    private final PlanningProblem problem;
    private final SequencerOptions options;
    private final Seeds seeds;
    private final boolean validate;
    private final Budget budget;
    private final boolean reproducible;
    private final List<Note> notes = new ArrayList<>();
    private final Map<String, Double> phases = new LinkedHashMap<>();
    private ArcCosts arcs;
    private ExactTimer timer;
    private Incumbent incumbent;
    /** Requests exact repair inserted into accepted plans, early and final repair together. */
    private int repairAdded;
    private double lpBound = Double.NaN;
    private double cpBound = Double.NaN;
    private double ngBound = Double.NaN;
    private boolean cpOptimalWhole;
    private long cpOptimalPrize = -1;
    private long cpOptimalTransitionS = -1;
    private boolean provenInfeasible;
    /** Who proved the required requests infeasible, as the message starts ("" when the explanation is the proof). */
    private String proof = "";
    private long arcsKept;
    private double buildS;
    private double solveS;
    private int lnsRounds;
    private int lnsImprovements;
    private ExactRepair.Result repaired;

    private double ownPriority = Double.NaN;
    private final double checkExpectedS;

    Run(PlanningProblem problem, SequencerOptions options, Seeds seeds, boolean validate) {
      this.problem = problem;
      this.options = options;
      this.seeds = seeds;
      this.validate = validate;
      this.budget = options.budget();
      this.reproducible = options.reproducible();
      long observable = 0;
      for (Task t : problem.tasks()) {
        observable += t.schedulable() ? t.maxDurationS() : 0;
      }
      this.checkExpectedS = options.validator() == null ? 0
          : options.validator().expectedS(Math.min(problem.horizonS(), observable));
    }

    /** Seconds the final phases keep: exact repair, then result assembly and the validation. */
    private double endReserveS() {
      return repairReserveS() + finishReserveS();
    }

    private double repairReserveS() {
      return Math.min(REPAIR_SHARE * budget.totalS(), REPAIR_MAX_S);
    }

    /** The final check's expected seconds (plus result assembly), or the default share when that is larger. */
    private double finishReserveS() {
      return Math.max(Math.min(FINISH_SHARE * budget.totalS(), FINISH_MAX_S), checkExpectedS);
    }

    /** A deadline for a search phase: {@code share} of the total at most, leaving the end reserve. */
    private long searchDeadline(double share) {
      return reproducible ? Long.MAX_VALUE : budget.phaseDeadlineNanos(share, endReserveS());
    }

    private void note(Note.Kind kind, String text) {
      notes.add(new Note(kind, text));
    }

    private void timed(String phase, Runnable work) {
      long t0 = System.nanoTime();
      work.run();
      phases.merge(phase, (System.nanoTime() - t0) * 1e-9, Double::sum);
    }

    SequencerResult execute() {
      if (options.solver() != SequencerOptions.Solver.GREEDY && options.solver() != SequencerOptions.Solver.BEST_NOW) {
        NativeSolver.ensureLoaded(); // fails with a clear message on an unsupported platform
      }
      timed("arcs", () -> arcs = new ArcCosts(problem));
      timer = new ExactTimer(problem);
      incumbent = new Incumbent(problem, timer, options.listener(), budget);
      incumbent.offer(Plan.EMPTY, Source.EMPTY);
      List<String> unschedulable = new ArrayList<>(problem.tasks().stream()
          .filter(t -> t.required() && !t.schedulable()).map(Task::id).toList());
      Sections sec = problem.sections();
      for (int u = 0; sec != null && u < sec.unitCount(); u++) {
        if (sec.unitRequired(u) && java.util.Arrays.stream(sec.options(u)).noneMatch(k -> problem.task(k).schedulable())) {
          unschedulable.add(problem.requestId(sec.options(u)[0])); // a required request no resource can observe
        }
      }
      if (!unschedulable.isEmpty()) {
        provenInfeasible = true;
        return finish();
      }
      timed("greedy", () -> {
        GreedyPlanner greedy = new GreedyPlanner(problem, timer, options.solver() == SequencerOptions.Solver.BEST_NOW
            ? GreedyPlanner.Rule.BEST_NOW : GreedyPlanner.Rule.VALUE_PER_SECOND);
        incumbent.offer(greedy.plan(reproducible ? Long.MAX_VALUE : budget.phaseDeadlineNanos(1.0, endReserveS())),
            Source.GREEDY);
        if (greedy.wasCut()) {
          note(Note.Kind.BASELINE_CUT, "greedy stopped at the time limit with " + incumbent.best().plan().size()
              + " observation(s) (each choice times every candidate with the exact slews; exact repair goes on "
              + "from there).");
        }
      });
      for (Plan seed : seeds.warmStarts()) {
        if (incumbent.offer(seed, Source.PREFERRED)) {
          note(Note.Kind.SOURCE, "warm start: the given plan (" + incumbent.best().plan().size() + " of "
              + seed.size() + " observations fit) beats greedy.");
        }
      }
      if (!incumbent.best().score().complete()) {
        timed("deadline orders", () -> {
          for (Plan p : DeadlineOrders.plans(problem, timer)) {
            if (incumbent.offer(p, Source.DEADLINE_ORDER)) {
              note(Note.Kind.SOURCE, "warm start: a deadline order fits more required requests than greedy.");
            }
          }
        });
      }
      timed("repair", this::earlyRepair);
      switch (options.solver()) {
        case GREEDY, BEST_NOW -> {
          if (options.relaxationBound()) {
            timed("bound", () -> lpBound = relaxation(Math.min(LP_MAX_S, budget.phaseS(LP_SHARE, endReserveS()))));
            timed("ng-route bound", () -> ngRouteBound(false));
          }
        }
        case TWO_STAGE -> timed("two-stage", this::twoStage);
        case CPSAT -> cpsat();
        default -> throw new IllegalStateException("unknown solver " + options.solver());
      }
      Incumbent.Best own = incumbent.best();
      ownPriority = own.score().complete() ? own.plan().priority(problem) : Double.NaN;
      for (Plan fallback : seeds.fallbacks()) {
        if (incumbent.offer(fallback, Source.FALLBACK)) {
          note(Note.Kind.SOURCE, "the given fallback plan beats the search's plan.");
        }
      }
      timed("repair", this::repair);
      return finish();
    }

    // ---------------------------------------------------------------- CP-SAT and its searches

    private void cpsat() {
      if (problem.sections() != null && problem.sections().count() > 1) {
        timed("resources in turn", this::resourcesInTurn);
      }
      if (problem.hasFlexible()) {
        timed("moves", this::movesStart);
      } else if (options.hint() && ruleBoundShare() < INSERTION_RULES_MAX) {
        timed("insertion", this::insertionSearch);
      } else if (options.hint()) {
        note(Note.Kind.SEARCH, String.format(Locale.ROOT, "insertion search skipped: %.0f %% of the requests' "
            + "observations are bound by visits or groups, which its moves do not keep (its time goes to CP-SAT "
            + "and the LNS, whose slices keep them).", 100 * ruleBoundShare()));
      }
      if (options.relaxationBound()) {
        timed("bound", () -> lpBound = relaxation(Math.min(LP_MAX_S, budget.phaseS(LP_SHARE, endReserveS()))));
        incumbent.bound(lpBound);
        timed("ng-route bound", () -> ngRouteBound(true));
      }
      int[] nodes = IntStream.range(0, problem.size()).filter(k -> problem.task(k).schedulable()).toArray();
      boolean large = nodes.length > LARGE;
      int k = options.kBest() < 0 ? 0 : options.kBest() == 0 ? (large ? AUTO_K_BEST : 0) : options.kBest();
      boolean runLns = options.lns() && large;
      Plan hint = options.hint() ? hintPlan() : null;
      boolean hintComplete = hint != null && hint.requiredMissing(problem) == 0 && arcs.feasible(hint);
      RoutingModel model = new RoutingModel(problem, arcs);
      long solveEnd = searchDeadline(1.0);
      double solveLeftS = Math.max(0, (solveEnd - System.nanoTime()) * 1e-9);
      double mainTime = runLns ? Math.max(0.5, MAIN_SHARE_LARGE * solveLeftS) : solveLeftS;
      double mainDet = runLns ? MAIN_SHARE_LARGE * options.deterministicLimit() : options.deterministicLimit();
      RoutingModel.Params params = new RoutingModel.Params(reproducible ? options.timeLimitS() : mainTime,
          options.effectiveWorkers(), options.seed(), reproducible, mainDet, large, this::fromSolver);
      if (!reproducible) {
        // Fewer time buckets when the solve is short: building their bounds must not eat the solve.
        params = params.withBucketPairBudget(Math.min(params.bucketPairBudget(), TimeBuckets.PAIRS_PER_SOLVE_S * mainTime));
      }
      RoutingModel.Spec spec = new RoutingModel.Spec(nodes, Transitions.START, 0, -1, problem.horizonS(), hint, k);
      boolean skipMain = !reproducible && (solveLeftS < 0.05
          || (runLns && hintComplete && solveLeftS < MIN_MAIN_S_LARGE));
      RoutingModel.Outcome main = null;
      if (skipMain) {
        note(Note.Kind.BUDGET, String.format(Locale.ROOT, "whole-model solve skipped (%.1f s left before the end "
            + "reserve)%s.", solveLeftS, runLns ? "; the LNS starts from the warm start" : ""));
      } else {
        main = model.solve(spec, params);
        account(main);
        if (main.status() == CpSolverStatus.INFEASIBLE && k > 0 && (reproducible || System.nanoTime() < solveEnd)) {
          note(Note.Kind.SEARCH, "K-best model infeasible; re-solved with all arcs.");
          k = 0;
          spec = new RoutingModel.Spec(nodes, Transitions.START, 0, -1, problem.horizonS(), null, 0);
          main = model.solve(spec, params.withTime(reproducible ? options.timeLimitS()
              : Math.max(0.05, (solveEnd - System.nanoTime()) * 1e-9), mainDet));
          account(main);
        }
        readMainOutcome(main, k == 0, nodes.length);
      }
      boolean mainOptimal = main != null && main.status() == CpSolverStatus.OPTIMAL;
      Plan lnsStart = lnsStart(main == null ? null : main.plan(), hint);
      if (runLns && !mainOptimal && lnsStart != null) {
        timed("lns", () -> lns(model, lnsStart, solveEnd, mainDet));
      }
      if (problem.hasFlexible() && !mainOptimal) {
        timed("moves", () -> {
          Plan from = lnsStart(incumbentModelPlan(), null);
          if (from != null) {
            Plan better = new FlexibleSearch(problem, arcs).moves(from, solveEnd, reproducible, 0);
            if (incumbent.offer(better, Source.MOVES)) {
              note(Note.Kind.SEARCH, "exposures re-allocated exactly (and moves) after the search.");
            }
          }
        });
      }
    }

    /** Every CP-SAT solution goes to the incumbent; its bound too, when the model is the whole problem's. */
    private void fromSolver(Plan plan, long prizeBound) {
      incumbent.offer(plan, Source.CPSAT);
    }

    private void account(RoutingModel.Outcome o) {
      arcsKept = o.arcsKept();
      buildS += o.buildS();
      solveS += o.solveS();
      phases.merge("cp-sat", o.buildS() + o.solveS(), Double::sum);
    }

    /**
     * The whole model's status and bound: a proof of infeasibility, the bound on priority and optimality
     * hold only with all arcs and time-independent transitions (with time-dependent ones the model uses
     * upper bounds of the exact legs, so its optimum and bound hold for plans under those bounds only).
     */
    private void readMainOutcome(RoutingModel.Outcome main, boolean allArcs, int nodeCount) {
      boolean exactModel = allArcs && !problem.transitions().timeDependent();
      if (main.status() == CpSolverStatus.INFEASIBLE && exactModel) {
        provenInfeasible = true;
        proof = "CP-SAT proved that the required requests cannot all be scheduled";
      }
      if (exactModel && main.prizeBound() >= 0) {
        cpBound = problem.prizes().priorityBound(main.prizeBound(), nodeCount);
        incumbent.bound(cpBound);
      }
      if (exactModel && main.status() == CpSolverStatus.OPTIMAL && main.plan() != null) {
        cpOptimalWhole = true;
        cpOptimalPrize = main.prize();
        cpOptimalTransitionS = main.transitionS();
      }
    }

    /** The CP-SAT warm start: the incumbent under the model's transitions when that keeps it whole, else as it is. */
    private Plan hintPlan() {
      Plan best = incumbent.best().plan();
      Plan model = arcs.retime(best);
      return model.requiredMissing(problem) <= best.requiredMissing(problem) ? model : best;
    }

    /** The incumbent re-timed under the model's transitions (what a model-level search can start from). */
    private Plan incumbentModelPlan() {
      return arcs.retime(incumbent.best().plan());
    }

    /** The better model-feasible plan holding every required request, of the two given; null when neither. */
    private Plan lnsStart(Plan a, Plan b) {
      Plan best = null;
      for (Plan p : new Plan[] {a, b, incumbentModelPlan()}) {
        if (p != null && arcs.feasible(p) && p.requiredMissing(problem) == 0
            && (best == null || arcs.score(p).betterThan(arcs.score(best)))) {
          best = p;
        }
      }
      return best;
    }

    private void lns(RoutingModel model, Plan start, long solveEnd, double mainDet) {
      NeighbourhoodSearch lns = new NeighbourhoodSearch(problem, arcs, model, options.seed());
      RoutingModel.Params lnsParams = new RoutingModel.Params(0, options.effectiveWorkers(), options.seed(),
          reproducible, 0, false, null);
      java.util.function.Consumer<Plan> onImprove = p -> incumbent.offer(p, Source.LNS);
      long deadline = reproducible ? Long.MAX_VALUE : solveEnd;
      if (problem.hasFlexible()) {
        FlexibleSearch search = new FlexibleSearch(problem, arcs);
        search.improve(start, lns, deadline, options.deterministicLimit() - mainDet, lnsParams, onImprove);
        lnsImprovements += search.moveCount();
        note(Note.Kind.SEARCH, "exposure-aware moves: " + search.moveCount() + " accepted.");
      } else {
        lns.improve(start, deadline, options.deterministicLimit() - mainDet, lnsParams, onImprove);
      }
      lnsRounds = lns.rounds();
      lnsImprovements += lns.improvements();
    }

    /** Share of the schedulable tasks bound by a visit rule or a group (format additions A4, A5). */
    private double ruleBoundShare() {
      Structure st = problem.structure();
      long schedulable = IntStream.range(0, problem.size()).filter(k -> problem.task(k).schedulable()).count();
      long bound = IntStream.range(0, problem.size()).filter(k -> problem.task(k).schedulable()
          && (st.visitRuleOf(k) != null || st.groupOf(k) != null)).count();
      return schedulable == 0 ? 0 : bound / (double) schedulable;
    }

    /**
     * Improves the warm start by {@link InsertionSearch} for {@link #INSERTION_SHARE} of the time left
     * (in reproducible mode, for {@link #INSERTION_EVALUATIONS_PER_UNIT} evaluations per deterministic
     * unit instead); every better plan it finds is offered.
     */
    private void insertionSearch() {
      InsertionSearch search = new InsertionSearch(problem, arcs, options.seed());
      long evaluations = reproducible
          ? Math.max(1, (long) (INSERTION_SHARE * INSERTION_EVALUATIONS_PER_UNIT * options.deterministicLimit()))
          : Long.MAX_VALUE;
      double before = incumbent.best().plan().priority(problem);
      search.improve(incumbent.best().plan(), searchDeadline(INSERTION_SHARE), Long.MAX_VALUE, evaluations,
          p -> incumbent.offer(p, Source.INSERTION));
      note(Note.Kind.SEARCH, String.format(Locale.ROOT, "insertion search: %d iterations (%d evaluations), %d "
          + "improving; incumbent %.6g -> %.6g.", search.iterations(), search.evaluations(), search.improvements(),
          before, incumbent.best().plan().priority(problem)));
    }

    /** Flexible exposures: the exposure-aware moves on the incumbent, for up to {@link #MOVES_START_SHARE}. */
    private void movesStart() {
      Plan from = incumbentModelPlan();
      Plan moved = new FlexibleSearch(problem, arcs).moves(from, searchDeadline(MOVES_START_SHARE), reproducible,
          MOVES_START_SHARE * options.deterministicLimit());
      if (incumbent.offer(moved, Source.MOVES)) {
        note(Note.Kind.SOURCE, "warm start: exposure-aware moves improve the greedy plan.");
      }
    }

    /**
     * Several resources: the common practice as a warm start. Each resource in file order is planned alone
     * (its own one-resource problem, the whole sequencer on it, {@link #IN_TURN_SHARE} of the time left split
     * evenly) on the requests the earlier ones did not take; the plans together are one plan of the joint
     * problem, which the joint model then starts from, so the joint plan is never below it.
     */
    private void resourcesInTurn() {
      Sections sec = problem.sections();
      int m = sec.count();
      double each = Math.max(0.2, budget.phaseS(IN_TURN_SHARE, endReserveS()) / m);
      boolean[] taken = new boolean[problem.requests().size()];
      List<long[]> picked = new ArrayList<>(); // {task, start, duration}
      for (int r = 0; r < m; r++) {
        if (!reproducible && budget.remainingS() < endReserveS() + each) {
          break;
        }
        List<Request> requests = new ArrayList<>();
        for (Request q : problem.requests()) {
          requests.add(q.withRequired(false));
        }
        // A request goes to one resource with all its visits, a group with all its members: a group with a
        // member taken by an earlier resource is not offered again.
        java.util.Set<String> blocked = new java.util.HashSet<>();
        List<dev.sequencer.model.Group> groups = new ArrayList<>();
        for (dev.sequencer.model.Group g : problem.groups()) {
          if (g.members().stream().anyMatch(id -> taken[requestIndex(id)])) {
            blocked.addAll(g.members());
          } else {
            groups.add(g);
          }
        }
        List<dev.sequencer.model.RequestWindows> windows = new ArrayList<>();
        for (dev.sequencer.model.RequestWindows w : sec.windows(r)) {
          int q = requestIndex(w.id());
          if (q >= 0 && !taken[q] && !blocked.contains(w.id())) {
            windows.add(w);
          }
        }
        PlanningProblem alone = PlanningProblem.of(problem.horizon(), requests, groups, windows, sec.transitions(r));
        SequencerOptions o = (reproducible ? options.withReproducible(options.deterministicLimit() * IN_TURN_SHARE / m)
            : options.withTimeLimitS(each)).withClock(null).withListener(null).withValidator(null);
        SequencerResult one = new Run(alone, o, Seeds.NONE, false).execute();
        for (Planned p : one.observations()) {
          int q = requestIndex(p.id());
          taken[q] = true;
          picked.add(new long[] {optionOn(sec, q, p.visit() == null ? 1 : p.visit(), r), p.startS() + sec.offsetS(r),
              p.endS() - p.startS()});
        }
        if (r + 1 < m) {
          picked.add(new long[] {sec.markerOf(r + 1), problem.task(sec.markerOf(r + 1)).earliestStartS(), 0});
        }
      }
      // Each resource's problem is built from the requests; when this problem's tasks were derived from them
      // (the two-stage baseline's preset exposures) an exposure chosen there may not be an option here.
      if (picked.stream().anyMatch(x -> !problem.task((int) x[0]).hasOption(x[2]) && !problem.isMarker((int) x[0]))) {
        note(Note.Kind.SOURCE, "resources in turn: not offered, its exposures are not this problem's options.");
        return;
      }
      if (incumbent.offer(plan(picked), Source.RESOURCES_IN_TURN)) {
        note(Note.Kind.SOURCE, "warm start: the resources planned one after the other beat greedy.");
      }
    }

    private int requestIndex(String id) {
      for (int q = 0; q < problem.requests().size(); q++) {
        if (problem.requests().get(q).id().equals(id)) {
          return q;
        }
      }
      return -1;
    }

    /** The option of request q's visit (1-based) on resource {@code section}. */
    private int optionOn(Sections sec, int q, int visit, int section) {
      for (int k : sec.requestOptions(q)) {
        if (sec.sectionOf(k) == section && problem.structure().visitOf(k) == visit) {
          return k;
        }
      }
      throw new IllegalStateException("request " + q + " has no option for visit " + visit + " on resource " + section);
    }

    /** The two-stage baseline (flexible exposures): stage 1 gets the time left, stage 2 is one LP. */
    private void twoStage() {
      double stage1S = Math.max(0.5, budget.phaseS(1.0, endReserveS()));
      Plan plan = new TwoStagePlanner(problem, arcs).plan(p -> {
        SequencerOptions o = options.withSolver(SequencerOptions.Solver.CPSAT).withClock(null)
            .withTimeLimitS(stage1S).withListener(null).withValidator(null);
        SequencerResult r = new Run(p, o, Seeds.NONE, false).execute();
        return r.hasPlan() ? planOf(p, r) : Plan.EMPTY;
      });
      incumbent.offer(plan, Source.TWO_STAGE);
      note(Note.Kind.SOURCE, "two-stage baseline: preset exposures, then continuous re-allocation.");
    }

    /**
     * The plan of {@code p} that result {@code r} of it describes: each observation's task by request, visit
     * and resource (a request with visits, A4, or several resources, A6, has a task per visit and resource), at
     * its start in planner seconds (a resource's own seconds plus its offset), in planner time order with each
     * later resource's boundary marker before its first observation (as {@link #resourcesInTurn} builds one).
     */
    private static Plan planOf(PlanningProblem p, SequencerResult r) {
      Sections sec = p.sections();
      List<long[]> picked = new ArrayList<>();
      for (Planned o : r.observations()) {
        int k = taskOf(p, o);
        long off = sec == null ? 0 : sec.offsetS(sec.sectionOf(k));
        picked.add(new long[] {k, o.startS() + off, o.endS() - o.startS()});
      }
      for (int s = 1; sec != null && s < sec.count(); s++) {
        picked.add(new long[] {sec.markerOf(s), p.task(sec.markerOf(s)).earliestStartS(), 0});
      }
      picked.sort(java.util.Comparator.comparingLong((long[] x) -> x[1]).thenComparingInt(x -> p.isMarker((int) x[0])
          ? 0 : 1));
      return plan(picked);
    }

    /** A plan from its entries in order, each {task, start, duration}. */
    private static Plan plan(List<long[]> picked) {
      int[] order = new int[picked.size()];
      long[] starts = new long[picked.size()];
      long[] durs = new long[picked.size()];
      for (int i = 0; i < order.length; i++) {
        order[i] = (int) picked.get(i)[0];
        starts[i] = picked.get(i)[1];
        durs[i] = picked.get(i)[2];
      }
      return new Plan(order, starts, durs);
    }

    private static int taskOf(PlanningProblem p, Planned o) {
      Sections sec = p.sections();
      int visit = o.visit() == null ? 1 : o.visit();
      for (int k = 0; k < p.size(); k++) {
        if (!p.isMarker(k) && p.requestId(k).equals(o.id()) && p.structure().visitOf(k) == visit
            && (sec == null || sec.resourceId(sec.sectionOf(k)).equals(o.resource()))) {
          return k;
        }
      }
      throw new IllegalStateException("no task for " + o.id() + " visit " + visit + " on " + o.resource());
    }

    private double relaxation(double timeLimitS) {
      if (timeLimitS <= 0.01) {
        note(Note.Kind.BOUND, "no LP bound: no time left for it.");
        return Double.NaN;
      }
      try {
        NativeSolver.ensureLoaded();
      } catch (NativeSolver.Unavailable e) {
        note(Note.Kind.BOUND, "no LP bound: the native solver is unavailable on this platform.");
        return Double.NaN;
      }
      return BucketRelaxation.bound(problem, arcs, timeLimitS);
    }

    /**
     * The ng-route DP bound ({@link NgRouteRelaxation}) above the incumbent's priority, for {@link #NG_SHARE}
     * of the limit (at most {@link #NG_MAX_S}), when a plan holds every required request and the priority is
     * not proven yet; with time-independent transitions its best path, when
     * elementary, is a model-feasible plan and is offered ({@code offerPath}).
     */
    private void ngRouteBound(boolean offerPath) {
      Incumbent.Best own = incumbent.best();
      if (!own.score().complete()) {
        // Finding a plan with every required request comes first: the searches get the time.
        note(Note.Kind.BOUND, "no ng-route bound: no plan holds every required request yet.");
        return;
      }
      double floor = own.plan().priority(problem);
      double known = minIgnoringNaN(lpBound, problem.trivialBound());
      if (floor >= known - 1e-6 * Math.max(1, problem.trivialBound())) {
        return; // the priority is proven already
      }
      long deadline = reproducible ? Long.MAX_VALUE
          : Math.min(budget.phaseDeadlineNanos(NG_SHARE, endReserveS()), System.nanoTime() + (long) (NG_MAX_S * 1e9));
      if (deadline - System.nanoTime() < MIN_PHASE_NANOS) {
        note(Note.Kind.BOUND, "no ng-route bound: no time left for it.");
        return;
      }
      long maxLabels = reproducible
          ? (long) (NG_SHARE * NG_LABELS_PER_UNIT * Math.max(1, options.deterministicLimit()))
          : Long.MAX_VALUE;
      NgRouteRelaxation.Result r = NgRouteRelaxation.bound(problem, arcs, floor, NG_SIZE, deadline, Integer.MAX_VALUE,
          NgRouteRelaxation.MAX_LABELS, maxLabels);
      if (Double.isNaN(r.bound())) {
        note(Note.Kind.BOUND, String.format(Locale.ROOT, "no ng-route bound: its first round did not finish %s "
            + "(%d labels).", reproducible ? "within its work limit" : "in time", r.labels()));
        return;
      }
      ngBound = r.bound();
      incumbent.bound(ngBound);
      note(Note.Kind.BOUND, String.format(Locale.ROOT, "ng-route bound %.6g (%d round(s), %d labels%s).", ngBound,
          r.rounds(), r.labels(), r.elementary() ? ", best path elementary" : ""));
      if (offerPath && r.elementaryPath() != null && !problem.transitions().timeDependent()
          && problem.mustBeLastIndex() < 0 && arcs.feasible(r.elementaryPath())
          && incumbent.offer(r.elementaryPath(), Source.STATE_SPACE)) {
        note(Note.Kind.SOURCE, "the ng-route DP's best path beats the warm start.");
      }
    }

    // ---------------------------------------------------------------- repair and result

    /**
     * Exact repair of the incumbent until the finish reserve (no limit in reproducible mode), in rounds
     * until a round inserts nothing: then every request it reports as failing fails on the returned plan.
     */
    private void repair() {
      repaired = repairRounds(reproducible ? Long.MAX_VALUE : budget.phaseDeadlineNanos(1.0, finishReserveS()));
      if (repairAdded > 0) {
        note(Note.Kind.EXACT_TIMING, "exact repair inserted " + repairAdded + " request(s) during the run (the "
            + "model's slew bounds, or "
            + "greedy's order, had left them out).");
      }
      if (!repaired.untried().isEmpty()) {
        note(Note.Kind.BUDGET, repaired.untried().size() + " unscheduled request(s) not re-checked with the exact "
            + "slews before the time limit.");
      }
    }

    /**
     * Exact repair of the warm start (greedy, seeds, deadline orders) before the searches, in rounds as the
     * final repair and with all the time before the finish reserve (so the final repair's reserve too, which
     * the greedy solver's repair has): the greedy baseline is greedy plus this
     * repair, and every solver starts from it, so no solver's plan is below the baseline's for lack of time
     * to repair (a solver only loses search time when repair is slow). Found by the planner fuzz property:
     * a station night at 1 s whose early repair had a quarter of the time and stopped short of greedy's.
     */
    private void earlyRepair() {
      ExactRepair.Result r = repairRounds(reproducible ? Long.MAX_VALUE
          : budget.phaseDeadlineNanos(1.0, finishReserveS()));
      if (!r.untried().isEmpty()) {
        note(Note.Kind.BASELINE_CUT, r.untried().size() + " request(s) not tried by the exact repair of the greedy "
            + "baseline before the time limit (the windows and slews took most of it).");
      }
    }

    /** Rounds of exact repair on the incumbent until a round inserts nothing or {@code deadline}; the last round. */
    private ExactRepair.Result repairRounds(long deadline) {
      ExactRepair r = new ExactRepair(problem, timer);
      while (true) {
        ExactRepair.Result round = r.repair(incumbent.best().plan(), deadline);
        if (round.inserted().isEmpty()) {
          return round;
        }
        if (incumbent.offer(round.plan(), Source.REPAIR)) {
          repairAdded += round.inserted().size();
        } else {
          // Cannot happen (an insertion raises the prize); its findings are then not vouched for.
          return new ExactRepair.Result(round.plan(), List.of(), List.of(), List.of(),
              concat(concat(concat(round.failed(), round.noGain()), round.inserted()), round.untried()));
        }
        if (System.nanoTime() >= deadline) {
          // The last round changed the plan and there is no time to re-check its failures on it.
          return new ExactRepair.Result(round.plan(), round.inserted(), List.of(), List.of(),
              concat(concat(round.failed(), round.noGain()), round.untried()));
        }
      }
    }

    private static List<Integer> concat(List<Integer> a, List<Integer> b) {
      List<Integer> out = new ArrayList<>(a);
      out.addAll(b);
      return out;
    }

    private SequencerResult finish() {
      Incumbent.Best best = incumbent.best();
      if (provenInfeasible) {
        if (best.score().complete() && best.plan().size() > 0) {
          note(Note.Kind.SOURCE, "CP-SAT reported the required requests infeasible, yet a plan holds them all (a "
              + "bug in the model); the plan is returned.");
        } else {
          return infeasible();
        }
      }
      if (!best.score().complete()) {
        return noPlan();
      }
      Plan plan = best.plan();
      ExactTimer.Timed timed = best.timed();
      double priority = plan.priority(problem);
      double bound = minIgnoringNaN(minIgnoringNaN(minIgnoringNaN(cpBound, lpBound), ngBound), problem.trivialBound());
      double tolerance = 1e-6 * Math.max(1, problem.trivialBound());
      if (bound < priority - tolerance) {
        throw new IllegalStateException("proven bound " + bound + " is below the plan's priority " + priority
            + " (a bug)");
      }
      boolean priorityProven = bound <= priority + tolerance;
      boolean optimal = cpOptimalWhole && plan.prize(problem) == cpOptimalPrize
          && arcs.transitionS(plan) == cpOptimalTransitionS && arcs.feasible(plan);
      if (priorityProven) {
        bound = priority;
        if (!optimal) {
          note(Note.Kind.OPTIMALITY, "priority proven optimal (the bound is reached); FEASIBLE because the slew total "
              + "is not proven minimal (" + whySlewUnproven() + ").");
        }
      }
      List<Planned> planned = new ArrayList<>();
      Sections sections = problem.sections();
      for (int q = 0; q < plan.size(); q++) {
        Task t = problem.task(plan.order()[q]);
        int k = plan.order()[q];
        if (problem.isMarker(k)) {
          continue;
        }
        long s = sections == null ? plan.startS()[q] : sections.localS(k, plan.startS()[q]);
        long e = sections == null ? plan.endS(q) : sections.localS(k, plan.endS(q));
        boolean visits = problem.requests().get(problem.structure().requestOf(k)).hasVisits();
        planned.add(new Planned(problem.requestId(k), problem.instant(s), problem.instant(e), s, e, timed.legS()[q],
            t.flexible() ? plan.value(problem, q) : null, visits ? problem.structure().visitOf(k) : null,
            sections == null ? null : sections.resourceId(sections.sectionOf(k))));
      }
      if (sections != null) {
        // One timeline in time order; observations starting together follow the resources' file order.
        List<String> ids = sections.resourceIds();
        planned.sort(java.util.Comparator.comparingLong(Planned::startS)
            .thenComparingInt(p -> ids.indexOf(p.resource())));
      }
      note(Note.Kind.SOURCE, "returned plan found by " + best.source().name().toLowerCase(Locale.ROOT).replace('_', ' ')
          + ".");
      PlanStatus status = optimal ? PlanStatus.OPTIMAL : PlanStatus.FEASIBLE;
      List<Unscheduled> unscheduled = unscheduled(timed);
      SequencerResult result = SequencerResult.planned(status, planned, priority, timed.transitionS(), bound,
          priorityProven, unscheduled, stats(best.source()));
      if (!validate) {
        return result;
      }
      timed("check", () -> check(result));
      return SequencerResult.planned(status, planned, priority, timed.transitionS(), bound, priorityProven, unscheduled,
          stats(best.source()));
    }

    private String whySlewUnproven() {
      if (problem.transitions().timeDependent()) {
        return "the slews depend on time and the model uses upper bounds of them";
      }
      if (options.solver() != SequencerOptions.Solver.CPSAT) {
        return "the " + options.solver().name().toLowerCase(Locale.ROOT).replace('_', '-') + " planner proves nothing";
      }
      if (!cpOptimalWhole) {
        return "CP-SAT did not finish the whole model in the time limit";
      }
      return "the returned plan differs from CP-SAT's proven optimum in its whole-second transition total";
    }

    /** The one validation of the returned plan: a violation is a bug, and no invalid plan is handed out. */
    private void check(SequencerResult result) {
      ResultCheck v = options.validator() != null ? options.validator() : ResultCheck.of(SelfCheck.of(problem));
      List<String> violations = v.violations(result);
      if (!violations.isEmpty()) {
        throw new IllegalStateException("the sequencer produced an invalid plan (a bug): " + violations);
      }
    }

    /**
     * Each request left out, with its reason; "lost to conflicts" only for requests exact repair could not
     * insert. A request with visits (A4) is listed once, with the visits it misses, when any is missing.
     */
    private List<Unscheduled> unscheduled(ExactTimer.Timed timed) {
      boolean[] in = timed.plan().membership(problem.size());
      java.util.Set<Integer> failed = repaired == null ? java.util.Set.of() : new java.util.HashSet<>(repaired.failed());
      java.util.Set<Integer> noGain = repaired == null ? java.util.Set.of() : new java.util.HashSet<>(repaired.noGain());
      ExactRepair reasons = new ExactRepair(problem, timer);
      List<Unscheduled> out = new ArrayList<>();
      java.util.Map<Integer, Integer> missing = new java.util.TreeMap<>(); // file order
      java.util.Map<Integer, String> why = new java.util.HashMap<>();
      Sections sections = problem.sections();
      java.util.Map<Integer, java.util.Map<String, String>> perResource = new java.util.HashMap<>();
      java.util.Map<Integer, Integer> firstTask = new java.util.HashMap<>();
      java.util.Set<Integer> units = new java.util.HashSet<>();
      for (int k = 0; k < problem.size(); k++) {
        Task t = problem.task(k);
        if (in[k] || problem.isMarker(k) || sections != null && (heldElsewhere(sections, k, in)
            || !t.schedulable() && otherOptionSchedulable(sections, k))) {
          continue;
        }
        String reason;
        if (!t.schedulable()) {
          reason = t.emptyReason();
        } else if (failed.contains(k)) {
          reason = reasons.reason(timed, k);
        } else if (noGain.contains(k)) {
          reason = Reasons.NO_GAIN;
        } else {
          reason = Reasons.NOT_RECHECKED;
        }
        int r = problem.structure().requestOf(k);
        if (sections != null) {
          perResource.computeIfAbsent(r, x -> new java.util.LinkedHashMap<>())
              .putIfAbsent(sections.resourceId(sections.sectionOf(k)), reason);
          firstTask.putIfAbsent(r, k);
          if (!units.add(sections.unitOf(k))) {
            continue; // another option of the same visit: one visit missing, not one per resource
          }
        }
        if (missing.merge(r, 1, Integer::sum) == 1) {
          why.put(r, Reasons.withRules(problem, k, timed.plan(), reason));
        }
      }
      perResource.forEach((r, each) -> why.put(r, Reasons.withRules(problem, firstTask.get(r), timed.plan(),
          onResources(each))));
      missing.forEach((r, n) -> out.add(new Unscheduled(problem.requests().get(r).id(), why.get(r),
          problem.requests().get(r).hasVisits() ? n : null)));
      return out;
    }

    /**
     * One reason from each resource's (several resources): the words once when every resource gives the same
     * or only one gives any and it is not a loss to conflicts; else each resource's after "on R", under one
     * "lost to conflicts" when every one is such a loss ("lost to conflicts: on R1 its windows are taken by
     * A, B; on R2 no room for the slews from C").
     */
    private static String onResources(java.util.Map<String, String> reasons) {
      String prefix = Reasons.LOST_TO_CONFLICTS + ": ";
      boolean allLost = reasons.values().stream().allMatch(x -> x.startsWith(prefix));
      if (new java.util.HashSet<>(reasons.values()).size() == 1 && (reasons.size() > 1 || !allLost)) {
        return reasons.values().iterator().next();
      }
      List<String> parts = new ArrayList<>();
      reasons.forEach((res, why) -> parts.add("on " + res + " " + (allLost ? why.substring(prefix.length()) : why)));
      return (allLost ? prefix : "") + String.join("; ", parts);
    }

    /** True when another option of k's request (several resources) is in the plan. */
    private boolean heldElsewhere(Sections sections, int k, boolean[] in) {
      for (int o : sections.options(sections.unitOf(k))) {
        if (in[o]) {
          return true;
        }
      }
      return false;
    }

    /**
     * True when some option of k's request other than k can be scheduled: the reason given is then that
     * option's (a request never visible from one resource is listed with what kept it off the others).
     */
    private boolean otherOptionSchedulable(Sections sections, int k) {
      for (int o : sections.options(sections.unitOf(k))) {
        if (o != k && problem.task(o).schedulable()) {
          return true;
        }
      }
      return false;
    }

    private Stats stats(Source source) {
      return new Stats(arcsKept, arcs == null ? 0 : arcs.feasibleArcCount(), buildS, solveS, incumbent.offers(),
          lnsRounds, lnsImprovements, minIgnoringNaN(lpBound, ngBound), source.name(), ownPriority, notes, phases);
    }

    /** Every request with {@code reason} (or why it cannot be scheduled at all), in file order. */
    private List<Unscheduled> all(String reason) {
      java.util.Map<Integer, Unscheduled> listed = new java.util.TreeMap<>();
      for (int k = 0; k < problem.size(); k++) {
        Task t = problem.task(k);
        int r = problem.structure().requestOf(k);
        if (problem.isMarker(k) || problem.sections() != null && !t.schedulable()
            && otherOptionSchedulable(problem.sections(), k)) {
          continue;
        }
        if (!listed.containsKey(r)) {
          Request q = problem.requests().get(r);
          listed.put(r, new Unscheduled(q.id(), t.schedulable() ? reason : t.emptyReason(),
              q.hasVisits() ? q.visits().count() : null));
        }
      }
      return new ArrayList<>(listed.values());
    }

    /** INFEASIBLE: proven, and explained by {@link RequiredConflicts} within the time left (at least 0.2 s). */
    private SequencerResult infeasible() {
      RequiredConflicts.Explanation why = explain();
      String message = proof.isEmpty() ? why.message() : proof + "; " + why.message();
      return SequencerResult.infeasible(message, why.conflicts(), all(Reasons.INFEASIBLE), stats(Source.EMPTY));
    }

    /** NO_SOLUTION_IN_TIME: no producer found a plan with every required request; suspects named when time allows. */
    private SequencerResult noPlan() {
      String message = "no plan holding every required request was found in the time limit (this proves nothing)";
      List<RequiredConflicts.Conflict> suspects = List.of();
      if (options.solver() == SequencerOptions.Solver.CPSAT && budget.remainingS() > 0.3) {
        RequiredConflicts.Explanation why = explain();
        suspects = why.conflicts();
        if (!why.conflicts().isEmpty()) {
          message += "; suspected: " + why.message();
        }
      }
      double bound = minIgnoringNaN(minIgnoringNaN(minIgnoringNaN(cpBound, lpBound), ngBound), problem.trivialBound());
      return SequencerResult.noPlanInTime(message, suspects, bound, all(Reasons.NO_PLAN), stats(Source.EMPTY));
    }

    private RequiredConflicts.Explanation explain() {
      double budgetS = reproducible ? Math.min(10, options.deterministicLimit())
          : Math.min(10, Math.max(0.2, budget.remainingS() - 0.1));
      return new RequiredConflicts(problem, arcs, options.seed(), reproducible).explain(budgetS);
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
  }
}
