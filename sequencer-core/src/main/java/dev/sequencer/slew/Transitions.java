package dev.sequencer.slew;

/**
 * Transition times between the requests of one scenario, indexed in file order; {@link #START} stands for
 * the initial pointing.
 *
 * <p>The sequencer builds its model from {@link #boundS}, which is never below the exact time for any
 * departure inside the given interval. The exact times depend on the whole sequence for models with
 * state (an alt-az mount's unwrapped azimuth), so they are evaluated for a sequence at once by
 * {@link #exactS}. All times in seconds; departures in seconds from the horizon start.
 */
public interface Transitions {
  /** Index of the initial pointing, as a "from" request. */
  int START = -1;

  /** Number of requests. */
  int size();

  /**
   * An upper bound on the transition from {@code from} (or {@link #START}) to {@code to} for any departure
   * (end of {@code from}) in [{@code departureMinS}, {@code departureMaxS}], whatever state the
   * instrument is in after {@code from}; {@link Double#POSITIVE_INFINITY} when the transition is never
   * possible (for example, no legal mount path).
   */
  double boundS(int from, int to, double departureMinS, double departureMaxS);

  /**
   * Exact transition times along a sequence: element k is the time from the previous request (or the
   * start pointing for k = 0) to {@code order[k]}, departing at {@code departureS[k]} (the end of the
   * previous observation, or the horizon start for k = 0) and arriving at the pointing of
   * {@code order[k]} at the instant the slew ends. {@link Double#POSITIVE_INFINITY} marks an impossible
   * leg.
   */
  double[] exactS(int[] order, double[] departureS);

  /** True when transition times depend on when they happen (moving pointings, alt-az mounts). */
  boolean timeDependent();

  /** The same {@code seconds} between any two requests and from the start pointing. */
  static Transitions fixed(int size, double seconds) {
    return new FixedTransitions(size, seconds);
  }

  /**
   * A user table: {@code seconds[i][j]} from request i to request j, {@code fromStartSeconds[j]} from the
   * start pointing (all zero when {@code null}).
   */
  static Transitions matrix(double[][] seconds, double[] fromStartSeconds) {
    return new MatrixTransitions(seconds, fromStartSeconds);
  }
}
