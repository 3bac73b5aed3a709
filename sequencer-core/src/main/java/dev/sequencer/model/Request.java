package dev.sequencer.model;

import java.util.List;
import java.util.Objects;

/**
 * A wanted observation.
 *
 * <p>A fixed request has {@code durationS} (0 is a pure waypoint) and {@code priority}; a flexible
 * request has {@code flexible} instead and both of those are {@code null}. {@code target} is
 * {@code null} only when the scenario has no observer. {@code windows} is empty when the file gives none
 * (then only the computed visibility limits the request).
 */
public record Request(
    String id,
    Target target,
    Double durationS,
    Double priority,
    boolean required,
    List<TimeWindow> windows,
    FlexibleExposure flexible) {
  public Request {
    Objects.requireNonNull(id, "id");
    Checks.finiteOrNull("durationS", durationS);
    Checks.finiteOrNull("priority", priority);
    windows = List.copyOf(windows);
  }

  /** A fixed-duration request with no explicit windows. */
  public static Request of(String id, Target target, double durationS, double priority) {
    return new Request(id, target, durationS, priority, false, List.of(), null);
  }

  /** A copy with these allowed windows. */
  public Request withWindows(List<TimeWindow> newWindows) {
    return new Request(id, target, durationS, priority, required, newWindows, flexible);
  }

  /** A copy with the required flag set. */
  public Request withRequired(boolean newRequired) {
    return new Request(id, target, durationS, priority, newRequired, windows, flexible);
  }

  /** True for the flexible-exposure extension. */
  public boolean isFlexible() {
    return flexible != null;
  }

  /** Shortest time the request occupies: its duration, or the flexible minimum. */
  public double minDurationS() {
    return isFlexible() ? flexible.minDurationS() : durationS;
  }
}
