package dev.sequencer.validate;

import dev.sequencer.model.Group;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Reconfiguration;
import dev.sequencer.model.Request;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.model.Visits;
import dev.sequencer.validate.Violation.Kind;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The validator's own reading of the rules between observations (format additions A4 and A5), written
 * from the format's wording and sharing no code with the planner's {@code Structure}: how often each
 * request is listed, the visits (count, numbering in time order, start-to-start separations, one per
 * window, all or nothing, required), the groups (all or nothing, order, maximum gap, one resource) and the
 * configuration change time that each transition must include. Time tolerance {@link #TOLERANCE_S}.
 */
public final class RequestRules {
  /** Time tolerance of every comparison, seconds (the validators' 1 ms). */
  public static final double TOLERANCE_S = 1e-3;

  /** Whether two observations of one request lie in one visibility window (for {@code onePerWindow}). */
  @FunctionalInterface
  public interface SameWindow {
    boolean test(Request r, Observation first, Observation second);
  }

  private final List<Request> requests;
  private final List<Group> groups;
  private final SameWindow sameWindow;
  private final boolean checkRequired;

  public RequestRules(List<Request> requests, List<Group> groups, SameWindow sameWindow, boolean checkRequired) {
    this.requests = List.copyOf(requests);
    this.groups = List.copyOf(groups);
    this.sameWindow = sameWindow;
    this.checkRequired = checkRequired;
  }

  /**
   * Every violation of the listing and visit and group rules: each request is observed at most
   * {@code visits.count} times (once without visits) and listed as unscheduled exactly when some visit
   * is missing ({@code visitsMissing} = the number missing, when the request has visits); unknown ids are
   * the caller's to report. All-or-nothing and required counts are not asked of part of a night
   * ({@code checkRequired} false).
   */
  public List<Violation> check(Timeline t) {
    List<Violation> out = new ArrayList<>();
    Map<String, List<Observation>> byId = new LinkedHashMap<>();
    for (Observation o : t.observations()) {
      byId.computeIfAbsent(o.id(), x -> new ArrayList<>()).add(o);
    }
    Map<String, List<Unscheduled>> left = new HashMap<>();
    for (Unscheduled u : t.unscheduled()) {
      left.computeIfAbsent(u.id(), x -> new ArrayList<>()).add(u);
    }
    Map<String, Integer> held = new HashMap<>();
    for (Request r : requests) {
      List<Observation> mine = byId.getOrDefault(r.id(), List.of());
      List<Unscheduled> listed = left.getOrDefault(r.id(), List.of());
      held.put(r.id(), mine.size());
      visits(r, mine, listed, out);
    }
    for (Group g : groups) {
      group(g, byId, held, out);
    }
    return out;
  }

  private void visits(Request r, List<Observation> mine, List<Unscheduled> listed, List<Violation> out) {
    Visits v = r.visits();
    boolean several = r.hasVisits();
    int n = mine.size();
    int wanted = v.count();
    if (n > wanted) {
      out.add(Violation.of(several ? Kind.VISIT_COUNT : Kind.NOT_LISTED_ONCE, r.id(), mine.get(wanted).start(), n, wanted, "request " + r.id()
          + " is observed " + n + " times, more than its " + wanted + " visit(s)"));
    }
    int missing = Math.max(0, wanted - n);
    if (missing == 0 && !listed.isEmpty()) {
      out.add(Violation.of(Kind.NOT_LISTED_ONCE, r.id(), null, n + listed.size(), n, "request " + r.id()
          + " appears " + (n + listed.size()) + " times in observations and unscheduled (observed " + n
          + " time(s), every visit it asks for, and also listed as unscheduled)"));
    } else if (missing > 0 && listed.size() != 1) {
      out.add(Violation.of(Kind.NOT_LISTED_ONCE, r.id(), null, listed.size(), 1, "request " + r.id() + " appears "
          + (n + listed.size()) + " times in observations and unscheduled: it misses " + missing
          + " visit(s) and is listed " + listed.size() + " times as unscheduled (must be exactly once)"));
    } else if (missing > 0 && several && listed.get(0).visitsMissing() != null
        && listed.get(0).visitsMissing() != missing) {
      out.add(Violation.of(Kind.VISITS_MISSING_LISTED, r.id(), null, listed.get(0).visitsMissing(), missing,
          "request " + r.id() + ": unscheduled says visitsMissing " + listed.get(0).visitsMissing() + ", but "
              + missing + " of its " + wanted + " visits are not observed"));
    } else if (missing > 0 && several && n > 0 && listed.get(0).visitsMissing() == null) {
      out.add(Violation.of(Kind.VISITS_MISSING_LISTED, r.id(), null, "request " + r.id() + " has " + n + " of "
          + wanted + " visits, but its unscheduled entry does not say visitsMissing " + missing));
    }
    for (int i = 0; i < n; i++) {
      Observation o = mine.get(i);
      Integer expected = several ? i + 1 : null;
      if (!java.util.Objects.equals(o.visit(), expected)) {
        out.add(Violation.of(Kind.VISIT_COUNT, r.id(), o.start(), "observation " + r.id() + " at " + o.start()
            + ": visit is " + o.visit() + ", expected " + (expected == null ? "none (the request has no visits)"
                : expected + " (visits are numbered 1, 2, ... in time order)")));
      }
      if (i == 0) {
        continue;
      }
      Observation p = mine.get(i - 1);
      double sep = seconds(p.start(), o.start());
      if (sep < v.minSeparationS() - TOLERANCE_S) {
        out.add(Violation.of(Kind.VISIT_SEPARATION, r.id(), o.start(), sep, v.minSeparationS(), String.format(
            Locale.ROOT, "visit %d of %s starts %.3f s after visit %d starts, less than minSeparationS", i + 1,
            r.id(), sep, i)));
      }
      if (v.maxSeparationS() != null && sep > v.maxSeparationS() + TOLERANCE_S && !history(o)) {
        out.add(Violation.of(Kind.VISIT_SEPARATION, r.id(), o.start(), sep, v.maxSeparationS(), String.format(
            Locale.ROOT, "visit %d of %s starts %.3f s after visit %d starts, more than maxSeparationS", i + 1,
            r.id(), sep, i)));
      }
      if (v.onePerWindow()) {
        for (int j = 0; j < i; j++) {
          if (sameWindow.test(r, mine.get(j), o)) {
            out.add(Violation.of(Kind.VISIT_SAME_WINDOW, r.id(), o.start(), "visits " + (j + 1) + " and " + (i + 1)
                + " of " + r.id() + " lie in one visibility window (onePerWindow)"));
            break;
          }
        }
      }
    }
    if (checkRequired && n > 0 && n < wanted && v.allOrNothing()) {
      out.add(Violation.of(Kind.VISITS_INCOMPLETE, r.id(), null, n, wanted, "request " + r.id() + " has " + n
          + " of its " + wanted + " all-or-nothing visits"));
    }
    if (checkRequired && r.required() && n > 0 && n < wanted) {
      out.add(Violation.of(Kind.VISITS_INCOMPLETE, r.id(), null, n, wanted, "required request " + r.id() + " has "
          + n + " of its " + wanted + " visits (a required request needs all)"));
    }
  }

  /**
   * True for an observation of a re-plan's history (done or running): an upper bound between it and the one
   * before it (maxSeparationS, maxGapS) is not judged, since a failed observation between them may have been
   * removed; what the re-plan adds is judged as always. Lower bounds and order still hold for the history.
   */
  private static boolean history(Observation o) {
    return Observation.DONE.equals(o.state()) || Observation.RUNNING.equals(o.state());
  }

  private void group(Group g, Map<String, List<Observation>> byId, Map<String, Integer> held, List<Violation> out) {
    if (g.allOrNothing() && checkRequired) {
      List<String> full = new ArrayList<>();
      List<String> notFull = new ArrayList<>();
      for (String id : g.members()) {
        Request r = request(id);
        int n = held.getOrDefault(id, 0);
        (r != null && n >= r.visits().count() ? full : notFull).add(id);
      }
      boolean any = g.members().stream().anyMatch(id -> held.getOrDefault(id, 0) > 0);
      if (any && !notFull.isEmpty()) {
        out.add(Violation.of(Kind.GROUP_INCOMPLETE, notFull.get(0), null, "group " + g.id() + " is all or nothing, "
            + "but " + String.join(", ", notFull) + " " + (notFull.size() == 1 ? "is" : "are")
            + " not (fully) observed while " + (full.isEmpty() ? "some visits are" : String.join(", ", full)
                + (full.size() == 1 ? " is" : " are"))));
      }
    }
    if (g.sameResource()) {
      sameResource(g, byId, out);
    }
    if (!g.ordered()) {
      return;
    }
    Observation prev = null;
    String prevId = null;
    for (String id : g.members()) {
      List<Observation> mine = byId.getOrDefault(id, List.of());
      if (mine.isEmpty()) {
        continue;
      }
      Observation o = mine.get(0);
      if (prev != null) {
        double after = seconds(prev.end(), o.start());
        if (after < -TOLERANCE_S) {
          out.add(Violation.of(Kind.GROUP_ORDER, id, o.start(), -after, 0, "group " + g.id() + " is ordered, but "
              + id + " starts at " + o.start() + ", before " + prevId + " ends at " + prev.end()));
        } else if (g.maxGapS() != null && after > g.maxGapS() + TOLERANCE_S && !history(o)) {
          out.add(Violation.of(Kind.GROUP_GAP, id, o.start(), after, g.maxGapS(), String.format(Locale.ROOT,
              "group %s: %s starts %.3f s after %s ends, more than maxGapS", g.id(), id, after, prevId)));
        }
      }
      prev = o;
      prevId = id;
    }
  }

  /**
   * A {@code sameResource} group (A6): every member's observations on the resource of the first one found
   * (members in group order); observations naming no resource are the validator's to report.
   */
  private static void sameResource(Group g, Map<String, List<Observation>> byId, List<Violation> out) {
    String resource = null;
    String holder = null;
    for (String id : g.members()) {
      for (Observation o : byId.getOrDefault(id, List.of())) {
        if (o.resource() == null) {
          continue;
        }
        if (resource == null) {
          resource = o.resource();
          holder = id;
        } else if (!resource.equals(o.resource())) {
          out.add(Violation.of(Kind.GROUP_RESOURCE, id, o.start(), "group " + g.id() + " keeps its members on one "
              + "resource (sameResource), but " + id + " at " + o.start() + " is observed on " + o.resource()
              + " while " + holder + " is on " + resource));
          return;
        }
      }
    }
  }

  private Request request(String id) {
    for (Request r : requests) {
      if (r.id().equals(id)) {
        return r;
      }
    }
    return null;
  }

  /**
   * The configuration change time from label {@code from} to {@code to}, read from the scenario's
   * {@code reconfiguration} as the format writes it: 0 for equal labels, the constant, or the table entry.
   */
  public static double changeS(Reconfiguration re, String from, String to) {
    if (from.equals(to)) {
      return 0;
    }
    if (re.labels().isEmpty()) {
      return re.constantS();
    }
    double[][] table = re.table();
    return table[re.labels().indexOf(from)][re.labels().indexOf(to)];
  }

  /** The transition the format asks for: max(slew, change) when concurrent, slew + change otherwise. */
  public static double transitionS(Reconfiguration re, double slewS, double changeS) {
    return re.concurrentWithSlew() ? Math.max(slewS, changeS) : slewS + changeS;
  }

  private static double seconds(Instant a, Instant b) {
    Duration d = Duration.between(a, b);
    return d.getSeconds() + d.getNano() * 1e-9;
  }
}
