package dev.sequencer.campaign;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The spread of a sweep's results per setting: for each axis that varies and each of its values, the
 * priority (a campaign's collected value) over the runs with that value: minimum, lower quartile, median,
 * upper quartile, maximum, and the median wall time. Quartiles by linear interpolation between order
 * statistics (R's type 7, numpy's default: common practice).
 */
public record SweepSummary(String axis, String value, int runs, double min, double q1, double median, double q3,
    double max, double medianWallS) {
  /** The CSV header of {@link #csv}. */
  public static final String HEADER = "axis,value,runs,priorityMin,priorityQ1,priorityMedian,priorityQ3,priorityMax,"
      + "medianWallS";

  public String csv() {
    return String.format(Locale.ROOT, "%s,%s,%d,%s,%s,%s,%s,%s,%.3f", axis, value, runs, SweepRow.num(min),
        SweepRow.num(q1), SweepRow.num(median), SweepRow.num(q3), SweepRow.num(max), medianWallS);
  }

  /** One summary per (axis, value), axes in grid order, values in first-seen order. */
  public static List<SweepSummary> of(List<SweepRow> rows, List<String> axes) {
    List<SweepSummary> out = new ArrayList<>();
    for (String axis : axes) {
      Map<String, List<SweepRow>> groups = new LinkedHashMap<>();
      for (SweepRow r : rows) {
        groups.computeIfAbsent(r.axisValue(axis), k -> new ArrayList<>()).add(r);
      }
      groups.forEach((value, g) -> {
        double[] p = g.stream().mapToDouble(SweepRow::priority).sorted().toArray();
        double[] w = g.stream().mapToDouble(SweepRow::wallS).sorted().toArray();
        out.add(new SweepSummary(axis, value, g.size(), p[0], quantile(p, 0.25), quantile(p, 0.5), quantile(p, 0.75),
            p[p.length - 1], quantile(w, 0.5)));
      });
    }
    return out;
  }

  /** The q-quantile of sorted values, linear between order statistics (type 7). */
  public static double quantile(double[] sorted, double q) {
    if (sorted.length == 0) {
      return Double.NaN;
    }
    double[] s = sorted;
    if (!isSorted(s)) {
      s = s.clone();
      Arrays.sort(s);
    }
    double h = (s.length - 1) * q;
    int lo = (int) Math.floor(h);
    int hi = Math.min(s.length - 1, lo + 1);
    return s[lo] + (h - lo) * (s[hi] - s[lo]);
  }

  private static boolean isSorted(double[] a) {
    for (int i = 1; i < a.length; i++) {
      if (a[i] < a[i - 1]) {
        return false;
      }
    }
    return true;
  }
}
