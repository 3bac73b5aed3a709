package dev.sequencer.campaign;

import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Request;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.planner.Planner;
import dev.sequencer.sequence.Sequencer;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.replan.ReplanOptions;
import dev.sequencer.sequence.replan.ReplanResult;
import dev.sequencer.sequence.replan.Replanner;
import dev.sequencer.validate.PlanValidator;
import dev.sequencer.validate.TimelineCheck;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Executes one night against its weather. Nobody knows the clouds in advance: an observation that overlaps
 * a cloud is lost, and so is every later one of the plan that starts before the cloud ends; the re-plan is
 * made when the sky clears (the cloud's end), with those observations failed (retried while visible). An
 * observation that fails on its own ({@link NightWeather#fails}) is known at its end and re-planned then.
 * The re-planned rest departs from the last successful observation (the re-planning rule of
 * {@link Replanner}).
 *
 * <p>{@link Strategy#CPSAT} plans the night first and re-plans after each loss; the dispatch strategies
 * ask the greedy for the next observation after every observation, done or lost. Every plan and re-plan
 * passes the full validator ({@link Planner#prepare}); at the end the executed observations alone are
 * checked again as one timeline ({@link NightLog#executed}), required requests not asked (a cloud may take
 * one). A violation there is a bug ({@link IllegalStateException}).
 */
public final class NightExecutor {
  /** Re-plans allowed in one night: a guard against a loop, far above what a night can hold. */
  static final int MAX_REPLANS = 100_000;

  private final PlanningProblem problem;
  private final TimelineCheck validator;
  private final NightWeather weather;
  private final SequencerOptions options;
  private final SequencerOptions replanOptions;
  private final Map<String, Integer> attempts = new HashMap<>();
  private final List<Observation> executed = new ArrayList<>();
  private int failedAttempts;
  private int replans;

  /**
   * One night: {@code validator} checks the whole night ({@code null}: the sequencer's self-check on the problem's own requests,
   * windows and transitions); {@code options}: the solver settings (the strategy sets the solver).
   */
  public NightExecutor(PlanningProblem problem, PlanValidator validator, NightWeather weather, SequencerOptions options) {
    this(problem, validator, weather, options, options);
  }

  /** As above, with other solver settings for the re-plans than for the night's first plan. */
  public NightExecutor(PlanningProblem problem, PlanValidator validator, NightWeather weather, SequencerOptions options,
      SequencerOptions replanOptions) {
    this.replanOptions = replanOptions;
    this.problem = problem;
    this.validator = validator != null ? validator
        : new dev.sequencer.sequence.SelfCheck(problem.horizon(), problem.requests(), problem.windows(),
            problem.transitions());
    this.weather = weather;
    this.options = options;
  }

  /**
   * What happened in one night: the executed observations as a timeline (every other request unscheduled),
   * the priority of the first plan of the night, the attempts lost, the re-plans made and how the night's
   * first plan ended ({@code firstStatus}).
   */
  public record NightLog(Timeline executed, double plannedPriority, PlanStatus firstStatus, int failedAttempts,
      int replans, double cloudS) {}

  /** Plays the night with {@code strategy}. */
  public NightLog run(Strategy strategy) {
    SequencerOptions so = options.withSolver(strategy.solver());
    double planned;
    PlanStatus first;
    if (strategy.dispatch()) {
      double[] p = {0};
      first = dispatch(so, p);
      planned = p[0];
    } else {
      Timeline plan = new Sequencer().plan(problem, so.withValidator(validator instanceof PlanValidator v ? Planner.check(v)
          : dev.sequencer.sequence.ResultCheck.of(validator))).toTimeline();
      planned = plan.priority();
      first = plan.status();
      if (plan.status() == PlanStatus.OPTIMAL || plan.status() == PlanStatus.FEASIBLE) {
        replanAfterLosses(plan, replanOptions.withSolver(strategy.solver()));
      }
    }
    Timeline t = executedTimeline();
    List<String> v = validator.withRequiredIgnored().violations(t);
    if (!v.isEmpty()) {
      throw new IllegalStateException("the executed night fails the validator: " + String.join("; ", v));
    }
    return new NightLog(t, planned, first, failedAttempts, replans, weather.cloudS());
  }

  private void replanAfterLosses(Timeline plan, SequencerOptions so) {
    ReplanOptions ro = ReplanOptions.defaults().withSequencer(so).withValidator(validator);
    Timeline current = plan;
    int next = 0;
    while (true) {
      List<Observation> obs = current.observations();
      Instant now = null;
      Set<String> failed = new LinkedHashSet<>();
      for (int k = next; k < obs.size(); k++) {
        Observation o = obs.get(k);
        if (Observation.DONE.equals(o.state())) {
          continue;
        }
        int attempt = attempt(o.id());
        TimeWindow cloud = weather.cloudOver(o.start(), o.end());
        if (cloud != null) {
          now = min(cloud.end(), problem.horizon().end());
          failed.add(o.id());
          for (int q = k + 1; q < obs.size() && obs.get(q).start().isBefore(cloud.end()); q++) {
            attempt(obs.get(q).id());
            failed.add(obs.get(q).id());
          }
          break;
        }
        if (weather.fails(o.id(), attempt)) {
          now = o.end();
          failed.add(o.id());
          break;
        }
        executed.add(o);
      }
      if (now == null) {
        return;
      }
      failedAttempts += failed.size();
      guard();
      ReplanResult r = new Replanner().replan(problem, current, now, Set.of(), failed, ro);
      if (!r.hasPlan()) {
        return;
      }
      current = r.timeline();
      next = 0;
    }
  }

  /** The dispatch loop; returns the status of the night's first plan and puts its priority in {@code planned[0]}. */
  private PlanStatus dispatch(SequencerOptions so, double[] planned) {
    ReplanOptions ro = ReplanOptions.defaults().withWarmStart(false).withStabilityWeight(0)
        .withSequencer(so.withRelaxationBound(false)).withValidator(validator);
    Timeline history = new Timeline(PlanStatus.FEASIBLE, 0, 0, null, List.of(), List.of());
    Instant now = problem.horizon().start();
    Set<String> failed = Set.of();
    PlanStatus first = null;
    while (true) {
      ReplanResult r = new Replanner().replan(problem, history, now, Set.of(), failed, ro);
      if (first == null) {
        first = r.status();
        planned[0] = r.hasPlan() ? r.timeline().priority() : 0;
      } else {
        guard();
      }
      if (!r.hasPlan()) {
        return first;
      }
      List<Observation> obs = r.timeline().observations();
      int next = 0;
      while (next < obs.size() && Observation.DONE.equals(obs.get(next).state())) {
        next++;
      }
      if (next >= obs.size()) {
        return first;
      }
      Observation o = obs.get(next);
      history = new Timeline(r.timeline().status(), 0, 0, null, obs.subList(0, next + 1), List.of());
      int attempt = attempt(o.id());
      TimeWindow cloud = weather.cloudOver(o.start(), o.end());
      if (cloud != null || weather.fails(o.id(), attempt)) {
        failedAttempts++;
        failed = Set.of(o.id());
        now = cloud != null ? min(cloud.end(), problem.horizon().end()) : o.end();
      } else {
        executed.add(o);
        failed = Set.of();
        now = o.end();
      }
    }
  }

  private int attempt(String id) {
    int a = attempts.getOrDefault(id, 0);
    attempts.put(id, a + 1);
    return a;
  }

  private void guard() {
    if (++replans > MAX_REPLANS) {
      throw new IllegalStateException("more than " + MAX_REPLANS + " re-plans in one night");
    }
  }

  private static Instant min(Instant a, Instant b) {
    return a.isBefore(b) ? a : b;
  }

  /** The executed observations as one planned timeline, every other request unscheduled. */
  private Timeline executedTimeline() {
    List<Observation> obs = new ArrayList<>();
    double priority = 0;
    double slew = 0;
    Set<String> seen = new HashSet<>();
    for (Observation o : executed) {
      obs.add(new Observation(o.id(), o.start(), o.end(), o.slewSeconds(), o.value(), null, o.slewStart(),
          o.slewVia()));
      seen.add(o.id());
      Request r = problem.requests().get(problem.indexOf(o.id()));
      priority += r.priority() != null ? r.priority() : o.value() != null ? o.value() : 0;
      slew += o.slewSeconds();
    }
    List<Unscheduled> rest = new ArrayList<>();
    for (Request r : problem.requests()) {
      if (!seen.contains(r.id())) {
        rest.add(new Unscheduled(r.id(), attempts.containsKey(r.id()) ? "lost (weather or failure)" : "not observed"));
      }
    }
    return new Timeline(PlanStatus.FEASIBLE, priority, slew, null, obs, rest);
  }
}
