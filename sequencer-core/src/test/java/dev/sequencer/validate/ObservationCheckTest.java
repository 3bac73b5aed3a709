package dev.sequencer.validate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.Observer;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Refraction;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.Target;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.visibility.RequestVisibility;
import dev.sequencer.visibility.VisibilityCalculator;
import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Random;
import java.util.function.Function;
import org.junit.jupiter.api.Test;

/**
 * The physics oracle (direct Orekit evaluation at the observation's instants) against the visibility
 * engine (shared grid, interpolation, root finding): two independent implementations of the format's
 * constraints must agree. Observations inside computed windows pass; observations that start two minutes
 * before a window opens (with a constraint closing it) are rejected and the constraint is named.
 */
class ObservationCheckTest {
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

  @Test
  void groundA2WindowsAgreeWithTheOracle() {
    // Airmass, hour angle, Moon elevation and illumination; every third request with its own constraints
    // (the hour angle replaced, the airmass removed).
    GroundSite site = new GroundSite(-29.3, -70.7, 2400, List.of());
    Constraints c = Constraints.builder().airmassMax(2.0).hourAngleMinH(-3).hourAngleMaxH(4).moonElevationMaxDeg(30)
        .moonIlluminationMax(0.6).build();
    ConstraintOverrides own = new ConstraintOverrides(Constraints.builder().hourAngleMinH(-1).hourAngleMaxH(1).build(),
        EnumSet.of(ConstraintField.AIRMASS_MAX));
    check(site, c, 86400, ObservationCheckTest::star, 300, own);
  }

  @Test
  void groundDaylightWindowsAgreeWithTheOracle() {
    GroundSite site = new GroundSite(47.0, 8.0, 500, List.of());
    check(site, Constraints.builder().sunElevationMinDeg(-6).elevationMinDeg(15).build(), 2 * 86400,
        ObservationCheckTest::star, 300, null);
  }

  @Test
  void earthPointDaylightAndOffNadirWindowsAgreeWithTheOracle() {
    KeplerianElements k = new KeplerianElements(T0, 6_378.137 + 550, 0.0012, 97.5, 100, 0, 10);
    Constraints c = Constraints.builder().sunElevationMinDeg(10).offNadirMaxDeg(55).build();
    check(new OrbitObserver(k), c, 3 * 86400,
        rnd -> new EarthPoint(-60 + 120 * rnd.nextDouble(), -180 + 360 * rnd.nextDouble(), 0), 30, null);
  }

  @Test
  void theOracleNamesTheNewConstraintThatFails() {
    // A star that rises at 0 deg long before it reaches airmass 2 (about 30 deg): two minutes before the
    // window opens only the airmass fails.
    GroundSite site = new GroundSite(31.0, 20.0, 1200, List.of());
    Request r = Request.of("A", new RaDec(100, 10), 60, 1);
    Scenario s = new Scenario(1, "t", new TimeWindow(T0, T0.plusSeconds(86400)), site,
        Constraints.builder().airmassMax(2.0).build(), new SlewSettings.Fixed(0), null, List.of(r), null);
    TimeWindow w = new VisibilityCalculator(CTX).compute(s).get(0).intervals().get(0);
    List<String> v = ObservationCheckTest.words(s, CTX, r, w.start().minusSeconds(120), w.start().minusSeconds(60));
    assertEquals(1, v.size());
    assertTrue(v.get(0).contains("airmass violated by"), v.get(0));
  }

  /** The check's verdict on {@code r} observed over [a, b], in words. */
  static List<String> words(Scenario s, AstroContext ctx, Request r, Instant a, Instant b) {
    return Violation.words(new ObservationCheck(new Sky(s, ctx)).violations(r, a, b));
  }

  private static RaDec star(Random rnd) {
    return new RaDec(360 * rnd.nextDouble(), -60 + 150 * rnd.nextDouble());
  }

  /** Runs the comparison on stars; returns how many early observations the oracle rejected for elevation. */
  private static int check(Observer observer, Constraints c, long lengthS) {
    return check(observer, c, lengthS, ObservationCheckTest::star, 300, null);
  }

  /**
   * 25 requests on random targets, observations of {@code obsS}; every third one carries {@code own}
   * constraints when it is not null. Returns how many early observations the oracle rejected for elevation.
   */
  private static int check(Observer observer, Constraints c, long lengthS, Function<Random, Target> targets,
      double obsS, ConstraintOverrides own) {
    Random rnd = new Random(3);
    List<Request> reqs = new ArrayList<>();
    for (int i = 0; i < 25; i++) {
      Request r = Request.of("S" + i, targets.apply(rnd), obsS, 1);
      reqs.add(own != null && i % 3 == 0 ? r.withConstraints(own) : r);
    }
    Scenario s = new Scenario(1, "t", new TimeWindow(T0, T0.plusSeconds(lengthS)), observer, c,
        new SlewSettings.Fixed(0), null, reqs, null);
    List<RequestVisibility> vis = new VisibilityCalculator(CTX).compute(s);
    ObservationCheck oracle = new ObservationCheck(new Sky(s, CTX));
    int inside = 0;
    int outside = 0;
    int byElevation = 0;
    for (int i = 0; i < reqs.size(); i++) {
      for (TimeWindow w : vis.get(i).intervals()) {
        if (w.durationS() >= obsS) {
          // The whole window edge to edge (inward-rounded edges) and an observation in its middle.
          assertEquals(List.of(), Violation.words(oracle.violations(reqs.get(i), w.start(), w.end())), reqs.get(i).id() + " " + w);
          Instant mid = w.start().plusMillis((long) (500 * (w.durationS() - obsS)));
          assertEquals(List.of(), Violation.words(oracle.violations(reqs.get(i), mid, mid.plusMillis((long) (1000 * obsS)))));
          inside++;
        }
        Instant early = w.start().minusSeconds(120);
        if (early.isAfter(s.horizon().start()) && !overlapsEarlierWindow(vis.get(i).intervals(), w, early)) {
          List<String> v = Violation.words(oracle.violations(reqs.get(i), early, early.plusSeconds(60)));
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
