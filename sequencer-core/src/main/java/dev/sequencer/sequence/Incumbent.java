package dev.sequencer.sequence;

import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Score;
import dev.sequencer.sequence.timing.ExactTimer;

/**
 * The best plan of a run so far: every producer (greedy, deadline orders, a re-plan's previous tail, the
 * insertion search, every CP-SAT solution, every LNS round, the exposure moves, exact repair) offers its
 * plans here, and this is the only place that decides which one wins.
 *
 * <p>An offered plan is first timed exactly ({@link ExactTimer#timeKeepingRules}: earliest exact starts, or
 * the plan's own starts when its exact legs fit only there, with what breaks a rule between tasks — visits,
 * groups — left out), then ranked by its {@link Score} with the exact
 * legs. So the incumbent is always a plan that holds under the exact slews, progress reports the plan the
 * run would return, and the returned plan is never worse than any plan reported during the run. A plan
 * that cannot beat the incumbent on its required requests and prize alone is rejected before timing.
 * Thread-safe.
 */
final class Incumbent {
  /** Who offered a plan. */
  enum Source { EMPTY, GREEDY, DEADLINE_ORDER, PREFERRED, INSERTION, MOVES, CPSAT, LNS, TWO_STAGE, FALLBACK, REPAIR, STATE_SPACE,
    RESOURCES_IN_TURN }

  /** The incumbent: its exact timing, rank and producer. */
  record Best(ExactTimer.Timed timed, Score score, Source source) {
    Plan plan() {
      return timed.plan();
    }
  }

  private final PlanningProblem problem;
  private final ExactTimer timer;
  private final ProgressListener listener;
  private final Budget clock;
  private Best best;
  private int offers;
  private double knownBound = Double.NaN;

  Incumbent(PlanningProblem problem, ExactTimer timer, ProgressListener listener, Budget clock) {
    this.problem = problem;
    this.timer = timer;
    this.listener = listener;
    this.clock = clock;
  }

  /** Offers a plan (model- or exact-feasible); true when it became the incumbent. */
  synchronized boolean offer(Plan plan, Source source) {
    offers++;
    if (best != null) {
      Score quick = new Score(plan.requiredMissing(problem), plan.prize(problem), Long.MIN_VALUE);
      if (!quick.betterThan(best.score())) {
        return false; // timing can only keep or lose observations: it cannot beat the incumbent
      }
    }
    ExactTimer.Timed timed = timer.timeKeepingRules(plan);
    Score score = timed.score(problem);
    if (best != null && !score.betterThan(best.score())) {
      return false;
    }
    best = new Best(timed, score, source);
    if (source != Source.EMPTY) {
      report(); // the empty plan is only the floor, not a plan anyone found
    }
    return true;
  }

  /** A new proven bound on total priority (user units, this run's requests only). */
  synchronized void bound(double priorityBound) {
    if (!Double.isNaN(priorityBound) && (Double.isNaN(knownBound) || priorityBound < knownBound)) {
      knownBound = priorityBound;
    }
  }

  /** The best proven bound reported so far ({@code NaN} when none). */
  synchronized double knownBound() {
    return knownBound;
  }

  private void report() {
    if (listener != null) {
      listener.onProgress(offers, best.plan().priority(problem), best.timed().transitionS(), knownBound,
          clock.elapsedS());
    }
  }

  /** The incumbent, or {@code null} before the first offer. */
  synchronized Best best() {
    return best;
  }

  /** Plans offered so far. */
  synchronized int offers() {
    return offers;
  }
}
