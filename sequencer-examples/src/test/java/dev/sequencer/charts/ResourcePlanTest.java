package dev.sequencer.charts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.Observation;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** One resource's share of a plan (A6) and the file names made from resource ids. */
class ResourcePlanTest {

  @Test
  void sharesSplitThePlanByResourceAndAddUpToIt() {
    NetworkPlans.Planned p = NetworkPlans.of(NetworkPlans.NETWORK);
    List<ResourcePlan> plans = ResourcePlan.of(p.scenario(), p.timeline());
    assertEquals(List.of("desert-1m", "plateau-60cm"), plans.stream().map(ResourcePlan::id).toList());
    int n = 0;
    double priority = 0;
    double slew = 0;
    for (ResourcePlan r : plans) {
      for (Observation o : r.timeline().observations()) {
        assertEquals(r.id(), o.resource());
      }
      n += r.timeline().observations().size();
      priority += r.timeline().priority();
      slew += r.timeline().slewSeconds();
      assertNull(r.timeline().bound(), "the bound is the whole plan's");
      assertTrue(r.scenario().observer() != null, r.id() + " is seen from its own site");
      assertTrue(r.timeline().unscheduled().stream().allMatch(u -> p.scenario().request(u.id()).orElseThrow()
          .allows(r.id())), "only requests it may observe");
    }
    assertEquals(p.timeline().observations().size(), n);
    // the validator checked the plan's totals against its observations, so the shares must add up to them
    assertEquals(p.timeline().priority(), priority, 1e-9);
    assertEquals(p.timeline().slewSeconds(), slew, 1e-6);
    // network-two-sites-night.json: plateau-60cm sets elevationMinDeg 30 over the scenario's 25
    assertEquals(25.0, ConstraintField.ELEVATION_MIN_DEG.valueIn(plans.get(0).scenario().constraints()));
    assertEquals(30.0, ConstraintField.ELEVATION_MIN_DEG.valueIn(plans.get(1).scenario().constraints()));
  }

  @Test
  void fileNamesKeepSafeCharactersAndStayDistinct() {
    Map<String, String> names = ChartFiles.fileNames(List.of("north-1", "a/b", "a b", "A_B", "..", "", "x".repeat(80),
        "télescope"));
    assertEquals("north-1", names.get("north-1"));
    assertEquals("a_b", names.get("a/b"));
    assertEquals("a_b-2", names.get("a b"), "same part as a/b: numbered");
    assertEquals("A_B-3", names.get("A_B"), "file systems that ignore case would mix it up with a_b");
    assertEquals("__", names.get(".."), "no way out of the folder");
    assertEquals("_", names.get(""));
    assertEquals("x".repeat(60), names.get("x".repeat(80)));
    assertEquals("t_lescope", names.get("télescope"));
  }
}
