package dev.sequencer.model;

import java.util.Objects;

/** A request left out of the plan, with the reason in words. */
public record Unscheduled(String id, String reason) {
  public Unscheduled {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(reason, "reason");
  }
}
