package dev.sequencer.sequence;

import dev.sequencer.model.SolverSettings;
import java.util.Objects;

/**
 * How {@link Sequencer} plans. Immutable; change by copy: {@code SequencerOptions.defaults().withTimeLimitS(10)}.
 *
 * <p>{@code timeLimitS}: wall-clock budget. {@code workers}: CP-SAT threads, 0 = all cores. {@code seed}:
 * CP-SAT random seed. {@code reproducible}: replace the wall clock by CP-SAT's deterministic time
 * ({@code deterministicLimit}, in CP-SAT's work units, roughly seconds on a fast core) and interleave
 * the workers, so the same input, seed and workers give the same plan; wall-clock runs may differ from
 * run to run because the threads race. {@code kBest}: successor arcs kept per request on large models
 * (0 = automatic, -1 = keep all). {@code lns}: run our large-neighbourhood search after the first
 * solve on large models. {@code hint}: warm start CP-SAT from the greedy plan. {@code relaxationBound}:
 * compute the time-bucket LP bound. {@code listener}: progress reports, may be {@code null}.
 * {@code clock}: the wall clock {@code timeLimitS} counts from ({@code null}: from the call to the
 * sequencer; the {@code Planner} façade passes the one it started before the visibility windows).
 * {@code validator}: the one check the returned plan must pass ({@code null}: a
 * {@link SelfCheck} of the problem's own requests, windows and transitions).
 */
public record SequencerOptions(
    Solver solver,
    double timeLimitS,
    int workers,
    int seed,
    boolean reproducible,
    double deterministicLimit,
    int kBest,
    boolean lns,
    boolean hint,
    boolean relaxationBound,
    ProgressListener listener,
    Budget clock,
    ResultCheck validator) {
  /** Which planner to run. */
  public enum Solver {
    /** The CP-SAT model (with greedy warm start, LNS and bounds). */
    CPSAT,
    /** Only the greedy baseline (best value per second used). */
    GREEDY,
    /** Only the best-now greedy: the highest value among what can start soonest ({@code GreedyPlanner.Rule.BEST_NOW}). */
    BEST_NOW,
    /**
     * The two-stage baseline for flexible exposures ({@link TwoStagePlanner}): fixed-duration CP-SAT at
     * preset exposures, then a continuous re-allocation of the chosen set's time; for comparisons.
     */
    TWO_STAGE
  }

  public SequencerOptions {
    Objects.requireNonNull(solver, "solver");
    if (!(timeLimitS > 0) || !Double.isFinite(timeLimitS)) {
      throw new IllegalArgumentException("timeLimitS: must be a finite number > 0, got " + timeLimitS);
    }
    if (workers < 0) {
      throw new IllegalArgumentException("workers: must be >= 0, got " + workers);
    }
    if (!(deterministicLimit > 0)) {
      throw new IllegalArgumentException("deterministicLimit: must be > 0, got " + deterministicLimit);
    }
  }

  /** CP-SAT, 30 s, all cores, seed 1, wall clock, automatic arcs, LNS, hint and relaxation bound on. */
  public static SequencerOptions defaults() {
    return new SequencerOptions(Solver.CPSAT, 30, 0, 1, false, 30, 0, true, true, true, null, null, null);
  }

  /** The scenario's solver settings (time limit, workers, seed) on top of the defaults. */
  public static SequencerOptions from(SolverSettings s) {
    return defaults().withTimeLimitS(s.timeLimitS()).withWorkers(s.workers()).withSeed(s.seed());
  }

  public SequencerOptions withSolver(Solver v) {
    return new SequencerOptions(v, timeLimitS, workers, seed, reproducible, deterministicLimit, kBest, lns, hint,
        relaxationBound, listener, clock, validator);
  }

  public SequencerOptions withTimeLimitS(double v) {
    return new SequencerOptions(solver, v, workers, seed, reproducible, deterministicLimit, kBest, lns, hint,
        relaxationBound, listener, clock, validator);
  }

  public SequencerOptions withWorkers(int v) {
    return new SequencerOptions(solver, timeLimitS, v, seed, reproducible, deterministicLimit, kBest, lns, hint,
        relaxationBound, listener, clock, validator);
  }

  public SequencerOptions withSeed(int v) {
    return new SequencerOptions(solver, timeLimitS, workers, v, reproducible, deterministicLimit, kBest, lns, hint,
        relaxationBound, listener, clock, validator);
  }

  /** Reproducible mode with this deterministic work limit (CP-SAT deterministic time units). */
  public SequencerOptions withReproducible(double deterministicLimitUnits) {
    return new SequencerOptions(solver, timeLimitS, workers, seed, true, deterministicLimitUnits, kBest, lns, hint,
        relaxationBound, listener, clock, validator);
  }

  public SequencerOptions withKBest(int v) {
    return new SequencerOptions(solver, timeLimitS, workers, seed, reproducible, deterministicLimit, v, lns, hint,
        relaxationBound, listener, clock, validator);
  }

  public SequencerOptions withLns(boolean v) {
    return new SequencerOptions(solver, timeLimitS, workers, seed, reproducible, deterministicLimit, kBest, v, hint,
        relaxationBound, listener, clock, validator);
  }

  public SequencerOptions withHint(boolean v) {
    return new SequencerOptions(solver, timeLimitS, workers, seed, reproducible, deterministicLimit, kBest, lns, v,
        relaxationBound, listener, clock, validator);
  }

  public SequencerOptions withRelaxationBound(boolean v) {
    return new SequencerOptions(solver, timeLimitS, workers, seed, reproducible, deterministicLimit, kBest, lns, hint,
        v, listener, clock, validator);
  }

  public SequencerOptions withListener(ProgressListener v) {
    return new SequencerOptions(solver, timeLimitS, workers, seed, reproducible, deterministicLimit, kBest, lns, hint,
        relaxationBound, v, clock, validator);
  }

  /** The same options counting {@code timeLimitS} from {@code v}. */
  public SequencerOptions withClock(Budget v) {
    return new SequencerOptions(solver, timeLimitS, workers, seed, reproducible, deterministicLimit, kBest, lns, hint,
        relaxationBound, listener, v, validator);
  }

  /** The same options with the one check the returned plan must pass. */
  public SequencerOptions withValidator(ResultCheck v) {
    return new SequencerOptions(solver, timeLimitS, workers, seed, reproducible, deterministicLimit, kBest, lns, hint,
        relaxationBound, listener, clock, v);
  }

  /** The budget of a run that starts now: {@link #clock} when set (with this time limit), else a new one. */
  public Budget budget() {
    return clock == null ? Budget.startingNow(timeLimitS) : clock.withTotalS(timeLimitS);
  }

  /** Worker count to use: {@code workers}, or the number of available processors when 0. */
  public int effectiveWorkers() {
    return workers > 0 ? workers : Runtime.getRuntime().availableProcessors();
  }
}
