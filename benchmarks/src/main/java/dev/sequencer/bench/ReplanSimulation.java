package dev.sequencer.bench;

import dev.sequencer.model.Observation;
import dev.sequencer.model.Timeline;
import dev.sequencer.sequence.NightScenario;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.replan.ReplanOptions;
import dev.sequencer.sequence.replan.ReplanResult;
import dev.sequencer.sequence.replan.Replanner;
import dev.sequencer.sequence.Sequencer;
import dev.sequencer.sequence.SequencerOptions;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.Set;

/**
 * A night with random weather losses, executed three ways: following the original plan (what falls in a
 * cloud is lost), re-planning after each loss, and greedy dispatch (after every observation, the greedy
 * planner picks the next one). Reports the priority each collects.
 *
 * <p>Night: {@link NightScenario} (10 h, n requests with 2–3 windows each, eigenaxis-like slew matrix),
 * seed 100 + s. Weather (seed s): 3 clouds, each starting uniformly in the night and lasting 20–90 min.
 * An observation that overlaps a cloud fails; the loss is known 60 s after the later of its start and the
 * cloud's start, and the re-plan is made then with that observation failed (retried if still visible).
 * Nobody knows the clouds in advance.
 *
 * <p>Usage: {@code ReplanSimulation [seeds=5] [requests=100] [planLimitS=5] [replanLimitS=2]}.
 */
public final class ReplanSimulation {
  private static final long DETECT_S = 60;

  private ReplanSimulation() {}

  public static void main(String[] args) {
    int seeds = args.length > 0 ? Integer.parseInt(args[0]) : 5;
    int n = args.length > 1 ? Integer.parseInt(args[1]) : 100;
    double planLimit = args.length > 2 ? Double.parseDouble(args[2]) : 5;
    double replanLimit = args.length > 3 ? Double.parseDouble(args[3]) : 2;
    System.out.println("| Seed | Cloud h | Original plan | No re-plan | Re-plan after each loss (re-plans, mean s) "
        + "| Greedy dispatch |");
    System.out.println("|---|---|---|---|---|---|");
    double[] sum = new double[4];
    for (int s = 1; s <= seeds; s++) {
      PlanningProblem p = NightScenario.generate(n, 100 + s);
      List<long[]> clouds = clouds(new Random(s));
      SequencerOptions plan = SequencerOptions.defaults().withTimeLimitS(planLimit).withWorkers(2).withSeed(s);
      Timeline original = new Sequencer().plan(p, plan).toTimeline();
      double noReplan = followPlan(p, original, clouds);
      long t0 = System.nanoTime();
      int[] replans = {0};
      double replan = replanAfterLosses(p, original, clouds, plan.withTimeLimitS(replanLimit), replans);
      double meanS = replans[0] == 0 ? 0 : (System.nanoTime() - t0) * 1e-9 / replans[0];
      double greedy = greedyDispatch(p, clouds);
      double cloudH = clouds.stream().mapToLong(c -> c[1] - c[0]).sum() / 3600.0;
      System.out.printf(Locale.ROOT, "| %d | %.1f | %.0f | %.0f | %.0f (%d, %.1f) | %.0f |%n", s, cloudH,
          original.priority(), noReplan, replan, replans[0], meanS, greedy);
      sum[0] += original.priority();
      sum[1] += noReplan;
      sum[2] += replan;
      sum[3] += greedy;
    }
    System.out.printf(Locale.ROOT, "| mean | | %.1f | %.1f | %.1f | %.1f |%n", sum[0] / seeds, sum[1] / seeds,
        sum[2] / seeds, sum[3] / seeds);
  }

  /** Three clouds [start, end) in seconds from the night's start. */
  private static List<long[]> clouds(Random r) {
    List<long[]> out = new ArrayList<>();
    for (int k = 0; k < 3; k++) {
      long len = 1200 + r.nextInt(4201);
      long start = (long) (r.nextDouble() * (NightScenario.NIGHT_S - len));
      out.add(new long[] {start, start + len});
    }
    return out;
  }

  /** The start of the first cloud that overlaps the observation (seconds), or -1. */
  private static long cloudHit(Observation o, List<long[]> clouds) {
    long a = o.start().getEpochSecond() - NightScenario.T0.getEpochSecond();
    long b = o.end().getEpochSecond() - NightScenario.T0.getEpochSecond();
    long hit = -1;
    for (long[] c : clouds) {
      if (a < c[1] && c[0] < b && (hit < 0 || c[0] < hit)) {
        hit = c[0];
      }
    }
    return hit;
  }

  private static double priority(PlanningProblem p, String id) {
    return p.tasks().stream().filter(t -> t.id().equals(id)).findFirst().orElseThrow().priority();
  }

  private static Instant lossKnown(Observation o, long cloudStartS) {
    Instant cloud = NightScenario.T0.plusSeconds(cloudStartS);
    return (cloud.isAfter(o.start()) ? cloud : o.start()).plusSeconds(DETECT_S);
  }

  private static double followPlan(PlanningProblem p, Timeline plan, List<long[]> clouds) {
    return plan.observations().stream().filter(o -> cloudHit(o, clouds) < 0).mapToDouble(o -> priority(p, o.id()))
        .sum();
  }

  private static double replanAfterLosses(PlanningProblem p, Timeline original, List<long[]> clouds,
      SequencerOptions options, int[] replans) {
    Timeline current = original;
    boolean lost = true;
    while (lost) {
      lost = false;
      for (Observation o : current.observations()) {
        if (Observation.DONE.equals(o.state())) {
          continue;
        }
        long hit = cloudHit(o, clouds);
        if (hit >= 0) {
          ReplanResult r = new Replanner().replan(p, current, lossKnown(o, hit), Set.of(), Set.of(o.id()),
              ReplanOptions.defaults().withSequencer(options));
          replans[0]++;
          current = r.timeline();
          lost = true;
          break;
        }
      }
    }
    return current.observations().stream().mapToDouble(o -> priority(p, o.id())).sum();
  }

  /** After each observation (done or failed), the greedy planner picks the next one from the current state. */
  private static double greedyDispatch(PlanningProblem p, List<long[]> clouds) {
    ReplanOptions o = ReplanOptions.defaults().withWarmStart(false).withStabilityWeight(0).withSequencer(
        SequencerOptions.defaults().withSolver(SequencerOptions.Solver.GREEDY).withRelaxationBound(false));
    Timeline history = new Timeline(dev.sequencer.model.PlanStatus.FEASIBLE, 0, 0, null, List.of(), List.of());
    Instant now = NightScenario.T0;
    Set<String> failed = Set.of();
    while (true) {
      ReplanResult r = new Replanner().replan(p, history, now, Set.of(), failed, o);
      List<Observation> obs = r.timeline().observations();
      int next = (int) obs.stream().filter(x -> !Observation.PLANNED.equals(x.state())).count();
      if (next >= obs.size()) {
        return obs.stream().mapToDouble(x -> priority(p, x.id())).sum();
      }
      Observation first = obs.get(next);
      history = new Timeline(r.timeline().status(), 0, 0, null, obs.subList(0, next + 1), List.of());
      long hit = cloudHit(first, clouds);
      failed = hit >= 0 ? Set.of(first.id()) : Set.of();
      now = hit >= 0 ? lossKnown(first, hit) : first.end();
    }
  }
}
