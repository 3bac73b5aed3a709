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
        "Writes the windows file and prints one line per request (per request and resource with several)."},
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
    // With several resources (A6): each resource's view of the scenario, for the requests it may observe.
    java.util.Map<String, List<RequestVisibility>> byResource = new java.util.LinkedHashMap<>();
    if (s.hasResources()) {
      for (dev.sequencer.model.Resource res : s.resources()) {
        Scenario view = s.forResource(res);
        byResource.put(res.id(), new VisibilityCalculator(common.astro()).compute(
            view.withRequests(s.requests().stream().filter(q -> q.allows(res.id())).toList())));
      }
    } else {
      byResource.put(null, new VisibilityCalculator(common.astro()).compute(s));
    }
    // Passes of orbiting targets over ground sites: rise, culmination and set (the contact plan).
    java.util.Map<String, java.util.Map<String, List<WindowsFile.Pass>>> passes = new java.util.HashMap<>();
    if (s.hasResources()) {
      for (dev.sequencer.model.Resource res : s.resources()) {
        passes.put(res.id(), ContactPlan.passes(s.forResource(res).withRequests(
            s.requests().stream().filter(q -> q.allows(res.id())).toList()), common.astro()));
      }
    } else {
      passes.put(null, ContactPlan.passes(s, common.astro()));
    }
    double elapsed = (System.nanoTime() - t0) * 1e-9;
    boolean several = s.hasResources();
    out.printf(Locale.ROOT, "%-16s %s%8s %12s  %s%n", "id", several ? String.format(Locale.ROOT, "%-14s ", "resource")
        : "", "windows", "visible [s]", "first window / why never");
    int lines = 0;
    for (java.util.Map.Entry<String, List<RequestVisibility>> e : byResource.entrySet()) {
      for (RequestVisibility v : e.getValue()) {
        String first;
        if (v.intervals().isEmpty()) {
          first = "never visible" + Explained.limiting(v);
        } else {
          TimeWindow w = v.intervals().get(0);
          first = w.start() + " .. " + w.end();
        }
        out.printf(Locale.ROOT, "%-16s %s%8d %12.1f  %s%n", v.id(), several
            ? String.format(Locale.ROOT, "%-14s ", e.getKey()) : "", v.intervals().size(), v.totalS(), first);
        lines++;
        int k = 0;
        for (WindowsFile.Pass p : passes.get(e.getKey()).getOrDefault(v.id(), List.of())) {
          out.printf(Locale.ROOT, "  pass %-3d rise %s  culmination %s at %5.1f deg  set %s%n", ++k, p.rise(),
              p.culmination(), p.culminationElevationDeg(), p.set());
        }
      }
    }
    out.printf(Locale.ROOT, "%d %s, computed in %.2f s%n", lines, several ? "(request, resource) pairs" : "requests",
        elapsed);
    if (output != null) {
      if (several) {
        List<WindowsFile.ResourceWindows> w = new java.util.ArrayList<>();
        byResource.forEach((id, vis) -> w.add(new WindowsFile.ResourceWindows(id,
            vis.stream().map(RequestVisibility::toWindows).toList())));
        WindowsFile.writeByResource(w, (res, id) -> passes.get(res).getOrDefault(id, List.of()), output);
      } else {
        WindowsFile.write(byResource.get(null).stream().map(RequestVisibility::toWindows).toList(),
            (res, id) -> passes.get(null).getOrDefault(id, List.of()), output);
      }
      out.println("wrote " + output);
    }
    return 0;
  }
}
