package dev.sequencer.model;

import java.time.Instant;
import java.util.Objects;

/**
 * One scheduled observation: its interval, the transition time before it (from the previous
 * observation or the start pointing), the value collected for flexible requests ({@code null}
 * otherwise) and the re-planning state ({@code null} means planned).
 */
public record Observation(String id, Instant start, Instant end, double slewSeconds, Double value, String state) {
  /** Re-planning states of the spec's extension. */
  public static final String DONE = "done";
  public static final String RUNNING = "running";
  public static final String PLANNED = "planned";

  public Observation {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(start, "start");
    Objects.requireNonNull(end, "end");
    if (end.isBefore(start)) {
      throw new IllegalArgumentException("observation " + id + ": end " + end + " is before start " + start);
    }
    Checks.finite("slewSeconds", slewSeconds);
  }

  /** A planned fixed-duration observation. */
  public static Observation of(String id, Instant start, Instant end, double slewSeconds) {
    return new Observation(id, start, end, slewSeconds, null, null);
  }

  /** Duration in seconds. */
  public double durationS() {
    return new TimeWindow(start, end).durationS();
  }
}
