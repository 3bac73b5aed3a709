package dev.sequencer.cli;

import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.TimelineFile;
import dev.sequencer.io.WindowsFile;
import dev.sequencer.model.SolverSettings;
import dev.sequencer.planner.PlanOutcome;
import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code sequencer demo}: plans the bundled demo night end to end and writes every output into one folder. */
@Command(
    name = "demo",
    mixinStandardHelpOptions = true,
    description = {"Run the bundled demo night (an invented site and 40 invented fields) end to end: "
        + "visibility windows, plan, re-check. Writes the timeline and windows JSON, a CSV, the timeline "
        + "and sky pictures (PNG and SVG) and the night report (night.html) into DIR and prints the summary."},
    footer = {"", Caution.TEXT})
final class DemoCommand implements Callable<Integer> {
  /** Classpath location of the bundled scenario. */
  static final String SCENARIO = "/scenarios/demo-night.json";
  /** The night report's file name in the output folder. */
  static final String REPORT = "night.html";
  /** Solver limit when neither the scenario nor --time-limit asks for less, seconds. */
  static final double DEFAULT_TIME_LIMIT_S = 10;

  @Option(names = {"-o", "--output-dir"}, paramLabel = "DIR", description = "Where to write (default: ./demo-out).")
  Path dir = Path.of("demo-out");

  @Mixin SolverOptionsMixin solverOptions;

  @Mixin CommonOptionsMixin common;

  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    Outputs.check(Outputs.folder("--output-dir", dir));
    PrintWriter out = spec.commandLine().getOut();
    ScenarioReader.Result r;
    try (InputStream in = DemoCommand.class.getResourceAsStream(SCENARIO)) {
      if (in == null) {
        throw new IllegalStateException("the bundled scenario " + SCENARIO + " is missing from the jar");
      }
      r = ScenarioReader.read(in);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    r.warnings().forEach(w -> out.println("warning: " + w));
    out.println("demo: " + r.scenario().name());
    try {
      Files.createDirectories(dir);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    SolverSettings fromFile = r.scenario().solverOrDefaults();
    fromFile = fromFile.withTimeLimitS(Math.min(fromFile.timeLimitS(), DEFAULT_TIME_LIMIT_S));
    PlanOutcome planned = PlanCommand.solve(r.scenario(), common.astro(), solverOptions, fromFile, out);
    Pipeline p = new Pipeline(planned.geometry(), common.astro());
    long visible = p.windows().stream().filter(w -> !w.intervals().isEmpty()).count();
    out.println("windows: " + visible + " of " + p.windows().size() + " requests visible");
    Path windowsFile = dir.resolve("windows.json");
    WindowsFile.write(p.windows(), windowsFile);
    PlanCommand.print(out, planned.result(), planned.timeline(), p.visibility());

    Path timelineFile = dir.resolve("timeline.json");
    TimelineFile.write(planned.timeline(), timelineFile);
    // The plan passed the independent validator once, inside the façade; the file as written must read back
    // as the same timeline (a lossy round trip would hand out another plan than the one checked).
    if (!TimelineFile.read(timelineFile).equals(planned.timeline())) {
      throw new IllegalStateException("the written timeline does not read back as the validated plan (a bug)");
    }
    out.println("check: valid (" + planned.timeline().observations().size() + " observations checked by the "
        + "independent validator)");
    out.println("wrote " + windowsFile);
    out.println("wrote " + timelineFile);
    PlanOutputs.csv(p, planned.timeline(), dir.resolve("plan.csv"), out);
    PlanOutputs.plots(p, planned.timeline(), dir.resolve("demo").toString(), false, out);
    ReportOutput.write(p, planned.timeline(), Double.isNaN(planned.result().gap()) ? null : planned.result().gap(),
        r.warnings(), List.of(), null, dir.resolve(REPORT), out);
    out.println("open " + dir.resolve(REPORT) + " in a browser (or " + dir.resolve("demo-timeline.png") + " and "
        + dir.resolve("demo-sky.png") + ") to look at the night");
    return 0;
  }
}
