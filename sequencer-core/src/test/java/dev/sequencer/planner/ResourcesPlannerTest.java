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
import dev.sequencer.model.Timeline;
import dev.sequencer.sequence.replan.ReplanOptions;
import dev.sequencer.sequence.replan.ReplanResult;
import dev.sequencer.sequence.replan.Replanner;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
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
  void aRequiredFieldNoAllowedSiteCanSeeIsProvenInfeasibleAndNamed() {
    Scenario s = network();
    List<Request> r = new ArrayList<>(s.requests());
    // Dec +80 culminates at 13.7° from the southern site (common practice: 90° − |latitude − declination|),
    // below its 30° limit.
    r.add(Request.of("POLAR", new RaDec(40, 80), 600, 2).withRequired(true).withResources(List.of("south")));
    PlanOutcome o = Planner.plan(s.withRequests(r), CTX, SequencerOptions.defaults().withTimeLimitS(5));
    assertEquals(dev.sequencer.model.PlanStatus.INFEASIBLE, o.result().status(), o.result().message());
    assertTrue(o.result().message().contains("POLAR") && o.result().message().contains("on south:"),
        o.result().message());
  }

  /** A required request with two visits on the network: both planned, numbered in time order, 10 min apart (A4, A6). */
  @Test
  void requiredVisitsOnSeveralResourcesArePlanned() {
    Scenario s = network();
    List<Request> r = new ArrayList<>(s.requests());
    r.set(3, r.get(3).withVisits(new Visits(2, 600, null, false, false)).withRequired(true));
    PlanOutcome o = Planner.plan(s.withRequests(r), CTX, SequencerOptions.defaults().withTimeLimitS(4).withWorkers(2));
    assertTrue(o.result().hasPlan(), o.result().message());
    List<Observation> eq0 = o.timeline().observations().stream().filter(x -> x.id().equals("EQ0")).toList();
    assertEquals(2, eq0.size(), o.timeline().toString());
    assertEquals(Integer.valueOf(1), eq0.get(0).visit());
    assertEquals(Integer.valueOf(2), eq0.get(1).visit());
    assertTrue(java.time.Duration.between(eq0.get(0).start(), eq0.get(1).start()).getSeconds() >= 600, eq0.toString());
  }

  /** The network's CP-SAT plan (the re-planning tests start from it). */
  private static PlanOutcome planned(Scenario s) {
    return Planner.plan(s, CTX, SequencerOptions.defaults().withTimeLimitS(8).withWorkers(2));
  }

  /** An instant inside an observation of {@code resource} that has another of its observations after it. */
  private static Instant insideOn(List<Observation> obs, String resource) {
    List<Observation> mine = obs.stream().filter(o -> o.resource().equals(resource)).toList();
    assertTrue(mine.size() >= 3, "the plan observes at least 3 fields on " + resource + ": " + mine);
    Observation o = mine.get(1);
    return o.start().plusSeconds(Duration.between(o.start(), o.end()).getSeconds() / 2);
  }

  @Test
  void aReplanWithNothingChangedKeepsEachResourcesRestWhereItWas() {
    Scenario s = network();
    Timeline previous = planned(s).timeline();
    Instant now = insideOn(previous.observations(), "south");
    ReplanResult r = Planner.replan(s, CTX, previous, now, Set.of(), Set.of(), ReplanOptions.defaults()
        .withSequencer(SequencerOptions.defaults().withTimeLimitS(5).withWorkers(2))).result();
    assertTrue(r.hasPlan(), r.message());
    // The rest of the previous plan is feasible as it stands, so the re-plan collects at least as much; at
    // equal priority the lexicographic stability level keeps every request on its resource.
    assertTrue(r.newPriority() >= r.tailPriority() - 1e-9, r.newPriority() + " < " + r.tailPriority());
    if (Math.abs(r.newPriority() - r.tailPriority()) < 1e-9) {
      assertEquals(r.tailRequests(), r.keptRequests(), "every tail request kept: " + r.timeline().observations());
    }
    Map<String, Observation> before = previous.observations().stream()
        .collect(Collectors.toMap(Observation::id, o -> o));
    for (Observation o : r.timeline().observations()) {
      if (o.start().isBefore(now)) {
        Observation was = before.get(o.id());
        assertEquals(was.start(), o.start(), o.id());
        assertEquals(was.resource(), o.resource(), o.id());
        assertEquals(o.end().isAfter(now) ? Observation.RUNNING : Observation.DONE, o.state(), o.id());
      } else {
        assertEquals(Observation.PLANNED, o.state(), o.id());
      }
    }
    // On the south site nothing new starts before its running observation ends.
    Observation running = r.timeline().observations().stream()
        .filter(o -> Observation.RUNNING.equals(o.state()) && o.resource().equals("south")).findFirst().orElseThrow();
    for (Observation o : r.timeline().observations()) {
      if (o.resource().equals("south") && Observation.PLANNED.equals(o.state())) {
        assertTrue(!o.start().isBefore(running.end()), o.id() + " starts before " + running.id() + " ends");
      }
    }
  }

  @Test
  void oneSiteLostMidNightTheOtherKeepsGoingAndTakesWhatItCan() {
    Scenario s = network();
    Timeline previous = planned(s).timeline();
    Instant now = insideOn(previous.observations(), "north");
    ReplanResult r = Planner.replan(s, CTX, previous, now, Set.of(), Set.of(), ReplanOptions.defaults()
        .withSequencer(SequencerOptions.defaults().withTimeLimitS(5).withWorkers(2))
        .withUnavailable(Set.of("north"))).result();
    assertTrue(r.hasPlan(), r.message());
    Observation lost = previous.observations().stream().filter(o -> o.resource().equals("north")
        && o.start().isBefore(now) && o.end().isAfter(now)).findFirst().orElseThrow();
    Set<String> in = r.timeline().observations().stream().map(Observation::id).collect(Collectors.toSet());
    for (Observation o : r.timeline().observations()) {
      if (o.resource().equals("north")) {
        assertTrue(o.end().isBefore(now) || o.end().equals(now), "nothing on north after it is lost: " + o);
      }
      if (o.id().equals(lost.id())) {
        assertEquals("south", o.resource(), "the observation lost with north is observed again only on south");
      }
    }
    assertTrue(in.contains("PINNED"), "the required request restricted to south stays in the plan");
    assertTrue(r.notes().contains(lost.id() + " was running on north"), r.notes());
    // The south site's rest of the night is still feasible: the re-plan collects at least that much more.
    double southTail = previous.observations().stream().filter(o -> o.resource().equals("south")
        && !o.start().isBefore(now)).mapToDouble(o -> s.request(o.id()).orElseThrow().priority()).sum();
    assertTrue(r.newPriority() >= southTail - 1e-9, r.newPriority() + " < " + southTail);
    // What only north could observe, still ahead, is listed with the reason.
    for (Observation o : previous.observations()) {
      if (o.id().equals("NORTHERN") && !o.start().isBefore(now)) {
        String why = r.timeline().unscheduled().stream().filter(u -> u.id().equals("NORTHERN")).findFirst()
            .orElseThrow().reason();
        assertEquals(Replanner.RESOURCES_UNAVAILABLE, why);
      }
    }
  }

  @Test
  void badReplanningInputNamesItsField() {
    Scenario s = network();
    Timeline previous = Planner.plan(s, CTX, SequencerOptions.defaults().withSolver(SequencerOptions.Solver.GREEDY)
        .withTimeLimitS(5)).timeline();
    Instant now = previous.observations().get(1).start();
    ScenarioException unknown = assertThrows(ScenarioException.class, () -> Planner.replan(s, CTX, previous, now,
        Set.of(), Set.of(), ReplanOptions.defaults().withUnavailable(Set.of("west"))));
    assertEquals("unavailable", unknown.problems().get(0).path());
    assertTrue(unknown.problems().get(0).message().contains("\"west\""), unknown.getMessage());
    List<Observation> noResource = new ArrayList<>(previous.observations());
    noResource.set(0, noResource.get(0).withResource(null));
    Timeline stripped = new Timeline(previous.status(), previous.priority(), previous.slewSeconds(),
        previous.bound(), noResource, previous.unscheduled());
    ScenarioException missing = assertThrows(ScenarioException.class, () -> Planner.replan(s, CTX, stripped, now,
        Set.of(), Set.of(), ReplanOptions.defaults()));
    assertEquals("previous", missing.problems().get(0).path());
    assertTrue(missing.problems().get(0).message().contains(".resource: missing"), missing.getMessage());
  }
}
