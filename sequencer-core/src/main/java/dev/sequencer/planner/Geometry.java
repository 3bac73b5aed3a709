package dev.sequencer.planner;

import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.slew.Transitions;
import dev.sequencer.visibility.RequestVisibility;
import java.util.List;

/**
 * What the planner needs from the physics of one scenario: each request's visibility (with what removes
 * the most time), its windows, and the transitions of the scenario's slew model; and the seconds each took.
 * With several resources (A6), the same per resource ({@link #ofResources}).
 */
public record Geometry(Scenario scenario, List<RequestVisibility> visibility, List<RequestWindows> windows,
    Transitions transitions, double windowsS, double transitionsS, List<Geometry> resources) {
  public Geometry {
    visibility = List.copyOf(visibility);
    windows = List.copyOf(windows);
    resources = resources == null ? List.of() : List.copyOf(resources);
  }

  /** The geometry of a scenario with one observer. */
  public Geometry(Scenario scenario, List<RequestVisibility> visibility, List<RequestWindows> windows,
      Transitions transitions, double windowsS, double transitionsS) {
    this(scenario, visibility, windows, transitions, windowsS, transitionsS, List.of());
  }

  /**
   * The geometry of a scenario with several resources (A6): one per resource (its scenario is
   * {@link Scenario#forResource}, its visibility and windows those of the requests it may observe, its
   * transitions indexed by all requests), with the seconds summed; the top level's own lists are empty and
   * its transitions null.
   */
  public static Geometry ofResources(Scenario scenario, List<Geometry> resources) {
    return new Geometry(scenario, List.of(), List.of(), null,
        resources.stream().mapToDouble(Geometry::windowsS).sum(),
        resources.stream().mapToDouble(Geometry::transitionsS).sum(), resources);
  }

  /** True for a scenario with several resources. */
  public boolean hasResources() {
    return !resources.isEmpty();
  }

  /** Every transition model, one per resource (or the one model), in the resources' file order. */
  public List<Transitions> transitionsPerResource() {
    return hasResources() ? resources.stream().map(Geometry::transitions).toList() : List.of(transitions);
  }
}
