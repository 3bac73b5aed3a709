package dev.sequencer.sequence.problem;

import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.Group;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Visits;
import dev.sequencer.slew.Reconfigured;
import dev.sequencer.slew.Transitions;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * The planner's input in whole seconds from the horizon start: the tasks (one per request and visit, in
 * scenario order; task index = transition index), the transition times, the rules between tasks
 * ({@link Structure}: visits and groups), the prizes the objective collects, and the requests
 * and windows as given (for the validator and the timeline).
 *
 * <p>Spans are the visibility windows rounded inward (start up, end down), so any observation inside one
 * lies inside a visibility window. Immutable.
 */
public final class PlanningProblem {
  private final Instant horizonStart;
  private final long horizonS;
  private final List<Task> tasks;
  private final Transitions transitions;
  private final int lastIndex;
  private final TimeWindow horizon;
  private final List<Request> requests;
  private final List<RequestWindows> windows;
  private final Prizes prizes;
  private final Structure structure;
  private final Transitions requestTransitions;
  private final List<Group> groups;

  private PlanningProblem(Instant horizonStart, long horizonS, List<Task> tasks, Transitions transitions, int lastIndex,
      TimeWindow horizon, List<Request> requests, List<RequestWindows> windows, Prizes prizes) {
    this(horizonStart, horizonS, tasks, transitions, lastIndex, horizon, requests, windows, prizes,
        Structure.none(tasks.size()), transitions, List.of());
  }

  private PlanningProblem(Instant horizonStart, long horizonS, List<Task> tasks, Transitions transitions, int lastIndex,
      TimeWindow horizon, List<Request> requests, List<RequestWindows> windows, Prizes prizes, Structure structure,
      Transitions requestTransitions, List<Group> groups) {
    this.groups = List.copyOf(groups);
    this.structure = Objects.requireNonNull(structure, "structure");
    this.requestTransitions = requestTransitions;
    this.horizonStart = Objects.requireNonNull(horizonStart, "horizonStart");
    this.horizon = horizon;
    this.requests = List.copyOf(requests);
    this.windows = List.copyOf(windows);
    this.horizonS = horizonS;
    this.tasks = List.copyOf(tasks);
    this.transitions = Objects.requireNonNull(transitions, "transitions");
    this.lastIndex = lastIndex;
    if (transitions.size() != tasks.size()) {
      throw new IllegalArgumentException(
          "transitions: " + transitions.size() + " requests, but the problem has " + tasks.size());
    }
    Map<String, Integer> seen = new HashMap<>();
    for (int k = 0; k < this.tasks.size(); k++) {
      Integer prev = seen.put(this.tasks.get(k).id(), k);
      if (prev != null) {
        throw new IllegalArgumentException("requests[" + k + "]: id \"" + this.tasks.get(k).id()
            + "\" already used by requests[" + prev + "]");
      }
    }
    boolean[] markers = new boolean[this.tasks.size()];
    for (int k = 0; k < markers.length; k++) {
      markers[k] = structure.sections() != null && structure.sections().isMarker(k);
    }
    this.prizes = prizes != null ? prizes : Prizes.of(this.tasks, markers);
  }

  /**
   * Builds the problem from the scenario's requests, their visibility windows (any order, by id) and slew
   * transitions (file order): the configuration changes (A5) are folded into the transitions
   * ({@link Reconfigured}), each visit (A4) becomes a task and the groups (A5) become {@link Structure} rules.
   */
  public static PlanningProblem of(Scenario scenario, List<RequestWindows> windows, Transitions transitions) {
    Transitions withChanges = Reconfigured.of(transitions, scenario.reconfiguration(),
        scenario.requests().stream().map(Request::configuration).toList(), scenario.startConfiguration());
    return of(scenario.horizon(), scenario.requests(), scenario.groups(), windows, withChanges);
  }

  /**
   * Builds the problem from requests and visibility windows (already intersected with each request's own
   * windows). A request without a {@link RequestWindows} entry is never visible. Durations must be whole
   * seconds; flexible requests (whole-second minimum and step) get their exposure grid.
   */
  public static PlanningProblem of(
      TimeWindow horizon, List<Request> requests, List<RequestWindows> windows, Transitions transitions) {
    return of(horizon, requests, List.of(), windows, transitions);
  }

  /**
   * As {@link #of(TimeWindow, List, List, Transitions)}, with groups: request r with {@code visits.count} = n
   * becomes n tasks (ids {@code r#1} … {@code r#n}, each with the request's duration, windows, value and
   * required flag), and {@code transitions} (one per request) are re-indexed by task.
   */
  public static PlanningProblem of(TimeWindow horizon, List<Request> requests, List<Group> groups,
      List<RequestWindows> windows, Transitions transitions) {
    Map<String, RequestWindows> byId = new HashMap<>();
    for (RequestWindows w : windows) {
      byId.put(w.id(), w);
    }
    Instant t0 = horizon.start();
    long horizonS = (long) Math.floor(horizon.durationS());
    List<Task> tasks = new ArrayList<>();
    List<Integer> requestOf = new ArrayList<>();
    List<Integer> visitOf = new ArrayList<>();
    List<Structure.VisitRule> visitRules = new ArrayList<>();
    Map<String, int[]> tasksOf = new HashMap<>();
    for (int k = 0; k < requests.size(); k++) {
      Request r = requests.get(k);
      String where = "requests[" + k + "] (id \"" + r.id() + "\")";
      RequestWindows rw = byId.get(r.id());
      List<TimeWindow> intervals = rw == null ? List.of() : rw.intervals();
      List<Span> spans = spans(t0, horizonS, intervals);
      Task one;
      if (r.isFlexible()) {
        one = flexibleTask(r, where, spans);
      } else {
        long dur = whole(r.durationS(), where + ".durationS");
        one = Task.fixedInSpans(r.id(), dur, r.priority(), r.required(), spans);
      }
      Visits v = r.visits();
      int[] mine = new int[v.count()];
      for (int i = 0; i < v.count(); i++) {
        mine[i] = tasks.size();
        tasks.add(v.count() == 1 ? one : one.withId(r.id() + "#" + (i + 1)));
        requestOf.add(k);
        visitOf.add(i + 1);
      }
      tasksOf.put(r.id(), mine);
      if (r.hasVisits()) {
        int[][] perVisit = new int[mine.length][];
        for (int i = 0; i < mine.length; i++) {
          perVisit[i] = new int[] {mine[i]};
        }
        visitRules.add(new Structure.VisitRule(k, perVisit, (long) Math.ceil(v.minSeparationS() - 1e-9),
            v.maxSeparationS() == null ? -1 : (long) Math.floor(v.maxSeparationS() + 1e-9), v.onePerWindow(),
            v.allOrNothing()));
      }
    }
    List<Structure.GroupRule> groupRules = groupRules(groups, tasksOf);
    int[] rq = requestOf.stream().mapToInt(Integer::intValue).toArray();
    Structure structure = new Structure(rq, visitOf.stream().mapToInt(Integer::intValue).toArray(), visitRules,
        groupRules);
    Transitions byTask = tasks.size() == requests.size() ? transitions : new TaskTransitions(transitions, rq);
    return new PlanningProblem(t0, horizonS, tasks, byTask, -1, horizon, requests, windows, null, structure,
        transitions, groups);
  }

  /** The groups in solver units: per member the tasks of {@code tasksOf} (by request id). */
  private static List<Structure.GroupRule> groupRules(List<Group> groups, Map<String, int[]> tasksOf) {
    List<Structure.GroupRule> groupRules = new ArrayList<>();
    for (Group g : groups) {
      int[][] members = new int[g.members().size()][];
      for (int i = 0; i < members.length; i++) {
        members[i] = tasksOf.get(g.members().get(i));
        if (members[i] == null) {
          throw new IllegalArgumentException("group " + g.id() + ": no request \"" + g.members().get(i) + "\"");
        }
      }
      groupRules.add(new Structure.GroupRule(g.id(), members, g.allOrNothing(), g.ordered(),
          g.maxGapS() == null ? -1 : (long) Math.floor(g.maxGapS() + 1e-9), g.sameResource()));
    }
    return groupRules;
  }

  /**
   * The task of a flexible request: option g = minDurationS + g·durationStepS up to the largest grid point
   * ≤ maxDurationS that also fits in the longest span (so every option can occur), valued by the curve's
   * linear interpolation.
   */
  private static Task flexibleTask(Request r, String where, List<Span> spans) {
    FlexibleExposure f = r.flexible();
    long min = whole(f.minDurationS(), where + ".minDurationS");
    long step = whole(f.durationStepS(), where + ".durationStepS");
    if (step <= 0) {
      throw new IllegalArgumentException(where + ".durationStepS: must be > 0, got " + f.durationStepS());
    }
    if (f.maxDurationS() < f.minDurationS()) {
      throw new IllegalArgumentException(where + ".maxDurationS: must be >= minDurationS " + f.minDurationS()
          + ", got " + f.maxDurationS());
    }
    long longest = -1;
    for (Span s : spans) {
      longest = Math.max(longest, s.toS() - s.fromS());
    }
    long top = (long) Math.floor(f.maxDurationS() + 1e-9);
    if (longest >= min) {
      top = Math.min(top, longest);
    }
    int count = (int) Math.max(1, (top - min) / step + 1);
    double[] values = new double[count];
    for (int g = 0; g < count; g++) {
      values[g] = f.valueAt(min + g * step);
    }
    try {
      return Task.flexible(r.id(), min, step, values, r.required(), spans);
    } catch (IllegalArgumentException e) {
      throw new IllegalArgumentException(where + ": " + e.getMessage(), e);
    }
  }

  /** Windows as whole-second spans from the horizon start, clipped to [0, horizonS], rounded inward. */
  private static List<Span> spans(Instant t0, long horizonS, List<TimeWindow> windows) {
    List<Span> out = new ArrayList<>();
    for (TimeWindow w : windows) {
      long from = Math.max(0, ceilSeconds(t0, w.start()));
      long to = Math.min(horizonS, floorSeconds(t0, w.end()));
      if (from <= to) {
        out.add(new Span(from, to));
      }
    }
    return out;
  }

  private static long whole(Double v, String path) {
    if (v == null || v < 0 || v != Math.rint(v)) {
      throw new IllegalArgumentException(path + ": must be a whole number of seconds >= 0, got " + v);
    }
    return v.longValue();
  }

  /** Builds a problem directly from tasks (tests, benchmarks); {@code horizonS} is the horizon length. */
  public static PlanningProblem ofTasks(Instant horizonStart, long horizonS, List<Task> tasks, Transitions transitions) {
    List<Request> requests = new ArrayList<>();
    List<RequestWindows> windows = new ArrayList<>();
    for (Task t : tasks) {
      requests.add(t.flexible() ? null : new Request(t.id(), null, (double) t.durationS(), t.priority(), t.required(),
          List.of(), null));
      List<TimeWindow> w = new ArrayList<>();
      for (Span s : t.spans()) {
        w.add(new TimeWindow(horizonStart.plusSeconds(s.fromS()), horizonStart.plusSeconds(s.toS())));
      }
      windows.add(new RequestWindows(t.id(), w));
    }
    if (requests.contains(null)) {
      throw new IllegalArgumentException("ofTasks: flexible tasks need their requests; use of(...)");
    }
    return new PlanningProblem(horizonStart, horizonS, tasks, transitions, -1,
        new TimeWindow(horizonStart, horizonStart.plusSeconds(horizonS)), requests, windows, null);
  }

  /**
   * A copy in which request {@code id}, when scheduled, must be the last observation (used for a
   * return-to-base request).
   */
  public PlanningProblem withMustBeLast(String id) {
    return new PlanningProblem(horizonStart, horizonS, tasks, transitions, indexOf(id), horizon, requests, windows,
        prizes, structure, requestTransitions, groups);
  }

  /** A copy whose objective collects {@code newPrizes} (re-planning adds stability bonuses). */
  public PlanningProblem withPrizes(Prizes newPrizes) {
    if (newPrizes.size() != tasks.size()) {
      throw new IllegalArgumentException("prizes: " + newPrizes.size() + " tasks, but the problem has " + tasks.size());
    }
    return new PlanningProblem(horizonStart, horizonS, tasks, transitions, lastIndex, horizon, requests, windows,
        newPrizes, structure, requestTransitions, groups);
  }

  /**
   * A copy whose groups named in {@code latestS} bound the start of their first member scheduled (a re-plan of
   * an ordered group with {@code maxGapS} part done; {@link Structure.GroupRule#hasFirstLatestStart}).
   */
  public PlanningProblem withFirstLatestStarts(Map<String, Long> latestS) {
    return new PlanningProblem(horizonStart, horizonS, tasks, transitions, lastIndex, horizon, requests, windows,
        prizes, structure.withFirstLatestStarts(latestS), requestTransitions, groups);
  }

  /** A copy with these tasks (same ids, same order) and everything else as is. */
  public PlanningProblem withTasks(List<Task> newTasks) {
    for (int k = 0; k < tasks.size(); k++) {
      if (!tasks.get(k).id().equals(newTasks.get(k).id())) {
        throw new IllegalArgumentException("withTasks: task " + k + " is " + newTasks.get(k).id() + ", was "
            + tasks.get(k).id());
      }
    }
    return new PlanningProblem(horizonStart, horizonS, newTasks, transitions, lastIndex, horizon, requests, windows,
        null, structure, requestTransitions, groups);
  }

  /** Index of the request with this id; throws when unknown. */
  public int indexOf(String id) {
    for (int k = 0; k < tasks.size(); k++) {
      if (tasks.get(k).id().equals(id)) {
        return k;
      }
    }
    throw new IllegalArgumentException("unknown request id \"" + id + "\"");
  }

  /** True when some request has a flexible exposure. */
  public boolean hasFlexible() {
    return tasks.stream().anyMatch(t -> t.optionCount() > 1);
  }

  /** Whole seconds from t0 to t, rounded up. */
  public static long ceilSeconds(Instant t0, Instant t) {
    Duration d = Duration.between(t0, t);
    return d.getNano() == 0 ? d.getSeconds() : d.getSeconds() + 1;
  }

  /** Whole seconds from t0 to t, rounded down. */
  public static long floorSeconds(Instant t0, Instant t) {
    return Duration.between(t0, t).getSeconds();
  }

  /** Horizon start (time 0). */
  public Instant horizonStart() {
    return horizonStart;
  }

  /** The horizon as given. */
  public TimeWindow horizon() {
    return horizon;
  }

  /** The requests as given (scenario order). */
  public List<Request> requests() {
    return requests;
  }

  /** The visibility windows as given. */
  public List<RequestWindows> windows() {
    return windows;
  }

  /** Horizon length, whole seconds. */
  public long horizonS() {
    return horizonS;
  }

  /** The tasks in scenario order (= transition indices). */
  public List<Task> tasks() {
    return tasks;
  }

  /** Task k. */
  public Task task(int k) {
    return tasks.get(k);
  }

  /** Number of requests. */
  public int size() {
    return tasks.size();
  }

  /** Transition times between tasks (= between requests when no request has visits). */
  public Transitions transitions() {
    return transitions;
  }

  /** Transition times between requests (file order), configuration changes included. */
  public Transitions requestTransitions() {
    return requestTransitions;
  }

  /** The groups as given (A5). */
  public List<Group> groups() {
    return groups;
  }

  /** The rules between tasks: visits and groups (A4, A5). */
  public Structure structure() {
    return structure;
  }

  /** The id of the request task k observes. */
  public String requestId(int k) {
    int r = structure.requestOf(k);
    return r < 0 ? tasks.get(k).id() : requests.get(r).id();
  }

  /** The resources' sections (A6), or null for a problem with one resource. */
  public Sections sections() {
    return structure.sections();
  }

  /** True when task k is a section marker (A6), not an observation. */
  public boolean isMarker(int k) {
    return structure.sections() != null && structure.sections().isMarker(k);
  }

  /** The instant of planner seconds {@code s} on task k's own resource clock. */
  public Instant instant(int k, long s) {
    Sections sec = structure.sections();
    return horizonStart.plusSeconds(sec == null ? s : sec.localS(k, s));
  }

  /** What the objective collects. */
  public Prizes prizes() {
    return prizes;
  }

  /** Index of the request that must be last when scheduled, or -1. */
  public int mustBeLastIndex() {
    return lastIndex;
  }

  /** The instant {@code s} seconds after the horizon start. */
  public Instant instant(long s) {
    return horizonStart.plusSeconds(s);
  }

  /** Sum of the largest value of every schedulable request: always a valid bound on total priority. */
  public double trivialBound() {
    Sections sec = structure.sections();
    if (sec == null) {
      return tasks.stream().filter(Task::schedulable).mapToDouble(Task::priority).sum();
    }
    double sum = 0;
    for (int u = 0; u < sec.unitCount(); u++) {
      double best = 0;
      for (int k : sec.options(u)) {
        best = tasks.get(k).schedulable() ? Math.max(best, tasks.get(k).priority()) : best;
      }
      sum += best;
    }
    return sum;
  }

  /** Seconds between two sections' offsets: the horizon, so that a section ends where the next starts. */
  private static long sectionLengthS(long horizonS) {
    return horizonS;
  }

  /**
   * Builds the problem of several resources (A6) as {@link Sections}: per resource r (in {@code resourceIds}
   * order) the windows of the requests it may observe ({@code windows.get(r)}, by id; a request without an
   * entry is not observable there) and its transitions indexed by request ({@code transitions.get(r)},
   * configuration changes folded in). Each request becomes one option per resource that has an entry for it,
   * named {@code id@resource}; sections 1… open with a marker task. No groups: see
   * {@link #ofSections(TimeWindow, List, List, List, List, List, long[])}.
   */
  public static PlanningProblem ofSections(TimeWindow horizon, List<Request> requests, List<String> resourceIds,
      List<List<RequestWindows>> windows, List<Transitions> transitions) {
    return ofSections(horizon, requests, resourceIds, windows, transitions, new long[resourceIds.size()]);
  }

  /**
   * As {@link #ofSections(TimeWindow, List, List, List, List)}, with resource r free to leave its start
   * pointing only {@code readyS[r]} seconds after the horizon start (a re-plan: a resource still busy with
   * an observation that began before the re-planning instant). The marker of section r is pinned there, so
   * every leg from it departs no earlier; {@code readyS[0]} must be 0 (section 0 opens at the start
   * pointing, with no marker: the caller puts a resource free at the horizon start first).
   */
  public static PlanningProblem ofSections(TimeWindow horizon, List<Request> requests, List<String> resourceIds,
      List<List<RequestWindows>> windows, List<Transitions> transitions, long[] readyS) {
    return ofSections(horizon, requests, List.of(), resourceIds, windows, transitions, readyS);
  }

  /**
   * As {@link #ofSections(TimeWindow, List, List, List, List, long[])}, with visits (A4) and groups (A5): each
   * visit of a request becomes one option per resource that may observe it ({@code id#v@resource}), the
   * options of one visit a unit of alternatives, so different visits may use different resources (A6); the
   * visit rules hold the options per visit and the groups all options of their members, compared on the
   * resources' own clocks ({@link Structure}).
   */
  public static PlanningProblem ofSections(TimeWindow horizon, List<Request> requests, List<Group> groups,
      List<String> resourceIds, List<List<RequestWindows>> windows, List<Transitions> transitions, long[] readyS) {
    int m = resourceIds.size();
    if (windows.size() != m || transitions.size() != m || readyS.length != m) {
      throw new IllegalArgumentException("ofSections: " + m + " resources, " + windows.size() + " window lists, "
          + transitions.size() + " transition models, " + readyS.length + " ready times");
    }
    if (m > 0 && readyS[0] != 0) {
      throw new IllegalArgumentException("ofSections: the first resource must be ready at the horizon start, not "
          + readyS[0] + " s after it");
    }
    Instant t0 = horizon.start();
    long horizonS = (long) Math.floor(horizon.durationS());
    long length = sectionLengthS(horizonS);
    long[] offsets = new long[m];
    for (int r = 1; r < m; r++) {
      offsets[r] = offsets[r - 1] + length;
    }
    List<Map<String, RequestWindows>> byId = new ArrayList<>();
    for (List<RequestWindows> ws : windows) {
      Map<String, RequestWindows> map = new HashMap<>();
      for (RequestWindows w : ws) {
        map.put(w.id(), w);
      }
      byId.add(map);
    }
    List<Task> tasks = new ArrayList<>();
    List<Integer> sectionOf = new ArrayList<>();
    List<Boolean> marker = new ArrayList<>();
    List<Integer> requestOf = new ArrayList<>();
    List<Integer> visitOf = new ArrayList<>();
    List<Integer> unitOf = new ArrayList<>();
    int[] firstUnit = new int[requests.size() + 1];
    for (int k = 0; k < requests.size(); k++) {
      firstUnit[k + 1] = firstUnit[k] + requests.get(k).visits().count();
    }
    boolean[] required = new boolean[firstUnit[requests.size()]];
    boolean[] anywhere = new boolean[requests.size()];
    for (int r = 0; r < m; r++) {
      for (int k = 0; k < requests.size(); k++) {
        anywhere[k] |= byId.get(r).containsKey(requests.get(k).id());
      }
    }
    for (int r = 0; r < m; r++) {
      if (r > 0) {
        if (readyS[r] < 0 || readyS[r] > horizonS) {
          throw new IllegalArgumentException("ofSections: resource " + resourceIds.get(r) + " ready " + readyS[r]
              + " s after the horizon start, outside [0, " + horizonS + "]");
        }
        tasks.add(Task.marker("|" + resourceIds.get(r) + "|", offsets[r] + readyS[r]));
        sectionOf.add(r);
        marker.add(true);
        requestOf.add(-1);
        visitOf.add(1);
        unitOf.add(-1);
      }
      for (int k = 0; k < requests.size(); k++) {
        Request q = requests.get(k);
        RequestWindows rw = byId.get(r).get(q.id());
        if (rw == null && (anywhere[k] || r > 0)) {
          continue; // a request no resource may observe keeps one option, never visible, to be listed
        }
        String where = "requests[" + k + "] (id \"" + q.id() + "\")";
        List<Span> spans = new ArrayList<>();
        for (Span sp : spans(t0, horizonS, rw == null ? List.of() : rw.intervals())) {
          spans.add(new Span(sp.fromS() + offsets[r], sp.toS() + offsets[r]));
        }
        Task one = q.isFlexible() ? flexibleTask(q, where, spans)
            : Task.fixedInSpans(q.id(), whole(q.durationS(), where + ".durationS"), q.priority(), false, spans);
        int count = q.visits().count();
        for (int i = 0; i < count; i++) {
          tasks.add(one.withRequired(false).withId(q.id() + (count > 1 ? "#" + (i + 1) : "") + "@"
              + resourceIds.get(r)));
          sectionOf.add(r);
          marker.add(false);
          requestOf.add(k);
          visitOf.add(i + 1);
          unitOf.add(firstUnit[k] + i);
          required[firstUnit[k] + i] = q.required();
        }
      }
    }
    int n = tasks.size();
    int[] sec = sectionOf.stream().mapToInt(Integer::intValue).toArray();
    boolean[] mk = new boolean[n];
    for (int k = 0; k < n; k++) {
      mk[k] = marker.get(k);
    }
    int[] rq = requestOf.stream().mapToInt(Integer::intValue).toArray();
    int[] units = unitOf.stream().mapToInt(Integer::intValue).toArray();
    Sections sections = new Sections(resourceIds, offsets, sec, mk, units, rq, required)
        .withInputs(windows, transitions);
    List<Structure.VisitRule> visitRules = new ArrayList<>();
    Map<String, int[]> tasksOf = new HashMap<>();
    for (int k = 0; k < requests.size(); k++) {
      Request q = requests.get(k);
      tasksOf.put(q.id(), sections.requestOptions(k));
      if (!q.hasVisits()) {
        continue;
      }
      int[][] perVisit = new int[q.visits().count()][];
      for (int i = 0; i < perVisit.length; i++) {
        perVisit[i] = sections.options(firstUnit[k] + i);
      }
      Visits v = q.visits();
      visitRules.add(new Structure.VisitRule(k, perVisit, (long) Math.ceil(v.minSeparationS() - 1e-9),
          v.maxSeparationS() == null ? -1 : (long) Math.floor(v.maxSeparationS() + 1e-9), v.onePerWindow(),
          v.allOrNothing()));
    }
    List<Structure.GroupRule> groupRules = groupRules(groups, tasksOf);
    Structure structure = new Structure(rq, visitOf.stream().mapToInt(Integer::intValue).toArray(), visitRules,
        groupRules, sections);
    Transitions byTask = new SectionTransitions(transitions, sections, rq);
    Prizes prizes = Prizes.of(tasks, mk);
    return new PlanningProblem(t0, offsets[m - 1] + horizonS, tasks, byTask, -1, horizon, requests, List.of(),
        prizes, structure, byTask, groups);
  }
}
