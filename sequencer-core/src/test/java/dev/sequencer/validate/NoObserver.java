package dev.sequencer.validate;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import java.util.Arrays;
import java.util.List;

/** Hand-made scenarios without observer (requests' own windows, a slew table): the validator's bookkeeping only. */
final class NoObserver {
  private NoObserver() {}

  /** A validator of requests carrying these windows as their own, with the slew table and its start row. */
  static PlanValidator validator(TimeWindow horizon, List<Request> requests, List<RequestWindows> windows,
      double[][] seconds, double[] fromStart) {
    List<Request> withWindows = requests.stream().map(r -> windows.stream().filter(w -> w.id().equals(r.id()))
        .findFirst().map(w -> r.withWindows(w.intervals())).orElse(r)).toList();
    SlewSettings slew = new SlewSettings.Matrix(Arrays.stream(seconds).map(row -> Arrays.stream(row).boxed().toList())
        .toList(), Arrays.stream(fromStart).boxed().toList());
    return PlanValidator.of(new Scenario(1, "hand-made", horizon, null, Constraints.none(), slew, null, withWindows,
        null), AstroContext.offline());
  }
}
