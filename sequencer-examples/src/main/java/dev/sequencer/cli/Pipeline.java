package dev.sequencer.cli;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.slew.SlewModel;
import dev.sequencer.slew.Transitions;
import dev.sequencer.visibility.PointingTracks;
import dev.sequencer.visibility.RequestVisibility;
import dev.sequencer.visibility.VisibilityCalculator;
import java.util.List;

/** The geometry every planning command needs: windows and transitions of one scenario. */
record Pipeline(Scenario scenario, List<RequestVisibility> visibility, List<RequestWindows> windows,
    Transitions transitions) {

  static Pipeline of(Scenario s, AstroContext ctx) {
    List<RequestVisibility> vis = new VisibilityCalculator(ctx).compute(s);
    List<RequestWindows> windows = vis.stream().map(RequestVisibility::toWindows).toList();
    Transitions transitions;
    try {
      transitions = s.observer() == null
          ? SlewModel.of(s.slew()).transitions(java.util.Collections.nCopies(s.requests().size(), null), null)
          : SlewModel.of(s.slew()).transitions(PointingTracks.of(s, ctx), PointingTracks.start(s, ctx));
    } catch (UnsupportedOperationException e) {
      throw new InputException(e.getMessage());
    }
    return new Pipeline(s, vis, windows, transitions);
  }
}
