package dev.sequencer.planner;

import dev.sequencer.sequence.replan.ReplanResult;

/** One re-planning run through {@link Planner#replan}: the geometry it computed, the re-plan and its wall time. */
public record ReplanOutcome(Geometry geometry, ReplanResult result, double wallS) {}
