package dev.sequencer.cli;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.TimelineFile;
import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SolverSettings;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.planner.PlanOutcome;
import dev.sequencer.planner.Planner;
import dev.sequencer.sequence.Note;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.SequencerResult;
import dev.sequencer.visibility.RequestVisibility;
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

  @Option(names = "--csv", paramLabel = "FILE", description = "Also write the plan as CSV, one line per observation.")
  Path csv;

  @Option(names = "--plot", paramLabel = "PREFIX", description = "Also draw PREFIX-timeline.png/.svg and "
      + "PREFIX-sky.png/.svg (with several resources PREFIX-sky-RESOURCE.png/.svg for each).")
  String plot;

  @Option(names = "--report", paramLabel = "FILE", description = "Also write the night report (one HTML file, "
      + "see the report command).")
  Path report;

  @Option(names = "--zone", paramLabel = "ZONE", description = "Time zone of the report's local-time axis (region "
      + "or offset; default: the nautical zone of the site's longitude).")
  String zone;

  @Option(names = "--plot-unscheduled", description = "Give the unscheduled requests rows in the timeline chart too.")
  boolean plotUnscheduled;

  @Mixin SolverOptionsMixin solverOptions;

  @Mixin CommonOptionsMixin common;

  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    PrintWriter out = spec.commandLine().getOut();
    ScenarioReader.Result r = Pipeline.read(scenario, out);
    ReportOutput.zone(zone, r.scenario().observer());
    Outputs.check(Outputs.file("--output", output), Outputs.file("--csv", csv),
        Outputs.plot("--plot", plot, r.scenario()), Outputs.file("--report", report));
    PlanOutcome planned = solve(r.scenario(), common.astro(), solverOptions, r.scenario().solverOrDefaults(), out);
    Pipeline p = new Pipeline(planned.geometry(), common.astro());
    print(out, planned.result(), planned.timeline(), p.visibility());
    if (output != null) {
      TimelineFile.write(planned.timeline(), output);
      out.println("wrote " + output);
    }
    if (csv != null) {
      PlanOutputs.csv(p, planned.timeline(), csv, out);
    }
    if (plot != null) {
      PlanOutputs.plots(p, planned.timeline(), plot, plotUnscheduled, out);
    }
    if (report != null) {
      ReportOutput.write(p, planned.timeline(), Double.isNaN(planned.result().gap()) ? null : planned.result().gap(),
          r.warnings(), List.of(), zone, report, out);
    }
    return NoPlan.report(planned.result(), out);
  }

  /**
   * Plans {@code s} through the {@link Planner} façade with the command-line options over {@code fromFile},
   * showing progress on {@code out}; the time limit covers windows, transitions, planning and the check.
   */
  static PlanOutcome solve(Scenario s, AstroContext ctx, SolverOptionsMixin o, SolverSettings fromFile,
      PrintWriter out) {
    try (Progress progress = Progress.to(out, Progress.consoleAttached())) {
      SequencerOptions options = o.options(fromFile, progress);
      progress.start();
      return Planner.plan(s, ctx, options);
    }
  }

  /**
   * Prints the plan; each unscheduled request's reason names the constraint that removes the most time
   * when {@code visibility} (in request order, or null) says.
   */
  static void print(PrintWriter out, SequencerResult result, Timeline t, List<RequestVisibility> visibility) {
    boolean resources = t.observations().stream().anyMatch(o -> o.resource() != null);
    out.printf(Locale.ROOT, "%-12s %-24s %-24s %8s %8s%s%n", "id", "start", "end", "dur [s]", "slew [s]",
        resources ? "  resource" : "");
    for (Observation o : t.observations()) {
      out.printf(Locale.ROOT, "%-12s %-24s %-24s %8.0f %8.1f%s%n", o.visit() == null ? o.id() : o.id() + " #" + o.visit(),
          o.start(), o.end(), o.durationS(), o.slewSeconds(), resources ? "  " + o.resource() : "");
    }
    for (Unscheduled u : t.unscheduled()) {
      out.printf(Locale.ROOT, "%-12s %s: %s%n", u.id(), u.visitsMissing() == null ? "not scheduled"
          : u.visitsMissing() + " visit(s) not scheduled", Explained.of(u, visibility));
    }
    double busy = t.observations().stream().mapToDouble(o -> o.durationS() + o.slewSeconds()).sum();
    double span = t.observations().isEmpty() ? 0
        : Duration.between(t.observations().get(0).start(), t.observations().get(t.observations().size() - 1).end())
            .toMillis() / 1000.0 + t.observations().get(0).slewSeconds();
    out.printf(Locale.ROOT, "status %s, priority %.2f, bound %s, gap %s, slew total %.0f s (exact), idle total %.0f s, "
        + "%d scheduled, %d not%n", t.status(), t.priority(),
        t.bound() == null ? "-" : String.format(Locale.ROOT, "%.2f", t.bound()),
        Double.isNaN(result.gap()) ? "-" : String.format(Locale.ROOT, "%.1f%%", 100 * result.gap()),
        t.slewSeconds(), Math.max(0, span - busy), t.observations().size(), t.unscheduled().size());
    if (result.hasPlan()) {
      out.printf(Locale.ROOT, "optimality: priority %s; slew total %s%n",
          result.priorityProven() ? "OPTIMAL (the bound is reached)" : "not proven (the bound is above it)",
          t.status() == PlanStatus.OPTIMAL ? "OPTIMAL (CP-SAT proved the whole model)"
              : "not proven minimal");
    }
    for (Note n : result.stats().notes()) {
      if (n.kind() == Note.Kind.OPTIMALITY) {
        out.println("note: " + n.text());
      }
    }
    warnIfBaselineCut(out, result);
  }

  /**
   * A warning (kept by {@code --quiet}) when the time limit cut the greedy baseline itself: the windows and
   * slews took most of the limit, so the plan may hold far less than the same scenario with a longer limit.
   */
  static void warnIfBaselineCut(PrintWriter out, SequencerResult result) {
    List<Note> cut = result.stats().notes().stream().filter(n -> n.kind() == Note.Kind.BASELINE_CUT).toList();
    if (cut.isEmpty()) {
      return;
    }
    cut.forEach(n -> out.println("warning: " + n.text()));
    out.println("warning: the time limit was too short for this scenario's baseline plan; raise --time-limit "
        + "(or use --reproducible, which has no wall-clock limit) for a fuller plan");
  }
}
