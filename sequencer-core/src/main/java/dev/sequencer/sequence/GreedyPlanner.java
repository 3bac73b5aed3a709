package dev.sequencer.sequence;

import dev.sequencer.sequence.PlanningProblem.Task;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.List;

/**
 * The greedy baseline: from the current time and pointing, take the request with the best priority per
 * second used, schedule it at its earliest feasible start, repeat until nothing fits.
 *
 * <p>Seconds used = waiting + transition + duration (at least 1 s). The waiting is counted on purpose:
 * without it a request visible only hours later would look as cheap as one available now, and the plan
 * would jump over the whole gap. The transition is {@code ceil(boundS(current, j, t, t))} at the actual
 * departure {@code t}. A candidate is skipped when taking it would make some still-unscheduled required
 * request impossible to reach directly afterwards (a necessary, not sufficient, look-ahead), and the
 * must-be-last request is taken only when nothing else fits. Ties go to the lower index, so the result is
 * deterministic.
 *
 * <p>Flexible requests (extension "flexible exposure time") are scored at the grid exposure with the best
 * value per second used, (value at d) / (waiting + transition + d), among the exposures that fit in the
 * window holding the start: the point where the value curve meets its tangent from the overhead, so a
 * long wait or slew favours a longer exposure. Ties go to the shorter exposure.
 */
final class GreedyPlanner {
  private final PlanningProblem problem;
  private final int[] required;

  GreedyPlanner(PlanningProblem problem) {
    this.problem = problem;
    this.required = java.util.stream.IntStream.range(0, problem.size())
        .filter(k -> problem.tasks().get(k).required() && problem.tasks().get(k).schedulable()).toArray();
  }

  /** The greedy plan (maybe missing required requests; the caller checks). */
  Plan plan() {
    int n = problem.size();
    Transitions tr = problem.transitions();
    boolean[] done = new boolean[n];
    List<Integer> order = new ArrayList<>();
    List<Long> starts = new ArrayList<>();
    List<Long> durations = new ArrayList<>();
    int cur = Transitions.START;
    long t = 0;
    while (true) {
      int best = -1;
      long bestStart = -1;
      long bestDur = -1;
      double bestScore = -1;
      for (int pass = 0; pass < 2 && best < 0; pass++) {
        for (int j = 0; j < n; j++) {
          Task tj = problem.tasks().get(j);
          if (done[j] || !tj.schedulable() || (pass == 0) == (j == problem.mustBeLastIndex())) {
            continue;
          }
          long s = earliestStart(cur, t, j);
          long d = s < 0 ? -1 : exposure(j, s, t);
          if (s < 0 || !requiredStillReachable(j, s + d, done)) {
            continue;
          }
          double score = valueOf(j, d) / Math.max(1, s + d - t);
          if (score > bestScore) {
            best = j;
            bestStart = s;
            bestDur = d;
            bestScore = score;
          }
        }
      }
      if (best < 0) {
        break;
      }
      done[best] = true;
      order.add(best);
      starts.add(bestStart);
      durations.add(bestDur);
      t = bestStart + bestDur;
      cur = best;
      if (best == problem.mustBeLastIndex()) {
        break;
      }
    }
    return new Plan(order.stream().mapToInt(Integer::intValue).toArray(),
        starts.stream().mapToLong(Long::longValue).toArray(),
        durations.stream().mapToLong(Long::longValue).toArray());
  }

  /**
   * The duration request j gets when it starts at {@code s} with the clock at {@code t}: its fixed
   * duration, or the grid exposure with the best value per second used that fits in the window.
   */
  private long exposure(int j, long s, long t) {
    Exposure e = problem.exposure(j);
    if (e == null) {
      return problem.tasks().get(j).durationS();
    }
    long latestEnd = e.latestEndFor(s);
    long bestD = e.minS();
    double best = -1;
    for (int g = 0; g < e.count() && s + e.durationS(g) <= latestEnd; g++) {
      double score = e.values()[g] / Math.max(1, s + e.durationS(g) - t);
      if (score > best) {
        best = score;
        bestD = e.durationS(g);
      }
    }
    return bestD;
  }

  /** The value of request j observed for {@code d} seconds. */
  private double valueOf(int j, long d) {
    Exposure e = problem.exposure(j);
    return e == null ? problem.tasks().get(j).priority() : e.values()[e.index(d)];
  }

  /**
   * The earliest start of task j after leaving {@code from} at {@code departure}, with the transition
   * bounded at that departure and the candidate start (the transition depends on both for moving
   * pointings); -1 when none. Starting from the first allowed start, each step moves to the first allowed
   * second after departure + bound(candidate); the candidate is accepted once the bound at it fits.
   */
  private long earliestStart(int from, long departure, int j) {
    Task tj = problem.tasks().get(j);
    Transitions tr = problem.transitions();
    long s = tj.firstStartAtOrAfter(departure);
    for (int step = 0; s >= 0 && step < MAX_START_STEPS; step++) {
      long c = ArcCosts.ceilS(tr.boundS(from, j, departure, s));
      if (c < 0) {
        s = tj.firstStartAtOrAfter(s + 1);
        continue;
      }
      if (departure + c <= s) {
        return s;
      }
      s = tj.firstStartAtOrAfter(departure + c);
    }
    return -1;
  }

  /** Search steps for a start whose transition fits (each step moves the candidate later). */
  private static final int MAX_START_STEPS = 64;

  /** True when every other unscheduled required request can still start after {@code end} (directly from j). */
  private boolean requiredStillReachable(int j, long end, boolean[] done) {
    Transitions tr = problem.transitions();
    for (int r : required) {
      Task tr_ = problem.tasks().get(r);
      if (r == j || done[r]) {
        continue;
      }
      if (end > tr_.latestStartS()) {
        return false;
      }
      if (earliestStart(j, end, r) < 0) {
        return false;
      }
    }
    return true;
  }
}
