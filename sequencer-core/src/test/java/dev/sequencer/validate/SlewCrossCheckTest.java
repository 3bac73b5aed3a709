package dev.sequencer.validate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.planner.FuzzScenarios;
import dev.sequencer.slew.SlewModel;
import dev.sequencer.slew.Transitions;
import dev.sequencer.visibility.PointingTracks;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The validator's slew times against the planner's on thousands of random pairs of every target kind and
 * slew model. This is a <b>consistency check between two independent implementations</b> (the validator's
 * {@link SlewLegs}, {@link Sky} and {@link RestToRestProfile} against the planner's slew tracks and
 * transitions): it shows they agree, not that either is right; each closed form is anchored on hand-derived
 * worked cases in {@link SlewWorkedCasesTest}. Each case is a sequence start pointing -> i -> j with random
 * instants; both legs are compared, within the validator's 1 ms (both impossible also agrees).
 */
class SlewCrossCheckTest {
  private static final AstroContext CTX = AstroContext.offline();

  @Test
  void starsFromTheGroundAltAzWithCableWrap() {
    compare(FuzzScenarios.generate(FuzzScenarios.Kind.GROUND_FIELDS_ALTAZ, 11, CTX), 600, 11);
  }

  @Test
  void starsFromTheGroundEigenaxis() {
    Scenario s = FuzzScenarios.generate(FuzzScenarios.Kind.GROUND_FIELDS_ALTAZ, 12, CTX)
        .withSlew(new SlewSettings.Eigenaxis(1.5, 0.2, 5));
    compare(s, 500, 12);
  }

  @Test
  void satellitesFromAStationAltAz() {
    // Satellites are up for minutes a day: the pairs are drawn inside their visibility windows (the engine's,
    // used here only to choose instants), from the start pointing of the scenario.
    Scenario s = FuzzScenarios.generate(FuzzScenarios.Kind.STATION_TLE_ALTAZ, 13, CTX);
    compare(s, 500, 13, new dev.sequencer.visibility.VisibilityCalculator(CTX).compute(s).stream()
        .map(dev.sequencer.visibility.RequestVisibility::intervals).toList());
  }

  @Test
  void starsFromALeoTleEigenaxis() {
    compare(FuzzScenarios.generate(FuzzScenarios.Kind.LEO_TLE_FIELDS, 14, CTX), 500, 14);
  }

  @Test
  void earthPointsFromKeplerianOrbitEigenaxis() {
    compare(FuzzScenarios.generate(FuzzScenarios.Kind.LEO_KEPLER_EARTH_POINTS, 15, CTX), 500, 15);
  }

  /**
   * One target tracked through two back-to-back observations (the visits of one request with no gap): the mount
   * does not move, so both say 0 s, not a settle. Before both drew the line at {@code NO_MOVE_DEG}, the
   * validator's unwrapped azimuth summed over the first observation left ~1e-13 deg and it asked for the settle
   * (found by StructureReplanProperties: "gap after F4 is 0.000 s, shorter than the slew 8.000 s").
   */
  @Test
  void oneTargetBackToBackIsNoSlew() {
    for (FuzzScenarios.Kind kind : List.of(FuzzScenarios.Kind.GROUND_FIELDS_ALTAZ, FuzzScenarios.Kind.STATION_TLE_ALTAZ,
        FuzzScenarios.Kind.LEO_TLE_FIELDS)) {
      Scenario s = FuzzScenarios.generate(kind, 21, CTX);
      Transitions planner = SlewModel.of(s.slew()).transitions(PointingTracks.of(s, CTX), PointingTracks.start(s, CTX));
      SlewLegs mine = new SlewLegs(new Sky(s, CTX));
      List<List<dev.sequencer.model.TimeWindow>> windows = new dev.sequencer.visibility.VisibilityCalculator(CTX)
          .compute(s).stream().map(dev.sequencer.visibility.RequestVisibility::intervals).toList();
      Random rnd = new Random(21);
      Instant t0 = s.horizon().start();
      int compared = 0;
      for (int n = 0; n < 4000 && compared < 200; n++) {
        int i = rnd.nextInt(s.requests().size());
        long durMs = 1000L * (30 + rnd.nextInt(900));
        long aMs = inside(windows.get(i), t0, 0, 2 * durMs, rnd);
        if (aMs < 0) {
          continue;
        }
        long bMs = aMs + durMs;
        Request r = s.requests().get(i);
        double[] p = planner.exactS(new int[] {i, i}, new double[] {0, bMs / 1000.0},
            new double[] {aMs / 1000.0, bMs / 1000.0});
        List<SlewLegs.Leg> v = mine.legs(List.of(Observation.of(r.id(), t0.plusMillis(aMs), t0.plusMillis(bMs), 0),
            Observation.of(r.id(), t0.plusMillis(bMs), t0.plusMillis(bMs + durMs), 0)), List.of(r, r));
        if (Double.isInfinite(p[0]) || Double.isInfinite(p[1])) {
          continue; // the cable wrap ran out on the way in: nothing to compare
        }
        String what = String.format(Locale.ROOT, "%s %s for %d s then again: planner %.6f s, validator %.6f s",
            s.name(), r.id(), durMs / 1000, p[1], v.get(1).seconds());
        assertEquals(0, p[1], 0, what);
        assertEquals(0, v.get(1).seconds(), 0, what);
        compared++;
      }
      assertTrue(compared >= 50, s.name() + ": too few back-to-back pairs compared: " + compared);
    }
  }

  private static void compare(Scenario s, int pairs, long seed) {
    compare(s, pairs, seed, null);
  }

  /** A random instant inside one of {@code w} (ms from {@code t0}) leaving {@code durMs}, or -1 when none fits. */
  private static long inside(List<dev.sequencer.model.TimeWindow> w, Instant t0, long afterMs, long durMs, Random rnd) {
    List<dev.sequencer.model.TimeWindow> fit = w.stream().filter(x -> x.end().toEpochMilli() - t0.toEpochMilli()
        - durMs > afterMs && x.durationS() * 1000 > durMs).toList();
    if (fit.isEmpty()) {
      return -1;
    }
    dev.sequencer.model.TimeWindow x = fit.get(rnd.nextInt(fit.size()));
    long lo = Math.max(afterMs, x.start().toEpochMilli() - t0.toEpochMilli());
    long hi = x.end().toEpochMilli() - t0.toEpochMilli() - durMs;
    return lo + (long) (rnd.nextDouble() * (hi - lo));
  }

  private static void compare(Scenario s, int pairs, long seed, List<List<dev.sequencer.model.TimeWindow>> windows) {
    Transitions planner = SlewModel.of(s.slew()).transitions(PointingTracks.of(s, CTX), PointingTracks.start(s, CTX));
    SlewLegs mine = new SlewLegs(new Sky(s, CTX));
    Random rnd = new Random(seed);
    List<Request> req = s.requests();
    Instant t0 = s.horizon().start();
    long horizonMs = s.horizon().end().toEpochMilli() - t0.toEpochMilli();
    double worst = 0;
    int finite = 0;
    for (int n = 0; n < pairs; n++) {
      int i = rnd.nextInt(req.size());
      int j = rnd.nextInt(req.size());
      long aMs = (long) (rnd.nextDouble() * horizonMs * 0.8);
      long durMs = 1000L * (10 + rnd.nextInt(300));
      long bMs = aMs + durMs + (long) (rnd.nextDouble() * 600_000);
      if (windows != null) {
        durMs = 1000L * (5 + rnd.nextInt(60));
        aMs = inside(windows.get(i), t0, 0, durMs, rnd);
        bMs = aMs < 0 ? -1 : inside(windows.get(j), t0, aMs + durMs, 1000, rnd);
        if (bMs < 0) {
          n--;
          continue;
        }
      }
      double[] p = planner.exactS(new int[] {i, j}, new double[] {0, (aMs + durMs) / 1000.0},
          new double[] {aMs / 1000.0, bMs / 1000.0});
      List<Observation> obs = List.of(
          Observation.of(req.get(i).id(), t0.plusMillis(aMs), t0.plusMillis(aMs + durMs), 0),
          Observation.of(req.get(j).id(), t0.plusMillis(bMs), t0.plusMillis(bMs + 1000), 0));
      List<SlewLegs.Leg> v = mine.legs(obs, List.of(req.get(i), req.get(j)));
      for (int k = 0; k < 2; k++) {
        String what = String.format(Locale.ROOT, "%s pair %d (%s -> %s) leg %d: planner %.6f s, validator %.6f s",
            s.name(), n, req.get(i).id(), req.get(j).id(), k, p[k], v.get(k).seconds());
        if (Double.isInfinite(p[k]) || Double.isInfinite(v.get(k).seconds())) {
          assertEquals(p[k], v.get(k).seconds(), what);
          break; // later legs of a lost mount are not compared
        }
        worst = Math.max(worst, Math.abs(p[k] - v.get(k).seconds()));
        assertEquals(p[k], v.get(k).seconds(), PlanValidator.TOLERANCE_S, what);
        finite += p[k] > 0 ? 1 : 0;
      }
    }
    System.out.printf(Locale.ROOT, "%s (%s): %d moving legs, worst difference %.3g s%n", s.name(), s.slew().model(),
        finite, worst);
    assertTrue(finite >= pairs / 2, "too few moving legs compared: " + finite);
  }
}
