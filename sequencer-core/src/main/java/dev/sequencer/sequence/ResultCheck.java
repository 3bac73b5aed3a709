package dev.sequencer.sequence;

import dev.sequencer.validate.TimelineCheck;
import java.util.List;

/**
 * The one independent check a planning run's plan must pass before it is handed out; a violation is a bug
 * and fails the run. The façade checks with the full validator (the physics re-check included), a re-plan
 * checks the merged night.
 */
@FunctionalInterface
public interface ResultCheck {
  /** What is wrong with the result's plan, in words; empty when it is valid. */
  List<String> violations(SequencerResult result);

  /**
   * About how long the check takes for a plan observing {@code observedS} seconds in all, so that the run
   * keeps that much of its budget for it (0 when negligible).
   */
  default double expectedS(long observedS) {
    return 0;
  }

  /** The check of {@code validator} on the result's timeline. */
  public static ResultCheck of(TimelineCheck validator) {
    return r -> validator.violations(r.toTimeline());
  }
}
