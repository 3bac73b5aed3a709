package dev.sequencer.sequence;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.Group;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Reconfiguration;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Visits;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.slew.Reconfigured;
import dev.sequencer.slew.Transitions;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * Visits, groups and configurations (format additions A4, A5) against an exhaustive search written here
 * from the format's wording, sharing nothing with the planner's rules ({@code Structure}) or its change
 * times ({@code Reconfigured}): small random instances (2–4 requests, up to 7 observations) with repeated
 * visits (separations, one per window, all or nothing), one group (all or nothing, ordered, maximum gap)
 * and two configurations (constant or table change time, concurrent with the slew or added to it).
 *
 * <p>The exhaustive search enumerates every sequence of request occurrences (a request at most its
 * visit count), every choice of window per occurrence, and decides the start times exactly: for a fixed
 * sequence and windows every rule is a difference constraint between starts (slew, separations, order,
 * gaps, window edges), so feasibility is a negative-cycle test (Bellman–Ford). Transitions do not depend on
 * time, so the objective (priority, then total transition) depends on the sequence only.
 */
class StructureBruteForceProperties {
  private static final Instant T0 = Instant.parse("2031-06-01T20:00:00Z");
  private static final long HORIZON_S = 600;

  /** A random instance in the format's own terms. */
  record Instance(List<Request> requests, List<Group> groups, List<RequestWindows> windows, double[][] slew,
      double[] fromStart, Reconfiguration change) {
    PlanningProblem problem() {
      Transitions slews = Transitions.matrix(slew, fromStart);
      Transitions t = Reconfigured.of(slews, change, requests.stream().map(Request::configuration).toList(), "");
      return PlanningProblem.of(new TimeWindow(T0, T0.plusSeconds(HORIZON_S)), requests, groups, windows, t);
    }
  }

  @Provide
  Arbitrary<Instance> instances() {
    return Arbitraries.longs().map(StructureBruteForceProperties::instance);
  }

  static Instance instance(long seed) {
    Random rnd = new Random(seed);
    int n = 2 + rnd.nextInt(3);
    List<Request> requests = new ArrayList<>();
    List<RequestWindows> windows = new ArrayList<>();
    int observations = 0;
    for (int k = 0; k < n; k++) {
      String id = "R" + (k + 1);
      double dur = 10 * (1 + rnd.nextInt(8));
      double priority = 1 + rnd.nextInt(5);
      boolean required = rnd.nextInt(8) == 0;
      Visits visits = Visits.ONCE;
      if (rnd.nextInt(2) == 0 && observations < 5) {
        int count = 2 + rnd.nextInt(2);
        double min = 10 * rnd.nextInt(20);
        Double max = rnd.nextBoolean() ? min + 10 * rnd.nextInt(20) : null;
        visits = new Visits(count, min, max, rnd.nextInt(3) == 0, rnd.nextInt(3) == 0);
      }
      observations += visits.count();
      String configuration = rnd.nextBoolean() ? "" : "red";
      requests.add(new Request(id, null, dur, priority, required, List.of(), null, null, visits, configuration));
      List<TimeWindow> w = new ArrayList<>();
      long cursor = 0;
      int count = 1 + rnd.nextInt(3);
      for (int q = 0; q < count && cursor < HORIZON_S; q++) {
        long a = cursor + 10 * rnd.nextInt(15);
        long b = Math.min(HORIZON_S, a + 10 * (3 + rnd.nextInt(25)));
        if (a >= HORIZON_S) {
          break;
        }
        w.add(new TimeWindow(T0.plusSeconds(a), T0.plusSeconds(b)));
        cursor = b + 10;
      }
      windows.add(new RequestWindows(id, w));
    }
    List<Group> groups = new ArrayList<>();
    if (rnd.nextInt(3) != 0) {
      boolean ordered = rnd.nextBoolean();
      List<String> members = new ArrayList<>();
      for (Request r : requests) {
        if ((!ordered || !r.hasVisits()) && members.size() < 3 && rnd.nextInt(3) != 0) {
          members.add(r.id());
        }
      }
      if (members.size() >= 2) {
        groups.add(new Group("G1", members, rnd.nextBoolean(), ordered,
            ordered && rnd.nextBoolean() ? 10.0 * rnd.nextInt(12) : null, false));
      }
    }
    double[][] m = new double[n][n];
    double[] fromStart = new double[n];
    for (int i = 0; i < n; i++) {
      fromStart[i] = 10 * rnd.nextInt(5);
      for (int j = 0; j < n; j++) {
        m[i][j] = i == j ? 0 : 10 * rnd.nextInt(8);
      }
    }
    boolean concurrent = rnd.nextBoolean();
    Reconfiguration change = rnd.nextBoolean() ? Reconfiguration.constant(10 * rnd.nextInt(6), concurrent)
        : new Reconfiguration(List.of("", "red"), 0,
            new double[][] {{0, 10 * rnd.nextInt(6)}, {10 * rnd.nextInt(6), 0}}, concurrent);
    return new Instance(requests, groups, windows, m, fromStart, change);
  }

  // ------------------------------------------------------------------ the exhaustive search

  /** Best {priority, transition} over every plan that keeps every rule; null when none holds the required. */
  static double[] exhaustive(Instance inst) {
    double[] best = {-1, Double.POSITIVE_INFINITY};
    dfs(inst, new ArrayList<>(), best);
    return best[0] < 0 ? null : best;
  }

  private static void dfs(Instance inst, List<Integer> seq, double[] best) {
    if (complete(inst, seq) && feasible(inst, seq)) {
      double prio = 0;
      double trans = 0;
      int prev = -1;
      for (int r : seq) {
        prio += inst.requests().get(r).priority();
        trans += transition(inst, prev, r);
        prev = r;
      }
      if (prio > best[0] + 1e-9 || Math.abs(prio - best[0]) <= 1e-9 && trans < best[1] - 1e-9) {
        best[0] = prio;
        best[1] = trans;
      }
    }
    if (!seq.isEmpty() && !feasible(inst, seq)) {
      return; // a prefix that cannot be timed cannot be extended (every rule only adds constraints)
    }
    for (int r = 0; r < inst.requests().size(); r++) {
      int times = count(seq, r);
      if (times < inst.requests().get(r).visits().count()) {
        seq.add(r);
        dfs(inst, seq, best);
        seq.remove(seq.size() - 1);
      }
    }
  }

  private static int count(List<Integer> seq, int r) {
    int c = 0;
    for (int x : seq) {
      c += x == r ? 1 : 0;
    }
    return c;
  }

  /** The counting rules: required and all-or-nothing visits, all-or-nothing groups, ordered members in list order. */
  private static boolean complete(Instance inst, List<Integer> seq) {
    for (int r = 0; r < inst.requests().size(); r++) {
      Request q = inst.requests().get(r);
      int c = count(seq, r);
      if (q.required() && c < q.visits().count() || q.visits().allOrNothing() && c > 0 && c < q.visits().count()) {
        return false;
      }
    }
    for (Group g : inst.groups()) {
      if (g.allOrNothing()) {
        boolean any = false;
        boolean all = true;
        for (String id : g.members()) {
          int r = index(inst, id);
          int c = count(seq, r);
          any |= c > 0;
          all &= c == inst.requests().get(r).visits().count();
        }
        if (any && !all) {
          return false;
        }
      }
      if (g.ordered()) {
        int last = -1;
        for (int r : seq) {
          int pos = g.members().indexOf(inst.requests().get(r).id());
          if (pos >= 0) {
            if (pos <= last) {
              return false;
            }
            last = pos;
          }
        }
      }
    }
    return true;
  }

  private static int index(Instance inst, String id) {
    for (int r = 0; r < inst.requests().size(); r++) {
      if (inst.requests().get(r).id().equals(id)) {
        return r;
      }
    }
    throw new IllegalArgumentException(id);
  }

  /** The format's transition: the slew table, with the configuration change as max or sum. */
  private static double transition(Instance inst, int from, int to) {
    double slew = from < 0 ? inst.fromStart()[to] : inst.slew()[from][to];
    String a = from < 0 ? "" : inst.requests().get(from).configuration();
    String b = inst.requests().get(to).configuration();
    double change = 0;
    if (!a.equals(b)) {
      Reconfiguration re = inst.change();
      change = re.labels().isEmpty() ? re.constantS() : re.table()[re.labels().indexOf(a)][re.labels().indexOf(b)];
    }
    return inst.change().concurrentWithSlew() ? Math.max(slew, change) : slew + change;
  }

  /** Some choice of windows and starts keeps every timing rule for this sequence. */
  private static boolean feasible(Instance inst, List<Integer> seq) {
    int m = seq.size();
    int[] choice = new int[m];
    return choose(inst, seq, choice, 0);
  }

  private static boolean choose(Instance inst, List<Integer> seq, int[] choice, int i) {
    if (i == seq.size()) {
      return timeable(inst, seq, choice);
    }
    int r = seq.get(i);
    int windows = inst.windows().get(r).intervals().size();
    for (int w = 0; w < windows; w++) {
      if (inst.requests().get(r).visits().onePerWindow()) {
        boolean used = false;
        for (int j = 0; j < i; j++) {
          used |= seq.get(j) == r && choice[j] == w;
        }
        if (used) {
          continue;
        }
      }
      choice[i] = w;
      if (choose(inst, seq, choice, i + 1)) {
        return true;
      }
    }
    return false;
  }

  /** Difference constraints s_b − s_a ≤ c on the starts (node m is time zero); feasible iff no negative cycle. */
  private static boolean timeable(Instance inst, List<Integer> seq, int[] choice) {
    int m = seq.size();
    List<long[]> edges = new ArrayList<>(); // {a, b, c}: s_b - s_a <= c
    int zero = m;
    double[] dur = new double[m];
    for (int i = 0; i < m; i++) {
      Request r = inst.requests().get(seq.get(i));
      dur[i] = r.durationS();
      TimeWindow w = inst.windows().get(seq.get(i)).intervals().get(choice[i]);
      long lo = w.start().getEpochSecond() - T0.getEpochSecond();
      long hi = w.end().getEpochSecond() - T0.getEpochSecond() - (long) dur[i];
      edges.add(new long[] {zero, i, hi});
      edges.add(new long[] {i, zero, -lo});
      long c = (long) transition(inst, i == 0 ? -1 : seq.get(i - 1), seq.get(i));
      if (i == 0) {
        edges.add(new long[] {i, zero, -c});
      } else {
        edges.add(new long[] {i, i - 1, -(long) dur[i - 1] - c}); // s_i - s_{i-1} >= dur + c
      }
    }
    for (int i = 0; i < m; i++) {
      Request r = inst.requests().get(seq.get(i));
      for (int j = i - 1; j >= 0; j--) {
        if (seq.get(j).equals(seq.get(i))) {
          edges.add(new long[] {i, j, -(long) Math.ceil(r.visits().minSeparationS())});
          if (r.visits().maxSeparationS() != null) {
            edges.add(new long[] {j, i, (long) Math.floor(r.visits().maxSeparationS())});
          }
          break;
        }
      }
    }
    for (Group g : inst.groups()) {
      if (!g.ordered()) {
        continue;
      }
      int prev = -1;
      for (int i = 0; i < m; i++) {
        if (g.members().contains(inst.requests().get(seq.get(i)).id())) {
          if (prev >= 0) {
            edges.add(new long[] {i, prev, -(long) dur[prev]});
            if (g.maxGapS() != null) {
              edges.add(new long[] {prev, i, (long) dur[prev] + (long) Math.floor(g.maxGapS())});
            }
          }
          prev = i;
        }
      }
    }
    long[] dist = new long[m + 1];
    Arrays.fill(dist, 0);
    for (int round = 0; round <= m + 1; round++) {
      boolean changed = false;
      for (long[] e : edges) {
        if (dist[(int) e[0]] + e[2] < dist[(int) e[1]]) {
          dist[(int) e[1]] = dist[(int) e[0]] + e[2];
          changed = true;
        }
      }
      if (!changed) {
        return true;
      }
    }
    return false;
  }

  // ------------------------------------------------------------------ the properties

  @Property(tries = 80)
  void cpSatMatchesExhaustiveSearchWithVisitsGroupsAndConfigurations(@ForAll("instances") Instance inst) {
    check(inst);
  }

  /** A recorded instance with an ordered all-or-nothing group and visits (seed found by the property). */
  @Example
  void aRecordedInstance() {
    check(instance(20261203L));
  }

  private static void check(Instance inst) {
    PlanningProblem p = inst.problem();
    double[] best = exhaustive(inst);
    SequencerResult r = new Sequencer().plan(p, SequencerOptions.defaults().withTimeLimitS(10).withWorkers(2));
    if (best == null) {
      assertEquals(PlanStatus.INFEASIBLE, r.status(), "the exhaustive search finds no plan with the required requests");
      return;
    }
    assertEquals(PlanStatus.OPTIMAL, r.status(), () -> "status of " + inst);
    assertEquals(best[0], r.totalPriority(), 1e-9, () -> "total priority of " + inst + "\n" + r.toTimeline());
    assertEquals(best[1], r.totalTransitionS(), 1e-6, () -> "total transition at the best priority of " + inst);
    assertEquals(List.of(), selfCheck(inst, p).violations(r.toTimeline()));
  }

  private static SelfCheck selfCheck(Instance inst, PlanningProblem p) {
    return new SelfCheck(p.horizon(), p.requests(), inst.groups(), p.windows(), p.requestTransitions());
  }

  @Property(tries = 60)
  void greedyPlansKeepEveryRule(@ForAll("instances") Instance inst) {
    PlanningProblem p = inst.problem();
    SequencerResult r = new Sequencer().plan(p,
        SequencerOptions.defaults().withSolver(SequencerOptions.Solver.GREEDY).withTimeLimitS(2));
    if (!r.hasPlan()) {
      return;
    }
    Timeline t = r.toTimeline();
    assertEquals(List.of(), selfCheck(inst, p).violations(t));
    double[] best = exhaustive(inst);
    assertTrue(best != null && r.totalPriority() <= best[0] + 1e-9, "greedy never beats the optimum");
  }
}
