package dev.sequencer.sequence.cpsat;

import com.google.ortools.sat.BoolVar;
import com.google.ortools.sat.CircuitConstraint;
import com.google.ortools.sat.CpModel;
import com.google.ortools.sat.CpSolver;
import com.google.ortools.sat.CpSolverSolutionCallback;
import com.google.ortools.sat.CpSolverStatus;
import com.google.ortools.sat.IntVar;
import com.google.ortools.sat.IntervalVar;
import com.google.ortools.sat.LinearExpr;
import com.google.ortools.sat.LinearExprBuilder;
import com.google.ortools.sat.Literal;
import com.google.ortools.sat.SatParameters;
import com.google.ortools.util.Domain;
import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Prizes;
import dev.sequencer.sequence.problem.Sections;
import dev.sequencer.sequence.problem.Span;
import dev.sequencer.sequence.problem.StartRange;
import dev.sequencer.sequence.problem.Structure;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.function.Predicate;
import java.util.function.ToLongFunction;

/**
 * The CP-SAT model of a prize-collecting path with time windows over a set of requests, between a fixed
 * predecessor ({@code from}: the start pointing or a fixed observation that ends at {@code departS}) and
 * an optional fixed successor ({@code to}, which starts at {@code arriveByS}).
 *
 * <p>The whole problem is the case from = START, departS = 0, to = none, arriveByS = horizon end; the
 * large-neighbourhood search solves slices of the timeline with the same model. Phases, top to bottom:
 * variables, circuit with transitions, redundant no-overlap, objective, hint, solve, read back. Circuit
 * node 0 is the depot: arcs out of it choose the first request, arcs into it the last.
 */
public final class RoutingModel {
  /** What the objective optimises. */
  public enum Mode {
    /** Maximise priority·W − transition, W = max total transition + 1: exact lexicographic order. */
    COMBINED,
    /** Maximise priority only (stage 1 of two). */
    PRIORITY,
    /** Fix priority, minimise transition (stage 2 of two). */
    TRANSITION
  }

  /** Largest objective magnitude kept exact in CP-SAT's double-valued objective and bound. */
  public static final long EXACT_DOUBLE_LIMIT = 1L << 53;

  /**
   * A sub-problem: candidate requests, fixed predecessor {@code from} ({@link Transitions#START} or a
   * request) ending at {@code departS}, fixed successor {@code to} (-1 for none) starting at
   * {@code arriveByS} (or the horizon end), a hint (may be null), and the arc limit per request ({@code
   * kBest} ≤ 0 keeps all time-feasible arcs).
   */
  public record Spec(int[] nodes, int from, long departS, int to, long arriveByS, Plan hint, int kBest, Plan context) {
    /** A spec without a surrounding plan: the whole problem, or a slice whose rules reach nothing outside. */
    public Spec(int[] nodes, int from, long departS, int to, long arriveByS, Plan hint, int kBest) {
      this(nodes, from, departS, to, arriveByS, hint, kBest, null);
    }
  }

  /** Solver settings for one solve. */
  public record Params(double timeLimitS, int workers, int seed, boolean reproducible, double deterministicLimit,
      boolean probingOff, Sink sink, double bucketPairBudget) {
    /** Settings with the default budget of time-bucket pairs ({@link TimeBuckets#PAIR_BUDGET}). */
    public Params(double timeLimitS, int workers, int seed, boolean reproducible, double deterministicLimit,
        boolean probingOff, Sink sink) {
      this(timeLimitS, workers, seed, reproducible, deterministicLimit, probingOff, sink, TimeBuckets.PAIR_BUDGET);
    }

    public Params withTime(double t, double det) {
      return new Params(t, workers, seed, reproducible, det, probingOff, sink, bucketPairBudget);
    }

    public Params withSink(Sink s) {
      return new Params(timeLimitS, workers, seed, reproducible, deterministicLimit, probingOff, s, bucketPairBudget);
    }

    /** The same settings with at most {@code pairs} bucket-pair bounds per model (fewer buckets when time is short). */
    public Params withBucketPairBudget(double pairs) {
      return new Params(timeLimitS, workers, seed, reproducible, deterministicLimit, probingOff, sink, pairs);
    }
  }

  /**
   * Receives each solution of a solve as it is found (from CP-SAT's threads) with the proven bound on its
   * prize known then (-1 when none).
   */
  @FunctionalInterface
  public interface Sink {
    void solution(Plan plan, long prizeBound);
  }

  /**
   * The outcome: CP-SAT status (of the last stage), plan (null if none), its prize and model transition,
   * the proven bound on the prize within this model (-1 if none), solutions found, arcs kept, build and
   * solve seconds and deterministic time used.
   */
  public record Outcome(CpSolverStatus status, Plan plan, long prize, long transitionS, long prizeBound,
      int solutions, long arcsKept, double buildS, double solveS, double deterministicTime) {}

  /** The CP-SAT variables of one flexible request: grid step, end, interval, scaled value, span literals. */
  private record FlexVars(Task exposure, IntVar step, IntVar end, IntervalVar interval, IntVar value,
      List<Literal> spans, List<long[]> spanRanges) {}

  private final PlanningProblem problem;
  private final ArcCosts arcs;
  private final Prizes prizes;

  static {
    NativeSolver.ensureLoaded();
  }

  public RoutingModel(PlanningProblem problem, ArcCosts arcs) {
    this.problem = problem;
    this.arcs = arcs;
    this.prizes = problem.prizes();
  }

  /**
   * Solves the spec lexicographically: one COMBINED solve when priority·W fits in 2^53, otherwise
   * PRIORITY then TRANSITION with the priority fixed, each with half the time.
   */
  public Outcome solve(Spec spec, Params params) {
    long start = System.nanoTime(); // the time limit covers building the model too
    Built probe = new Built(spec, Mode.COMBINED, 0, params);
    if (probe.fitsCombined()) {
      return probe.run(params, start, 1.0);
    }
    Built stage1 = new Built(spec, Mode.PRIORITY, 0, params);
    Outcome o1 = stage1.run(params.withTime(params.timeLimitS(), params.deterministicLimit() / 2), start, 0.5);
    if (o1.plan() == null) {
      return o1;
    }
    Spec spec2 = new Spec(spec.nodes(), spec.from(), spec.departS(), spec.to(), spec.arriveByS(), o1.plan(),
        spec.kBest(), spec.context());
    Built stage2 = new Built(spec2, Mode.TRANSITION, o1.prize(), params);
    Outcome o2 = stage2.run(params.withTime(params.timeLimitS(), params.deterministicLimit() / 2), start, 1.0);
    boolean bothOptimal = o1.status() == CpSolverStatus.OPTIMAL && o2.status() == CpSolverStatus.OPTIMAL;
    Outcome best = o2.plan() != null ? o2 : o1;
    return new Outcome(bothOptimal ? CpSolverStatus.OPTIMAL : CpSolverStatus.FEASIBLE, best.plan(),
        best.prize(), best.transitionS(), o1.prizeBound(), o1.solutions() + o2.solutions(),
        o1.arcsKept(), o1.buildS() + o2.buildS(), o1.solveS() + o2.solveS(),
        o1.deterministicTime() + o2.deterministicTime());
  }

  /** One built CP-SAT model. */
  private final class Built {
    private final Spec spec;
    private final Mode mode;
    private final CpModel model = new CpModel();
    private final List<Integer> nodes = new ArrayList<>();
    private final List<long[][]> domains = new ArrayList<>();
    private final List<BoolVar> present = new ArrayList<>();
    private final List<IntVar> startS = new ArrayList<>();
    private final List<IntervalVar> intervals = new ArrayList<>();
    /** Per model position: the flexible request's variables (extension "flexible exposure"), or null. */
    private final List<FlexVars> flex = new ArrayList<>();
    /** Per model position: bucket index -> literal "the start lies in that bucket" (time buckets only). */
    private final List<java.util.TreeMap<Integer, BoolVar>> inBucket = new ArrayList<>();
    /** Per model position: bucket index -> [lowest, highest] start of the domain inside that bucket. */
    private final List<java.util.TreeMap<Integer, long[]>> bucketSpan = new ArrayList<>();
    private TimeBuckets buckets;
    private final java.util.Map<Long, long[][]> bucketCosts = new java.util.HashMap<>();
    private final List<int[]> arcEnds = new ArrayList<>();
    private final List<Literal> arcLits = new ArrayList<>();
    private final List<Long> arcCost = new ArrayList<>();
    private final long buildNanos;
    private boolean emptyAllowed;
    private long weight = 1;
    private long maxScaledPriority;
    private LinearExpr priorityExpr;
    private LinearExpr transitionExpr;

    private final int bucketsPerRequest;

    Built(Spec spec, Mode mode, long fixedPriority, Params params) {
      long t0 = System.nanoTime();
      this.spec = spec;
      this.mode = mode;
      this.bucketsPerRequest = TimeBuckets.bucketsFor(spec.nodes().length, params.bucketPairBudget());
      this.buckets = TimeBuckets.wanted(problem, spec.nodes().length) && bucketsPerRequest > 1 ? new TimeBuckets(problem)
          : null;
      addVariables();
      addStructure();
      addCircuitWithTransitions();
      addRedundantNoOverlap();
      if (flex.stream().anyMatch(java.util.Objects::nonNull)) {
        addRedundantEnergy();
      }
      addObjective(fixedPriority);
      addHint();
      this.buildNanos = System.nanoTime() - t0;
    }

    private String name(int node) {
      if (node == Transitions.START) {
        return "START";
      }
      return problem.task(node).id();
    }

    /** Adds: present[R] (bool), startS[R] in the union of R's start ranges inside [departS, arriveByS − dur], obs[R] optional interval. */
    private void addVariables() {
      for (int k : spec.nodes()) {
        Task t = problem.task(k);
        long lo = spec.departS();
        long hi = spec.arriveByS() - t.durationS();
        List<long[]> parts = new ArrayList<>();
        for (StartRange r : t.starts()) {
          long a = Math.max(lo, r.fromS());
          long b = Math.min(hi, r.toS());
          if (a <= b) {
            parts.add(new long[] {a, b});
          }
        }
        if (parts.isEmpty()) {
          if (t.required()) {
            // Keep the request so the model is (correctly) infeasible rather than silently dropping it.
            parts.add(new long[] {lo, lo});
            BoolVar contradiction = model.newBoolVar("fits[" + t.id() + "]");
            model.addEquality(contradiction, 1);
            model.addEquality(contradiction, 0);
          } else {
            continue;
          }
        }
        long[][] dom = parts.toArray(new long[0][]);
        BoolVar p = model.newBoolVar("present[" + t.id() + "]");
        IntVar s = model.newIntVarFromDomain(Domain.fromIntervals(dom), "startS[" + t.id() + "]");
        FlexVars fv = t.optionCount() == 1 ? null : addExposure(k, t, dom, p, s);
        IntervalVar iv = fv != null ? fv.interval
            : model.newOptionalFixedSizeIntervalVar(s, t.durationS(), p, "obs[" + t.id() + "]");
        if (t.required()) {
          model.addEquality(p, 1);
        }
        nodes.add(k);
        domains.add(dom);
        present.add(p);
        startS.add(s);
        intervals.add(iv);
        flex.add(fv);
        if (buckets != null) {
          addBucketLiterals(t, dom, p, s);
        }
      }
    }

    /**
     * Adds the exposure of flexible request R: exposureStep[R] = g in [0, count − 1], exposure = min +
     * step·g, endS[R] = startS[R] + exposure on the optional interval obs[R] (variable size); the whole
     * observation in one span: inSpan[R][w] implies span.from <= startS[R] and endS[R] <= span.to, with
     * Σ_w inSpan[R][w] = present[R]; value[R] = scaledValue[g] (element) when present, 0 (and g = 0) when
     * absent.
     */
    private FlexVars addExposure(int k, Task e, long[][] dom, BoolVar p, IntVar s) {
      String id = problem.task(k).id();
      long lo = dom[0][0];
      long hi = dom[dom.length - 1][1];
      IntVar g = model.newIntVar(0, e.optionCount() - 1, "exposureStep[" + id + "]");
      LinearExpr size = LinearExpr.affine(g, e.stepS(), e.durationS());
      IntVar end = model.newIntVar(lo + e.durationS(), Math.max(lo + e.durationS(), Math.min(spec.arriveByS(), hi + e.maxDurationS())),
          "endS[" + id + "]");
      IntervalVar iv = model.newOptionalIntervalVar(s, size, end, p, "obs[" + id + "]");
      List<Literal> in = new ArrayList<>();
      List<long[]> ranges = new ArrayList<>();
      for (Span sp : e.spans()) {
        long from = Math.max(sp.fromS(), lo);
        long to = Math.min(sp.toS(), spec.arriveByS());
        if (to - from < e.durationS() || from > hi) {
          continue;
        }
        BoolVar y = model.newBoolVar("inSpan[" + id + "][" + sp.fromS() + ".." + sp.toS() + "]");
        model.addGreaterOrEqual(s, from).onlyEnforceIf(y);
        model.addLessOrEqual(end, to).onlyEnforceIf(y);
        in.add(y);
        ranges.add(new long[] {from, to});
      }
      model.addEquality(LinearExpr.sum(in.toArray(new Literal[0])), p);
      long[] grid = prizes.prizes(k);
      long top = Arrays.stream(grid).max().orElse(0);
      long bottom = Math.min(0, Arrays.stream(grid).min().orElse(0));
      IntVar full = model.newIntVar(bottom, top, "gridValue[" + id + "]");
      model.addElement(g, grid, full);
      IntVar value = model.newIntVar(bottom, top, "value[" + id + "]");
      model.addEquality(value, full).onlyEnforceIf(p);
      model.addEquality(value, 0).onlyEnforceIf(p.not());
      model.addEquality(g, 0).onlyEnforceIf(p.not()); // an absent request has one exposure: no symmetric copies
      addEnvelopeCuts(id, grid, g, value);
      return new FlexVars(e, g, end, iv, value, in, ranges);
    }

    /**
     * Adds (redundant): value[R] below every chord of the upper concave envelope of the scaled grid values,
     * (b − a)·value[R] <= (b − a)·V_a + (V_b − V_a)·(g − a) for consecutive hull points a < b. The element
     * constraint alone gives the LP relaxation no link between exposure and value; with the cuts and the
     * energy constraint the LP bound of concave curves is the continuous optimum. Valid when R is absent
     * too (value 0, g = 0: each chord is at least V_0 >= 0 there).
     */
    private void addEnvelopeCuts(String id, long[] grid, IntVar g, IntVar value) {
      List<Integer> hull = new ArrayList<>();
      for (int q = 0; q < grid.length; q++) {
        while (hull.size() >= 2) {
          int a = hull.get(hull.size() - 2);
          int b = hull.get(hull.size() - 1);
          // b is on or below the chord a-q: drop it
          if ((b - a) * (double) (grid[q] - grid[a]) - (grid[b] - grid[a]) * (double) (q - a) >= 0) {
            hull.remove(hull.size() - 1);
          } else {
            break;
          }
        }
        hull.add(q);
      }
      for (int h = 0; h + 1 < hull.size(); h++) {
        int a = hull.get(h);
        int b = hull.get(h + 1);
        long rise = grid[b] - grid[a];
        // (b − a)·value − rise·g <= (b − a)·V_a − rise·a
        model.addLessOrEqual(LinearExpr.newBuilder().addTerm(value, b - a).addTerm(g, -rise).build(),
            (b - a) * grid[a] - rise * a);
      }
      if (hull.size() == 1) {
        model.addLessOrEqual(value, grid[hull.get(0)]);
      }
    }

    /**
     * Adds (redundant) the energy constraint: Σ_R (shortest transition into R + duration of R)·present[R]
     * <= arriveByS − departS, with a flexible duration min·present[R] + step·g (g = 0 when absent).
     * Occupancies [start − least transition in, end] of a plan are disjoint inside the slice; the circuit
     * implies this, but only through many arcs, so the LP relaxation misses it; it lets the bound trade
     * exposure time against the number of observations.
     */
    private void addRedundantEnergy() {
      LinearExprBuilder used = LinearExpr.newBuilder();
      for (int a = 0; a < nodes.size(); a++) {
        long in = arcs.minIn(nodes.get(a));
        long least = in == Long.MAX_VALUE ? 0 : in;
        FlexVars fv = flex.get(a);
        if (fv == null) {
          used.addTerm(present.get(a), dur(a) + least);
        } else {
          used.addTerm(present.get(a), fv.exposure.durationS() + least).addTerm(fv.step, fv.exposure.stepS());
        }
      }
      model.addLessOrEqual(used.build(), Math.max(0, spec.arriveByS() - spec.departS()));
    }

    /**
     * Adds, for time-dependent transitions: inBucket[R][q] (bool) for every bucket q that R's start domain
     * meets; inBucket[R][q] implies startS[R] in q; the sum over q of inBucket[R][q] equals present[R].
     */
    private void addBucketLiterals(Task t, long[][] dom, BoolVar p, IntVar s) {
      java.util.TreeMap<Integer, BoolVar> lits = new java.util.TreeMap<>();
      java.util.TreeMap<Integer, long[]> spans = new java.util.TreeMap<>();
      List<long[]> parts = TimeBuckets.partition(dom, bucketsPerRequest);
      for (int q = 0; q < parts.size(); q++) {
        spans.put(q, parts.get(q));
      }
      List<BoolVar> all = new ArrayList<>();
      for (var e : spans.entrySet()) {
        BoolVar y = model.newBoolVar("inBucket[" + t.id() + "][" + e.getKey() + "]");
        model.addLinearConstraint(s, e.getValue()[0], e.getValue()[1]).onlyEnforceIf(y);
        lits.put(e.getKey(), y);
        all.add(y);
      }
      model.addEquality(LinearExpr.sum(all.toArray(new BoolVar[0])), p);
      inBucket.add(lits);
      bucketSpan.add(spans);
    }

    /**
     * Bucket-pair transition costs of the arc a -> b: costs[i][j] for the i-th bucket of a and the j-th of
     * b (in bucket order), {@link TimeBuckets#IMPOSSIBLE} where no times in those buckets fit.
     */
    private long[][] bucketCosts(int a, int b) {
      return bucketCosts.computeIfAbsent((long) a * nodes.size() + b, key -> {
        List<long[]> sa = new ArrayList<>(bucketSpan.get(a).values());
        List<long[]> sb = new ArrayList<>(bucketSpan.get(b).values());
        long[][] c = new long[sa.size()][sb.size()];
        for (int i = 0; i < sa.size(); i++) {
          for (int j = 0; j < sb.size(); j++) {
            c[i][j] = buckets.cost(nodes.get(a), sa.get(i)[0], sa.get(i)[1], nodes.get(b), sb.get(j)[0], sb.get(j)[1]);
          }
        }
        return c;
      });
    }

    /** The least finite bucket-pair cost of a -> b, or -1 when every pair is impossible. */
    private long lowBucketCost(int a, int b) {
      long low = -1;
      for (long[] row : bucketCosts(a, b)) {
        for (long c : row) {
          if (c >= 0 && (low < 0 || c < low)) {
            low = c;
          }
        }
      }
      return low;
    }

    /** The largest finite bucket-pair cost of a -> b (the arc's pessimistic cost in the objective). */
    private long highBucketCost(int a, int b) {
      long high = -1;
      for (long[] row : bucketCosts(a, b)) {
        for (long c : row) {
          high = Math.max(high, c);
        }
      }
      return high;
    }

    /**
     * Adds, per bucket pair (q of A, r of B): next[A->B] and inBucket[A][q] and inBucket[B][r] imply
     * startS[B] >= endS[A] + cost_qr(A, B) (endS = startS + dur for a fixed request, the exposure's end for a
     * flexible one, whose bucket costs cover every exposure); an impossible pair is forbidden outright.
     */
    private void addBucketedTransition(int a, int b, Literal lit, long baseCost) {
      List<BoolVar> ya = new ArrayList<>(inBucket.get(a).values());
      List<BoolVar> yb = new ArrayList<>(inBucket.get(b).values());
      long[][] c = bucketCosts(a, b);
      for (int i = 0; i < ya.size(); i++) {
        for (int j = 0; j < yb.size(); j++) {
          if (c[i][j] < 0) {
            model.addBoolOr(new Literal[] {lit.not(), ya.get(i).not(), yb.get(j).not()});
          } else if (c[i][j] > baseCost) {
            model.addGreaterOrEqual(startS.get(b), endPlus(a, c[i][j]))
                .onlyEnforceIf(new Literal[] {lit, ya.get(i), yb.get(j)});
          }
        }
      }
    }

    private long earliest(int a) {
      return domains.get(a)[0][0];
    }

    /**
     * Adds the rules between tasks ({@link Structure}, format additions A4 and A5), each exactly:
     * <ul>
     * <li>visits v and v + 1 of one request: present[v+1] ⇒ present[v] (symmetry break: the visits held are
     * the first ones) and, when both are present, startS[v+1] ≥ startS[v] + minSeparationS and
     * startS[v+1] ≤ startS[v] + maxSeparationS; all-or-nothing visits: present[v] = present[1];
     * one per window: a literal per (visit, span) that holds the whole observation, exactly one of them
     * when present, and at most one visit per span;</li>
     * <li>all-or-nothing groups: every member task's presence equals the first member's;</li>
     * <li>ordered groups: for members i &lt; j both present, startS[j] ≥ endS[i]; with a maximum gap,
     * startS[j] ≤ endS[i] + maxGapS when i and j are present and no member between them is.</li>
     * </ul>
     * The rules only restrict which plans are feasible; the objective is untouched, so the lexicographic
     * objective stays exact. In the whole problem a task without a start (not in the model) is absent. In a
     * slice of the timeline (the large-neighbourhood search, {@link Spec#context} the plan around it) a task
     * outside the slice is a constant: present at its start in the plan, or absent when the plan leaves it
     * out; so every rule is stated exactly and the spliced plan keeps it (a move that would break a chain or
     * a visit sequence outside the slice is not offered). Without a context a rule that reaches a task
     * outside the model is left to the incumbent ({@link Structure#prune}).
     */
    private void addStructure() {
      Structure st = problem.structure();
      if (st.isEmpty()) {
        return;
      }
      for (int a = 0; a < nodes.size(); a++) {
        pos.put(nodes.get(a), a);
      }
      whole = spec.from() == Transitions.START && spec.to() < 0 && spec.departS() == 0;
      if (spec.context() != null) {
        Plan c = spec.context();
        for (int q = 0; q < c.size(); q++) {
          if (!pos.containsKey(c.order()[q])) {
            fixed.put(c.order()[q], new long[] {c.startS()[q], c.endS(q)});
          }
        }
      }
      Sections sec = st.sections();
      if (sec != null) {
        addUnits(sec, pos, whole);
      }
      for (Structure.VisitRule rule : st.visits()) {
        if (!stated(rule.tasks())) {
          continue;
        }
        if (sec == null) {
          addVisits(rule);
        } else {
          addVisitsAcross(rule);
        }
      }
      for (Structure.GroupRule g : st.groups()) {
        int[] all = java.util.Arrays.stream(g.members()).flatMapToInt(java.util.Arrays::stream).toArray();
        if (!stated(all)) {
          continue;
        }
        if (g.allOrNothing()) {
          java.util.Map<Integer, List<Literal>> byUnit = new java.util.LinkedHashMap<>();
          for (int k : all) {
            byUnit.computeIfAbsent(sec == null ? k : sec.unitOf(k), x -> new ArrayList<>()).add(presentOf(k));
          }
          LinearExpr first = null;
          for (List<Literal> unit : byUnit.values()) {
            LinearExpr held = LinearExpr.sum(unit.toArray(new Literal[0]));
            if (first == null) {
              first = held;
            } else {
              model.addEquality(held, first);
            }
          }
        }
        if (g.sameResource() && sec != null) {
          BoolVar[] on = new BoolVar[sec.count()];
          for (int r = 0; r < on.length; r++) {
            on[r] = model.newBoolVar("group[" + g.id() + "]@" + sec.resourceId(r));
          }
          model.addAtMostOne(on);
          for (int k : all) {
            if (!isAbsent(k)) {
              model.addImplication(presentOf(k), on[sec.sectionOf(k)]);
            }
          }
        }
        if (g.ordered()) {
          addOrder(g);
        }
      }
    }

    /** Model position by task (the structure's rules only). */
    private final java.util.Map<Integer, Integer> pos = new java.util.HashMap<>();
    /** Tasks outside a slice that the plan around it holds: {start, end} (planner seconds). */
    private final java.util.Map<Integer, long[]> fixed = new java.util.HashMap<>();
    private boolean whole;

    /** True when every task of a rule has a presence here (a variable or a constant): the rule can be stated. */
    private boolean stated(int[] tasks) {
      for (int k : tasks) {
        if (!pos.containsKey(k) && !fixed.containsKey(k) && !(spec.context() != null || whole
            && !problem.task(k).schedulable())) {
          return false;
        }
      }
      return true;
    }

    /** Task k's presence: its variable, constant true for a task fixed outside the slice, else constant false. */
    private Literal presentOf(int k) {
      Integer a = pos.get(k);
      return a != null ? present.get(a) : fixed.containsKey(k) ? held() : absent();
    }

    private boolean isAbsent(int k) {
      return !pos.containsKey(k) && !fixed.containsKey(k);
    }

    /** Task k's start: its variable or the fixed start (not for an absent task). */
    private LinearExpr startOf(int k, long plus) {
      Integer a = pos.get(k);
      return a != null ? LinearExpr.affine(startS.get(a), 1, plus) : LinearExpr.constant(fixed.get(k)[0] + plus);
    }

    /** Task k's end plus {@code plus}: its expression or the fixed end (not for an absent task). */
    private LinearExpr endOf(int k, long plus) {
      Integer a = pos.get(k);
      return a != null ? endPlus(a, plus) : LinearExpr.constant(fixed.get(k)[1] + plus);
    }

    /** True when task k is decided here: in the model as a variable (false for a constant). */
    private boolean variable(int k) {
      return pos.containsKey(k);
    }

    /** Visits of one resource: presence in visit order, separations enforced when both visits are present. */
    private void addVisits(Structure.VisitRule rule) {
      int[] t = rule.tasks();
      for (int i = 0; i + 1 < t.length; i++) {
        int ka = t[i];
        int kb = t[i + 1];
        if (variable(ka) || variable(kb)) {
          model.addImplication(presentOf(kb), presentOf(ka));
          if (rule.allOrNothing()) {
            model.addEquality(presentOf(kb), presentOf(ka));
          }
        }
        if (!isAbsent(ka) && !isAbsent(kb) && (variable(ka) || variable(kb))) {
          Literal[] both = {presentOf(ka), presentOf(kb)};
          model.addGreaterOrEqual(startOf(kb, 0), startOf(ka, rule.minSeparationS())).onlyEnforceIf(both);
          if (rule.hasMax()) {
            model.addLessOrEqual(startOf(kb, 0), startOf(ka, rule.maxSeparationS())).onlyEnforceIf(both);
          }
        }
      }
      if (rule.onePerWindow()) {
        addOnePerWindow(t, problem.structure().mergedWindows(problem, rule));
      }
    }

    /**
     * Visits across resources (A4, A6): visit v is held when one of its options is (Σ present ≤ 1 per visit,
     * {@link #addUnits}); Σ present[v+1] ≤ Σ present[v] (= with all or nothing); for options a of visit v and b
     * of visit v + 1 both present, the separations on the resources' own clocks: startS[b] − offset(b) −
     * (startS[a] − offset(a)) within [min, max]; one per window on the merged windows of every resource.
     */
    private void addVisitsAcross(Structure.VisitRule rule) {
      int[][] v = rule.visits();
      for (int i = 0; i + 1 < v.length; i++) {
        LinearExpr held = LinearExpr.sum(java.util.Arrays.stream(v[i]).mapToObj(this::presentOf).toArray(Literal[]::new));
        LinearExpr next = LinearExpr.sum(java.util.Arrays.stream(v[i + 1]).mapToObj(this::presentOf)
            .toArray(Literal[]::new));
        if (rule.allOrNothing()) {
          model.addEquality(next, held);
        } else {
          model.addLessOrEqual(next, held);
        }
        for (int ka : v[i]) {
          for (int kb : v[i + 1]) {
            if (isAbsent(ka) || isAbsent(kb) || !variable(ka) && !variable(kb)) {
              continue;
            }
            long shift = offsetS(kb) - offsetS(ka);
            Literal[] both = {presentOf(ka), presentOf(kb)};
            model.addGreaterOrEqual(startOf(kb, 0), startOf(ka, rule.minSeparationS() + shift)).onlyEnforceIf(both);
            if (rule.hasMax()) {
              model.addLessOrEqual(startOf(kb, 0), startOf(ka, rule.maxSeparationS() + shift)).onlyEnforceIf(both);
            }
          }
        }
      }
      if (rule.onePerWindow()) {
        addOnePerWindow(rule.tasks(), problem.structure().mergedWindows(problem, rule));
      }
    }

    /** Planner seconds at which task k's resource clock starts (0 with one resource). */
    private long offsetS(int k) {
      Sections sec = problem.sections();
      return sec == null ? 0 : sec.offsetS(sec.sectionOf(k));
    }

    /**
     * Ordered groups: for options a of member i and b of a later member j, both present, startS[b] ≥ endS[a]
     * on the resources' own clocks; with a maximum gap, startS[b] ≤ endS[a] + maxGapS when no option of a
     * member between them is present; the first member present within its latest start when a re-plan gives
     * one ({@link Structure.GroupRule#hasFirstLatestStart}).
     */
    private void addOrder(Structure.GroupRule g) {
      int[][] m = g.members(); // ordered members have one visit: their tasks are its options
      for (int j = 0; j < m.length && g.hasMaxGap() && g.hasFirstLatestStart(); j++) {
        for (int kb : m[j]) {
          if (!variable(kb)) {
            continue;
          }
          List<Literal> when = new ArrayList<>(List.of(presentOf(kb)));
          for (int before = 0; before < j; before++) {
            for (int kc : m[before]) {
              when.add(presentOf(kc).not());
            }
          }
          model.addLessOrEqual(startOf(kb, 0), g.firstLatestStartS() + offsetS(kb))
              .onlyEnforceIf(when.toArray(new Literal[0]));
        }
      }
      for (int j = 1; j < m.length; j++) {
        for (int kb : m[j]) {
          if (isAbsent(kb)) {
            continue;
          }
          for (int i = j - 1; i >= 0; i--) {
            for (int ka : m[i]) {
              if (isAbsent(ka) || !variable(ka) && !variable(kb)) {
                continue;
              }
              long shift = offsetS(kb) - offsetS(ka);
              model.addGreaterOrEqual(startOf(kb, 0), endOf(ka, shift))
                  .onlyEnforceIf(new Literal[] {presentOf(ka), presentOf(kb)});
              if (g.hasMaxGap()) {
                List<Literal> when = new ArrayList<>(List.of(presentOf(ka), presentOf(kb)));
                for (int between = i + 1; between < j; between++) {
                  for (int kc : m[between]) {
                    when.add(presentOf(kc).not());
                  }
                }
                model.addLessOrEqual(startOf(kb, 0), endOf(ka, g.maxGapS() + shift))
                    .onlyEnforceIf(when.toArray(new Literal[0]));
              }
            }
          }
        }
      }
    }

    /**
     * Several resources ({@link Sections}): the options of one request in the model are alternatives, at most
     * one present; exactly one for a required request when the model holds all its options (the whole
     * problem, or a slice that holds them all; otherwise the incumbent's rules decide).
     */
    private void addUnits(Sections sec, java.util.Map<Integer, Integer> pos, boolean whole) {
      for (int u = 0; u < sec.unitCount(); u++) {
        List<Literal> in = new ArrayList<>();
        boolean all = true;
        for (int k : sec.options(u)) {
          Integer a = pos.get(k);
          if (a != null) {
            in.add(present.get(a));
          } else {
            all &= whole && !problem.task(k).schedulable();
          }
        }
        if (sec.unitRequired(u) && all) {
          if (in.isEmpty()) {
            BoolVar contradiction = model.newBoolVar("unit[" + u + "]");
            model.addEquality(contradiction, 1);
            model.addEquality(contradiction, 0);
          } else {
            model.addExactlyOne(in);
          }
        } else if (in.size() > 1) {
          model.addAtMostOne(in);
        }
      }
    }

    private final BoolVar[] constants = new BoolVar[2];

    /** Constant false: a task that is not in the plan (or has no start). */
    private Literal absent() {
      return constant(0);
    }

    /** Constant true: a task the plan around a slice holds. */
    private Literal held() {
      return constant(1);
    }

    private Literal constant(int value) {
      if (constants[value] == null) {
        constants[value] = model.newBoolVar(value == 0 ? "absent" : "held");
        model.addEquality(constants[value], value);
      }
      return constants[value];
    }

    /**
     * One per window: inWindow[v][w] ⇒ window w holds visit v; Σ_w inWindow[v][w] = present[v]; Σ_v inWindow[v][w]
     * ≤ 1. The windows are the rule's {@code merged} ones ({@link Structure#mergedWindows}, on the resources' own
     * clocks, shifted by each task's offset): a task's own spans would miss two visits in one window when a
     * re-plan clipped one of them. A window that holds a task fixed outside a slice takes no visit here.
     */
    private void addOnePerWindow(int[] tasks, List<Span> merged) {
      java.util.Map<Span, List<Literal>> bySpan = new java.util.LinkedHashMap<>();
      java.util.Set<Span> taken = new java.util.HashSet<>();
      for (int k : tasks) {
        long[] f = fixed.get(k);
        if (f == null) {
          continue;
        }
        long off = offsetS(k);
        for (Span sp : merged) {
          if (sp.fromS() + off <= f[0] && f[1] <= sp.toS() + off) {
            taken.add(sp);
          }
        }
      }
      for (int k : tasks) {
        Integer a = pos.get(k);
        if (a == null) {
          continue;
        }
        Task t = problem.task(k);
        long off = offsetS(k);
        List<Literal> mine = new ArrayList<>();
        for (Span sp : merged) {
          if (sp.toS() - sp.fromS() < t.durationS() || taken.contains(sp)) {
            continue;
          }
          BoolVar y = model.newBoolVar("inWindow[" + t.id() + "][" + sp.fromS() + "]");
          model.addGreaterOrEqual(startS.get(a), sp.fromS() + off).onlyEnforceIf(y);
          model.addLessOrEqual(endPlus(a, 0), sp.toS() + off).onlyEnforceIf(y);
          mine.add(y);
          bySpan.computeIfAbsent(sp, x -> new ArrayList<>()).add(y);
        }
        model.addEquality(LinearExpr.sum(mine.toArray(new Literal[0])), present.get(a));
      }
      for (List<Literal> ys : bySpan.values()) {
        if (ys.size() > 1) {
          model.addAtMostOne(ys);
        }
      }
    }

    private long latest(int a) {
      long[][] d = domains.get(a);
      return d[d.length - 1][1];
    }

    /** Shortest time position a occupies (its duration; a flexible request's shortest exposure). */
    private long dur(int a) {
      return problem.task(nodes.get(a)).durationS();
    }

    /** endS[a] + c: startS[a] + dur(a) + c for a fixed request, endS[a] + c for a flexible one. */
    private LinearExpr endPlus(int a, long c) {
      FlexVars fv = flex.get(a);
      return fv == null ? LinearExpr.affine(startS.get(a), 1, dur(a) + c) : LinearExpr.affine(fv.end, 1, c);
    }

    /**
     * Adds the circuit over present requests (skipped request R = self-loop with literal
     * present[R].not()); next[A->B] implies startS[B] >= startS[A] + dur(A) + cost(A, B); next[from->B]
     * implies startS[B] >= departS + cost(from, B); next[A->to] implies startS[A] + dur(A) + cost(A, to)
     * <= arriveByS. Arcs that can never be time-feasible are not created.
     */
    private void addCircuitWithTransitions() {
      int m = nodes.size();
      CircuitConstraint circuit = model.addCircuit();
      boolean anyRequired = false;
      for (int a = 0; a < m; a++) {
        anyRequired |= problem.task(nodes.get(a)).required();
      }
      // Depot self-loop: nothing scheduled in this slice.
      long emptyCost = spec.to() < 0 ? 0 : arcs.costFrom(spec.from(), spec.to());
      emptyAllowed = !anyRequired && emptyCost >= 0 && spec.departS() + emptyCost <= spec.arriveByS();
      if (emptyAllowed) {
        BoolVar empty = model.newBoolVar("next[" + name(spec.from()) + "->" + endName() + "]");
        circuit.addArc(0, 0, empty);
        remember(-1, -1, empty, emptyCost);
      }
      Set<Long> hinted = hintArcs();
      for (int a = 0; a < m; a++) {
        int k = nodes.get(a);
        Task t = problem.task(k);
        if (!t.required()) {
          circuit.addArc(a + 1, a + 1, present.get(a).not());
        }
        long c0 = arcs.costFrom(spec.from(), k);
        long[] fromBucket = buckets == null ? null : fromCosts(a);
        if (fromBucket != null) {
          c0 = lowest(fromBucket);
        }
        if (c0 >= 0 && spec.departS() + c0 <= latest(a)) {
          BoolVar lit = model.newBoolVar("next[" + name(spec.from()) + "->" + t.id() + "]");
          circuit.addArc(0, a + 1, lit);
          model.addGreaterOrEqual(startS.get(a), spec.departS() + c0).onlyEnforceIf(lit);
          long objectiveCost = c0;
          if (fromBucket != null) {
            List<BoolVar> ya = new ArrayList<>(inBucket.get(a).values());
            for (int j = 0; j < ya.size(); j++) {
              if (fromBucket[j] < 0) {
                model.addBoolOr(new Literal[] {lit.not(), ya.get(j).not()});
              } else if (fromBucket[j] > c0) {
                model.addGreaterOrEqual(startS.get(a), spec.departS() + fromBucket[j])
                    .onlyEnforceIf(new Literal[] {lit, ya.get(j)});
              }
              objectiveCost = Math.max(objectiveCost, fromBucket[j]);
            }
          }
          remember(-1, a, lit, objectiveCost);
        }
        if (k == problem.mustBeLastIndex() && spec.to() >= 0) {
          continue; // the must-be-last request cannot precede a fixed successor
        }
        long c1 = spec.to() < 0 ? 0 : arcs.cost(k, spec.to());
        if (c1 >= 0 && earliest(a) + dur(a) + c1 <= spec.arriveByS()) {
          BoolVar lit = model.newBoolVar("next[" + t.id() + "->" + endName() + "]");
          circuit.addArc(a + 1, 0, lit);
          if (spec.to() >= 0) {
            model.addLessOrEqual(endPlus(a, c1), spec.arriveByS()).onlyEnforceIf(lit);
          }
          remember(a, -1, lit, c1);
        }
      }
      for (int a = 0; a < m; a++) {
        int k = nodes.get(a);
        if (k == problem.mustBeLastIndex()) {
          continue; // no successor after the must-be-last request
        }
        for (int b : successors(a, hinted)) {
          long c = buckets == null ? arcs.cost(k, nodes.get(b)) : lowBucketCost(a, b);
          BoolVar lit = model.newBoolVar("next[" + name(k) + "->" + name(nodes.get(b)) + "]");
          circuit.addArc(a + 1, b + 1, lit);
          model.addGreaterOrEqual(startS.get(b), endPlus(a, c)).onlyEnforceIf(lit);
          if (buckets != null) {
            addBucketedTransition(a, b, lit, c);
          }
          remember(a, b, lit, buckets == null ? c : highBucketCost(a, b));
        }
      }
    }

    /** Bucket costs from the slice's departure point to position a, one per bucket of a. */
    private long[] fromCosts(int a) {
      List<long[]> spans = new ArrayList<>(bucketSpan.get(a).values());
      long[] out = new long[spans.size()];
      for (int j = 0; j < out.length; j++) {
        out[j] = buckets.cost(spec.from(), spec.departS(), spec.departS(), nodes.get(a), spans.get(j)[0],
            spans.get(j)[1]);
      }
      return out;
    }

    private static long lowest(long[] costs) {
      long low = -1;
      for (long c : costs) {
        if (c >= 0 && (low < 0 || c < low)) {
          low = c;
        }
      }
      return low;
    }

    private String endName() {
      return spec.to() < 0 ? "END" : name(spec.to());
    }

    private void remember(int a, int b, Literal lit, long cost) {
      arcEnds.add(new int[] {a, b});
      arcLits.add(lit);
      arcCost.add(cost);
    }

    /** Hinted request-to-request arcs, as a*m+b keys over model positions. */
    private Set<Long> hintArcs() {
      Set<Long> out = new HashSet<>();
      if (spec.hint() == null) {
        return out;
      }
      int[] pos = positions();
      int[] o = spec.hint().order();
      for (int q = 0; q + 1 < o.length; q++) {
        int a = pos[o[q]];
        int b = pos[o[q + 1]];
        if (a >= 0 && b >= 0) {
          out.add((long) a * nodes.size() + b);
        }
      }
      return out;
    }

    private int[] positions() {
      int[] pos = new int[problem.size()];
      Arrays.fill(pos, -1);
      for (int a = 0; a < nodes.size(); a++) {
        pos[nodes.get(a)] = a;
      }
      return pos;
    }

    /**
     * Time-feasible successors of position a: earliest end of a + cost <= latest start of b. With
     * kBest > 0, only the kBest best by (cost + least forced wait) out of a, united with the kBest best
     * into each b and with the hinted arcs.
     */
    private List<Integer> successors(int a, Set<Long> hinted) {
      int m = nodes.size();
      List<Integer> out = new ArrayList<>();
      for (int b = 0; b < m; b++) {
        if (b != a && feasible(a, b)) {
          out.add(b);
        }
      }
      if (spec.kBest() <= 0 || out.size() <= spec.kBest()) {
        return out;
      }
      if (kept == null) {
        kept = kBestArcs(hinted);
      }
      List<Integer> filtered = new ArrayList<>();
      for (int b : out) {
        if (kept.contains((long) a * m + b)) {
          filtered.add(b);
        }
      }
      return filtered;
    }

    private Set<Long> kept;

    private boolean feasible(int a, int b) {
      long c = buckets == null ? arcs.cost(nodes.get(a), nodes.get(b)) : lowBucketCost(a, b);
      return c >= 0 && earliest(a) + dur(a) + c <= latest(b);
    }

    private long score(int a, int b) {
      long c = buckets == null ? arcs.cost(nodes.get(a), nodes.get(b)) : lowBucketCost(a, b);
      long wait = Math.max(0, earliest(b) - (latest(a) + dur(a) + c));
      return c + wait;
    }

    private Set<Long> kBestArcs(Set<Long> hinted) {
      int m = nodes.size();
      int k = spec.kBest();
      Set<Long> keep = new HashSet<>(hinted);
      List<List<Integer>> in = new ArrayList<>();
      for (int b = 0; b < m; b++) {
        in.add(new ArrayList<>());
      }
      for (int a = 0; a < m; a++) {
        List<Integer> out = new ArrayList<>();
        for (int b = 0; b < m; b++) {
          if (b != a && feasible(a, b)) {
            out.add(b);
            in.get(b).add(a);
          }
        }
        final int fa = a;
        out.sort(Comparator.comparingLong((Integer b) -> score(fa, b)).thenComparingInt(b -> b));
        for (int q = 0; q < Math.min(k, out.size()); q++) {
          keep.add((long) a * m + out.get(q));
        }
      }
      for (int b = 0; b < m; b++) {
        final int fb = b;
        List<Integer> preds = in.get(b);
        preds.sort(Comparator.comparingLong((Integer a) -> score(a, fb)).thenComparingInt(a -> a));
        for (int q = 0; q < Math.min(k, preds.size()); q++) {
          keep.add((long) preds.get(q) * m + b);
        }
      }
      return keep;
    }

    /**
     * Adds (redundant): NoOverlap(obs[R] for all R). The circuit already orders present requests; the
     * no-overlap propagator reasons over all intervals at once (edge finding, disjunctive bounds), which
     * prunes start domains and detects overload before the circuit has chosen the arcs.
     */
    private void addRedundantNoOverlap() {
      if (intervals.size() > 1) {
        model.addNoOverlap(intervals);
      }
    }

    /**
     * Adds the objective: COMBINED maximises P·W − T with P = Σ prize[R]·present[R] (+ arc bonuses of the
     * chosen arcs when re-planning, {@link Prizes}),
     * T = Σ cost(A, B)·next[A->B] and W = (upper bound on T) + 1, so one unit of priority outweighs any
     * transition saving; PRIORITY maximises P; TRANSITION fixes P and minimises T.
     */
    private void addObjective(long fixedPriority) {
      LinearExprBuilder p = LinearExpr.newBuilder();
      maxScaledPriority = 0;
      for (int a = 0; a < nodes.size(); a++) {
        long w = prizes.maxPrize(nodes.get(a));
        if (flex.get(a) != null) {
          p.add(flex.get(a).value); // value[R] is 0 when R is absent
        } else {
          p.addTerm(present.get(a), w);
        }
        maxScaledPriority += w;
      }
      if (prizes.hasArcBonus()) {
        for (int q = 0; q < arcLits.size(); q++) {
          long bonus = arcBonusOf(arcEnds.get(q));
          if (bonus > 0) {
            p.addTerm(arcLits.get(q), bonus);
            maxScaledPriority += bonus;
          }
        }
      }
      LinearExprBuilder t = LinearExpr.newBuilder();
      for (int q = 0; q < arcLits.size(); q++) {
        if (arcCost.get(q) != 0) {
          t.addTerm(arcLits.get(q), arcCost.get(q));
        }
      }
      priorityExpr = p.build();
      transitionExpr = t.build();
      // Transitions are disjoint stretches of [departS, arriveByS], so T <= arriveByS - departS; also T <=
      // the sum over requests (and the end) of their largest incoming arc cost.
      long maxTransitionS = Math.max(0, spec.arriveByS() - spec.departS());
      maxTransitionS = Math.min(maxTransitionS, sumOfLargestIncoming());
      long priorityWeight = maxTransitionS + 1; // one unit of priority outweighs any transition saving
      weight = priorityWeight;
      switch (mode) {
        case COMBINED -> {
          if (fitsCombined()) {
            model.maximize(LinearExpr.newBuilder().addTerm(priorityExpr, priorityWeight).addTerm(transitionExpr, -1)
                .build());
          }
        }
        case PRIORITY -> model.maximize(priorityExpr);
        case TRANSITION -> {
          model.addEquality(priorityExpr, fixedPriority);
          model.minimize(transitionExpr);
        }
        default -> throw new IllegalStateException("unknown mode " + mode);
      }
    }

    /** The stability bonus ({@link Prizes#arcBonus}) of a model arc between positions (-1: the slice's ends). */
    private long arcBonusOf(int[] ends) {
      int from = ends[0] < 0 ? spec.from() : nodes.get(ends[0]);
      int to = ends[1] < 0 ? spec.to() : nodes.get(ends[1]);
      return to < 0 ? 0 : prizes.arcBonus(from, to);
    }

    private long sumOfLargestIncoming() {
      long[] largest = new long[nodes.size() + 1];
      for (int q = 0; q < arcLits.size(); q++) {
        int b = arcEnds.get(q)[1];
        int slot = b < 0 ? nodes.size() : b;
        largest[slot] = Math.max(largest[slot], arcCost.get(q));
      }
      long sum = 0;
      for (long v : largest) {
        sum += v;
      }
      return sum;
    }

    /** True when (ΣP)·W + W stays below 2^53, so objective and bound are exact in CP-SAT's doubles. */
    boolean fitsCombined() {
      return maxScaledPriority < (EXACT_DOUBLE_LIMIT - weight) / weight;
    }

    /** Adds hints on every variable (presence, start, every arc including self-loops) from spec.hint. */
    private void addHint() {
      Plan h = spec.hint();
      if (h == null) {
        return;
      }
      int[] pos = positions();
      int m = nodes.size();
      long[] hs = new long[m];
      long[] hd = new long[m];
      boolean[] in = new boolean[m];
      int[] order = Arrays.stream(h.order()).map(k -> pos[k]).toArray();
      for (int q = 0; q < order.length; q++) {
        if (order[q] < 0) {
          return; // the hint uses a request outside this model: not usable
        }
        in[order[q]] = true;
        hs[order[q]] = h.startS()[q];
        hd[order[q]] = h.durationS()[q];
      }
      for (int a = 0; a < m; a++) {
        model.addHint(present.get(a), in[a]);
        model.addHint(startS.get(a), in[a] ? hs[a] : earliest(a));
        if (flex.get(a) != null) {
          hintExposure(a, in[a], in[a] ? hs[a] : earliest(a), in[a] ? hd[a] : dur(a));
        }
        if (buckets != null) {
          for (var e : inBucket.get(a).entrySet()) {
            long[] span = bucketSpan.get(a).get(e.getKey());
            model.addHint(e.getValue(), in[a] && hs[a] >= span[0] && hs[a] <= span[1]);
          }
        }
      }
      Set<Long> used = new HashSet<>();
      int prev = -1;
      for (int a : order) {
        used.add(key(prev, a));
        prev = a;
      }
      used.add(key(prev, -1));
      for (int q = 0; q < arcLits.size(); q++) {
        int[] e = arcEnds.get(q);
        model.addHint(arcLits.get(q), used.contains(key(e[0], e[1])));
      }
    }

    /** Hints exposure step, end, value and span literals of flexible position a. */
    private void hintExposure(int a, boolean isIn, long start, long duration) {
      FlexVars fv = flex.get(a);
      int g = isIn ? fv.exposure.option(duration) : 0;
      model.addHint(fv.step, g);
      model.addHint(fv.end, start + fv.exposure.durationS(g));
      model.addHint(fv.value, isIn ? prizes.prize(nodes.get(a), g) : 0);
      boolean chosen = false;
      for (int w = 0; w < fv.spans.size(); w++) {
        Literal y = fv.spans.get(w);
        long[] span = fv.spanRanges.get(w);
        boolean here = isIn && !chosen && start >= span[0] && start + fv.exposure.durationS(g) <= span[1];
        chosen |= here;
        model.addHint(y, here);
      }
    }

    private long key(int a, int b) {
      return (long) (a + 1) * (nodes.size() + 2) + (b + 1);
    }

    /**
     * Solves and reads back the plan (requests in circuit order with their starts). The wall-clock limit is
     * what is left, at {@code share} of the time limit, of the time since {@code startNanos} (model building
     * counts); at least 10 ms.
     */
    Outcome run(Params params, long startNanos, double share) {
      CpSolver solver = new CpSolver();
      SatParameters.Builder sp = solver.getParameters();
      sp.setNumWorkers(params.workers());
      sp.setRandomSeed(params.seed());
      if (params.reproducible()) {
        sp.setMaxDeterministicTime(params.deterministicLimit());
        sp.setInterleaveSearch(true);
        // Safety net only; reproducibility holds while the deterministic limit is reached first.
        sp.setMaxTimeInSeconds(Math.max(10 * params.timeLimitS(), 60));
      } else {
        double usedS = (System.nanoTime() - startNanos) * 1e-9;
        sp.setMaxTimeInSeconds(Math.max(0.01, share * params.timeLimitS() - usedS));
      }
      if (params.probingOff()) {
        sp.setCpModelProbingLevel(0);
        sp.setSymmetryLevel(0);
      }
      int[] solutions = {0};
      CpSolverSolutionCallback cb = new CpSolverSolutionCallback() {
        @Override
        public void onSolutionCallback() {
          solutions[0]++;
          if (params.sink() != null) {
            params.sink().solution(readBack(this::value, this::booleanValue), prizeBoundFrom(bestObjectiveBound()));
          }
        }
      };
      long t0 = System.nanoTime();
      CpSolverStatus status = solver.solve(model, cb);
      double solveS = (System.nanoTime() - t0) * 1e-9;
      if (status == CpSolverStatus.MODEL_INVALID) {
        throw new IllegalStateException("CP-SAT rejected the sequencing model (a bug in the sequencer): "
            + model.validate());
      }
      Plan plan = null;
      long pr = 0;
      long tr = 0;
      if (status == CpSolverStatus.OPTIMAL || status == CpSolverStatus.FEASIBLE) {
        plan = readBack(solver::value, solver::booleanValue);
        pr = solver.value(priorityExpr);
        tr = solver.value(transitionExpr);
      }
      long bound = -1;
      if (status == CpSolverStatus.OPTIMAL) {
        bound = pr;
      } else if (status == CpSolverStatus.FEASIBLE && mode != Mode.TRANSITION) {
        bound = prizeBoundFrom(solver.bestObjectiveBound());
      }
      return new Outcome(status, plan, pr, tr, bound, solutions[0], arcLits.size(), buildNanos * 1e-9, solveS,
          solver.response().getDeterministicTime());
    }

    /** Proven bound on the prize from an objective bound B: COMBINED gives P <= floor((B + W − 1) / W). */
    private long prizeBoundFrom(double objectiveBound) {
      if (Double.isNaN(objectiveBound) || Double.isInfinite(objectiveBound)) {
        return -1;
      }
      long b = (long) Math.floor(objectiveBound + 1e-9);
      return switch (mode) {
        case COMBINED -> Math.floorDiv(b + weight - 1, weight);
        case PRIORITY -> b;
        case TRANSITION -> -1;
      };
    }

    /**
     * The plan of a solution, read from {@code value} and {@code isTrue} (the solver's, or a callback's
     * during the search): the present requests in start order, which is the circuit's order because a
     * chosen arc A -> B forces start(B) >= start(A) + dur(A) + cost; only when two starts tie (a 0 s
     * observation followed by a 0 s transition) are the arcs read to order them.
     */
    private Plan readBack(ToLongFunction<IntVar> value, Predicate<Literal> isTrue) {
      int m = nodes.size();
      List<long[]> in = new ArrayList<>(); // {position, start}
      for (int a = 0; a < m; a++) {
        if (isTrue.test(present.get(a))) {
          in.add(new long[] {a, value.applyAsLong(startS.get(a))});
        }
      }
      in.sort((x, y) -> Long.compare(x[1], y[1]));
      boolean tie = false;
      for (int q = 1; q < in.size(); q++) {
        tie |= in.get(q)[1] == in.get(q - 1)[1];
      }
      if (tie) {
        in = byArcs(value, isTrue);
      }
      int[] order = new int[in.size()];
      long[] starts = new long[in.size()];
      long[] durs = new long[in.size()];
      for (int q = 0; q < in.size(); q++) {
        int a = (int) in.get(q)[0];
        order[q] = nodes.get(a);
        starts[q] = in.get(q)[1];
        FlexVars fv = flex.get(a);
        durs[q] = fv == null ? dur(a) : fv.exposure.durationS((int) value.applyAsLong(fv.step));
      }
      return new Plan(order, starts, durs);
    }

    /** The present positions and starts in circuit order, following the chosen arcs from the depot. */
    private List<long[]> byArcs(ToLongFunction<IntVar> value, Predicate<Literal> isTrue) {
      int m = nodes.size();
      int[] succ = new int[m + 1];
      Arrays.fill(succ, Integer.MIN_VALUE);
      for (int q = 0; q < arcLits.size(); q++) {
        if (isTrue.test(arcLits.get(q))) {
          int[] e = arcEnds.get(q);
          succ[e[0] + 1] = e[1];
        }
      }
      List<long[]> out = new ArrayList<>();
      int cur = succ[0];
      while (cur >= 0) {
        if (out.size() > m) {
          throw new IllegalStateException("CP-SAT circuit read back as a cycle without the depot (a bug)");
        }
        out.add(new long[] {cur, value.applyAsLong(startS.get(cur))});
        cur = succ[cur + 1];
      }
      return out;
    }
  }
}
