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
 * observation names a resource that may observe its request; the request-level rules (visits, groups,
 * required requests observed, every other one listed) over the whole timeline, one per window on the windows
 * of all resources merged (A4); per resource, its observations as a {@link SelfCheck} of that resource alone
 * (its windows, its exact transitions from its own start pointing, no overlap on it; a request with visits
 * counts there as the visits it has on that resource, numbered there), the requests it did not observe listed
 * as unscheduled there; the totals over all resources. Like {@link SelfCheck} it shares the planner's windows and transitions on
 * purpose; the façade's plans pass the independent validator instead.
 */
final class SectionsCheck implements TimelineCheck {
  private final TimeWindow horizon;
  private final List<Request> requests;
  private final List<dev.sequencer.model.Group> groups;
  private final Sections sections;
  private final Instant now;
  private final boolean checkRequired;

  SectionsCheck(TimeWindow horizon, List<Request> requests, List<dev.sequencer.model.Group> groups,
      Sections sections) {
    this(horizon, requests, groups, sections, null, true);
  }

  private SectionsCheck(TimeWindow horizon, List<Request> requests, List<dev.sequencer.model.Group> groups,
      Sections sections, Instant now, boolean checkRequired) {
    this.horizon = horizon;
    this.requests = List.copyOf(requests);
    this.groups = List.copyOf(groups);
    this.sections = sections;
    this.now = now;
    this.checkRequired = checkRequired;
  }

  @Override
  public SectionsCheck withNow(Instant newNow) {
    return new SectionsCheck(horizon, requests, groups, sections, newNow, checkRequired);
  }

  @Override
  public SectionsCheck withRequiredIgnored() {
    return new SectionsCheck(horizon, requests, groups, sections, now, false);
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
    RequestRules rules = new RequestRules(requests, groups, this::inSomeWindow, checkRequired);
    for (Violation v : rules.check(timeline)) {
      out.add(v.message());
    }
    for (int r = 0; r < sections.count(); r++) {
      String id = sections.resourceId(r);
      List<Observation> mine = new ArrayList<>();
      double p = 0;
      double s = 0;
      Map<String, Integer> here = new HashMap<>();
      for (Observation o : timeline.observations()) {
        if (id.equals(o.resource())) {
          here.merge(o.id(), 1, Integer::sum);
          mine.add(o);
          s += o.slewSeconds();
          Request q = byId.get(o.id());
          p += q == null ? 0 : q.priority() != null ? q.priority() : o.value() != null ? o.value() : 0;
        }
      }
      // The visits this resource made, as if they were all the request asked of it (the rules between visits
      // on different resources are the whole timeline's, above).
      List<Request> asked = new ArrayList<>();
      for (Request q : requests) {
        int n = here.getOrDefault(q.id(), 0);
        asked.add(!q.hasVisits() ? q : q.withVisits(n <= 1 ? dev.sequencer.model.Visits.ONCE
            : new dev.sequencer.model.Visits(n, 0, null, false, false)));
      }
      Map<String, Integer> rank = new HashMap<>();
      for (int i = 0; i < mine.size(); i++) {
        Observation o = mine.get(i);
        int n = here.get(o.id());
        int v = rank.merge(o.id(), 1, Integer::sum);
        mine.set(i, o.withVisit(n <= 1 || byId.get(o.id()) == null || !byId.get(o.id()).hasVisits() ? null : v));
      }
      List<Unscheduled> elsewhere = new ArrayList<>();
      for (Request q : requests) {
        if (mine.stream().noneMatch(o -> o.id().equals(q.id()))) {
          elsewhere.add(new Unscheduled(q.id(), "not on resource " + id));
        }
      }
      SelfCheck one = new SelfCheck(horizon, asked, sections.windows(r), sections.transitions(r))
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

  /**
   * The windows of r on every resource, merged (A4: one per window counts in them), hold both observations
   * and everything between them; windows less than a second apart count as one, as the planner joins them.
   */
  private boolean inSomeWindow(Request r, Observation first, Observation second) {
    List<TimeWindow> all = new ArrayList<>();
    for (int k = 0; k < sections.count(); k++) {
      for (RequestWindows w : sections.windows(k)) {
        if (w.id().equals(r.id())) {
          all.addAll(w.intervals());
        }
      }
    }
    all.sort(java.util.Comparator.comparing(TimeWindow::start));
    Instant from = null;
    Instant to = null;
    for (TimeWindow w : all) {
      if (to != null && !w.start().isAfter(to.plusSeconds(1))) {
        to = w.end().isAfter(to) ? w.end() : to;
      } else {
        from = w.start();
        to = w.end();
      }
      if (!first.start().isBefore(from) && !second.end().isAfter(to)) {
        return true;
      }
    }
    return false;
  }
}
