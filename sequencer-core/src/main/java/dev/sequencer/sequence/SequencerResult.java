package dev.sequencer.sequence;

import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;

/**
 * The answer of {@link Sequencer#plan}: status, observations in time order, totals, the proven upper
 * bound on total priority and the relative gap, the reason for each unscheduled request, and statistics.
 * Built by the named factories {@link #planned}, {@link #infeasible} and {@link #noPlanInTime}.
 *
 * <p>{@code boundPriority} is {@code Double.NaN} when nothing was proven. {@code gap} = (bound −
 * priority) / bound, 0 when the bound is reached, {@code NaN} without a bound. {@code priorityProven}:
 * the bound equals the priority, so no plan collects more; the status is OPTIMAL only when the slew level
 * is proven too (see the {@link Note.Kind#OPTIMALITY} note otherwise). {@code message} explains
 * INFEASIBLE and NO_SOLUTION_IN_TIME in words ({@code ""} otherwise). {@code conflicts}: required
 * requests that cannot all be scheduled and why ({@link RequiredConflicts}); for INFEASIBLE a proof, for
 * NO_SOLUTION_IN_TIME what the model's bounds suggest, re-checked with the exact slews.
 */
public record SequencerResult(
    PlanStatus status,
    List<Planned> observations,
    double totalPriority,
    double totalTransitionS,
    double boundPriority,
    double gap,
    boolean priorityProven,
    List<Unscheduled> unscheduled,
    Stats stats,
    String message,
    List<RequiredConflicts.Conflict> conflicts) {

  /**
   * One scheduled request: start and end (instants and seconds from the horizon start), the exact
   * transition before it, for a flexible request the value collected ({@code null} otherwise) and, for a
   * request with visits (A4), the visit number (1, 2, … in time order; {@code null} otherwise), and with
   * several resources (A6) the resource that makes it ({@code null} with one; seconds and the transition are
   * then that resource's own).
   */
  public record Planned(String id, Instant start, Instant end, long startS, long endS, double transitionS,
      Double value, Integer visit, String resource) {
    /** A request observed once. */
    public Planned(String id, Instant start, Instant end, long startS, long endS, double transitionS, Double value) {
      this(id, start, end, startS, endS, transitionS, value, null, null);
    }

    /** An observation of a scenario with one resource. */
    public Planned(String id, Instant start, Instant end, long startS, long endS, double transitionS, Double value,
        Integer visit) {
      this(id, start, end, startS, endS, transitionS, value, visit, null);
    }
  }

  /**
   * Statistics: arcs kept in the main model and arcs that are time-feasible at all, model build and solve
   * seconds, plans offered by all producers, LNS rounds and improvements, the relaxation bound alone
   * ({@code NaN} when not computed), which producer found the returned plan, the priority of the best
   * plan before the fallbacks were offered ({@link Seeds}; {@code NaN} when none held every required
   * request), the notes, and the seconds each phase took (in run order).
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
      String source,
      double ownPriority,
      List<Note> notes,
      Map<String, Double> phaseS) {
    public Stats {
      notes = List.copyOf(notes);
      phaseS = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(phaseS));
    }

    /** The notes as one line of text. */
    public String notesText() {
      return notes.stream().map(Note::text).collect(Collectors.joining(" "));
    }

    /** True when some note is of this kind. */
    public boolean has(Note.Kind kind) {
      return notes.stream().anyMatch(n -> n.kind() == kind);
    }
  }

  public SequencerResult {
    observations = List.copyOf(observations);
    unscheduled = List.copyOf(unscheduled);
    conflicts = List.copyOf(conflicts);
  }

  /** A plan: OPTIMAL or FEASIBLE, with its bound ({@code NaN} when none) and gap computed from it. */
  public static SequencerResult planned(PlanStatus status, List<Planned> observations, double totalPriority,
      double totalTransitionS, double bound, boolean priorityProven, List<Unscheduled> unscheduled, Stats stats) {
    if (status != PlanStatus.OPTIMAL && status != PlanStatus.FEASIBLE) {
      throw new IllegalArgumentException("a planned result is OPTIMAL or FEASIBLE, not " + status);
    }
    double gap = Double.isNaN(bound) ? Double.NaN : bound <= 0 ? 0 : Math.max(0, (bound - totalPriority) / bound);
    return new SequencerResult(status, observations, totalPriority, totalTransitionS, bound, gap, priorityProven,
        unscheduled, stats, "", List.of());
  }

  /** Proven infeasible: {@code message} says why, {@code conflicts} name the required requests at fault. */
  public static SequencerResult infeasible(String message, List<RequiredConflicts.Conflict> conflicts,
      List<Unscheduled> unscheduled, Stats stats) {
    return new SequencerResult(PlanStatus.INFEASIBLE, List.of(), 0, 0, Double.NaN, Double.NaN, false, unscheduled,
        stats, message, conflicts);
  }

  /** No plan holding every required request was found in time (nothing proven about whether one exists). */
  public static SequencerResult noPlanInTime(String message, List<RequiredConflicts.Conflict> suspected,
      double bound, List<Unscheduled> unscheduled, Stats stats) {
    return new SequencerResult(PlanStatus.NO_SOLUTION_IN_TIME, List.of(), 0, 0, bound, Double.NaN, false,
        unscheduled, stats, message, suspected);
  }

  /** True when the result carries a plan (OPTIMAL or FEASIBLE). */
  public boolean hasPlan() {
    return status == PlanStatus.OPTIMAL || status == PlanStatus.FEASIBLE;
  }

  /** The timeline-file view: same status, totals, bound ({@code null} when unknown), observations, unscheduled. */
  public Timeline toTimeline() {
    List<Observation> obs = new ArrayList<>();
    for (Planned p : observations) {
      obs.add(new Observation(p.id(), p.start(), p.end(), p.transitionS(), p.value(), null).withVisit(p.visit())
          .withResource(p.resource()));
    }
    Double bound = Double.isNaN(boundPriority) ? null : boundPriority;
    return new Timeline(status, totalPriority, totalTransitionS, bound, obs, unscheduled);
  }
}
