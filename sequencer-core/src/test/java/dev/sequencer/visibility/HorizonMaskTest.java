package dev.sequencer.visibility;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.astro.Sofa;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Refraction;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.jastronomy.jsofa.JSOFA;
import org.junit.jupiter.api.Test;
import org.orekit.time.AbsoluteDate;

/**
 * Horizon masks that bind: window edges of fixed targets where the mask, not {@code elevationMinDeg}, is
 * the limit (including across the 0/360 deg seam), against an outside chain: SOFA's observed place
 * (jauAtco13; no refraction, or SOFA's own refraction model) with the mask applied to SOFA's azimuth, edges
 * found by bisection to 1 ms. UT1 = UTC and no polar motion on both sides (no EOP offline).
 *
 * <p>Tolerance per edge: 0.05 s (the engine's root accuracy) + 1 ms (inward rounding) + 0.4" divided by
 * how fast the margin crosses zero there (the chains differ by up to 0.334" on the sky, the diurnal
 * aberration SOFA applies: GroundPointingSofaTest), rounded up.
 */
class HorizonMaskTest {
  private static final AstroContext CTX = AstroContext.offline();
  private static final Instant T0 = Instant.parse("2031-10-14T12:00:00Z");
  private static final long LENGTH_S = 24 * 3600;
  private static final double ELEVATION_MIN_DEG = 15;
  /**
   * A mask above the 15 deg limit in the north (across the seam: 22 deg at 340, 30 at 20, so 26 at 0) and
   * in the east-south-east (34 deg between 100 and 120), 8 deg elsewhere.
   */
  private static final List<AzEl> MASK = List.of(new AzEl(20, 30), new AzEl(60, 8), new AzEl(100, 34),
      new AzEl(120, 34), new AzEl(140, 8), new AzEl(320, 8), new AzEl(340, 22));
  /** Stars chosen to rise, set or pass lower culmination behind the mask at latitude 45 deg. */
  private static final List<RaDec> STARS = List.of(new RaDec(30, 62), new RaDec(200, 68), new RaDec(120, 55),
      new RaDec(300, 5), new RaDec(80, -10), new RaDec(250, 20));

  @Test
  void maskEdgesMatchSofaIncludingTheSeam() {
    GroundSite site = new GroundSite(45, 10, 500, MASK);
    check(site, 0, 0);
  }

  @Test
  void maskEdgesWithRefractionMatchSofaRefraction() {
    // SOFA's observed place with pressure and temperature applies its refco model (A tan z + B tan^3 z,
    // here dry air at 0.55 um), which ours matches within 0.017" above 10 deg (RefractionTest); every edge
    // here is at 15 deg or higher.
    GroundSite site = new GroundSite(45, 10, 500, MASK, new Refraction(780, 5));
    check(site, 780, 5);
  }

  @Test
  void theMaskRemovesTimeAndItsSeamInterpolatesTheShortWay() {
    // Pure mask arithmetic (GroundSite.maskElevationDeg): at the seam the mask runs from 22 deg (340) to
    // 30 deg (20) through north, not the long way round.
    GroundSite site = new GroundSite(45, 10, 500, MASK);
    assertEquals(26.0, site.maskElevationDeg(0), 1e-12);
    assertEquals(26.0, site.maskElevationDeg(360), 1e-12);
    assertEquals(24.0, site.maskElevationDeg(350), 1e-12);
    assertEquals(28.0, site.maskElevationDeg(10), 1e-12);
    assertEquals(34.0, site.maskElevationDeg(110), 1e-12);
    // Every window with the mask lies inside one without it, and the mask takes time away from most stars.
    List<RequestVisibility> masked = windows(site);
    List<RequestVisibility> open = windows(new GroundSite(45, 10, 500, List.of()));
    int shorter = 0;
    for (int i = 0; i < STARS.size(); i++) {
      for (TimeWindow w : masked.get(i).intervals()) {
        assertTrue(open.get(i).intervals().stream().anyMatch(o -> !o.start().isAfter(w.start()) && !o.end().isBefore(w.end())),
            "star " + i + " window " + w + " is not inside an unmasked one");
      }
      shorter += masked.get(i).totalS() < open.get(i).totalS() - 60 ? 1 : 0;
    }
    assertTrue(shorter >= 4, "the mask shortened only " + shorter + " of " + STARS.size() + " stars' windows");
  }

  private static List<RequestVisibility> windows(GroundSite site) {
    List<Request> reqs = new ArrayList<>();
    for (int i = 0; i < STARS.size(); i++) {
      reqs.add(Request.of("S" + i, STARS.get(i), 60, 1));
    }
    Scenario s = new Scenario(1, "mask", new TimeWindow(T0, T0.plusSeconds(LENGTH_S)), site,
        Constraints.builder().elevationMinDeg(ELEVATION_MIN_DEG).build(), new SlewSettings.Fixed(0), null, reqs, null);
    return new VisibilityCalculator(CTX).compute(s);
  }

  private static void check(GroundSite site, double pressureHPa, double temperatureC) {
    List<RequestVisibility> vis = windows(site);
    AbsoluteDate origin = CTX.date(T0);
    int maskEdges = 0;
    int seamEdges = 0;
    double worstS = 0;
    for (int i = 0; i < STARS.size(); i++) {
      RaDec star = STARS.get(i);
      DoubleUnaryOperator margin = t -> {
        double[] azEl = observed(origin.shiftedBy(t), star, site, pressureHPa, temperatureC);
        return azEl[1] - Math.max(ELEVATION_MIN_DEG, site.maskElevationDeg(azEl[0]));
      };
      List<Double> reference = edges(margin);
      List<Double> ours = new ArrayList<>();
      for (TimeWindow w : vis.get(i).intervals()) {
        double a = CTX.date(w.start()).durationFrom(origin);
        double b = CTX.date(w.end()).durationFrom(origin);
        if (a > 0.5) {
          ours.add(a);
        }
        if (b < LENGTH_S - 0.5) {
          ours.add(b);
        }
      }
      assertEquals(reference.size(), ours.size(), "star " + i + ": edges " + ours + " vs SOFA " + reference);
      for (int k = 0; k < ours.size(); k++) {
        double t = reference.get(k);
        double slopeDegPerS = Math.abs(margin.applyAsDouble(t + 1) - margin.applyAsDouble(t - 1)) / 2;
        double tolS = 0.05 + 0.001 + 0.4 / 3600 / slopeDegPerS;
        double errS = Math.abs(ours.get(k) - t);
        assertTrue(errS <= tolS, "star " + i + " edge " + k + ": " + ours.get(k) + " vs SOFA " + t + " (tolerance "
            + tolS + " s)");
        worstS = Math.max(worstS, errS);
        double az = observed(origin.shiftedBy(t), star, site, pressureHPa, temperatureC)[0];
        if (site.maskElevationDeg(az) > ELEVATION_MIN_DEG) {
          maskEdges++;
          seamEdges += az < 20 || az > 340 ? 1 : 0;
        }
      }
    }
    System.out.printf("mask edges vs SOFA (P %.0f hPa): %d mask-bound edges, %d at the seam, worst %.3f s%n",
        pressureHPa, maskEdges, seamEdges, worstS);
    assertTrue(maskEdges >= 6, "only " + maskEdges + " edges are set by the mask");
    assertTrue(seamEdges >= 2, "only " + seamEdges + " mask edges within 20 deg of north");
  }

  /** SOFA's observed {azimuth, elevation} in degrees, with refraction when pressure > 0 (dry air, 0.55 um). */
  private static double[] observed(AbsoluteDate date, RaDec star, GroundSite site, double pressureHPa,
      double temperatureC) {
    double[] u = Sofa.utc(CTX, date);
    try {
      JSOFA.ObservedPositionEO o = JSOFA.jauAtco13(Math.toRadians(star.raDeg()), Math.toRadians(star.decDeg()), 0, 0,
          0, 0, u[0], u[1], 0.0, Math.toRadians(site.longitudeDeg()), Math.toRadians(site.latitudeDeg()),
          site.altitudeM(), 0.0, 0.0, pressureHPa, temperatureC, 0.0, 0.55);
      return new double[] {Math.toDegrees(o.op.aob), 90 - Math.toDegrees(o.op.zob)};
    } catch (Exception e) {
      throw new IllegalStateException(e);
    }
  }

  /** Sign changes of the margin over the horizon (120 s scan, then bisection to 1 ms). */
  private static List<Double> edges(DoubleUnaryOperator margin) {
    List<Double> out = new ArrayList<>();
    double step = 120;
    double ta = 0;
    double ga = margin.applyAsDouble(ta);
    for (double tb = step; tb <= LENGTH_S + 1e-9; tb += step) {
      double gb = margin.applyAsDouble(tb);
      if ((ga >= 0) != (gb >= 0)) {
        double lo = ta;
        double hi = tb;
        boolean loSign = ga >= 0;
        while (hi - lo > 1e-3) {
          double mid = (lo + hi) / 2;
          if ((margin.applyAsDouble(mid) >= 0) == loSign) {
            lo = mid;
          } else {
            hi = mid;
          }
        }
        out.add((lo + hi) / 2);
      }
      ta = tb;
      ga = gb;
    }
    return out;
  }
}
