package dev.sequencer.sequence.problem;

/**
 * How plans rank, everywhere in the planner: fewer required requests missing first, then more prize
 * ({@link Prizes}: scaled priority, plus stability bonuses when re-planning), then less transition.
 *
 * <p>Every component is an integer, so ranking needs no tolerance: the prize is exact by construction and
 * the transition is counted in whole milliseconds, each leg rounded up ({@link #legMs}) — 1 ms is also the
 * validator's time tolerance. Searches that work on the model's transition bounds rank by those bounds
 * ({@code transitionMs} = 1000 × model seconds); the incumbent ranks by the exact legs.
 */
public record Score(int requiredMissing, long prize, long transitionMs) implements Comparable<Score> {
  /** Worse than any plan. */
  public static final Score NONE = new Score(Integer.MAX_VALUE, Long.MIN_VALUE, Long.MAX_VALUE);

  /** A leg of {@code seconds} in whole milliseconds, rounded up (1 µs of floating-point noise forgiven). */
  public static long legMs(double seconds) {
    return Math.max(0, (long) Math.ceil(seconds * 1000 - 1e-3));
  }

  /** Positive when this ranks above {@code o}. */
  @Override
  public int compareTo(Score o) {
    if (requiredMissing != o.requiredMissing) {
      return Integer.compare(o.requiredMissing, requiredMissing);
    }
    if (prize != o.prize) {
      return Long.compare(prize, o.prize);
    }
    return Long.compare(o.transitionMs, transitionMs);
  }

  /** True when this ranks strictly above {@code o}. */
  public boolean betterThan(Score o) {
    return compareTo(o) > 0;
  }

  /** True when every required request is in. */
  public boolean complete() {
    return requiredMissing == 0;
  }
}
