package dev.sequencer.model;

import java.time.Duration;
import java.time.Instant;
import java.util.Objects;

/** A closed UTC interval; {@code end} is never before {@code start}. */
public record TimeWindow(Instant start, Instant end) {
  public TimeWindow {
    Objects.requireNonNull(start, "start");
    Objects.requireNonNull(end, "end");
    if (end.isBefore(start)) {
      throw new IllegalArgumentException("end " + end + " is before start " + start);
    }
  }

  /** Length in seconds (fractional). */
  public double durationS() {
    Duration d = Duration.between(start, end);
    return d.getSeconds() + d.getNano() * 1e-9;
  }

  /** True when {@code t} lies in [start, end]. */
  public boolean contains(Instant t) {
    return !t.isBefore(start) && !t.isAfter(end);
  }

  /** True when [a, b] lies inside this window. */
  public boolean contains(Instant a, Instant b) {
    return !a.isBefore(start) && !b.isAfter(end);
  }
}
