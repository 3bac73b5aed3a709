package dev.sequencer.sequence;

import dev.sequencer.sequence.PlanningProblem.Task;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/** A sequence of request indices with their start seconds, in time order. */
record Plan(int[] order, long[] startS) {
  static final Plan EMPTY = new Plan(new int[0], new long[0]);

  /** Number of observations. */
  int size() {
    return order.length;
  }

  /** Total priority (unscaled). */
  double priority(PlanningProblem p) {
    double sum = 0;
    for (int k : order) {
      sum += p.tasks().get(k).priority();
    }
    return sum;
  }

  /** Total scaled integer priority. */
  long scaledPriority(PriorityScale scale) {
    long sum = 0;
    for (int k : order) {
      sum += scale.scaled(k);
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
      if (c < 0 || startS[k] < end + c || !t.allows(startS[k])) {
        return false;
      }
      end = startS[k] + t.durationS();
      prev = order[k];
    }
    return true;
  }

  /**
   * Earliest-start schedule of {@code order} under model transitions: each request starts at its first
   * allowed start after the previous end plus the arc cost; requests that no longer fit are dropped.
   */
  static Plan retime(PlanningProblem p, ArcCosts arcs, int[] order) {
    List<Integer> keptOrder = new ArrayList<>();
    List<Long> keptStart = new ArrayList<>();
    long end = 0;
    int prev = Transitions.START;
    for (int k : order) {
      long c = arcs.costFrom(prev, k);
      if (c < 0) {
        continue;
      }
      Task t = p.tasks().get(k);
      long s = t.firstStartAtOrAfter(end + c);
      if (s < 0) {
        continue;
      }
      keptOrder.add(k);
      keptStart.add(s);
      end = s + t.durationS();
      prev = k;
    }
    return new Plan(keptOrder.stream().mapToInt(Integer::intValue).toArray(),
        keptStart.stream().mapToLong(Long::longValue).toArray());
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Plan q && Arrays.equals(order, q.order) && Arrays.equals(startS, q.startS);
  }

  @Override
  public int hashCode() {
    return 31 * Arrays.hashCode(order) + Arrays.hashCode(startS);
  }

  @Override
  public String toString() {
    return "Plan" + Arrays.toString(order) + "@" + Arrays.toString(startS);
  }
}
