package dev.sequencer.sequence;

import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.sequence.problem.Sections;
import dev.sequencer.validate.RequestRules;
import dev.sequencer.validate.TimelineCheck;
import dev.sequencer.validate.Violation;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The sequencer's self-check of a plan on several resources (A6), where no scenario is at hand: every
 * observation names a resource that may observe its request; the request-level rules (each request once,
 * required requests observed, every other one listed) over the whole timeline; per resource, its
 * observations as a {@link SelfCheck} of that resource alone (its windows, its exact transitions from its
 * own start pointing, no overlap on it), the requests it did not observe listed as unscheduled there; the
 * totals over all resources. Like {@link SelfCheck} it shares the planner's windows and transitions on
 * purpose; the façade's plans pass the independent validator instead.
 */
final class SectionsCheck implements TimelineCheck {
  private final TimeWindow horizon;
  private final List<Request> requests;
  private final Sections sections;
  private final Instant now;
  private final boolean checkRequired;

  SectionsCheck(TimeWindow horizon, List<Request> requests, Sections sections) {
    this(horizon, requests, sections, null, true);
  }

  private SectionsCheck(TimeWindow horizon, List<Request> requests, Sections sections, Instant now,
      boolean checkRequired) {
    this.horizon = horizon;
    this.requests = List.copyOf(requests);
    this.sections = sections;
    this.now = now;
    this.checkRequired = checkRequired;
  }

  @Override
  public SectionsCheck withNow(Instant newNow) {
    return new SectionsCheck(horizon, requests, sections, newNow, checkRequired);
  }

  @Override
  public SectionsCheck withRequiredIgnored() {
    return new SectionsCheck(horizon, requests, sections, now, false);
  }

  @Override
  public List<String> violations(Timeline timeline) {
    List<String> out = new ArrayList<>();
    Map<String, Request> byId = new HashMap<>();
    requests.forEach(r -> byId.put(r.id(), r));
    double priority = 0;
    double slew = 0;
    for (Observation o : timeline.observations()) {
      slew += o.slewSeconds();
      Request r = byId.get(o.id());
      priority += r == null ? 0 : r.priority() != null ? r.priority() : o.value() != null ? o.value() : 0;
      if (o.resource() == null || !sections.resourceIds().contains(o.resource())) {
        out.add("observation " + o.id() + ": resource " + (o.resource() == null ? "missing"
            : "\"" + o.resource() + "\" unknown"));
      } else if (r != null && !r.allows(o.resource())) {
        out.add("observation " + o.id() + ": resource " + o.resource() + " may not observe it");
      }
    }
    RequestRules rules = new RequestRules(requests, List.of(), this::inSomeWindow, checkRequired);
    for (Violation v : rules.check(timeline)) {
      out.add(v.message());
    }
    for (int r = 0; r < sections.count(); r++) {
      String id = sections.resourceId(r);
      List<Observation> mine = new ArrayList<>();
      double p = 0;
      double s = 0;
      for (Observation o : timeline.observations()) {
        if (id.equals(o.resource())) {
          mine.add(o);
          s += o.slewSeconds();
          Request q = byId.get(o.id());
          p += q == null ? 0 : q.priority() != null ? q.priority() : o.value() != null ? o.value() : 0;
        }
      }
      List<Unscheduled> elsewhere = new ArrayList<>();
      for (Request q : requests) {
        if (mine.stream().noneMatch(o -> o.id().equals(q.id()))) {
          elsewhere.add(new Unscheduled(q.id(), "not on resource " + id));
        }
      }
      SelfCheck one = new SelfCheck(horizon, requests, sections.windows(r), sections.transitions(r))
          .withRequiredIgnored();
      if (now != null) {
        one = one.withNow(now);
      }
      Timeline part = new Timeline(timeline.status(), p, s, null, mine, elsewhere);
      for (String v : one.violations(part)) {
        out.add("resource " + id + ": " + v);
      }
    }
    if (Math.abs(priority - timeline.priority()) > 1e-9 * Math.max(1, Math.abs(priority))) {
      out.add(String.format(Locale.ROOT, "total priority: timeline says %s, observations sum to %s",
          timeline.priority(), priority));
    }
    if (Math.abs(slew - timeline.slewSeconds()) > SelfCheck.TOLERANCE_S) {
      out.add(String.format(Locale.ROOT, "total slewSeconds: timeline says %.3f, observations sum to %.3f",
          timeline.slewSeconds(), slew));
    }
    return out;
  }

  /** One window of r on some resource holds both observations and everything between them. */
  private boolean inSomeWindow(Request r, Observation first, Observation second) {
    for (int k = 0; k < sections.count(); k++) {
      for (RequestWindows w : sections.windows(k)) {
        if (w.id().equals(r.id()) && w.intervals().stream().anyMatch(i -> i.contains(first.start(), second.end()))) {
          return true;
        }
      }
    }
    return false;
  }
}
