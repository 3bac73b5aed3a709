package dev.sequencer.validate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.Observer;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Refraction;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.visibility.RequestVisibility;
import dev.sequencer.visibility.VisibilityCalculator;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The physics oracle (direct Orekit evaluation at the observation's instants) against the visibility
 * engine (shared grid, interpolation, root finding): two independent implementations of the format's
 * constraints must agree. Observations inside computed windows pass; observations that start two minutes
 * before a window opens (with a constraint closing it) are rejected and the constraint is named.
 */
class PhysicsOracleTest {
  private static final AstroContext CTX = AstroContext.offline();
  private static final Instant T0 = Instant.parse("2031-10-14T15:00:00Z");

  @Test
  void groundNightWindowsAgreeWithTheOracle() {
    GroundSite site = new GroundSite(24.62, 33.91, 820, List.of(new AzEl(0, 12), new AzEl(90, 18),
        new AzEl(180, 10), new AzEl(270, 15)));
    Constraints c = Constraints.builder().elevationMinDeg(25).elevationMaxDeg(87).sunElevationMaxDeg(-12)
        .moonSeparationMinDeg(25).build();
    check(site, c, 14 * 3600);
  }

  @Test
  void bindingMaskAndRefractionAgreeWithTheOracle() {
    // A mask above elevationMinDeg (25 deg) over a third of the sky, across the 0/360 seam, and refraction
    // (format A1): the oracle applies both with its own Orekit topocentric frame, the engine with its grid.
    GroundSite site = new GroundSite(24.62, 33.91, 820, List.of(new AzEl(0, 40), new AzEl(60, 12),
        new AzEl(150, 35), new AzEl(200, 10), new AzEl(300, 12), new AzEl(330, 38)), new Refraction(920, 12));
    Constraints c = Constraints.builder().elevationMinDeg(25).elevationMaxDeg(87).sunElevationMaxDeg(-12).build();
    int maskRejections = check(site, c, 14 * 3600);
    assertTrue(maskRejections >= 5, "only " + maskRejections + " early observations rejected by the elevation");
  }

  @Test
  void leoWindowsAgreeWithTheOracle() {
    KeplerianElements k = new KeplerianElements(T0, 6_378.137 + 550, 0.0005, 97.5, 100, 0, 0);
    Constraints c = Constraints.builder().earthLimbMinDeg(15).sunSeparationMinDeg(45).moonSeparationMinDeg(10).build();
    check(new OrbitObserver(k), c, 6 * 3600);
  }

  /** Runs the comparison; returns how many early observations the oracle rejected for elevation. */
  private static int check(Observer observer, Constraints c, long lengthS) {
    Random rnd = new Random(3);
    List<Request> reqs = new ArrayList<>();
    for (int i = 0; i < 25; i++) {
      reqs.add(Request.of("S" + i, new RaDec(360 * rnd.nextDouble(), -60 + 150 * rnd.nextDouble()), 300, 1));
    }
    Scenario s = new Scenario(1, "t", new TimeWindow(T0, T0.plusSeconds(lengthS)), observer, c,
        new SlewSettings.Fixed(0), null, reqs, null);
    List<RequestVisibility> vis = new VisibilityCalculator(CTX).compute(s);
    PhysicsOracle oracle = new PhysicsOracle(s, CTX);
    int inside = 0;
    int outside = 0;
    int byElevation = 0;
    for (int i = 0; i < reqs.size(); i++) {
      for (TimeWindow w : vis.get(i).intervals()) {
        if (w.durationS() >= 300) {
          // The whole window edge to edge (inward-rounded edges) and a 300 s observation in its middle.
          assertEquals(List.of(), oracle.violations(reqs.get(i), w.start(), w.end()), reqs.get(i).id() + " " + w);
          Instant mid = w.start().plusSeconds((long) (w.durationS() / 2) - 150);
          assertEquals(List.of(), oracle.violations(reqs.get(i), mid, mid.plusSeconds(300)));
          inside++;
        }
        Instant early = w.start().minusSeconds(120);
        if (early.isAfter(s.horizon().start()) && !overlapsEarlierWindow(vis.get(i).intervals(), w, early)) {
          List<String> v = oracle.violations(reqs.get(i), early, early.plusSeconds(60));
          assertFalse(v.isEmpty(), reqs.get(i).id() + " two minutes before " + w);
          assertTrue(v.get(0).contains("violated by"), v.get(0));
          outside++;
          byElevation += v.get(0).contains(": elevation violated") ? 1 : 0;
        }
      }
    }
    assertTrue(inside >= 10 && outside >= 10, "inside " + inside + ", outside " + outside);
    return byElevation;
  }

  private static boolean overlapsEarlierWindow(List<TimeWindow> all, TimeWindow w, Instant t) {
    return all.stream().anyMatch(x -> x != w && !x.end().isBefore(t) && x.start().isBefore(w.start()));
  }
}
