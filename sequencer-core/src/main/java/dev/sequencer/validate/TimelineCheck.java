package dev.sequencer.validate;

import dev.sequencer.model.Timeline;
import java.time.Instant;
import java.util.List;

/**
 * A check of a whole timeline, in words (empty = valid), with the two variants a re-plan needs. The
 * independent {@link PlanValidator} is one; the sequencer's self-check (package {@code sequence}) is the
 * other, used only where no scenario is at hand.
 */
public interface TimelineCheck {
  /** What is wrong with {@code timeline}, one sentence per violation; empty when it is valid. */
  List<String> violations(Timeline timeline);

  /**
   * A copy for a re-plan made at {@code now}: done and running observations start at or before it, planned
   * ones at or after it; legs into done and running observations are history and not re-checked.
   */
  TimelineCheck withNow(Instant now);

  /** A copy that does not ask for the required requests (part of a night, the rest still to come). */
  TimelineCheck withRequiredIgnored();
}
