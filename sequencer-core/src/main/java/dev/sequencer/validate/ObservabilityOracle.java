package dev.sequencer.validate;

import dev.sequencer.model.Request;
import java.time.Instant;
import java.util.List;

/**
 * An independent physics re-check of one observation (for example, recomputing elevation and Sun
 * separation over [start, end]); returns violations in words, empty when the observation is observable.
 */
@FunctionalInterface
public interface ObservabilityOracle {
  /** Violations for request {@code r} observed over [start, end]; empty when none. */
  List<String> violations(Request r, Instant start, Instant end);
}
