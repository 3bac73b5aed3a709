package dev.sequencer.sequence;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.UtilityPoint;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.slew.Transitions;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Reproducible mode with flexible exposures on a large model (above {@link Sequencer#LARGE}, so the
 * exposure moves alternate with the LNS): the same file, seed and workers give the same plan twice.
 * Invented instance: concave values w·(1 − exp(−t/τ)) on a 60 s grid, one window each, fixed slews.
 */
class FlexibleReproducibilityTest {
  private static final Instant T0 = Instant.parse("2031-05-04T18:00:00Z");

  private static PlanningProblem instance(int n, long horizonS, long seed) {
    Random rnd = new Random(seed);
    List<Request> requests = new ArrayList<>();
    List<RequestWindows> windows = new ArrayList<>();
    for (int k = 0; k < n; k++) {
      String id = "F" + k;
      double w = 1 + 9 * rnd.nextDouble();
      double tau = 150 + 1050 * rnd.nextDouble();
      List<UtilityPoint> pts = new ArrayList<>();
      for (double t : new double[] {60, 240, 660, 1200}) {
        pts.add(new UtilityPoint(t, Math.round(1000 * w * (1 - Math.exp(-t / tau))) / 1000.0));
      }
      requests.add(new Request(id, null, null, null, false, List.of(), new FlexibleExposure(60, 1200, 60, pts)));
      long len = 1800 + rnd.nextInt(3600);
      long from = (long) (rnd.nextDouble() * (horizonS - len));
      windows.add(new RequestWindows(id, List.of(new TimeWindow(T0.plusSeconds(from), T0.plusSeconds(from + len)))));
    }
    return PlanningProblem.of(new TimeWindow(T0, T0.plusSeconds(horizonS)), requests, windows,
        Transitions.fixed(n, 90));
  }

  @Test
  void reproducibleFlexiblePlansRepeat() {
    PlanningProblem p = instance(Sequencer.LARGE + 20, 3 * 3600, 4);
    SequencerOptions o = SequencerOptions.defaults().withTimeLimitS(20).withWorkers(2).withSeed(5)
        .withReproducible(1.0);
    SequencerResult a = new Sequencer().plan(p, o);
    SequencerResult b = new Sequencer().plan(p, o);
    assertTrue(a.hasPlan());
    assertEquals(a.observations(), b.observations());
    assertEquals(a.totalPriority(), b.totalPriority());
  }
}
