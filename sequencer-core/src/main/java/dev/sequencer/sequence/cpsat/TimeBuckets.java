package dev.sequencer.sequence.cpsat;

import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.slew.Transitions;

/**
 * Time buckets for time-dependent transitions: each request's start domain is cut into buckets, and
 * an arc's transition is bounded separately for each pair (bucket of the start of A, bucket of the start
 * of B). A bound over the whole start ranges of A and B lets both pointings drift over hours (an alt-az
 * mount's azimuth can turn by 100° or more), which makes it far above the exact transition; over two
 * buckets the drift is that of the bucket length only.
 *
 * <p>Buckets are per request (see {@link #partition}): short ones for short start ranges (an orbiting
 * object's pass), at most half an hour for long ones (a star's night).
 *
 * <p>Validity: each bucket pair's bound is {@link Transitions#boundS} over the departures (ends of A) and
 * arrivals (starts of B) the pair allows, so it is never below the exact transition of any plan whose
 * starts fall in those buckets; a plan's starts always fall in exactly one bucket each.
 */
public final class TimeBuckets {
  /** Shortest bucket, seconds. */
  static final long MIN_BUCKET_S = 60;
  /** Longest bucket, seconds (half an hour: sidereal drift of about 7.5°). */
  static final long MAX_BUCKET_S = 1800;
  /** At most this many buckets per request (the arc constraints grow as buckets²). */
  static final int MAX_BUCKETS = 12;
  /**
   * Budget of bucket-pair bounds per model, n² · buckets² (an alt-az bound costs a few microseconds, so
   * this keeps the build to about a second): larger models get fewer buckets per request.
   */
  static final double PAIR_BUDGET = 400_000;
  /**
   * Bucket-pair bounds per second of solve time when that is short: about 0.2 s of bound evaluations per
   * second, so a model built for a short solve leaves most of it to CP-SAT.
   */
  public static final double PAIRS_PER_SOLVE_S = 40_000;
  /** Bucketing is used up to this many requests in one model. */
  static final int MAX_NODES = 400;
  /** Marks an impossible bucket pair. */
  static final long IMPOSSIBLE = -1;

  private final PlanningProblem problem;

  TimeBuckets(PlanningProblem problem) {
    this.problem = problem;
  }

  /** True when a model over {@code nodes} requests should use buckets. */
  static boolean wanted(PlanningProblem problem, int nodes) {
    return problem.transitions().timeDependent() && nodes <= MAX_NODES;
  }

  /** Buckets per request for a model of {@code nodes} requests: within {@code pairBudget} pairs, 1 to 12. */
  static int bucketsFor(int nodes, double pairBudget) {
    return (int) Math.max(1, Math.min(MAX_BUCKETS, Math.floor(Math.sqrt(pairBudget) / Math.max(1, nodes))));
  }

  /**
   * Cuts a start domain (ordered, disjoint [from, to] parts) into buckets: equal lengths between
   * {@link #MIN_BUCKET_S} and {@link #MAX_BUCKET_S}, at most {@code maxBuckets} over the domain's hull
   * (longer buckets when the hull needs it); each bucket is reported as the [lowest, highest] start of the
   * domain inside it, empty buckets left out. Every start of the domain lies in exactly one bucket.
   */
  static java.util.List<long[]> partition(long[][] domain, int maxBuckets) {
    long lo = domain[0][0];
    long hi = domain[domain.length - 1][1];
    long span = hi - lo + 1;
    long size = Math.max(MIN_BUCKET_S, Math.min(MAX_BUCKET_S, (span + maxBuckets - 1) / maxBuckets));
    size = Math.max(size, (span + maxBuckets - 1) / maxBuckets);
    java.util.List<long[]> out = new java.util.ArrayList<>();
    for (long b0 = lo; b0 <= hi; b0 += size) {
      long b1 = b0 + size - 1;
      long min = Long.MAX_VALUE;
      long max = Long.MIN_VALUE;
      for (long[] part : domain) {
        long a = Math.max(part[0], b0);
        long b = Math.min(part[1], b1);
        if (a <= b) {
          min = Math.min(min, a);
          max = Math.max(max, b);
        }
      }
      if (min <= max) {
        out.add(new long[] {min, max});
      }
    }
    return out;
  }
  /**
   * Whole seconds bounding the transition from request {@code from} (or {@link Transitions#START}) to
   * {@code to} when the start of {@code from} lies in [fromLo, fromHi] (so it ends in that range plus
   * its duration — for a flexible request, plus its shortest to its longest exposure; for START,
   * {@code fromLo = fromHi} is the departure itself) and the start of {@code to} in [toLo, toHi];
   * {@link #IMPOSSIBLE} when no such pair of times can hold the transition.
   */
  long cost(int from, long fromLo, long fromHi, int to, long toLo, long toHi) {
    long depMin = fromLo + (from == Transitions.START ? 0 : problem.task(from).durationS());
    long depMax = fromHi + (from == Transitions.START ? 0 : problem.task(from).maxDurationS());
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
