package dev.sequencer.visibility;

import java.util.ArrayList;
import java.util.List;

/** Operations on ordered, disjoint lists of closed intervals {a, b} in seconds. */
final class Intervals {
  private Intervals() {}

  /** The intersection of two ordered, disjoint lists. */
  static List<double[]> intersect(List<double[]> x, List<double[]> y) {
    List<double[]> out = new ArrayList<>();
    int i = 0;
    int j = 0;
    while (i < x.size() && j < y.size()) {
      double a = Math.max(x.get(i)[0], y.get(j)[0]);
      double b = Math.min(x.get(i)[1], y.get(j)[1]);
      if (a <= b) {
        out.add(new double[] {a, b});
      }
      if (x.get(i)[1] < y.get(j)[1]) {
        i++;
      } else {
        j++;
      }
    }
    return out;
  }

  /** Total length. */
  static double total(List<double[]> x) {
    double s = 0;
    for (double[] w : x) {
      s += w[1] - w[0];
    }
    return s;
  }

  /** Appends {@code w} to an ordered list, merging it with the last interval when they touch. */
  static void append(List<double[]> list, double[] w) {
    if (!list.isEmpty()) {
      double[] last = list.get(list.size() - 1);
      if (w[0] <= last[1] + 1e-9) {
        last[1] = Math.max(last[1], w[1]);
        return;
      }
    }
    list.add(w);
  }
}
