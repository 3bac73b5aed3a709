package dev.sequencer.cli;

import dev.sequencer.model.Unscheduled;
import dev.sequencer.sequence.problem.Reasons;
import dev.sequencer.visibility.RequestVisibility;
import java.util.List;

/**
 * Why a request is rarely or never observable, in words: the constraint that removes the most time on its
 * own (any of the scenario's or the request's own constraints, by the visibility engine's names:
 * "airmass", "hour angle", "Moon illumination", ...). Used by {@code windows} and by the printed plans.
 */
final class Explained {
  private Explained() {}

  /** " (airmass removes the most time)", or the empty string when no constraint removes any time. */
  static String limiting(RequestVisibility v) {
    String c = v == null ? null : v.limitingConstraint();
    return c == null ? "" : " (" + c + " removes the most time)";
  }

  /**
   * The reason of {@code u}; when it is about visibility (never visible, windows too short), followed by
   * the constraint that removes the most time according to {@code vis} (may be null).
   */
  static String of(Unscheduled u, List<RequestVisibility> vis) {
    boolean aboutVisibility = u.reason().equals(Reasons.NEVER_VISIBLE)
        || u.reason().equals(Reasons.WINDOWS_TOO_SHORT);
    if (vis == null || !aboutVisibility) {
      return words(u.reason());
    }
    RequestVisibility v = vis.stream().filter(x -> x.id().equals(u.id())).findFirst().orElse(null);
    return words(u.reason()) + limiting(v);
  }

  /** The reason without a leading "not scheduled: " (every caller already says the request is not scheduled). */
  static String words(String reason) {
    String prefix = "not scheduled: ";
    return reason.startsWith(prefix) ? reason.substring(prefix.length()) : reason;
  }
}
