package dev.sequencer.cli;

import dev.sequencer.model.SolverSettings;
import dev.sequencer.sequence.ProgressListener;
import dev.sequencer.sequence.SequencerOptions;
import java.util.Locale;
import picocli.CommandLine.Option;

/** Solver options shared by {@code plan} and {@code demo}; each overrides the scenario's setting. */
final class SolverOptionsMixin {
  @Option(names = "--time-limit", paramLabel = "SECONDS", description = "Wall-clock limit of the solver, "
      + "seconds (a trailing 's' is allowed). Default: the scenario's, else 30.")
  String timeLimit;

  @Option(names = "--workers", paramLabel = "N", description = "Solver threads (default: the scenario's, else all cores).")
  Integer workers;

  @Option(names = "--seed", paramLabel = "S", description = "Random seed (default: the scenario's, else 1).")
  Integer seed;

  @Option(names = "--solver", paramLabel = "cpsat|greedy", description = "cpsat (default) or the greedy baseline.")
  String solver = "cpsat";

  @Option(names = "--reproducible", description = "Deterministic work limit instead of wall clock: the same "
      + "file, seed and workers give the same plan. With --time-limit, the limit becomes the work budget in "
      + "CP-SAT's deterministic units (the wall time then varies with the machine).")
  boolean reproducible;

  /** The scenario's settings overridden by the options given, reporting progress to {@code listener}. */
  SequencerOptions options(SolverSettings fromFile, ProgressListener listener) {
    SequencerOptions o = SequencerOptions.from(fromFile);
    if (timeLimit != null) {
      String t = timeLimit.endsWith("s") ? timeLimit.substring(0, timeLimit.length() - 1) : timeLimit;
      try {
        o = o.withTimeLimitS(Double.parseDouble(t));
      } catch (IllegalArgumentException e) {
        throw new InputException("--time-limit: must be a number of seconds > 0 (was " + timeLimit + ")");
      }
    }
    if (workers != null) {
      if (workers < 0) {
        throw new InputException("--workers: must be >= 0 (was " + workers + ")");
      }
      o = o.withWorkers(workers);
    }
    if (seed != null) {
      o = o.withSeed(seed);
    }
    switch (solver.toLowerCase(Locale.ROOT)) {
      case "cpsat" -> o = o.withSolver(SequencerOptions.Solver.CPSAT);
      case "greedy" -> o = o.withSolver(SequencerOptions.Solver.GREEDY);
      default -> throw new InputException("--solver: must be cpsat or greedy (was " + solver + ")");
    }
    if (reproducible) {
      // With --time-limit, the limit becomes the work budget in CP-SAT's deterministic units.
      o = o.withReproducible(timeLimit != null ? o.timeLimitS() : o.deterministicLimit());
    }
    return o.withListener(listener);
  }
}
