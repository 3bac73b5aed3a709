package dev.sequencer.sequence.timing;

import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Score;
import dev.sequencer.sequence.problem.Structure;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.slew.Transitions;
import dev.sequencer.slew.Transitions.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Timing with the slew models' exact legs: the one owner of "when can this observation start", used by
 * the greedy planner, compaction, exact repair, the deadline orders and re-planning alike.
 *
 * <p>A leg departs at the previous observation's end (the start pointing departs at 0) and must arrive by
 * the observation's start: {@code departS + leg(departS, s) <= s}, with {@link ArcCosts#CEIL_SLACK_S}
 * forgiven (far below the validator's 1 ms). Starts are whole seconds. Legs come from a
 * {@link Transitions.Path}, so an alt-az mount's unwrapped azimuth follows the real sequence. Stateless
 * apart from the problem: one timer may serve several threads.
 */
public final class ExactTimer {
  /** Candidate starts tried per observation before the search gives up. */
  public static final int MAX_STEPS = 64;

  private final PlanningProblem problem;
  private final Transitions transitions;

  public ExactTimer(PlanningProblem problem) {
    this.problem = problem;
    this.transitions = problem.transitions();
  }

  /** The path at the start pointing, before any observation. */
  public Path start() {
    return transitions.path();
  }

  /** The exact leg from {@code path} departing at {@code departS} into request k starting at {@code startS}. */
  public double legS(Path path, int k, long departS, long startS) {
    return path.legS(k, departS, startS);
  }

  /** True when k observed for {@code d} s from {@code s} lies in a span and its exact leg arrives by s. */
  public boolean fitsAt(Path path, int k, long departS, long s, long d) {
    return s >= departS && problem.task(k).fits(s, d) && arrives(departS, path.legS(k, departS, s), s);
  }

  private static boolean arrives(long departS, double legS, long s) {
    return legS < Double.POSITIVE_INFINITY && departS + legS <= s + ArcCosts.CEIL_SLACK_S;
  }

  /**
   * The earliest whole second s in [max(fromS, departS), latestS] at which request k observed for
   * {@code d} seconds lies in a span and its exact leg from {@code path} (departing at {@code departS})
   * arrives by s; -1 when none is found within {@link #MAX_STEPS} candidates.
   *
   * <p>Candidates: the first fitting start; then, while the leg does not fit, the first fitting start at
   * or after departS + leg (rounded up to a second); an impossible leg (the target out of the mount's
   * reach at that instant) moves on by 1, 2, 4 … seconds. Each candidate is later than the one before,
   * so the search ends; it finds the earliest start whenever the leg grows by less than a second per
   * second of arrival (true of every model here: targets move far slower than slews).
   */
  public long earliestStart(Path path, int k, long departS, long fromS, long d, long latestS) {
    Task t = problem.task(k);
    long s = t.firstFittingStart(Math.max(fromS, departS), d);
    long jump = 1;
    for (int step = 0; step < MAX_STEPS && s >= 0 && s <= latestS; step++) {
      double leg = path.legS(k, departS, s);
      if (!(leg < Double.POSITIVE_INFINITY)) {
        s = t.firstFittingStart(s + jump, d);
        jump = Math.min(jump * 2, 1L << 20);
        continue;
      }
      if (arrives(departS, leg, s)) {
        return s;
      }
      s = t.firstFittingStart(Math.max(s + 1, departS + ArcCosts.ceilS(leg)), d);
    }
    return -1;
  }

  /** A plan with its exact legs, and the requests (indices) left out on the way. */
  public record Timed(Plan plan, double[] legS, int[] dropped) {
    /** Total exact transition, seconds. */
    public double transitionS() {
      double sum = 0;
      for (double l : legS) {
        sum += l;
      }
      return sum;
    }

    /** Total transition in whole milliseconds, each leg rounded up ({@link Score#legMs}). */
    public long transitionMs() {
      long sum = 0;
      for (double l : legS) {
        sum += Score.legMs(l);
      }
      return sum;
    }

    /** The plan's rank by its exact legs. */
    public Score score(PlanningProblem p) {
      return new Score(plan.requiredMissing(p), plan.prize(p), transitionMs());
    }
  }

  /** The plan exactly as given (each leg departing at the previous end); {@code null} when some leg does not fit. */
  public Timed verify(Plan plan) {
    Path path = start();
    double[] legs = new double[plan.size()];
    long end = 0;
    for (int q = 0; q < plan.size(); q++) {
      int k = plan.order()[q];
      long s = plan.startS()[q];
      long d = plan.durationS()[q];
      if (!problem.task(k).fits(s, d) || s < end) {
        return null;
      }
      double leg = path.legS(k, end, s);
      if (!arrives(end, leg, s)) {
        return null;
      }
      legs[q] = leg;
      path = path.then(k, end, s);
      end = s + d;
    }
    return new Timed(plan, legs, new int[0]);
  }

  /**
   * Compaction: each observation, in order, at the earliest second at or after the (compacted) previous
   * end at which its exact leg fits, searched up to its given start; else at its given start when the leg
   * fits there; else at the earliest later second. An observation that fits nowhere is left out (listed
   * in {@link Timed#dropped}). Starts only move earlier for a model-feasible plan: its given start is
   * always exact-feasible from an earlier departure, because the model's transitions bound the exact
   * legs over every departure the model allows (except when an alt-az mount's cable wrap runs out while
   * it follows an observation, which the pairwise bounds cannot see).
   */
  public Timed compact(Plan plan) {
    return place(plan.order(), plan.durationS(), plan.startS());
  }

  /** Earliest exact schedule of {@code order} at exposures {@code durS}: {@link #compact} without given starts. */
  public Timed schedule(int[] order, long[] durS) {
    return place(order, durS, null);
  }

  private Timed place(int[] order, long[] durS, long[] given) {
    Structure rules = problem.structure();
    Path path = start();
    int n = order.length;
    int[] ko = new int[n];
    long[] ks = new long[n];
    long[] kd = new long[n];
    long[] ke = new long[n];
    double[] kl = new double[n];
    int m = 0;
    List<Integer> dropped = new ArrayList<>();
    long end = 0;
    for (int q = 0; q < n; q++) {
      int k = order[q];
      long d = durS[q];
      Task t = problem.task(k);
      long latest = t.latestFittingStart(Long.MAX_VALUE / 4, d);
      long from = end;
      if (!rules.isEmpty()) {
        from = Math.max(end, rules.earliestStartS(k, ko, ks, ke, m));
        latest = Math.min(latest, rules.latestStartS(k, ko, ks, ke, m));
      }
      long s;
      if (given != null && given[q] >= from) {
        s = earliestStart(path, k, end, from, d, Math.min(given[q], latest));
        if (s < 0 && given[q] <= latest && fitsAt(path, k, end, given[q], d)) {
          s = given[q];
        }
        if (s < 0) {
          s = earliestStart(path, k, end, given[q] + 1, d, latest);
        }
      } else {
        s = earliestStart(path, k, end, from, d, latest);
      }
      if (s < 0) {
        dropped.add(k);
        continue;
      }
      kl[m] = path.legS(k, end, s);
      ko[m] = k;
      ks[m] = s;
      kd[m] = d;
      ke[m] = s + d;
      m++;
      path = path.then(k, end, s);
      end = s + d;
    }
    return new Timed(new Plan(Arrays.copyOf(ko, m), Arrays.copyOf(ks, m), Arrays.copyOf(kd, m)), Arrays.copyOf(kl, m),
        dropped.stream().mapToInt(Integer::intValue).toArray());
  }

  /**
   * {@code plan} timed exactly and keeping the rules between tasks ({@link Structure}: visits, groups): the
   * compaction (which respects the separations and gaps as it places each observation) or the plan at its
   * own starts, whichever ranks higher, then pruned ({@link Structure#prune}) and re-timed at its own
   * starts until nothing more is left out. Without rules: {@link #compact}, or the plan as given when
   * compaction dropped something and the given plan ranks higher.
   */
  public Timed timeKeepingRules(Plan plan) {
    Structure rules = problem.structure();
    Plan kept = rules.prune(problem, plan);
    Timed timed = compact(kept);
    boolean holds = rules.holds(problem, timed.plan());
    if (timed.dropped().length > 0 || !holds) {
      Timed asGiven = verify(kept);
      if (asGiven != null && (!holds || asGiven.score(problem).betterThan(timed.score(problem)))) {
        timed = asGiven;
      }
    }
    for (int round = 0; !rules.holds(problem, timed.plan()); round++) {
      Plan pruned = rules.prune(problem, timed.plan());
      Timed again = verify(pruned);
      timed = again != null ? again : compact(pruned);
      if (round > plan.size()) {
        throw new IllegalStateException("the rules between tasks do not settle on " + plan + " (a bug)");
      }
    }
    return timed;
  }

  /** The paths after each prefix of {@code plan} as given: element q is the path before observation q. */
  public Path[] prefixPaths(Plan plan) {
    Path[] out = new Path[plan.size() + 1];
    Path path = start();
    out[0] = path;
    long end = 0;
    for (int q = 0; q < plan.size(); q++) {
      path = path.then(plan.order()[q], end, plan.startS()[q]);
      end = plan.endS(q);
      out[q + 1] = path;
    }
    return out;
  }
}
