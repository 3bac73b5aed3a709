package dev.sequencer.charts;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.examples.Embedding;
import dev.sequencer.io.WindowsFile.ResourceWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import dev.sequencer.planner.Geometry;
import dev.sequencer.planner.PlanOutcome;
import dev.sequencer.planner.Planner;
import dev.sequencer.sequence.SequencerOptions;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.stream.IntStream;

/**
 * The bundled scenarios with several resources (format addition A6), each planned once per test run through
 * the {@link Planner} façade (CP-SAT, reproducible work limit, 5 s, 2 workers), for the chart and report tests.
 */
public final class NetworkPlans {
  /** Two telescope sites sharing one queue. */
  public static final String NETWORK = "/scenarios/network-two-sites-night.json";
  /** One station with two antennas sharing the passes of 60 objects. */
  public static final String STATION = "/scenarios/station-two-antennas-night.json";
  public static final AstroContext CTX = AstroContext.offline();
  private static final Map<String, Planned> PLANNED = new ConcurrentHashMap<>();

  private NetworkPlans() {}

  /** One planned scenario: the scenario, the façade's geometry (windows per resource) and the timeline. */
  public record Planned(Scenario scenario, Geometry geometry, Timeline timeline) {
    /** Each resource's windows, in the scenario's file order. */
    public List<ResourceWindows> windowsByResource() {
      return IntStream.range(0, scenario.resources().size()).mapToObj(i -> new ResourceWindows(
          scenario.resources().get(i).id(), geometry.resources().get(i).windows())).toList();
    }
  }

  /** The bundled scenario {@code file} planned (once; later calls get the same plan). */
  public static Planned of(String file) {
    return PLANNED.computeIfAbsent(file, f -> {
      Scenario s = Embedding.bundled(f);
      PlanOutcome o = Planner.plan(s, CTX, SequencerOptions.from(s.solverOrDefaults()).withTimeLimitS(5).withWorkers(2)
          .withReproducible(5).withSolver(SequencerOptions.Solver.CPSAT));
      if (!o.result().hasPlan() || !s.hasResources()) {
        throw new IllegalStateException(f + ": no plan with resources (" + o.result().status() + ")");
      }
      return new Planned(s, o.geometry(), o.timeline());
    });
  }
}
