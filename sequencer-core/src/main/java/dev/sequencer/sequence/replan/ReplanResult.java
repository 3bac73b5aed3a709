package dev.sequencer.sequence.replan;

import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Timeline;
import java.time.Instant;

/**
 * The answer of {@link Replanner#replan}: the whole night's timeline (done and running observations
 * first, marked, then the new plan marked "planned"), where the new plan came from and how it compares
 * with the rest of the previous plan.
 *
 * <p>{@code newPriority}: priority of the newly planned observations; {@code tailPriority}: priority of the
 * previous plan's observations that had not started ({@code tailRequests} of them), as planned;
 * {@code solverPriority}: what the sequencer's own plan would have collected ({@code NaN} when it gave
 * none). {@code keptRequests} and {@code keptArcs}: the stability score's parts. {@code departure}: the
 * instant the new plan may start slewing. {@code message}: why there is no plan ({@code ""} otherwise).
 */
public record ReplanResult(
    Timeline timeline,
    Source source,
    double newPriority,
    double tailPriority,
    double solverPriority,
    int tailRequests,
    int keptRequests,
    int keptArcs,
    Instant departure,
    String message,
    String notes) {

  /** Which candidate became the new plan. */
  public enum Source {
    /** The sequencer's plan. */
    SOLVER,
    /** The rest of the previous plan (kept where still valid), as the fallback. */
    PREVIOUS_TAIL,
    /** No plan: see the message. */
    NONE
  }

  /** The timeline's status. */
  public PlanStatus status() {
    return timeline.status();
  }

  /** True when the result carries a plan (OPTIMAL or FEASIBLE). */
  public boolean hasPlan() {
    return status() == PlanStatus.OPTIMAL || status() == PlanStatus.FEASIBLE;
  }
}
