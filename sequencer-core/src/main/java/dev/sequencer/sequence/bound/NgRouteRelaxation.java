package dev.sequencer.sequence.bound;

import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.timing.ArcCosts;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * An upper bound on total priority from a state-space relaxation solved by dynamic programming: the
 * best <em>ng-route</em> (Baldacci, Mingozzi and Roberti 2011: a path that may revisit a request only
 * after leaving the request's neighbourhood), grown round by round as in decremental state-space
 * relaxation (Righini and Salani 2009: a request that the best path visits twice is added to the memory
 * of the requests on its cycle, and the DP is solved again).
 *
 * <p>The DP. A label is (request j, start s of its observation, priority P collected along the path,
 * memory Π ⊆ N(j)). The first labels are the requests j at the first start the start pointing allows
 * (departing at 0, model transition {@code fromStart(j)}), P = p_j, Π = {j}. A label extends to k ∉ Π at
 * the first start s' ≥ s + dur_j + c(j, k) at which one of k's spans holds k's shortest exposure, with
 * P' = P + p_k and Π' = (Π ∩ N(k)) ∪ {k}. Label A dominates B at the same request when s_A ≤ s_B,
 * P_A ≥ P_B and Π_A ⊆ Π_B: every extension of B is an extension of A, no later and with as much priority
 * (starting earlier never hurts a later request: waiting is allowed, and a request's allowed starts are
 * the same whenever one arrives).
 *
 * <p>Why it is valid. Take any plan the model accepts (every required request or not: dropping the
 * required rows and "must be last" only relaxes). Its sequence is elementary, so it is an ng-route for
 * every choice of neighbourhoods, and scheduling it at earliest starts under the costs below is feasible
 * whenever the plan is. Its priority, with every flexible request counted at its largest value and its
 * shortest exposure (the longer ones need at least as much room), is the P of a label the DP builds or of
 * one that a dominating label covers. Labels are also dropped when P + K(end of j) ≤ {@code floor}, with K
 * the fractional-knapsack bound below on what any elementary continuation can still collect; a plan that
 * passes through a dropped label therefore has priority ≤ floor. So max(floor, best P) bounds every plan
 * with priority above floor, and the call's {@code floor} is the priority of a plan that holds (the
 * incumbent), so the result bounds every plan. Each round's value is a bound; the result is the smallest.
 *
 * <p>K(τ): the requests k with latest start ≥ τ + minIn_k each take dur_k + minIn_k seconds of the
 * [τ, latest end] interval left (minIn_k the least model transition into k); the fractional knapsack of
 * their priorities over that capacity bounds any set of distinct requests observed after τ. It is
 * tabulated on a grid with τ rounded down (K does not increase with τ). A second completion bound, U
 * (the best path with no memory at all from a request and start on, on a time grid, see
 * {@link #pathTable}), prunes too: a label is dropped when P − p_j + U(j, s) ≤ floor.
 *
 * <p>Transitions. With time-independent transitions c is the model cost ({@link ArcCosts}: the exact
 * time rounded up to whole seconds, which a plan with whole-second starts needs anyway), and arcs the model
 * finds infeasible are left out. With time-dependent transitions the model costs bound the exact legs from
 * above only, so c = 0 for every pair and only the time windows restrict the path (the bound of every plan
 * with any slews); minIn_k is then 0 too.
 *
 * <p>The DP stops at {@code deadlineNanos} or at {@link #MAX_LABELS} labels; a round that stops gives no
 * bound. A round also ends once some path collects more than the sum of all priorities (zero-second cycles
 * of zero-duration requests can revisit without end): its value is then that sum, the trivial bound. Priorities are summed in double: the value is widened by a relative 1e-9 so that rounding never
 * makes it optimistic.
 */
public final class NgRouteRelaxation {
  /** Labels one round may create before it gives up (about 40 bytes each). */
  public static final int MAX_LABELS = 3_000_000;
  /** Largest memory a neighbourhood may grow to (bits of an int). */
  static final int MAX_NEIGHBOURHOOD = 30;
  /** Grid points of the completion bound K. */
  private static final int GRID = 4096;

  /**
   * The outcome: {@code bound} (NaN when no round finished), the best path of the last finished round when
   * it is elementary (a plan under the model's transitions; {@code null} otherwise), rounds finished, labels
   * created in all rounds, and whether the last round's best path was elementary (the relaxation is then
   * exact for its costs).
   */
  public record Result(double bound, Plan elementaryPath, int rounds, long labels, boolean elementary) {}

  private final PlanningProblem problem;
  private final boolean timeDependent;
  private final int[] nodes; // DP node -> task index
  private final int m;
  private final long[] dur;
  private final double[] prize;
  private final long[] fromStart; // -1 = not reachable first
  private final int[] cost; // m*m, -1 = no arc
  private final long[] minIn;
  private final double prizeSum;
  private final double[] completion;
  private final long gridStep;
  /** U(a, b) on a time grid, m × buckets (null when not built): see {@link #pathTable}. */
  private double[] path;
  private long pathStep;
  private int pathBuckets;

  private NgRouteRelaxation(PlanningProblem p, ArcCosts arcs, long deadlineNanos) {
    this.problem = p;
    this.timeDependent = p.transitions().timeDependent();
    List<Integer> keep = new ArrayList<>();
    for (int k = 0; k < p.size(); k++) {
      if (p.task(k).schedulable() && arcs.minIn(k) != Long.MAX_VALUE) {
        keep.add(k);
      }
    }
    this.nodes = keep.stream().mapToInt(Integer::intValue).toArray();
    this.m = nodes.length;
    this.dur = new long[m];
    this.prize = new double[m];
    this.fromStart = new long[m];
    this.minIn = new long[m];
    this.cost = new int[m * m];
    double sum = 0;
    long latestEnd = 0;
    for (int a = 0; a < m; a++) {
      Task t = p.task(nodes[a]);
      dur[a] = t.durationS();
      prize[a] = t.priority();
      sum += prize[a];
      fromStart[a] = timeDependent ? 0 : arcs.fromStart(nodes[a]);
      minIn[a] = timeDependent ? 0 : arcs.minIn(nodes[a]);
      latestEnd = Math.max(latestEnd, t.latestStartS() + t.durationS());
      for (int b = 0; b < m; b++) {
        int c;
        if (a == b) {
          c = -1;
        } else if (timeDependent) {
          Task tb = p.task(nodes[b]);
          c = t.earliestStartS() + t.durationS() <= tb.latestStartS() ? 0 : -1;
        } else {
          c = arcs.feasible(nodes[a], nodes[b]) ? (int) arcs.cost(nodes[a], nodes[b]) : -1;
        }
        cost[a * m + b] = c;
      }
    }
    this.prizeSum = sum;
    this.gridStep = Math.max(1, (latestEnd + GRID - 1) / GRID);
    this.completion = completionTable(latestEnd);
    pathTable(latestEnd, deadlineNanos);
  }

  /** Grid cells of {@link #pathTable} at most (m × buckets doubles). */
  private static final long PATH_CELLS = 4_000_000;
  /** Arc evaluations building {@link #pathTable} may take at most (m² × buckets). */
  private static final long PATH_WORK = 30_000_000;

  /**
   * U(a, b): a bound on the priority of any path (no memory at all, revisits allowed) whose first
   * observation is request a starting at or after b·step, p_a included. U(a, b) = p_a + max(0, max over
   * arcs a→k of U(k, bucket of k's first start ≥ b·step + dur_a + c(a, k))). Since the true value is not
   * increasing in the start and the recursion starts each bucket at its earliest second, U bounds it for
   * every start in the bucket or later. It needs dur_a + c(a, k) ≥ step on every arc (the next bucket is
   * then strictly later, so the table fills from the last bucket back); when no step ≥ 1 allows that within
   * {@link #PATH_CELLS} cells and {@link #PATH_WORK} arc evaluations, or the deadline passes while it is
   * built, there is no table and only K prunes.
   */
  private void pathTable(long latestEnd, long deadlineNanos) {
    long minStep = Long.MAX_VALUE;
    for (int a = 0; a < m; a++) {
      for (int b = 0; b < m; b++) {
        if (cost[a * m + b] >= 0) {
          minStep = Math.min(minStep, dur[a] + cost[a * m + b]);
        }
      }
    }
    if (minStep == Long.MAX_VALUE) {
      minStep = Math.max(1, latestEnd);
    }
    long mm = Math.max(1, m);
    long maxBuckets = Math.max(1, Math.min(PATH_CELLS / mm, PATH_WORK / (mm * mm)));
    long step = Math.max(1, (latestEnd + maxBuckets) / maxBuckets);
    if (minStep < 1 || step > minStep) {
      return;
    }
    step = Math.max(step, 1);
    int buckets = (int) (latestEnd / step) + 2;
    double[] u = new double[m * buckets];
    for (int bk = buckets - 1; bk >= 0; bk--) {
      if (System.nanoTime() >= deadlineNanos) {
        return; // no table: only K prunes
      }
      long t = bk * step;
      for (int a = 0; a < m; a++) {
        Task ta = problem.task(nodes[a]);
        if (ta.latestStartS() < t) {
          continue; // 0: a cannot start this late
        }
        long s = Math.max(t, ta.earliestStartS());
        double best = 0;
        for (int k = 0; k < m; k++) {
          int c = cost[a * m + k];
          if (c < 0) {
            continue;
          }
          long sk = problem.task(nodes[k]).firstFittingStart(s + dur[a] + c, dur[k]);
          if (sk < 0) {
            continue;
          }
          int nb = (int) Math.min(buckets - 1, sk / step);
          best = Math.max(best, u[k * buckets + nb]);
        }
        u[a * buckets + bk] = prize[a] + best;
      }
    }
    this.path = u;
    this.pathStep = step;
    this.pathBuckets = buckets;
  }

  /** U(a, start) with the start rounded down to the grid; +∞ when there is no table. */
  private double pathBound(int a, long start) {
    if (path == null) {
      return Double.POSITIVE_INFINITY;
    }
    int bk = (int) Math.min(pathBuckets - 1, start / pathStep);
    return path[a * pathBuckets + bk];
  }

  /**
   * The bound on total (unscaled) priority with neighbourhoods of {@code ngSize} requests, grown while the
   * best path is not elementary and time is left; {@code floor} is the priority of a plan that holds every
   * required request (0 when none is known).
   */
  public static Result bound(PlanningProblem p, ArcCosts arcs, double floor, int ngSize, long deadlineNanos) {
    return bound(p, arcs, floor, ngSize, deadlineNanos, Integer.MAX_VALUE, MAX_LABELS);
  }

  /**
   * As {@link #bound(PlanningProblem, ArcCosts, double, int, long)}, with at most {@code maxRounds} rounds
   * and {@code maxLabels} labels per round (a work limit that does not depend on the machine).
   */
  public static Result bound(PlanningProblem p, ArcCosts arcs, double floor, int ngSize, long deadlineNanos,
      int maxRounds, int maxLabels) {
    return bound(p, arcs, floor, ngSize, deadlineNanos, maxRounds, maxLabels, Long.MAX_VALUE);
  }

  /**
   * As {@link #bound(PlanningProblem, ArcCosts, double, int, long, int, int)}, with at most
   * {@code maxTotalLabels} labels over all rounds: a round that would pass it stops and gives no bound (the
   * earlier rounds' bound stands). Reproducible runs use it so that the work, not only each round, is limited.
   */
  public static Result bound(PlanningProblem p, ArcCosts arcs, double floor, int ngSize, long deadlineNanos,
      int maxRounds, int maxLabels, long maxTotalLabels) {
    return new NgRouteRelaxation(p, arcs, deadlineNanos).solve(floor, ngSize, deadlineNanos, maxRounds,
        Math.min(MAX_LABELS, maxLabels), maxTotalLabels);
  }

  private Result solve(double floor, int ngSize, long deadlineNanos, int maxRounds, int maxLabels,
      long maxTotalLabels) {
    if (m == 0) {
      return new Result(Math.max(0, floor), Plan.EMPTY, 1, 0, true);
    }
    int[][] ng = initialNeighbourhoods(Math.max(1, Math.min(ngSize, MAX_NEIGHBOURHOOD)));
    double best = Double.NaN;
    Plan path = null;
    boolean elementary = false;
    int rounds = 0;
    long labels = 0;
    while (rounds < maxRounds && System.nanoTime() < deadlineNanos && labels < maxTotalLabels) {
      Round r = new Round(ng, floor, deadlineNanos, (int) Math.min(maxLabels, maxTotalLabels - labels));
      boolean done = r.run();
      labels += r.count;
      if (!done) {
        break;
      }
      rounds++;
      double value = Math.min(prizeSum, Math.max(floor, r.bestPrize) + 1e-9 * Math.max(1, prizeSum));
      best = Double.isNaN(best) ? value : Math.min(best, value);
      int[] seq = r.bestPath();
      int[] repeat = seq == null ? null : firstRepeat(seq);
      elementary = repeat == null;
      path = elementary && seq != null ? r.bestPlan() : null;
      if (r.bestPrize <= floor || elementary || !grow(ng, seq)) {
        break; // the floor is proven, or the relaxation is exact, or its memory cannot grow
      }
    }
    return new Result(best, path, rounds, labels, elementary && rounds > 0);
  }

  /** For each request the ngSize − 1 others closest by c(j, k) + c(k, j) that can form a cycle with it, and itself. */
  private int[][] initialNeighbourhoods(int ngSize) {
    int[][] ng = new int[m][];
    for (int a = 0; a < m; a++) {
      List<long[]> near = new ArrayList<>();
      for (int b = 0; b < m; b++) {
        if (b != a && cost[a * m + b] >= 0 && cost[b * m + a] >= 0) {
          near.add(new long[] {(long) cost[a * m + b] + cost[b * m + a], b});
        }
      }
      near.sort((x, y) -> x[0] != y[0] ? Long.compare(x[0], y[0]) : Long.compare(x[1], y[1]));
      int size = Math.min(ngSize - 1, near.size());
      ng[a] = new int[size + 1];
      ng[a][0] = a;
      for (int q = 0; q < size; q++) {
        ng[a][q + 1] = (int) near.get(q)[1];
      }
    }
    return ng;
  }

  /** {i, j} positions of the first request visited twice (j the second visit), or null when elementary. */
  private static int[] firstRepeat(int[] seq) {
    int[] seen = new int[seq.length == 0 ? 1 : Arrays.stream(seq).max().getAsInt() + 1];
    Arrays.fill(seen, -1);
    for (int q = 0; q < seq.length; q++) {
      if (seen[seq[q]] >= 0) {
        return new int[] {seen[seq[q]], q};
      }
      seen[seq[q]] = q;
    }
    return null;
  }

  /**
   * DSSR step: for every request the best path visits more than once, between each two consecutive visits,
   * the request joins the memory of every request on that cycle; false when no memory can grow.
   */
  private boolean grow(int[][] ng, int[] seq) {
    int[] last = new int[m];
    Arrays.fill(last, -1);
    boolean grown = false;
    for (int q = 0; q < seq.length; q++) {
      int v = seq[q];
      if (last[v] >= 0) {
        for (int r = last[v] + 1; r <= q; r++) {
          int u = seq[r];
          if (!contains(ng[u], v) && ng[u].length < MAX_NEIGHBOURHOOD) {
            ng[u] = Arrays.copyOf(ng[u], ng[u].length + 1);
            ng[u][ng[u].length - 1] = v;
            grown = true;
          }
        }
      }
      last[v] = q;
    }
    return grown;
  }

  private static boolean contains(int[] a, int v) {
    for (int x : a) {
      if (x == v) {
        return true;
      }
    }
    return false;
  }

  /** K on the grid: entry g bounds the priority of distinct requests observed after g·gridStep. */
  private double[] completionTable(long latestEnd) {
    Integer[] byRatio = new Integer[m];
    for (int a = 0; a < m; a++) {
      byRatio[a] = a;
    }
    Arrays.sort(byRatio, (x, y) -> Double.compare(prize[y] * weight(x), prize[x] * weight(y)));
    int points = (int) (latestEnd / gridStep) + 2;
    double[] k = new double[points];
    for (int g = 0; g < points; g++) {
      long tau = g * gridStep;
      double capacity = Math.max(0, latestEnd - tau);
      double value = 0;
      for (int a : byRatio) {
        if (problem.task(nodes[a]).latestStartS() < tau + minIn[a]) {
          continue;
        }
        double w = weight(a);
        if (w <= capacity) {
          value += prize[a];
          capacity -= w;
        } else {
          value += prize[a] * capacity / w;
          break;
        }
      }
      k[g] = value;
    }
    return k;
  }

  private double weight(int a) {
    return dur[a] + minIn[a];
  }

  /** K(τ) with τ rounded down to the grid. */
  private double completion(long tau) {
    int g = (int) Math.min(completion.length - 1, Math.max(0, tau / gridStep));
    return completion[g];
  }

  /** One DP with fixed neighbourhoods. */
  private final class Round {
    private final int[][] ng;
    private final int[] position; // a*m + b -> index of b in ng[a], -1
    private final double floor;
    private final long deadlineNanos;
    private final int maxLabels;
    private int count;
    private int[] node = new int[1024];
    private long[] start = new long[1024];
    private double[] value = new double[1024];
    private int[] memory = new int[1024];
    private int[] parent = new int[1024];
    private boolean[] dead = new boolean[1024];
    private final int[][] alive;
    private final int[] aliveCount;
    private long[] heap = new long[1024];
    private int heapSize;
    private double bestPrize;
    private int bestLabel = -1;

    Round(int[][] ng, double floor, long deadlineNanos, int maxLabels) {
      this.ng = ng;
      this.maxLabels = maxLabels;
      this.floor = floor;
      this.deadlineNanos = deadlineNanos;
      this.position = new int[m * m];
      Arrays.fill(position, -1);
      for (int a = 0; a < m; a++) {
        for (int q = 0; q < ng[a].length; q++) {
          position[a * m + ng[a][q]] = q;
        }
      }
      this.alive = new int[m][];
      this.aliveCount = new int[m];
      for (int a = 0; a < m; a++) {
        alive[a] = new int[8];
      }
    }

    /** True when the DP finished (every label extended). */
    boolean run() {
      for (int a = 0; a < m; a++) {
        if (fromStart[a] < 0) {
          continue;
        }
        long s = problem.task(nodes[a]).firstFittingStart(fromStart[a], dur[a]);
        if (s >= 0) {
          add(a, s, prize[a], 1, -1);
        }
      }
      int sinceCheck = 0;
      while (heapSize > 0) {
        if (bestPrize > prizeSum) {
          return true; // a path collects more than all requests together (revisits): the sum is the bound
        }
        if (count >= maxLabels) {
          return false;
        }
        if (++sinceCheck >= 256) {
          sinceCheck = 0;
          if (System.nanoTime() >= deadlineNanos) {
            return false;
          }
        }
        int l = (int) (pop() & 0xFFFF_FFFFL);
        if (dead[l]) {
          continue;
        }
        extend(l);
      }
      return true;
    }

    private void extend(int l) {
      int a = node[l];
      long ready = start[l] + dur[a];
      int mem = memory[l];
      for (int b = 0; b < m; b++) {
        int c = cost[a * m + b];
        if (c < 0) {
          continue;
        }
        int pos = position[a * m + b];
        if (pos >= 0 && (mem & (1 << pos)) != 0) {
          continue; // b is in the memory: no revisit yet
        }
        long s = problem.task(nodes[b]).firstFittingStart(ready + c, dur[b]);
        if (s < 0) {
          continue;
        }
        int next = 1; // b itself is position 0 of its own neighbourhood
        for (int bits = mem; bits != 0; bits &= bits - 1) {
          int g = ng[a][Integer.numberOfTrailingZeros(bits)];
          int q = position[b * m + g];
          if (q > 0) {
            next |= 1 << q;
          }
        }
        add(b, s, value[l] + prize[b], next, l);
      }
    }

    private void add(int b, long s, double p, int mem, int from) {
      if (Math.min(p + completion(s + dur[b]), p - prize[b] + pathBound(b, s)) <= floor) {
        return; // no continuation gets above the floor
      }
      int[] list = alive[b];
      int n = aliveCount[b];
      for (int q = 0; q < n; q++) {
        int o = list[q];
        if (start[o] <= s && value[o] >= p && (memory[o] & ~mem) == 0) {
          return; // dominated
        }
      }
      int id = count++;
      ensure(id);
      node[id] = b;
      start[id] = s;
      value[id] = p;
      memory[id] = mem;
      parent[id] = from;
      int kept = 0;
      for (int q = 0; q < n; q++) {
        int o = list[q];
        if (s <= start[o] && p >= value[o] && (mem & ~memory[o]) == 0) {
          dead[o] = true;
        } else {
          list[kept++] = o;
        }
      }
      if (kept == list.length) {
        list = Arrays.copyOf(list, list.length * 2);
        alive[b] = list;
      }
      list[kept++] = id;
      aliveCount[b] = kept;
      if (p > bestPrize) {
        bestPrize = p;
        bestLabel = id;
      }
      push((s << 32) | id);
    }

    private void ensure(int id) {
      if (id < node.length) {
        return;
      }
      int size = node.length * 2;
      node = Arrays.copyOf(node, size);
      start = Arrays.copyOf(start, size);
      value = Arrays.copyOf(value, size);
      memory = Arrays.copyOf(memory, size);
      parent = Arrays.copyOf(parent, size);
      dead = Arrays.copyOf(dead, size);
    }

    private void push(long key) {
      if (heapSize == heap.length) {
        heap = Arrays.copyOf(heap, heap.length * 2);
      }
      int i = heapSize++;
      while (i > 0) {
        int up = (i - 1) >>> 1;
        if (heap[up] <= key) {
          break;
        }
        heap[i] = heap[up];
        i = up;
      }
      heap[i] = key;
    }

    private long pop() {
      long top = heap[0];
      long last = heap[--heapSize];
      int i = 0;
      while (true) {
        int child = 2 * i + 1;
        if (child >= heapSize) {
          break;
        }
        if (child + 1 < heapSize && heap[child + 1] < heap[child]) {
          child++;
        }
        if (heap[child] >= last) {
          break;
        }
        heap[i] = heap[child];
        i = child;
      }
      heap[i] = last;
      return top;
    }

    /** DP nodes of the best label's path, first to last; null when every label fell below the floor. */
    int[] bestPath() {
      if (bestLabel < 0) {
        return null;
      }
      List<Integer> seq = new ArrayList<>();
      for (int l = bestLabel; l >= 0; l = parent[l]) {
        seq.add(node[l]);
      }
      int[] out = new int[seq.size()];
      for (int q = 0; q < out.length; q++) {
        out[q] = seq.get(out.length - 1 - q);
      }
      return out;
    }

    /** The best label's path as a plan (task indices, starts, shortest exposures). */
    Plan bestPlan() {
      List<Integer> labelsOnPath = new ArrayList<>();
      for (int l = bestLabel; l >= 0; l = parent[l]) {
        labelsOnPath.add(l);
      }
      int size = labelsOnPath.size();
      int[] order = new int[size];
      long[] starts = new long[size];
      long[] durs = new long[size];
      for (int q = 0; q < size; q++) {
        int l = labelsOnPath.get(size - 1 - q);
        order[q] = nodes[node[l]];
        starts[q] = start[l];
        durs[q] = dur[node[l]];
      }
      return new Plan(order, starts, durs);
    }
  }
}
