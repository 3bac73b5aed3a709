package dev.sequencer.sequence;

/**
 * Integer priorities for CP-SAT: if all priorities are whole numbers they are used as they are;
 * otherwise they are multiplied by the smallest power of ten (10, 100 or 1000) that makes them whole,
 * and if none does, by 1000 and rounded to the nearest integer (resolution 0.001). In the rounded case
 * two plans whose priorities differ by less than about n × 0.0005 may be ranked the wrong way round,
 * and {@link #boundSlack} widens proven bounds accordingly.
 */
final class PriorityScale {
  private static final double INTEGRAL_TOLERANCE = 1e-9;
  private final long factor;
  private final long[] scaled;
  private final boolean rounded;

  PriorityScale(PlanningProblem p) {
    long chosen = -1;
    for (long f = 1; f <= 1000 && chosen < 0; f *= 10) {
      boolean all = true;
      for (PlanningProblem.Task t : p.tasks()) {
        double v = t.priority() * f;
        if (Math.abs(v - Math.rint(v)) > INTEGRAL_TOLERANCE * Math.max(1, Math.abs(v))) {
          all = false;
          break;
        }
      }
      if (all) {
        chosen = f;
      }
    }
    this.rounded = chosen < 0;
    this.factor = rounded ? 1000 : chosen;
    this.scaled = new long[p.size()];
    for (int k = 0; k < p.size(); k++) {
      scaled[k] = Math.max(1, Math.round(p.tasks().get(k).priority() * factor));
    }
  }

  /** Integer priority of request k. */
  long scaled(int k) {
    return scaled[k];
  }

  /** The multiplier (1, 10, 100 or 1000). */
  long factor() {
    return factor;
  }

  /** Extra priority to add to a bound derived from scaled values of {@code count} requests (0 unless rounded). */
  double boundSlack(int count) {
    return rounded ? count * 0.5 / factor : 0.0;
  }
}
