package dev.sequencer.cli;

import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.WindowsFile;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.visibility.RequestVisibility;
import dev.sequencer.visibility.VisibilityCalculator;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code sequencer windows}: computes every request's visibility windows. */
@Command(
    name = "windows",
    mixinStandardHelpOptions = true,
    description = {"Compute when each request's target satisfies every constraint.",
        "Writes the windows file and prints one line per request."},
    footer = {"", Caution.TEXT})
final class WindowsCommand implements Callable<Integer> {
  @Parameters(index = "0", paramLabel = "SCENARIO.json", description = "The scenario file.")
  Path scenario;

  @Option(names = {"-o", "--output"}, paramLabel = "FILE", description = "Write the windows file here.")
  Path output;

  @Mixin CommonOptionsMixin common;

  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    ScenarioReader.Result r = ScenarioReader.read(scenario);
    Outputs.check(Outputs.file("--output", output));
    Scenario s = r.scenario();
    PrintWriter out = spec.commandLine().getOut();
    r.warnings().forEach(w -> out.println("warning: " + w));
    long t0 = System.nanoTime();
    List<RequestVisibility> vis = new VisibilityCalculator(common.astro()).compute(s);
    double elapsed = (System.nanoTime() - t0) * 1e-9;
    out.printf(Locale.ROOT, "%-16s %8s %12s  %s%n", "id", "windows", "visible [s]", "first window / why never");
    for (RequestVisibility v : vis) {
      String first;
      if (v.intervals().isEmpty()) {
        first = "never visible" + Explained.limiting(v);
      } else {
        TimeWindow w = v.intervals().get(0);
        first = w.start() + " .. " + w.end();
      }
      out.printf(Locale.ROOT, "%-16s %8d %12.1f  %s%n", v.id(), v.intervals().size(), v.totalS(), first);
    }
    out.printf(Locale.ROOT, "%d requests, computed in %.2f s%n", vis.size(), elapsed);
    if (output != null) {
      WindowsFile.write(vis.stream().map(RequestVisibility::toWindows).toList(), output);
      out.println("wrote " + output);
    }
    return 0;
  }
}
