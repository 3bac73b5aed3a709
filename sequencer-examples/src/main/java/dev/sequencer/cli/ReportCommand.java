package dev.sequencer.cli;

import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.TimelineFile;
import dev.sequencer.model.Timeline;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code sequencer report}: one self-contained HTML page about a plan, for a person to read before the night. */
@Command(
    name = "report",
    mixinStandardHelpOptions = true,
    description = {"Write a night report: one HTML file (charts inline, nothing fetched) with the summary, the "
        + "timeline, night and sky charts, the observations with airmass, Moon separation and sidereal time, the "
        + "passes of orbiting targets, the unscheduled requests and why, and the constraints in force. The "
        + "timeline is re-checked first; a failing one gets a report that says so, and exit 1.",
        "Exit 0 when written for a valid timeline; 1 when the timeline fails the re-check; 2 on invalid input."},
    footer = {"", Caution.TEXT})
final class ReportCommand implements Callable<Integer> {
  @Parameters(index = "0", paramLabel = "SCENARIO.json", description = "The scenario file.")
  Path scenario;

  @Parameters(index = "1", paramLabel = "TIMELINE.json", description = "The timeline file (from plan or replan).")
  Path timeline;

  @Option(names = {"-o", "--output"}, paramLabel = "FILE", required = true, description = "Write the report here "
      + "(e.g. night.html).")
  Path output;

  @Option(names = "--zone", paramLabel = "ZONE", description = "Time zone of the local-time axis: a region "
      + "(Africa/Cairo) or an offset (+02:00). Default: the nautical zone of the site's longitude.")
  String zone;

  @Mixin CommonOptionsMixin common;

  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    PrintWriter out = spec.commandLine().getOut();
    ScenarioReader.Result r = Pipeline.read(scenario, out);
    Timeline t = TimelineFile.read(timeline);
    ReportOutput.zone(zone, r.scenario().observer());
    Outputs.check(Outputs.file("--output", output));
    Pipeline p = Pipeline.of(r.scenario(), common.astro());
    List<String> violations = Pipeline.violations(r.scenario(), common.astro(), t, CheckCommand.replanInstant(t));
    List<String> warnings = new ArrayList<>(r.warnings());
    ReportOutput.write(p, t, null, warnings, violations, zone, output, out);
    if (!violations.isEmpty()) {
      violations.forEach(out::println);
      out.println(violations.size() + " violation(s): the report says so at the top");
      return 1;
    }
    return 0;
  }
}
