package dev.sequencer.sequence;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.slew.Transitions;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * Several resources (format addition A6) against an exhaustive search written here from the format's
 * wording, sharing nothing with the planner's sections: small random instances (3–6 requests, 2–3
 * resources) where each resource has its own slew table and start legs, each request its own windows per
 * resource (or none: not allowed there), some requests required.
 *
 * <p>The search: for each resource and each subset of requests, the smallest total transition of an order
 * that can be timed (transitions do not depend on time and waiting is allowed, so starting each observation
 * as early as its window and the previous transition allow is optimal for a fixed order); then every
 * choice of disjoint subsets, one per resource, holding every required request: the most priority, then the
 * least transition. The returned timeline is also checked here, per resource, against the same tables.
 */
class ResourcesBruteForceProperties {
  private static final Instant T0 = Instant.parse("2031-06-01T20:00:00Z");
  private static final long HORIZON_S = 900;

  /** A random instance: per resource its windows by request id, its slew table and start legs. */
  record Instance(List<Request> requests, List<String> resources, List<Map<String, List<TimeWindow>>> windows,
      List<double[][]> slew, List<double[]> fromStart) {
    @Override
    public String toString() {
      StringBuilder b = new StringBuilder();
      for (Request q : requests) {
        b.append(q.id()).append(" d=").append(q.durationS()).append(" p=").append(q.priority())
            .append(q.required() ? " required" : "").append('\n');
      }
      for (int r = 0; r < resources.size(); r++) {
        b.append(resources.get(r)).append(" windows ").append(windows.get(r)).append("\n  slew ")
            .append(java.util.Arrays.deepToString(slew.get(r))).append(" from start ")
            .append(java.util.Arrays.toString(fromStart.get(r))).append('\n');
      }
      return b.toString();
    }

    PlanningProblem problem() {
      List<List<RequestWindows>> w = new ArrayList<>();
      List<Transitions> t = new ArrayList<>();
      for (int r = 0; r < resources.size(); r++) {
        List<RequestWindows> mine = new ArrayList<>();
        windows.get(r).forEach((id, list) -> mine.add(new RequestWindows(id, list)));
        w.add(mine);
        t.add(Transitions.matrix(slew.get(r), fromStart.get(r)));
      }
      return PlanningProblem.ofSections(new TimeWindow(T0, T0.plusSeconds(HORIZON_S)), requests, resources, w, t);
    }
  }

  @Provide
  Arbitrary<Instance> instances() {
    return Arbitraries.longs().map(ResourcesBruteForceProperties::instance);
  }

  static Instance instance(long seed) {
    Random rnd = new Random(seed);
    int n = 3 + rnd.nextInt(4);
    int m = 2 + rnd.nextInt(2);
    List<String> resources = new ArrayList<>();
    for (int r = 0; r < m; r++) {
      resources.add("res" + (char) ('A' + r));
    }
    List<Request> requests = new ArrayList<>();
    for (int k = 0; k < n; k++) {
      requests.add(new Request("R" + (k + 1), null, 30.0 * (1 + rnd.nextInt(6)), 1.0 + rnd.nextInt(5),
          rnd.nextInt(7) == 0, List.of(), null));
    }
    List<Map<String, List<TimeWindow>>> windows = new ArrayList<>();
    List<double[][]> slew = new ArrayList<>();
    List<double[]> fromStart = new ArrayList<>();
    for (int r = 0; r < m; r++) {
      Map<String, List<TimeWindow>> mine = new HashMap<>();
      for (Request q : requests) {
        if (rnd.nextInt(4) == 0) {
          continue; // not allowed on this resource
        }
        mine.put(q.id(), windows(rnd, T0, HORIZON_S, 40, 5, 40));
      }
      windows.add(mine);
      double[] s = new double[n];
      slew.add(table(rnd, s, 6, 10));
      fromStart.add(s);
    }
    return new Instance(requests, resources, windows, slew, fromStart);
  }

  /**
   * One or two windows in [0, horizonS] on a 10 s grid (shared with {@link ResourcesStructureBruteForceProperties}):
   * each starts up to 10·gapSteps s after the previous one's end plus 10 s and lasts 10·(minSteps + [0,
   * lenSteps)) s, cut at the horizon.
   */
  static List<TimeWindow> windows(Random rnd, Instant t0, long horizonS, int gapSteps, int minSteps, int lenSteps) {
    List<TimeWindow> w = new ArrayList<>();
    long cursor = 0;
    int count = 1 + rnd.nextInt(2);
    for (int i = 0; i < count && cursor < horizonS; i++) {
      long a = cursor + 10 * rnd.nextInt(gapSteps);
      long b = Math.min(horizonS, a + 10 * (minSteps + rnd.nextInt(lenSteps)));
      if (a >= horizonS) {
        break;
      }
      w.add(new TimeWindow(t0.plusSeconds(a), t0.plusSeconds(b)));
      cursor = b + 10;
    }
    return w;
  }

  /** A random slew table on a 10 s grid (0 to itself, legs below 10·legSteps s), start legs into {@code fromStart}. */
  static double[][] table(Random rnd, double[] fromStart, int startSteps, int legSteps) {
    int n = fromStart.length;
    double[][] t = new double[n][n];
    for (int i = 0; i < n; i++) {
      fromStart[i] = 10 * rnd.nextInt(startSteps);
      for (int j = 0; j < n; j++) {
        t[i][j] = i == j ? 0 : 10 * rnd.nextInt(legSteps);
      }
    }
    return t;
  }

  // ------------------------------------------------------------------ the exhaustive search

  /** Best {priority, transition} over every plan; null when none holds every required request. */
  static double[] exhaustive(Instance inst) {
    int n = inst.requests().size();
    int m = inst.resources().size();
    double[][] cost = new double[m][1 << n]; // least transition of a timed order of the subset; +inf: none
    for (int r = 0; r < m; r++) {
      java.util.Arrays.fill(cost[r], Double.POSITIVE_INFINITY);
      orders(inst, r, 0, -1, 0, 0, cost[r]);
    }
    double[] best = {-1, Double.POSITIVE_INFINITY};
    combine(inst, 0, 0, 0, 0, cost, best);
    return best[0] < 0 ? null : best;
  }

  /** Every order on resource r extending the current one (mask, last request, time free, transition so far). */
  private static void orders(Instance inst, int r, int mask, int last, long free, double trans, double[] cost) {
    cost[mask] = Math.min(cost[mask], trans);
    for (int j = 0; j < inst.requests().size(); j++) {
      if ((mask & (1 << j)) != 0) {
        continue;
      }
      double c = last < 0 ? inst.fromStart().get(r)[j] : inst.slew().get(r)[last][j];
      long s = earliest(inst, r, j, free + (long) c);
      if (s >= 0) {
        orders(inst, r, mask | (1 << j), j, s + duration(inst, j), trans + c, cost);
      }
    }
  }

  /** Earliest start at or after t inside one of j's windows on resource r; -1 when none. */
  private static long earliest(Instance inst, int r, int j, long t) {
    List<TimeWindow> w = inst.windows().get(r).get(inst.requests().get(j).id());
    long best = -1;
    for (TimeWindow x : w == null ? List.<TimeWindow>of() : w) {
      long a = Math.max(t, x.start().getEpochSecond() - T0.getEpochSecond());
      if (a + duration(inst, j) <= x.end().getEpochSecond() - T0.getEpochSecond() && (best < 0 || a < best)) {
        best = a;
      }
    }
    return best;
  }

  private static long duration(Instance inst, int j) {
    return (long) (double) inst.requests().get(j).durationS();
  }

  private static void combine(Instance inst, int r, int used, double prio, double trans, double[][] cost,
      double[] best) {
    int n = inst.requests().size();
    if (r == inst.resources().size()) {
      for (int j = 0; j < n; j++) {
        if (inst.requests().get(j).required() && (used & (1 << j)) == 0) {
          return;
        }
      }
      if (prio > best[0] + 1e-9 || Math.abs(prio - best[0]) <= 1e-9 && trans < best[1] - 1e-9) {
        best[0] = prio;
        best[1] = trans;
      }
      return;
    }
    for (int mask = 0; mask < 1 << n; mask++) {
      if ((mask & used) != 0 || cost[r][mask] == Double.POSITIVE_INFINITY) {
        continue;
      }
      double p = 0;
      for (int j = 0; j < n; j++) {
        p += (mask & (1 << j)) != 0 ? inst.requests().get(j).priority() : 0;
      }
      combine(inst, r + 1, used | mask, prio + p, trans + cost[r][mask], cost, best);
    }
  }

  // ------------------------------------------------------------------ the timeline, checked here

  /** What is wrong with {@code t} per the format's A6 and this instance's tables (empty: valid). */
  static List<String> problems(Instance inst, Timeline t) {
    List<String> out = new ArrayList<>();
    Map<String, Integer> index = new HashMap<>();
    for (int k = 0; k < inst.requests().size(); k++) {
      index.put(inst.requests().get(k).id(), k);
    }
    Map<String, Integer> seen = new HashMap<>();
    double prio = 0;
    for (Observation o : t.observations()) {
      if (seen.merge(o.id(), 1, Integer::sum) > 1) {
        out.add(o.id() + " observed twice");
      }
      prio += inst.requests().get(index.get(o.id())).priority();
    }
    for (Request q : inst.requests()) {
      if (q.required() && !seen.containsKey(q.id())) {
        out.add("required " + q.id() + " missing");
      }
    }
    if (Math.abs(prio - t.priority()) > 1e-9) {
      out.add("priority " + t.priority() + " but observations sum to " + prio);
    }
    for (int r = 0; r < inst.resources().size(); r++) {
      String res = inst.resources().get(r);
      int last = -1;
      Instant free = T0;
      for (Observation o : t.observations()) {
        if (!res.equals(o.resource())) {
          continue;
        }
        int j = index.get(o.id());
        List<TimeWindow> w = inst.windows().get(r).get(o.id());
        if (w == null || w.stream().noneMatch(x -> !o.start().isBefore(x.start()) && !o.end().isAfter(x.end()))) {
          out.add(o.id() + " outside its windows on " + res);
        }
        double c = last < 0 ? inst.fromStart().get(r)[j] : inst.slew().get(r)[last][j];
        double gap = Duration.between(free, o.start()).toNanos() * 1e-9;
        if (gap < c - 1e-6) {
          out.add(o.id() + " on " + res + ": gap " + gap + " s below the transition " + c + " s");
        }
        if (Math.abs(o.slewSeconds() - c) > 1e-6) {
          out.add(o.id() + " on " + res + ": slewSeconds " + o.slewSeconds() + ", table says " + c);
        }
        if (Math.abs(o.durationS() - duration(inst, j)) > 1e-6) {
          out.add(o.id() + ": duration " + o.durationS());
        }
        last = j;
        free = o.end();
      }
    }
    for (Observation o : t.observations()) {
      if (!inst.resources().contains(o.resource())) {
        out.add(o.id() + ": resource " + o.resource());
      }
    }
    return out;
  }

  // ------------------------------------------------------------------ the properties

  @Property(tries = 80)
  void cpSatMatchesExhaustiveSearchOnSeveralResources(@ForAll("instances") Instance inst) {
    check(inst);
  }

  /** A recorded instance with three resources and a required request. */
  @Example
  void aRecordedInstance() {
    check(instance(20261204L));
  }

  private static void check(Instance inst) {
    SequencerResult r = new Sequencer().plan(inst.problem(), SequencerOptions.defaults().withTimeLimitS(10)
        .withWorkers(2));
    if (matchesExhaustive(r, exhaustive(inst), inst)) {
      assertEquals(List.of(), problems(inst, r.toTimeline()));
    }
  }

  /**
   * CP-SAT's answer against an exhaustive search's best {priority, transition} (null: no plan holds the
   * required requests): INFEASIBLE then, else OPTIMAL at exactly that priority and transition. Returns whether
   * there is a plan to check further. Shared by the exhaustive-search oracles of this package.
   */
  static boolean matchesExhaustive(SequencerResult r, double[] best, Object inst) {
    if (best == null) {
      assertEquals(PlanStatus.INFEASIBLE, r.status(), () -> "the exhaustive search finds no plan with the required "
          + "requests: " + inst);
      return false;
    }
    assertEquals(PlanStatus.OPTIMAL, r.status(), () -> "status of " + inst + ": " + r.message());
    assertEquals(best[0], r.totalPriority(), 1e-9, () -> "total priority of " + inst + "\n" + r.toTimeline());
    assertEquals(best[1], r.totalTransitionS(), 1e-6, () -> "total transition at the best priority of " + inst
        + "\n" + r.toTimeline());
    return true;
  }

  @Property(tries = 60)
  void greedyPlansAreValidAndNeverBeatTheOptimum(@ForAll("instances") Instance inst) {
    PlanningProblem p = inst.problem();
    SequencerResult r = new Sequencer().plan(p,
        SequencerOptions.defaults().withSolver(SequencerOptions.Solver.GREEDY).withTimeLimitS(2));
    double[] best = exhaustive(inst);
    if (!r.hasPlan()) {
      return;
    }
    assertEquals(List.of(), problems(inst, r.toTimeline()));
    assertTrue(best != null && r.totalPriority() <= best[0] + 1e-9, "greedy never beats the optimum");
  }
}
