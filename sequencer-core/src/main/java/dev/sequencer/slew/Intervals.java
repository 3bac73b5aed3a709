package dev.sequencer.slew;

/** Argument checks shared by the {@link Transitions} implementations. */
final class Intervals {
  private Intervals() {}

  /** Rejects a reversed or non-finite interval, naming it and its ends in order. */
  static void check(String name, double minS, double maxS) {
    if (!Double.isFinite(minS) || !Double.isFinite(maxS) || maxS < minS) {
      throw new IllegalArgumentException(
          name + " interval: must be finite with min <= max (was [" + minS + ", " + maxS + "])");
    }
  }

  /** The midpoint and half-width of an interval, seconds. */
  record Span(double mid, double half) {}

  /** The checked interval [minS, maxS] as midpoint and half-width (see {@link #check}). */
  static Span span(String name, double minS, double maxS) {
    check(name, minS, maxS);
    return new Span(0.5 * (minS + maxS), 0.5 * (maxS - minS));
  }

  /** Rejects a sequence whose arrays differ in length or whose indices are outside [0, size). */
  static void checkSequence(int[] order, double[] departureS, double[] arrivalS, int size) {
    if (order.length != departureS.length || order.length != arrivalS.length) {
      throw new IllegalArgumentException("departureS: " + departureS.length + " entries, arrivalS: "
          + arrivalS.length + ", but order has " + order.length);
    }
    for (int k = 0; k < order.length; k++) {
      if (order[k] < 0 || order[k] >= size) {
        throw new IllegalArgumentException("order[" + k + "]: must be in [0, " + size + ") (was " + order[k] + ")");
      }
    }
  }
}
