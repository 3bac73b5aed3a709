package dev.sequencer.model;

import java.util.List;
import java.util.Objects;

/**
 * A wanted observation.
 *
 * <p>A fixed request has {@code durationS} (0 is a pure waypoint) and {@code priority}; a flexible
 * request has {@code flexible} instead and both of those are {@code null}. {@code target} is
 * {@code null} only when the scenario has no observer. {@code windows} is empty when the file gives none
 * (then only the computed visibility limits the request). {@code constraints} holds the request's own
 * constraint fields, applied over the scenario's by {@link Scenario#constraintsFor}; never null
 * ({@link ConstraintOverrides#none()} when the file gives none). {@code visits} (A4) is {@link Visits#ONCE}
 * when the file gives none; {@code configuration} (A5) is the instrument set-up label, {@code ""} by default;
 * {@code resources} (A6) the resources allowed to observe it, empty for all.
 */
public record Request(
    String id,
    Target target,
    Double durationS,
    Double priority,
    boolean required,
    List<TimeWindow> windows,
    FlexibleExposure flexible,
    ConstraintOverrides constraints,
    Visits visits,
    String configuration,
    List<String> resources) {
  public Request {
    resources = resources == null ? List.of() : List.copyOf(resources);
    Objects.requireNonNull(id, "id");
    Checks.finiteOrNull("durationS", durationS);
    Checks.finiteOrNull("priority", priority);
    windows = List.copyOf(windows);
    constraints = constraints == null ? ConstraintOverrides.none() : constraints;
    visits = visits == null ? Visits.ONCE : visits;
    configuration = configuration == null ? "" : configuration;
  }

  /** A request any resource may observe (A6). */
  public Request(String id, Target target, Double durationS, Double priority, boolean required,
      List<TimeWindow> windows, FlexibleExposure flexible, ConstraintOverrides constraints, Visits visits,
      String configuration) {
    this(id, target, durationS, priority, required, windows, flexible, constraints, visits, configuration, List.of());
  }

  /** A request observed once, in the default configuration. */
  public Request(String id, Target target, Double durationS, Double priority, boolean required,
      List<TimeWindow> windows, FlexibleExposure flexible, ConstraintOverrides constraints) {
    this(id, target, durationS, priority, required, windows, flexible, constraints, Visits.ONCE, "");
  }

  /** A request with no constraints of its own (it inherits the scenario's). */
  public Request(String id, Target target, Double durationS, Double priority, boolean required,
      List<TimeWindow> windows, FlexibleExposure flexible) {
    this(id, target, durationS, priority, required, windows, flexible, ConstraintOverrides.none());
  }

  /** A fixed-duration request with no explicit windows. */
  public static Request of(String id, Target target, double durationS, double priority) {
    return new Request(id, target, durationS, priority, false, List.of(), null, ConstraintOverrides.none());
  }

  /** A copy with these allowed windows. */
  public Request withWindows(List<TimeWindow> newWindows) {
    return new Request(id, target, durationS, priority, required, newWindows, flexible, constraints, visits,
        configuration, resources);
  }

  /** A copy with the required flag set. */
  public Request withRequired(boolean newRequired) {
    return new Request(id, target, durationS, priority, newRequired, windows, flexible, constraints, visits,
        configuration, resources);
  }

  /** A copy with these constraint fields of its own. */
  public Request withConstraints(ConstraintOverrides newConstraints) {
    return new Request(id, target, durationS, priority, required, windows, flexible, newConstraints, visits,
        configuration, resources);
  }

  /** A copy with these visits (A4). */
  public Request withVisits(Visits newVisits) {
    return new Request(id, target, durationS, priority, required, windows, flexible, constraints, newVisits,
        configuration, resources);
  }

  /** A copy with this configuration label (A5). */
  public Request withConfiguration(String newConfiguration) {
    return new Request(id, target, durationS, priority, required, windows, flexible, constraints, visits,
        newConfiguration, resources);
  }

  /** A copy with these allowed resources (A6; empty: all). */
  public Request withResources(List<String> newResources) {
    return new Request(id, target, durationS, priority, required, windows, flexible, constraints, visits,
        configuration, newResources);
  }

  /** True when resource {@code id} may observe this request (A6). */
  public boolean allows(String resourceId) {
    return resources.isEmpty() || resources.contains(resourceId);
  }

  /** True when the request asks for more than one visit (A4). */
  public boolean hasVisits() {
    return visits.count() > 1 || visits.allOrNothing();
  }

  /** True for the flexible-exposure extension. */
  public boolean isFlexible() {
    return flexible != null;
  }

  /** Shortest time the request occupies: its duration, or the flexible minimum. */
  public double minDurationS() {
    return isFlexible() ? flexible.minDurationS() : durationS;
  }
}
