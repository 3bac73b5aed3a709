package dev.sequencer.visibility;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.ScenarioException;
import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.ScenarioWriter;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import java.time.Instant;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import org.junit.jupiter.api.Test;

/**
 * Issue 15: every ordinary Keplerian element set (a >= 6,478 km, 0 <= e < 0.9, any angles) either gives
 * windows or is refused when the file is read, with the elements' path; never a failure later.
 */
class OrdinaryElementsProperties {
  private static final AstroContext CTX = AstroContext.offline();
  private static final Instant T0 = Instant.parse("2031-06-21T00:00:00Z");

  @Property(tries = 40)
  void ordinaryElementsPropagateOrAreRefusedAtInputTime(
      @ForAll @DoubleRange(min = 6478, max = 60000) double aKm,
      @ForAll @DoubleRange(min = 0, max = 0.9, maxIncluded = false) double e,
      @ForAll @DoubleRange(min = 0, max = 180) double iDeg,
      @ForAll @DoubleRange(min = -720, max = 720) double raanDeg,
      @ForAll @DoubleRange(min = -720, max = 720) double argpDeg,
      @ForAll @DoubleRange(min = -720, max = 720) double mDeg) {
    check(new KeplerianElements(T0.minusSeconds(7200), aKm, e, iDeg, raanDeg, argpDeg, mDeg));
  }

  @Test
  void edgesOfTheOrdinarySet() {
    // Kept from the property's corners: circular equatorial, retrograde equatorial, high eccentricity with
    // the perigee just above the surface, and the reported near-circular case.
    check(new KeplerianElements(T0, 6478, 0, 0, 0, 0, 0));
    check(new KeplerianElements(T0, 6478, 0, 180, 0, 0, 0));
    check(new KeplerianElements(T0, 64000, 0.899, 63.4, 10, 270, 180));
    check(new KeplerianElements(T0, 6928, 0.0015, 97.6, 10, 20, 10));
  }

  private static void check(KeplerianElements k) {
    Scenario s = new Scenario(1, "t", new TimeWindow(T0, T0.plusSeconds(3 * 3600)), new OrbitObserver(k),
        Constraints.builder().earthLimbMinDeg(10).offNadirMaxDeg(60).build(), new SlewSettings.Fixed(0), null,
        List.of(Request.of("S", new RaDec(10, 20), 60, 1), Request.of("P", new EarthPoint(0, 0, 0), 60, 1)), null);
    Scenario read;
    try {
      read = ScenarioReader.parse(ScenarioWriter.toJson(s)).scenario();
    } catch (ScenarioException ex) {
      assertTrue(ex.path().startsWith("observer.orbit.keplerian"), ex.getMessage());
      return;
    }
    List<RequestVisibility> v = new VisibilityCalculator(CTX).withThreads(1).compute(read);
    assertEquals(2, v.size());
    assertTrue(v.get(0).totalS() >= 0 && v.get(1).totalS() >= 0);
  }
}
