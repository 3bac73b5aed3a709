package dev.sequencer.sequence;

/**
 * Something a planning run wants its user to know, typed so that programs can react and tests can assert
 * on the kind rather than on wording.
 */
public record Note(Kind kind, String text) {
  /** What a note is about. */
  public enum Kind {
    /** Where the plan came from, which warm start was kept. */
    SOURCE,
    /** A search phase's work and outcome. */
    SEARCH,
    /** A phase that was skipped or cut short by the budget. */
    BUDGET,
    /**
     * The greedy baseline itself (greedy and its exact repair) was cut short by the budget: the plan may then
     * be below what {@code --solver greedy} returns with more of the same limit left (the windows took it).
     */
    BASELINE_CUT,
    /** Exact re-timing and repair: observations moved, added or left out. */
    EXACT_TIMING,
    /** How the bound was obtained, or why one is missing. */
    BOUND,
    /** Why the status is what it is (e.g. FEASIBLE with a gap of 0: the slew level is not proven). */
    OPTIMALITY
  }

  public Note {
    java.util.Objects.requireNonNull(kind, "kind");
    java.util.Objects.requireNonNull(text, "text");
  }

  @Override
  public String toString() {
    return text;
  }
}
