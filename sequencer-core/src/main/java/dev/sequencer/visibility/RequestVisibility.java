package dev.sequencer.visibility;

import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import java.util.List;
import java.util.Map;

/**
 * Visibility of one request: its windows, and for each constraint the seconds of the horizon it
 * removes on its own (so a user learns why a request is rarely or never visible).
 *
 * @param id request id
 * @param intervals ordered, disjoint windows inside the horizon where every constraint holds
 * @param removedS seconds of the horizon where each constraint alone fails, by constraint name
 *     (including "request windows" for time outside the request's own windows)
 */
public record RequestVisibility(String id, List<TimeWindow> intervals, Map<String, Double> removedS) {
  public RequestVisibility {
    intervals = List.copyOf(intervals);
    removedS = Map.copyOf(removedS);
  }

  /** The constraint that removes the most time on its own, or {@code null} when none removes any. */
  public String limitingConstraint() {
    return removedS.entrySet().stream()
        .filter(e -> e.getValue() > 0)
        .max(Map.Entry.<String, Double>comparingByValue().thenComparing(Map.Entry.comparingByKey()))
        .map(Map.Entry::getKey)
        .orElse(null);
  }

  /** True when there is no window at all. */
  public boolean neverVisible() {
    return intervals.isEmpty();
  }

  /** Total visible seconds. */
  public double totalS() {
    return intervals.stream().mapToDouble(TimeWindow::durationS).sum();
  }

  /** As the windows file's entry. */
  public RequestWindows toWindows() {
    return new RequestWindows(id, intervals);
  }
}
