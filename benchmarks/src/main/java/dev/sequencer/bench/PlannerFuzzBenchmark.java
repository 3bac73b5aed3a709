package dev.sequencer.bench;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.planner.FuzzScenarios;
import dev.sequencer.planner.PlanOutcome;
import dev.sequencer.planner.Planner;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.problem.Reasons;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;

/**
 * Runs the planner on many generated scenarios of every kind ({@code FuzzScenarios}) and measures what
 * the budget promises: the wall time of {@code Planner.plan} (windows, transitions, planning and the
 * check) against the time limit. Also counts plans, lost and not re-checked requests, and CP-SAT against
 * greedy. Not a test: figures go to docs/benchmarks.md.
 *
 * <p>Usage: {@code PlannerFuzzBenchmark <tries> <seed> [limits, e.g. 1,2,5,10]}. Each try draws a kind, a
 * scenario seed, a time limit from the list and 1 or 2 workers.
 */
public final class PlannerFuzzBenchmark {
  private PlannerFuzzBenchmark() {}

  /** One run's measurements. */
  record Run(FuzzScenarios.Kind kind, double limitS, int workers, double wallS, String status, double priority,
      double greedyPriority, int lost, int notRechecked, int requests) {
    double overrunS() {
      return wallS - limitS;
    }
  }

  public static void main(String[] args) {
    Locale.setDefault(Locale.ROOT);
    int tries = Integer.parseInt(args[0]);
    long seed = Long.parseLong(args[1]);
    double[] limits = args.length > 2 ? java.util.Arrays.stream(args[2].split(",")).mapToDouble(Double::parseDouble)
        .toArray() : new double[] {1, 2, 5, 10};
    AstroContext ctx = AstroContext.offline();
    Random rnd = new Random(seed);
    List<Run> runs = new ArrayList<>();
    FuzzScenarios.Kind[] kinds = FuzzScenarios.Kind.values();
    for (int i = 0; i < tries; i++) {
      FuzzScenarios.Kind kind = kinds[rnd.nextInt(kinds.length)];
      long scenarioSeed = 1 + rnd.nextInt(1_000_000);
      double limit = limits[rnd.nextInt(limits.length)];
      int workers = 1 + rnd.nextInt(2);
      Scenario plain = FuzzScenarios.generate(kind, scenarioSeed, ctx);
      SequencerOptions o = SequencerOptions.defaults().withTimeLimitS(limit).withWorkers(workers).withSeed(1 + i % 9);
      PlanOutcome first = Planner.plan(plain, ctx, o.withSolver(SequencerOptions.Solver.GREEDY)
          .withRelaxationBound(false));
      Scenario s = FuzzScenarios.withRequired(plain,
          first.timeline().observations().stream().map(x -> x.id()).toList(), new Random(scenarioSeed + 17));
      PlanOutcome greedy = Planner.plan(s, ctx, o.withSolver(SequencerOptions.Solver.GREEDY).withRelaxationBound(false));
      long t0 = System.nanoTime();
      PlanOutcome cp = Planner.plan(s, ctx, o);
      double wall = (System.nanoTime() - t0) * 1e-9;
      int lost = 0;
      int unchecked = 0;
      for (Unscheduled u : cp.result().unscheduled()) {
        lost += u.reason().startsWith(Reasons.LOST_TO_CONFLICTS) ? 1 : 0;
        unchecked += u.reason().equals(Reasons.NOT_RECHECKED) ? 1 : 0;
      }
      Run r = new Run(kind, limit, workers, wall, cp.result().status().name(), cp.result().totalPriority(),
          greedy.result().totalPriority(), lost, unchecked, s.requests().size());
      runs.add(r);
      System.out.printf("%4d %-24s limit %4.1f s  workers %d  wall %6.2f s  overrun %+6.2f s  %-19s priority %7.2f "
              + "(greedy %7.2f)  lost %2d  not re-checked %2d  of %d  windows %.2f s%n", i, kind, limit, workers, wall,
          r.overrunS(), r.status(), r.priority(), r.greedyPriority(), lost, unchecked, r.requests(),
          cp.phaseS().getOrDefault("windows", 0.0));
      if (r.overrunS() > 0 || r.priority() < r.greedyPriority() - 1e-9) {
        System.out.println("       phases " + format(cp.phaseS()) + "; greedy run phases " + format(greedy.phaseS()));
      }
    }
    summary(runs);
  }

  private static void summary(List<Run> runs) {
    List<Double> overruns = runs.stream().map(Run::overrunS).sorted().toList();
    long beyond = runs.stream().filter(r -> r.overrunS() > Math.max(1.0, 0.05 * r.limitS())).count();
    System.out.printf("%nruns %d; overrun (wall - limit) s: median %+.2f, 90th %+.2f, 99th %+.2f, max %+.2f; beyond "
            + "max(1 s, 5 %%): %d%n", runs.size(), quantile(overruns, 0.5), quantile(overruns, 0.9),
        quantile(overruns, 0.99), overruns.get(overruns.size() - 1), beyond);
    Map<FuzzScenarios.Kind, List<Run>> byKind = new EnumMap<>(FuzzScenarios.Kind.class);
    runs.forEach(r -> byKind.computeIfAbsent(r.kind(), k -> new ArrayList<>()).add(r));
    byKind.forEach((k, list) -> {
      List<Double> o = list.stream().map(Run::overrunS).sorted().toList();
      long plans = list.stream().filter(r -> r.status().equals("OPTIMAL") || r.status().equals("FEASIBLE")).count();
      long better = list.stream().filter(r -> r.priority() > r.greedyPriority() + 1e-9).count();
      int lost = list.stream().mapToInt(Run::lost).sum();
      int unchecked = list.stream().mapToInt(Run::notRechecked).sum();
      System.out.printf("  %-24s runs %3d  plans %3d  above greedy %3d  overrun median %+.2f max %+.2f  lost %d  "
          + "not re-checked %d%n", k, list.size(), plans, better, quantile(o, 0.5), o.get(o.size() - 1), lost, unchecked);
    });
  }

  private static String format(Map<String, Double> phases) {
    StringBuilder sb = new StringBuilder();
    phases.forEach((k, v) -> sb.append(sb.length() == 0 ? "" : ", ").append(k).append(String.format(" %.2f", v)));
    return sb.toString();
  }

  private static double quantile(List<Double> sorted, double q) {
    return sorted.get(Math.min(sorted.size() - 1, (int) Math.floor(q * (sorted.size() - 1) + 0.5)));
  }
}
