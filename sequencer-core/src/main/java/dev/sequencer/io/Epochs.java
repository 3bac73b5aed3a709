package dev.sequencer.io;

import dev.sequencer.model.TimeWindow;
import java.time.Duration;
import java.time.Instant;

/** How far an orbit's epoch lies from the horizon: an error when surely wrong, a warning when far. */
final class Epochs {
  /** Beyond this many days between the epoch and the horizon the elements are surely the wrong ones: error. */
  static final double MAX_DISTANCE_DAYS = 3650;
  /** Beyond this many days predictions from the elements are poor: warning. */
  static final double WARN_DISTANCE_DAYS = 30;

  private Epochs() {}

  /**
   * Reports {@code epoch} of {@code what} ("TLE", "elements") at {@code path} when it is far from
   * {@code horizon} (null: no check); {@code why} says, after the warning, what the distance costs.
   */
  static void check(Instant epoch, TimeWindow horizon, String path, String value, Problems p, String what,
      String why) {
    if (horizon == null) {
      return;
    }
    Duration gap =
        epoch.isBefore(horizon.start())
            ? Duration.between(epoch, horizon.start())
            : epoch.isAfter(horizon.end()) ? Duration.between(horizon.end(), epoch) : Duration.ZERO;
    double days = gap.toMillis() / 86_400_000.0;
    String side = epoch.isBefore(horizon.start()) ? "before the horizon start" : "after the horizon end";
    String text = String.format(java.util.Locale.ROOT, "epoch %s is %.1f days %s", epoch, days, side);
    if (days > MAX_DISTANCE_DAYS) {
      p.add(path, text + "; more than " + Range.num(MAX_DISTANCE_DAYS) + " days is surely the wrong " + what, value);
    } else if (days > WARN_DISTANCE_DAYS) {
      p.warn(path, text + "; " + why);
    }
  }
}
