package dev.sequencer.cli;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.WindowsFile.ResourceWindows;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import dev.sequencer.planner.Geometry;
import dev.sequencer.planner.Planner;
import dev.sequencer.validate.PlanValidator;
import dev.sequencer.visibility.RequestVisibility;
import dev.sequencer.io.ScenarioReader;
import dev.sequencer.planner.InputRules;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;

/** A scenario's geometry (from the {@link Planner} façade) with the astronomy context the commands print and draw with. */
record Pipeline(Geometry geometry, AstroContext astro) {

  /**
   * Reads a scenario file for a command that plans or reports: the reader's warnings printed to {@code out},
   * then the façade's input rules (bad input as an exception naming the JSON path, the rule and the value).
   */
  static ScenarioReader.Result read(Path file, PrintWriter out) {
    ScenarioReader.Result r = ScenarioReader.read(file);
    r.warnings().forEach(w -> out.println("warning: " + w));
    InputRules.check(r.scenario(), file.toString());
    return r;
  }

  /** The geometry of {@code s}, computed by the façade (for commands that do not plan: windows, check). */
  static Pipeline of(Scenario s, AstroContext ctx) {
    return new Pipeline(Planner.geometry(s, ctx), ctx);
  }

  Scenario scenario() {
    return geometry.scenario();
  }

  List<RequestWindows> windows() {
    return geometry.windows();
  }

  /** Each resource's windows (A6), in the scenario's file order; empty with one observer. */
  List<ResourceWindows> windowsByResource() {
    List<dev.sequencer.model.Resource> resources = scenario().resources();
    return java.util.stream.IntStream.range(0, geometry.resources().size())
        .mapToObj(i -> new ResourceWindows(resources.get(i).id(), geometry.resources().get(i).windows())).toList();
  }

  /** Each request's visibility with what removes the most time (for the explained reasons). */
  List<RequestVisibility> visibility() {
    return geometry.visibility();
  }

  /**
   * What the independent validator finds wrong with {@code timeline} (for a re-plan made at {@code now} when
   * not null); it uses only the scenario, none of this pipeline's windows or transitions.
   */
  static List<String> violations(Scenario s, AstroContext ctx, Timeline timeline, Instant now) {
    PlanValidator v = Planner.validator(s, ctx);
    return (now == null ? v : v.withNow(now)).violations(timeline);
  }
}
