package dev.sequencer.model;

/**
 * Solver settings: wall-clock limit in seconds, worker threads (0 = all cores) and random seed.
 * Immutable; change by copy: {@code SolverSettings.defaults().withTimeLimitS(30).withSeed(1)}.
 */
public record SolverSettings(double timeLimitS, int workers, int seed) {
  /** Default time limit when the file gives none. */
  public static final double DEFAULT_TIME_LIMIT_S = 30.0;

  public SolverSettings {
    Checks.finite("timeLimitS", timeLimitS);
  }

  /** 30 s, all cores, seed 1. */
  public static SolverSettings defaults() {
    return new SolverSettings(DEFAULT_TIME_LIMIT_S, 0, 1);
  }

  public SolverSettings withTimeLimitS(double v) {
    return new SolverSettings(v, workers, seed);
  }

  public SolverSettings withWorkers(int v) {
    return new SolverSettings(timeLimitS, v, seed);
  }

  public SolverSettings withSeed(int v) {
    return new SolverSettings(timeLimitS, workers, v);
  }

  /** Worker count to use: {@code workers}, or the number of available processors when 0. */
  public int effectiveWorkers() {
    return workers > 0 ? workers : Runtime.getRuntime().availableProcessors();
  }
}
