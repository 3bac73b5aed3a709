package dev.sequencer.model;

import java.util.Objects;

/**
 * One observing resource of a scenario with several (format addition A6): a telescope of a network, an
 * antenna of a station, one spacecraft of a fleet. Its {@code observer} may be {@code null} (then every
 * request carries windows and its slew model is {@code matrix} or {@code fixed}); {@code startPointing} may
 * be {@code null}. {@code constraints} replace the scenario's field by field (a request's own replace both);
 * {@code reconfiguration} replaces the scenario's change times, {@code null} when the resource gives none.
 */
public record Resource(String id, Observer observer, SlewSettings slew, Pointing startPointing,
    ConstraintOverrides constraints, Reconfiguration reconfiguration) {
  public Resource {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(slew, "slew");
    constraints = constraints == null ? ConstraintOverrides.none() : constraints;
  }
}
