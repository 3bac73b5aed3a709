package dev.sequencer.validate;

import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.validate.Violation.Kind;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.util.FastMath;
import org.orekit.frames.Frame;
import org.orekit.frames.TopocentricFrame;
import org.orekit.bodies.GeodeticPoint;
import org.orekit.time.AbsoluteDate;
import org.orekit.time.TimeScalarFunction;
import org.orekit.utils.IERSConventions;

/**
 * Every constraint of the scenario re-computed at an observation's own instants, from the physics
 * ({@link Sky}) and the format's definition of each constraint, each request's own constraints applied over
 * the scenario's (A2). No visibility window, grid, interpolation or root of the engine is used.
 *
 * <p><b>Where.</b> The start, the end and every {@link #STEP_S} seconds between; then, for each constraint,
 * every sample that is a local minimum of its margin among its neighbours is refined by a golden-section
 * search over the two steps around it ({@link #REFINE_ITERATIONS} steps, to about 1 ms), so a dip between
 * samples is found when it shows at a sample as a local minimum. 5 s: the fastest line of sight a scenario
 * can have (an Earth point seen from LEO, or a LEO object from the ground, about 1°/s) moves 5° between
 * samples, over which every margin here (angles between smooth directions) is close to linear or has one
 * extremum, which the refinement finds. A dip that is narrower than a step and shows at no sample as a local
 * minimum is not looked for.
 *
 * <p><b>Margins</b> are in degrees (>= 0 when the constraint holds): airmass as degrees of elevation (the
 * shortfall over the slope of the Kasten-Young formula), hour angle as degrees of hour angle (15° per hour),
 * Moon illumination as degrees of phase angle beyond the angle where the illuminated fraction reaches its
 * limit (when the Moon is up). The violation reports the quantity itself and its limit, in the kind's unit.
 *
 * <p><b>Tolerance.</b> A margin may fall short by {@link #TOLERANCE_DEG} plus {@link #EDGE_S} seconds of its
 * own rate of change there (measured ±0.5 s around the instant): the planner's window edges are exact to
 * about 0.05 s against its own engine, and the two independent computations differ by well under 0.0001°
 * (aberration formulas, propagator set-ups). An observation moved 2 s across a window edge is therefore
 * rejected whenever its constraint changes by more than 0.0001° in 1.75 s.
 */
final class ObservationCheck {
  /** Sampling step inside an observation, seconds. */
  static final double STEP_S = 5.0;
  /** Allowed shortfall of a margin beyond the edge allowance, degrees. */
  static final double TOLERANCE_DEG = 1e-4;
  /** Edge accuracy the tolerance allows for, seconds. */
  static final double EDGE_S = 0.25;
  static final int REFINE_ITERATIONS = 14;
  private static final double GOLDEN = (Math.sqrt(5) - 1) / 2;

  /** The constraint kinds this check measures, in the order of the arrays below. */
  private static final Kind[] KINDS = {Kind.ELEVATION_MIN, Kind.ELEVATION_MAX, Kind.AIRMASS, Kind.HOUR_ANGLE,
      Kind.SUN_SEPARATION, Kind.MOON_SEPARATION, Kind.MOON_ELEVATION, Kind.MOON_ILLUMINATION, Kind.SUN_ELEVATION_MAX,
      Kind.SUN_ELEVATION_MIN, Kind.EARTH_LIMB, Kind.OFF_NADIR, Kind.TARGET_SUNLIT};
  private static final int N = KINDS.length;

  private final Sky sky;
  private final Frame gcrf;
  /** Greenwich apparent sidereal time, radians (Orekit, IERS 2010; UT1 from the context's EOP, if any). */
  private final TimeScalarFunction gast;

  ObservationCheck(Sky sky) {
    this.sky = sky;
    this.gcrf = sky.ctx().inertial();
    this.gast = IERSConventions.IERS_2010.getGASTFunction(
        sky.ctx().timeScales().getUT1(IERSConventions.IERS_2010, true),
        sky.ctx().dataContext().getFrames().getEOPHistory(IERSConventions.IERS_2010, true), sky.ctx().timeScales());
  }

  /** The state of every constraint at one instant: margin (deg), quantity and limit (NaN where none applies). */
  static final class Sample {
    final double[] margin = new double[N];
    final double[] value = new double[N];
    final double[] limit = new double[N];
    /** For ELEVATION_MIN: true when the horizon mask is the binding floor. */
    boolean maskBinds;

    Sample() {
      Arrays.fill(margin, Double.NaN);
      Arrays.fill(value, Double.NaN);
      Arrays.fill(limit, Double.NaN);
    }

    void put(Kind k, double marginDeg, double v, double lim) {
      int i = index(k);
      margin[i] = marginDeg;
      value[i] = v;
      limit[i] = lim;
    }
  }

  private static int index(Kind k) {
    for (int i = 0; i < N; i++) {
      if (KINDS[i] == k) {
        return i;
      }
    }
    throw new IllegalArgumentException(k.toString());
  }

  /** The first violated constraint of {@code r} observed over [start, end], at most one; empty when none. */
  List<Violation> violations(Request r, Instant start, Instant end) {
    List<Violation> out = new ArrayList<>();
    if (!sky.hasObserver() || r.target() == null) {
      return out; // no geometry: only the request's own windows apply, checked by the validator
    }
    Constraints c = sky.scenario().constraintsFor(r);
    AbsoluteDate t0 = sky.date(start);
    double length = sky.date(end).durationFrom(t0);
    int n = Math.max(1, (int) Math.ceil(length / STEP_S));
    double[] times = new double[n + 1];
    Sample[] samples = new Sample[n + 1];
    for (int i = 0; i <= n; i++) {
      times[i] = Math.min(length, i * length / n);
      samples[i] = sample(r, c, t0.shiftedBy(times[i]));
      Violation v = firstViolation(r, c, t0, times[i], samples[i]);
      if (v != null) {
        out.add(v);
        return out; // one violation per observation is enough to reject it
      }
    }
    // Refine each margin's local minima among the samples.
    for (int k = 0; k < N; k++) {
      for (int i = 1; i < n; i++) {
        double m = samples[i].margin[k];
        if (Double.isNaN(m) || !(m <= samples[i - 1].margin[k]) || !(m <= samples[i + 1].margin[k])) {
          continue;
        }
        double tMin = refineMinimum(r, c, t0, k, times[i - 1], times[i + 1]);
        Sample s = sample(r, c, t0.shiftedBy(tMin));
        Violation v = firstViolation(r, c, t0, tMin, s);
        if (v != null) {
          out.add(v);
          return out;
        }
      }
    }
    return out;
  }

  /** Golden-section search for the minimum of margin {@code k} over [a, b] seconds from t0. */
  private double refineMinimum(Request r, Constraints c, AbsoluteDate t0, int k, double a, double b) {
    double x1 = b - GOLDEN * (b - a);
    double x2 = a + GOLDEN * (b - a);
    double f1 = sample(r, c, t0.shiftedBy(x1)).margin[k];
    double f2 = sample(r, c, t0.shiftedBy(x2)).margin[k];
    for (int it = 0; it < REFINE_ITERATIONS; it++) {
      if (f1 <= f2) {
        b = x2;
        x2 = x1;
        f2 = f1;
        x1 = b - GOLDEN * (b - a);
        f1 = sample(r, c, t0.shiftedBy(x1)).margin[k];
      } else {
        a = x1;
        x1 = x2;
        f1 = f2;
        x2 = a + GOLDEN * (b - a);
        f2 = sample(r, c, t0.shiftedBy(x2)).margin[k];
      }
    }
    return f1 <= f2 ? x1 : x2;
  }

  /** The first margin of {@code s} below its tolerance, as a violation; null when all hold. */
  private Violation firstViolation(Request r, Constraints c, AbsoluteDate t0, double tS, Sample s) {
    for (int k = 0; k < N; k++) {
      double m = s.margin[k];
      if (Double.isNaN(m) || m >= -TOLERANCE_DEG) {
        continue;
      }
      double before = sample(r, c, t0.shiftedBy(tS - 0.5)).margin[k];
      double after = sample(r, c, t0.shiftedBy(tS + 0.5)).margin[k];
      double rate = Math.abs(after - before);
      if (m >= -(TOLERANCE_DEG + rate * EDGE_S)) {
        continue;
      }
      Kind kind = KINDS[k] == Kind.ELEVATION_MIN && s.maskBinds ? Kind.HORIZON_MASK : KINDS[k];
      AbsoluteDate at = t0.shiftedBy(tS);
      return Violation.of(kind, r.id(), sky.instant(at), s.value[k], s.limit[k], String.format(Locale.ROOT,
          "observation %s at %s: %s violated by %.4f deg", r.id(), sky.instant(at), words(kind), -m));
    }
    return null;
  }

  static String words(Kind k) {
    return switch (k) {
      case ELEVATION_MIN -> "elevation";
      case HORIZON_MASK -> "horizon mask";
      case ELEVATION_MAX -> "elevation max";
      case AIRMASS -> "airmass";
      case HOUR_ANGLE -> "hour angle";
      case SUN_SEPARATION -> "Sun separation";
      case MOON_SEPARATION -> "Moon separation";
      case MOON_ELEVATION -> "Moon elevation";
      case MOON_ILLUMINATION -> "Moon illumination";
      case SUN_ELEVATION_MAX -> "darkness";
      case SUN_ELEVATION_MIN -> "daylight";
      case EARTH_LIMB -> "Earth limb";
      case OFF_NADIR -> "off-nadir";
      case TARGET_SUNLIT -> "target sunlit";
      default -> k.name();
    };
  }

  /** Every applicable constraint of request {@code r} (constraints {@code c}) at {@code t}. */
  Sample sample(Request r, Constraints c, AbsoluteDate t) {
    Sample s = new Sample();
    Vector3D obs = sky.observer(t);
    Vector3D target = sky.targetPosition(r, t); // null for a direction
    Vector3D los = target == null ? sky.apparent((RaDec) r.target(), t) : target.subtract(obs).normalize();
    Vector3D sun = sky.sun(t);
    Vector3D moon = sky.moon(t);
    if (c.sunSeparationMinDeg() != null) {
      double sep = FastMath.toDegrees(Vector3D.angle(los, sun.subtract(obs)));
      s.put(Kind.SUN_SEPARATION, sep - c.sunSeparationMinDeg(), sep, c.sunSeparationMinDeg());
    }
    if (c.moonSeparationMinDeg() != null) {
      double sep = FastMath.toDegrees(Vector3D.angle(los, moon.subtract(obs)));
      s.put(Kind.MOON_SEPARATION, sep - c.moonSeparationMinDeg(), sep, c.moonSeparationMinDeg());
    }
    if (sky.ground() != null) {
      siteSample(s, c, r, t, los, sun, moon);
    } else if (r.target() instanceof EarthPoint ep) {
      TopocentricFrame point = new TopocentricFrame(sky.ctx().earth(), new GeodeticPoint(
          FastMath.toRadians(ep.latitudeDeg()), FastMath.toRadians(ep.longitudeDeg()), ep.altitudeM()), "point");
      double elMin = c.elevationMinDeg() != null ? c.elevationMinDeg() : 0.0;
      double el = FastMath.toDegrees(point.getElevation(obs, gcrf, t));
      s.put(Kind.ELEVATION_MIN, el - elMin, el, elMin);
      double sunEl = FastMath.toDegrees(point.getElevation(sun, gcrf, t));
      if (c.sunElevationMaxDeg() != null) {
        s.put(Kind.SUN_ELEVATION_MAX, c.sunElevationMaxDeg() - sunEl, sunEl, c.sunElevationMaxDeg());
      }
      if (c.sunElevationMinDeg() != null) {
        s.put(Kind.SUN_ELEVATION_MIN, sunEl - c.sunElevationMinDeg(), sunEl, c.sunElevationMinDeg());
      }
      if (c.offNadirMaxDeg() != null) {
        double off = FastMath.toDegrees(Vector3D.angle(los, obs.negate()));
        s.put(Kind.OFF_NADIR, c.offNadirMaxDeg() - off, off, c.offNadirMaxDeg());
      }
    } else if (c.earthLimbMinDeg() != null) {
      double limb = FastMath.toDegrees(earthLimbRad(los, obs));
      s.put(Kind.EARTH_LIMB, limb - c.earthLimbMinDeg(), limb, c.earthLimbMinDeg());
    }
    if (r.target() instanceof OrbitingTarget && c.sunlitRequired()) {
      Vector3D toEarth = target.negate();
      Vector3D toSun = sun.subtract(target);
      double umbra = FastMath.asin(Sky.EARTH_RADIUS_M / toEarth.getNorm()) - FastMath.asin(Sky.SUN_RADIUS_M / toSun.getNorm());
      double beyond = FastMath.toDegrees(Vector3D.angle(toEarth, toSun) - umbra);
      s.put(Kind.TARGET_SUNLIT, beyond, beyond, 0);
    }
    return s;
  }

  /** Earth-limb clearance of a line of sight from {@code obs}, radians (the format's spherical Earth). */
  static double earthLimbRad(Vector3D los, Vector3D obs) {
    return Vector3D.angle(los, obs.negate()) - FastMath.asin(Sky.EARTH_RADIUS_M / obs.getNorm());
  }

  /** The constraints that apply at a ground site. */
  private void siteSample(Sample s, Constraints c, Request r, AbsoluteDate t, Vector3D los, Vector3D sun,
      Vector3D moon) {
    GroundSite g = sky.ground();
    TopocentricFrame site = sky.siteFrame();
    double[] azEl = sky.azEl(los, t);
    // The target elevation the elevation limits, the mask and the airmass use: refracted when the site gives
    // refraction (the format's A1).
    double el = g.observedElevationDeg(azEl[1]);
    double limitMin = c.elevationMinDeg() != null ? c.elevationMinDeg() : 0.0;
    double mask = g.horizonMask().isEmpty() ? Double.NEGATIVE_INFINITY : g.maskElevationDeg(azEl[0]);
    double floor = g.horizonMask().isEmpty() ? limitMin
        : c.elevationMinDeg() != null ? Math.max(c.elevationMinDeg(), mask) : mask;
    s.put(Kind.ELEVATION_MIN, el - floor, el, floor);
    s.maskBinds = mask > limitMin || (c.elevationMinDeg() == null && !g.horizonMask().isEmpty());
    if (c.elevationMaxDeg() != null) {
      s.put(Kind.ELEVATION_MAX, c.elevationMaxDeg() - el, el, c.elevationMaxDeg());
    }
    if (c.airmassMax() != null) {
      s.put(Kind.AIRMASS, airmassMarginDeg(el, c.airmassMax()), el > 0 ? kastenYoung(el) : Double.POSITIVE_INFINITY,
          c.airmassMax());
    }
    double sunEl = FastMath.toDegrees(site.getElevation(sun, gcrf, t));
    if (c.sunElevationMaxDeg() != null) {
      s.put(Kind.SUN_ELEVATION_MAX, c.sunElevationMaxDeg() - sunEl, sunEl, c.sunElevationMaxDeg());
    }
    if (c.sunElevationMinDeg() != null) {
      s.put(Kind.SUN_ELEVATION_MIN, sunEl - c.sunElevationMinDeg(), sunEl, c.sunElevationMinDeg());
    }
    double moonEl = FastMath.toDegrees(site.getElevation(moon, gcrf, t));
    if (c.moonElevationMaxDeg() != null) {
      s.put(Kind.MOON_ELEVATION, c.moonElevationMaxDeg() - moonEl, moonEl, c.moonElevationMaxDeg());
    }
    if (c.moonIlluminationMax() != null) {
      // Holds when the Moon is down, or when k = (1 + cos i) / 2 <= max, i.e. i >= acos(2 max - 1).
      double phase = Vector3D.angle(sun.subtract(moon), moon.negate());
      double minPhaseDeg = FastMath.toDegrees(FastMath.acos(2 * c.moonIlluminationMax() - 1));
      s.put(Kind.MOON_ILLUMINATION, Math.max(-moonEl, FastMath.toDegrees(phase) - minPhaseDeg),
          (1 + FastMath.cos(phase)) / 2, c.moonIlluminationMax());
    }
    if (r.target() instanceof RaDec rd && (c.hourAngleMinH() != null || c.hourAngleMaxH() != null)) {
      double ha = hourAngleH(rd, t, g.longitudeDeg());
      double min = c.hourAngleMinH() != null ? c.hourAngleMinH() : -12.0;
      double max = c.hourAngleMaxH() != null ? c.hourAngleMaxH() : 12.0;
      s.put(Kind.HOUR_ANGLE, 15 * Math.min(ha - min, max - ha), ha, ha - min < max - ha ? min : max);
    }
  }

  /**
   * The format's airmass (Kasten and Young 1989) against its limit, as degrees of elevation to first order:
   * (max - X(h)) / |dX/dh|; at or below the horizon, the elevation itself (the rule h > 0).
   */
  static double airmassMarginDeg(double elevationDeg, double airmassMax) {
    if (elevationDeg <= 0) {
      return elevationDeg;
    }
    double x = kastenYoung(elevationDeg);
    double slopePerDeg = Math.abs(kastenYoung(elevationDeg + 1e-4) - kastenYoung(elevationDeg - 1e-4)) / 2e-4;
    return (airmassMax - x) / Math.max(slopePerDeg, 1e-9);
  }

  static double kastenYoung(double hDeg) {
    return 1 / (FastMath.sin(FastMath.toRadians(hDeg)) + 0.50572 * FastMath.pow(hDeg + 6.07995, -1.6364));
  }

  /**
   * Local hour angle in hours, wrapped to [-12, 12): GAST + east longitude - right ascension on the true
   * equator and equinox of date (Orekit's TOD frame), of the apparent direction (the format's A2: apparent
   * right ascension of date).
   */
  private double hourAngleH(RaDec rd, AbsoluteDate t, double longitudeDeg) {
    Vector3D ofDate = gcrf.getStaticTransformTo(sky.ctx().dataContext().getFrames().getTOD(IERSConventions.IERS_2010,
        true), t).transformVector(sky.apparent(rd, t));
    double haDeg = FastMath.toDegrees(gast.value(t)) + longitudeDeg - FastMath.toDegrees(ofDate.getAlpha());
    double h = haDeg / 15.0;
    return h - 24.0 * Math.floor((h + 12.0) / 24.0);
  }
}
