package dev.sequencer.sequence;

/**
 * The wall-clock budget of one planning run: it starts when the run starts (for the CLI and the
 * {@code Planner} façade, right after the scenario is read, so that visibility windows and transitions
 * count too) and every phase takes its deadline from it. A phase that runs long takes time from the later
 * ones; none adds to the total. Immutable; one budget may be read from several threads.
 */
public final class Budget {
  private final long startNanos;
  private final double totalS;

  private Budget(long startNanos, double totalS) {
    if (!(totalS > 0) || Double.isNaN(totalS)) {
      throw new IllegalArgumentException("totalS: must be > 0, got " + totalS);
    }
    this.startNanos = startNanos;
    this.totalS = totalS;
  }

  /** A budget of {@code totalS} seconds starting now. */
  public static Budget startingNow(double totalS) {
    return new Budget(System.nanoTime(), totalS);
  }

  /** The same start with another total (the caller's limit applies from the same instant). */
  public Budget withTotalS(double newTotalS) {
    return new Budget(startNanos, newTotalS);
  }

  /** The whole budget, seconds. */
  public double totalS() {
    return totalS;
  }

  /** Seconds since the start. */
  public double elapsedS() {
    return (System.nanoTime() - startNanos) * 1e-9;
  }

  /** Seconds left (0 once spent). */
  public double remainingS() {
    return Math.max(0, totalS - elapsedS());
  }

  /** The end of the budget, {@link System#nanoTime} units. */
  public long deadlineNanos() {
    return startNanos + (long) (totalS * 1e9);
  }

  /** True once the budget is spent. */
  public boolean expired() {
    return System.nanoTime() >= deadlineNanos();
  }

  /**
   * The deadline of a phase that may take {@code share} of what is left before the last {@code reserveS}
   * seconds (kept for the phases after it): now + share·(end − reserve − now), never before now. Shares are
   * of the time left, not of the total, so they never stack past the end: a phase that started late (an
   * earlier one ran long) gets its share of less, and the later phases still get theirs.
   */
  public long phaseDeadlineNanos(double share, double reserveS) {
    long now = System.nanoTime();
    long rest = deadlineNanos() - (long) (reserveS * 1e9) - now;
    return rest <= 0 ? now : now + (long) (Math.min(1.0, share) * rest);
  }

  /** Seconds until {@link #phaseDeadlineNanos}. */
  public double phaseS(double share, double reserveS) {
    return Math.max(0, (phaseDeadlineNanos(share, reserveS) - System.nanoTime()) * 1e-9);
  }
}
