package dev.sequencer.planner;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.Problem;
import dev.sequencer.io.ScenarioException;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.Timeline;
import dev.sequencer.sequence.Budget;
import dev.sequencer.sequence.ResultCheck;
import dev.sequencer.sequence.Sequencer;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.SequencerResult;
import dev.sequencer.sequence.cpsat.NativeSolver;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.replan.ReplanOptions;
import dev.sequencer.sequence.replan.ReplanResult;
import dev.sequencer.sequence.replan.Replanner;
import dev.sequencer.slew.SlewModel;
import dev.sequencer.slew.Transitions;
import dev.sequencer.validate.PlanValidator;
import dev.sequencer.visibility.PointingTracks;
import dev.sequencer.visibility.RequestVisibility;
import dev.sequencer.visibility.SlewKeepOuts;
import dev.sequencer.visibility.VisibilityCalculator;
import java.time.Instant;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Plans a scenario end to end: the input rules ({@link InputRules}), visibility windows, slew transitions,
 * the sequencer, and the one independent check of the plan ({@link PlanValidator}, which derives its own
 * geometry and slews from the scenario). The time limit of the options is the wall clock of the whole call: windows and
 * transitions count, and the sequencer gets what they leave. Stateless.
 *
 * <pre>{@code
 * PlanOutcome o = Planner.plan(scenario, AstroContext.offline(), SequencerOptions.from(scenario.solverOrDefaults()));
 * TimelineFile.write(o.timeline(), Path.of("timeline.json"));
 * }</pre>
 */
public final class Planner {
  private Planner() {}

  /**
   * Starts loading OR-Tools' native library in the background, so that its second or so overlaps the
   * visibility windows instead of adding to the run (the sequencer waits for it, or sees its failure).
   */
  private static void preloadSolver() {
    Thread t = new Thread(() -> {
      try {
        NativeSolver.ensureLoaded();
      } catch (RuntimeException e) {
        // reported by the sequencer's own call, with the same message
      }
    }, "sequencer-native-load");
    t.setDaemon(true);
    t.start();
  }

  /** Windows and transitions of {@code s}; bad input (a slew model the observer cannot drive) as a {@link ScenarioException}. */
  public static Geometry geometry(Scenario s, AstroContext ctx) {
    if (s.hasResources()) {
      List<Geometry> each = new java.util.ArrayList<>();
      for (dev.sequencer.model.Resource r : s.resources()) {
        Scenario view = s.forResource(r);
        each.add(geometry(view, view.withRequests(s.requests().stream().filter(q -> q.allows(r.id())).toList()),
            ctx));
      }
      return Geometry.ofResources(s, each);
    }
    return geometry(s, s, ctx);
  }

  /** The windows of {@code visible}'s requests and the transitions of all of {@code s}'s (same observer and slew). */
  private static Geometry geometry(Scenario s, Scenario visible, AstroContext ctx) {
    long t0 = System.nanoTime();
    List<RequestVisibility> visibility = new VisibilityCalculator(ctx).compute(visible);
    List<RequestWindows> windows = visibility.stream().map(RequestVisibility::toWindows).toList();
    long t1 = System.nanoTime();
    Transitions transitions;
    try {
      // The fixed and matrix models use only the number of requests: no pointing tracks needed.
      boolean tracksNeeded = s.observer() != null
          && !(s.slew() instanceof SlewSettings.Fixed) && !(s.slew() instanceof SlewSettings.Matrix);
      transitions = !tracksNeeded
          ? SlewModel.of(s.slew()).transitions(Collections.nCopies(s.requests().size(), null), null)
          : SlewModel.of(s.slew()).transitions(PointingTracks.of(s, ctx), PointingTracks.start(s, ctx),
              SlewKeepOuts.of(s, ctx));
    } catch (UnsupportedOperationException e) {
      throw new ScenarioException("scenario", List.of(new Problem("slew.model", e.getMessage(), null)));
    }
    long t2 = System.nanoTime();
    return new Geometry(s, visibility, windows, transitions, (t1 - t0) * 1e-9, (t2 - t1) * 1e-9);
  }

  /**
   * The independent validator of {@code g}'s scenario: it derives its own geometry, slews and constraints from
   * the scenario and uses nothing of {@code g} but the scenario.
   */
  public static PlanValidator validator(Geometry g, AstroContext ctx) {
    return validator(g.scenario(), ctx);
  }

  /** The independent validator of {@code s} as the façade runs it (the same rules for plan and check). */
  public static PlanValidator validator(Scenario s, AstroContext ctx) {
    return PlanValidator.of(s, ctx).withSlewKeepOuts(PLANNER_KEEPS_SLEW_KEEP_OUTS);
  }

  /**
   * Whether the façade's validator checks the keep-outs of the format's A3 (Sun separation and Earth limb
   * along every slew, {@code keepOutDuringSlew}): on, since the planner plans its slews around them
   * (eigenaxis detours written as {@code slewVia}/{@code slewStart} by {@link SlewPaths}, alt-az legs on the
   * mount's nearest branch refused when they cross the Sun's cone). A plan whose slew crosses a keep-out is
   * then a bug the façade reports instead of handing out; {@code sequencer check} uses the same rules.
   */
  static final boolean PLANNER_KEEPS_SLEW_KEEP_OUTS = true;

  /**
   * Plans {@code s}: every phase counts towards {@code options.timeLimitS()} from this call on (in
   * reproducible mode the sequencer's work limits apply instead). A returned plan has passed the full
   * validator once; a plan that fails it is a bug and raises {@link IllegalStateException}.
   */
  public static PlanOutcome plan(Scenario s, AstroContext ctx, SequencerOptions options) {
    Budget clock = Budget.startingNow(options.timeLimitS());
    InputRules.check(s, "scenario");
    preloadSolver();
    Geometry g = geometry(s, ctx);
    PlanningProblem problem = problem(s, g);
    PlanValidator validator = validator(g, ctx);
    SequencerResult result = new Sequencer().plan(problem,
        options.withClock(clock).withValidator(check(validator, s, g)));
    Map<String, Double> phases = new LinkedHashMap<>();
    phases.put("windows", g.windowsS());
    phases.put("transitions", g.transitionsS());
    result.stats().phaseS().forEach((k, v) -> phases.merge(k, v, Double::sum));
    return new PlanOutcome(g, result, annotate(s, g, result.toTimeline()), phases, clock.elapsedS());
  }

  /**
   * The planning problem of {@code s}: with one observer {@link PlanningProblem#of(Scenario, List, Transitions)};
   * with several resources (A6) {@link PlanningProblem#ofSections}, each resource's transitions with its own
   * configuration change times folded in.
   */
  static PlanningProblem problem(Scenario s, Geometry g) {
    if (!g.hasResources()) {
      return PlanningProblem.of(s, g.windows(), g.transitions());
    }
    List<String> ids = s.resources().stream().map(dev.sequencer.model.Resource::id).toList();
    List<List<dev.sequencer.model.RequestWindows>> windows = g.resources().stream().map(Geometry::windows).toList();
    List<String> configurations = s.requests().stream().map(dev.sequencer.model.Request::configuration).toList();
    List<Transitions> transitions = g.resources().stream()
        .map(r -> dev.sequencer.slew.Reconfigured.of(r.transitions(), r.scenario().reconfiguration(), configurations,
            s.startConfiguration()))
        .toList();
    return PlanningProblem.ofSections(s.horizon(), s.requests(), s.groups(), ids, windows, transitions,
        new long[ids.size()]);
  }

  /** The timeline with its slews' departures and waypoints (spec A3), per resource when there are several. */
  static Timeline annotate(Scenario s, Geometry g, Timeline t) {
    return g.hasResources() ? SlewPaths.annotate(s, g.transitionsPerResource(), t)
        : SlewPaths.annotate(s, g.transitions(), t);
  }

  /**
   * {@code v} on the timeline as it is written ({@link #annotate}: the slews' departures and waypoints, A3), as
   * {@link #check(PlanValidator, Scenario, Geometry)} does for a plan: a re-plan's night with a slew around a
   * keep-out is judged with its waypoints, not as the direct slew it replaces.
   */
  static dev.sequencer.validate.TimelineCheck annotating(dev.sequencer.validate.TimelineCheck v, Scenario s,
      Geometry g) {
    return new dev.sequencer.validate.TimelineCheck() {
      @Override
      public List<String> violations(Timeline t) {
        return v.violations(annotate(s, g, t));
      }

      @Override
      public dev.sequencer.validate.TimelineCheck withNow(Instant now) {
        return annotating(v.withNow(now), s, g);
      }

      @Override
      public dev.sequencer.validate.TimelineCheck withRequiredIgnored() {
        return annotating(v.withRequiredIgnored(), s, g);
      }
    };
  }

  /**
   * The façade's one check: the independent validator, with its expected cost (it samples each observation's
   * constraints every {@link PlanValidator#SAMPLE_STEP_S} seconds, about {@link #CHECK_SAMPLE_S} each).
   */
  public static ResultCheck check(PlanValidator validator) {
    return check(validator, null, null);
  }

  /** As {@link #check(PlanValidator)}, on the timeline as it is written: with its slews' departures and waypoints. */
  static ResultCheck check(PlanValidator validator, Scenario s, Geometry g) {
    return new ResultCheck() {
      @Override
      public List<String> violations(SequencerResult r) {
        Timeline t = r.toTimeline();
        return validator.violations(s == null ? t : annotate(s, g, t));
      }

      @Override
      public double expectedS(long observedS) {
        double perSample = s != null && s.observer() instanceof dev.sequencer.model.OrbitObserver
            ? CHECK_SAMPLE_ORBIT_S : CHECK_SAMPLE_S;
        return 0.05 + observedS / PlanValidator.SAMPLE_STEP_S * perSample;
      }
    };
  }

  /**
   * Seconds per sample of the independent check from a ground site (or without an observer), a deliberately
   * high figure: about 4 times what one sample took on this project's 2-core machine under load (60 µs idle;
   * see docs/benchmarks.md).
   */
  static final double CHECK_SAMPLE_S = 1e-4;
  /**
   * The same from orbit, where every sample propagates the observer and the keep-outs during slews are
   * sampled along each path too: the bundled LEO day's check took 2.4–2.6 s for 84 observations (14,448
   * samples, 170 µs each, idle, 2026-12-03); 1.5 times that.
   */
  static final double CHECK_SAMPLE_ORBIT_S = 2.5e-4;

  /**
   * What a caller that plans and re-plans one night itself needs (the campaign simulator): the input rules
   * applied, the geometry, the planning problem and the full validator. No time budget is started.
   */
  public static Prepared prepare(Scenario s, AstroContext ctx) {
    InputRules.check(s, "scenario");
    preloadSolver();
    Geometry g = geometry(s, ctx);
    return new Prepared(g, problem(s, g), validator(g, ctx));
  }

  /**
   * Re-plans the rest of a night (see {@link Replanner}) under the same budget rule as {@link #plan};
   * bad re-planning input (ids, instants) as a {@link ScenarioException}.
   */
  public static ReplanOutcome replan(Scenario s, AstroContext ctx, Timeline previous, Instant now, Set<String> done,
      Set<String> failed, ReplanOptions options) {
    Budget clock = Budget.startingNow(options.sequencer().timeLimitS());
    InputRules.check(s, "scenario");
    preloadSolver();
    Geometry g = geometry(s, ctx);
    PlanningProblem problem = problem(s, g);
    ReplanOptions o = options.withSequencer(options.sequencer().withClock(clock))
        .withValidator(annotating(validator(g, ctx), s, g));
    ReplanResult r = new Replanner().replan(problem, previous, now, done, failed, o);
    ReplanResult annotated = new ReplanResult(annotate(s, g, r.timeline()), r.source(),
        r.newPriority(), r.tailPriority(), r.solverPriority(), r.tailRequests(), r.keptRequests(), r.keptArcs(),
        r.departure(), r.message(), r.notes());
    return new ReplanOutcome(g, annotated, clock.elapsedS());
  }
}
