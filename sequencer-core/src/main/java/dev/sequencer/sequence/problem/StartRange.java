package dev.sequencer.sequence.problem;

/** Closed range of allowed start times, whole seconds from the horizon start; {@code fromS <= toS}. */
public record StartRange(long fromS, long toS) {
  public StartRange {
    if (toS < fromS) {
      throw new IllegalArgumentException("start range [" + fromS + ", " + toS + "] is reversed");
    }
  }
}
