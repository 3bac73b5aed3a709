package dev.sequencer.campaign;

import java.util.Locale;

/**
 * One run of a sweep. Inputs: {@code run} (0-based index in the grid), {@code solver}, {@code timeLimitS},
 * {@code workers}, {@code seed}, {@code weatherSeed} (campaigns), {@code slew} (the slew axis's index and
 * model, or "scenario"). Results: {@code status} (the plan's, or "SEASON" for a campaign), {@code priority}
 * (the plan's total, or the value a campaign collected), {@code bound} (the proven bound, NaN when none),
 * {@code remaining} (a campaign's remaining value, NaN for a scenario), {@code slewS}, {@code observations}
 * and {@code wallS} (the only column that depends on the machine). Serializable: engines (Spark) ship rows back.
 */
public record SweepRow(int run, String solver, double timeLimitS, int workers, int seed, Long weatherSeed, String slew,
    String status, double priority, double bound, double remaining, double slewS, int observations, double wallS)
    implements java.io.Serializable {
  /** The CSV header of {@link #csv}. */
  public static final String HEADER = "run,solver,timeLimitS,workers,seed,weatherSeed,slew,status,priority,bound,"
      + "remaining,slewS,observations,wallS";

  /** The row without its wall time: the same on every machine in reproducible mode. */
  public String resultCsv() {
    return String.format(Locale.ROOT, "%d,%s,%s,%d,%d,%s,%s,%s,%s,%s,%s,%.3f,%d", run, solver, num(timeLimitS),
        workers, seed, weatherSeed == null ? "" : weatherSeed.toString(), slew, status, num(priority), num(bound),
        num(remaining), slewS, observations);
  }

  /** The full row, wall time last. */
  public String csv() {
    return resultCsv() + String.format(Locale.ROOT, ",%.3f", wallS);
  }

  /** The value of one of the grid's axes, as written in the CSV ("solver", "timeLimitS", ...). */
  public String axisValue(String axis) {
    return switch (axis) {
      case "solver" -> solver;
      case "timeLimitS" -> num(timeLimitS);
      case "workers" -> Integer.toString(workers);
      case "seed" -> Integer.toString(seed);
      case "weatherSeed" -> weatherSeed == null ? "" : weatherSeed.toString();
      case "slew" -> slew;
      default -> throw new IllegalArgumentException("unknown axis " + axis);
    };
  }

  static String num(double v) {
    if (Double.isNaN(v)) {
      return "";
    }
    return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : String.format(Locale.ROOT, "%.6f", v);
  }
}
