package dev.sequencer.sequence.problem;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;

/**
 * One request in solver units: its id, whether it is required, the exposures it may take with the value
 * each collects, and the spans that may hold a whole observation.
 *
 * <p>Every task carries its exposure options: option g lasts {@code minDurationS + g·stepS} seconds
 * (g = 0 … count − 1) and collects {@code value(g)}. A fixed-duration request has one option (its duration
 * and priority); a flexible one (extension "flexible exposure time") the grid of its curve. So no layer
 * tells the two kinds apart by a missing value; {@link #flexible()} only says whether the timeline must
 * carry the collected value. Spans are whole seconds from the horizon start, rounded inward from the
 * visibility windows; an observation [s, s + d] is allowed when one span holds it. {@link #starts()} are
 * the starts allowed for the shortest exposure (merged). A task without any start is unschedulable and
 * {@link #emptyReason()} says why ({@code null} otherwise). Immutable.
 */
public final class Task {
  /**
   * Largest priority (or flexible value) the planner takes: CP-SAT needs integer priorities (scaled by up
   * to 1000), and their sum over 10,000 requests must stay far below 2^63 (1e9 × 1000 × 1e4 = 1e16).
   */
  public static final double MAX_PRIORITY = 1e9;
  /** The priority bound given to a flexible request whose curve is 0 everywhere (priorities must be > 0). */
  static final double MIN_FLEXIBLE_PRIORITY = 1e-9;

  private final String id;
  private final boolean required;
  private final boolean flexible;
  private final long minDurationS;
  private final long stepS;
  private final double[] values;
  private final List<Span> spans;
  private final List<StartRange> starts;
  private final String emptyReason;
  private final boolean marker;

  private Task(String id, boolean required, boolean flexible, long minDurationS, long stepS, double[] values,
      List<Span> spans, String noWindowReason) {
    this(id, required, flexible, minDurationS, stepS, values, spans, noWindowReason, false);
  }

  private Task(String id, boolean required, boolean flexible, long minDurationS, long stepS, double[] values,
      List<Span> spans, String noWindowReason, boolean marker) {
    this.marker = marker;
    this.id = Objects.requireNonNull(id, "id");
    this.required = required;
    this.flexible = flexible;
    this.minDurationS = minDurationS;
    this.stepS = stepS;
    this.values = values.clone();
    this.spans = List.copyOf(spans);
    if (minDurationS < 0) {
      throw new IllegalArgumentException("request " + id + ": durationS must be >= 0, got " + minDurationS);
    }
    if (stepS <= 0) {
      throw new IllegalArgumentException("request " + id + ": durationStepS must be > 0, got " + stepS);
    }
    if (values.length == 0) {
      throw new IllegalArgumentException("request " + id + ": no exposure option");
    }
    for (double v : values) {
      if (!Double.isFinite(v) || v < 0 || (!flexible && !marker && !(v > 0))) {
        throw new IllegalArgumentException("request " + id + ": " + (flexible ? "values must be finite numbers >= 0"
            : "priority must be a finite number > 0") + ", got " + v);
      }
      if (v > MAX_PRIORITY) {
        throw new IllegalArgumentException("request " + id + ": " + (flexible ? "value " : "priority ") + v
            + " is above the largest the planner takes, " + MAX_PRIORITY);
      }
    }
    List<StartRange> s = new ArrayList<>();
    for (Span sp : this.spans) {
      if (sp.toS() - sp.fromS() >= minDurationS) {
        s.add(new StartRange(sp.fromS(), sp.toS() - minDurationS));
      }
    }
    this.starts = merge(s);
    this.emptyReason = starts.isEmpty() ? (noWindowReason != null ? noWindowReason
        : this.spans.isEmpty() ? Reasons.NEVER_VISIBLE : Reasons.WINDOWS_TOO_SHORT) : null;
  }

  /**
   * A fixed-duration task: {@code durationS} seconds, priority > 0, allowed starts (any order; empty when
   * it cannot be scheduled, then it is "never visible").
   */
  public static Task fixed(String id, long durationS, double priority, boolean required, List<StartRange> starts) {
    List<Span> spans = new ArrayList<>();
    for (StartRange r : starts) {
      spans.add(new Span(r.fromS(), r.toS() + durationS));
    }
    return new Task(id, required, false, durationS, 1, new double[] {priority}, spans, null);
  }

  /** A fixed-duration task whose whole observation must lie in one of {@code spans}. */
  public static Task fixedInSpans(String id, long durationS, double priority, boolean required, List<Span> spans) {
    return new Task(id, required, false, durationS, 1, new double[] {priority}, spans, null);
  }

  /**
   * A flexible task: exposure option g lasts {@code minDurationS + g·stepS} and collects {@code values[g]}
   * (>= 0); the whole observation must lie in one of {@code spans}.
   */
  public static Task flexible(String id, long minDurationS, long stepS, double[] values, boolean required,
      List<Span> spans) {
    return new Task(id, required, true, minDurationS, stepS, values, spans, null);
  }

  /**
   * A section marker of several resources ({@link Sections}): required, zero length, worth nothing, pinned at
   * {@code atS}. Only {@link PlanningProblem#ofSections} makes them.
   */
  static Task marker(String id, long atS) {
    return new Task(id, true, false, 0, 1, new double[] {0}, List.of(new Span(atS, atS)), null, true);
  }

  /** A copy with another required flag. */
  public Task withRequired(boolean value) {
    return new Task(id, value, flexible, minDurationS, stepS, values, spans, null, marker);
  }

  /**
   * A copy whose starts are at most {@code latestS} (a re-plan: the next visit of a request part done, within
   * {@code maxSeparationS} of the last visit done). Each span ends by {@code latestS} + the shortest exposure:
   * exact for a fixed duration; for a flexible exposure a longer option must then start earlier than
   * {@code latestS} (conservative, never allowing a late start). {@code why} is the reason when nothing is left.
   */
  public Task withLatestStart(long latestS, String why) {
    List<Span> clipped = new ArrayList<>();
    for (Span sp : spans) {
      long to = Math.min(sp.toS(), latestS + minDurationS);
      if (to >= sp.fromS()) {
        clipped.add(new Span(sp.fromS(), to));
      }
    }
    return new Task(id, required, flexible, minDurationS, stepS, values, clipped, emptyReason != null ? emptyReason
        : why, marker);
  }

  /** A copy with another id (a visit of a request observed several times). */
  public Task withId(String newId) {
    return new Task(newId, required, flexible, minDurationS, stepS, values, spans, null, marker);
  }

  public String id() {
    return id;
  }

  public boolean required() {
    return required;
  }

  /** True for a flexible-exposure request: its observations carry the collected value in the timeline. */
  public boolean flexible() {
    return flexible;
  }

  /** Number of exposure options (1 for a fixed duration). */
  public int optionCount() {
    return values.length;
  }

  /** Seconds of exposure option g. */
  public long durationS(int g) {
    return minDurationS + g * stepS;
  }

  /** Value (priority) collected by exposure option g. */
  public double value(int g) {
    return values[g];
  }

  /** Grid step of the exposure options, seconds (1 for a fixed duration). */
  public long stepS() {
    return stepS;
  }

  /** Shortest exposure: the duration of a fixed request. */
  public long durationS() {
    return minDurationS;
  }

  /** Longest exposure option, seconds. */
  public long maxDurationS() {
    return durationS(values.length - 1);
  }

  /** The largest value any option collects (the priority of a fixed request): a bound for relaxations; > 0. */
  public double priority() {
    double m = 0;
    for (double v : values) {
      m = Math.max(m, v);
    }
    return Math.max(m, MIN_FLEXIBLE_PRIORITY);
  }

  /** True when an exposure of {@code durationS} seconds is one of this task's options. */
  public boolean hasOption(long durationS) {
    long off = durationS - minDurationS;
    return off >= 0 && off % stepS == 0 && off / stepS < values.length;
  }

  /** The option index of an exposure of {@code durationS}; throws when it is not an option (a bug). */
  public int option(long durationS) {
    long off = durationS - minDurationS;
    if (!hasOption(durationS)) {
      throw new IllegalStateException("request " + id + ": exposure " + durationS + " s is not an option ("
          + minDurationS + " + k·" + stepS + " s, k < " + values.length + ")");
    }
    return (int) (off / stepS);
  }

  /** The value collected by an exposure of {@code durationS} seconds. */
  public double valueFor(long durationS) {
    return values[option(durationS)];
  }

  /** The spans that may each hold a whole observation (ordered as given). */
  public List<Span> spans() {
    return spans;
  }

  /** Allowed starts for the shortest exposure: ordered, disjoint; empty when unschedulable. */
  public List<StartRange> starts() {
    return starts;
  }

  /** Why the task cannot be scheduled at all, or {@code null} when it can. */
  public String emptyReason() {
    return emptyReason;
  }

  /** True when some start is allowed. */
  public boolean schedulable() {
    return !starts.isEmpty();
  }

  /** Earliest allowed start, seconds; only for a schedulable task. */
  public long earliestStartS() {
    return starts.get(0).fromS();
  }

  /** Latest allowed start (shortest exposure), seconds; only for a schedulable task. */
  public long latestStartS() {
    return starts.get(starts.size() - 1).toS();
  }

  /** Smallest allowed start {@code >= t} for the shortest exposure, or -1 when none. */
  public long firstStartAtOrAfter(long t) {
    for (StartRange r : starts) {
      if (t <= r.toS()) {
        return Math.max(t, r.fromS());
      }
    }
    return -1;
  }

  /** True when {@code s} is an allowed start for the shortest exposure. */
  public boolean allows(long s) {
    for (StartRange r : starts) {
      if (s >= r.fromS() && s <= r.toS()) {
        return true;
      }
    }
    return false;
  }

  /** True when one span holds the observation [s, s + d]. */
  public boolean fits(long s, long d) {
    for (Span sp : spans) {
      if (sp.holds(s, d)) {
        return true;
      }
    }
    return false;
  }

  /** Smallest start {@code >= t} at which one span holds an observation of {@code d} seconds; -1 when none. */
  public long firstFittingStart(long t, long d) {
    long best = -1;
    for (Span sp : spans) {
      long s = Math.max(t, sp.fromS());
      if (s + d <= sp.toS() && (best < 0 || s < best)) {
        best = s;
      }
    }
    return best;
  }

  /** Largest start {@code <= latestS} at which one span holds an observation of {@code d} seconds; -1 when none. */
  public long latestFittingStart(long latestS, long d) {
    long best = -1;
    for (Span sp : spans) {
      long s = Math.min(latestS, sp.toS() - d);
      if (s >= sp.fromS()) {
        best = Math.max(best, s);
      }
    }
    return best;
  }

  /** The latest end allowed for an observation that starts at {@code startS}, or -1 when no span holds the start. */
  public long latestEndFor(long startS) {
    long best = -1;
    for (Span s : spans) {
      if (startS >= s.fromS() && startS <= s.toS()) {
        best = Math.max(best, s.toS());
      }
    }
    return best;
  }

  /** The span that holds [s, s + d]; throws when none does (a bug). */
  public Span spanHolding(long s, long d) {
    for (Span sp : spans) {
      if (sp.holds(s, d)) {
        return sp;
      }
    }
    throw new IllegalStateException("observation of " + id + " at " + s + " s for " + d + " s lies in no window (a bug)");
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

  @Override
  public String toString() {
    return "Task[" + id + (required ? ", required" : "") + ", " + (values.length == 1 ? minDurationS + " s"
        : minDurationS + ".." + maxDurationS() + " s") + ", values " + Arrays.toString(values) + ", starts " + starts
        + "]";
  }
}
