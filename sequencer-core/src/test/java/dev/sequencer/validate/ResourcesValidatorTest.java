package dev.sequencer.validate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Group;
import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.model.Visits;
import dev.sequencer.validate.Violation.Kind;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The independent validator on scenarios with several resources (format addition A6), each rule with a
 * planted violation. Most cases: a hand-made hour without observer, two resources "ridge" (a slew table,
 * 15 s between different requests except A→B 20 s, D→B 10 s, A→D 25 s; 5 s from the start) and "mesa"
 * (every slew 30 s, the first one too); requests A, B (the sameResource group G), C (ridge only), D
 * (required), E and V (2 visits at least 300 s apart), each with the own window [0, 3600] s. The valid plan
 * (seconds from the start): ridge A [100, 200], B [300, 400], C [500, 560], V2 [800, 840]; mesa D [210, 260],
 * E [300, 380], V1 [420, 460]. D starts 10 s after A ends and E overlaps B: both fine on different
 * resources. Ground cases: invented sites, stars whose elevation or hour angle is known without the code
 * under test.
 */
class ResourcesValidatorTest {
  private static final AstroContext CTX = AstroContext.offline();
  private static final Instant T0 = Instant.parse("2031-05-04T18:00:00Z");
  private static final String RIDGE = "ridge";
  private static final String MESA = "mesa";
  private static final List<String> IDS = List.of("A", "B", "C", "D", "E", "V");

  private static final List<Request> REQUESTS = List.of(
      request("A", 100, 1), request("B", 100, 2), request("C", 60, 3).withResources(List.of(RIDGE)),
      request("D", 50, 1).withRequired(true), request("E", 80, 2),
      request("V", 40, 1).withVisits(new Visits(2, 300, null, false, false)));
  private static final Scenario SCENARIO = new Scenario(1, "two resources", new TimeWindow(T0, T0.plusSeconds(3600)),
      null, Constraints.none(), new SlewSettings.Fixed(0), null, REQUESTS, null,
      List.of(new Group("G", List.of("A", "B"), false, false, null, true)), null, null,
      List.of(new Resource(RIDGE, null, ridgeTable(), null, null, null),
          new Resource(MESA, null, new SlewSettings.Fixed(30), null, null, null)));
  private static final PlanValidator VALIDATOR = PlanValidator.of(SCENARIO, CTX);

  private static Request request(String id, double durationS, double priority) {
    return new Request(id, null, durationS, priority, false, List.of(new TimeWindow(T0, T0.plusSeconds(3600))), null);
  }

  /** Ridge's table by file order A, B, C, D, E, V: 15 s between different requests, three exceptions. */
  private static SlewSettings ridgeTable() {
    List<List<Double>> rows = new ArrayList<>();
    for (String from : IDS) {
      List<Double> row = new ArrayList<>();
      for (String to : IDS) {
        String leg = from + to;
        row.add(from.equals(to) ? 0.0 : leg.equals("AB") ? 20.0 : leg.equals("DB") ? 10.0 : leg.equals("AD") ? 25.0
            : 15.0);
      }
      rows.add(row);
    }
    return new SlewSettings.Matrix(rows, List.of(5.0, 5.0, 5.0, 5.0, 5.0, 5.0));
  }

  private static Observation obs(String id, String resource, long start, long dur, double slew) {
    return Observation.of(id, T0.plusSeconds(start), T0.plusSeconds(start + dur), slew).withResource(resource);
  }

  private static Observation visit(String resource, long start, double slew, int k) {
    return obs("V", resource, start, 40, slew).withVisit(k);
  }

  /** The valid plan, in time order (B and E both start at 300 s). */
  private static List<Observation> valid() {
    return new ArrayList<>(List.of(obs("A", RIDGE, 100, 100, 5), obs("D", MESA, 210, 50, 30),
        obs("B", RIDGE, 300, 100, 20), obs("E", MESA, 300, 80, 30), visit(MESA, 420, 30, 1),
        obs("C", RIDGE, 500, 60, 15), visit(RIDGE, 800, 15, 2)));
  }

  /** A timeline of these observations sorted by start (stable), with totals summed and these unscheduled. */
  private static Timeline timeline(List<Observation> o, Unscheduled... unscheduled) {
    List<Observation> sorted = o.stream().sorted(Comparator.comparing(Observation::start)).toList();
    return listed(sorted, unscheduled);
  }

  /** A timeline of these observations of {@link #REQUESTS} in the order given. */
  private static Timeline listed(List<Observation> o, Unscheduled... unscheduled) {
    return listed(REQUESTS, o, unscheduled);
  }

  /** A timeline of these observations of {@code requests} in the order given, with totals summed. */
  private static Timeline listed(List<Request> requests, List<Observation> o, Unscheduled... unscheduled) {
    double priority = 0;
    double slew = 0;
    for (Observation x : o) {
      priority += requests.stream().filter(r -> r.id().equals(x.id())).findFirst().map(Request::priority).orElse(0.0);
      slew += x.slewSeconds();
    }
    return new Timeline(PlanStatus.FEASIBLE, priority, slew, null, o, List.of(unscheduled));
  }

  /** The only violation of {@code t} under {@code v}; fails when there are none or several. */
  private static Violation only(PlanValidator v, Timeline t) {
    List<Violation> found = v.check(t);
    assertEquals(1, found.size(), Violation.words(found).toString());
    return found.get(0);
  }

  private static void assertViolation(Violation v, Kind kind, String requestId, double value, double limit,
      String... fragments) {
    assertEquals(kind, v.kind(), v.message());
    assertEquals(requestId, v.requestId(), v.message());
    assertEquals(value, v.value(), 1e-6, v.message());
    assertEquals(limit, v.limit(), 1e-6, v.message());
    for (String f : fragments) {
      assertTrue(v.message().contains(f), "'" + v.message() + "' should contain '" + f + "'");
    }
  }

  @Test
  void theValidPlanOnTwoResourcesHasNoViolations() {
    assertEquals(List.of(), VALIDATOR.violations(timeline(valid())));
  }

  @Test
  void theSameGapOnOneResourceIsTooShort() {
    // D moved from mesa to ridge keeps its start 10 s after A ends, but on ridge A -> D takes 25 s; B's slew
    // is then from D (10 s), so only D's gap is wrong.
    List<Observation> o = valid();
    o.set(1, obs("D", RIDGE, 210, 50, 25));
    o.set(2, obs("B", RIDGE, 300, 100, 10));
    assertViolation(only(VALIDATOR, timeline(o)), Kind.GAP_TOO_SHORT, "D", 10, 25, "resource ridge:",
        "gap after A is 10.000 s");
  }

  @Test
  void aGapIsMeasuredFromThePreviousObservationOnTheSameResource() {
    // Ridge: B starts 15 s after A ends, A -> B takes 20 s. Measured from the observation that ends last
    // before B on any resource (D on mesa, ending 13 s before B; D -> B takes 10 s) it would pass.
    List<Observation> o = valid();
    o.set(1, obs("D", MESA, 152, 50, 30));
    o.set(2, obs("B", RIDGE, 215, 100, 20));
    assertViolation(only(VALIDATOR, timeline(o)), Kind.GAP_TOO_SHORT, "B", 15, 20, "resource ridge:",
        "gap after A is 15.000 s");
  }

  @Test
  void slewSecondsIsTheTransitionFromTheSameResource() {
    // 10 s is D -> B, as if measured from D, which ends last before B but on mesa.
    List<Observation> o = valid();
    o.set(2, obs("B", RIDGE, 300, 100, 10));
    assertViolation(only(VALIDATOR, timeline(o)), Kind.SLEW_SECONDS, "B", 10, 20, "resource ridge:", "from A");
  }

  @Test
  void anOverlapOnOneResourceIsRejected() {
    // E [240, 320] overlaps D [210, 260] on mesa by 20 s (and misses its 30 s slew); B on ridge overlaps it
    // too, which is allowed.
    List<Observation> o = valid();
    o.set(3, obs("E", MESA, 240, 80, 30));
    List<Violation> v = VALIDATOR.check(timeline(o));
    assertEquals(2, v.size(), Violation.words(v).toString());
    assertViolation(v.get(0), Kind.OVERLAP, "E", 20, 0, "resource mesa:", "before D ends");
    assertViolation(v.get(1), Kind.GAP_TOO_SHORT, "E", -20, 30, "resource mesa:");
  }

  @Test
  void aResourceTheRequestDoesNotAllowIsRejected() {
    // C (ridge only) on mesa, 40 s after V1 ends; ridge goes B -> V2 (15 s).
    List<Observation> o = valid();
    o.set(5, obs("C", MESA, 500, 60, 30));
    Violation v = only(VALIDATOR, timeline(o));
    assertEquals(Kind.RESOURCE_NOT_ALLOWED, v.kind(), v.message());
    assertEquals("C", v.requestId());
    assertEquals(T0.plusSeconds(500), v.instant());
    assertTrue(v.message().contains("made by resource mesa, but request C allows only [ridge]"), v.message());
  }

  @Test
  void anUnknownResourceIsRejected() {
    List<Observation> o = valid();
    o.set(5, obs("C", "summit", 500, 60, 30));
    Violation v = only(VALIDATOR, timeline(o));
    assertEquals(Kind.RESOURCE_UNKNOWN, v.kind(), v.message());
    assertTrue(v.message().contains("resource \"summit\" is none of the scenario's resources [ridge, mesa]"),
        v.message());
  }

  @Test
  void aMissingResourceIsRejected() {
    List<Observation> o = valid();
    o.set(5, obs("C", null, 500, 60, 30));
    Violation v = only(VALIDATOR, timeline(o));
    assertEquals(Kind.RESOURCE_MISSING, v.kind(), v.message());
    assertTrue(v.message().startsWith("observation C at 2031-05-04T18:08:20Z: no resource"), v.message());
  }

  @Test
  void aResourceWithOneObserverIsRejected() {
    // The same requests with one observer (ridge's table at the top level): A may not name a resource.
    Scenario one = new Scenario(1, "one observer", SCENARIO.horizon(), null, Constraints.none(), ridgeTable(), null,
        REQUESTS, null);
    Timeline t = listed(List.of(obs("A", RIDGE, 100, 100, 5), obs("D", null, 300, 50, 25)),
        new Unscheduled("B", "x"), new Unscheduled("C", "x"), new Unscheduled("E", "x"), new Unscheduled("V", "x"));
    Violation v = only(PlanValidator.of(one, CTX), t);
    assertEquals(Kind.RESOURCE_UNKNOWN, v.kind(), v.message());
    assertTrue(v.message().contains("resource \"ridge\" given, but the scenario has one observer"), v.message());
  }

  @Test
  void aRequestObservedOnTwoResourcesIsListedTwice() {
    // E again on ridge after C (15 s), and V2 after it (15 s): each resource's sequence is valid.
    List<Observation> o = valid();
    o.add(obs("E", RIDGE, 600, 80, 15));
    assertViolation(only(VALIDATOR, timeline(o)), Kind.NOT_LISTED_ONCE, "E", 2, 1, "observed 2 times");
  }

  @Test
  void aMissingRequiredRequestIsRejectedUnlessIgnored() {
    List<Observation> o = valid();
    o.remove(1); // D; E is then mesa's first observation (30 s from the start, as before)
    Timeline t = timeline(o, new Unscheduled("D", "lost to conflicts"));
    Violation v = only(VALIDATOR, t);
    assertEquals(Kind.REQUIRED_MISSING, v.kind(), v.message());
    assertEquals("D", v.requestId());
    assertEquals(List.of(), VALIDATOR.withRequiredIgnored().check(t));
  }

  @Test
  void visitsOnTwoResourcesAreSeparatedOverTheWholeTimeline() {
    // V1 on mesa at 420 s, V2 on ridge at 650 s: 230 s apart, minSeparationS 300.
    List<Observation> o = valid();
    o.set(6, visit(RIDGE, 650, 15, 2));
    assertViolation(only(VALIDATOR, timeline(o)), Kind.VISIT_SEPARATION, "V", 230, 300, "less than minSeparationS");
    o = valid();
    o.set(6, visit(RIDGE, 800, 15, 1)); // numbered per resource instead of over the timeline
    Violation v = only(VALIDATOR, timeline(o));
    assertEquals(Kind.VISIT_COUNT, v.kind(), v.message());
    assertTrue(v.message().contains("visit is 1, expected 2"), v.message());
  }

  @Test
  void aSameResourceGroupOnTwoResourcesIsRejected() {
    // B on mesa [500, 600], 40 s after V1; ridge then goes A -> C (15 s).
    List<Observation> o = valid();
    o.set(2, obs("B", MESA, 500, 100, 30));
    Violation v = only(VALIDATOR, timeline(o));
    assertEquals(Kind.GROUP_RESOURCE, v.kind(), v.message());
    assertEquals("B", v.requestId());
    assertTrue(v.message().contains("group G keeps its members on one resource (sameResource), but B at "
        + "2031-05-04T18:08:20Z is observed on mesa while A is on ridge"), v.message());
  }

  @Test
  void observationsOutOfTimeOrderAreRejected() {
    // D (210 s) listed before A (100 s): each resource's own order is still right.
    List<Observation> o = valid();
    o.set(0, valid().get(1));
    o.set(1, valid().get(0));
    assertViolation(only(VALIDATOR, listed(o)), Kind.TIME_ORDER, "A", 110, 0, "listed before it");
  }

  @Test
  void legsIntoDoneAndRunningObservationsAreHistoryOnEveryResource() {
    // A done and D running, both written with slewSeconds 0 (5 s and 30 s are right): re-planned at 250 s
    // their legs are history on both resources; without now both are wrong.
    List<Observation> o = valid();
    o.set(0, new Observation("A", T0.plusSeconds(100), T0.plusSeconds(200), 0, null, Observation.DONE)
        .withResource(RIDGE));
    o.set(1, new Observation("D", T0.plusSeconds(210), T0.plusSeconds(260), 0, null, Observation.RUNNING)
        .withResource(MESA));
    assertEquals(List.of(), VALIDATOR.withNow(T0.plusSeconds(250)).check(timeline(o)));
    List<Violation> v = VALIDATOR.check(timeline(o));
    assertEquals(List.of(Kind.SLEW_SECONDS, Kind.SLEW_SECONDS), v.stream().map(Violation::kind).toList());
    assertTrue(v.get(0).message().startsWith("resource ridge: observation A"), v.get(0).message());
    assertTrue(v.get(1).message().startsWith("resource mesa: observation D"), v.get(1).message());
  }

  @Test
  void aStricterResourceElevationMinimumRejectsWhatTheOtherResourceMayObserve() {
    // A star 1 deg from the north celestial pole stands at the site's latitude within about 1.2 deg at any
    // time (1 deg of polar distance plus under 0.2 deg of precession of the pole since J2000): about 45 deg
    // from ridge (latitude 45 deg, its own elevationMinDeg 50) and 20 deg from mesa (latitude 20 deg, the
    // scenario's elevationMinDeg 10). Fixed 10 s slews, observations from 600 s to 900 s.
    Request p = Request.of("P", new RaDec(40, 89), 300, 1);
    Scenario s = new Scenario(1, "two sites", new TimeWindow(T0, T0.plusSeconds(3600)), null,
        Constraints.builder().elevationMinDeg(10).build(), new SlewSettings.Fixed(0), null, List.of(p), null,
        List.of(), null, null, List.of(
            new Resource(RIDGE, new GroundSite(45.0, 10.0, 1200, List.of()), new SlewSettings.Fixed(10), null,
                ConstraintOverrides.setting(Constraints.builder().elevationMinDeg(50).build()), null),
            new Resource(MESA, new GroundSite(20.0, -40.0, 300, List.of()), new SlewSettings.Fixed(10), null, null,
                null)));
    PlanValidator validator = PlanValidator.of(s, CTX);
    assertEquals(List.of(), validator.check(listed(List.of(p), List.of(obs("P", MESA, 600, 300, 10)))));
    Violation v = only(validator, listed(List.of(p), List.of(obs("P", RIDGE, 600, 300, 10))));
    assertEquals(Kind.ELEVATION_MIN, v.kind(), v.message());
    assertEquals(50, v.limit(), 1e-9);
    assertEquals(45, v.value(), 1.2, v.message());
    assertTrue(v.message().startsWith("resource ridge: "), v.message());
  }

  @Test
  void onePerWindowMergesTheWindowsOfTheAllowedResources() {
    // Two telescopes on one invented site (latitude 30 deg, longitude 10 deg E) and an equatorial star that
    // culminates 3 h after the start. Ridge may observe it at hour angles [-2 h, 0 h], mesa at [-0.5 h, 2 h]:
    // merged, one window, so visit 1 on ridge (hour angle about -1.5 h) and visit 2 on mesa (about +1 h) share
    // it although each lies in a different resource's window. With mesa at [0.5 h, 2 h] the merged windows
    // leave a gap of half an hour between them and the same visits are fine.
    Request w = Request.of("W", new RaDec(raCulminatingAt(T0.plusSeconds(3 * 3600), 10.0), 0), 300, 1)
        .withVisits(new Visits(2, 0, null, true, false));
    Timeline t = listed(List.of(w), List.of(
        Observation.of("W", T0.plusSeconds(5400), T0.plusSeconds(5700), 10).withResource(RIDGE).withVisit(1),
        Observation.of("W", T0.plusSeconds(14400), T0.plusSeconds(14700), 10).withResource(MESA).withVisit(2)));
    Violation v = only(PlanValidator.of(telescopes(w, -0.5), CTX), t);
    assertEquals(Kind.VISIT_SAME_WINDOW, v.kind(), v.message());
    assertTrue(v.message().contains("visits 1 and 2 of W lie in one visibility window"), v.message());
    assertEquals(List.of(), PlanValidator.of(telescopes(w, 0.5), CTX).check(t));
  }

  /** Ridge and mesa on one site with hour-angle limits [-2 h, 0 h] and [mesaMinH, 2 h]; fixed 10 s slews. */
  private static Scenario telescopes(Request w, double mesaMinH) {
    GroundSite site = new GroundSite(30.0, 10.0, 800, List.of());
    return new Scenario(1, "two telescopes", new TimeWindow(T0, T0.plusSeconds(6 * 3600)), null, Constraints.none(),
        new SlewSettings.Fixed(0), null, List.of(w), null, List.of(), null, null, List.of(
            new Resource(RIDGE, site, new SlewSettings.Fixed(10), null,
                ConstraintOverrides.setting(Constraints.builder().hourAngleMinH(-2).hourAngleMaxH(0).build()), null),
            new Resource(MESA, site, new SlewSettings.Fixed(10), null,
                ConstraintOverrides.setting(Constraints.builder().hourAngleMinH(mesaMinH).hourAngleMaxH(2).build()),
                null)));
  }

  /**
   * The right ascension (deg) on the local meridian at {@code t} for east longitude {@code lonDeg}: Greenwich
   * mean sidereal time from Meeus, Astronomical Algorithms, 2nd ed., eq. 12.4 (UTC for UT1; the T^2 term,
   * under 0.0001 deg here, dropped), plus the longitude. Precession of the catalogue RA to the date and the
   * equation of the equinoxes move the culmination by about 2 min, far from every edge used.
   */
  private static double raCulminatingAt(Instant t, double lonDeg) {
    double jd = 2440587.5 + t.getEpochSecond() / 86400.0;
    double gmst = 280.46061837 + 360.98564736629 * (jd - 2451545.0);
    return ((gmst + lonDeg) % 360 + 360) % 360;
  }
}
