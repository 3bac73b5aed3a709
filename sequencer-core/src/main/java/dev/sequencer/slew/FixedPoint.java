package dev.sequencer.slew;

import java.util.function.DoubleFunction;
import java.util.function.DoubleUnaryOperator;

/**
 * Exact and bounding slew times to a pointing that moves while the slew runs.
 *
 * <p>A slew leaving at t_d and taken to end at t_d + T needs φ(T) seconds: the rest-to-rest time to the
 * target's pointing at t_d + T. It is possible when φ(T) <= T (the mount arrives at that pointing early
 * and waits, at rest, for the target). The exact time is the earliest possible T*, the smallest T >= 0
 * with φ(T) <= T. {@link #earliest} finds it from below without ever stepping over a possible T, using a
 * lower bound of φ just after the current T (from the targets' rate bounds).
 *
 * <p>A bound uses a non-decreasing G with φ(T) <= G(T) for all 0 <= T <= B_0, where B_0 >= G everywhere.
 * Then B_(j+1) = G(B_j) is non-increasing (B_1 <= B_0, and G is monotone), so every B_j satisfies
 * φ(B_j) <= G(B_j) = B_(j+1) <= B_j: each B_j is possible, hence >= T*. If instead φ is infinite at some
 * T <= B_j (the target unreachable), G(B_j) >= G(T) = ∞ and the bound is infinite too.
 */
final class FixedPoint {
  static final int MAX_ITERATIONS = 100;
  static final int MAX_STEPS = 10_000;
  private static final double STOP_S = 1e-9;
  /** Smallest forward step. */
  private static final double MIN_STEP_S = 1e-10;

  private FixedPoint() {}

  /**
   * What is known at one candidate T: the slew time φ(T), and a lower bound of φ(T + δ) for
   * 0 <= δ <= φ(T) - T as a non-increasing function of δ that is <= φ(T) at δ = 0. It is only called
   * when φ(T) > T.
   */
  record Probe(double seconds, DoubleUnaryOperator lowerSecondsAfter) {}

  /**
   * The earliest T >= 0 with φ(T) <= T (to {@value #STOP_S} s), or infinity when φ is infinite at a
   * candidate. Each step jumps to where φ's lower bound first allows φ(T) <= T, found by bisection and
   * rounded down. Where the lower bound allows no progress, it creeps by 1/1000 of the gap φ(T) - T
   * instead. After {@value #MAX_STEPS} steps the current T is returned.
   */
  static double earliest(DoubleFunction<Probe> phi) {
    double t = 0;
    for (int step = 0; step < MAX_STEPS; step++) {
      Probe p = phi.apply(t);
      if (Double.isInfinite(p.seconds())) {
        return Double.POSITIVE_INFINITY;
      }
      if (p.seconds() <= t + STOP_S) {
        return t;
      }
      double lo = 0; // T + lo is known impossible
      double hi = p.seconds() - t; // T + hi >= φ(T) >= the lower bound there
      if (t + hi <= p.lowerSecondsAfter().applyAsDouble(hi)) {
        lo = hi; // the lower bound holds up over the whole gap (a still target): jump it at once
      }
      for (int i = 0; i < 60 && hi - lo > 1e-12 * (1 + t); i++) {
        double mid = 0.5 * (lo + hi);
        if (t + mid < p.lowerSecondsAfter().applyAsDouble(mid)) {
          lo = mid;
        } else {
          hi = mid;
        }
      }
      // No safe progress means the lower bound is useless here (a rate bound is infinite, as for a target
      // near the zenith, or a branch sits on the wrap limit): creep forward by 1/1000 of the gap, which
      // may step past T* by that much. The interval bound is infinite in the first case anyway.
      t += lo >= MIN_STEP_S ? lo : Math.max(MIN_STEP_S, 1e-3 * (p.seconds() - t));
    }
    return t;
  }

  /**
   * The last iterate of B <- g(B) from {@code b0} (see the class comment), plus a margin of 1 ns and
   * 1e-12 relative for rounding and {@link #MIN_STEP_S}.
   */
  static double bound(double b0, DoubleUnaryOperator g) {
    double b = b0;
    for (int j = 0; j < MAX_ITERATIONS; j++) {
      double next = g.applyAsDouble(b);
      if (Double.isInfinite(next)) {
        return Double.POSITIVE_INFINITY;
      }
      if (b - next <= STOP_S) {
        b = Math.max(b, next); // rounding may make G(B) exceed B by a hair: keep the larger
        break;
      }
      b = next;
    }
    return b + 1e-9 + 1e-12 * b;
  }
}
