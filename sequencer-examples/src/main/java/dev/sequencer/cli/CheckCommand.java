package dev.sequencer.cli;

import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.TimelineFile;
import dev.sequencer.planner.InputRules;
import dev.sequencer.model.Timeline;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code sequencer check}: re-checks a timeline against a scenario. */
@Command(
    name = "check",
    mixinStandardHelpOptions = true,
    description = {"Re-check a timeline against its scenario with the validator's own physics: every "
        + "constraint recomputed along each observation, no overlap, every gap covers the slew the validator "
        + "computes itself, keep-outs along slews, required requests present, totals add up.",
        "Exit 0 when valid; 1 with every violation listed; 2 on invalid input."},
    footer = {"", Caution.TEXT})
final class CheckCommand implements Callable<Integer> {
  @Parameters(index = "0", paramLabel = "SCENARIO.json", description = "The scenario file.")
  Path scenario;

  @Parameters(index = "1", paramLabel = "TIMELINE.json", description = "The timeline file.")
  Path timeline;

  @Mixin CommonOptionsMixin common;

  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    ScenarioReader.Result r = ScenarioReader.read(scenario);
    Timeline t = TimelineFile.read(timeline);
    InputRules.check(r.scenario(), scenario.toString());
    List<String> violations = Pipeline.violations(r.scenario(), common.astro(), t, replanInstant(t));
    PrintWriter out = spec.commandLine().getOut();
    if (violations.isEmpty()) {
      out.println("valid: " + t.observations().size() + " observations, priority " + t.priority());
      return 0;
    }
    violations.forEach(out::println);
    out.println(violations.size() + " violation(s)");
    return 1;
  }

  /**
   * For a re-planned timeline (some observation done or running): the first planned start (or the last
   * frozen start), so the done and running observations are checked as history; null otherwise.
   */
  static java.time.Instant replanInstant(Timeline t) {
    java.time.Instant at = null;
    boolean frozen = false;
    for (dev.sequencer.model.Observation o : t.observations()) {
      boolean f = dev.sequencer.model.Observation.DONE.equals(o.state())
          || dev.sequencer.model.Observation.RUNNING.equals(o.state());
      frozen |= f;
      if (f) {
        at = o.start();
      } else {
        return frozen ? o.start() : null;
      }
    }
    return frozen ? at : null;
  }
}
