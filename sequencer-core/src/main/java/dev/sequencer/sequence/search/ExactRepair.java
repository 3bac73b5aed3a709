package dev.sequencer.sequence.search;

import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Reasons;
import dev.sequencer.sequence.problem.Score;
import dev.sequencer.sequence.problem.Sections;
import dev.sequencer.sequence.problem.Structure;
import dev.sequencer.sequence.problem.Span;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.timing.ExactTimer;
import dev.sequencer.slew.Transitions.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Exact repair: inserts unscheduled requests into a plan with the exact legs. The model's transitions are
 * never-optimistic bounds (for moving targets and alt-az mounts sometimes far above the exact slews), so a
 * request the model could not fit may well fit; only a request that fails here is "lost to conflicts".
 *
 * <p>An insertion puts request k between two consecutive observations (or first, or last) at the earliest
 * second its exact leg allows; every later observation keeps its start when its exact leg from the new
 * predecessor still fits there, else moves to its earliest exact start (earlier or later), and the
 * insertion is refused when one no longer fits anywhere. Of the positions that work, the one with the
 * best {@link Score} is taken. Flexible requests try their exposure options from the largest prize down.
 * Requests are tried once each: required ones first, then by prize per second of their shortest
 * exposure. Positions are pruned only where no insertion can work (k would start after its last allowed
 * start, or end after the next observation's last allowed start).
 */
public final class ExactRepair {
  /** Exposure options tried per flexible request and position (spread over the grid when it has more). */
  static final int MAX_OPTIONS = 8;

  private final PlanningProblem problem;
  private final ExactTimer timer;

  public ExactRepair(PlanningProblem problem, ExactTimer timer) {
    this.problem = problem;
    this.timer = timer;
  }

  /**
   * What a repair did: the plan; the requests inserted; those that fit nowhere ({@code failed}); those
   * that fit but add nothing to the score ({@code noGain}, e.g. a value of 0); and those not tried before
   * the deadline. {@code failed} and {@code noGain} hold for the returned plan when {@code inserted} is
   * empty (else only for the plan as it was when each was tried).
   */
  public record Result(Plan plan, List<Integer> inserted, List<Integer> failed, List<Integer> noGain,
      List<Integer> untried) {}

  /** True when another option of k's request (several resources) is in the plan. */
  private static boolean mateIn(Sections sections, int k, boolean[] in) {
    if (sections == null || sections.unitOf(k) < 0) {
      return false;
    }
    for (int o : sections.options(sections.unitOf(k))) {
      if (in[o]) {
        return true;
      }
    }
    return false;
  }

  /** Inserts what fits into {@code plan} (exact-feasible, as from {@link ExactTimer}) until {@code deadlineNanos}. */
  public Result repair(Plan plan, long deadlineNanos) {
    boolean[] in = plan.membership(problem.size());
    List<Integer> candidates = new ArrayList<>();
    Sections sections = problem.sections();
    for (int k = 0; k < problem.size(); k++) {
      if (!in[k] && problem.task(k).schedulable()
          && !mateIn(sections, k, in)) {
        candidates.add(k);
      }
    }
    candidates.sort(Comparator.comparing((Integer k) -> !problem.task(k).required())
        .thenComparingDouble(k -> -problem.prizes().maxPrize(k) / (problem.task(k).durationS() + 1.0))
        .thenComparingInt(k -> k));
    List<Integer> inserted = new ArrayList<>();
    List<Integer> failed = new ArrayList<>();
    List<Integer> noGain = new ArrayList<>();
    List<Integer> untried = new ArrayList<>();
    Plan current = plan;
    for (int k : candidates) {
      if (System.nanoTime() >= deadlineNanos) {
        untried.add(k);
        continue;
      }
      Plan better = bestInsertion(current, k);
      if (better == null) {
        failed.add(k);
      } else if (!score(better).betterThan(score(current))) {
        noGain.add(k);
      } else {
        current = better;
        inserted.add(k);
      }
    }
    return new Result(current, inserted, failed, noGain, untried);
  }

  private Score score(Plan p) {
    ExactTimer.Timed t = timer.verify(p);
    if (t == null) {
      throw new IllegalStateException("exact repair works on exact-feasible plans only (a bug): " + p);
    }
    return t.score(problem);
  }

  /** The best plan with request k inserted (exact legs), or null when no position works. */
  public Plan bestInsertion(Plan plan, int k) {
    Task t = problem.task(k);
    Path[] paths = timer.prefixPaths(plan);
    int m = plan.size();
    int last = problem.mustBeLastIndex();
    int maxPos = m;
    if (last >= 0) {
      for (int q = 0; q < m; q++) {
        if (plan.order()[q] == last) {
          maxPos = q; // nothing goes after the must-be-last request
        }
      }
      if (k == last && maxPos == m && m > 0) {
        return tryAt(plan, paths, m, k).orElse(null);
      }
    }
    Plan best = null;
    Score bestScore = Score.NONE;
    for (int q = (k == last ? m : 0); q <= maxPos; q++) {
      long departS = q == 0 ? 0 : plan.endS(q - 1);
      if (departS > t.latestStartS()) {
        break;
      }
      if (q < m) {
        Task next = problem.task(plan.order()[q]);
        long nextLatest = next.latestFittingStart(Long.MAX_VALUE / 4, plan.durationS()[q]);
        if (t.earliestStartS() + t.durationS() > nextLatest) {
          continue;
        }
      }
      java.util.Optional<Plan> candidate = tryAt(plan, paths, q, k)
          .map(c -> problem.structure().prune(problem, c)) // visits renumbered in time order
          .filter(c -> c.size() == plan.size() + 1); // an insertion that breaks a rule between tasks is none
      if (candidate.isPresent()) {
        ExactTimer.Timed timed = timer.verify(candidate.get());
        if (timed == null) {
          throw new IllegalStateException("exact insertion of " + t.id() + " produced an invalid plan (a bug)");
        }
        Score s = timed.score(problem);
        if (s.betterThan(bestScore)) {
          best = candidate.get();
          bestScore = s;
        }
      }
    }
    return best;
  }

  /** Request k inserted before position q at its earliest exact start, the rest kept or re-timed; empty if impossible. */
  private java.util.Optional<Plan> tryAt(Plan plan, Path[] paths, int q, int k) {
    Task t = problem.task(k);
    long departS = q == 0 ? 0 : plan.endS(q - 1);
    for (int g : optionsToTry(t)) {
      long d = t.durationS(g);
      long latest = t.latestFittingStart(Long.MAX_VALUE / 4, d);
      long from = departS;
      Structure rules = problem.structure();
      if (!rules.isEmpty()) { // visits' separations and ordered groups' gaps after the observations before q
        long[] ends = new long[q];
        for (int i = 0; i < q; i++) {
          ends[i] = plan.endS(i);
        }
        from = Math.max(from, rules.earliestStartS(k, plan.order(), plan.startS(), ends, q));
        latest = Math.min(latest, rules.latestStartS(k, plan.order(), plan.startS(), ends, q));
      }
      long s = timer.earliestStart(paths[q], k, departS, from, d, latest);
      if (s < 0) {
        continue;
      }
      Plan out = withSuffix(plan, paths, q, k, s, d, paths[q].then(k, departS, s));
      if (out != null) {
        return java.util.Optional.of(out);
      }
    }
    return java.util.Optional.empty();
  }

  /** Exposure options of t, the largest prize first, at most {@link #MAX_OPTIONS}. */
  private List<Integer> optionsToTry(Task t) {
    List<Integer> g = new ArrayList<>();
    int n = t.optionCount();
    if (n <= MAX_OPTIONS) {
      for (int i = 0; i < n; i++) {
        g.add(i);
      }
    } else {
      for (int i = 0; i < MAX_OPTIONS; i++) {
        g.add((int) Math.round(i * (n - 1) / (double) (MAX_OPTIONS - 1)));
      }
    }
    int k = problem.indexOf(t.id());
    g.sort(Comparator.comparingLong((Integer i) -> -problem.prizes().prize(k, i)).thenComparingInt(i -> i));
    return g;
  }

  /**
   * The plan with k at [s, s + d] before position q and positions q.. re-checked after it; null when one
   * fails. Once an observation keeps its start and the path after it is in the same state as before the
   * insertion ({@link Path#state}), every later one is unchanged and is copied.
   */
  private Plan withSuffix(Plan plan, Path[] paths, int q, int k, long s, long d, Path afterK) {
    int m = plan.size();
    int[] order = new int[m + 1];
    long[] start = new long[m + 1];
    long[] dur = new long[m + 1];
    System.arraycopy(plan.order(), 0, order, 0, q);
    System.arraycopy(plan.startS(), 0, start, 0, q);
    System.arraycopy(plan.durationS(), 0, dur, 0, q);
    order[q] = k;
    start[q] = s;
    dur[q] = d;
    Path path = afterK;
    long end = s + d;
    boolean copyRest = false;
    for (int i = q; i < m; i++) {
      int ki = plan.order()[i];
      long di = plan.durationS()[i];
      long si;
      if (copyRest) {
        si = plan.startS()[i];
      } else if (timer.fitsAt(path, ki, end, plan.startS()[i], di)) {
        si = plan.startS()[i];
        Object after = path.then(ki, end, si).state();
        copyRest = after != null && after.equals(paths[i + 1].state()); // later legs unchanged
      } else {
        si = timer.earliestStart(path, ki, end, end, di, problem.task(ki).latestFittingStart(Long.MAX_VALUE / 4, di));
        if (si < 0) {
          return null;
        }
      }
      order[i + 1] = ki;
      start[i + 1] = si;
      dur[i + 1] = di;
      if (!copyRest) {
        path = path.then(ki, end, si);
      }
      end = si + di;
    }
    return new Plan(order, start, dur);
  }

  /**
   * The reason request k (schedulable, not in {@code plan}) is left out: "lost to conflicts", naming the
   * observations that occupy its windows (start minus the slew into them, to their end), or the
   * neighbours whose slews leave no room when none does.
   */
  public String reason(ExactTimer.Timed timed, int k) {
    Task t = problem.task(k);
    Plan plan = timed.plan();
    if (plan.size() == 0 && timer.earliestStart(timer.start(), k, 0, 0, t.durationS(), t.latestStartS()) < 0) {
      return Reasons.UNREACHABLE_FROM_START; // exact: nothing precedes it, and the first slew never fits
    }
    List<String> taken = new ArrayList<>();
    String before = null;
    String after = null;
    for (int q = 0; q < plan.size(); q++) {
      double busyFrom = plan.startS()[q] - timed.legS()[q];
      long busyTo = plan.endS(q);
      boolean overlaps = false;
      for (Span sp : t.spans()) {
        if (sp.toS() - sp.fromS() >= t.durationS() && busyFrom < sp.toS() && busyTo > sp.fromS()) {
          overlaps = true;
        }
      }
      int other = plan.order()[q];
      if (problem.isMarker(other)) {
        continue; // a resource's section boundary, not an observation
      }
      // Names of requests, not of the planner's tasks: with several resources the request's id (its
      // observations there are on k's resource: the sections do not overlap in planner time); with visits
      // "R visit 2", or "its visit 2" for another visit of k's own request (one per window).
      int request = problem.structure().requestOf(other);
      String id = problem.requests().get(request).id();
      if (problem.requests().get(request).hasVisits()) {
        id = (request == problem.structure().requestOf(k) ? "its" : id) + " visit "
            + problem.structure().visitOf(other);
      }
      if (overlaps) {
        taken.add(id);
      } else if (busyTo <= t.earliestStartS()) {
        before = id;
      } else if (after == null && busyFrom >= t.latestStartS()) {
        after = id;
      }
    }
    if (!taken.isEmpty()) {
      String names = taken.size() <= 3 ? String.join(", ", taken)
          : String.join(", ", taken.subList(0, 3)) + " and " + (taken.size() - 3) + " more";
      return Reasons.LOST_TO_CONFLICTS + ": its windows are taken by " + names;
    }
    if (before != null || after != null) {
      return Reasons.LOST_TO_CONFLICTS + ": no room for the slews " + (before != null ? "from " + before : "")
          + (before != null && after != null ? " and " : "") + (after != null ? "to " + after : "");
    }
    return Reasons.LOST_TO_CONFLICTS + ": no position in the plan fits it with the exact slews";
  }
}
