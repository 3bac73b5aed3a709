package dev.sequencer.sequence.problem;

import dev.sequencer.slew.Transitions;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The integer objective the planner maximises: for each task and exposure option its prize, and for some
 * successor pairs an arc bonus. One owner for "how much a plan collects", so every search, the CP-SAT
 * model and the incumbent rank plans the same way.
 *
 * <p>Priorities become integers for CP-SAT: if all values are whole numbers they are used as they are;
 * otherwise they are multiplied by the smallest power of ten (10, 100 or 1000) that makes them whole, and
 * if none does, by 1000 and rounded to the nearest integer (resolution 0.001, a fixed request at least 1).
 * In the rounded case two plans whose priorities differ by less than about n × 0.0005 may be ranked the
 * wrong way round, and {@link #priorityBound} widens proven bounds accordingly.
 *
 * <p>Re-planning ranks plans by priority, then stability: it gives each prize a multiplier M and a bonus
 * per kept request (and per kept successor pair, {@link #arcBonus}), prize = M·scaled value + bonus, with
 * M larger than any total bonus so that priority still comes first. Without bonuses M = 1.
 */
public final class Prizes {
  private static final double INTEGRAL_TOLERANCE = 1e-9;
  private final long factor;
  private final boolean rounded;
  private final long multiplier;
  /** Per task, per option: scaled value (before multiplier and bonus). */
  private final long[][] scaled;
  private final long[] taskBonus;
  /** Arc bonus by key (from + 1)·(n + 1) + to, {@code from} = START included. */
  private final Map<Long, Long> arcBonus;

  private Prizes(long factor, boolean rounded, long multiplier, long[][] scaled, long[] taskBonus,
      Map<Long, Long> arcBonus) {
    this.factor = factor;
    this.rounded = rounded;
    this.multiplier = multiplier;
    this.scaled = scaled;
    this.taskBonus = taskBonus;
    this.arcBonus = Map.copyOf(arcBonus);
  }

  /** The plain objective of these tasks: scaled values, no bonus. */
  public static Prizes of(List<Task> tasks) {
    return of(tasks, new boolean[tasks.size()]);
  }

  /**
   * The plain objective of these tasks, with the tasks marked in {@code none} collecting nothing (the section
   * markers of several resources, {@link Sections}); the scale is chosen from the other tasks.
   */
  public static Prizes of(List<Task> tasks, boolean[] none) {
    long chosen = -1;
    for (long f = 1; f <= 1000 && chosen < 0; f *= 10) {
      boolean all = true;
      for (int k = 0; k < tasks.size() && all; k++) {
        Task t = tasks.get(k);
        if (none[k]) {
          continue;
        }
        for (int g = 0; g < t.optionCount() && all; g++) {
          all = whole(t.value(g) * f);
        }
      }
      if (all) {
        chosen = f;
      }
    }
    boolean rounded = chosen < 0;
    long factor = rounded ? 1000 : chosen;
    long[][] scaled = new long[tasks.size()][];
    for (int k = 0; k < tasks.size(); k++) {
      Task t = tasks.get(k);
      scaled[k] = new long[t.optionCount()];
      for (int g = 0; g < t.optionCount(); g++) {
        long v = Math.round(t.value(g) * factor);
        scaled[k][g] = none[k] ? 0 : t.flexible() ? v : Math.max(1, v);
      }
    }
    return new Prizes(factor, rounded, 1, scaled, new long[tasks.size()], Map.of());
  }

  private static boolean whole(double v) {
    return Math.abs(v - Math.rint(v)) <= INTEGRAL_TOLERANCE * Math.max(1, Math.abs(v));
  }

  /**
   * A copy with stability bonuses: every prize multiplied by {@code newMultiplier} (>= 1) plus
   * {@code bonus[k]} (>= 0) for task k, and {@code arcBonuses} (from, to, bonus) on successor pairs,
   * {@code from} = {@link Transitions#START} for the first observation.
   */
  public Prizes withBonuses(long newMultiplier, long[] bonus, List<long[]> arcBonuses) {
    if (newMultiplier < 1 || bonus.length != scaled.length) {
      throw new IllegalArgumentException("bonuses: multiplier " + newMultiplier + " (must be >= 1), " + bonus.length
          + " task bonuses for " + scaled.length + " tasks");
    }
    Map<Long, Long> arcs = new HashMap<>();
    for (long[] a : arcBonuses) {
      if (a[2] < 0) {
        throw new IllegalArgumentException("arc bonus must be >= 0, got " + a[2]);
      }
      arcs.merge(key((int) a[0], (int) a[1]), a[2], Long::sum);
    }
    for (long b : bonus) {
      if (b < 0) {
        throw new IllegalArgumentException("task bonus must be >= 0, got " + b);
      }
    }
    return new Prizes(factor, rounded, newMultiplier, scaled, bonus.clone(), arcs);
  }

  private long key(int from, int to) {
    return (from + 1L) * (scaled.length + 1L) + to;
  }

  /** Number of tasks. */
  public int size() {
    return scaled.length;
  }

  /** Prize of task k observed with exposure option g. */
  public long prize(int k, int g) {
    return multiplier * scaled[k][g] + taskBonus[k];
  }

  /** The largest prize of task k over its options. */
  public long maxPrize(int k) {
    long m = Long.MIN_VALUE;
    for (int g = 0; g < scaled[k].length; g++) {
      m = Math.max(m, prize(k, g));
    }
    return m;
  }

  /** The prizes of every option of task k (a new array). */
  public long[] prizes(int k) {
    long[] out = new long[scaled[k].length];
    for (int g = 0; g < out.length; g++) {
      out[g] = prize(k, g);
    }
    return out;
  }

  /** Bonus for observing {@code to} directly after {@code from} ({@link Transitions#START} included); 0 mostly. */
  public long arcBonus(int from, int to) {
    return arcBonus.isEmpty() ? 0 : arcBonus.getOrDefault(key(from, to), 0L);
  }

  /** True when some successor pair carries a bonus. */
  public boolean hasArcBonus() {
    return !arcBonus.isEmpty();
  }

  /** The multiplier (1, 10, 100 or 1000) from priorities to scaled values. */
  public long factor() {
    return factor;
  }

  /** The multiplier of scaled values inside prizes (1 without stability bonuses). */
  public long multiplier() {
    return multiplier;
  }

  /** True when prizes are plain scaled priorities (no bonus): prize totals then convert to priority exactly. */
  public boolean plain() {
    return multiplier == 1 && arcBonus.isEmpty() && java.util.Arrays.stream(taskBonus).allMatch(b -> b == 0);
  }

  /**
   * A proven bound on total priority from a proven bound on total prize over plans of at most
   * {@code count} observations: bonuses are >= 0, so Σ scaled ≤ floor(prizeBound / M), and rounding
   * (when values are not multiples of 0.001) adds at most 0.0005 per observation.
   */
  public double priorityBound(long prizeBound, int count) {
    return Math.floorDiv(prizeBound, multiplier) / (double) factor + (rounded ? count * 0.5 / factor : 0.0);
  }

  /** Total priority (user units) of {@code scaledTotal} scaled value units. */
  public double priorityOf(long scaledTotal) {
    return scaledTotal / (double) factor;
  }

  /** Scaled value of task k, option g (no multiplier, no bonus). */
  public long scaled(int k, int g) {
    return scaled[k][g];
  }
}
