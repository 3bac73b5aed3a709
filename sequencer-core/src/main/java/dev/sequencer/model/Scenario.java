package dev.sequencer.model;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * A planning problem: horizon, observer, constraints, slew model, start pointing, requests and solver
 * settings. {@code observer}, {@code startPointing} and {@code solver} may be {@code null} (absent in the
 * file); {@code constraints} is never null (absent means {@link Constraints#none()}). {@code groups},
 * {@code reconfiguration} and {@code startConfiguration} are the format's addition A5 (none, no change
 * time, {@code ""} when absent).
 */
public record Scenario(
    int format,
    String name,
    TimeWindow horizon,
    Observer observer,
    Constraints constraints,
    SlewSettings slew,
    Pointing startPointing,
    List<Request> requests,
    SolverSettings solver,
    List<Group> groups,
    Reconfiguration reconfiguration,
    String startConfiguration) {
  /** The only format version this library reads and writes. */
  public static final int FORMAT = 1;

  public Scenario {
    Objects.requireNonNull(horizon, "horizon");
    Objects.requireNonNull(slew, "slew");
    constraints = constraints == null ? Constraints.none() : constraints;
    requests = List.copyOf(requests);
    groups = groups == null ? List.of() : List.copyOf(groups);
    reconfiguration = reconfiguration == null ? Reconfiguration.NONE : reconfiguration;
    startConfiguration = startConfiguration == null ? "" : startConfiguration;
  }

  /** A scenario without groups or configurations (A5). */
  public Scenario(int format, String name, TimeWindow horizon, Observer observer, Constraints constraints,
      SlewSettings slew, Pointing startPointing, List<Request> requests, SolverSettings solver) {
    this(format, name, horizon, observer, constraints, slew, startPointing, requests, solver, List.of(),
        Reconfiguration.NONE, "");
  }

  /** True when some request has visits, some group exists or some configuration differs from the start (A4, A5). */
  public boolean hasStructure() {
    return !groups.isEmpty() || requests.stream().anyMatch(r -> r.hasVisits()
        || !r.configuration().equals(startConfiguration));
  }

  /** The group {@code id} belongs to, if any. */
  public Optional<Group> groupOf(String id) {
    return groups.stream().filter(g -> g.members().contains(id)).findFirst();
  }

  /** The solver settings, or the defaults when the file gives none. */
  public SolverSettings solverOrDefaults() {
    return solver == null ? SolverSettings.defaults() : solver;
  }

  /**
   * The constraints that apply to {@code r}: the scenario's, with the request's own fields replacing
   * (or removing) the matching ones.
   */
  public Constraints constraintsFor(Request r) {
    return constraints.overriddenBy(r.constraints());
  }

  /** The request with this id, if any. */
  public Optional<Request> request(String id) {
    return requests.stream().filter(r -> r.id().equals(id)).findFirst();
  }

  /** A copy with other requests. */
  public Scenario withRequests(List<Request> newRequests) {
    return new Scenario(format, name, horizon, observer, constraints, slew, startPointing, newRequests, solver, groups,
        reconfiguration, startConfiguration);
  }

  /** A copy with other solver settings. */
  public Scenario withSolver(SolverSettings newSolver) {
    return new Scenario(format, name, horizon, observer, constraints, slew, startPointing, requests, newSolver, groups,
        reconfiguration, startConfiguration);
  }

  /** A copy with another slew model. */
  public Scenario withSlew(SlewSettings newSlew) {
    return new Scenario(format, name, horizon, observer, constraints, newSlew, startPointing, requests, solver, groups,
        reconfiguration, startConfiguration);
  }
}
