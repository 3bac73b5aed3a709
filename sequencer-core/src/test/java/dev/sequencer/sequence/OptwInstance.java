package dev.sequencer.sequence;

import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.slew.Transitions;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A Righini–Salani OPTW instance (Solomon c1/r1/rc1, 100 customers; format and conventions in the README
 * next to the files in {@code shared/benchmarks/optw}) as a sequencing problem, mapped as that README
 * suggests: time × 10 so that every travel time (Euclidean distance truncated to one decimal) is a whole
 * number of seconds; customer i becomes request "C{i}" with duration 10·d_i, priority = profit and window
 * [10·O_i, min(10·(C_i + d_i), 10·Tmax − t_i0)] for the whole visit (so the return to the depot always
 * fits); the depot is the start pointing. The objective value of a plan is its total priority.
 */
public record OptwInstance(String name, double[] x, double[] y, long[] service, double[] profit, long[] open,
    long[] close) {
  /** Epoch used as time 0. */
  public static final Instant T0 = Instant.parse("2030-01-01T00:00:00Z");

  /** Reads an instance file (vertex 0 is the depot; its closing time is Tmax). */
  public static OptwInstance read(Path file) throws IOException {
    String name = file.getFileName().toString().replace(".txt", "");
    List<String> lines = Files.readAllLines(file);
    int n = Integer.parseInt(lines.get(0).trim().split("\\s+")[2]);
    double[] x = new double[n + 1];
    double[] y = new double[n + 1];
    long[] d = new long[n + 1];
    double[] s = new double[n + 1];
    long[] o = new long[n + 1];
    long[] c = new long[n + 1];
    for (int v = 0; v <= n; v++) {
      String[] f = lines.get(2 + v).trim().split("\\s+");
      if (Integer.parseInt(f[0]) != v) {
        throw new IOException(file + ": vertex " + v + " expected on line " + (3 + v) + ", got " + f[0]);
      }
      x[v] = Double.parseDouble(f[1]);
      y[v] = Double.parseDouble(f[2]);
      d[v] = Math.round(Double.parseDouble(f[3]));
      s[v] = Double.parseDouble(f[4]);
      o[v] = Math.round(Double.parseDouble(f[f.length - 2]));
      c[v] = Math.round(Double.parseDouble(f[f.length - 1]));
    }
    return new OptwInstance(name, x, y, d, s, o, c);
  }

  /** Travel from u to v in tenths (the distance truncated to one decimal, times 10; exact for integer coordinates). */
  public long travel(int u, int v) {
    double dx = x[u] - x[v];
    double dy = y[u] - y[v];
    long sq = Math.round(100 * (dx * dx + dy * dy));
    long r = (long) Math.sqrt((double) sq);
    while (r * r > sq) {
      r--;
    }
    while ((r + 1) * (r + 1) <= sq) {
      r++;
    }
    return r;
  }

  /** Customers (vertices 1..N). */
  public int customers() {
    return x.length - 1;
  }

  /** The sequencing problem described in the type comment. */
  public PlanningProblem toProblem() {
    int n = customers();
    long tmax = 10 * close[0];
    List<Request> requests = new ArrayList<>();
    List<RequestWindows> windows = new ArrayList<>();
    double[][] m = new double[n][n];
    double[] fromStart = new double[n];
    for (int i = 1; i <= n; i++) {
      String id = "C" + i;
      requests.add(new Request(id, null, 10.0 * service[i], profit[i], false, List.of(), null));
      long from = 10 * open[i];
      long to = Math.min(10 * (close[i] + service[i]), tmax - travel(i, 0));
      windows.add(new RequestWindows(id, to - from >= 10 * service[i]
          ? List.of(new TimeWindow(T0.plusSeconds(from), T0.plusSeconds(to))) : List.of()));
      fromStart[i - 1] = travel(0, i);
      for (int j = 1; j <= n; j++) {
        m[i - 1][j - 1] = i == j ? 0 : travel(i, j);
      }
    }
    return PlanningProblem.of(new TimeWindow(T0, T0.plusSeconds(tmax)), requests, windows,
        Transitions.matrix(m, fromStart));
  }

  /**
   * The team version (TOPTW): {@code resources} identical resources sharing the depot, each with the same
   * windows and travel table as {@link #toProblem}, as several resources (format addition A6).
   */
  public PlanningProblem toTeamProblem(int resources) {
    PlanningProblem one = toProblem();
    List<String> ids = new ArrayList<>();
    List<List<RequestWindows>> windows = new ArrayList<>();
    List<Transitions> transitions = new ArrayList<>();
    for (int r = 0; r < resources; r++) {
      ids.add("v" + (r + 1));
      windows.add(one.windows());
      transitions.add(one.transitions());
    }
    return PlanningProblem.ofSections(one.horizon(), one.requests(), ids, windows, transitions);
  }

  /** Published values by instance: {objective, 1 when proven optimal}, from best-known.csv. */
  public static Map<String, double[]> published(Path csv) throws IOException {
    Map<String, double[]> out = new LinkedHashMap<>();
    for (String line : Files.readAllLines(csv)) {
      String[] f = line.split(",");
      if (f.length >= 3 && !f[0].equals("instance")) {
        out.put(f[0], new double[] {Double.parseDouble(f[1]), f[2].equals("yes") ? 1 : 0});
      }
    }
    return out;
  }

  /** The folder of the shared OPTW 1-series files, walking up from the working directory; null when absent. */
  public static Path folder() {
    Path dir = Path.of("").toAbsolutePath();
    for (; dir != null; dir = dir.getParent()) {
      Path candidate = dir.resolve("shared/benchmarks/optw");
      if (Files.isDirectory(candidate.resolve("solomon"))) {
        return candidate;
      }
      Path sibling = dir.resolveSibling("shared").resolve("benchmarks/optw");
      if (dir.getParent() != null && Files.isDirectory(sibling.resolve("solomon"))) {
        return sibling;
      }
    }
    return null;
  }
}
