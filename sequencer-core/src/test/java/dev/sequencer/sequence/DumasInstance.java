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
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * A Dumas et al. (1995) TSPTW instance (LKH-3 TSPLIB conversion, see the README next to the files) as a
 * sequencing problem: customer node i (2..DIMENSION) becomes required request "C{i}" with duration 0,
 * priority 1 and start window [a_i, b_i]; the transition table is the travel matrix and the start pointing
 * is the depot (node 1). The return to the depot is a required request "RETURN" (a copy of the depot) with
 * window [0, b_1] that must be last, so the plan's total transition equals the tour's travel, return arc
 * included.
 */
public record DumasInstance(String name, int dimension, long[][] travel, long[] open, long[] close) {
  /** Epoch used as time 0. */
  public static final Instant T0 = Instant.parse("2030-01-01T00:00:00Z");

  /** Reads an instance file; the name comes from the file name (the NAME header has a known quirk). */
  public static DumasInstance read(Path file) throws IOException {
    String name = file.getFileName().toString().replace(".tsptw", "");
    List<String> lines = Files.readAllLines(file);
    int dim = -1;
    int at = 0;
    for (; at < lines.size(); at++) {
      String l = lines.get(at).trim();
      if (l.startsWith("DIMENSION")) {
        dim = Integer.parseInt(l.split(":")[1].trim());
      }
      if (l.equals("EDGE_WEIGHT_SECTION")) {
        break;
      }
    }
    List<Long> tokens = new ArrayList<>();
    for (at++; !lines.get(at).trim().equals("TIME_WINDOW_SECTION"); at++) {
      for (String tok : lines.get(at).trim().split("\\s+")) {
        if (!tok.isEmpty()) {
          tokens.add(Long.parseLong(tok));
        }
      }
    }
    if (tokens.size() != dim * dim) {
      throw new IOException(file + ": " + tokens.size() + " weights, expected " + dim * dim);
    }
    long[][] d = new long[dim][dim];
    for (int i = 0; i < dim; i++) {
      for (int j = 0; j < dim; j++) {
        d[i][j] = tokens.get(i * dim + j);
      }
    }
    long[] a = new long[dim];
    long[] b = new long[dim];
    for (int i = 0; i < dim; i++) {
      String[] f = lines.get(++at).trim().split("\\s+");
      int node = Integer.parseInt(f[0]);
      a[node - 1] = Long.parseLong(f[1]);
      b[node - 1] = Long.parseLong(f[2]);
    }
    return new DumasInstance(name, dim, d, a, b);
  }

  /** Published best-known travel values by instance name, from best-known.csv. */
  public static Map<String, Long> bestKnownTravel(Path csv) throws IOException {
    Map<String, Long> out = new HashMap<>();
    for (String line : Files.readAllLines(csv)) {
      String[] f = line.split(",");
      if (f.length >= 3 && f[2].equals("travel")) {
        out.put(f[0], Long.parseLong(f[1]));
      }
    }
    return out;
  }

  /** The sequencing problem described in the type comment. */
  public PlanningProblem toProblem() {
    int n = dimension; // customers 2..dim -> index 0..dim-2; RETURN -> index dim-1
    List<Request> requests = new ArrayList<>();
    List<RequestWindows> windows = new ArrayList<>();
    int[] node = new int[n];
    for (int k = 0; k < n - 1; k++) {
      node[k] = k + 1;
      String id = "C" + (k + 2);
      requests.add(new Request(id, null, 0.0, 1.0, true, List.of(), null));
      windows.add(new RequestWindows(id, List.of(new TimeWindow(T0.plusSeconds(open[k + 1]), T0.plusSeconds(close[k + 1])))));
    }
    node[n - 1] = 0;
    requests.add(new Request("RETURN", null, 0.0, 1.0, true, List.of(), null));
    windows.add(new RequestWindows("RETURN", List.of(new TimeWindow(T0, T0.plusSeconds(close[0])))));
    double[][] m = new double[n][n];
    double[] fromStart = new double[n];
    for (int i = 0; i < n; i++) {
      fromStart[i] = travel[0][node[i]];
      for (int j = 0; j < n; j++) {
        m[i][j] = travel[node[i]][node[j]];
      }
    }
    TimeWindow horizon = new TimeWindow(T0, T0.plusSeconds(close[0]));
    return PlanningProblem.of(horizon, requests, windows, Transitions.matrix(m, fromStart)).withMustBeLast("RETURN");
  }

  /** The folder of the shared Dumas files, walking up from the working directory; null when absent. */
  public static Path folder() {
    Path dir = Path.of("").toAbsolutePath();
    for (; dir != null; dir = dir.getParent()) {
      Path candidate = dir.resolve("shared/benchmarks/tsptw/dumas");
      if (Files.isDirectory(candidate)) {
        return candidate;
      }
      Path sibling = dir.resolveSibling("shared").resolve("benchmarks/tsptw/dumas");
      if (dir.getParent() != null && Files.isDirectory(sibling)) {
        return sibling;
      }
    }
    return null;
  }
}
