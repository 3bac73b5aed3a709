package dev.sequencer.cli;

import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.TimelineFile;
import dev.sequencer.model.Observation;
import dev.sequencer.model.SolverSettings;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.sequence.PlanningProblem;
import dev.sequencer.sequence.Sequencer;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.SequencerResult;
import dev.sequencer.validate.PlanValidator;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code sequencer plan}: computes windows, then chooses, orders and times the observations. */
@Command(
    name = "plan",
    mixinStandardHelpOptions = true,
    description = {"Plan a scenario: visibility, slews, then the subset, order and start times that collect "
        + "the most priority (then the least slew). Every plan is re-checked before it is written.",
        "Exit 0 with a plan; 1 when there is none (INFEASIBLE: the conflicting required requests are listed; "
            + "NO_SOLUTION_IN_TIME); 2 on invalid input; 3 on an internal error or a missing native solver."},
    footer = {"", Caution.TEXT})
final class PlanCommand implements Callable<Integer> {
  @Parameters(index = "0", paramLabel = "SCENARIO.json", description = "The scenario file.")
  Path scenario;

  @Option(names = {"-o", "--output"}, paramLabel = "FILE", description = "Write the timeline file here.")
  Path output;

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

  @Mixin CommonOptionsMixin common;

  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    ScenarioReader.Result r = ScenarioReader.read(scenario);
    PrintWriter out = spec.commandLine().getOut();
    r.warnings().forEach(w -> out.println("warning: " + w));
    PlanInputs.check(r.scenario(), scenario.toString());
    Outputs.checkFolder("--output", output);
    Pipeline p = Pipeline.of(r.scenario(), common.astro());
    SequencerOptions options = options(r.scenario().solverOrDefaults(), out);
    PlanningProblem problem = PlanningProblem.of(r.scenario(), p.windows(), p.transitions());
    SequencerResult result = new Sequencer().plan(problem, options);
    Timeline timeline = result.toTimeline();
    // A result without a plan (INFEASIBLE, NO_SOLUTION_IN_TIME) has nothing to re-check: its required
    // requests are missing by definition.
    List<String> violations = !result.hasPlan() ? List.of()
        : PlanValidator.of(r.scenario(), p.windows(), p.transitions()).violations(timeline);
    if (!violations.isEmpty()) {
      throw new IllegalStateException("the plan failed its re-check (a bug): " + violations);
    }
    print(out, result, timeline);
    if (output != null) {
      TimelineFile.write(timeline, output);
      out.println("wrote " + output);
    }
    return NoPlan.report(result, out);
  }

  private SequencerOptions options(SolverSettings fromFile, PrintWriter out) {
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
      o = o.withReproducible(timeLimit != null ? o.timeLimitS() : o.deterministicLimit());
    }
    return o.withListener((solutions, priority, transitionS, bound, elapsedS) -> out.printf(Locale.ROOT,
        "  %6.1f s  solution %d: priority %.1f, slew %.0f s, bound %s%n", elapsedS, solutions, priority,
        transitionS, Double.isNaN(bound) ? "-" : String.format(Locale.ROOT, "%.1f", bound)));
  }

  static void print(PrintWriter out, SequencerResult result, Timeline t) {
    out.printf(Locale.ROOT, "%-12s %-24s %-24s %8s %8s%n", "id", "start", "end", "dur [s]", "slew [s]");
    for (Observation o : t.observations()) {
      out.printf(Locale.ROOT, "%-12s %-24s %-24s %8.0f %8.1f%n", o.id(), o.start(), o.end(), o.durationS(),
          o.slewSeconds());
    }
    for (Unscheduled u : t.unscheduled()) {
      out.printf(Locale.ROOT, "%-12s not scheduled: %s%n", u.id(), u.reason());
    }
    double busy = t.observations().stream().mapToDouble(o -> o.durationS() + o.slewSeconds()).sum();
    double span = t.observations().isEmpty() ? 0
        : Duration.between(t.observations().get(0).start(), t.observations().get(t.observations().size() - 1).end())
            .toMillis() / 1000.0 + t.observations().get(0).slewSeconds();
    out.printf(Locale.ROOT, "status %s, priority %.2f, bound %s, gap %.1f%%, slew total %.0f s, idle total %.0f s, "
        + "%d scheduled, %d not%n", t.status(), t.priority(),
        t.bound() == null ? "-" : String.format(Locale.ROOT, "%.2f", t.bound()), 100 * result.gap(),
        t.slewSeconds(), Math.max(0, span - busy), t.observations().size(), t.unscheduled().size());
  }
}
