package dev.sequencer.validate;

import dev.sequencer.model.Constraints;
import dev.sequencer.model.Observation;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.validate.Violation.Kind;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.util.FastMath;
import org.orekit.time.AbsoluteDate;

/**
 * Keep-outs during slews (the format's A3): the Sun-separation and Earth-limb minima along the whole gap
 * before an observation — the rest at the previous end direction, the slew's path, the settle and the rest
 * at the next start direction.
 *
 * <p><b>Path.</b> Eigenaxis: each leg of the chain (from, {@code slewVia}..., to) along the shorter great
 * circle, the angle covered as the rest-to-rest profile says, legs one after the other from the departure;
 * the pointing is inertial (GCRF) and rests at the previous end direction before and at the next start
 * direction after (through the settle). Alt-az: both axes leave together at the departure, each along its own
 * profile on the unwrapped branch the mount uses; the pointing is fixed in azimuth and elevation while it
 * rests (it turns with the Earth). Which minima: along the slew and the settle the scenario's; during the
 * rests the previous and the next request's own (A2 overrides), since the pointing is still on their targets.
 *
 * <p><b>Where.</b> The Sun's direction from the observer and, from orbit, the nadir direction and the limb's
 * angular radius are evaluated exactly on a grid (30 s from the ground, 2 s from orbit) and interpolated
 * linearly between (error under 1e-6° from the ground, under 4e-5° from LEO, whose nadir turns at most
 * 0.065°/s). The path is sampled every 0.5 s or every 0.25° of the fastest axis, whichever is shorter, and
 * each local minimum among the samples is refined by a golden-section search; the rests every 10 s from the
 * ground and 1 s from orbit, plus their ends.
 *
 * <p><b>Departure.</b> With {@code slewStart} the slew departs there (it must lie in the gap, early enough for
 * the slew and settle to end by the observation's start). Without it the plan is valid when some departure
 * in [previous end, start − transition] keeps the minima: the validator tries 64 departures spread evenly
 * (or one per second, if fewer), both ends included, then a golden-section search for the best around the
 * best one. <b>Guarantee:</b> an accepted gap has a departure (one of those tried) whose sampled rests and path
 * keep every minimum within {@link #TOLERANCE_DEG}; a gap is rejected when no tried departure does, so a plan
 * that needs a departure window narrower than the spacing of the tried ones (gap / 63) may be rejected though
 * valid — a planner should write {@code slewStart} then.
 */
final class SlewKeepOut {
  /** Allowed shortfall of a minimum along a slew, degrees. */
  static final double TOLERANCE_DEG = 0.01;
  private static final int DEPARTURES = 64;
  private static final double GOLDEN = (Math.sqrt(5) - 1) / 2;

  private final Sky sky;
  private final boolean eigenaxis;
  private final double settleS;
  private final RestToRestProfile p1;
  private final RestToRestProfile p2;
  private final boolean orbit;

  SlewKeepOut(Sky sky) {
    this.sky = sky;
    SlewSettings s = sky.scenario().slew();
    this.eigenaxis = s instanceof SlewSettings.Eigenaxis;
    this.orbit = sky.ground() == null;
    if (s instanceof SlewSettings.Eigenaxis e) {
      settleS = e.settleS();
      p1 = new RestToRestProfile(e.rateDegPerS(), e.accelDegPerS2());
      p2 = null;
    } else if (s instanceof SlewSettings.AltAz a) {
      settleS = a.settleS();
      p1 = new RestToRestProfile(a.azimuthRateDegPerS(), a.azimuthAccelDegPerS2());
      p2 = new RestToRestProfile(a.elevationRateDegPerS(), a.elevationAccelDegPerS2());
    } else {
      settleS = 0;
      p1 = null;
      p2 = null;
    }
  }

  /** True when the scenario asks for keep-outs along slews and has a model with a path. */
  static boolean applies(Sky sky) {
    Constraints c = sky.scenario().constraints();
    return sky.hasObserver() && sky.scenario().slew().keepOutDuringSlew()
        && (c.sunSeparationMinDeg() != null || (sky.ground() == null && c.earthLimbMinDeg() != null));
  }

  /** The minima of one part of the gap: Sun separation and Earth limb, degrees (NaN for none). */
  private record Minima(double sunDeg, double limbDeg) {
    static Minima of(Constraints c, boolean orbit) {
      return new Minima(c.sunSeparationMinDeg() == null ? Double.NaN : c.sunSeparationMinDeg(),
          orbit && c.earthLimbMinDeg() != null ? c.earthLimbMinDeg() : Double.NaN);
    }

    boolean none() {
      return Double.isNaN(sunDeg) && Double.isNaN(limbDeg);
    }
  }

  /** The worst point of a departure: the smallest margin (deg), where (s from the gap start) and of what. */
  private record Worst(double marginDeg, double atS, Kind kind, double value, double limit) {
    static final Worst NONE = new Worst(Double.POSITIVE_INFINITY, 0, null, Double.NaN, Double.NaN);

    Worst min(Worst o) {
      return o.marginDeg < marginDeg ? o : this;
    }
  }

  /**
   * The keep-out violation of the slew into {@code o} over the gap [gapStart, o.start()] ({@code leg} from
   * {@link SlewLegs}; {@code fromC}/{@code toC}: the previous and next request's constraints, {@code fromC}
   * the scenario's for the start pointing), or null when it keeps them.
   */
  Violation check(Observation o, Instant gapStart, SlewLegs.Leg leg, Constraints fromC, Constraints toC) {
    if (leg.chain() == null && leg.axes() == null) {
      return null; // no slew (0 s leg) or no path
    }
    Minima path = Minima.of(sky.scenario().constraints(), orbit);
    Minima before = Minima.of(fromC, orbit);
    Minima after = Minima.of(toC, orbit);
    if (path.none() && before.none() && after.none()) {
      return null;
    }
    AbsoluteDate a = sky.date(gapStart);
    double gap = sky.date(o.start()).durationFrom(a);
    double moving = leg.seconds() - settleS;
    double latest = gap - leg.seconds();
    if (latest < -1e-3) {
      return null; // the gap is too short for the slew: reported as such
    }
    latest = Math.max(0, latest);
    Environment env = new Environment(a, gap);
    Worst chosen;
    if (o.slewStart() != null) {
      double d = sky.date(o.slewStart()).durationFrom(a);
      if (d < -1e-3 || d > latest + 1e-3) {
        return Violation.of(Kind.SLEW_START, o.id(), o.slewStart(), d, d < 0 ? 0 : latest, String.format(Locale.ROOT,
            "observation %s: slewStart %s is %s the gap [%s, %s] allows for a %.3f s transition", o.id(),
            o.slewStart(), d < 0 ? "before the previous end; the earliest" : "later than the latest departure",
            gapStart, o.start(), leg.seconds()));
      }
      chosen = worst(Math.max(0, Math.min(latest, d)), moving, gap, leg, env, path, before, after);
    } else {
      int n = latest <= 0 ? 1 : (int) Math.min(DEPARTURES, 1 + Math.ceil(latest));
      chosen = null;
      double bestD = 0;
      for (int i = 0; i < n; i++) {
        double d = n == 1 ? 0 : latest * i / (n - 1);
        Worst w = worst(d, moving, gap, leg, env, path, before, after);
        if (chosen == null || w.marginDeg > chosen.marginDeg) {
          chosen = w;
          bestD = d;
        }
        if (w.marginDeg >= -TOLERANCE_DEG) {
          return null;
        }
      }
      if (n > 1) {
        double h = latest / (n - 1);
        double lo = Math.max(0, bestD - h);
        double hi = Math.min(latest, bestD + h);
        double x1 = hi - GOLDEN * (hi - lo);
        double x2 = lo + GOLDEN * (hi - lo);
        Worst w1 = worst(x1, moving, gap, leg, env, path, before, after);
        Worst w2 = worst(x2, moving, gap, leg, env, path, before, after);
        for (int it = 0; it < 20; it++) {
          if (Math.max(w1.marginDeg, w2.marginDeg) >= -TOLERANCE_DEG) {
            return null;
          }
          if (w1.marginDeg >= w2.marginDeg) {
            hi = x2;
            x2 = x1;
            w2 = w1;
            x1 = hi - GOLDEN * (hi - lo);
            w1 = worst(x1, moving, gap, leg, env, path, before, after);
          } else {
            lo = x1;
            x1 = x2;
            w1 = w2;
            x2 = lo + GOLDEN * (hi - lo);
            w2 = worst(x2, moving, gap, leg, env, path, before, after);
          }
        }
        Worst refined = w1.marginDeg >= w2.marginDeg ? w1 : w2;
        if (refined.marginDeg > chosen.marginDeg) {
          chosen = refined;
        }
      }
    }
    if (chosen.marginDeg >= -TOLERANCE_DEG) {
      return null;
    }
    Instant at = sky.instant(a.shiftedBy(chosen.atS));
    String what = chosen.kind == Kind.SLEW_SUN_SEPARATION ? "Sun separation" : "Earth limb";
    return Violation.of(chosen.kind, o.id(), at, chosen.value, chosen.limit, String.format(Locale.ROOT,
        "observation %s: the slew into it breaks the %s minimum at %s by %.4f deg (%s)", o.id(), what, at,
        -chosen.marginDeg, o.slewStart() != null ? "departing at slewStart" : "no departure in the gap keeps it"));
  }

  /** The worst margin of the whole gap when the slew departs {@code d} seconds after its start. */
  private Worst worst(double d, double moving, double gap, SlewLegs.Leg leg, Environment env, Minima path,
      Minima before, Minima after) {
    Worst w = Worst.NONE;
    double restStep = orbit ? 1 : 10;
    if (!before.none()) {
      Vector3D p = pointing(leg, 0, env, 0);
      int n = Math.max(1, (int) Math.ceil(d / restStep));
      for (int i = 0; i <= n && d > 0; i++) {
        double t = d * i / n;
        w = w.min(margin(p, t, env, before));
      }
      if (d == 0) {
        w = w.min(margin(p, 0, env, before));
      }
    }
    if (!path.none()) {
      double rate = p2 == null ? p1.rateDegPerS() : Math.max(p1.rateDegPerS(), p2.rateDegPerS());
      double step = Math.min(0.5, 0.25 / rate);
      double end = moving + settleS;
      int n = Math.max(2, (int) Math.ceil(end / step));
      double[] m = new double[n + 1];
      Worst[] ws = new Worst[n + 1];
      for (int i = 0; i <= n; i++) {
        double s = end * i / n;
        ws[i] = margin(pointing(leg, s, env, d + s), d + s, env, path);
        m[i] = ws[i].marginDeg;
        w = w.min(ws[i]);
      }
      for (int i = 1; i < n; i++) {
        if (m[i] <= m[i - 1] && m[i] <= m[i + 1] && m[i] < TOLERANCE_DEG + 1) {
          w = w.min(refine(leg, env, path, d, end * (i - 1) / n, end * (i + 1) / n));
        }
      }
    }
    if (!after.none()) {
      double from = d + moving + settleS;
      double length = gap - from;
      int n = Math.max(1, (int) Math.ceil(length / restStep));
      for (int i = 0; i <= n; i++) {
        double t = from + Math.max(0, length) * i / n;
        w = w.min(margin(pointing(leg, t - d, env, t), t, env, after));
      }
    }
    return w;
  }

  private Worst refine(SlewLegs.Leg leg, Environment env, Minima path, double d, double lo, double hi) {
    double x1 = hi - GOLDEN * (hi - lo);
    double x2 = lo + GOLDEN * (hi - lo);
    Worst w1 = margin(pointing(leg, x1, env, d + x1), d + x1, env, path);
    Worst w2 = margin(pointing(leg, x2, env, d + x2), d + x2, env, path);
    for (int it = 0; it < 12; it++) {
      if (w1.marginDeg <= w2.marginDeg) {
        hi = x2;
        x2 = x1;
        w2 = w1;
        x1 = hi - GOLDEN * (hi - lo);
        w1 = margin(pointing(leg, x1, env, d + x1), d + x1, env, path);
      } else {
        lo = x1;
        x1 = x2;
        w1 = w2;
        x2 = lo + GOLDEN * (hi - lo);
        w2 = margin(pointing(leg, x2, env, d + x2), d + x2, env, path);
      }
    }
    return w1.min(w2);
  }

  /** The worst of the minima for pointing {@code p} (in the environment's axes) at {@code t} s from the gap start. */
  private Worst margin(Vector3D p, double t, Environment env, Minima min) {
    Worst w = Worst.NONE;
    if (!Double.isNaN(min.sunDeg)) {
      double sep = FastMath.toDegrees(Vector3D.angle(p, env.sun(t)));
      w = w.min(new Worst(sep - min.sunDeg, t, Kind.SLEW_SUN_SEPARATION, sep, min.sunDeg));
    }
    if (!Double.isNaN(min.limbDeg)) {
      double limb = FastMath.toDegrees(Vector3D.angle(p, env.nadir(t)) - env.limbRad(t));
      w = w.min(new Worst(limb - min.limbDeg, t, Kind.SLEW_EARTH_LIMB, limb, min.limbDeg));
    }
    return w;
  }

  /**
   * The pointing {@code s} seconds after the departure (s <= 0: the start of the slew; after the path: its end),
   * in the environment's axes: GCRF for eigenaxis, topocentric for alt-az ({@code t}, s from the gap start, is
   * unused: a resting pointing is fixed in those axes).
   */
  private Vector3D pointing(SlewLegs.Leg leg, double s, Environment env, double t) {
    if (eigenaxis) {
      List<Vector3D> chain = leg.chain();
      double elapsed = Math.max(0, s);
      for (int i = 1; i < chain.size(); i++) {
        Vector3D a = chain.get(i - 1);
        Vector3D b = chain.get(i);
        double angle = SlewLegs.angleDeg(a, b);
        double legS = p1.seconds(angle);
        if (elapsed < legS) {
          return slerp(a, b, angle, p1.angleAt(elapsed, angle) / angle);
        }
        elapsed -= legS;
      }
      return chain.get(chain.size() - 1);
    }
    double[] x = leg.axes();
    double dAz = Math.abs(x[2] - x[0]);
    double dEl = Math.abs(x[3] - x[1]);
    double az = x[0] + Math.signum(x[2] - x[0]) * p1.angleAt(Math.max(0, s), dAz);
    double el = x[1] + Math.signum(x[3] - x[1]) * p2.angleAt(Math.max(0, s), dEl);
    return Sky.topocentric(az, el);
  }

  /** The point a fraction f along the great circle from a to b (angle in degrees between them). */
  static Vector3D slerp(Vector3D a, Vector3D b, double angleDeg, double f) {
    double theta = FastMath.toRadians(angleDeg);
    double s = FastMath.sin(theta);
    if (s < 1e-12) {
      return f < 0.5 ? a : b;
    }
    return new Vector3D(FastMath.sin((1 - f) * theta) / s, a, FastMath.sin(f * theta) / s, b).normalize();
  }

  /**
   * The Sun's direction from the observer and, from orbit, the nadir direction and the limb's angular radius,
   * in the pointing's axes, on a grid over the gap, interpolated linearly.
   */
  private final class Environment {
    private final double step;
    private final Vector3D[] sun;
    private final Vector3D[] nadir;
    private final double[] limb;

    Environment(AbsoluteDate a, double gap) {
      step = orbit ? 2 : 30;
      int n = (int) Math.ceil(gap / step) + 2;
      sun = new Vector3D[n + 1];
      nadir = orbit ? new Vector3D[n + 1] : null;
      limb = orbit ? new double[n + 1] : null;
      for (int i = 0; i <= n; i++) {
        AbsoluteDate t = a.shiftedBy((i - 1) * step);
        Vector3D obs = sky.observer(t);
        Vector3D s = sky.sun(t).subtract(obs).normalize();
        sun[i] = eigenaxis ? s : sky.toTopocentric(s, t);
        if (orbit) {
          nadir[i] = obs.negate().normalize();
          limb[i] = FastMath.asin(Sky.EARTH_RADIUS_M / obs.getNorm());
        }
      }
    }

    private int cell(double t) {
      return Math.max(0, Math.min(sun.length - 2, (int) Math.floor(t / step) + 1));
    }

    private double frac(double t, int i) {
      return (t - (i - 1) * step) / step;
    }

    Vector3D sun(double t) {
      int i = cell(t);
      double f = frac(t, i);
      return new Vector3D(1 - f, sun[i], f, sun[i + 1]).normalize();
    }

    Vector3D nadir(double t) {
      int i = cell(t);
      double f = frac(t, i);
      return new Vector3D(1 - f, nadir[i], f, nadir[i + 1]).normalize();
    }

    double limbRad(double t) {
      int i = cell(t);
      double f = frac(t, i);
      return (1 - f) * limb[i] + f * limb[i + 1];
    }
  }
}
