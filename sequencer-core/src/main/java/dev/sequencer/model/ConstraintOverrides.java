package dev.sequencer.model;

import java.util.Collections;
import java.util.EnumSet;
import java.util.Objects;
import java.util.Set;

/**
 * One level's own constraint fields (a request's; later a resource's): each field {@code given} replaces
 * the inherited value, each field in {@code removed} (written as JSON {@code null}) drops it, and every
 * other field is inherited. Applied with {@link Constraints#overriddenBy}.
 *
 * @param given the fields this level sets (absent fields are {@code null} in it)
 * @param removed the fields this level removes; none of them is set in {@code given}
 */
public record ConstraintOverrides(Constraints given, Set<ConstraintField> removed) {
  private static final ConstraintOverrides NONE = new ConstraintOverrides(Constraints.none(), Set.of());

  public ConstraintOverrides {
    Objects.requireNonNull(given, "given");
    EnumSet<ConstraintField> copy = EnumSet.noneOf(ConstraintField.class);
    copy.addAll(removed);
    for (ConstraintField f : copy) {
      if (f.valueIn(given) != null) {
        throw new IllegalArgumentException(f.key() + ": both given and removed");
      }
    }
    removed = Collections.unmodifiableSet(copy);
  }

  /** Inherits everything. */
  public static ConstraintOverrides none() {
    return NONE;
  }

  /** Overrides that set these fields and remove none. */
  public static ConstraintOverrides setting(Constraints given) {
    return new ConstraintOverrides(given, Set.of());
  }

  /** True when this level neither sets nor removes anything. */
  public boolean isEmpty() {
    return removed.isEmpty() && given.equals(Constraints.none());
  }

  /** True when this level sets or removes {@code f}. */
  public boolean mentions(ConstraintField f) {
    return removed.contains(f) || f.valueIn(given) != null;
  }
}
