package dev.sequencer.slew;

import java.util.Arrays;

/**
 * The generic {@link Transitions.Path}: it keeps the sequence so far and evaluates each new leg with
 * {@link Transitions#exactS} on the prefix plus that leg, so it is exact for any implementation, at O(n)
 * per leg.
 */
final class ReplayPath implements Transitions.Path {
  private final Transitions transitions;
  private final int[] order;
  private final double[] departureS;
  private final double[] arrivalS;

  private ReplayPath(Transitions transitions, int[] order, double[] departureS, double[] arrivalS) {
    this.transitions = transitions;
    this.order = order;
    this.departureS = departureS;
    this.arrivalS = arrivalS;
  }

  static Transitions.Path start(Transitions transitions) {
    return new ReplayPath(transitions, new int[0], new double[0], new double[0]);
  }

  @Override
  public int last() {
    return order.length == 0 ? Transitions.START : order[order.length - 1];
  }

  @Override
  public double legS(int to, double departure, double arrival) {
    ReplayPath p = extended(to, departure, arrival);
    return transitions.exactS(p.order, p.departureS, p.arrivalS)[order.length];
  }

  @Override
  public Transitions.Path then(int to, double departure, double arrival) {
    return extended(to, departure, arrival);
  }

  private ReplayPath extended(int to, double departure, double arrival) {
    int n = order.length;
    int[] o = Arrays.copyOf(order, n + 1);
    double[] d = Arrays.copyOf(departureS, n + 1);
    double[] a = Arrays.copyOf(arrivalS, n + 1);
    o[n] = to;
    d[n] = departure;
    a[n] = arrival;
    return new ReplayPath(transitions, o, d, a);
  }
}
