package dev.sequencer.slew;

import java.util.function.DoubleUnaryOperator;

/**
 * The two iterations that give exact and bounding slew times to a moving pointing.
 *
 * <p>A slew leaving at t_d takes T = φ(T): its duration depends on the pointing at the arrival t_d + T.
 * The exact time is the iterate T_K of T_0 = 0, T_(k+1) = φ(T_k), stopped when it moves by under 1 ns or
 * after {@value #MAX_ITERATIONS} steps. A bound uses a non-decreasing G with φ(T) <= G(T) for every
 * 0 <= T <= B_0, and B_0 >= every finite φ(T), iterated B_(j+1) = G(B_j). By induction on k, every T_k
 * is <= every B_j: T_0 = 0; and T_k <= B_j gives T_(k+1) = φ(T_k) <= G(T_k) <= G(B_j) = B_(j+1), while
 * T_(k+1) <= B_0 by the choice of B_0. So the smallest B_j is a bound on the exact time whether or not
 * either iteration has converged.
 */
final class FixedPoint {
  static final int MAX_ITERATIONS = 100;
  private static final double STOP_S = 1e-9;

  private FixedPoint() {}

  /** The exact iterate T_K of T <- phi(T) from T_0 = 0; infinite as soon as an iterate is. */
  static double exact(DoubleUnaryOperator phi) {
    double t = 0;
    for (int k = 0; k < MAX_ITERATIONS; k++) {
      double next = phi.applyAsDouble(t);
      if (Double.isInfinite(next) || Math.abs(next - t) <= STOP_S) {
        return next;
      }
      t = next;
    }
    return t;
  }

  /**
   * The smallest iterate of B <- g(B) from {@code b0}, which must bound every finite value of the exact
   * map; a tiny margin (1 ns plus 1e-12 relative) absorbs the rounding differences between the two.
   */
  static double bound(double b0, DoubleUnaryOperator g) {
    double best = b0;
    double b = b0;
    for (int j = 0; j < MAX_ITERATIONS; j++) {
      double next = g.applyAsDouble(b);
      if (Double.isInfinite(next)) {
        return Double.POSITIVE_INFINITY;
      }
      best = Math.min(best, next);
      if (Math.abs(next - b) <= STOP_S) {
        break;
      }
      b = next;
    }
    return best + 1e-9 + 1e-12 * best;
  }
}
