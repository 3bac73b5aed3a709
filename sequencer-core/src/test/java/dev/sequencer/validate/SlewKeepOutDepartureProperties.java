package dev.sequencer.validate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.Timeline;
import dev.sequencer.validate.Violation.Kind;
import java.time.Instant;
import java.util.List;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.LongRange;
import net.jqwik.api.statistics.Statistics;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.orekit.time.AbsoluteDate;

/**
 * Keep-outs during slews (A3) on random gaps from a low orbit, against a dense evaluation written here. Each try
 * draws two pointings A and B anywhere on the sky (sometimes with a waypoint, {@code slewVia}), the scenario's
 * Sun-separation and Earth-limb minima and, for A and B, their own (A2 overrides, which hold while the pointing
 * rests on them), a gap between the slew's need and 240 s more, and in one try in three a {@code slewStart}
 * (sometimes outside the gap). The oracle evaluates every departure 0.25 s apart: the rest on A (every 0.25 s,
 * A's minima), the path (every 0.1 s, the trapezoid profile of {@link SlewKeepOutDenseTest}, each leg of the
 * chain in turn, then the settle at B; the scenario's minima) and the rest on B (B's minima); the observer from
 * Orekit's TLE propagator, the Sun from the time layer (shared with the validator: its position is not what is
 * tested), the limb from the WGS-84 equatorial radius (common practice). The chain's ends and waypoints are the
 * validator's apparent directions ({@link SlewLegs}), so only the departure, the path and the margins are
 * compared.
 *
 * <p>Verdicts, away from the edge (0.02° either side of the 0.01° tolerance): with {@code slewStart} the
 * validator fails the gap exactly when that departure breaks a minimum, names the kind and reports the worst
 * value to 0.005°; outside the gap it reports {@code SLEW_START}. Without it, the gap fails when every
 * departure breaks a minimum, and passes when the departures that keep them span more than the spacing of the
 * 64 the validator tries (its documented guarantee). Tries nearer the edge decide nothing; at least half
 * must decide.
 */
class SlewKeepOutDepartureProperties {
  private static final AstroContext CTX = AstroContext.offline();
  private static final double EARTH_RADIUS_M = 6_378_137.0;
  private static final double BAND = 0.02;
  private static final double GRID_S = 0.25;
  private static final double PATH_S = 0.1;

  @Property(tries = 80, shrinking = net.jqwik.api.ShrinkingMode.OFF)
  void theValidatorKeepsTheMinimaAlongEverySlewAsTheDenseEvaluation(@ForAll @LongRange(min = 1, max = 1_000_000)
      long seed) {
    String verdict = check(seed);
    Statistics.label("verdict").collect(verdict);
    Statistics.label("verdict").coverage(c -> c.check("undecided").percentage(p -> p <= 50));
  }

  /** One try; returns what was decided ("pass", "fail", "slewStart outside", or "undecided"). */
  static String check(long seed) {
    Random rnd = new Random(seed);
    Instant t0 = SlewKeepOutDenseTest.T.plusSeconds(rnd.nextInt(1800));
    double sunMin = 15 + 35 * rnd.nextDouble();
    double limbMin = -5 + 25 * rnd.nextDouble();
    Constraints c = Constraints.builder().sunSeparationMinDeg(sunMin).earthLimbMinDeg(limbMin).build();
    ConstraintOverrides ownA = own(rnd);
    ConstraintOverrides ownB = own(rnd);
    double[] minA = minima(c, ownA);
    double[] minB = minima(c, ownB);
    Instant aEnd = t0.plusSeconds(10);
    Observation oa = Observation.of("A", t0, aEnd, 0);
    AbsoluteDate d0 = CTX.date(aEnd);
    Vector3D r0 = SlewKeepOutDenseTest.observer(d0);
    double limb0 = Math.toDegrees(Math.asin(EARTH_RADIUS_M / r0.getNorm()));
    Vector3D a;
    Vector3D b;
    List<dev.sequencer.model.RaDec> via;
    Scenario s;
    double gap;
    if (rnd.nextInt(3) == 0) {
      // Built so that the departure decides (as in KeepOutDuringSlewTest): A a little above the limb ahead of
      // nadir, where the Earth rises towards it (resting on A keeps its limb minimum for a while only), B a
      // little above the limb behind nadir at B's start, where the Earth sinks away from it (resting on B long
      // before its start breaks it), the slew via the zenith, a gap some tens of seconds longer than the slew.
      Vector3D normal = Vector3D.crossProduct(r0, SlewKeepOutDenseTest.observer(d0.shiftedBy(1)).subtract(r0))
          .normalize();
      a = SlewKeepOutDenseTest.turn(r0.negate().normalize(), normal, limb0 + minA[1] + 1 + 7 * rnd.nextDouble());
      via = List.of(SlewKeepOutDenseTest.raDec(r0.normalize()));
      double aboveB = -1 + 7 * rnd.nextDouble();
      double extra = 20 + 100 * rnd.nextDouble();
      gap = 300;
      b = null;
      s = null;
      for (int it = 0; it < 3; it++) {
        Vector3D r1 = SlewKeepOutDenseTest.observer(d0.shiftedBy(gap));
        double limb1 = Math.toDegrees(Math.asin(EARTH_RADIUS_M / r1.getNorm()));
        b = SlewKeepOutDenseTest.turn(r1.negate().normalize(), normal, -(limb1 + minB[1] + aboveB));
        s = scenario(c, a, b, ownA, ownB);
        Instant at = aEnd.plusMillis(Math.round(gap * 1000));
        gap = legInto(s, oa, new Observation("B", at, at.plusSeconds(10), 0, null, null, null, via)).seconds()
            + extra;
      }
    } else {
      // Ends mostly clear of both keep-outs at the gap's start (so that the path and the departure decide),
      // a few anywhere.
      Vector3D sunDir = SlewKeepOutDenseTest.sunFromObserver(d0);
      a = clear(rnd, sunDir, sunMin + 5, r0.negate(), limb0 + limbMin + 8 * rnd.nextDouble());
      b = clear(rnd, sunDir, sunMin + 5, r0.negate(), limb0 + limbMin + 8 * rnd.nextDouble());
      via = rnd.nextInt(3) == 0 ? List.of(SlewKeepOutDenseTest.raDec(random(rnd))) : List.of();
      s = scenario(c, a, b, ownA, ownB);
      Instant guess = aEnd.plusSeconds(300);
      double need = legInto(s, oa, new Observation("B", guess, guess.plusSeconds(10), 0, null, null, null, via))
          .seconds();
      gap = need + 240 * rnd.nextDouble();
    }
    gap = Math.round(gap * 1000) / 1000.0;
    Instant bStart = aEnd.plusMillis(Math.round(gap * 1000));
    SlewLegs.Leg leg = legInto(s, oa, new Observation("B", bStart, bStart.plusSeconds(10), 0, null, null, null, via));
    List<Vector3D> chain = leg.chain();
    double slew = leg.seconds();
    double latest = gap - slew;
    if (latest < 0) {
      return "undecided"; // the slew needs more than the gap (only when the last correction overshot)
    }
    Double slewStart = null;
    if (rnd.nextInt(3) == 0) {
      slewStart = Math.round((-3 + (latest + 6) * rnd.nextDouble()) * 1000) / 1000.0;
    }
    Instant depart = slewStart == null ? null : aEnd.plusMillis(Math.round(slewStart * 1000));
    Observation ob = new Observation("B", bStart, bStart.plusSeconds(10), slew, null, null, depart, via);
    List<Violation> found = PlanValidator.of(s, CTX).check(new Timeline(PlanStatus.FEASIBLE, 2, slew, null,
        List.of(oa, ob), List.of())).stream().filter(v -> v.kind() == Kind.SLEW_SUN_SEPARATION
            || v.kind() == Kind.SLEW_EARTH_LIMB || v.kind() == Kind.SLEW_START).toList();
    String what = "seed " + seed + ": gap " + gap + " s, slew " + slew + " s, slewStart " + slewStart + ", via "
        + via + ": " + Violation.words(found);

    Dense dense = new Dense(CTX.date(aEnd), gap, chain, slew - SlewKeepOutDenseTest.SETTLE, minima(c, null),
        minA, minB);
    double tol = SlewKeepOut.TOLERANCE_DEG;
    if (slewStart != null) {
      if (slewStart < -0.01 || slewStart > latest + 0.01) {
        assertEquals(List.of(Kind.SLEW_START), found.stream().map(Violation::kind).toList(), what);
        return "slewStart outside";
      }
      if (slewStart < 0.01 || slewStart > latest - 0.01) {
        return "undecided";
      }
      Dense.Worst w = dense.worst(slewStart);
      if (w.margin() >= -tol + BAND) {
        assertEquals(List.of(), found, what + "; dense worst margin " + w);
        return "pass at slewStart";
      }
      if (w.margin() < -tol - BAND) {
        assertEquals(1, found.size(), what + "; dense worst " + w);
        Violation v = found.get(0);
        if (Math.abs(w.otherMargin() - w.margin()) > 0.01) {
          assertEquals(w.kind(), v.kind(), what + "; dense worst " + w);
          assertEquals(w.value(), v.value(), 0.005, what + "; dense worst " + w);
          assertEquals(w.limit(), v.limit(), 1e-9, what);
        }
        return "fail at slewStart";
      }
      return "undecided";
    }
    double step = 0.25;
    int m = latest <= 0 ? 1 : (int) Math.floor(latest / step) + 1;
    double best = Double.NEGATIVE_INFINITY;
    int run = 0;
    int longest = 0;
    for (int i = 0; i < m; i++) {
      double d = Math.min(latest, i * step);
      double margin = dense.worst(Math.max(0, d)).margin();
      best = Math.max(best, margin);
      run = margin >= -tol + BAND ? run + 1 : 0;
      longest = Math.max(longest, run);
    }
    int tried = latest <= 0 ? 1 : (int) Math.min(64, 1 + Math.ceil(latest));
    double spacing = tried == 1 ? 0 : latest / (tried - 1);
    if (best < -tol - BAND) {
      assertEquals(1, found.size(), what + "; best dense margin " + best);
      assertTrue(found.get(0).kind() != Kind.SLEW_START, what);
      return "fail, every departure";
    }
    if (tried == 1 ? longest > 0 : (longest - 1) * step >= spacing + 2 * step) {
      assertEquals(List.of(), found, what + "; departures keeping the minima span " + (longest - 1) * step
          + " s, the tried ones are " + spacing + " s apart");
      return longest == m ? "pass, every departure" : "pass, some departures";
    }
    return "undecided";
  }

  private static Scenario scenario(Constraints c, Vector3D a, Vector3D b, ConstraintOverrides ownA,
      ConstraintOverrides ownB) {
    return new Scenario(1, "departures", SlewKeepOutDenseTest.LEO.horizon(), SlewKeepOutDenseTest.LEO.observer(), c,
        new SlewSettings.Eigenaxis(SlewKeepOutDenseTest.RATE, SlewKeepOutDenseTest.ACCEL, SlewKeepOutDenseTest.SETTLE),
        null, List.of(Request.of("A", SlewKeepOutDenseTest.raDec(a), 10, 1).withConstraints(ownA),
            Request.of("B", SlewKeepOutDenseTest.raDec(b), 10, 1).withConstraints(ownB)), null);
  }

  /** The validator's leg into {@code b} after {@code a}: its seconds and its chain of apparent directions. */
  private static SlewLegs.Leg legInto(Scenario s, Observation a, Observation b) {
    return new SlewLegs(new Sky(s, CTX)).legs(List.of(a, b), s.requests()).get(1);
  }

  /** A direction uniform on the sphere, drawn again (up to 40 times) while nearer sun or nadir than given. */
  private static Vector3D clear(Random rnd, Vector3D sun, double sunDeg, Vector3D nadir, double nadirDeg) {
    Vector3D u = random(rnd);
    for (int i = 0; i < 40 && (Math.toDegrees(Vector3D.angle(u, sun)) < sunDeg
        || Math.toDegrees(Vector3D.angle(u, nadir)) < nadirDeg); i++) {
      u = random(rnd);
    }
    return u;
  }

  /** A direction uniform on the sphere. */
  private static Vector3D random(Random rnd) {
    double z = 2 * rnd.nextDouble() - 1;
    double phi = 2 * Math.PI * rnd.nextDouble();
    double r = Math.sqrt(1 - z * z);
    return new Vector3D(r * Math.cos(phi), r * Math.sin(phi), z);
  }

  /** A request's own minima, one time in two each (A2: a given field replaces the scenario's). */
  private static ConstraintOverrides own(Random rnd) {
    Constraints.Builder b = Constraints.builder();
    boolean any = false;
    if (rnd.nextBoolean()) {
      b.sunSeparationMinDeg(10 + 40 * rnd.nextDouble());
      any = true;
    }
    if (rnd.nextBoolean()) {
      b.earthLimbMinDeg(-5 + 25 * rnd.nextDouble());
      any = true;
    }
    return any ? ConstraintOverrides.setting(b.build()) : ConstraintOverrides.none();
  }

  /** {sun, limb} minima: the request's own where it gives one, else the scenario's. */
  private static double[] minima(Constraints scenario, ConstraintOverrides own) {
    Constraints g = own == null ? null : own.given();
    double sun = g != null && g.sunSeparationMinDeg() != null ? g.sunSeparationMinDeg() : scenario.sunSeparationMinDeg();
    double limb = g != null && g.earthLimbMinDeg() != null ? g.earthLimbMinDeg() : scenario.earthLimbMinDeg();
    return new double[] {sun, limb};
  }

  /** The gap's geometry on a 0.25 s grid (exact values, interpolated linearly between). */
  private static final class Dense {
    record Worst(double margin, Kind kind, double value, double limit, double otherMargin) {}

    private final double gap;
    private final List<Vector3D> chain;
    private final double moving;
    private final double[] path;
    private final double[] before;
    private final double[] after;
    private final Vector3D[] sun;
    private final Vector3D[] obs;

    Dense(AbsoluteDate start, double gap, List<Vector3D> chain, double moving, double[] path, double[] before,
        double[] after) {
      this.gap = gap;
      this.chain = chain;
      this.moving = moving;
      this.path = path;
      this.before = before;
      this.after = after;
      int n = (int) Math.ceil(gap / GRID_S) + 2;
      sun = new Vector3D[n + 1];
      obs = new Vector3D[n + 1];
      for (int i = 0; i <= n; i++) {
        AbsoluteDate t = start.shiftedBy(i * GRID_S);
        obs[i] = SlewKeepOutDenseTest.observer(t);
        sun[i] = SlewKeepOutDenseTest.sunFromObserver(t);
      }
    }

    /** The worst point of the gap when the slew departs d seconds after it opens. */
    Worst worst(double d) {
      double[] w = {Double.POSITIVE_INFINITY, 0, 0, 0, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY};
      for (double t = 0; t < d; t += 0.25) {
        add(w, chain.get(0), t, before);
      }
      add(w, chain.get(0), d, before);
      double end = moving + SlewKeepOutDenseTest.SETTLE;
      for (double s = 0; s <= end; s += PATH_S) {
        add(w, pointing(s), d + s, path);
      }
      add(w, pointing(end), d + end, path);
      for (double t = d + end; t < gap; t += 0.25) {
        add(w, chain.get(chain.size() - 1), t, after);
      }
      add(w, chain.get(chain.size() - 1), gap, after);
      boolean sun = w[1] == 0;
      return new Worst(w[0], sun ? Kind.SLEW_SUN_SEPARATION : Kind.SLEW_EARTH_LIMB, w[2], w[3], sun ? w[5] : w[4]);
    }

    /**
     * Folds the margins at pointing p, t s into the gap, into w = {worst margin, its kind (0 Sun, 1 limb), its
     * value, its limit, the worst Sun margin, the worst limb margin}.
     */
    private void add(double[] w, Vector3D p, double t, double[] min) {
      double f = t / GRID_S;
      int i = Math.max(0, Math.min(sun.length - 2, (int) Math.floor(f)));
      double x = f - i;
      Vector3D s = new Vector3D(1 - x, sun[i], x, sun[i + 1]).normalize();
      Vector3D o = new Vector3D(1 - x, obs[i], x, obs[i + 1]);
      double sep = Math.toDegrees(Vector3D.angle(p, s));
      double limb = Math.toDegrees(Vector3D.angle(p, o.negate()) - Math.asin(EARTH_RADIUS_M / o.getNorm()));
      w[4] = Math.min(w[4], sep - min[0]);
      w[5] = Math.min(w[5], limb - min[1]);
      if (sep - min[0] < w[0]) {
        w[0] = sep - min[0];
        w[1] = 0;
        w[2] = sep;
        w[3] = min[0];
      }
      if (limb - min[1] < w[0]) {
        w[0] = limb - min[1];
        w[1] = 1;
        w[2] = limb;
        w[3] = min[1];
      }
    }

    /** The pointing s seconds after the departure: each leg of the chain in turn, then its end. */
    private Vector3D pointing(double s) {
      double left = s;
      for (int i = 1; i < chain.size(); i++) {
        Vector3D a = chain.get(i - 1);
        Vector3D b = chain.get(i);
        double total = Math.toDegrees(Vector3D.angle(a, b));
        double legS = SlewKeepOutDenseTest.slewSeconds(total);
        if (left < legS) {
          Vector3D axis = Vector3D.crossProduct(a, b);
          return axis.getNorm() < 1e-12 ? a
              : SlewKeepOutDenseTest.turn(a, axis.normalize(), SlewKeepOutDenseTest.angleAt(left, total));
        }
        left -= legS;
      }
      return chain.get(chain.size() - 1);
    }
  }
}
