package dev.sequencer.bench;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.ScenarioReader;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.Sequencer;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.SequencerResult;
import dev.sequencer.slew.SlewModel;
import dev.sequencer.slew.Transitions;
import dev.sequencer.visibility.PointingTracks;
import dev.sequencer.visibility.RequestVisibility;
import dev.sequencer.visibility.VisibilityCalculator;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The same night (the bundled demo night: 40 invented fields at an invented site) planned under each slew
 * model: collected priority, total slew and observations scheduled, with CP-SAT and with the greedy
 * baseline, so researchers can compare slew models on one scenario.
 *
 * <p>Second table (issue 15): the bundled LEO telescope day planned with the keep-outs during slews (spec
 * A3) on and off, and what the detours cost: over the plan made with keep-outs, each leg's seconds with
 * them (the detour's, when the great circle crosses a keep-out) less the same leg's direct great-circle
 * seconds, departing and arriving as planned.
 *
 * <p>Run: {@code java -cp benchmarks/target/benchmarks.jar dev.sequencer.bench.SlewComparison [seconds]}
 */
public final class SlewComparison {
  private SlewComparison() {}

  public static void main(String[] args) throws Exception {
    double limitS = args.length > 0 ? Double.parseDouble(args[0]) : 10;
    Scenario base;
    try (InputStream in = SlewComparison.class.getResourceAsStream("/scenarios/demo-night.json")) {
      base = ScenarioReader.parse(new String(in.readAllBytes(), StandardCharsets.UTF_8), "demo-night.json")
          .scenario();
    }
    AstroContext ctx = AstroContext.offline();
    List<RequestWindows> windows = new VisibilityCalculator(ctx).compute(base).stream()
        .map(RequestVisibility::toWindows).toList();
    Map<String, SlewSettings> models = new LinkedHashMap<>();
    models.put("altaz 3/2 deg/s, 1 deg/s2, 10 s settle, wrap [-270, 270]", base.slew());
    models.put("eigenaxis 1 deg/s, 0.2 deg/s2, 10 s settle", new SlewSettings.Eigenaxis(1.0, 0.2, 10));
    models.put("eigenaxis 0.5 deg/s, 0.05 deg/s2, 30 s settle", new SlewSettings.Eigenaxis(0.5, 0.05, 30));
    models.put("fixed 60 s", new SlewSettings.Fixed(60));
    models.put("fixed 300 s", new SlewSettings.Fixed(300));
    System.out.println("| slew model | solver | status | priority | bound | scheduled | total slew [s] | wall [s] |");
    System.out.println("|---|---|---|---|---|---|---|---|");
    for (var e : models.entrySet()) {
      Scenario s = base.withSlew(e.getValue());
      Transitions tr = SlewModel.of(s.slew()).transitions(PointingTracks.of(s, ctx), PointingTracks.start(s, ctx));
      PlanningProblem p = PlanningProblem.of(s, windows, tr);
      for (SequencerOptions.Solver solver : List.of(SequencerOptions.Solver.CPSAT, SequencerOptions.Solver.GREEDY)) {
        long t0 = System.nanoTime();
        SequencerResult r = new Sequencer().plan(p,
            SequencerOptions.defaults().withSolver(solver).withTimeLimitS(limitS).withWorkers(2).withSeed(1));
        double wall = (System.nanoTime() - t0) * 1e-9;
        System.out.printf(Locale.ROOT, "| %s | %s | %s | %.0f | %.0f | %d | %.0f | %.1f |%n", e.getKey(),
            solver.name().toLowerCase(Locale.ROOT), r.status(), r.totalPriority(), r.boundPriority(),
            r.observations().size(), r.totalTransitionS(), wall);
      }
    }
    detourCost(ctx, limitS);
  }

  /** The LEO telescope day with and without keep-outs during slews, and the detours' cost (class comment). */
  private static void detourCost(AstroContext ctx, double limitS) throws Exception {
    Scenario leo;
    try (InputStream in = SlewComparison.class.getResourceAsStream("/scenarios/leo-telescope-day.json")) {
      leo = ScenarioReader.parse(new String(in.readAllBytes(), StandardCharsets.UTF_8), "leo-telescope-day.json")
          .scenario();
    }
    SlewSettings.Eigenaxis on = (SlewSettings.Eigenaxis) leo.slew();
    Scenario free = leo.withSlew(on.withKeepOutDuringSlew(false));
    Transitions direct = SlewModel.of(free.slew()).transitions(PointingTracks.of(free, ctx),
        PointingTracks.start(free, ctx));
    System.out.println();
    System.out.println("| LEO telescope day | solver | status | priority | scheduled | total slew [s] | detours | "
        + "detour cost [s] | wall [s] |");
    System.out.println("|---|---|---|---|---|---|---|---|---|");
    for (Scenario s : List.of(leo, free)) {
      for (SequencerOptions.Solver solver : List.of(SequencerOptions.Solver.CPSAT, SequencerOptions.Solver.GREEDY)) {
        long t0 = System.nanoTime();
        dev.sequencer.planner.PlanOutcome o = dev.sequencer.planner.Planner.plan(s, ctx,
            SequencerOptions.defaults().withSolver(solver).withTimeLimitS(limitS).withWorkers(2).withSeed(1));
        double wall = (System.nanoTime() - t0) * 1e-9;
        SequencerResult r = o.result();
        List<SequencerResult.Planned> obs = r.observations();
        int[] order = new int[obs.size()];
        double[] dep = new double[obs.size()];
        double[] arr = new double[obs.size()];
        List<String> ids = s.requests().stream().map(q -> q.id()).toList();
        for (int q = 0; q < obs.size(); q++) {
          order[q] = ids.indexOf(obs.get(q).id());
          dep[q] = q == 0 ? 0 : obs.get(q - 1).endS();
          arr[q] = obs.get(q).startS();
        }
        double[] straight = direct.exactS(order, dep, arr);
        double cost = 0;
        for (int q = 0; q < obs.size(); q++) {
          cost += obs.get(q).transitionS() - straight[q];
        }
        long detours = o.timeline().observations().stream().filter(x -> !x.slewVia().isEmpty()).count();
        System.out.printf(Locale.ROOT, "| keep-outs %s | %s | %s | %.0f | %d | %.0f | %d | %.0f | %.1f |%n",
            s == leo ? "on" : "off", solver.name().toLowerCase(Locale.ROOT), r.status(), r.totalPriority(),
            obs.size(), r.totalTransitionS(), detours, cost, wall);
      }
    }
  }
}
