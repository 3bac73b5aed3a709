package dev.sequencer.sequence.search;

import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Score;
import dev.sequencer.sequence.problem.Sections;
import dev.sequencer.sequence.problem.Structure;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.timing.ExactTimer;
import dev.sequencer.slew.Transitions.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * The greedy baseline: from the current time and pointing, take the request with the best priority per
 * second used, schedule it at its earliest start, repeat until nothing fits. Timing is exact
 * ({@link ExactTimer}): every plan it returns holds under the slew models' exact legs.
 *
 * <p>Seconds used = waiting + transition + duration (at least 1 s). The waiting is counted on purpose:
 * without it a request visible only hours later would look as cheap as one available now, and the plan
 * would jump over the whole gap. A candidate is skipped when taking it would make some still-unscheduled
 * required request impossible to reach directly afterwards (a necessary, not sufficient, look-ahead), and
 * the must-be-last request is taken only when nothing else fits. Ties go to the lower index, so the
 * result is deterministic.
 *
 * <p>The look-ahead asks for a direct slew. Where a required request can only be reached through others
 * (the direct slew to it crosses a keep-out that a detour through another target avoids), it rejects every
 * candidate and the plan misses the request. So when the plan misses a required request, two more passes
 * run and the best of the three is returned (fewer required requests missing, then more prize): the same
 * rule without the look-ahead, and the required requests alone, the one that can end first taken next
 * (earliest-deadline order, which the exact repair afterwards fills with the others).
 * Found by the planner fuzz benchmark on 2026-12-02: a LEO day where the direct slews to the required S6
 * all cross the Earth-limb keep-out, while the plan without the look-ahead holds S6.
 *
 * <p>Flexible requests are scored at the exposure option with the best value per second used,
 * (value at d) / (waiting + transition + d), among the options that fit in the window holding the start:
 * the point where the value curve meets its tangent from the overhead, so a long wait or slew favours a
 * longer exposure. Ties go to the shorter exposure.
 *
 * <p>The {@link Rule#BEST_NOW} rule is the other greedy that planners argue for: among the requests that
 * can start within {@link #NOW_WINDOW_S} of the earliest possible start, the one of highest value (ties:
 * the earlier start, then the lower index), whatever it costs in slew or exposure time.
 */
public final class GreedyPlanner {
  /** How the next request is chosen. */
  public enum Rule {
    /** Best value per second used (waiting + transition + duration): the default. */
    VALUE_PER_SECOND,
    /** Highest value among the requests that can start within {@link #NOW_WINDOW_S} of the earliest. */
    BEST_NOW
  }

  /** Seconds after the earliest possible start within which {@link Rule#BEST_NOW} counts a request as "now". */
  public static final long NOW_WINDOW_S = 600;

  /**
   * Take-backs allowed in a row at one dead end (a plan that then grows past it starts counting again): a
   * dead end from a keep-out is the last observation's, and a plan's true end (no time left for anything)
   * should not unravel its tail.
   */
  static final int MAX_BACKTRACKS = 3;

  private final PlanningProblem problem;
  private final ExactTimer timer;
  private final int[] required;
  private final Rule rule;
  private final Structure rules;
  private boolean cut;

  public GreedyPlanner(PlanningProblem problem, ExactTimer timer) {
    this(problem, timer, Rule.VALUE_PER_SECOND);
  }

  public GreedyPlanner(PlanningProblem problem, ExactTimer timer, Rule rule) {
    this.problem = problem;
    this.timer = timer;
    this.rule = java.util.Objects.requireNonNull(rule, "rule");
    this.rules = problem.structure();
    this.required = java.util.stream.IntStream.range(0, problem.size())
        .filter(k -> problem.task(k).required() && problem.task(k).schedulable()).toArray();
  }

  /** True when task j is required: itself, or as an option of a required request on several resources. */
  private boolean mustHave(int j) {
    Sections sec = rules.sections();
    return problem.task(j).required() || sec != null && sec.unitOf(j) >= 0 && sec.unitRequired(sec.unitOf(j));
  }

  /** The greedy plan (maybe missing required requests; the caller's score says so). */
  public Plan plan() {
    return plan(Long.MAX_VALUE);
  }

  /**
   * The greedy plan built until {@code deadlineNanos} ({@link System#nanoTime}): past it no further request
   * is added and the plan so far is returned ({@link #wasCut} then says so). Each choice evaluates every
   * candidate with the exact legs, so with expensive legs (alt-az with the Sun keep-out) a whole greedy pass
   * can take seconds; the deadline keeps it inside the run's budget.
   */
  public Plan plan(long deadlineNanos) {
    cut = false;
    Plan best = build(deadlineNanos, Pass.LOOK_AHEAD);
    for (Pass fallback : new Pass[] {Pass.PLAIN, Pass.REQUIRED_FIRST}) {
      if (cut || best.requiredMissing(problem) == 0) {
        break;
      }
      Plan other = build(deadlineNanos, fallback);
      best = better(other, best) ? other : best;
    }
    return best;
  }

  /** One greedy pass's way of choosing. */
  private enum Pass {
    /** The rule, skipping candidates after which some required request cannot be reached directly. */
    LOOK_AHEAD,
    /** The rule alone. */
    PLAIN,
    /** Required requests only, the one that can end first next. */
    REQUIRED_FIRST
  }

  private Plan build(long deadlineNanos, Pass how) {
    int n = problem.size();
    boolean[] done = new boolean[n];
    boolean[] excluded = new boolean[n];
    List<long[]> chosen = new ArrayList<>(); // {k, start, duration}
    List<Path> pathsBefore = new ArrayList<>();
    List<Long> timesBefore = new ArrayList<>();
    Plan kept = null;
    int backtracks = 0; // consecutive take-backs below the same plan length
    int backtrackDepth = -1;
    Path path = timer.start();
    long t = 0;
    while (true) {
      int best = -1;
      long bestStart = -1;
      long bestDur = -1;
      double bestScore = -1;
      List<long[]> bestBlock = null;
      for (int pass = 0; pass < 2 && best < 0; pass++) {
        long earliest = rule == Rule.BEST_NOW ? earliestStart(path, t, done, pass) : -1;
        for (int j = 0; j < n && !cut; j++) {
          Task tj = problem.task(j);
          if (done[j] || excluded[j] || !tj.schedulable() || (pass == 0) == (j == problem.mustBeLastIndex())
              || (how == Pass.REQUIRED_FIRST && !mustHave(j))) {
            continue;
          }
          if (deadlineNanos != Long.MAX_VALUE && System.nanoTime() > deadlineNanos) {
            cut = true; // the choice in progress is not finished: it is not made
            break;
          }
          long from = t;
          long latest = tj.latestStartS();
          if (!rules.isEmpty()) {
            if (!rulesAllow(j, done)) {
              continue;
            }
            int m = fill(chosen);
            from = Math.max(t, rules.earliestStartS(j, co, cs, ce, m));
            latest = Math.min(latest, rules.latestStartS(j, co, cs, ce, m));
          }
          long s = timer.earliestStart(path, j, t, from, tj.durationS(), latest);
          long d = s < 0 ? -1 : exposure(j, s, t);
          if (s < 0 || (how == Pass.LOOK_AHEAD && !requiredStillReachable(path, j, t, s, s + d, done))) {
            continue;
          }
          List<long[]> block = null;
          Structure.GroupRule chain = rules.isEmpty() ? null : rules.groupOf(j);
          if (chain != null && chain.ordered() && chain.allOrNothing()) {
            if (rules.memberOf(j) > 0) {
              continue; // the chain's later members come with its first one
            }
            block = chainAfter(chain, path, j, t, s, d, done);
            if (block == null) {
              continue;
            }
          }
          double score;
          if (block != null) {
            double value = 0;
            for (long[] b : block) {
              value += problem.task((int) b[0]).valueFor(b[2]);
            }
            long blockEnd = block.get(block.size() - 1)[1] + block.get(block.size() - 1)[2];
            score = how == Pass.REQUIRED_FIRST ? 1.0 / (1 + blockEnd) : value / Math.max(1, blockEnd - t);
          } else if (how == Pass.REQUIRED_FIRST) {
            score = 1.0 / (1 + s + d); // the earliest end first
          } else if (rule == Rule.BEST_NOW) {
            if (s > earliest + NOW_WINDOW_S) {
              continue;
            }
            score = problem.task(j).valueFor(d);
          } else {
            score = problem.task(j).valueFor(d) / Math.max(1, s + d - t);
          }
          if (score > bestScore || (rule == Rule.BEST_NOW && score == bestScore && s < bestStart)) {
            best = j;
            bestStart = s;
            bestDur = d;
            bestScore = score;
            bestBlock = block;
          }
        }
      }
      if (chosen.size() > backtrackDepth) {
        backtracks = 0; // the plan grew past the last dead end
      }
      if (best < 0 && !cut && !chosen.isEmpty() && backtracks < MAX_BACKTRACKS
          && stillOpen(t, done, excluded, how)) {
        // A dead end: nothing can follow the last choice although requests remain open later on (e.g. an
        // observation ending at the Earth-limb edge leaves the line of sight where every slew out crosses
        // the keep-out). Keep the plan so far, take the last choice back and never make it again.
        Plan here = toPlan(chosen);
        kept = kept == null || better(here, kept) ? here : kept;
        long[] last = chosen.remove(chosen.size() - 1);
        done[(int) last[0]] = false;
        excluded[(int) last[0]] = true;
        path = pathsBefore.remove(pathsBefore.size() - 1);
        t = timesBefore.remove(timesBefore.size() - 1);
        backtracks++;
        backtrackDepth = chosen.size();
        continue;
      }
      if (best < 0 || cut) {
        break;
      }
      List<long[]> steps = bestBlock != null ? bestBlock : List.of(new long[] {best, bestStart, bestDur});
      for (long[] step : steps) {
        done[(int) step[0]] = true;
        chosen.add(step);
        pathsBefore.add(path);
        timesBefore.add(t);
        path = path.then((int) step[0], t, step[1]);
        t = step[1] + step[2];
      }
      if (best == problem.mustBeLastIndex()) {
        break;
      }
    }
    Plan result = toPlan(chosen);
    return kept != null && better(kept, result) ? kept : result;
  }

  /**
   * The rules between tasks ({@link Structure}) as greedy keeps them while it builds: visits in order (visit
   * v + 1 only after visit v), members of an ordered group in list order; separations and gaps bound each
   * candidate's start; an ordered all-or-nothing group (a calibration chain) is taken as one step
   * ({@link #chainAfter}), scored by its total value per second used. Other all-or-nothing rules and one
   * visit per window are left to the incumbent's {@link Structure#prune}, which drops what greedy could not
   * complete.
   */
  private boolean rulesAllow(int j, boolean[] done) {
    Sections sec = rules.sections();
    if (sec != null && sec.unitOf(j) >= 0) {
      for (int k : sec.options(sec.unitOf(j))) {
        if (k != j && done[k]) {
          return false; // the request is observed on another resource already
        }
      }
    }
    Structure.VisitRule v = rules.visitRuleOf(j);
    if (v != null) {
      for (int q = 0; q < rules.visitOf(j) - 1; q++) {
        if (java.util.Arrays.stream(v.visits()[q]).noneMatch(k -> done[k])) {
          return false; // visit q + 1 is not observed yet, on any resource
        }
      }
    }
    Structure.GroupRule g = rules.groupOf(j);
    if (g != null && g.ordered()) {
      for (int i = rules.memberOf(j) + 1; i < g.members().length; i++) {
        if (java.util.Arrays.stream(g.members()[i]).anyMatch(k -> done[k])) {
          return false;
        }
      }
    }
    if (g != null && g.sameResource() && sec != null) {
      for (int[] member : g.members()) {
        for (int k : member) {
          if (done[k] && sec.sectionOf(k) != sec.sectionOf(j)) {
            return false; // the group is on another resource already
          }
        }
      }
    }
    return true;
  }

  /** The task among {@code options} on task {@code like}'s resource (the first one with one resource); -1: none. */
  private int onResourceOf(int[] options, int like) {
    Sections sec = rules.sections();
    for (int k : options) {
      if (sec == null || sec.sectionOf(k) == sec.sectionOf(like)) {
        return k;
      }
    }
    return -1;
  }

  /**
   * An ordered all-or-nothing group taken as one step: its first member j at [s, s + d], then each later
   * member at its earliest exact start after the previous one's end and within the group's gap; null when
   * some member does not fit (then greedy does not start the chain: half a chain would be dropped).
   */
  private List<long[]> chainAfter(Structure.GroupRule chain, Path path, int j, long t, long s, long d,
      boolean[] done) {
    List<long[]> block = new ArrayList<>();
    block.add(new long[] {j, s, d});
    Path p = path.then(j, t, s);
    long end = s + d;
    for (int i = 1; i < chain.members().length; i++) {
      int k = onResourceOf(chain.members()[i], j); // a chain greedy takes in one step stays on j's resource
      Task tk = k < 0 ? null : problem.task(k);
      if (k < 0 || done[k] || !tk.schedulable()) {
        return null;
      }
      long latest = chain.hasMaxGap() ? Math.min(tk.latestStartS(), end + chain.maxGapS()) : tk.latestStartS();
      long sk = timer.earliestStart(p, k, end, end, tk.durationS(), latest);
      if (sk < 0) {
        return null;
      }
      block.add(new long[] {k, sk, tk.durationS()});
      p = p.then(k, end, sk);
      end = sk + tk.durationS();
    }
    return block;
  }

  private int[] co = new int[0];
  private long[] cs = new long[0];
  private long[] ce = new long[0];

  /** The chosen observations as arrays for the rules' start bounds; returns how many. */
  private int fill(List<long[]> chosen) {
    int m = chosen.size();
    if (co.length < m) {
      co = new int[2 * m];
      cs = new long[2 * m];
      ce = new long[2 * m];
    }
    for (int q = 0; q < m; q++) {
      co[q] = (int) chosen.get(q)[0];
      cs[q] = chosen.get(q)[1];
      ce[q] = chosen.get(q)[1] + chosen.get(q)[2];
    }
    return m;
  }

  private static Plan toPlan(List<long[]> chosen) {
    int m = chosen.size();
    int[] order = new int[m];
    long[] starts = new long[m];
    long[] durs = new long[m];
    for (int q = 0; q < m; q++) {
      order[q] = (int) chosen.get(q)[0];
      starts[q] = chosen.get(q)[1];
      durs[q] = chosen.get(q)[2];
    }
    return new Plan(order, starts, durs);
  }

  /** True when a ranks above b by {@link Score}: fewer required requests missing, then more prize (transitions not compared). */
  private boolean better(Plan a, Plan b) {
    return new Score(a.requiredMissing(problem), a.prize(problem), 0)
        .betterThan(new Score(b.requiredMissing(problem), b.prize(problem), 0));
  }

  /** True when some schedulable request the pass considers, not yet planned nor excluded, may still start after {@code t}. */
  private boolean stillOpen(long t, boolean[] done, boolean[] excluded, Pass how) {
    for (int j = 0; j < problem.size(); j++) {
      Task tj = problem.task(j);
      if (!done[j] && !excluded[j] && tj.schedulable() && tj.latestStartS() > t
          && (how != Pass.REQUIRED_FIRST || mustHave(j))) {
        return true;
      }
    }
    return false;
  }

  /** True when the last {@link #plan(long)} stopped at its deadline before greedy had nothing left to add. */
  public boolean wasCut() {
    return cut;
  }

  /** The earliest start of any candidate of this pass from {@code t} (Long.MAX_VALUE / 2 when none fits). */
  private long earliestStart(Path path, long t, boolean[] done, int pass) {
    long earliest = Long.MAX_VALUE / 2;
    for (int j = 0; j < problem.size(); j++) {
      Task tj = problem.task(j);
      if (done[j] || !tj.schedulable() || (pass == 0) == (j == problem.mustBeLastIndex())) {
        continue;
      }
      long s = timer.earliestStart(path, j, t, t, tj.durationS(), tj.latestStartS());
      if (s >= 0 && s < earliest) {
        earliest = s;
      }
    }
    return earliest;
  }

  /**
   * The exposure request j gets when it starts at {@code s} with the clock at {@code t}: the option with
   * the best value per second used that fits in the window holding the start (a fixed request's duration).
   */
  private long exposure(int j, long s, long t) {
    Task task = problem.task(j);
    long latestEnd = task.latestEndFor(s);
    long bestD = task.durationS();
    double best = -1;
    for (int g = 0; g < task.optionCount() && s + task.durationS(g) <= latestEnd; g++) {
      double score = task.value(g) / Math.max(1, s + task.durationS(g) - t);
      if (score > best) {
        best = score;
        bestD = task.durationS(g);
      }
    }
    return bestD;
  }

  /**
   * True when every other unscheduled required request can still start after {@code end} (directly from j);
   * with several resources, a required request counts as reachable when a later resource may observe it.
   */
  private boolean requiredStillReachable(Path path, int j, long departS, long s, long end, boolean[] done) {
    Path after = null;
    for (int r : required) {
      Task tr = problem.task(r);
      if (r == j || done[r]) {
        continue;
      }
      if (end > tr.latestStartS()) {
        return false;
      }
      if (after == null) {
        after = path.then(j, departS, s);
      }
      if (timer.earliestStart(after, r, end, end, tr.durationS(), tr.latestStartS()) < 0) {
        return false;
      }
    }
    Sections sec = rules.sections();
    if (sec == null) {
      return true;
    }
    // Several resources: a required request must stay reachable on the resource in use unless a later
    // resource may still observe it (its clock starts afresh at its marker); one lost already is not j's doing.
    int here = sec.sectionOf(j);
    for (int u = 0; u < sec.unitCount(); u++) {
      if (!sec.unitRequired(u) || sec.unitOf(j) == u || held(sec, u, done)) {
        continue;
      }
      int local = -1;
      boolean later = false;
      for (int o : sec.options(u)) {
        if (problem.task(o).schedulable()) {
          later |= sec.sectionOf(o) > here;
          local = sec.sectionOf(o) == here ? o : local;
        }
      }
      if (later || local < 0) {
        continue;
      }
      Task to = problem.task(local);
      if (end > to.latestStartS()) {
        return false;
      }
      if (after == null) {
        after = path.then(j, departS, s);
      }
      if (timer.earliestStart(after, local, end, end, to.durationS(), to.latestStartS()) < 0) {
        return false;
      }
    }
    return true;
  }

  private static boolean held(Sections sec, int u, boolean[] done) {
    for (int o : sec.options(u)) {
      if (done[o]) {
        return true;
      }
    }
    return false;
  }
}
