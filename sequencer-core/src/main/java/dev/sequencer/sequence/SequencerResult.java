package dev.sequencer.sequence;

import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/**
 * The answer of {@link Sequencer#plan}: status, observations in time order, totals, the proven upper
 * bound on total priority and the relative gap, the reason for each unscheduled request, and statistics.
 *
 * <p>{@code boundPriority} is {@code Double.NaN} when nothing was proven. {@code gap} = (bound −
 * priority) / bound, 0 when optimal, {@code NaN} without a bound. {@code message} explains
 * INFEASIBLE and NO_SOLUTION_IN_TIME in words ({@code ""} otherwise). {@code conflicts}: for INFEASIBLE,
 * the required requests that cannot all be scheduled and why ({@link RequiredConflicts}); empty otherwise
 * or when no conflicting set could be singled out in time.
 */
public record SequencerResult(
    PlanStatus status,
    List<Planned> observations,
    double totalPriority,
    double totalTransitionS,
    double boundPriority,
    double gap,
    List<Unscheduled> unscheduled,
    Stats stats,
    String message,
    List<RequiredConflicts.Conflict> conflicts) {

  /**
   * One scheduled request: start and end (instants and seconds from the horizon start), the exact
   * transition before it and, for a flexible request, the value collected ({@code null} otherwise).
   */
  public record Planned(String id, Instant start, Instant end, long startS, long endS, double transitionS,
      Double value) {
    /** A fixed-duration observation (no value). */
    public Planned(String id, Instant start, Instant end, long startS, long endS, double transitionS) {
      this(id, start, end, startS, endS, transitionS, null);
    }
  }

  /**
   * Statistics: arcs kept in the main model and arcs that are time-feasible at all, model build and solve
   * seconds, CP-SAT solutions found, LNS rounds and improvements, the relaxation bound alone ({@code NaN}
   * when not computed), model transition seconds minus exact seconds after compaction, and the total
   * seconds the compaction moved starts earlier.
   */
  public record Stats(
      long arcsKept,
      long arcsFeasible,
      double buildS,
      double solveS,
      int solutions,
      int lnsRounds,
      int lnsImprovements,
      double relaxationBound,
      double transitionSavedS,
      long compactionShiftS,
      String notes) {}

  public SequencerResult {
    observations = List.copyOf(observations);
    unscheduled = List.copyOf(unscheduled);
    conflicts = List.copyOf(conflicts);
  }

  /** A result without conflicts (every status but INFEASIBLE). */
  public SequencerResult(PlanStatus status, List<Planned> observations, double totalPriority,
      double totalTransitionS, double boundPriority, double gap, List<Unscheduled> unscheduled, Stats stats,
      String message) {
    this(status, observations, totalPriority, totalTransitionS, boundPriority, gap, unscheduled, stats, message,
        List.of());
  }

  /** True when the result carries a plan (OPTIMAL or FEASIBLE). */
  public boolean hasPlan() {
    return status == PlanStatus.OPTIMAL || status == PlanStatus.FEASIBLE;
  }

  /** The timeline-file view: same status, totals, bound ({@code null} when unknown), observations, unscheduled. */
  public Timeline toTimeline() {
    List<Observation> obs = new ArrayList<>();
    for (Planned p : observations) {
      obs.add(new Observation(p.id(), p.start(), p.end(), p.transitionS(), p.value(), null));
    }
    Double bound = Double.isNaN(boundPriority) ? null : boundPriority;
    return new Timeline(status, totalPriority, totalTransitionS, bound, obs, unscheduled);
  }
}
