package dev.sequencer.visibility;

import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.hipparchus.analysis.solvers.AllowedSolution;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;

/**
 * Finds where a margin function is non-negative on a sampled chunk: brackets each sign change between
 * samples and refines it with Hipparchus' bracketing Brent solver to {@link #EDGE_ACCURACY_S}, keeping
 * the root on the side where the constraint holds (so every instant of a reported interval is
 * feasible up to the solver's accuracy).
 *
 * <p>Between two samples of the same sign the margin may still cross zero and come back. With a slope
 * bound L (degrees per second), the margin between samples a and b cannot rise above
 * (g(a) + g(b))/2 + L (b - a)/2 nor fall below (g(a) + g(b))/2 - L (b - a)/2; when that tent reaches
 * zero the segment is halved, down to {@link #MIN_SPLIT_S}. When the constraint comes with a proven rate
 * bound (the Sun's and the Moon's elevation, the Moon's phase, the hour angle) L is that bound (or the
 * largest sampled slope if larger), and the test is a proof: no window or gap longer than
 * {@link #MIN_SPLIT_S} is missed. Otherwise L is estimated per chunk from the sampled slopes with a
 * safety factor of 2; it is an estimate, not a proof, which is why the grid step itself already
 * guarantees that no window or gap longer than the step is missed.
 */
final class RootScan {
  /** Absolute accuracy of a refined edge, seconds. */
  static final double EDGE_ACCURACY_S = 0.05;
  /** Shortest segment the slope check subdivides. */
  static final double MIN_SPLIT_S = 1.0;
  /** Slope floor, degrees per second, so a flat-looking margin still gets a small tent. */
  static final double MIN_SLOPE_DEG_PER_S = 1e-4;

  private final BracketingNthOrderBrentSolver solver =
      new BracketingNthOrderBrentSolver(1e-12, EDGE_ACCURACY_S, 1e-12, 5);

  /**
   * The intervals of [times[0], times[n-1]] where {@code g >= 0}, given its values on the samples.
   *
   * @param times sample times, increasing
   * @param values margin at the samples
   * @param g the margin at any time of the chunk (interpolated state)
   * @param maxRate a proven bound on |dg/dt| (per second), or NaN when none is known
   */
  List<double[]> positive(double[] times, double[] values, DoubleUnaryOperator g, double maxRate) {
    int n = times.length;
    double sampled = MIN_SLOPE_DEG_PER_S;
    for (int k = 0; k + 1 < n; k++) {
      double s = Math.abs(values[k + 1] - values[k]) / (times[k + 1] - times[k]);
      if (s > sampled && Double.isFinite(s)) {
        sampled = s;
      }
    }
    double slope = Double.isNaN(maxRate) ? 2.0 * sampled : Math.max(maxRate, sampled);
    Collector out = new Collector(values[0] >= 0, times[0]);
    for (int k = 0; k + 1 < n; k++) {
      segment(times[k], values[k], times[k + 1], values[k + 1], slope, g, out);
    }
    if (out.inside) {
      out.list.add(new double[] {out.start, times[n - 1]});
    }
    return out.list;
  }

  private void segment(double ta, double ga, double tb, double gb, double slope, DoubleUnaryOperator g,
      Collector out) {
    boolean pa = ga >= 0;
    boolean pb = gb >= 0;
    if (pa != pb) {
      double root = solver.solve(200, g::applyAsDouble, ta, tb, AllowedSolution.ABOVE_SIDE);
      out.edge(pb, root);
      return;
    }
    double tent = slope * (tb - ta) / 2;
    double mean = (ga + gb) / 2;
    boolean mayCross = pa ? mean - tent < 0 : mean + tent >= 0;
    if (mayCross && tb - ta > MIN_SPLIT_S) {
      double tm = (ta + tb) / 2;
      double gm = g.applyAsDouble(tm);
      segment(ta, ga, tm, gm, slope, g, out);
      segment(tm, gm, tb, gb, slope, g, out);
    }
  }

  /** Accumulates edges in time order. */
  private static final class Collector {
    final List<double[]> list = new ArrayList<>();
    boolean inside;
    double start;

    Collector(boolean inside, double start) {
      this.inside = inside;
      this.start = start;
    }

    void edge(boolean rising, double t) {
      if (rising) {
        inside = true;
        start = t;
      } else {
        inside = false;
        if (t >= start) {
          list.add(new double[] {start, t});
        }
      }
    }
  }
}
