package dev.sequencer.sequence;

import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.slew.Transitions;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * The sequencer's input in integer seconds from the horizon start: per request its duration, priority,
 * required flag and the intervals where it may START, plus the transition times.
 *
 * <p>Request k (in scenario order) is transition index k. Start intervals are rounded inward (window
 * start rounded up, window end rounded down), so any start in them keeps the whole observation inside a
 * visibility window. Immutable.
 */
public final class PlanningProblem {
  /**
   * Largest priority (or flexible value) the planner takes: CP-SAT needs integer priorities (scaled by up
   * to 1000), and their sum over 10,000 requests must stay far below 2^63 (1e9 × 1000 × 1e4 = 1e16).
   */
  public static final double MAX_PRIORITY = 1e9;

  /** Reason given for a request without any visibility window. */
  public static final String NEVER_VISIBLE = "never visible";
  /** Reason given for a request whose windows are all too short (after inward rounding to seconds). */
  public static final String WINDOWS_TOO_SHORT = "windows shorter than its duration";
  /** Reason given for a schedulable request that the plan leaves out. */
  public static final String LOST_TO_CONFLICTS = "lost to conflicts";

  /** Closed range of allowed start times, seconds from the horizon start; {@code fromS <= toS}. */
  public record StartRange(long fromS, long toS) {
    public StartRange {
      if (toS < fromS) {
        throw new IllegalArgumentException("start range [" + fromS + ", " + toS + "] is reversed");
      }
    }
  }

  /**
   * One request: id, duration (integer seconds), priority (> 0), required flag and allowed start ranges
   * (ordered, disjoint; empty when it cannot be scheduled, then {@code emptyReason} says why).
   */
  public record Task(
      String id, long durationS, double priority, boolean required, List<StartRange> starts, String emptyReason) {
    public Task {
      Objects.requireNonNull(id, "id");
      starts = List.copyOf(starts);
      if (durationS < 0) {
        throw new IllegalArgumentException("request " + id + ": durationS must be >= 0, got " + durationS);
      }
      if (!(priority > 0) || !Double.isFinite(priority)) {
        throw new IllegalArgumentException("request " + id + ": priority must be a finite number > 0, got " + priority);
      }
      if (priority > MAX_PRIORITY) {
        throw new IllegalArgumentException("request " + id + ": priority " + priority + " is above the largest the "
            + "planner takes, " + MAX_PRIORITY);
      }
    }

    /** Earliest allowed start, seconds; only for a schedulable task. */
    public long earliestStartS() {
      return starts.get(0).fromS();
    }

    /** Latest allowed start, seconds; only for a schedulable task. */
    public long latestStartS() {
      return starts.get(starts.size() - 1).toS();
    }

    /** True when some start is allowed. */
    public boolean schedulable() {
      return !starts.isEmpty();
    }

    /** Smallest allowed start {@code >= t}, or -1 when none. */
    public long firstStartAtOrAfter(long t) {
      for (StartRange r : starts) {
        if (t <= r.toS()) {
          return Math.max(t, r.fromS());
        }
      }
      return -1;
    }

    /** True when {@code s} is an allowed start. */
    public boolean allows(long s) {
      for (StartRange r : starts) {
        if (s >= r.fromS() && s <= r.toS()) {
          return true;
        }
      }
      return false;
    }
  }

  private final Instant horizonStart;
  private final long horizonS;
  private final List<Task> tasks;
  private final Transitions transitions;
  private final int lastIndex;
  private final TimeWindow horizon;
  private final List<Request> requests;
  private final List<RequestWindows> windows;
  /** Per request: its exposure grid, or null for fixed-duration requests (flexible-exposure extension). */
  private final List<Exposure> exposures;

  private PlanningProblem(Instant horizonStart, long horizonS, List<Task> tasks, Transitions transitions, int lastIndex,
      TimeWindow horizon, List<Request> requests, List<RequestWindows> windows) {
    this.horizonStart = Objects.requireNonNull(horizonStart, "horizonStart");
    this.horizon = horizon;
    this.requests = List.copyOf(requests);
    this.windows = List.copyOf(windows);
    this.horizonS = horizonS;
    this.tasks = List.copyOf(tasks);
    this.transitions = Objects.requireNonNull(transitions, "transitions");
    this.lastIndex = lastIndex;
    this.exposures = exposuresOf(horizonStart, horizonS, this.requests, this.windows, this.tasks.size());
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
  }

  /** Builds the problem from the scenario's requests, their visibility windows (any order, by id) and transitions. */
  public static PlanningProblem of(Scenario scenario, List<RequestWindows> windows, Transitions transitions) {
    return of(scenario.horizon(), scenario.requests(), windows, transitions);
  }

  /**
   * Builds the problem from requests and visibility windows (already intersected with each request's own
   * windows). A request without a {@link RequestWindows} entry is never visible. Durations must be whole
   * seconds; flexible requests (whole-second minimum and step) get their exposure grid.
   */
  public static PlanningProblem of(
      TimeWindow horizon, List<Request> requests, List<RequestWindows> windows, Transitions transitions) {
    Map<String, RequestWindows> byId = new HashMap<>();
    for (RequestWindows w : windows) {
      byId.put(w.id(), w);
    }
    Instant t0 = horizon.start();
    long horizonS = (long) Math.floor(horizon.durationS());
    List<Task> tasks = new ArrayList<>();
    for (int k = 0; k < requests.size(); k++) {
      Request r = requests.get(k);
      String where = "requests[" + k + "] (id \"" + r.id() + "\")";
      RequestWindows rwFlex = byId.get(r.id());
      if (r.isFlexible()) {
        tasks.add(flexibleTask(r, where, t0, horizonS, rwFlex == null ? List.of() : rwFlex.intervals(), transitions));
        continue;
      }
      double d = r.durationS();
      if (d < 0 || d != Math.rint(d)) {
        throw new IllegalArgumentException(where + ".durationS: must be a whole number of seconds >= 0, got " + d);
      }
      long dur = (long) d;
      RequestWindows rw = byId.get(r.id());
      List<TimeWindow> intervals = rw == null ? List.of() : rw.intervals();
      List<StartRange> starts = new ArrayList<>();
      for (TimeWindow w : intervals) {
        long from = Math.max(0, ceilSeconds(t0, w.start()));
        long to = Math.min(horizonS, floorSeconds(t0, w.end())) - dur;
        if (from <= to) {
          starts.add(new StartRange(from, to));
        }
      }
      starts = merge(starts);
      String reason = starts.isEmpty() ? (intervals.isEmpty() ? NEVER_VISIBLE : WINDOWS_TOO_SHORT) : null;
      tasks.add(new Task(r.id(), dur, r.priority(), r.required(), starts, reason));
    }
    return new PlanningProblem(t0, horizonS, tasks, transitions, -1, horizon, requests, windows);
  }

  /**
   * The task of a flexible request (extension "flexible exposure time"): duration = the shortest grid
   * exposure, priority = the largest grid value (so bounds computed from tasks stay valid), starts = the
   * starts that leave room for the shortest exposure inside one window. The model and the planners read
   * the full grid from {@link #exposure(int)}.
   */
  private static Task flexibleTask(Request r, String where, Instant t0, long horizonS, List<TimeWindow> intervals,
      Transitions transitions) {
    if (transitions.timeDependent()) {
      throw new IllegalArgumentException(where + ": flexible exposure with time-dependent transitions (alt-az "
          + "mount or moving targets) is not supported by the sequencer yet");
    }
    Exposure e = Exposure.of(r.flexible(), t0, horizonS, intervals, where);
    List<StartRange> starts = new ArrayList<>();
    for (Exposure.Span sp : e.spans()) {
      starts.add(new StartRange(sp.fromS(), sp.toS() - e.minS()));
    }
    starts = merge(starts);
    String reason = starts.isEmpty() ? (intervals.isEmpty() ? NEVER_VISIBLE : WINDOWS_TOO_SHORT) : null;
    // Task priorities must be > 0; a curve that is 0 everywhere is worth (almost) nothing.
    double best = Math.max(e.maxValue(), MIN_FLEXIBLE_PRIORITY);
    return new Task(r.id(), e.minS(), best, r.required(), starts, reason);
  }

  /** Task priority given to a flexible request whose curve is 0 everywhere (tasks need priority > 0). */
  static final double MIN_FLEXIBLE_PRIORITY = 1e-9;

  /** The exposure grid of request k, or {@code null} for a fixed-duration request. */
  Exposure exposure(int k) {
    return exposures.get(k);
  }

  /** True when some request has a flexible exposure. */
  public boolean hasFlexible() {
    return exposures.stream().anyMatch(java.util.Objects::nonNull);
  }

  /** Longest time request k can occupy: its duration, or its longest grid exposure. */
  long maxDurationS(int k) {
    Exposure e = exposures.get(k);
    return e == null ? tasks.get(k).durationS() : e.maxS();
  }

  /** Builds a problem directly from tasks (tests, benchmarks); {@code horizonS} is the horizon length. */
  public static PlanningProblem ofTasks(Instant horizonStart, long horizonS, List<Task> tasks, Transitions transitions) {
    List<Request> requests = new ArrayList<>();
    List<RequestWindows> windows = new ArrayList<>();
    for (Task t : tasks) {
      requests.add(new Request(t.id(), null, (double) t.durationS(), t.priority(), t.required(), List.of(), null));
      List<TimeWindow> w = new ArrayList<>();
      for (StartRange r : t.starts()) {
        w.add(new TimeWindow(horizonStart.plusSeconds(r.fromS()), horizonStart.plusSeconds(r.toS() + t.durationS())));
      }
      windows.add(new RequestWindows(t.id(), w));
    }
    return new PlanningProblem(horizonStart, horizonS, tasks, transitions, -1,
        new TimeWindow(horizonStart, horizonStart.plusSeconds(horizonS)), requests, windows);
  }

  /**
   * A copy in which request {@code id}, when scheduled, must be the last observation (used for a
   * return-to-base request).
   */
  public PlanningProblem withMustBeLast(String id) {
    for (int k = 0; k < tasks.size(); k++) {
      if (tasks.get(k).id().equals(id)) {
        return new PlanningProblem(horizonStart, horizonS, tasks, transitions, k, horizon, requests, windows);
      }
    }
    throw new IllegalArgumentException("mustBeLast: unknown request id \"" + id + "\"");
  }

  /** The exposure grid of every flexible request (null entries for fixed ones). */
  private static List<Exposure> exposuresOf(Instant t0, long horizonS, List<Request> requests,
      List<RequestWindows> windows, int size) {
    Map<String, RequestWindows> byId = new HashMap<>();
    for (RequestWindows w : windows) {
      byId.put(w.id(), w);
    }
    List<Exposure> out = new ArrayList<>();
    for (int k = 0; k < size; k++) {
      Request r = k < requests.size() ? requests.get(k) : null;
      if (r == null || !r.isFlexible()) {
        out.add(null);
        continue;
      }
      RequestWindows rw = byId.get(r.id());
      out.add(Exposure.of(r.flexible(), t0, horizonS, rw == null ? List.of() : rw.intervals(),
          "requests[" + k + "] (id \"" + r.id() + "\")"));
    }
    return java.util.Collections.unmodifiableList(out);
  }

  private static List<StartRange> merge(List<StartRange> in) {
    List<StartRange> sorted = new ArrayList<>(in);
    sorted.sort((a, b) -> Long.compare(a.fromS(), b.fromS()));
    List<StartRange> out = new ArrayList<>();
    for (StartRange r : sorted) {
      if (!out.isEmpty() && r.fromS() <= out.get(out.size() - 1).toS() + 1) {
        StartRange last = out.remove(out.size() - 1);
        out.add(new StartRange(last.fromS(), Math.max(last.toS(), r.toS())));
      } else {
        out.add(r);
      }
    }
    return out;
  }

  /** Whole seconds from t0 to t, rounded up. */
  static long ceilSeconds(Instant t0, Instant t) {
    Duration d = Duration.between(t0, t);
    return d.getNano() == 0 ? d.getSeconds() : d.getSeconds() + 1;
  }

  /** Whole seconds from t0 to t, rounded down. */
  static long floorSeconds(Instant t0, Instant t) {
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

  /** The requests in scenario order (= transition indices). */
  public List<Task> tasks() {
    return tasks;
  }

  /** Number of requests. */
  public int size() {
    return tasks.size();
  }

  /** Transition times between requests. */
  public Transitions transitions() {
    return transitions;
  }

  /** Index of the request that must be last when scheduled, or -1. */
  public int mustBeLastIndex() {
    return lastIndex;
  }

  /** The instant {@code s} seconds after the horizon start. */
  public Instant instant(long s) {
    return horizonStart.plusSeconds(s);
  }
}
