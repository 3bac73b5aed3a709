package dev.sequencer.slew;

/**
 * Transition times between the requests of one scenario, indexed in file order; {@link #START} stands for
 * the initial pointing.
 *
 * <p>A transition is measured, as the scenario format says, from the pointing at the end of the previous
 * observation (its <em>departure</em>) to the pointing at the start of the next (its <em>arrival</em>);
 * a sequence is legal when every arrival minus its departure covers the transition. The sequencer builds
 * its model from {@link #boundS}, which is never below the exact time for any departure and arrival inside
 * the given intervals. The exact times depend on the whole sequence for models with state (an alt-az
 * mount's unwrapped azimuth), so they are evaluated for a sequence at once by {@link #exactS}. All times in
 * seconds from the horizon start.
 */
public interface Transitions {
  /** Index of the initial pointing, as a "from" request. */
  int START = -1;

  /** Number of requests. */
  int size();

  /**
   * An upper bound on the transition from {@code from} (or {@link #START}) to {@code to} for any departure
   * (end of {@code from}) in [{@code departureMinS}, {@code departureMaxS}] and any arrival (start of
   * {@code to}) in [{@code arrivalMinS}, {@code arrivalMaxS}], whatever state the instrument is in after
   * {@code from}; {@link Double#POSITIVE_INFINITY} when the transition may be impossible (for example, no
   * legal mount path).
   */
  double boundS(int from, int to, double departureMinS, double departureMaxS, double arrivalMinS,
      double arrivalMaxS);

  /** The bound for one departure instant and one arrival instant. */
  default double boundS(int from, int to, double departureS, double arrivalS) {
    return boundS(from, to, departureS, departureS, arrivalS, arrivalS);
  }

  /**
   * Exact transition times along a sequence: element k is the time from the pointing of the previous
   * request at {@code departureS[k]} (its end; for k = 0 the start pointing at the horizon start) to the
   * pointing of {@code order[k]} at {@code arrivalS[k]} (its start). {@link Double#POSITIVE_INFINITY} marks
   * an impossible leg.
   */
  double[] exactS(int[] order, double[] departureS, double[] arrivalS);

  /**
   * True when an exact leg may exceed {@link #boundS} for reasons the pairwise bound cannot see: an alt-az
   * mount whose cable wrap runs out while it follows an earlier observation (the mount state depends on
   * the whole sequence). Planners then re-check exact legs and drop what the mount cannot follow.
   */
  default boolean exactMayExceedBound() {
    return false;
  }

  /**
   * True when transition times depend on when they happen (moving pointings, alt-az mounts). Fixed targets
   * pointed at their apparent direction move by at most the annual aberration; models whose tracks all have
   * a {@link PointingTrack#anchor()} fold that into their bounds and stay time-independent.
   */
  boolean timeDependent();

  /**
   * A path at the start pointing, before any observation: exact legs evaluated one at a time, the
   * instrument's state (an alt-az mount's unwrapped azimuth) carried along. {@link #exactS} is the same
   * computation for a whole sequence. The default replays {@link #exactS} on the prefix (O(n) per leg);
   * the models of this package answer each leg in O(1).
   */
  default Path path() {
    return ReplayPath.start(this);
  }

  /**
   * A point along a sequence: the observations made so far and the state they leave the instrument in.
   * Immutable, so a search may branch from any point. Times in seconds from the horizon start.
   */
  interface Path {
    /** The request observed last on this path, or {@link #START} before the first observation. */
    int last();

    /**
     * Exact seconds from the pointing of {@link #last()} at {@code departureS} (its end; for {@link #START}
     * the start pointing) to the pointing of {@code to} at {@code arrivalS} (its start);
     * {@link Double#POSITIVE_INFINITY} when impossible.
     */
    double legS(int to, double departureS, double arrivalS);

    /** The path after the leg of {@link #legS} and the observation of {@code to} that starts at {@code arrivalS}. */
    Path then(int to, double departureS, double arrivalS);

    /**
     * A value equal for two paths whose every later leg is the same (the last request and arrival, and the
     * mount's state); {@code null} when unknown, which never equals anything.
     */
    default Object state() {
      return null;
    }
  }

  /**
   * One slew as the timeline writes it (spec A3): its seconds (as {@link Path#legS}), the instant it
   * departs ({@code slewStart}) and the directions it passes through ({@code slewVia}, GCRF unit vectors;
   * empty for the direct path).
   */
  record Slew(double seconds, double departureS, java.util.List<org.hipparchus.geometry.euclidean.threed.Vector3D> via) {
    public Slew {
      via = java.util.List.copyOf(via);
    }
  }

  /**
   * The slew from {@code from} to {@code to} departing at {@code departureS} (the previous end) and arriving
   * at {@code arrivalS}, for models whose legs depend on the two requests only (eigenaxis); the default
   * (models with state or without a path) is a direct slew departing at {@code departureS} with seconds NaN
   * (not known here: use {@link #exactS}).
   */
  default Slew slew(int from, int to, double departureS, double arrivalS) {
    return new Slew(Double.NaN, departureS, java.util.List.of());
  }

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
