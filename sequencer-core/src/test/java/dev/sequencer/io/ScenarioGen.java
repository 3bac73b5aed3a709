package dev.sequencer.io;

import dev.sequencer.model.AzEl;
import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Refraction;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.Observer;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.Pointing;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Reconfiguration;
import dev.sequencer.model.Request;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.SolverSettings;
import dev.sequencer.model.Target;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Tle;
import dev.sequencer.model.UtilityPoint;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Collections;
import java.util.EnumSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import java.util.TreeSet;

/**
 * Random valid scenarios for the properties: every observer kind, target kind, slew model and optional
 * part, one observer or several resources (A6), with values at the edges of their ranges part of the time.
 * Invented data only.
 */
final class ScenarioGen {
  /** Every configuration label of the resource scenarios; each change-time table lists all of them. */
  static final List<String> LABELS = List.of("", "red", "blue");

  private final Random r;

  ScenarioGen(Random random) {
    this.r = random;
  }

  enum Kind { NONE, GROUND, ORBIT_TLE, ORBIT_KEPLER }

  /** A scenario with one observer (or none): no {@code resources}. */
  Scenario scenario() {
    TimeWindow horizon = horizon();
    Kind kind = Kind.values()[r.nextInt(4)];
    Observer observer = observer(kind, horizon);
    int n = 1 + r.nextInt(6);
    SlewSettings slew = slew(kind, n);
    List<Request> requests = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      requests.add(request("R" + (i + 1) + (r.nextBoolean() ? "" : "-é\"x"), kind, horizon));
    }
    return new Scenario(1, r.nextBoolean() ? null : "night " + r.nextInt(100), horizon, observer, constraints(),
        slew, startPointing(kind, slew), requests, solver());
  }

  /**
   * A scenario with 1 to 3 resources (A6) of any observer kind, each with its own slew (a matrix over every
   * request), sometimes a start pointing, constraints of its own and change times; requests may be restricted
   * to some resources, always to resources they are valid for, and use the configurations of {@link #LABELS}.
   */
  Scenario resourceScenario() {
    TimeWindow horizon = horizon();
    int n = 1 + r.nextInt(6);
    List<Resource> resources = new ArrayList<>();
    List<Kind> kinds = new ArrayList<>();
    for (String id : List.of("north", "south", "queue").subList(0, 1 + r.nextInt(3))) {
      Kind kind = Kind.values()[r.nextInt(4)];
      SlewSettings slew = slew(kind, n);
      kinds.add(kind);
      resources.add(new Resource(id + (r.nextBoolean() ? "" : "-é\"x"), observer(kind, horizon), slew,
          startPointing(kind, slew), ownConstraints(), r.nextBoolean() ? null : reconfiguration()));
    }
    List<Request> requests = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      List<Integer> allowed = allowed(kinds);
      Kind kind = targetKind(allowed.stream().map(kinds::get).toList());
      List<String> ids = allowed.stream().map(k -> resources.get(k).id()).toList();
      boolean all = allowed.size() == resources.size();
      requests.add(request("R" + (i + 1), kind, horizon).withConfiguration(LABELS.get(r.nextInt(LABELS.size())))
          .withResources(all && r.nextBoolean() ? List.of() : ids));
    }
    return new Scenario(1, r.nextBoolean() ? null : "network " + r.nextInt(100), horizon, null, constraints(),
        resources.get(0).slew(), null, requests, solver(), List.of(), r.nextBoolean() ? null : reconfiguration(),
        LABELS.get(r.nextInt(LABELS.size())), resources);
  }

  /**
   * The indices of the resources allowed to observe a request, in random order: a random non-empty subset,
   * kept to those without an observer or to those with one (a request cannot be valid for both).
   */
  private List<Integer> allowed(List<Kind> kinds) {
    List<Integer> all = new ArrayList<>();
    for (int k = 0; k < kinds.size(); k++) {
      all.add(k);
    }
    Collections.shuffle(all, r);
    List<Integer> subset = new ArrayList<>(all.subList(0, 1 + r.nextInt(all.size())));
    boolean none = kinds.get(subset.get(0)) == Kind.NONE;
    subset.removeIf(k -> (kinds.get(k) == Kind.NONE) != none);
    return subset;
  }

  /** The observer kind a request's target must suit: none, a ground site if any, else an orbit. */
  private static Kind targetKind(List<Kind> allowed) {
    if (allowed.contains(Kind.NONE)) {
      return Kind.NONE;
    }
    return allowed.contains(Kind.GROUND) ? Kind.GROUND : Kind.ORBIT_TLE;
  }

  /** A constant change time, or a table over {@link #LABELS} in random order (0 on the diagonal). */
  private Reconfiguration reconfiguration() {
    if (r.nextBoolean()) {
      return Reconfiguration.constant(nonNegative(), r.nextBoolean());
    }
    List<String> labels = new ArrayList<>(LABELS);
    Collections.shuffle(labels, r);
    double[][] table = new double[labels.size()][labels.size()];
    for (int i = 0; i < labels.size(); i++) {
      for (int j = 0; j < labels.size(); j++) {
        table[i][j] = i == j ? 0 : nonNegative();
      }
    }
    return new Reconfiguration(labels, 0, table, r.nextBoolean());
  }

  private TimeWindow horizon() {
    Instant start = Instant.parse("2026-01-01T00:00:00Z").plusSeconds(r.nextInt(3650 * 86_400));
    if (r.nextBoolean()) {
      start = start.plusMillis(1 + r.nextInt(999));
    }
    Instant end = start.plusSeconds(3600 + r.nextInt(3 * 86_400));
    if (r.nextInt(4) == 0) {
      end = end.plusNanos(1 + r.nextInt(999_999_999));
    }
    return new TimeWindow(start, end);
  }

  private Observer observer(Kind kind, TimeWindow horizon) {
    switch (kind) {
      case GROUND: {
        List<AzEl> mask = new ArrayList<>();
        for (int i = r.nextInt(4); i > 0; i--) {
          mask.add(new AzEl(closed(0, 360), closed(-90, 90)));
        }
        Refraction refraction = r.nextBoolean() ? null : new Refraction(closed(0, 1200), closed(-90, 60));
        return new GroundSite(closed(-90, 90), halfOpen(-180, 360), closed(-1000, 10000), mask, refraction);
      }
      case ORBIT_TLE:
        return new OrbitObserver(tle(90001 + r.nextInt(9000), horizon));
      case ORBIT_KEPLER: {
        double e = halfOpen(0, 0.05);
        return new OrbitObserver(new KeplerianElements(horizon.start().minusSeconds(r.nextInt(86_400)),
            6378.137 / (1 - e) + 1 + r.nextDouble() * 40_000, e, closed(0, 180), any(), any(), any()));
      }
      default:
        return null;
    }
  }

  private Tle tle(int satnum, TimeWindow horizon) {
    List<String> lines = TestTles.tle(satnum, horizon.start().minusSeconds(r.nextInt(20 * 86_400)));
    return new Tle(lines.get(0), lines.get(1));
  }

  private Constraints constraints() {
    Constraints.Builder b = Constraints.builder();
    if (r.nextBoolean()) {
      b.sunSeparationMinDeg(closed(0, 180));
    }
    if (r.nextBoolean()) {
      b.moonSeparationMinDeg(closed(0, 180));
    }
    if (r.nextBoolean()) {
      b.earthLimbMinDeg(closed(-90, 180));
    }
    if (r.nextBoolean()) {
      double lo = halfOpen(-90, 90);
      b.elevationMinDeg(lo).elevationMaxDeg(lo + (90 - lo) * (0.01 + 0.99 * r.nextDouble()));
    } else if (r.nextBoolean()) {
      b.elevationMinDeg(closed(-90, 90));
    }
    if (r.nextBoolean()) {
      b.sunElevationMaxDeg(closed(-90, 90));
    }
    if (r.nextBoolean()) {
      b.targetSunlitRequired(r.nextBoolean());
    }
    addA2(b);
    return b.build();
  }

  /** The A2 fields, each present half of the time; the hour-angle pair ordered when both are given. */
  private void addA2(Constraints.Builder b) {
    if (r.nextBoolean()) {
      b.airmassMax(r.nextInt(4) == 0 ? 1.0 : 1 + 4 * r.nextDouble());
    }
    if (r.nextBoolean()) {
      double lo = closed(-12, 12);
      b.hourAngleMinH(lo).hourAngleMaxH(lo + (12 - lo) * r.nextDouble());
    } else if (r.nextBoolean()) {
      b.hourAngleMaxH(closed(-12, 12));
    }
    if (r.nextBoolean()) {
      b.moonElevationMaxDeg(closed(-90, 90));
    }
    if (r.nextBoolean()) {
      b.moonIlluminationMax(closed(0, 1));
    }
    if (r.nextBoolean()) {
      b.sunElevationMinDeg(closed(-90, 90));
    }
    if (r.nextBoolean()) {
      b.offNadirMaxDeg(closed(0, 180));
    }
  }

  /**
   * A request's own constraints (a third of the requests): some fields replaced, some removed. The ordered
   * pairs are only removed or given together, so any scenario level keeps them ordered.
   */
  private ConstraintOverrides ownConstraints() {
    if (r.nextInt(3) != 0) {
      return ConstraintOverrides.none();
    }
    Constraints.Builder b = Constraints.builder();
    if (r.nextBoolean()) {
      b.sunSeparationMinDeg(closed(0, 180));
    }
    if (r.nextBoolean()) {
      b.targetSunlitRequired(r.nextBoolean());
    }
    addA2(b);
    Constraints given = b.build();
    Set<ConstraintField> removed = EnumSet.noneOf(ConstraintField.class);
    for (ConstraintField f : ConstraintField.values()) {
      if (f.valueIn(given) == null && r.nextInt(6) == 0) {
        removed.add(f);
      }
    }
    if (given.hourAngleMinH() == null || given.hourAngleMaxH() == null) {
      // Give the pair together or not at all: a lone bound could cross the scenario's other bound.
      given = given.overriddenBy(new ConstraintOverrides(Constraints.none(),
          EnumSet.of(ConstraintField.HOUR_ANGLE_MIN_H, ConstraintField.HOUR_ANGLE_MAX_H)));
    }
    return new ConstraintOverrides(given, removed);
  }

  private SlewSettings slew(Kind kind, int n) {
    List<String> models = switch (kind) {
      case NONE -> List.of("fixed", "matrix");
      case GROUND -> List.of("eigenaxis", "altaz", "fixed", "matrix");
      default -> List.of("eigenaxis", "fixed", "matrix");
    };
    switch (models.get(r.nextInt(models.size()))) {
      case "eigenaxis":
        return new SlewSettings.Eigenaxis(positive(), positive(), nonNegative(), r.nextInt(4) != 0);
      case "altaz": {
        List<Double> range = null;
        if (r.nextBoolean()) {
          double min = -360 + r.nextInt(361);
          range = List.of(min, min + 360 + (r.nextBoolean() ? 0 : r.nextDouble() * 180));
        }
        return new SlewSettings.AltAz(positive(), positive(), positive(), positive(), nonNegative(), range,
            r.nextInt(4) != 0);
      }
      case "fixed":
        return new SlewSettings.Fixed(nonNegative());
      default: {
        List<List<Double>> rows = new ArrayList<>();
        for (int i = 0; i < n; i++) {
          List<Double> row = new ArrayList<>();
          for (int j = 0; j < n; j++) {
            row.add(i == j ? 0.0 : nonNegative());
          }
          rows.add(row);
        }
        List<Double> fromStart = null;
        if (r.nextBoolean()) {
          fromStart = new ArrayList<>();
          for (int j = 0; j < n; j++) {
            fromStart.add(nonNegative());
          }
        }
        return new SlewSettings.Matrix(rows, fromStart);
      }
    }
  }

  private Pointing startPointing(Kind kind, SlewSettings slew) {
    int pick = r.nextInt(3);
    if (pick == 0) {
      return null;
    }
    if (pick == 1 || kind != Kind.GROUND) {
      return new RaDec(halfOpen(0, 360), closed(-90, 90));
    }
    double az = halfOpen(0, 360);
    if (slew instanceof SlewSettings.AltAz a && a.azimuthRangeDeg() != null) {
      az = closed(a.azimuthRangeDeg().get(0), a.azimuthRangeDeg().get(1));
    }
    return new AzElPointing(az, closed(-90, 90));
  }

  private Request request(String id, Kind kind, TimeWindow horizon) {
    Target target = switch (kind) {
      case NONE -> null;
      case GROUND -> r.nextInt(3) == 0 ? new OrbitingTarget(tle(90001 + r.nextInt(9000), horizon)) : raDec();
      default -> switch (r.nextInt(3)) {
        case 0 -> new OrbitingTarget(tle(90001 + r.nextInt(9000), horizon));
        case 1 -> new EarthPoint(closed(-90, 90), halfOpen(-180, 360), closed(-1000, 10000));
        default -> raDec();
      };
    };
    List<TimeWindow> windows = kind == Kind.NONE || r.nextBoolean() ? windows(horizon) : List.of();
    boolean required = r.nextInt(4) == 0;
    ConstraintOverrides own = kind == Kind.NONE ? ConstraintOverrides.none() : ownConstraints();
    if (r.nextInt(3) == 0) {
      return new Request(id, target, null, null, required, windows, flexible(), own);
    }
    return new Request(id, target, r.nextInt(5) == 0 ? 0.0 : nonNegative(), positive(), required, windows, null,
        own);
  }

  private RaDec raDec() {
    return new RaDec(halfOpen(0, 360), closed(-90, 90));
  }

  private FlexibleExposure flexible() {
    double min = r.nextInt(4) == 0 ? 0 : r.nextInt(3600);
    double max = r.nextInt(5) == 0 ? min : min + 1 + r.nextDouble() * 7200;
    List<UtilityPoint> utility = new ArrayList<>();
    utility.add(new UtilityPoint(min, nonNegative()));
    if (max > min) {
      TreeSet<Double> inner = new TreeSet<>();
      for (int i = r.nextInt(3); i > 0; i--) {
        double s = min + (max - min) * r.nextDouble();
        if (s > min && s < max) {
          inner.add(s);
        }
      }
      inner.forEach(s -> utility.add(new UtilityPoint(s, nonNegative())));
      utility.add(new UtilityPoint(max, nonNegative()));
    }
    double step = r.nextBoolean() ? FlexibleExposure.DEFAULT_STEP_S : positive();
    return new FlexibleExposure(min, max, step, utility);
  }

  /** 1 to 3 ordered windows, apart, inside the horizon, edges on milliseconds. */
  private List<TimeWindow> windows(TimeWindow horizon) {
    long spanMs = (long) (horizon.durationS() * 1000);
    int k = 1 + r.nextInt(3);
    TreeSet<Long> cuts = new TreeSet<>();
    while (cuts.size() < 2 * k) {
      cuts.add((long) (r.nextDouble() * spanMs));
    }
    List<Long> c = new ArrayList<>(cuts);
    List<TimeWindow> out = new ArrayList<>();
    for (int i = 0; i < k; i++) {
      out.add(new TimeWindow(horizon.start().plusMillis(c.get(2 * i)), horizon.start().plusMillis(c.get(2 * i + 1))));
    }
    return out;
  }

  private SolverSettings solver() {
    if (r.nextBoolean()) {
      return null;
    }
    return new SolverSettings(positive(), r.nextInt(9), r.nextInt());
  }

  /** Uniform in [lo, hi], hitting each end a tenth of the time. */
  private double closed(double lo, double hi) {
    int pick = r.nextInt(10);
    return pick == 0 ? lo : pick == 1 ? hi : lo + (hi - lo) * r.nextDouble();
  }

  /** Uniform in [lo, hi), hitting lo a tenth of the time. */
  private double halfOpen(double lo, double hi) {
    double v = r.nextInt(10) == 0 ? lo : lo + (hi - lo) * r.nextDouble();
    return v < hi ? v : lo;
  }

  private double positive() {
    return switch (r.nextInt(4)) {
      case 0 -> Double.MIN_VALUE * (1 + r.nextInt(10));
      case 1 -> 1 + r.nextInt(100);
      default -> 1e-3 + r.nextDouble() * 1e3;
    };
  }

  private double nonNegative() {
    return r.nextInt(5) == 0 ? (r.nextBoolean() ? 0.0 : -0.0) : positive();
  }

  private double any() {
    return r.nextInt(5) == 0 ? -r.nextDouble() * 1000 : r.nextDouble() * 360;
  }
}
