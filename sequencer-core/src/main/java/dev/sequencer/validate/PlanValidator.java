package dev.sequencer.validate;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.validate.Violation.Kind;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * The independent check of a plan: everything is derived from the {@link Scenario} itself with the
 * validator's own physics ({@link Sky}), own slew times ({@link SlewLegs}) and own constraint evaluation
 * ({@link ObservationCheck}); nothing of the planner (visibility windows, transitions, tracks) is used. It
 * shares with the planner only the model, the time layer of the {@link AstroContext} (leap seconds, time
 * scales, Earth frames, and its Sun and Moon series, since the offline Orekit context has no JPL files) and
 * Orekit itself.
 *
 * <p>Checks, each reported as a {@link Violation} of its {@link Kind}: every request listed as the format
 * says (observed once, or up to its visits, and unscheduled when some visit is missing: {@link RequestRules},
 * which also checks the visits' and groups' rules) and no unknown ids; every observation inside the horizon and inside one of the request's
 * own {@code windows}; its duration the request's (flexible requests: a grid exposure in [min, max] carrying
 * the curve's value); observations in time order without overlap; every constraint of the request at the
 * observation's start, end, every 5 s between and at the margins' local minima ({@link ObservationCheck});
 * each gap at least the transition (the slew the validator computes from the previous observation's end pointing (or the
 * start pointing) to the next one's start pointing, with the configuration change of A5), and each
 * {@code slewSeconds} equal to it; the alt-az
 * cable wrap; {@code slewStart} inside its gap; the keep-outs along every slew (A3, {@link SlewKeepOut});
 * every required request observed; the totals equal the sums.
 *
 * <p>Several resources (A6): every observation names a resource of the scenario that its request allows
 * (with one observer, none names one), and the timeline lists them by start. The observations of each
 * resource are checked as a one-observer plan ({@link ObserverCheck}, through {@link Scenario#forResource}):
 * no overlap on the resource, constraints from its observer, each transition from the previous observation
 * on the same resource; observations of different resources may overlap. Listing, required requests, visits
 * (one per window over the merged windows of the allowed resources), groups ({@code sameResource} too) and
 * totals are checked once, over the whole timeline. The re-planning instant, the required flag and the
 * keep-outs along slews apply to every resource.
 *
 * <p>Tolerance {@link #TOLERANCE_S} = 1 ms on every time comparison (slew seconds included: the two
 * independent slew computations agree to about 1e-6 s, see the tests); constraints as {@link ObservationCheck}
 * says; priority totals to 1e-9 relative. Thread-safe (one check at a time).
 */
public final class PlanValidator implements TimelineCheck {
  private static final Logger LOG = LoggerFactory.getLogger(PlanValidator.class);

  /** Time tolerance of every comparison, seconds. */
  public static final double TOLERANCE_S = 1e-3;
  /** Tolerance on a flexible observation's {@code value} against the interpolated curve. */
  public static final double VALUE_TOLERANCE = 1e-6;
  /** Sampling step of the constraints inside an observation, seconds (for cost estimates). */
  public static final double SAMPLE_STEP_S = ObservationCheck.STEP_S;

  private final Scenario scenario;
  private final AstroContext ctx;
  private final Instant now;
  private final boolean checkRequired;
  private final boolean slewKeepOuts;
  private final Map<String, Request> byId = new HashMap<>();
  /** The one observer, or one check per resource in the file's order (A6). */
  private final List<ObserverCheck> observers;

  private PlanValidator(Scenario scenario, AstroContext ctx, Instant now, boolean checkRequired, boolean slewKeepOuts) {
    this.slewKeepOuts = slewKeepOuts;
    this.scenario = Objects.requireNonNull(scenario, "scenario");
    this.ctx = Objects.requireNonNull(ctx, "ctx");
    this.now = now;
    this.checkRequired = checkRequired;
    for (Request r : scenario.requests()) {
      byId.put(r.id(), r);
    }
    this.observers = scenario.hasResources()
        ? scenario.resources().stream().map(r -> new ObserverCheck(r.id(), scenario.forResource(r), ctx, now,
            slewKeepOuts)).toList()
        : List.of(new ObserverCheck(null, scenario, ctx, now, slewKeepOuts));
  }

  /** The validator of plans for {@code scenario}, computing in {@code ctx}. */
  public static PlanValidator of(Scenario scenario, AstroContext ctx) {
    return new PlanValidator(scenario, ctx, null, true, true);
  }

  /**
   * A copy for a re-plan made at {@code newNow}: observations in state "done" or "running" must start at or
   * before it, every other (planned) one at or after it. The legs into done and running observations are
   * history and not re-checked (the mount's cable-wrap state is still carried through them); every leg into
   * a planned observation is, the first one from the end pointing of the last done or running observation
   * (of the same resource, A6).
   */
  @Override
  public PlanValidator withNow(Instant newNow) {
    return new PlanValidator(scenario, ctx, Objects.requireNonNull(newNow, "now"), checkRequired, slewKeepOuts);
  }

  /** A copy that does not ask for the required requests (part of a night, the rest still to come). */
  @Override
  public PlanValidator withRequiredIgnored() {
    return new PlanValidator(scenario, ctx, now, false, slewKeepOuts);
  }

  /**
   * A copy that checks the keep-outs during slews (A3) or not, on every resource. On by default and in the
   * façade ({@code Planner}, whose rules {@code sequencer check} shares); off only where a caller knowingly
   * accepts plans whose slews were not planned around the keep-outs.
   */
  public PlanValidator withSlewKeepOuts(boolean on) {
    return new PlanValidator(scenario, ctx, now, checkRequired, on);
  }

  /** The scenario this validator checks against. */
  public Scenario scenario() {
    return scenario;
  }

  /** Every violation of {@code timeline}, in words; empty when it is valid. */
  @Override
  public List<String> violations(Timeline timeline) {
    return Violation.words(check(timeline));
  }

  /** Every violation of {@code timeline}; empty when it is valid. */
  public synchronized List<Violation> check(Timeline timeline) {
    long t0 = System.nanoTime();
    List<Violation> out = new ArrayList<>();
    checkOncePerRequest(timeline, out);
    List<Observation> obs = timeline.observations();
    checkResources(obs, out);
    double prioritySum = 0;
    double slewSum = 0;
    for (Observation o : obs) {
      slewSum += o.slewSeconds();
      Request r = byId.get(o.id());
      if (r == null) {
        continue;
      }
      prioritySum += r.priority() != null ? r.priority() : o.value() != null ? o.value() : 0;
      checkDuration(o, r, out);
      checkHorizonAndWindows(o, r, out);
      checkNow(o, out);
    }
    for (ObserverCheck c : observers) {
      out.addAll(c.check(c.resource() == null ? obs
          : obs.stream().filter(o -> c.resource().equals(o.resource())).toList()));
    }
    for (Request r : scenario.requests()) {
      if (checkRequired && r.required() && obs.stream().noneMatch(o -> o.id().equals(r.id()))) {
        out.add(Violation.of(Kind.REQUIRED_MISSING, r.id(), null, "required request " + r.id() + " is not observed"));
      }
    }
    if (Math.abs(prioritySum - timeline.priority()) > 1e-9 * Math.max(1, Math.abs(prioritySum))) {
      out.add(Violation.of(Kind.TOTAL_PRIORITY, null, null, timeline.priority(), prioritySum, String.format(
          Locale.ROOT, "total priority: timeline says %s, observations sum to %s", timeline.priority(), prioritySum)));
    }
    if (Math.abs(slewSum - timeline.slewSeconds()) > TOLERANCE_S) {
      out.add(Violation.of(Kind.TOTAL_SLEW_SECONDS, null, null, timeline.slewSeconds(), slewSum, String.format(
          Locale.ROOT, "total slewSeconds: timeline says %.3f, observations sum to %.3f", timeline.slewSeconds(),
          slewSum)));
    }
    LOG.debug("check: {} observations, {} violations, in {} ms", obs.size(), out.size(),
        (System.nanoTime() - t0) / 1_000_000);
    return out;
  }

  private void checkOncePerRequest(Timeline timeline, List<Violation> out) {
    for (Observation o : timeline.observations()) {
      if (!byId.containsKey(o.id())) {
        out.add(Violation.of(Kind.UNKNOWN_REQUEST, o.id(), o.start(), "observation " + o.id() + ": unknown request id"));
      }
    }
    for (Unscheduled u : timeline.unscheduled()) {
      if (!byId.containsKey(u.id())) {
        out.add(Violation.of(Kind.UNKNOWN_REQUEST, u.id(), null, "unscheduled " + u.id() + ": unknown request id"));
      }
    }
    RequestRules rules = new RequestRules(scenario.requests(), scenario.groups(), this::sameWindow, checkRequired);
    out.addAll(rules.check(timeline));
  }

  /**
   * Two observations of {@code r} lie in one visibility window when every constraint of the request holds
   * from the first one's start to the second one's end (sampled and refined as inside an observation,
   * {@link ObservationCheck}) and one of the request's own windows holds that whole interval. A dip out of
   * visibility shorter than the sampling can resolve would count as the same window: the check errs on the
   * side of reporting. With several resources (A4, A6) the windows of the resources that may observe
   * {@code r} are merged first ({@link #seenThroughout}).
   */
  private boolean sameWindow(Request r, Observation first, Observation second) {
    if (!r.windows().isEmpty() && r.windows().stream().noneMatch(w -> w.contains(first.start(), second.end()))) {
      return false;
    }
    return seenThroughout(r, observers.stream().filter(c -> c.mayObserve(r)).toList(), first.start(), second.end());
  }

  /**
   * True when the merged visibility of {@code r} from the observers {@code by} covers [a, b]: one of them
   * sees it over the whole interval, or each half is covered. An interval of at most one sampling step
   * ({@link ObservationCheck#STEP_S}) that no single observer covers counts as covered when some observer
   * sees {@code r} at each of its ends: a gap between two resources' windows narrower than a step is not
   * resolved, erring on the side of reporting as with one observer.
   */
  private static boolean seenThroughout(Request r, List<ObserverCheck> by, Instant a, Instant b) {
    if (by.stream().anyMatch(c -> c.sees(r, a, b))) {
      return true;
    }
    if (by.size() < 2) {
      return false;
    }
    if (seconds(a, b) <= ObservationCheck.STEP_S) {
      return by.stream().anyMatch(c -> c.sees(r, a, a)) && by.stream().anyMatch(c -> c.sees(r, b, b));
    }
    Instant mid = a.plus(Duration.between(a, b).dividedBy(2));
    return seenThroughout(r, by, a, mid) && seenThroughout(r, by, mid, b);
  }

  /**
   * Resources (A6): with resources every observation names one of them that its request allows, and the
   * observations are listed by start (those of different resources may overlap, so the per-resource overlap
   * check cannot see the order); with one observer no observation names a resource.
   */
  private void checkResources(List<Observation> obs, List<Violation> out) {
    List<String> ids = scenario.resources().stream().map(Resource::id).toList();
    long tol = (long) (TOLERANCE_S * 1e9);
    for (int k = 0; k < obs.size(); k++) {
      Observation o = obs.get(k);
      String at = "observation " + o.id() + " at " + o.start();
      Request r = byId.get(o.id());
      if (!scenario.hasResources()) {
        if (o.resource() != null) {
          out.add(Violation.of(Kind.RESOURCE_UNKNOWN, o.id(), o.start(), at + ": resource \"" + o.resource()
              + "\" given, but the scenario has one observer and no resources"));
        }
        continue;
      }
      if (o.resource() == null) {
        out.add(Violation.of(Kind.RESOURCE_MISSING, o.id(), o.start(), at + ": no resource, but the scenario's "
            + "observations are made by its resources " + ids));
      } else if (!ids.contains(o.resource())) {
        out.add(Violation.of(Kind.RESOURCE_UNKNOWN, o.id(), o.start(), at + ": resource \"" + o.resource()
            + "\" is none of the scenario's resources " + ids));
      } else if (r != null && !r.allows(o.resource())) {
        out.add(Violation.of(Kind.RESOURCE_NOT_ALLOWED, o.id(), o.start(), at + " is made by resource "
            + o.resource() + ", but request " + o.id() + " allows only " + r.resources()));
      }
      Observation p = k > 0 ? obs.get(k - 1) : null;
      if (p != null && o.start().isBefore(p.start().minusNanos(tol))) {
        double early = seconds(o.start(), p.start());
        out.add(Violation.of(Kind.TIME_ORDER, o.id(), o.start(), early, 0, String.format(Locale.ROOT,
            "observation %s (resource %s) starts at %s, %.3f s before %s (resource %s), listed before it, starts "
                + "at %s (observations are listed in time order)", o.id(), o.resource(), o.start(), early, p.id(),
            p.resource(), p.start())));
      }
    }
  }

  /** With a re-planning instant: done/running observations start by it, planned ones at or after it. */
  private void checkNow(Observation o, List<Violation> out) {
    if (now == null) {
      return;
    }
    long tol = (long) (TOLERANCE_S * 1e9);
    boolean frozen = ObserverCheck.frozen(o, now);
    if (frozen && o.start().isAfter(now.plusNanos(tol))) {
      out.add(Violation.of(Kind.REPLAN_NOW, o.id(), o.start(), seconds(now, o.start()), 0,
          "observation " + o.id() + " is " + o.state() + " but starts at " + o.start() + ", after now " + now));
    } else if (!frozen && o.start().isBefore(now.minusNanos(tol))) {
      out.add(Violation.of(Kind.REPLAN_NOW, o.id(), o.start(), seconds(now, o.start()), 0,
          "observation " + o.id() + " is planned but starts at " + o.start() + ", before now " + now));
    }
  }

  private void checkDuration(Observation o, Request r, List<Violation> out) {
    if (r.durationS() == null) {
      checkExposure(o, r, out);
      return;
    }
    double d = o.durationS();
    if (Math.abs(d - r.durationS()) > TOLERANCE_S) {
      out.add(Violation.of(Kind.DURATION, o.id(), o.start(), d, r.durationS(), String.format(Locale.ROOT,
          "observation %s lasts %.3f s, but the request's durationS is %.3f", o.id(), d, r.durationS())));
    }
  }

  /**
   * Flexible exposure: the duration is min + k·step for a whole k and lies in [min, max] (within
   * {@link #TOLERANCE_S}); the observation carries {@code value} equal to the curve's linear interpolation at
   * its duration (within {@link #VALUE_TOLERANCE}).
   */
  private void checkExposure(Observation o, Request r, List<Violation> out) {
    FlexibleExposure f = r.flexible();
    if (f == null) {
      return;
    }
    double d = o.durationS();
    if (!f.allows(d, TOLERANCE_S)) {
      out.add(Violation.of(Kind.EXPOSURE_GRID, o.id(), o.start(), d, f.nearestGridS(d), String.format(Locale.ROOT,
          "observation %s lasts %.3f s, not a grid exposure %s", o.id(), d, f.gridText())));
    }
    if (o.value() == null) {
      out.add(Violation.of(Kind.EXPOSURE_VALUE, o.id(), o.start(),
          "observation " + o.id() + ": a flexible request's observation must carry its value"));
      return;
    }
    double expected = f.valueAt(d);
    if (Math.abs(o.value() - expected) > VALUE_TOLERANCE) {
      out.add(Violation.of(Kind.EXPOSURE_VALUE, o.id(), o.start(), o.value(), expected, String.format(Locale.ROOT,
          "observation %s: value is %s, but the utility curve gives %s at %.3f s", o.id(), o.value(), expected, d)));
    }
  }

  private void checkHorizonAndWindows(Observation o, Request r, List<Violation> out) {
    long tol = (long) (TOLERANCE_S * 1e9);
    TimeWindow horizon = scenario.horizon();
    if (o.start().isBefore(horizon.start().minusNanos(tol)) || o.end().isAfter(horizon.end().plusNanos(tol))) {
      double outside = Math.max(seconds(o.start(), horizon.start()), seconds(horizon.end(), o.end()));
      out.add(Violation.of(Kind.OUTSIDE_HORIZON, o.id(), o.start().isBefore(horizon.start()) ? o.start() : o.end(),
          outside, 0, "observation " + o.id() + " [" + o.start() + ", " + o.end() + "] is outside the horizon ["
              + horizon.start() + ", " + horizon.end() + "]"));
    }
    if (r.windows().isEmpty()) {
      return;
    }
    Instant lo = o.start().plusNanos(tol);
    Instant hi = o.end().minusNanos(tol);
    if (hi.isBefore(lo)) {
      lo = o.start();
      hi = o.end();
    }
    for (TimeWindow w : r.windows()) {
      if (w.contains(lo, hi)) {
        return;
      }
    }
    out.add(Violation.of(Kind.OUTSIDE_REQUEST_WINDOW, o.id(), o.start(), "observation " + o.id() + " [" + o.start()
        + ", " + o.end() + "] lies inside none of the request's own windows " + r.windows()));
  }

  /** Seconds from {@code a} to {@code b} (negative when b is earlier), to the nanosecond. */
  static double seconds(Instant a, Instant b) {
    Duration d = Duration.between(a, b);
    return d.getSeconds() + d.getNano() * 1e-9;
  }
}
