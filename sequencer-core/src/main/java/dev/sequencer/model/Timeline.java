package dev.sequencer.model;

import java.util.List;
import java.util.Objects;

/**
 * A plan as written to the timeline file: status, objective (total priority, then total slew seconds),
 * the proven upper bound on priority ({@code null} when none is known), observations in time order and
 * every other request with a reason.
 */
public record Timeline(
    PlanStatus status,
    double priority,
    double slewSeconds,
    Double bound,
    List<Observation> observations,
    List<Unscheduled> unscheduled) {
  public Timeline {
    Objects.requireNonNull(status, "status");
    observations = List.copyOf(observations);
    unscheduled = List.copyOf(unscheduled);
  }
}
