package dev.sequencer.visibility;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.slew.PointingTrack;
import dev.sequencer.slew.SlewModel;
import dev.sequencer.slew.Transitions;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Alt-az slew bounds over the production star tracks, with negative lower elevation limits (allowed by the
 * API; the audit of issue #14 found 35 of 118,020 exact slews above their bound, by up to 0.92 s, before
 * the star tracks bounded |elevation| with both culminations): for random pairs of stars and random
 * departure and arrival intervals, every sampled exact leg is at most the interval bound. Exact legs are
 * evaluated on two-leg sequences (the mount first placed on the from-star, following it to the
 * departure), with and without cable wrap.
 */
class AltAzProductionBoundTest {
  private static final AstroContext CTX = AstroContext.offline();
  private static final Instant T0 = Instant.parse("2031-10-14T12:00:00Z");
  private static final double HORIZON_S = 14 * 3600;

  @Test
  void exactLegsNeverExceedTheirBoundWithNegativeElevationLimits() {
    Random rnd = new Random(201);
    int legs = 0;
    int finiteBounds = 0;
    double worstSlackS = Double.POSITIVE_INFINITY;
    for (int scenario = 0; scenario < 12; scenario++) {
      double lat = -80 + 160 * rnd.nextDouble();
      GroundSite site = new GroundSite(lat, 360 * rnd.nextDouble() - 180, 1000, List.of());
      List<Request> reqs = new ArrayList<>();
      for (int i = 0; i < 12; i++) {
        double dec = i % 4 == 0 ? Math.max(-90, Math.min(90, lat - 3 + 6 * rnd.nextDouble()))
            : Math.toDegrees(Math.asin(2 * rnd.nextDouble() - 1));
        reqs.add(Request.of("S" + i, new RaDec(360 * rnd.nextDouble(), dec), 300, 1));
      }
      List<Double> wrap = scenario % 2 == 0 ? null : List.of(-270.0, 270.0);
      SlewSettings.AltAz settings = new SlewSettings.AltAz(2 + rnd.nextDouble(), 1 + rnd.nextDouble(), 0.5, 0.5, 5, wrap);
      double elMin = -30 * rnd.nextDouble();
      Scenario s = new Scenario(1, "t", new TimeWindow(T0, T0.plusSeconds((long) HORIZON_S)), site, Constraints.none(),
          settings, null, reqs, null);
      List<PointingTrack> tracks = PointingTracks.of(s, CTX);
      Transitions tr = SlewModel.altaz(settings, elMin, 90).transitions(tracks, null);
      for (int pair = 0; pair < 120; pair++) {
        int i = rnd.nextInt(reqs.size());
        int j = (i + 1 + rnd.nextInt(reqs.size() - 1)) % reqs.size();
        double dMin = (HORIZON_S - 3000) * rnd.nextDouble();
        double dMax = dMin + 1800 * rnd.nextDouble() * rnd.nextDouble();
        double aMin = dMin + 600 * rnd.nextDouble();
        double aMax = aMin + 1800 * rnd.nextDouble() * rnd.nextDouble();
        double bound = tr.boundS(i, j, dMin, dMax, aMin, aMax);
        if (!Double.isFinite(bound)) {
          continue;
        }
        finiteBounds++;
        for (int k = 0; k < 25; k++) {
          double td = dMin + (dMax - dMin) * (k / 5) / 4.0;
          double ta = aMin + (aMax - aMin) * (k % 5) / 4.0;
          if (ta < td) {
            continue; // an arrival before the departure is no leg
          }
          double first = Math.max(0, td - 300);
          double[] exact = tr.exactS(new int[] {i, j}, new double[] {0, td}, new double[] {first, ta});
          if (!Double.isFinite(exact[1])) {
            continue; // elevation outside the limits at arrival, or the wrap ran out: not a pairwise case
          }
          legs++;
          worstSlackS = Math.min(worstSlackS, bound - exact[1]);
          double b = bound;
          double e = exact[1];
          int ii = i;
          int jj = j;
          assertTrue(e <= b, () -> "exact " + e + " s > bound " + b + " s for " + ii + " -> " + jj + " departing "
              + td + " in [" + dMin + ", " + dMax + "], arriving " + ta + " in [" + aMin + ", " + aMax + "]");
        }
      }
    }
    System.out.printf("alt-az production bounds: %d exact legs under %d finite bounds, least slack %.3f s%n", legs,
        finiteBounds, worstSlackS);
    assertTrue(legs >= 10_000, "only " + legs + " exact legs checked");
  }
}
