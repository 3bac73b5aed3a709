package dev.sequencer.model;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * A planning problem: horizon, observer, constraints, slew model, start pointing, requests and solver
 * settings. {@code observer}, {@code startPointing} and {@code solver} may be {@code null} (absent in the
 * file); {@code constraints} is never null (absent means {@link Constraints#none()}). {@code groups},
 * {@code reconfiguration} and {@code startConfiguration} are the format's addition A5 (none, no change
 * time, {@code ""} when absent). {@code resources} (A6) is empty for the one-observer form; otherwise the
 * top-level {@code observer} and {@code startPointing} are {@code null} and {@code slew} is unused (each
 * resource has its own).
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
    String startConfiguration,
    List<Resource> resources) {
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
    resources = resources == null ? List.of() : List.copyOf(resources);
  }

  /** A scenario with one observer (no {@code resources}, A6). */
  public Scenario(int format, String name, TimeWindow horizon, Observer observer, Constraints constraints,
      SlewSettings slew, Pointing startPointing, List<Request> requests, SolverSettings solver, List<Group> groups,
      Reconfiguration reconfiguration, String startConfiguration) {
    this(format, name, horizon, observer, constraints, slew, startPointing, requests, solver, groups,
        reconfiguration, startConfiguration, List.of());
  }

  /** True when the file gives {@code resources} (A6) instead of one observer. */
  public boolean hasResources() {
    return !resources.isEmpty();
  }

  /**
   * The scenario as resource {@code r} sees it (A6): its observer, slew model, start pointing and change
   * times, the scenario's constraints with the resource's fields over them, and every request (file order,
   * so a {@code matrix} slew keeps its indices; whether {@code r} may observe a request is
   * {@link Request#allows}). Groups are kept; the copy has no resources.
   */
  public Scenario forResource(Resource r) {
    return new Scenario(format, name, horizon, r.observer(), constraints.overriddenBy(r.constraints()), r.slew(),
        r.startPointing(), requests, solver, groups,
        r.reconfiguration() != null ? r.reconfiguration() : reconfiguration, startConfiguration, List.of());
  }

  /** The resource with this id, if any. */
  public Optional<Resource> resource(String id) {
    return resources.stream().filter(r -> r.id().equals(id)).findFirst();
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
        reconfiguration, startConfiguration, resources);
  }

  /** A copy with other solver settings. */
  public Scenario withSolver(SolverSettings newSolver) {
    return new Scenario(format, name, horizon, observer, constraints, slew, startPointing, requests, newSolver, groups,
        reconfiguration, startConfiguration, resources);
  }

  /** A copy with another slew model. */
  public Scenario withSlew(SlewSettings newSlew) {
    return new Scenario(format, name, horizon, observer, constraints, newSlew, startPointing, requests, solver, groups,
        reconfiguration, startConfiguration, resources);
  }

  /** A copy with these resources (A6; empty: the one observer of the top level). */
  public Scenario withResources(List<Resource> newResources) {
    return new Scenario(format, name, horizon, observer, constraints, slew, startPointing, requests, solver, groups,
        reconfiguration, startConfiguration, newResources);
  }
}
