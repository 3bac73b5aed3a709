package dev.sequencer.sequence;

import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.Group;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.slew.Transitions;
import dev.sequencer.validate.RequestRules;
import dev.sequencer.validate.TimelineCheck;
import dev.sequencer.validate.Violation;
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
 * The sequencer's self-check: a timeline against requests, the planner's own visibility windows and the
 * planner's own exact transitions; returns the violations in words (empty = valid). It shares the
 * planner's geometry on purpose (it checks the sequencing, not the physics) and is used only where no
 * scenario is at hand ({@link Sequencer} and the re-planner called without a validator). Every plan the
 * library façade hands out passes the independent {@link dev.sequencer.validate.PlanValidator} instead,
 * which derives the geometry and the slew times itself.
 *
 * <p>Checks: every observation inside one window of its request and inside the horizon; duration equal to
 * the request's (flexible requests: a grid exposure in [min, max] whose {@code value} is the curve's
 * value there); observations in time order without overlap; each gap (from the previous end, or from
 * the horizon start for the first) at least the exact transition recomputed with
 * {@link Transitions#exactS} at the plan's own departure times; each reported {@code slewSeconds} equal
 * to that exact transition; every required request observed; every request listed as the format says
 * (observed once or up to its visits, unscheduled when some visit is missing) with the visits' and groups'
 * rules ({@link RequestRules}, with the planner's windows for one-per-window) and no unknown ids; totals (priority, slew seconds) equal to the sums.
 *
 * <p>Tolerance {@link #TOLERANCE_S} = 1 ms on every time comparison: timeline instants are exact to the
 * nanosecond, but transition models are floating-point and the sequencer works in whole seconds with a
 * 1 µs rounding slack; 1 ms is far above that noise and far below any physically meaningful slew error.
 * Priority totals are compared to 1e-9 relative.
 */
public final class SelfCheck implements TimelineCheck {
  private static final Logger LOG = LoggerFactory.getLogger(SelfCheck.class);

  /** Time tolerance of every comparison, seconds. */
  public static final double TOLERANCE_S = 1e-3;
  /**
   * Tolerance on a flexible observation's {@code value} against the interpolated curve: values are written
   * as decimal doubles, so only rounding noise far below 1e-6 can separate equal values.
   */
  public static final double VALUE_TOLERANCE = 1e-6;

  private final TimeWindow horizon;
  private final List<Request> requests;
  private final Map<String, Integer> index = new HashMap<>();
  private final Map<String, List<TimeWindow>> windows = new HashMap<>();
  private final Transitions transitions;
  private final Instant now;
  private final boolean checkRequired;
  private final List<Group> groups;

  /**
   * A validator for these requests (scenario order = transition index), their visibility windows
   * (already intersected with the requests' own windows; a missing entry = never visible) and transitions.
   */
  public SelfCheck(TimeWindow horizon, List<Request> requests, List<RequestWindows> windows,
      Transitions transitions) {
    this(horizon, requests, List.of(), windows, transitions, null, true);
  }

  /** As {@link #SelfCheck(TimeWindow, List, List, Transitions)}, with the scenario's groups (A5). */
  public SelfCheck(TimeWindow horizon, List<Request> requests, List<Group> groups, List<RequestWindows> windows,
      Transitions transitions) {
    this(horizon, requests, groups, windows, transitions, null, true);
  }

  /**
   * The plan's own check of {@code problem} where no scenario is at hand: this class for one observer, each
   * resource's observations checked as one-observer plans for several ({@link dev.sequencer.sequence.problem.Sections}).
   */
  public static TimelineCheck of(dev.sequencer.sequence.problem.PlanningProblem problem) {
    return problem.sections() != null
        ? new SectionsCheck(problem.horizon(), problem.requests(), problem.groups(), problem.sections())
        : new SelfCheck(problem.horizon(), problem.requests(), problem.groups(), problem.windows(),
            problem.requestTransitions());
  }

  private SelfCheck(TimeWindow horizon, List<Request> requests, List<Group> groups, List<RequestWindows> windows,
      Transitions transitions, Instant now, boolean checkRequired) {
    this.groups = List.copyOf(groups);
    this.now = now;
    this.checkRequired = checkRequired;
    this.horizon = Objects.requireNonNull(horizon, "horizon");
    this.requests = List.copyOf(requests);
    this.transitions = Objects.requireNonNull(transitions, "transitions");
    for (int k = 0; k < this.requests.size(); k++) {
      index.put(this.requests.get(k).id(), k);
    }
    for (RequestWindows w : windows) {
      this.windows.put(w.id(), w.intervals());
    }
  }

  /**
   * A copy for a re-plan made at {@code newNow}: observations in state "done" or "running" must start
   * at or before it, every other (planned) observation at or after it (re-planning extension). The
   * transitions into done and running observations are history and not re-checked (a failed observation
   * between two of them is no longer listed); every leg into a planned observation is, the first one from
   * the end pointing of the last done or running observation.
   */
  @Override
  public SelfCheck withNow(Instant newNow) {
    List<RequestWindows> w = new ArrayList<>();
    windows.forEach((id, list) -> w.add(new RequestWindows(id, list)));
    return new SelfCheck(horizon, requests, groups, w, transitions, Objects.requireNonNull(newNow, "now"),
        checkRequired);
  }

  /**
   * A copy that does not ask for the required requests: for checking part of a night (the done and running
   * observations a re-plan keeps), where the rest is still to come.
   */
  @Override
  public SelfCheck withRequiredIgnored() {
    List<RequestWindows> w = new ArrayList<>();
    windows.forEach((id, list) -> w.add(new RequestWindows(id, list)));
    return new SelfCheck(horizon, requests, groups, w, transitions, now, false);
  }

  /** All violations of {@code timeline}; empty when it is valid. */
  @Override
  public List<String> violations(Timeline timeline) {
    long t0 = System.nanoTime();
    List<String> out = check(timeline);
    LOG.debug("check: {} observations, {} violations, in {} ms", timeline.observations().size(), out.size(),
        (System.nanoTime() - t0) / 1_000_000);
    return out;
  }

  private List<String> check(Timeline timeline) {
    List<String> out = new ArrayList<>();
    List<Observation> obs = timeline.observations();
    checkOncePerRequest(timeline, out);
    double prioritySum = 0;
    double slewSum = 0;
    for (int k = 0; k < obs.size(); k++) {
      Observation o = obs.get(k);
      slewSum += o.slewSeconds();
      Integer idx = index.get(o.id());
      if (idx == null) {
        continue;
      }
      Request r = requests.get(idx);
      if (r.priority() != null) {
        prioritySum += r.priority();
      } else if (o.value() != null) {
        prioritySum += o.value();
      }
      checkDuration(o, r, out);
      checkWindow(o, out);
      checkNow(o, out);
      if (k > 0 && o.start().isBefore(obs.get(k - 1).end())) {
        Observation p = obs.get(k - 1);
        out.add(String.format(Locale.ROOT, "observation %s starts at %s, %.3f s before %s ends at %s (overlap or "
            + "out of time order)", o.id(), o.start(), seconds(o.start(), p.end()), p.id(), p.end()));
      }
    }
    checkTransitions(obs, out);
    for (Request r : requests) {
      if (checkRequired && r.required() && obs.stream().noneMatch(o -> o.id().equals(r.id()))) {
        out.add("required request " + r.id() + " is not observed");
      }
    }
    if (Math.abs(prioritySum - timeline.priority()) > 1e-9 * Math.max(1, Math.abs(prioritySum))) {
      out.add(String.format(Locale.ROOT, "total priority: timeline says %s, observations sum to %s",
          timeline.priority(), prioritySum));
    }
    if (Math.abs(slewSum - timeline.slewSeconds()) > TOLERANCE_S) {
      out.add(String.format(Locale.ROOT, "total slewSeconds: timeline says %.3f, observations sum to %.3f",
          timeline.slewSeconds(), slewSum));
    }
    return out;
  }

  private void checkOncePerRequest(Timeline timeline, List<String> out) {
    for (Observation o : timeline.observations()) {
      if (!index.containsKey(o.id())) {
        out.add("observation " + o.id() + ": unknown request id");
      }
    }
    for (Unscheduled u : timeline.unscheduled()) {
      if (!index.containsKey(u.id())) {
        out.add("unscheduled " + u.id() + ": unknown request id");
      }
    }
    RequestRules rules = new RequestRules(requests, groups, this::sameWindow, checkRequired);
    for (Violation v : rules.check(timeline)) {
      out.add(v.message());
    }
  }

  /** One of the planner's windows of r holds both observations and everything between them. */
  private boolean sameWindow(Request r, Observation first, Observation second) {
    return windows.getOrDefault(r.id(), List.of()).stream().anyMatch(w -> w.contains(first.start(), second.end()));
  }

  /** With a re-planning instant: done/running observations start by it, planned ones at or after it. */
  private void checkNow(Observation o, List<String> out) {
    if (now == null) {
      return;
    }
    long tol = (long) (TOLERANCE_S * 1e9);
    boolean frozen = Observation.DONE.equals(o.state()) || Observation.RUNNING.equals(o.state());
    if (frozen && o.start().isAfter(now.plusNanos(tol))) {
      out.add("observation " + o.id() + " is " + o.state() + " but starts at " + o.start() + ", after now " + now);
    } else if (!frozen && o.start().isBefore(now.minusNanos(tol))) {
      out.add("observation " + o.id() + " is planned but starts at " + o.start() + ", before now " + now);
    }
  }

  private void checkDuration(Observation o, Request r, List<String> out) {
    if (r.durationS() == null) {
      checkExposure(o, r, out);
      return;
    }
    double d = o.durationS();
    if (Math.abs(d - r.durationS()) > TOLERANCE_S) {
      out.add(String.format(Locale.ROOT, "observation %s lasts %.3f s, but the request's durationS is %.3f",
          o.id(), d, r.durationS()));
    }
  }

  /**
   * Flexible-exposure extension: the duration is min + k·step for a whole k and lies in [min, max]
   * (within {@link #TOLERANCE_S}); the observation carries {@code value} equal to the curve's linear
   * interpolation at its duration (within {@link #VALUE_TOLERANCE}).
   */
  private void checkExposure(Observation o, Request r, List<String> out) {
    FlexibleExposure f = r.flexible();
    if (f == null) {
      return;
    }
    double d = o.durationS();
    if (!f.allows(d, TOLERANCE_S)) {
      out.add(String.format(Locale.ROOT, "observation %s lasts %.3f s, not a grid exposure %s", o.id(), d,
          f.gridText()));
    }
    if (o.value() == null) {
      out.add("observation " + o.id() + ": a flexible request's observation must carry its value");
      return;
    }
    double expected = f.valueAt(d);
    if (Math.abs(o.value() - expected) > VALUE_TOLERANCE) {
      out.add(String.format(Locale.ROOT, "observation %s: value is %s, but the utility curve gives %s at %.3f s",
          o.id(), o.value(), expected, d));
    }
  }

  private void checkWindow(Observation o, List<String> out) {
    Instant lo = o.start().plusNanos((long) (TOLERANCE_S * 1e9));
    Instant hi = o.end().minusNanos((long) (TOLERANCE_S * 1e9));
    if (hi.isBefore(lo)) {
      lo = o.start();
      hi = o.end();
    }
    if (o.start().isBefore(horizon.start().minusNanos((long) (TOLERANCE_S * 1e9)))
        || o.end().isAfter(horizon.end().plusNanos((long) (TOLERANCE_S * 1e9)))) {
      out.add("observation " + o.id() + " [" + o.start() + ", " + o.end() + "] is outside the horizon ["
          + horizon.start() + ", " + horizon.end() + "]");
    }
    for (TimeWindow w : windows.getOrDefault(o.id(), List.of())) {
      if (w.contains(lo, hi)) {
        return;
      }
    }
    out.add("observation " + o.id() + " [" + o.start() + ", " + o.end() + "] lies inside no visibility window of "
        + "the request (windows: " + windows.getOrDefault(o.id(), List.of()) + ")");
  }

  /** Gap before each observation >= exact transition, and reported slewSeconds = exact transition. */
  private void checkTransitions(List<Observation> obs, List<String> out) {
    int[] order = new int[obs.size()];
    double[] departure = new double[obs.size()];
    double[] arrival = new double[obs.size()];
    for (int k = 0; k < obs.size(); k++) {
      Integer idx = index.get(obs.get(k).id());
      if (idx == null) {
        return; // already reported; the transition table cannot be indexed
      }
      order[k] = idx;
      departure[k] = k == 0 ? 0.0 : seconds(horizon.start(), obs.get(k - 1).end());
      arrival[k] = seconds(horizon.start(), obs.get(k).start());
    }
    double[] exact = transitions.exactS(order, departure, arrival);
    for (int k = 0; k < obs.size(); k++) {
      Observation o = obs.get(k);
      if (now != null && (Observation.DONE.equals(o.state()) || Observation.RUNNING.equals(o.state()))) {
        continue; // history: legs into done/running observations are as recorded (a failed one may be gone)
      }
      String from = k == 0 ? "the start pointing" : obs.get(k - 1).id();
      if (!(exact[k] < Double.POSITIVE_INFINITY)) {
        out.add("observation " + o.id() + ": the transition from " + from + " is impossible (exact = " + exact[k] + ")");
        continue;
      }
      double gap = seconds(k == 0 ? horizon.start() : obs.get(k - 1).end(), o.start());
      if (gap < exact[k] - TOLERANCE_S) {
        out.add(String.format(Locale.ROOT, "observation %s: gap after %s is %.3f s, shorter than the exact "
            + "transition %.3f s", o.id(), from, gap, exact[k]));
      }
      if (Math.abs(o.slewSeconds() - exact[k]) > TOLERANCE_S) {
        out.add(String.format(Locale.ROOT, "observation %s: slewSeconds is %.3f, but the exact transition from %s is "
            + "%.3f s", o.id(), o.slewSeconds(), from, exact[k]));
      }
    }
  }

  private static double seconds(Instant a, Instant b) {
    Duration d = Duration.between(a, b);
    return d.getSeconds() + d.getNano() * 1e-9;
  }
}
