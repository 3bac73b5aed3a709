package dev.sequencer.sequence;

/**
 * Integer priorities for CP-SAT: if all priorities are whole numbers they are used as they are;
 * otherwise they are multiplied by the smallest power of ten (10, 100 or 1000) that makes them whole,
 * and if none does, by 1000 and rounded to the nearest integer (resolution 0.001). In the rounded case
 * two plans whose priorities differ by less than about n × 0.0005 may be ranked the wrong way round,
 * and {@link #boundSlack} widens proven bounds accordingly.
 *
 * <p>Flexible requests (extension "flexible exposure time") take part with the value at every grid point
 * of their exposure: the same factor scales them, a value may scale to 0, and {@link #scaled(int)} is
 * their largest scaled grid value.
 */
final class PriorityScale {
  private static final double INTEGRAL_TOLERANCE = 1e-9;
  private final long factor;
  private final long[] scaled;
  /** Per request: scaled value at each grid point (flexible requests), else null. */
  private final long[][] scaledGrid;
  private final boolean rounded;

  PriorityScale(PlanningProblem p) {
    long chosen = -1;
    for (long f = 1; f <= 1000 && chosen < 0; f *= 10) {
      boolean all = true;
      for (int k = 0; k < p.size() && all; k++) {
        Exposure e = p.exposure(k);
        if (e == null) {
          all = whole(p.tasks().get(k).priority() * f);
        } else {
          for (double v : e.values()) {
            all &= whole(v * f);
          }
        }
      }
      if (all) {
        chosen = f;
      }
    }
    this.rounded = chosen < 0;
    this.factor = rounded ? 1000 : chosen;
    this.scaled = new long[p.size()];
    this.scaledGrid = new long[p.size()][];
    for (int k = 0; k < p.size(); k++) {
      Exposure e = p.exposure(k);
      if (e == null) {
        scaled[k] = Math.max(1, Math.round(p.tasks().get(k).priority() * factor));
        continue;
      }
      scaledGrid[k] = new long[e.count()];
      for (int g = 0; g < e.count(); g++) {
        scaledGrid[k][g] = Math.round(e.values()[g] * factor);
        scaled[k] = Math.max(scaled[k], scaledGrid[k][g]);
      }
    }
  }

  private static boolean whole(double v) {
    return Math.abs(v - Math.rint(v)) <= INTEGRAL_TOLERANCE * Math.max(1, Math.abs(v));
  }

  /** Integer priority of request k (for a flexible request: its largest scaled grid value). */
  long scaled(int k) {
    return scaled[k];
  }

  /** Integer value of flexible request k at grid point g. */
  long scaledAt(int k, int g) {
    return scaledGrid[k][g];
  }

  /** Integer value of request k observed for {@code durationS} seconds (its priority when fixed). */
  long scaledFor(PlanningProblem p, int k, long durationS) {
    Exposure e = p.exposure(k);
    return e == null ? scaled[k] : scaledGrid[k][e.index(durationS)];
  }

  /** The scaled grid values of flexible request k (a copy). */
  long[] scaledGrid(int k) {
    return scaledGrid[k].clone();
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
