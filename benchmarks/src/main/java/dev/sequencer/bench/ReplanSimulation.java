package dev.sequencer.bench;

import dev.sequencer.campaign.NightExecutor;
import dev.sequencer.campaign.NightWeather;
import dev.sequencer.campaign.Strategy;
import dev.sequencer.model.Observation;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.sequence.NightScenario;
import dev.sequencer.sequence.Sequencer;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.problem.PlanningProblem;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;

/**
 * A night with random weather losses, executed four ways through the library's night executor
 * ({@link NightExecutor}, the campaign simulator's): following the original plan (what falls in a cloud is
 * lost), re-planning with CP-SAT after each loss, and dispatch by the two greedy rules (after every
 * observation the greedy picks the next one). Reports the priority each collects.
 *
 * <p>Night: {@link NightScenario} (10 h, n requests with 2–3 windows each, eigenaxis-like slew matrix),
 * seed 100 + s. Weather (seed s): 3 clouds, each starting uniformly in the night and lasting 20–90 min,
 * unknown in advance; an observation that overlaps a cloud fails, and the re-plan is made when the cloud
 * ends (the executor's rule), with every observation lost in it failed (retried if still visible).
 *
 * <p>Usage: {@code ReplanSimulation [seeds=5] [requests=100] [planLimitS=5] [replanLimitS=2]}.
 */
public final class ReplanSimulation {
  private ReplanSimulation() {}

  public static void main(String[] args) {
    int seeds = args.length > 0 ? Integer.parseInt(args[0]) : 5;
    int n = args.length > 1 ? Integer.parseInt(args[1]) : 100;
    double planLimit = args.length > 2 ? Double.parseDouble(args[2]) : 5;
    double replanLimit = args.length > 3 ? Double.parseDouble(args[3]) : 2;
    System.out.println("| Seed | Cloud h | Original plan | No re-plan | Re-plan after each loss (re-plans) "
        + "| Greedy dispatch | Best-now dispatch |");
    System.out.println("|---|---|---|---|---|---|---|");
    double[] sum = new double[5];
    for (int s = 1; s <= seeds; s++) {
      PlanningProblem p = NightScenario.generate(n, 100 + s);
      NightWeather weather = new NightWeather(s, 0, clouds(new Random(s)), 0);
      SequencerOptions plan = SequencerOptions.defaults().withTimeLimitS(planLimit).withWorkers(2).withSeed(s);
      Timeline original = new Sequencer().plan(p, plan).toTimeline();
      double noReplan = original.observations().stream().filter(o -> weather.cloudOver(o.start(), o.end()) == null)
          .mapToDouble(o -> priority(p, o)).sum();
      NightExecutor.NightLog replan = new NightExecutor(p, null, weather, plan, plan.withTimeLimitS(replanLimit))
          .run(Strategy.CPSAT);
      NightExecutor.NightLog greedy = new NightExecutor(p, null, weather, plan).run(Strategy.GREEDY);
      NightExecutor.NightLog bestNow = new NightExecutor(p, null, weather, plan).run(Strategy.BEST_NOW);
      System.out.printf(Locale.ROOT, "| %d | %.1f | %.0f | %.0f | %.0f (%d) | %.0f | %.0f |%n", s,
          weather.cloudS() / 3600, original.priority(), noReplan, replan.executed().priority(), replan.replans(),
          greedy.executed().priority(), bestNow.executed().priority());
      sum[0] += original.priority();
      sum[1] += noReplan;
      sum[2] += replan.executed().priority();
      sum[3] += greedy.executed().priority();
      sum[4] += bestNow.executed().priority();
    }
    System.out.printf(Locale.ROOT, "| mean | | %.1f | %.1f | %.1f | %.1f | %.1f |%n", sum[0] / seeds, sum[1] / seeds,
        sum[2] / seeds, sum[3] / seeds, sum[4] / seeds);
  }

  /** Three clouds in the night, 20-90 min each. */
  private static List<TimeWindow> clouds(Random r) {
    List<TimeWindow> out = new ArrayList<>();
    for (int k = 0; k < 3; k++) {
      long len = 1200 + r.nextInt(4201);
      long start = (long) (r.nextDouble() * (NightScenario.NIGHT_S - len));
      out.add(new TimeWindow(NightScenario.T0.plusSeconds(start), NightScenario.T0.plusSeconds(start + len)));
    }
    out.sort(java.util.Comparator.comparing(TimeWindow::start));
    return out;
  }

  private static double priority(PlanningProblem p, Observation o) {
    return p.tasks().get(p.indexOf(o.id())).priority();
  }
}
