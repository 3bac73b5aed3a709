package dev.sequencer.charts;

import dev.sequencer.model.AzEl;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Group;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.Observer;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Reconfiguration;
import dev.sequencer.model.Request;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Visits;
import dev.sequencer.planner.PlanOutcome;
import dev.sequencer.planner.Planner;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.visibility.SkyValues;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Scenarios built in code from invented sites, orbits and ids (none is a real observatory, mission or person),
 * each planned once per test run through the {@link Planner} façade as {@link NetworkPlans} plans the bundled ones
 * (CP-SAT, reproducible work limit, 2 workers): a night at one site with groups, visits and configurations (A4,
 * A5); two sites three time zones apart with a group across them (A5, A6); two imaging spacecraft (A6).
 */
public final class InventedPlans {
  /** 2031-10-15, evening to morning at 20 deg E (Sun below -12 deg from about 17:30 to 03:30 UTC). */
  private static final TimeWindow NIGHT = new TimeWindow(Instant.parse("2031-10-15T18:00:00Z"),
      Instant.parse("2031-10-16T03:00:00Z"));
  private static final Map<String, NetworkPlans.Planned> PLANNED = new ConcurrentHashMap<>();

  private InventedPlans() {}

  /**
   * One site (30 N, 20 E): an ordered all-or-nothing chain CHAIN of three members, an unordered pair PAIR, a
   * group SOLO whose second member never rises above the elevation limit (Dec -80 deg from 30 deg N culminates
   * below the horizon), a field visited twice and two configurations with a 120 s change.
   */
  public static NetworkPlans.Planned groupsNight() {
    return PLANNED.computeIfAbsent("groups", k -> plan(new Scenario(1, "invented groups night", NIGHT,
        site(30.0, 20.0), nightConstraints(), new SlewSettings.Fixed(60), null, List.of(
            fixed("CHN-1", 350, 20, 600, 5), fixed("CHN-2", 0, 25, 600, 5), fixed("CHN-3", 10, 15, 600, 5),
            fixed("PR-1", 30, 10, 900, 4), fixed("PR-2", 40, 20, 900, 4),
            fixed("SOLO-1", 20, 5, 600, 3), fixed("SOLO-2", 20, -80, 600, 3),
            fixed("FLD-1", 15, 30, 600, 6).withVisits(new Visits(2, 3600, null, false, false))
                .withConfiguration("narrow"),
            fixed("FLD-2", 5, 0, 900, 2).withConfiguration("wide")),
        null, List.of(new Group("CHAIN", List.of("CHN-1", "CHN-2", "CHN-3"), true, true, 1200.0, false),
            new Group("PAIR", List.of("PR-1", "PR-2"), false, false, null, false),
            new Group("SOLO", List.of("SOLO-1", "SOLO-2"), false, false, null, false)),
        Reconfiguration.constant(120, false), "")));
  }

  /**
   * Two sites three nautical zones apart, east-ridge (28 N, 65 E: UTC+4) and west-mesa (32 N, 20 E: UTC+1), and
   * an ordered group RELAY whose first member only east-ridge may observe, in the east's evening, and whose second
   * only west-mesa, after 20:00 UTC: a group across two resources, planned as it is (format additions A5, A6).
   */
  public static NetworkPlans.Planned twoZones() {
    return PLANNED.computeIfAbsent("zones", k -> {
      TimeWindow horizon = new TimeWindow(Instant.parse("2031-10-15T14:00:00Z"), Instant.parse("2031-10-16T03:00:00Z"));
      List<Resource> resources = List.of(
          new Resource("east-ridge", site(28.0, 65.0), new SlewSettings.Fixed(60), null, null, null),
          new Resource("west-mesa", site(32.0, 20.0), new SlewSettings.Fixed(60), null, null, null));
      List<Request> requests = List.of(
          fixed("RLY-1", 330, 20, 900, 5).withResources(List.of("east-ridge")).withWindows(List.of(new TimeWindow(
              Instant.parse("2031-10-15T15:00:00Z"), Instant.parse("2031-10-15T18:00:00Z")))),
          fixed("RLY-2", 20, 20, 900, 5).withResources(List.of("west-mesa")).withWindows(List.of(new TimeWindow(
              Instant.parse("2031-10-15T20:00:00Z"), Instant.parse("2031-10-16T02:00:00Z")))),
          fixed("E-1", 310, 10, 900, 3).withResources(List.of("east-ridge")),
          fixed("W-1", 40, 15, 900, 3).withResources(List.of("west-mesa")),
          fixed("ANY-1", 0, 20, 900, 2));
      return plan(new Scenario(1, "invented two-zone network", horizon, null, nightConstraints(),
          new SlewSettings.Fixed(60), null, requests, null,
          List.of(new Group("RELAY", List.of("RLY-1", "RLY-2"), false, true, null, false)), Reconfiguration.NONE, "",
          resources));
    });
  }

  /**
   * Two imaging spacecraft on invented sun-synchronous-like orbits (550 km, 97.5 deg, RAAN 40 and 160 deg),
   * three hours, each with three Earth points of its own placed below its ground track (so each is seen at
   * elevation near 90 deg then), only that spacecraft allowed to observe them.
   */
  public static NetworkPlans.Planned imagingFleet() {
    return PLANNED.computeIfAbsent("fleet", k -> {
      Instant t0 = Instant.parse("2031-06-01T00:00:00Z");
      TimeWindow horizon = new TimeWindow(t0, t0.plusSeconds(3 * 3600));
      SlewSettings slew = new SlewSettings.Eigenaxis(1.0, 0.1, 10);
      List<Resource> resources = List.of(
          new Resource("imager-a", orbit(t0, 40, 0), slew, null, null, null),
          new Resource("imager-b", orbit(t0, 160, 120), slew, null, null, null));
      Scenario bare = new Scenario(1, "invented imaging fleet", horizon, null,
          Constraints.builder().elevationMinDeg(40).build(), slew, null, List.of(), null, List.of(),
          Reconfiguration.NONE, "", resources);
      List<Request> requests = new ArrayList<>();
      for (Resource r : resources) {
        SkyValues sky = SkyValues.of(bare.forResource(r), NetworkPlans.CTX);
        for (int i = 1; i <= 3; i++) {
          double[] latLon = sky.subObserverLatLonDeg(t0.plusSeconds(1500L + 2700L * i));
          requests.add(Request.of(r.id() + "-P" + i, new EarthPoint(round(latLon[0]), round(latLon[1]), 0), 30, i)
              .withResources(List.of(r.id())));
        }
      }
      return plan(bare.withRequests(requests));
    });
  }

  private static NetworkPlans.Planned plan(Scenario s) {
    PlanOutcome o = Planner.plan(s, NetworkPlans.CTX, SequencerOptions.from(s.solverOrDefaults()).withTimeLimitS(5)
        .withWorkers(2).withReproducible(5).withSolver(SequencerOptions.Solver.CPSAT));
    if (!o.result().hasPlan()) {
      throw new IllegalStateException(s.name() + ": no plan (" + o.result().status() + ")");
    }
    return new NetworkPlans.Planned(s, o.geometry(), o.timeline());
  }

  private static Observer site(double latDeg, double lonDeg) {
    return new GroundSite(latDeg, lonDeg, 900, List.<AzEl>of());
  }

  private static Observer orbit(Instant epoch, double raanDeg, double meanAnomalyDeg) {
    return new OrbitObserver(new KeplerianElements(epoch, 6928.137, 0.001, 97.5, raanDeg, 90, meanAnomalyDeg));
  }

  private static Constraints nightConstraints() {
    return Constraints.builder().elevationMinDeg(25).sunElevationMaxDeg(-12).build();
  }

  private static Request fixed(String id, double raDeg, double decDeg, double durationS, double priority) {
    return new Request(id, new RaDec(raDeg, decDeg), durationS, priority, false, List.of(), null,
        ConstraintOverrides.none());
  }

  private static double round(double deg) {
    return Math.round(deg * 1000) / 1000.0;
  }
}
