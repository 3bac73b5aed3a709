package dev.sequencer.validate;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.validate.Violation.Kind;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The checks of the observations one observer makes, in the order listed: the scenario's one observer, or
 * one resource (A6) seen through {@link Scenario#forResource}, so its observer, slew model, start pointing,
 * constraints and change times apply. Checked: no overlap, every constraint from this observer's own
 * {@link Sky} ({@link ObservationCheck}), and each gap against the transition from the previous observation
 * of this observer (or its start pointing and the scenario's start configuration): the slew
 * ({@link SlewLegs}) with the configuration change, {@code slewSeconds}, {@code slewStart} and the keep-outs
 * along the slew ({@link SlewKeepOut}). A resource's violations name it first ("resource north: ...").
 *
 * <p>Not thread-safe (its {@link Sky} caches); {@link PlanValidator} runs one check at a time.
 */
final class ObserverCheck {
  private final String resource;
  private final Scenario view;
  private final AstroContext ctx;
  private final Instant now;
  private final boolean slewKeepOuts;
  private final Map<String, Request> byId = new HashMap<>();
  private Sky sky;
  private ObservationCheck constraints;

  /**
   * The check of resource {@code resource} ({@code null}: the one observer) through {@code view}; with a
   * re-planning instant {@code now} (or {@code null}) legs into done and running observations are history.
   */
  ObserverCheck(String resource, Scenario view, AstroContext ctx, Instant now, boolean slewKeepOuts) {
    this.resource = resource;
    this.view = view;
    this.ctx = ctx;
    this.now = now;
    this.slewKeepOuts = slewKeepOuts;
    for (Request r : view.requests()) {
      byId.put(r.id(), r);
    }
  }

  /** The resource this check is for; {@code null} for the scenario's one observer. */
  String resource() {
    return resource;
  }

  /** True when this observer may make observations of {@code r} (always with one observer). */
  boolean mayObserve(Request r) {
    return resource == null || r.allows(resource);
  }

  /** True when every constraint of {@code r} holds over [a, b] from this observer (always without one). */
  boolean sees(Request r, Instant a, Instant b) {
    return constraints().violations(r, a, b).isEmpty();
  }

  /** True when observation {@code o} is history at the re-planning instant {@code now} (done or running). */
  static boolean frozen(Observation o, Instant now) {
    return now != null && (Observation.DONE.equals(o.state()) || Observation.RUNNING.equals(o.state()));
  }

  /** Every violation of {@code obs}, the observations this observer makes, in the order the timeline lists them. */
  List<Violation> check(List<Observation> obs) {
    List<Violation> out = new ArrayList<>();
    boolean allKnown = true;
    for (int k = 0; k < obs.size(); k++) {
      Observation o = obs.get(k);
      Request r = byId.get(o.id());
      if (r == null) {
        allKnown = false;
        continue;
      }
      if (k > 0 && o.start().isBefore(obs.get(k - 1).end())) {
        Observation p = obs.get(k - 1);
        double overlap = PlanValidator.seconds(o.start(), p.end());
        out.add(Violation.of(Kind.OVERLAP, o.id(), o.start(), overlap, 0, String.format(Locale.ROOT,
            "observation %s starts at %s, %.3f s before %s ends at %s (overlap or out of time order)", o.id(),
            o.start(), overlap, p.id(), p.end())));
      }
      out.addAll(constraints().violations(r, o.start(), o.end()));
    }
    if (allKnown) {
      checkSlews(obs, out);
    }
    return resource == null ? out : out.stream().map(v -> v.onResource(resource)).toList();
  }

  private Sky sky() {
    if (sky == null) {
      sky = new Sky(view, ctx);
    }
    return sky;
  }

  private ObservationCheck constraints() {
    if (constraints == null) {
      constraints = new ObservationCheck(sky());
    }
    return constraints;
  }

  /** Each gap covers the validator's own slew; slewSeconds equals it; slewStart in the gap; keep-outs (A3). */
  private void checkSlews(List<Observation> obs, List<Violation> out) {
    double tol = PlanValidator.TOLERANCE_S;
    List<Request> req = obs.stream().map(o -> byId.get(o.id())).toList();
    List<SlewLegs.Leg> legs = new SlewLegs(sky()).legs(obs, req);
    SlewKeepOut keepOut = slewKeepOuts && SlewKeepOut.applies(sky()) ? new SlewKeepOut(sky()) : null;
    Violation reported = null;
    for (int k = 0; k < obs.size(); k++) {
      Observation o = obs.get(k);
      SlewLegs.Leg leg = legs.get(k);
      if (frozen(o, now)) {
        continue; // history: legs into done/running observations are as recorded (a failed one may be gone)
      }
      String from = k == 0 ? "the start pointing" : obs.get(k - 1).id();
      if (!(leg.seconds() < Double.POSITIVE_INFINITY)) {
        if (leg.problem() != reported) {
          out.add(leg.problem());
          reported = leg.problem();
        }
        continue;
      }
      Instant gapStart = k == 0 ? view.horizon().start() : obs.get(k - 1).end();
      double gap = PlanValidator.seconds(gapStart, o.start());
      String fromConfiguration = k == 0 ? view.startConfiguration() : req.get(k - 1).configuration();
      double change = RequestRules.changeS(view.reconfiguration(), fromConfiguration, req.get(k).configuration());
      double transition = RequestRules.transitionS(view.reconfiguration(), leg.seconds(), change);
      String what = change > 0 ? String.format(Locale.ROOT, "the transition (slew %.3f s, configuration change "
          + "%.3f s)", leg.seconds(), change) : "the slew";
      if (gap < transition - tol) {
        out.add(Violation.of(Kind.GAP_TOO_SHORT, o.id(), o.start(), gap, transition, String.format(Locale.ROOT,
            "observation %s: gap after %s is %.3f s, shorter than %s %.3f s", o.id(), from, gap, what, transition)));
      }
      if (Math.abs(o.slewSeconds() - transition) > tol) {
        out.add(Violation.of(Kind.SLEW_SECONDS, o.id(), o.start(), o.slewSeconds(), transition, String.format(
            Locale.ROOT, "observation %s: slewSeconds is %.3f, but %s from %s takes %.3f s", o.id(),
            o.slewSeconds(), what, from, transition)));
      }
      if (o.slewStart() != null && (o.slewStart().isBefore(gapStart.minusNanos((long) (tol * 1e9)))
          || PlanValidator.seconds(o.slewStart(), o.start()) < leg.seconds() - tol)) {
        out.add(Violation.of(Kind.SLEW_START, o.id(), o.slewStart(), PlanValidator.seconds(gapStart, o.slewStart()),
            gap - leg.seconds(), String.format(Locale.ROOT, "observation %s: slewStart %s does not leave the slew "
                + "of %.3f s inside the gap [%s, %s]", o.id(), o.slewStart(), leg.seconds(), gapStart, o.start())));
        continue;
      }
      if (keepOut != null && gap >= leg.seconds() - tol) {
        Constraints fromC = k == 0 ? view.constraints() : view.constraintsFor(req.get(k - 1));
        Violation v = keepOut.check(o, gapStart, leg, fromC, view.constraintsFor(req.get(k)));
        if (v != null) {
          out.add(v);
        }
      }
    }
  }
}
