package dev.sequencer.io;

import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Reads a {@code constraints} object: the scenario's (a JSON {@code null} field is absent there), or a
 * resource's (A6) or a request's own (a {@code null} field removes the inherited constraint). Checks each
 * field's range and, on the constraints that result for the level, the pairs that must be ordered
 * ({@code elevationMinDeg < elevationMaxDeg}, {@code hourAngleMinH <= hourAngleMaxH}).
 */
final class ConstraintsParser {
  /** Allowed range of each numeric field (the format's A2 table and the earlier fields' rules). */
  static final Map<ConstraintField, Range> RANGES = ranges();

  /** The note of a value inherited from the scenario's {@code constraints}. */
  static final String FROM_SCENARIO = " (from the scenario's constraints)";

  /** Constraints a level's own replace, and the note that tells where an inherited value comes from. */
  record Inherited(Constraints constraints, String note) {}

  private final Problems p;

  ConstraintsParser(Problems problems) {
    this.p = problems;
  }

  private static Map<ConstraintField, Range> ranges() {
    Map<ConstraintField, Range> m = new EnumMap<>(ConstraintField.class);
    m.put(ConstraintField.SUN_SEPARATION_MIN_DEG, Range.SEPARATION);
    m.put(ConstraintField.MOON_SEPARATION_MIN_DEG, Range.SEPARATION);
    m.put(ConstraintField.EARTH_LIMB_MIN_DEG, Range.closed(-90, 180));
    m.put(ConstraintField.ELEVATION_MIN_DEG, Range.ELEVATION);
    m.put(ConstraintField.ELEVATION_MAX_DEG, Range.ELEVATION);
    m.put(ConstraintField.SUN_ELEVATION_MAX_DEG, Range.ELEVATION);
    m.put(ConstraintField.AIRMASS_MAX, new Range(1, true, Double.POSITIVE_INFINITY, false));
    m.put(ConstraintField.HOUR_ANGLE_MIN_H, Range.closed(-12, 12));
    m.put(ConstraintField.HOUR_ANGLE_MAX_H, Range.closed(-12, 12));
    m.put(ConstraintField.MOON_ELEVATION_MAX_DEG, Range.ELEVATION);
    m.put(ConstraintField.MOON_ILLUMINATION_MAX, Range.closed(0, 1));
    m.put(ConstraintField.SUN_ELEVATION_MIN_DEG, Range.ELEVATION);
    m.put(ConstraintField.OFF_NADIR_MAX_DEG, Range.SEPARATION);
    return m;
  }

  /** The scenario's {@code constraints} (absent: none). */
  Constraints scenario(Fields top) {
    Fields c = top.object("constraints", false, ConstraintField.keys());
    if (c == null) {
      return Constraints.none();
    }
    Constraints read = read(c);
    checkOrder(c, read, ConstraintOverrides.setting(read), "");
    return read;
  }

  /**
   * A level's own {@code constraints} (a resource's or a request's; absent: none), read as overrides: a
   * {@code null} field removes the inherited constraint. The pairs that must be ordered are checked on the
   * constraints that result over each {@code inherited} level in turn, up to the first that breaks one.
   */
  ConstraintOverrides overrides(Fields owner, List<Inherited> inherited) {
    Fields c = owner.object("constraints", false, ConstraintField.keys());
    if (c == null) {
      return ConstraintOverrides.none();
    }
    Set<ConstraintField> removed = EnumSet.noneOf(ConstraintField.class);
    for (ConstraintField f : ConstraintField.values()) {
      if (c.isNull(f.key())) {
        removed.add(f);
      }
    }
    ConstraintOverrides own = new ConstraintOverrides(read(c), removed);
    for (Inherited level : inherited) {
      int before = p.count();
      checkOrder(c, level.constraints().overriddenBy(own), own, level.note());
      if (p.count() != before) {
        break;
      }
    }
    return own;
  }

  private Constraints read(Fields c) {
    ValueBuilder b = new ValueBuilder();
    for (ConstraintField f : ConstraintField.values()) {
      if (f.isBoolean()) {
        b.sunlit = c.bool(f.key(), false);
      } else {
        b.numbers.put(f, c.number(f.key(), false, RANGES.get(f)));
      }
    }
    return b.build();
  }

  /**
   * Reports an unordered pair of the effective constraints {@code e}, at the field this level gives
   * (the upper one when it gives both); {@code inheritedNote} tells where a value this level does not
   * give comes from.
   */
  private void checkOrder(Fields c, Constraints e, ConstraintOverrides own, String inheritedNote) {
    if (e.elevationMinDeg() != null && e.elevationMaxDeg() != null && !(e.elevationMinDeg() < e.elevationMaxDeg())) {
      report(c, own, ConstraintField.ELEVATION_MIN_DEG, e.elevationMinDeg(), ConstraintField.ELEVATION_MAX_DEG,
          e.elevationMaxDeg(), "greater than", "", inheritedNote);
    }
    if (e.hourAngleMinH() != null && e.hourAngleMaxH() != null && !(e.hourAngleMinH() <= e.hourAngleMaxH())) {
      report(c, own, ConstraintField.HOUR_ANGLE_MIN_H, e.hourAngleMinH(), ConstraintField.HOUR_ANGLE_MAX_H,
          e.hourAngleMaxH(), ">=", "; a range across +-12 h is not expressible", inheritedNote);
    }
  }

  private void report(Fields c, ConstraintOverrides own, ConstraintField lo, double loValue, ConstraintField hi,
      double hiValue, String relation, String why, String inheritedNote) {
    if (!own.mentions(lo) && !own.mentions(hi)) {
      return; // both inherited: reported where they were given
    }
    if (own.mentions(hi)) {
      String loFrom = own.mentions(lo) ? "" : inheritedNote;
      p.add(c.path(hi.key()), "must be " + relation + " " + lo.key() + " " + Range.num(loValue) + loFrom + " (was "
          + Range.num(hiValue) + ")" + why, Range.num(hiValue));
    } else {
      String inverse = relation.equals(">=") ? "<=" : "less than";
      p.add(c.path(lo.key()), "must be " + inverse + " " + hi.key() + " " + Range.num(hiValue) + inheritedNote
          + " (was " + Range.num(loValue) + ")" + why, Range.num(loValue));
    }
  }

  /** The fields read so far; absent and invalid ones stay null. */
  private static final class ValueBuilder {
    final Map<ConstraintField, Double> numbers = new EnumMap<>(ConstraintField.class);
    Boolean sunlit;

    Constraints build() {
      return new Constraints(
          numbers.get(ConstraintField.SUN_SEPARATION_MIN_DEG),
          numbers.get(ConstraintField.MOON_SEPARATION_MIN_DEG),
          numbers.get(ConstraintField.EARTH_LIMB_MIN_DEG),
          numbers.get(ConstraintField.ELEVATION_MIN_DEG),
          numbers.get(ConstraintField.ELEVATION_MAX_DEG),
          numbers.get(ConstraintField.SUN_ELEVATION_MAX_DEG),
          sunlit,
          numbers.get(ConstraintField.AIRMASS_MAX),
          numbers.get(ConstraintField.HOUR_ANGLE_MIN_H),
          numbers.get(ConstraintField.HOUR_ANGLE_MAX_H),
          numbers.get(ConstraintField.MOON_ELEVATION_MAX_DEG),
          numbers.get(ConstraintField.MOON_ILLUMINATION_MAX),
          numbers.get(ConstraintField.SUN_ELEVATION_MIN_DEG),
          numbers.get(ConstraintField.OFF_NADIR_MAX_DEG));
    }
  }
}
