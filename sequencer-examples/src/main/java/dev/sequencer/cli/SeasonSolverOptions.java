package dev.sequencer.cli;

import dev.sequencer.model.SolverSettings;
import dev.sequencer.sequence.SequencerOptions;
import java.nio.file.Path;
import java.util.Locale;
import picocli.CommandLine.Option;

/**
 * Solver options of {@code campaign} (every plan and re-plan of every night); reproducible by default so
 * that the same campaign file gives the same CSV on any machine.
 */
final class SeasonSolverOptions {
  @Option(names = "--time-limit", paramLabel = "SECONDS", description = "Limit of each plan and re-plan, seconds "
      + "(a trailing 's' is allowed; in the default reproducible mode CP-SAT's deterministic work units). Default 1.")
  String timeLimit = "1";

  @Option(names = "--workers", paramLabel = "N", description = "Solver threads of each plan (default 1).")
  int workers = 1;

  @Option(names = "--seed", paramLabel = "S", description = "Solver seed (default: the scenario's, else 1).")
  Integer seed;

  @Option(names = "--wall-clock", description = "Limit plans by the wall clock instead of deterministic work "
      + "(results then depend on the machine's load).")
  boolean wallClock;

  SequencerOptions options(SolverSettings fromFile) {
    String t = timeLimit.endsWith("s") ? timeLimit.substring(0, timeLimit.length() - 1) : timeLimit;
    double limit;
    try {
      limit = Double.parseDouble(t);
    } catch (NumberFormatException e) {
      limit = Double.NaN;
    }
    if (!(limit > 0) || !Double.isFinite(limit)) {
      throw new InputException("--time-limit: must be a number of seconds > 0 (was " + timeLimit + ")");
    }
    if (workers < 1) {
      throw new InputException("--workers: must be >= 1 (was " + workers + ")");
    }
    SequencerOptions o = SequencerOptions.from(fromFile).withTimeLimitS(limit).withWorkers(workers);
    if (seed != null) {
      o = o.withSeed(seed);
    }
    return wallClock ? o : o.withReproducible(limit);
  }

  static void checkChartName(String option, Path file) {
    String n = file.toString().toLowerCase(Locale.ROOT);
    if (!n.endsWith(".png") && !n.endsWith(".svg")) {
      throw new InputException(option + ": must end in .png or .svg (was " + file + ")");
    }
  }
}
