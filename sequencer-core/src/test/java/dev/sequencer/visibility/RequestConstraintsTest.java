package dev.sequencer.visibility;

import static dev.sequencer.visibility.VisibilityReferenceTest.T0;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import java.util.EnumSet;
import java.util.List;
import org.junit.jupiter.api.Test;

/** A request's own constraints in the visibility engine, and the explanation naming the new constraints. */
class RequestConstraintsTest {
  private static final AstroContext CTX = AstroContext.offline();
  private static final GroundSite SITE = new GroundSite(31.0, 20.0, 1200, List.of());
  private static final RaDec STAR = new RaDec(100, 10);

  private static Scenario scenario(Constraints c, List<Request> requests) {
    return new Scenario(1, "test", new TimeWindow(T0, T0.plusSeconds(2 * 86400)), SITE, c,
        new SlewSettings.Fixed(0), null, requests, null);
  }

  @Test
  void eachRequestGetsItsOwnReplacedInheritedOrRemovedConstraint() {
    // The same star three times: A inherits airmass <= 1.5, B replaces it by 3, C removes it (null).
    Constraints top = Constraints.builder().elevationMinDeg(-90).airmassMax(1.5).build();
    Request a = Request.of("A", STAR, 60, 1);
    Request b = Request.of("B", STAR, 60, 1)
        .withConstraints(ConstraintOverrides.setting(Constraints.builder().airmassMax(3).build()));
    Request c = Request.of("C", STAR, 60, 1)
        .withConstraints(new ConstraintOverrides(Constraints.none(), EnumSet.of(ConstraintField.AIRMASS_MAX)));
    List<RequestVisibility> v = new VisibilityCalculator(CTX).compute(scenario(top, List.of(a, b, c)));
    // Each equals the same request computed alone under the effective constraints written at the top level.
    assertEquals(alone(Constraints.builder().elevationMinDeg(-90).airmassMax(1.5).build()), v.get(0).intervals());
    assertEquals(alone(Constraints.builder().elevationMinDeg(-90).airmassMax(3).build()), v.get(1).intervals());
    assertEquals(alone(Constraints.builder().elevationMinDeg(-90).build()), v.get(2).intervals());
    assertTrue(v.get(0).totalS() < v.get(1).totalS() && v.get(1).totalS() < v.get(2).totalS());
    assertFalse(v.get(2).removedS().containsKey(ConstraintFunction.AIRMASS));
  }

  private static List<TimeWindow> alone(Constraints c) {
    return new VisibilityCalculator(CTX).compute(scenario(c, List.of(Request.of("X", STAR, 60, 1)))).get(0)
        .intervals();
  }

  @Test
  void aNeverVisibleRequestNamesTheNewConstraintThatRemovesTheMostTime() {
    // At latitude 31 N a star at dec -40 culminates at 90 - 31 - 40 = 19 deg (common practice); airmass
    // <= 2 needs about 30 deg, so it is never visible, and the airmass removes the whole horizon.
    Constraints c = Constraints.builder().elevationMinDeg(-90).airmassMax(2).build();
    RequestVisibility v = new VisibilityCalculator(CTX)
        .compute(scenario(c, List.of(Request.of("LOW", new RaDec(100, -40), 60, 1)))).get(0);
    assertTrue(v.neverVisible());
    assertEquals("airmass", v.limitingConstraint());
    assertEquals(2 * 86400.0, v.removedS().get("airmass"), 1e-6);
  }
}
