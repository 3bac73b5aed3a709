package dev.sequencer.sequence.replan;

import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.validate.TimelineCheck;
import java.util.Objects;
import java.util.Set;

/**
 * How {@link Replanner} re-plans. Immutable; change by copy: {@code ReplanOptions.defaults().withDropFailed(true)}.
 *
 * <p>{@code sequencer}: the solver settings of the re-plan. {@code dropFailed}: failed requests are not
 * retried (required ones always are). {@code stabilityWeight}: {@code NaN} (the default) ranks plans
 * lexicographically — priority first, then the stability score (kept previous requests + kept previous
 * successor arcs), then total slew; a number w >= 0 ranks them by priority + w x stability score, then
 * slew (0 switches stability off). {@code warmStart}: offer the rest of the previous plan to the
 * sequencer as warm start (it is always kept as a fallback). {@code validator}: the check of the whole
 * night, done and running observations included ({@code null}: the sequencer's self-check from the problem's own windows
 * and transitions; the library façade passes the independent validator); the re-plan applies its re-planning instant.
 * {@code unavailable}: ids of resources (format addition A6) out of service from the re-planning instant to
 * the end of the horizon — nothing new is planned on them, and an observation running on one at the
 * re-planning instant counts as failed unless it is listed as done.
 */
public record ReplanOptions(SequencerOptions sequencer, boolean dropFailed, double stabilityWeight, boolean warmStart,
    TimelineCheck validator, Set<String> unavailable) {
  public ReplanOptions {
    Objects.requireNonNull(sequencer, "sequencer");
    unavailable = Set.copyOf(Objects.requireNonNull(unavailable, "unavailable"));
    if (!Double.isNaN(stabilityWeight) && !(stabilityWeight >= 0 && stabilityWeight < Double.POSITIVE_INFINITY)) {
      throw new IllegalArgumentException("stabilityWeight: must be a finite number >= 0, got " + stabilityWeight);
    }
  }

  /** Sequencer defaults, failed requests retried, lexicographic stability, warm start on. */
  public static ReplanOptions defaults() {
    return new ReplanOptions(SequencerOptions.defaults(), false, Double.NaN, true, null, Set.of());
  }

  public ReplanOptions withSequencer(SequencerOptions v) {
    return new ReplanOptions(v, dropFailed, stabilityWeight, warmStart, validator, unavailable);
  }

  public ReplanOptions withDropFailed(boolean v) {
    return new ReplanOptions(sequencer, v, stabilityWeight, warmStart, validator, unavailable);
  }

  /** Priority units per unit of stability score; 0 switches stability off. */
  public ReplanOptions withStabilityWeight(double v) {
    return new ReplanOptions(sequencer, dropFailed, v, warmStart, validator, unavailable);
  }

  /** Back to the default lexicographic order: priority, then stability, then slew. */
  public ReplanOptions withLexicographicStability() {
    return new ReplanOptions(sequencer, dropFailed, Double.NaN, warmStart, validator, unavailable);
  }

  public ReplanOptions withWarmStart(boolean v) {
    return new ReplanOptions(sequencer, dropFailed, stabilityWeight, v, validator, unavailable);
  }

  public ReplanOptions withValidator(TimelineCheck v) {
    return new ReplanOptions(sequencer, dropFailed, stabilityWeight, warmStart, v, unavailable);
  }

  /** Resources out of service from the re-planning instant on (ids of the scenario's resources). */
  public ReplanOptions withUnavailable(Set<String> v) {
    return new ReplanOptions(sequencer, dropFailed, stabilityWeight, warmStart, validator, v);
  }

  /** True in the default lexicographic mode. */
  public boolean lexicographic() {
    return Double.isNaN(stabilityWeight);
  }
}
