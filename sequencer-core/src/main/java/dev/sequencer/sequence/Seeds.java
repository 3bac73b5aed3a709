package dev.sequencer.sequence;

import dev.sequencer.sequence.problem.Plan;
import java.util.List;

/**
 * Plans a caller already has, e.g. the rest of a previous plan when re-planning: warm starts are offered
 * to the incumbent before the searches (so they start from the best of them and greedy), fallbacks only
 * at the end (the result is never worse, but the searches do not start from them). Either is timed
 * exactly when offered; what no longer fits is left out.
 */
public record Seeds(List<Plan> warmStarts, List<Plan> fallbacks) {
  /** No seed. */
  public static final Seeds NONE = new Seeds(List.of(), List.of());

  public Seeds {
    warmStarts = List.copyOf(warmStarts);
    fallbacks = List.copyOf(fallbacks);
  }
}
