package dev.sequencer.planner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.ScenarioException;
import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Observation;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Visits;
import dev.sequencer.sequence.SequencerOptions;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

/**
 * Two invented ground sites sharing one queue (format addition A6), through the façade (every plan passes the
 * independent validator per resource): a far-northern field only the northern site can reach above its
 * elevation limit and a far-southern one only the southern site can, a required request restricted to the
 * southern site, and more equatorial fields than one site's night holds. Where each field must go follows
 * from the geometry alone (common practice: a fixed target culminates at 90° − |latitude − declination|).
 */
class ResourcesPlannerTest {
  private static final AstroContext CTX = AstroContext.offline();
  private static final Instant T0 = Instant.parse("2031-10-14T15:00:00Z");

  private static Scenario network() {
    SlewSettings slew = new SlewSettings.AltAz(3, 2, 1, 1, 10, List.of(-270.0, 270.0));
    Resource north = new Resource("north", new GroundSite(24.62, 33.91, 820, List.of(), null), slew,
        new AzElPointing(0, 60), null, null);
    Resource south = new Resource("south", new GroundSite(-23.71, 31.08, 1340, List.of(), null), slew,
        new AzElPointing(180, 60), ConstraintOverrides.setting(Constraints.builder().elevationMinDeg(30).build()),
        null);
    List<Request> requests = new ArrayList<>();
    // Culminations: dec +55 at 59.6° from the north site and 11.3° from the south; dec -70 the reverse.
    requests.add(Request.of("NORTHERN", new RaDec(25, 55), 1800, 5));
    requests.add(Request.of("SOUTHERN", new RaDec(30, -70), 1800, 5));
    requests.add(Request.of("PINNED", new RaDec(35, -10), 1200, 3).withRequired(true).withResources(List.of("south")));
    for (int k = 0; k < 8; k++) {
      requests.add(Request.of("EQ" + k, new RaDec(5 + 10 * k, 0), 5400, 4));
    }
    Constraints c = Constraints.builder().sunElevationMaxDeg(-12).elevationMinDeg(25).build();
    return new Scenario(Scenario.FORMAT, "invented two-site network", new TimeWindow(T0, T0.plusSeconds(14 * 3600)),
        null, c, slew, null, requests, null, List.of(), null, "", List.of(north, south));
  }

  @Test
  void eachFieldGoesWhereItCanBeSeenAndTheNetworkHoldsMoreThanOneSite() {
    Scenario s = network();
    for (SequencerOptions.Solver solver : List.of(SequencerOptions.Solver.CPSAT, SequencerOptions.Solver.GREEDY)) {
      PlanOutcome o = Planner.plan(s, CTX, SequencerOptions.defaults().withSolver(solver).withTimeLimitS(10)
          .withWorkers(2));
      Map<String, String> where = o.timeline().observations().stream()
          .collect(Collectors.toMap(Observation::id, Observation::resource));
      assertEquals("north", where.get("NORTHERN"), solver + ": " + where);
      assertEquals("south", where.get("SOUTHERN"), solver + ": " + where);
      assertEquals("south", where.get("PINNED"), solver + ": " + where);
      long onNorth = where.values().stream().filter("north"::equals).count();
      long onSouth = where.values().stream().filter("south"::equals).count();
      assertTrue(onNorth >= 3 && onSouth >= 3, solver + ": both sites observe equatorial fields too: " + where);
      assertTrue(overlapAcrossResources(o.timeline().observations()), solver + ": the sites observe at the same time");
    }
  }

  private static boolean overlapAcrossResources(List<Observation> obs) {
    for (Observation a : obs) {
      for (Observation b : obs) {
        if (!a.resource().equals(b.resource()) && a.start().isBefore(b.end()) && b.start().isBefore(a.end())) {
          return true;
        }
      }
    }
    return false;
  }

  @Test
  void visitsOnSeveralResourcesAreRefusedWithTheirPath() {
    Scenario s = network();
    List<Request> r = new ArrayList<>(s.requests());
    r.set(3, r.get(3).withVisits(new Visits(2, 600, null, false, false)));
    ScenarioException e = assertThrows(ScenarioException.class, () -> Planner.plan(s.withRequests(r), CTX,
        SequencerOptions.defaults().withTimeLimitS(2)));
    assertEquals("requests[3] (id \"EQ0\").visits", e.problems().get(0).path());
  }

  @Test
  void replanningWithSeveralResourcesIsRefused() {
    Scenario s = network();
    PlanOutcome o = Planner.plan(s, CTX, SequencerOptions.defaults().withSolver(SequencerOptions.Solver.GREEDY)
        .withTimeLimitS(5));
    ScenarioException e = assertThrows(ScenarioException.class, () -> Planner.replan(s, CTX, o.timeline(),
        o.timeline().observations().get(1).start(), java.util.Set.of(), java.util.Set.of(),
        dev.sequencer.sequence.replan.ReplanOptions.defaults()));
    assertEquals("resources", e.problems().get(0).path());
  }
}
