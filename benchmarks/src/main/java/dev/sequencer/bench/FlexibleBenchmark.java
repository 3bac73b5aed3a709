package dev.sequencer.bench;

import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.UtilityPoint;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.Sequencer;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.SequencerResult;
import dev.sequencer.slew.Transitions;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;

/**
 * Flexible exposures when overheads alone exceed the horizon (not JMH): {@code <targets> <horizonH>
 * <slewS> <timeLimitS> <seed>...} builds, per seed, an invented instance (each target flexible with
 * exposure 60–1800 s on a 60 s grid, value w·(1 − exp(−t/τ)) sampled at 8 points, w in [1, 10], τ in
 * [150, 1200] s, one visibility window of 1–4 h), fixed slews of {@code slewS}, and compares the joint
 * model, the two-stage baseline and greedy: value collected, observations, exposure seconds, wall time.
 * Prints a Markdown table.
 */
public final class FlexibleBenchmark {
  private static final Instant T0 = Instant.parse("2031-05-04T18:00:00Z");

  private FlexibleBenchmark() {}

  public static void main(String[] args) {
    Locale.setDefault(Locale.ROOT);
    if (args.length < 5) {
      throw new IllegalArgumentException("usage: <targets> <horizonH> <slewS> <timeLimitS> <seed>...");
    }
    int n = Integer.parseInt(args[0]);
    double horizonH = Double.parseDouble(args[1]);
    double slewS = Double.parseDouble(args[2]);
    double limitS = Double.parseDouble(args[3]);
    System.out.printf("%d targets, %.1f h horizon, fixed %.0f s slews (overheads alone %.1f h), %.0f s per solver,"
        + " 2 workers%n%n", n, horizonH, slewS, n * slewS / 3600, limitS);
    System.out.println("| seed | greedy value (obs) | two-stage value (obs) | joint value (obs) | joint − two-stage "
        + "| two-stage s | joint s | joint status |");
    System.out.println("|---|---|---|---|---|---|---|---|");
    for (int a = 4; a < args.length; a++) {
      long seed = Long.parseLong(args[a]);
      PlanningProblem p = instance(n, (long) (horizonH * 3600), slewS, seed);
      SequencerOptions o = SequencerOptions.defaults().withTimeLimitS(limitS).withWorkers(2).withSeed((int) seed);
      Run greedy = run(p, o.withSolver(SequencerOptions.Solver.GREEDY));
      Run two = run(p, o.withSolver(SequencerOptions.Solver.TWO_STAGE));
      Run joint = run(p, o);
      System.out.printf("| %d | %.3f (%d) | %.3f (%d) | %.3f (%d) | %+.3f | %.1f | %.1f | %s |%n", seed,
          greedy.r.totalPriority(), greedy.r.observations().size(), two.r.totalPriority(), two.r.observations().size(),
          joint.r.totalPriority(), joint.r.observations().size(), joint.r.totalPriority() - two.r.totalPriority(),
          two.seconds, joint.seconds, joint.r.status());
      if (System.getenv("FLEX_DEBUG") != null) {
        System.out.println(joint.r.stats());
      }
    }
  }

  private record Run(SequencerResult r, double seconds) {}

  private static Run run(PlanningProblem p, SequencerOptions o) {
    long t0 = System.nanoTime();
    SequencerResult r = new Sequencer().plan(p, o);
    return new Run(r, (System.nanoTime() - t0) * 1e-9);
  }

  /** The invented instance of {@code seed}. */
  static PlanningProblem instance(int n, long horizonS, double slewS, long seed) {
    Random rnd = new Random(seed);
    List<Request> requests = new ArrayList<>();
    List<RequestWindows> windows = new ArrayList<>();
    for (int k = 0; k < n; k++) {
      String id = "T" + k;
      double w = 1 + 9 * rnd.nextDouble();
      double tau = 150 + 1050 * rnd.nextDouble();
      List<UtilityPoint> pts = new ArrayList<>();
      for (double t : new double[] {60, 120, 240, 420, 660, 960, 1320, 1800}) {
        pts.add(new UtilityPoint(t, Math.round(1000 * w * (1 - Math.exp(-t / tau))) / 1000.0));
      }
      requests.add(new Request(id, null, null, null, false, List.of(),
          new FlexibleExposure(60, 1800, 60, pts)));
      long len = Math.min(horizonS, 3600 + rnd.nextInt(3 * 3600));
      long from = (long) (rnd.nextDouble() * (horizonS - len));
      windows.add(new RequestWindows(id, List.of(new TimeWindow(T0.plusSeconds(from), T0.plusSeconds(from + len)))));
    }
    return PlanningProblem.of(new TimeWindow(T0, T0.plusSeconds(horizonS)), requests, windows,
        Transitions.fixed(n, slewS));
  }
}
