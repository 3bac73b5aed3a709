package dev.sequencer.sequence.problem;

/**
 * A closed span [fromS, toS] of whole seconds from the horizon start (a visibility window rounded
 * inward) that must hold a whole observation of its request.
 */
public record Span(long fromS, long toS) {
  public Span {
    if (toS < fromS) {
      throw new IllegalArgumentException("span [" + fromS + ", " + toS + "] is reversed");
    }
  }

  /** True when the observation [startS, startS + durationS] lies inside. */
  public boolean holds(long startS, long durationS) {
    return startS >= fromS && startS + durationS <= toS;
  }
}
