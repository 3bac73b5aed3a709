package dev.sequencer.cli;

import dev.sequencer.io.ScenarioException;
import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.TimelineFile;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.planner.Planner;
import dev.sequencer.planner.ReplanOutcome;
import dev.sequencer.sequence.replan.ReplanOptions;
import dev.sequencer.sequence.replan.ReplanResult;
import dev.sequencer.sequence.replan.Replanner;
import dev.sequencer.visibility.RequestVisibility;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code sequencer replan}: keeps what is done and running, plans the rest of the night from now. */
@Command(
    name = "replan",
    mixinStandardHelpOptions = true,
    description = {"Re-plan the rest of a night: done and running observations of the previous timeline are kept "
        + "and marked, nothing new starts before --now nor before the running observation ends plus the slew "
        + "from it, failed requests are retried while visible (unless --drop-failed), requests new in the "
        + "scenario are considered. Among plans of equal priority the one closest to the previous plan wins.",
        "An observation of the previous timeline that ended by --now counts as done unless listed in --failed; "
            + "one that started before --now is running.",
        "With several resources each one departs from its own running (or last done) observation; "
            + "--unavailable takes resources out of service from --now on.",
        "Exit 0 with a plan; 1 when there is none; 2 on invalid input; 3 on an internal error."},
    footer = {"", Caution.TEXT})
final class ReplanCommand implements Callable<Integer> {
  @Parameters(index = "0", paramLabel = "SCENARIO.json", description = "The scenario file (new requests allowed).")
  Path scenario;

  @Option(names = "--previous", required = true, paramLabel = "TIMELINE.json", description = "The timeline being executed.")
  Path previous;

  @Option(names = "--now", required = true, paramLabel = "INSTANT", description = "The re-planning instant, ISO-8601 "
      + "UTC (2031-05-04T23:10:00Z).")
  String now;

  @Option(names = "--done", split = ",", paramLabel = "ID", description = "Observations that completed (for a "
      + "request with visits: its last visit started before --now).")
  List<String> done = List.of();

  @Option(names = "--failed", split = ",", paramLabel = "ID", description = "Observations that failed or were "
      + "aborted (for a request with visits: its last visit started before --now).")
  List<String> failed = List.of();

  @Option(names = "--unavailable", split = ",", paramLabel = "RESOURCE", description = "Resources out of service "
      + "from --now to the end of the horizon: nothing new is planned on them, and an observation running on one "
      + "counts as failed unless listed in --done.")
  List<String> unavailable = List.of();

  @Option(names = "--drop-failed", description = "Do not retry failed requests (required ones are always retried).")
  boolean dropFailed;

  @Option(names = "--stability", paramLabel = "WEIGHT", description = "Priority units per unit of stability "
      + "(kept previous requests + kept previous successor pairs); 0 = off. Default: priority first, then "
      + "stability, then slew.")
  String stability;

  @Option(names = {"-o", "--output"}, paramLabel = "FILE", description = "Write the new timeline file here.")
  Path output;

  @Mixin SolverOptionsMixin solverOptions;

  @Mixin CommonOptionsMixin common;

  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    PrintWriter out = spec.commandLine().getOut();
    ScenarioReader.Result r = Pipeline.read(scenario, out);
    Timeline prev = TimelineFile.read(previous);
    Instant at = instant();
    ReplanOptions options = ReplanOptions.defaults().withDropFailed(dropFailed).withUnavailable(ids(unavailable));
    if (stability != null) {
      options = options.withStabilityWeight(weight());
    }
    Outputs.check(Outputs.file("--output", output));
    ReplanOutcome outcome;
    try (Progress progress = Progress.to(out, Progress.consoleAttached())) {
      options = options.withSequencer(solverOptions.options(r.scenario().solverOrDefaults(), progress));
      progress.start();
      outcome = Planner.replan(r.scenario(), common.astro(), prev, at, ids(done), ids(failed), options);
    } catch (ScenarioException e) {
      if (!Replanner.INPUT.equals(e.source())) {
        throw e;
      }
      throw new InputException("--" + e.problems().get(0));
    }
    ReplanResult result = outcome.result();
    print(out, result, outcome.geometry().visibility());
    if (output != null) {
      TimelineFile.write(result.timeline(), output);
      out.println("wrote " + output);
    }
    if (!result.hasPlan()) {
      out.println("no plan (" + result.status() + "): " + result.message());
      return NoPlan.EXIT_NO_PLAN;
    }
    return 0;
  }

  private Instant instant() {
    try {
      return Instant.parse(now);
    } catch (DateTimeParseException e) {
      throw new InputException("--now: must be an ISO-8601 UTC instant such as 2031-05-04T23:10:00Z (was " + now + ")");
    }
  }

  private double weight() {
    try {
      double w = Double.parseDouble(stability);
      if (w >= 0 && w < Double.POSITIVE_INFINITY) {
        return w;
      }
    } catch (NumberFormatException e) {
      // reported below
    }
    throw new InputException("--stability: must be a number >= 0 (was " + stability + ")");
  }

  private static Set<String> ids(List<String> list) {
    Set<String> out = new LinkedHashSet<>();
    for (String s : list) {
      if (!s.isBlank()) {
        out.add(s.trim());
      }
    }
    return out;
  }

  private static void print(PrintWriter out, ReplanResult r, List<RequestVisibility> visibility) {
    Timeline t = r.timeline();
    boolean resources = t.observations().stream().anyMatch(o -> o.resource() != null);
    out.printf(Locale.ROOT, "%-12s %-8s %-24s %-24s %8s %8s%s%n", "id", "state", "start", "end", "dur [s]", "slew [s]",
        resources ? "  resource" : "");
    for (Observation o : t.observations()) {
      out.printf(Locale.ROOT, "%-12s %-8s %-24s %-24s %8.0f %8.1f%s%n", o.id(), o.state(), o.start(), o.end(),
          o.durationS(), o.slewSeconds(), resources ? "  " + o.resource() : "");
    }
    for (Unscheduled u : t.unscheduled()) {
      out.printf(Locale.ROOT, "%-12s not scheduled: %s%n", u.id(), Explained.of(u, visibility));
    }
    out.printf(Locale.ROOT, "status %s, night priority %.2f, new plan %.2f (rest of the previous plan %.2f), "
        + "from %s, kept %d of %d previous requests and %d successor pairs, plan from %s%n", t.status(),
        t.priority(), r.newPriority(), r.tailPriority(), r.source() == ReplanResult.Source.PREVIOUS_TAIL
            ? "the previous plan" : "the sequencer", r.keptRequests(), r.tailRequests(), r.keptArcs(),
        r.departure());
    if (!r.notes().isEmpty()) {
      out.println("notes: " + r.notes());
    }
  }
}
