package dev.sequencer.planner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.sequence.Sequencer;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.SequencerResult;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.slew.Transitions;
import dev.sequencer.validate.PlanValidator;
import dev.sequencer.validate.Violation;
import dev.sequencer.validate.Violation.Kind;
import dev.sequencer.visibility.VisibilityCalculator;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

/**
 * The independent validator catches what the planner's own check cannot: wrong slew times (a test double of
 * the planner's transitions), and observations moved into a binding mask, before twilight ends, or 2 s across
 * a window edge; and it agrees with the planner on generated scenarios of every kind (valid plans pass,
 * perturbed ones fail). Instants of the edge cases are taken from the planner's visibility engine; the verdicts
 * are the validator's own.
 */
class IndependentValidatorTest {
  private static final AstroContext CTX = AstroContext.offline();

  /** The planner's transitions with every time scaled: a planted slew-time bug. */
  private record Scaled(Transitions t, double factor) implements Transitions {
    @Override
    public int size() {
      return t.size();
    }

    @Override
    public double boundS(int from, int to, double a, double b, double c, double d) {
      return factor * t.boundS(from, to, a, b, c, d);
    }

    @Override
    public double[] exactS(int[] order, double[] departureS, double[] arrivalS) {
      double[] x = t.exactS(order, departureS, arrivalS);
      for (int i = 0; i < x.length; i++) {
        x[i] *= factor;
      }
      return x;
    }

    @Override
    public boolean exactMayExceedBound() {
      return t.exactMayExceedBound();
    }

    @Override
    public boolean timeDependent() {
      return t.timeDependent();
    }
  }

  private static Set<Kind> kinds(List<Violation> v) {
    return v.stream().map(Violation::kind).collect(Collectors.toSet());
  }

  @Test
  void slewTimesNinetyPercentOfTheTruthFailThePlan() {
    for (FuzzScenarios.Kind kind : List.of(FuzzScenarios.Kind.GROUND_FIELDS_ALTAZ, FuzzScenarios.Kind.LEO_TLE_FIELDS,
        FuzzScenarios.Kind.STATION_TLE_ALTAZ)) {
      Scenario s = FuzzScenarios.generate(kind, 5, CTX).withSlew(noKeepOut(FuzzScenarios.generate(kind, 5, CTX).slew()));
      Geometry g = Planner.geometry(s, CTX);
      SequencerOptions o = SequencerOptions.defaults().withTimeLimitS(2).withSolver(SequencerOptions.Solver.GREEDY)
          .withRelaxationBound(false);
      // Built with the false times; the sequencer's self-check uses them too, so it passes.
      SequencerResult r = new Sequencer().plan(PlanningProblem.of(s, g.windows(), new Scaled(g.transitions(), 0.9)), o);
      assertTrue(r.hasPlan(), kind + ": " + r.message());
      Timeline t = r.toTimeline();
      List<String> moving = t.observations().stream().filter(x -> x.slewSeconds() > 0.01).map(Observation::id).toList();
      assertFalse(moving.isEmpty(), kind + ": no slew to check");
      List<Violation> v = PlanValidator.of(s, CTX).check(t);
      Set<String> caught = v.stream().filter(x -> x.kind() == Kind.SLEW_SECONDS).map(Violation::requestId)
          .collect(Collectors.toSet());
      assertEquals(Set.copyOf(moving), caught, kind + ": " + Violation.words(v));
      // The control: the same sequencer with the true times gives a plan the validator accepts.
      SequencerResult ok = new Sequencer().plan(PlanningProblem.of(s, g.windows(), g.transitions()), o);
      assertEquals(List.of(), PlanValidator.of(s, CTX).check(ok.toTimeline()), kind.toString());
    }
  }

  private static SlewSettings noKeepOut(SlewSettings s) {
    return s instanceof SlewSettings.Eigenaxis e ? e.withKeepOutDuringSlew(false)
        : s instanceof SlewSettings.AltAz a ? a.withKeepOutDuringSlew(false) : s;
  }

  // ---- moved into a binding mask, before twilight ends, across a window edge by 2 s ----

  private static final GroundSite SITE = new GroundSite(30.0, 15.0, 900,
      List.of(new AzEl(50, 0), new AzEl(60, 45), new AzEl(120, 45), new AzEl(130, 0)));
  private static final Instant MIDNIGHT = Instant.parse("2031-03-21T23:00:00Z"); // about local midnight at 15 E

  /** Local sidereal time, degrees (Meeus, Astronomical Algorithms, 2nd ed., eq. 12.4; to pick targets only). */
  private static double lstDeg(Instant t, double lonDeg) {
    double jd = t.getEpochSecond() / 86400.0 + 2440587.5;
    return ((280.46061837 + 360.98564736629 * (jd - 2451545.0) + lonDeg) % 360 + 360) % 360;
  }

  private static Scenario night(List<Request> requests) {
    return new Scenario(1, "edges", new TimeWindow(MIDNIGHT.minusSeconds(7 * 3600), MIDNIGHT.plusSeconds(7 * 3600)),
        SITE, Constraints.builder().elevationMinDeg(20.0).sunElevationMaxDeg(-12.0).build(), new SlewSettings.Fixed(0),
        null, requests, null);
  }

  private static Timeline single(Scenario s, String id, Instant start, double durationS) {
    List<Unscheduled> un = s.requests().stream().filter(r -> !r.id().equals(id))
        .map(r -> new Unscheduled(r.id(), "lost to conflicts")).toList();
    double priority = s.request(id).orElseThrow().priority();
    return new Timeline(PlanStatus.FEASIBLE, priority, 0, null,
        List.of(Observation.of(id, start, start.plusMillis((long) (durationS * 1000)), 0)), un);
  }

  @Test
  void maskTwilightAndWindowEdgesEachFailWithTheirKind() {
    double lst = lstDeg(MIDNIGHT, SITE.longitudeDeg());
    // TWILIGHT: high in the evening sky, up long before the Sun is 12 deg down: its first window opens at
    // the end of twilight. MASK: rises in the east behind the 45 deg mask (azimuths 60-120) after midnight.
    // SETS: sets in the west (no mask) through 20 deg after midnight. OWN: always up, its own window.
    Request twilight = Request.of("TWILIGHT", new RaDec((lst - 90 + 360) % 360, 30), 60, 1);
    Request mask = Request.of("MASK", new RaDec((lst + 80) % 360, 5), 60, 1);
    Request sets = Request.of("SETS", new RaDec((lst - 30 + 360) % 360, 0), 60, 1);
    Instant ownEnd = MIDNIGHT.plusSeconds(1800);
    Request own = Request.of("OWN", new RaDec(lst, 30), 60, 1)
        .withWindows(List.of(new TimeWindow(MIDNIGHT.minusSeconds(1800), ownEnd)));
    Scenario s = night(List.of(twilight, mask, sets, own));
    var vis = new VisibilityCalculator(CTX).compute(s);
    PlanValidator v = PlanValidator.of(s, CTX);
    TimeWindow wTwilight = vis.get(0).intervals().get(0);
    TimeWindow wMask = vis.get(1).intervals().get(0);
    TimeWindow wSets = vis.get(2).intervals().get(vis.get(2).intervals().size() - 1);
    TimeWindow wOwn = vis.get(3).intervals().get(0);
    assertEquals(ownEnd, wOwn.end(), "OWN's window ends at its own window's end");

    // At the edges: valid.
    assertEquals(List.of(), v.check(single(s, "TWILIGHT", wTwilight.start(), 60)));
    assertEquals(List.of(), v.check(single(s, "MASK", wMask.start(), 60)));
    assertEquals(List.of(), v.check(single(s, "SETS", wSets.end().minusSeconds(60), 60)));
    assertEquals(List.of(), v.check(single(s, "OWN", ownEnd.minusSeconds(60), 60)));
    // 2 s across: each fails with its own kind, for its request, at the offending instant.
    assertOne(v.check(single(s, "TWILIGHT", wTwilight.start().minusSeconds(2), 60)), Kind.SUN_ELEVATION_MAX,
        "TWILIGHT", wTwilight.start().minusSeconds(2));
    assertOne(v.check(single(s, "MASK", wMask.start().minusSeconds(2), 60)), Kind.HORIZON_MASK, "MASK",
        wMask.start().minusSeconds(2));
    assertOne(v.check(single(s, "SETS", wSets.end().minusSeconds(58), 60)), Kind.ELEVATION_MIN, "SETS",
        wSets.end().plusSeconds(2));
    assertOne(v.check(single(s, "OWN", ownEnd.minusSeconds(58), 60)), Kind.OUTSIDE_REQUEST_WINDOW, "OWN",
        ownEnd.minusSeconds(58));
    // Deep inside the mask: still the mask.
    assertOne(v.check(single(s, "MASK", wMask.start().minusSeconds(1200), 60)), Kind.HORIZON_MASK, "MASK",
        wMask.start().minusSeconds(1200));
  }

  private static void assertOne(List<Violation> v, Kind kind, String id, Instant at) {
    assertEquals(1, v.size(), Violation.words(v).toString());
    assertEquals(kind, v.get(0).kind(), v.get(0).message());
    assertEquals(id, v.get(0).requestId());
    assertEquals(at, v.get(0).instant(), v.get(0).message());
    if (kind != Kind.OUTSIDE_REQUEST_WINDOW) {
      assertTrue(Double.isFinite(v.get(0).value()) && Double.isFinite(v.get(0).limit()), v.get(0).message());
    }
  }

  // ---- agreement over generated scenarios of every kind ----

  @Test
  void plannerPlansPassAndPerturbedPlansFail() {
    int perturbed = 0;
    for (FuzzScenarios.Kind kind : FuzzScenarios.Kind.values()) {
      for (long seed = 1; seed <= 2; seed++) {
        Scenario s = FuzzScenarios.generate(kind, seed, CTX);
        PlanOutcome o = Planner.plan(s, CTX, SequencerOptions.defaults().withTimeLimitS(2).withWorkers(1));
        if (!o.result().hasPlan()) {
          continue;
        }
        Timeline t = o.timeline();
        String what = kind + " seed " + seed;
        PlanValidator v = Planner.validator(s, CTX);
        assertEquals(List.of(), v.check(t), what); // the façade checked it already; again, explicitly
        List<Observation> obs = t.observations();
        for (int k = 0; k < obs.size(); k++) {
          Observation x = obs.get(k);
          if (x.slewSeconds() > 0.01) {
            // The written slew time 10 % short.
            assertTrue(kinds(v.check(replace(t, k, new Observation(x.id(), x.start(), x.end(), 0.9 * x.slewSeconds(),
                x.value(), x.state())))).contains(Kind.SLEW_SECONDS), what + " " + x.id());
            perturbed++;
          }
          Instant gapStart = k == 0 ? s.horizon().start() : obs.get(k - 1).end();
          double slack = java.time.Duration.between(gapStart, x.start()).toMillis() / 1000.0 - x.slewSeconds();
          if (x.slewSeconds() > 1) {
            // The gap 0.5 s shorter than the slew (the observation moved earlier, its slewSeconds kept).
            long ms = (long) ((slack + 0.5) * 1000);
            Observation early = new Observation(x.id(), x.start().minusMillis(ms), x.end().minusMillis(ms),
                x.slewSeconds(), x.value(), x.state());
            // Usually GAP_TOO_SHORT (or SLEW_SECONDS for moving targets); a satellite may also be out of reach then.
            Set<Kind> got = kinds(v.check(replace(t, k, early)));
            assertFalse(got.isEmpty(), what + " " + x.id());
            perturbed++;
          }
        }
        if (!obs.isEmpty()) {
          // An observation dropped from the plan: listed nowhere.
          List<Observation> fewer = new ArrayList<>(obs.subList(1, obs.size()));
          Timeline dropped = new Timeline(t.status(), t.priority(), t.slewSeconds(), t.bound(), fewer, t.unscheduled());
          assertTrue(v.check(dropped).stream().anyMatch(x -> x.kind() == Kind.NOT_LISTED_ONCE
              && x.requestId().equals(obs.get(0).id())), what);
        }
      }
    }
    assertTrue(perturbed >= 50, "perturbations tried: " + perturbed);
  }

  private static Timeline replace(Timeline t, int k, Observation x) {
    List<Observation> obs = new ArrayList<>(t.observations());
    double slew = t.slewSeconds() - obs.get(k).slewSeconds() + x.slewSeconds();
    obs.set(k, x);
    return new Timeline(t.status(), t.priority(), slew, t.bound(), obs, t.unscheduled());
  }
}
