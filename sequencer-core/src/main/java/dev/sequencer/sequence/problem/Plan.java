package dev.sequencer.sequence.problem;

import dev.sequencer.slew.Transitions;
import java.util.Arrays;

/**
 * A sequence of request indices in time order with each observation's start and exposure, whole seconds
 * from the horizon start. A plain value: whether it is feasible is for a timer to say.
 */
public record Plan(int[] order, long[] startS, long[] durationS) {
  /** The plan with no observation. */
  public static final Plan EMPTY = new Plan(new int[0], new long[0], new long[0]);

  public Plan {
    if (order.length != startS.length || order.length != durationS.length) {
      throw new IllegalArgumentException("plan: " + order.length + " requests, " + startS.length + " starts, "
          + durationS.length + " durations");
    }
  }

  /** A plan with every request at its shortest exposure (its duration when fixed). */
  public static Plan atShortest(PlanningProblem p, int[] order, long[] startS) {
    long[] d = new long[order.length];
    for (int q = 0; q < order.length; q++) {
      d[q] = p.task(order[q]).durationS();
    }
    return new Plan(order, startS, d);
  }

  /** Number of observations. */
  public int size() {
    return order.length;
  }

  /** End of observation q. */
  public long endS(int q) {
    return startS[q] + durationS[q];
  }

  /** Value (priority) collected by observation q. */
  public double value(PlanningProblem p, int q) {
    return p.task(order[q]).valueFor(durationS[q]);
  }

  /** Total priority, user units. */
  public double priority(PlanningProblem p) {
    double sum = 0;
    for (int q = 0; q < order.length; q++) {
      sum += value(p, q);
    }
    return sum;
  }

  /** Total prize ({@link Prizes}): the options' prizes plus the arc bonuses along the order. */
  public long prize(PlanningProblem p) {
    Prizes z = p.prizes();
    long sum = optionPrize(p);
    if (z.hasArcBonus()) {
      int prev = Transitions.START;
      for (int k : order) {
        sum += z.arcBonus(prev, k);
        prev = k;
      }
    }
    return sum;
  }

  /** The options' prizes alone, without arc bonuses (what exposure allocation maximises). */
  public long optionPrize(PlanningProblem p) {
    Prizes z = p.prizes();
    long sum = 0;
    for (int q = 0; q < order.length; q++) {
      sum += z.prize(order[q], p.task(order[q]).option(durationS[q]));
    }
    return sum;
  }

  /** Scaled value ({@link Prizes#scaled}) without bonuses: the priority in integer units. */
  public long scaledValue(PlanningProblem p) {
    long sum = 0;
    for (int q = 0; q < order.length; q++) {
      sum += p.prizes().scaled(order[q], p.task(order[q]).option(durationS[q]));
    }
    return sum;
  }

  /** Required requests of {@code p} this plan does not hold. */
  public int requiredMissing(PlanningProblem p) {
    boolean[] in = membership(p.size());
    int missing = 0;
    for (int k = 0; k < p.size(); k++) {
      missing += p.task(k).required() && !in[k] ? 1 : 0;
    }
    return p.sections() == null ? missing : missing + p.sections().unitsMissing(in);
  }

  /** {@code in[k]} is true when request k is observed. */
  public boolean[] membership(int n) {
    boolean[] in = new boolean[n];
    for (int k : order) {
      in[k] = true;
    }
    return in;
  }

  /** The exposures (a copy). */
  public long[] durations() {
    return durationS.clone();
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Plan q && Arrays.equals(order, q.order) && Arrays.equals(startS, q.startS)
        && Arrays.equals(durationS, q.durationS);
  }

  @Override
  public int hashCode() {
    return 31 * (31 * Arrays.hashCode(order) + Arrays.hashCode(startS)) + Arrays.hashCode(durationS);
  }

  @Override
  public String toString() {
    return "Plan" + Arrays.toString(order) + "@" + Arrays.toString(startS) + " for " + Arrays.toString(durationS);
  }
}
