package dev.sequencer.model;

import java.util.List;
import java.util.Objects;

/** The visibility of one request: ordered, disjoint intervals inside the horizon (empty if never visible). */
public record RequestWindows(String id, List<TimeWindow> intervals) {
  public RequestWindows {
    Objects.requireNonNull(id, "id");
    intervals = List.copyOf(intervals);
  }

  /** Total visible seconds. */
  public double totalS() {
    return intervals.stream().mapToDouble(TimeWindow::durationS).sum();
  }
}
