package dev.sequencer.model;

import java.util.Objects;

/**
 * A request left out of the plan, with the reason in words; {@code visitsMissing} (A4): for a request with
 * visits, how many of them are not in the plan ({@code null} otherwise). A request with some but not all
 * of its visits scheduled is listed here as well as among the observations.
 */
public record Unscheduled(String id, String reason, Integer visitsMissing) {
  public Unscheduled {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(reason, "reason");
    if (visitsMissing != null && visitsMissing < 1) {
      throw new IllegalArgumentException("unscheduled " + id + ": visitsMissing must be >= 1 (was " + visitsMissing
          + ")");
    }
  }

  /** A request observed once, left out. */
  public Unscheduled(String id, String reason) {
    this(id, reason, null);
  }
}
