package dev.sequencer.sequence;

import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.TimeWindow;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/**
 * The exposure grid of one flexible request in solver units: exposures {@code minS + g·stepS} for
 * {@code g = 0 .. count − 1} (whole seconds), the value collected at each, and the spans (whole seconds
 * from the horizon start, rounded inward) that must each hold a whole observation.
 *
 * <p>The grid stops at the largest point ≤ {@code maxDurationS} and ≤ the longest span, so every grid
 * point can occur in some window. Values are the curve's linear interpolation at each grid point.
 */
record Exposure(long minS, long stepS, double[] values, List<Span> spans) {
  /** A closed span [fromS, toS] of seconds from the horizon start in which a whole observation must lie. */
  record Span(long fromS, long toS) {}

  Exposure {
    values = values.clone();
    spans = List.copyOf(spans);
  }

  /** Number of grid points (at least 1). */
  int count() {
    return values.length;
  }

  /** Exposure at grid point g, seconds. */
  long durationS(int g) {
    return minS + g * stepS;
  }

  /** Longest exposure on the grid, seconds. */
  long maxS() {
    return durationS(count() - 1);
  }

  /** Grid index of an exposure of {@code durationS}; throws when it is not a grid point (a bug). */
  int index(long durationS) {
    long off = durationS - minS;
    if (off < 0 || off % stepS != 0 || off / stepS >= count()) {
      throw new IllegalStateException("exposure " + durationS + " s is not on the grid " + minS + " + k·" + stepS
          + " (k < " + count() + ")");
    }
    return (int) (off / stepS);
  }

  /** Largest grid value. */
  double maxValue() {
    double m = 0;
    for (double v : values) {
      m = Math.max(m, v);
    }
    return m;
  }

  /** The latest end allowed for an observation that starts at {@code startS}, or -1 when no span holds the start. */
  long latestEndFor(long startS) {
    long best = -1;
    for (Span s : spans) {
      if (startS >= s.fromS() && startS <= s.toS()) {
        best = Math.max(best, s.toS());
      }
    }
    return best;
  }

  /**
   * The grid of {@code f} inside {@code windows} (clipped to [0, horizonS], rounded inward); {@code where}
   * names the request in errors. Exposure bounds and step must be whole seconds.
   */
  static Exposure of(FlexibleExposure f, Instant t0, long horizonS, List<TimeWindow> windows, String where) {
    long min = whole(f.minDurationS(), where + ".minDurationS");
    long step = whole(f.durationStepS(), where + ".durationStepS");
    if (step <= 0) {
      throw new IllegalArgumentException(where + ".durationStepS: must be > 0, got " + f.durationStepS());
    }
    if (f.maxDurationS() < f.minDurationS()) {
      throw new IllegalArgumentException(where + ".maxDurationS: must be >= minDurationS " + f.minDurationS()
          + ", got " + f.maxDurationS());
    }
    List<Span> spans = new ArrayList<>();
    long longest = -1;
    for (TimeWindow w : windows) {
      long from = Math.max(0, PlanningProblem.ceilSeconds(t0, w.start()));
      long to = Math.min(horizonS, PlanningProblem.floorSeconds(t0, w.end()));
      if (to - from >= min) {
        spans.add(new Span(from, to));
        longest = Math.max(longest, to - from);
      }
    }
    long top = (long) Math.floor(f.maxDurationS() + 1e-9);
    if (longest >= 0) {
      top = Math.min(top, longest);
    }
    int count = (int) Math.max(1, (top - min) / step + 1);
    double[] values = new double[count];
    for (int g = 0; g < count; g++) {
      values[g] = f.valueAt(min + g * step);
      if (values[g] > PlanningProblem.MAX_PRIORITY) {
        throw new IllegalArgumentException("value " + values[g] + " at " + (min + g * step) + " s is above the largest "
            + "the planner takes, " + PlanningProblem.MAX_PRIORITY);
      }
    }
    return new Exposure(min, step, values, spans);
  }

  private static long whole(double v, String path) {
    if (v < 0 || v != Math.rint(v)) {
      throw new IllegalArgumentException(path + ": must be a whole number of seconds >= 0, got " + v);
    }
    return (long) v;
  }
}
