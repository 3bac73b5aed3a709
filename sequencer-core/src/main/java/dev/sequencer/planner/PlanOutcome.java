package dev.sequencer.planner;

import dev.sequencer.model.Timeline;
import dev.sequencer.sequence.SequencerResult;
import java.util.Map;

/**
 * One planning run through {@link Planner#plan}: the geometry it computed, the sequencer's answer, its
 * timeline-file view, and the seconds of every phase (windows, transitions, then the sequencer's own) and
 * of the whole run. A result with a plan has passed the independent check exactly once.
 */
public record PlanOutcome(Geometry geometry, SequencerResult result, Timeline timeline, Map<String, Double> phaseS,
    double wallS) {
  public PlanOutcome {
    phaseS = Map.copyOf(phaseS);
  }
}
