package dev.sequencer.campaign;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.astro.Sofa;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.TimeWindow;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Random;
import org.jastronomy.jsofa.JSOFA;
import org.junit.jupiter.api.Test;
import org.orekit.time.AbsoluteDate;

class DarkNightsTest {
  private static final AstroContext CTX = AstroContext.offline();

  /**
   * The Sun's elevation by SOFA alone: its geocentric direction from {@code jauEpv00} (minus the Earth's
   * heliocentric position), taken to the site's observed place by {@code jauAtco13} without refraction
   * (outside reference; the test helper {@link Sofa#observed} shares no code with {@link DarkNights}).
   */
  private static double sofaSunElevationDeg(Instant t, GroundSite site) {
    AbsoluteDate d = CTX.date(t);
    double[] tt = Sofa.tt(CTX, d);
    double[][] pvh = new double[2][3];
    double[][] pvb = new double[2][3];
    JSOFA.jauEpv00(tt[0], tt[1], pvh, pvb);
    double x = -pvh[0][0];
    double y = -pvh[0][1];
    double z = -pvh[0][2];
    double ra = Math.toDegrees(Math.atan2(y, x));
    double dec = Math.toDegrees(Math.atan2(z, Math.hypot(x, y)));
    return Sofa.observed(CTX, d, ra < 0 ? ra + 360 : ra, dec, site.latitudeDeg(), site.longitudeDeg(),
        site.altitudeM())[1];
  }

  @Test
  void duskAndDawnMeetTheLimitBySofa() {
    Random random = new Random(19);
    double worst = 0;
    for (int k = 0; k < 12; k++) {
      GroundSite site = new GroundSite(-60 + random.nextDouble() * 110, -180 + random.nextDouble() * 360,
          random.nextDouble() * 3000, List.of(), null);
      LocalDate evening = LocalDate.of(2031, 1, 1).plusDays(random.nextInt(365));
      double limit = -18 + random.nextDouble() * 18;
      DarkNights dark = new DarkNights(CTX, site);
      TimeWindow w = dark.night(evening, limit);
      if (w == null) {
        continue;
      }
      for (Instant edge : List.of(w.start(), w.end())) {
        double sofa = sofaSunElevationDeg(edge, site);
        worst = Math.max(worst, Math.abs(sofa - limit));
        // Tolerance 0.02 deg: SOFA's observed place includes annual aberration (20.5") and light deflection
        // that the format's geometric Sun does not, plus the rounding inwards to whole seconds (at most
        // 0.0042 deg at the Sun's fastest elevation rate of 15"/s): about 0.01 deg in all.
        assertEquals(limit, sofa, 0.02, "edge " + edge + " at " + site + ", limit " + limit);
      }
      // Darkness inside, light just outside (5 minutes: well above the tolerance).
      assertTrue(dark.sunElevationDeg(w.start().plusSeconds(300)) < limit);
      assertTrue(dark.sunElevationDeg(w.start().minusSeconds(300)) > limit);
      assertTrue(dark.sunElevationDeg(w.end().plusSeconds(300)) > limit);
    }
    System.out.printf("darkness edges vs SOFA: worst %.4f deg%n", worst);
  }

  @Test
  void polarSummerHasNoNightAndPolarWinterIsDarkAllDay() {
    GroundSite north = new GroundSite(78.2, 15.6, 10, List.of(), null); // invented site at Svalbard's latitude
    DarkNights dark = new DarkNights(CTX, north);
    // Common practice: at 78 N the Sun stays above -12 deg from about mid-April to late August.
    assertNull(dark.night(LocalDate.of(2031, 6, 21), -12));
    TimeWindow winter = dark.night(LocalDate.of(2031, 12, 21), -6);
    assertNotNull(winter);
    assertEquals(86_400, winter.durationS(), 1.0, "polar night: the whole 24 h are darker than -6 deg");
  }

  @Test
  void midLatitudeNightLengthIsPlausible() {
    // Invented site at 29.3 S; astronomical darkness (Sun below -18 deg) in the southern autumn lasts about
    // 9-10 h (common practice: 12 h of night minus about 1.5 h of twilight at each end).
    GroundSite site = new GroundSite(-29.3, -70.7, 2200, List.of(), null);
    TimeWindow w = new DarkNights(CTX, site).night(LocalDate.of(2031, 3, 20), -18);
    assertTrue(w.durationS() > 8.5 * 3600 && w.durationS() < 10.5 * 3600, "dark for " + w.durationS() / 3600 + " h");
  }
}
