package dev.sequencer.sequence;

import dev.sequencer.slew.Transitions;

/**
 * Time buckets for time-dependent transitions: the horizon is cut into equal buckets of start times, and
 * an arc's transition is bounded separately for each pair (bucket of the start of A, bucket of the start
 * of B). A bound over the whole start ranges of A and B lets both pointings drift over hours (an alt-az
 * mount's azimuth can turn by 100° or more), which makes it far above the exact transition; over two
 * buckets the drift is that of the bucket length only.
 *
 * <p>Validity: each bucket pair's bound is {@link Transitions#boundS} over the departures (ends of A) and
 * arrivals (starts of B) the pair allows, so it is never below the exact transition of any plan whose
 * starts fall in those buckets; a plan's starts always fall in exactly one bucket each.
 */
final class TimeBuckets {
  /** Shortest bucket, seconds. */
  static final long MIN_BUCKET_S = 1800;
  /** At most this many buckets over the horizon (the bucket grows for long horizons). */
  static final int MAX_BUCKETS = 32;
  /** Bucketing is used up to this many requests in one model (the arc constraints grow as n² buckets²). */
  static final int MAX_NODES = 400;
  /** Marks an impossible bucket pair. */
  static final long IMPOSSIBLE = -1;

  private final PlanningProblem problem;
  private final long bucketS;

  TimeBuckets(PlanningProblem problem) {
    this.problem = problem;
    this.bucketS = Math.max(MIN_BUCKET_S, (problem.horizonS() + MAX_BUCKETS - 1) / MAX_BUCKETS);
  }

  /** True when a model over {@code nodes} requests should use buckets. */
  static boolean wanted(PlanningProblem problem, int nodes) {
    return problem.transitions().timeDependent() && nodes <= MAX_NODES;
  }

  long bucketS() {
    return bucketS;
  }

  /** Bucket index of a start time. */
  int bucket(long startS) {
    return (int) (startS / bucketS);
  }

  /** First start second of bucket q. */
  long lo(int q) {
    return q * bucketS;
  }

  /** Last start second of bucket q. */
  long hi(int q) {
    return (q + 1) * bucketS - 1;
  }

  /**
   * Whole seconds bounding the transition from request {@code from} (or {@link Transitions#START}) to
   * {@code to} when the start of {@code from} lies in [fromLo, fromHi] (so it ends in that range plus
   * its duration; for START, {@code fromLo = fromHi} is the departure itself) and the start of {@code to}
   * in [toLo, toHi]; {@link #IMPOSSIBLE} when no such pair of times can hold the transition.
   */
  long cost(int from, long fromLo, long fromHi, int to, long toLo, long toHi) {
    long dur = from == Transitions.START ? 0 : problem.tasks().get(from).durationS();
    long depMin = fromLo + dur;
    long depMax = fromHi + dur;
    if (toHi < depMin) {
      return IMPOSSIBLE;
    }
    long arrMin = Math.max(toLo, depMin);
    long depTop = Math.min(depMax, toHi);
    long c = ArcCosts.ceilS(problem.transitions().boundS(from, to, depMin, depTop, arrMin, toHi));
    if (c < 0 || depMin + c > toHi) {
      return IMPOSSIBLE;
    }
    return c;
  }
}
