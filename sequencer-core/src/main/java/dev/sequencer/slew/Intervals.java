package dev.sequencer.slew;

/** Argument checks shared by the {@link Transitions} implementations. */
final class Intervals {
  private Intervals() {}

  /** Rejects a reversed or non-finite departure interval, naming it in order. */
  static void check(double departureMinS, double departureMaxS) {
    if (!Double.isFinite(departureMinS) || !Double.isFinite(departureMaxS) || departureMaxS < departureMinS) {
      throw new IllegalArgumentException(
          "departure interval: must be finite with min <= max (was [" + departureMinS + ", " + departureMaxS + "])");
    }
  }

  /** Rejects a sequence whose arrays differ in length or whose indices are outside [0, size). */
  static void checkSequence(int[] order, double[] departureS, int size) {
    if (order.length != departureS.length) {
      throw new IllegalArgumentException(
          "departureS: " + departureS.length + " entries, but order has " + order.length);
    }
    for (int k = 0; k < order.length; k++) {
      if (order[k] < 0 || order[k] >= size) {
        throw new IllegalArgumentException("order[" + k + "]: must be in [0, " + size + ") (was " + order[k] + ")");
      }
    }
  }
}
