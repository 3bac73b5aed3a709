package dev.sequencer.model;

/**
 * Repeated visits of one request (format addition A4): up to {@code count} observations, each of the
 * request's duration (or flexible exposure) inside one of its windows, each start at least
 * {@code minSeparationS} and (when given) at most {@code maxSeparationS} after the previous visit's start;
 * {@code onePerWindow}: no two visits in one visibility window; {@code allOrNothing}: all or none.
 */
public record Visits(int count, double minSeparationS, Double maxSeparationS, boolean onePerWindow,
    boolean allOrNothing) {
  public Visits {
    if (count < 1) {
      throw new IllegalArgumentException("visits.count: must be >= 1 (was " + count + ")");
    }
    Checks.finite("visits.minSeparationS", minSeparationS);
    Checks.finiteOrNull("visits.maxSeparationS", maxSeparationS);
    if (minSeparationS < 0 || maxSeparationS != null && maxSeparationS < minSeparationS) {
      throw new IllegalArgumentException("visits: need 0 <= minSeparationS <= maxSeparationS (was " + minSeparationS
          + ", " + maxSeparationS + ")");
    }
  }

  /** One visit, no rules: what a request without {@code visits} means. */
  public static final Visits ONCE = new Visits(1, 0, null, false, false);
}
