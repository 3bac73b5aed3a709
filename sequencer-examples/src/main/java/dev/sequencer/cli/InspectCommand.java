package dev.sequencer.cli;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.WindowsFile;
import dev.sequencer.model.Request;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
import dev.sequencer.planner.InputRules;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code sequencer inspect}: checks a scenario and prints a short summary. */
@Command(
    name = "inspect",
    mixinStandardHelpOptions = true,
    description = {"Check a scenario file against the format and the planner's rules, compute its windows, and "
        + "print a short summary (the requested time against the time the constraints leave).",
        "Exit 0 when valid; 2 with every problem listed, one a line, when not."},
    footer = {"", Caution.TEXT})
final class InspectCommand implements Callable<Integer> {
  @Parameters(index = "0", paramLabel = "SCENARIO.json", description = "The scenario file.")
  Path scenario;

  @Mixin CommonOptionsMixin common;

  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    ScenarioReader.Result r = ScenarioReader.read(scenario);
    // The same rules as plan: what inspect calls valid, plan takes.
    InputRules.check(r.scenario(), scenario.toString());
    PrintWriter out = spec.commandLine().getOut();
    ScenarioSummary.lines(r.scenario()).forEach(out::println);
    AstroContext astro = common.astro();
    Pipeline p = Pipeline.of(r.scenario(), astro);
    if (p.geometry().hasResources()) {
      // Several resources (A6): each resource's observable time for the requests it may observe.
      for (dev.sequencer.planner.Geometry g : p.geometry().resources()) {
        String id = r.scenario().resources().get(p.geometry().resources().indexOf(g)).id();
        out.println(ScenarioSummary.requestedAgainstObservable(r.scenario(), g.windows())
            .replaceFirst("^observable  ", "observable  on " + id + ": "));
      }
    } else {
      out.println(ScenarioSummary.requestedAgainstObservable(r.scenario(), p.windows()));
    }
    passLines(r.scenario(), astro).forEach(out::println);
    if (astro.beyondLeapSecondValidity(r.scenario().horizon().end())) {
      out.println("warning     the horizon ends after " + astro.leapSecondsValidUntil()
          + ", the last date the leap-second table is known to be complete for");
    }
    r.warnings().forEach(w -> out.println("warning     " + w));
    ScenarioSummary.unusedConstraints(r.scenario()).forEach(w -> out.println("note        " + w));
    out.println("valid");
    return 0;
  }

  /**
   * One line per pass of each orbiting target over each ground site (rise and set at the geometric horizon,
   * culmination at the highest elevation), per resource with several: the contact plan.
   */
  static List<String> passLines(Scenario s, AstroContext astro) {
    List<String> out = new ArrayList<>();
    List<Resource> resources = s.hasResources() ? s.resources() : java.util.Collections.singletonList(null);
    for (Resource res : resources) {
      Scenario view = res == null ? s
          : s.forResource(res).withRequests(s.requests().stream().filter(q -> q.allows(res.id())).toList());
      Map<String, List<WindowsFile.Pass>> passes = ContactPlan.passes(view, astro);
      for (Request q : view.requests()) {
        int k = 0;
        for (WindowsFile.Pass p : passes.getOrDefault(q.id(), List.of())) {
          out.add(String.format(Locale.ROOT, "pass        %s%s #%d: rise %s, culmination %s at %.1f deg, set %s", q.id(),
              res == null ? "" : " on " + res.id(), ++k, seconds(p.rise()), seconds(p.culmination()),
              p.culminationElevationDeg(), seconds(p.set())));
        }
      }
    }
    return out;
  }

  private static String seconds(Instant t) {
    return t.truncatedTo(ChronoUnit.SECONDS).toString();
  }
}
