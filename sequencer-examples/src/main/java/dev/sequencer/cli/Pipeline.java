package dev.sequencer.cli;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.Timeline;
import dev.sequencer.sequence.PlanningProblem;
import dev.sequencer.sequence.Sequencer;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.SequencerResult;
import dev.sequencer.slew.SlewModel;
import dev.sequencer.slew.Transitions;
import dev.sequencer.validate.PhysicsOracle;
import dev.sequencer.validate.PlanValidator;
import dev.sequencer.visibility.PointingTracks;
import dev.sequencer.visibility.RequestVisibility;
import dev.sequencer.visibility.VisibilityCalculator;
import java.util.List;

/** The geometry every planning command needs: windows and transitions of one scenario. */
record Pipeline(Scenario scenario, List<RequestVisibility> visibility, List<RequestWindows> windows,
    Transitions transitions, AstroContext astro) {

  /** A solved and re-checked plan: the sequencer's result and its timeline-file view. */
  record Planned(SequencerResult result, Timeline timeline) {}

  static Pipeline of(Scenario s, AstroContext ctx) {
    List<RequestVisibility> vis = new VisibilityCalculator(ctx).compute(s);
    List<RequestWindows> windows = vis.stream().map(RequestVisibility::toWindows).toList();
    Transitions transitions;
    try {
      // The fixed and matrix models use only the number of requests: no pointing tracks needed.
      boolean tracksNeeded = s.observer() != null
          && !(s.slew() instanceof SlewSettings.Fixed) && !(s.slew() instanceof SlewSettings.Matrix);
      transitions = !tracksNeeded
          ? SlewModel.of(s.slew()).transitions(java.util.Collections.nCopies(s.requests().size(), null), null)
          : SlewModel.of(s.slew()).transitions(PointingTracks.of(s, ctx), PointingTracks.start(s, ctx));
    } catch (UnsupportedOperationException e) {
      throw new InputException(e.getMessage());
    }
    return new Pipeline(s, vis, windows, transitions, ctx);
  }

  /** Plans with {@code options}, then re-checks the plan; a violation is our bug (IllegalStateException). */
  Planned plan(SequencerOptions options) {
    if (transitions.timeDependent() && scenario.requests().stream().anyMatch(r -> r.isFlexible())) {
      throw new InputException("requests: flexible exposures need time-independent transitions (fixed, matrix, "
          + "or eigenaxis between fixed RA/Dec targets); this scenario's transitions depend on time");
    }
    PlanningProblem problem = PlanningProblem.of(scenario, windows, transitions);
    SequencerResult result = new Sequencer().plan(problem, options);
    Timeline timeline = result.toTimeline();
    // A result without a plan (INFEASIBLE, NO_SOLUTION_IN_TIME) has nothing to re-check: its required
    // requests are missing by definition.
    List<String> violations = result.hasPlan() ? violations(timeline) : List.of();
    if (!violations.isEmpty()) {
      throw new IllegalStateException("the plan failed its re-check (a bug): " + violations);
    }
    return new Planned(result, timeline);
  }

  /** What the independent validator finds wrong with {@code timeline} (empty when it is valid). */
  List<String> violations(Timeline timeline) {
    return validator().violations(timeline);
  }

  /**
   * The validator: windows, overlaps, exact transitions and totals, plus every constraint re-evaluated
   * from the physics at the observations' own instants ({@link PhysicsOracle}, independent of the
   * visibility engine).
   */
  private PlanValidator validator() {
    return PlanValidator.of(scenario, windows, transitions).withOracle(new PhysicsOracle(scenario, astro));
  }

  /** As {@link #violations(Timeline)}, for a re-plan made at {@code now} when it is not null. */
  List<String> violations(Timeline timeline, java.time.Instant now) {
    PlanValidator v = validator();
    return (now == null ? v : v.withNow(now)).violations(timeline);
  }
}
