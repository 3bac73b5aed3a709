package dev.sequencer.sequence;

import dev.sequencer.sequence.PlanningProblem.Task;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * A sequence of request indices with their start seconds, in time order, and the exposure of each
 * observation ({@code durS}; {@code null} means every request at its task duration, which for a flexible
 * request is its shortest exposure).
 */
record Plan(int[] order, long[] startS, long[] durS) {
  static final Plan EMPTY = new Plan(new int[0], new long[0]);

  /** A plan with every request at its task duration. */
  Plan(int[] order, long[] startS) {
    this(order, startS, null);
  }

  /** Seconds observation q lasts. */
  long durationS(PlanningProblem p, int q) {
    return durS == null ? p.tasks().get(order[q]).durationS() : durS[q];
  }

  /** The exposures of all observations (a new array). */
  long[] durations(PlanningProblem p) {
    long[] out = new long[order.length];
    for (int q = 0; q < order.length; q++) {
      out[q] = durationS(p, q);
    }
    return out;
  }

  /** Value of observation q: the priority of a fixed request, the curve value of a flexible one. */
  double value(PlanningProblem p, int q) {
    Exposure e = p.exposure(order[q]);
    return e == null ? p.tasks().get(order[q]).priority() : e.values()[e.index(durationS(p, q))];
  }

  /** Number of observations. */
  int size() {
    return order.length;
  }

  /** Total priority (unscaled). */
  double priority(PlanningProblem p) {
    double sum = 0;
    for (int q = 0; q < order.length; q++) {
      sum += value(p, q);
    }
    return sum;
  }

  /** Total scaled integer priority (flexible requests: scaled value at their exposure). */
  long scaledPriority(PlanningProblem p, PriorityScale scale) {
    long sum = 0;
    for (int q = 0; q < order.length; q++) {
      sum += scale.scaledFor(p, order[q], durationS(p, q));
    }
    return sum;
  }

  /** Sum of model arc costs along the sequence (from the start pointing; no cost after the last). */
  long modelTransitionS(ArcCosts arcs) {
    long sum = 0;
    int prev = Transitions.START;
    for (int k : order) {
      sum += arcs.costFrom(prev, k);
      prev = k;
    }
    return sum;
  }

  /** True when the plan respects start ranges and model transitions. */
  boolean modelFeasible(PlanningProblem p, ArcCosts arcs) {
    long end = 0;
    int prev = Transitions.START;
    for (int k = 0; k < order.length; k++) {
      Task t = p.tasks().get(order[k]);
      long c = arcs.costFrom(prev, order[k]);
      long d = durationS(p, k);
      if (c < 0 || startS[k] < end + c || !t.allows(startS[k]) || !fits(p, order[k], startS[k], d)) {
        return false;
      }
      end = startS[k] + d;
      prev = order[k];
    }
    return true;
  }

  /**
   * Earliest-start schedule of {@code order} under model transitions: each request starts at its first
   * allowed start after the previous end plus the arc cost; requests that no longer fit are dropped.
   */
  static Plan retime(PlanningProblem p, ArcCosts arcs, int[] order) {
    return retime(p, arcs, order, null);
  }

  /** True when a flexible request's observation [s, s + d] lies in one of its spans (always true for fixed). */
  static boolean fits(PlanningProblem p, int k, long s, long d) {
    Exposure e = p.exposure(k);
    if (e == null) {
      return true;
    }
    e.index(d); // throws on an off-grid exposure (a bug)
    return s + d <= e.latestEndFor(s);
  }

  /**
   * As {@link #retime(PlanningProblem, ArcCosts, int[])} with the exposures {@code durS} (parallel to
   * {@code order}; null = task durations): a flexible request starts at the first allowed second whose
   * span still holds its exposure.
   */
  static Plan retime(PlanningProblem p, ArcCosts arcs, int[] order, long[] durS) {
    List<Long> keptDur = new ArrayList<>();
    List<Integer> keptOrder = new ArrayList<>();
    List<Long> keptStart = new ArrayList<>();
    long end = 0;
    int prev = Transitions.START;
    for (int q = 0; q < order.length; q++) {
      int k = order[q];
      long c = arcs.costFrom(prev, k);
      if (c < 0) {
        continue;
      }
      Task t = p.tasks().get(k);
      long d = durS == null ? t.durationS() : durS[q];
      long s = firstFittingStart(p, k, end + c, d);
      if (s < 0) {
        continue;
      }
      keptOrder.add(k);
      keptStart.add(s);
      keptDur.add(d);
      end = s + d;
      prev = k;
    }
    return new Plan(keptOrder.stream().mapToInt(Integer::intValue).toArray(),
        keptStart.stream().mapToLong(Long::longValue).toArray(),
        durS == null ? null : keptDur.stream().mapToLong(Long::longValue).toArray());
  }

  /** First allowed start >= t of request k for which [s, s + d] fits in one window; -1 when none. */
  static long firstFittingStart(PlanningProblem p, int k, long t, long d) {
    Task task = p.tasks().get(k);
    Exposure e = p.exposure(k);
    if (e == null) {
      return task.firstStartAtOrAfter(t);
    }
    long best = -1;
    for (Exposure.Span sp : e.spans()) {
      long s = Math.max(t, sp.fromS());
      if (s + d <= sp.toS() && (best < 0 || s < best)) {
        best = s;
      }
    }
    return best;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Plan q && Arrays.equals(order, q.order) && Arrays.equals(startS, q.startS)
        && Arrays.equals(durS, q.durS);
  }

  @Override
  public int hashCode() {
    return 31 * (31 * Arrays.hashCode(order) + Arrays.hashCode(startS)) + Arrays.hashCode(durS);
  }

  @Override
  public String toString() {
    return "Plan" + Arrays.toString(order) + "@" + Arrays.toString(startS)
        + (durS == null ? "" : " for " + Arrays.toString(durS));
  }
}
