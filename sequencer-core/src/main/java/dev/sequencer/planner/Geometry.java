package dev.sequencer.planner;

import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.slew.Transitions;
import dev.sequencer.visibility.RequestVisibility;
import java.util.List;

/**
 * What the planner needs from the physics of one scenario: each request's visibility (with what removes
 * the most time), its windows, and the transitions of the scenario's slew model; and the seconds each took.
 */
public record Geometry(Scenario scenario, List<RequestVisibility> visibility, List<RequestWindows> windows,
    Transitions transitions, double windowsS, double transitionsS) {
  public Geometry {
    visibility = List.copyOf(visibility);
    windows = List.copyOf(windows);
  }
}
