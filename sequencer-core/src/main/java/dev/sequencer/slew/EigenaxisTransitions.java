package dev.sequencer.slew;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import org.hipparchus.geometry.euclidean.threed.Vector3D;

/**
 * Eigenaxis transitions between possibly moving lines of sight. The exact leg is the rest-to-rest slew
 * between the line of sight of the previous request at its end (t_d) and that of the next at its start
 * (t_a): s(angle(from(t_d), to(t_a))), 0 when the two coincide.
 *
 * Two tracks with the same {@link PointingTrack.Anchor anchor} direction follow one catalogue target: the
 * mount keeps tracking it, so that leg is 0 s.
 *
 * <p>Bound over departures [a, b] and arrivals [c, e], with midpoints m_d, m_a and half-widths h_d, h_a: by
 * the triangle inequality on the sphere and because a track moves no faster than its maximum rate,
 * angle(from(t_d), to(t_a)) <= angle(from(m_d), to(m_a)) + D_from + D_to, with D = L·h (or, for an anchored
 * track, at most twice its anchor radius), never more than 180°; s is non-decreasing in the angle, so s of
 * that bound is never below the exact leg.
 *
 * <p><b>Time-independent</b> when every track (and the start) has an anchor (fixed targets, pointed at their
 * apparent direction, which moves by at most the annual aberration, 20.9" from the ground): the bound is
 * then s(angle(anchor_from, anchor_to) + r_from + r_to), the same for every departure and arrival, and never
 * below the exact leg at any time (triangle inequality through the anchors). It exceeds the exact leg by
 * the time to turn at most 2 (r_from + r_to), about 0.023° from the ground: 0.02 s at 1°/s.
 *
 * <p><b>Keep-outs during slews</b> (spec A3, {@link KeepOuts}). The exact leg is the direct arc when it
 * keeps every cone (checked at the leg's own times, {@link Detour#legClear}), else the quickest checked
 * {@link Detour} chain, else impossible (infinite). The transition is the chain's legs plus one settle, and
 * the end direction must keep the cones during the settle. The slew may depart at the previous end
 * (then the pointing waits at the next start direction) or just in time (waiting at the previous end
 * direction): the first whose waits keep the cones is taken, and {@link #slew} reports it.
 * With both ends anchored and every cone quasi-still (the Sun), the waypoints are built once per pair
 * from the anchors around the cones at the middle of the {@link KeepOuts} span widened by their drift over
 * half of it, so the legs differ from the anchor chain only by the anchors' radii.
 *
 * <p><b>Bound with keep-outs.</b> Write L for an arc's length and f(L) = 1.1 for L ≤ 90°, 1.1/sin L above
 * (moving an arc's end by r moves its points by at most r·sin x / sin L to first order, x the distance
 * from the fixed end; 10 % for the higher orders of r ≤ 0.1°). Over departures [a, b] and arrivals
 * [c, e] the cones are taken at m = (a + e)/2 widened by drift·(e − a)/2 (for quasi-still cones and
 * anchored ends: the span's middle and half-span), which holds every position the cones take while the
 * slew, its settle and its waits happen. (1) If the arc between the midpoint directions clears every
 * widened cone by (D_from + D_to)·f(L), every actual direct arc (and both waiting directions) clears the
 * cones, the exact leg is direct and the plain bound above holds. (2) Else, with both ends anchored and
 * quasi-still cones, if the anchor chain's first leg clears by r_from·f(L_1), its last by r_to·f(L_n) and
 * the others by the margin, the exact leg uses that chain (or the direct arc, which is no longer by the
 * triangle inequality and subadditivity of T), and its legs are at most L_1 + r_from, …, L_n + r_to, so
 * Σ T(those) + settle bounds it. (3) Otherwise the bound is infinite. So the bound is never below the
 * exact leg; {@code EigenaxisKeepOutPropertyTest} checks it on random scenes.
 */
final class EigenaxisTransitions implements Transitions {
  private final EigenaxisModel model;
  private final List<PointingTrack> tracks;
  private final PointingTrack start;

  private final boolean timeDependent;
  private final KeepOuts keepOuts;
  /** Anchor chains per pair (from * (n + 1) + to), built on first use; empty when there is none. */
  private final Map<Long, Optional<Detour.Chain>> anchorChains = new ConcurrentHashMap<>();

  EigenaxisTransitions(EigenaxisModel model, List<PointingTrack> tracks, PointingTrack startOrNull) {
    this(model, tracks, startOrNull, KeepOuts.NONE);
  }

  EigenaxisTransitions(EigenaxisModel model, List<PointingTrack> tracks, PointingTrack startOrNull,
      KeepOuts keepOuts) {
    this.model = model;
    this.tracks = List.copyOf(tracks);
    this.start = startOrNull;
    this.keepOuts = keepOuts;
    if (!keepOuts.none() && keepOuts.sky().length != this.tracks.size()) {
      throw new IllegalArgumentException("keep-outs: " + keepOuts.sky().length + " sky flags for "
          + this.tracks.size() + " requests");
    }
    boolean moving = start != null && anchor(start) == null;
    for (PointingTrack t : this.tracks) {
      moving |= anchor(t) == null;
    }
    this.timeDependent = moving || !keepOuts.quasiStill();
  }

  /** The track's anchor; a track that declares none but never moves is its own anchor with radius 0. */
  private static PointingTrack.Anchor anchor(PointingTrack t) {
    PointingTrack.Anchor a = t.anchor();
    if (a == null && t.maxAngularRateDegPerS(-1e9, 1e9) == 0) {
      return new PointingTrack.Anchor(t.inertialDirection(0), 0);
    }
    return a;
  }

  /** True when both tracks follow the same catalogue target (equal anchor directions). */
  private static boolean sameTarget(PointingTrack f, PointingTrack t) {
    PointingTrack.Anchor a = f.anchor();
    PointingTrack.Anchor b = t.anchor();
    return a != null && b != null && a.direction().equals(b.direction());
  }

  @Override
  public int size() {
    return tracks.size();
  }

  @Override
  public double boundS(int from, int to, double departureMinS, double departureMaxS, double arrivalMinS,
      double arrivalMaxS) {
    Intervals.span("departure", departureMinS, departureMaxS); // checks the arguments
    Intervals.span("arrival", arrivalMinS, arrivalMaxS);
    if (from == START && start == null) {
      return 0;
    }
    PointingTrack f = from == START ? start : tracks.get(from);
    PointingTrack t = tracks.get(to);
    if (sameTarget(f, t)) {
      return 0;
    }
    double plain = plainBoundS(f, t, departureMinS, departureMaxS, arrivalMinS, arrivalMaxS);
    List<KeepOut> cones = keepOuts.none() ? List.of() : keepOuts.between(from, to);
    if (cones.isEmpty() || !(plain < Double.POSITIVE_INFINITY)) {
      return plain;
    }
    return keepOutBoundS(from, to, f, t, plain, cones, departureMinS, departureMaxS, arrivalMinS, arrivalMaxS);
  }

  /** The bound without keep-outs (class comment). */
  private double plainBoundS(PointingTrack f, PointingTrack t, double departureMinS, double departureMaxS,
      double arrivalMinS, double arrivalMaxS) {
    Intervals.Span departure = Intervals.span("departure", departureMinS, departureMaxS);
    Intervals.Span arrival = Intervals.span("arrival", arrivalMinS, arrivalMaxS);
    if (!timeDependent || (anchor(f) != null && anchor(t) != null && keepOuts.quasiStill())) {
      PointingTrack.Anchor af = anchor(f);
      PointingTrack.Anchor at = anchor(t);
      double radiusDeg = af.radiusDeg() + at.radiusDeg();
      double angleDeg = EigenaxisModel.angleDeg(af.direction(), at.direction());
      return radiusDeg == 0 ? model.secondsForAngle(angleDeg == 0 ? 0 : Math.min(180, angleDeg + 1e-9))
          : model.secondsForAngle(Math.min(180, angleDeg + radiusDeg + 1e-9));
    }
    double md = departure.mid();
    double hd = departure.half();
    double ma = arrival.mid();
    double ha = arrival.half();
    double driftDeg = drift(f, hd, departureMinS, departureMaxS) + drift(t, ha, arrivalMinS, arrivalMaxS);
    double angleDeg = EigenaxisModel.angleDeg(f.inertialDirection(md), t.inertialDirection(ma)) + driftDeg;
    if (Double.isNaN(angleDeg)) {
      return Double.POSITIVE_INFINITY;
    }
    // 1e-9 deg covers the different order of the floating-point operations in the exact legs.
    return driftDeg > 0 ? model.movingSecondsForAngle(Math.min(180, angleDeg + 1e-9))
        : model.secondsForAngle(angleDeg == 0 ? 0 : Math.min(180, angleDeg + 1e-9));
  }

  /** First-order factor by which moving an arc's end moves its points (class comment), with 10 % margin. */
  static double endFactor(double lengthDeg) {
    if (lengthDeg >= 179) {
      return Double.POSITIVE_INFINITY;
    }
    return lengthDeg <= 90 ? 1.1 : 1.1 / Math.sin(Math.toRadians(lengthDeg));
  }

  /** The keep-out cases (1)-(3) of the class comment. */
  private double keepOutBoundS(int from, int to, PointingTrack f, PointingTrack t, double plain, List<KeepOut> cones,
      double departureMinS, double departureMaxS, double arrivalMinS, double arrivalMaxS) {
    boolean anchored = anchor(f) != null && anchor(t) != null && keepOuts.quasiStill();
    double refS;
    double halfS;
    Vector3D a;
    Vector3D b;
    double da;
    double db;
    if (anchored) {
      refS = 0.5 * (keepOuts.fromS() + keepOuts.toS());
      halfS = 0.5 * (keepOuts.toS() - keepOuts.fromS());
      a = anchor(f).direction();
      b = anchor(t).direction();
      da = anchor(f).radiusDeg();
      db = anchor(t).radiusDeg();
    } else {
      refS = 0.5 * (departureMinS + arrivalMaxS);
      halfS = 0.5 * (arrivalMaxS - departureMinS);
      double md = 0.5 * (departureMinS + departureMaxS);
      double ma = 0.5 * (arrivalMinS + arrivalMaxS);
      a = f.inertialDirection(md);
      b = t.inertialDirection(ma);
      da = drift(f, 0.5 * (departureMaxS - departureMinS), departureMinS, departureMaxS);
      db = drift(t, 0.5 * (arrivalMaxS - arrivalMinS), arrivalMinS, arrivalMaxS);
    }
    double lengthDeg = EigenaxisModel.angleDeg(a, b);
    if (clearsWidened(a, b, cones, refS, halfS, (da + db) * endFactor(lengthDeg))) {
      return plain; // case (1): every actual arc is direct
    }
    if (!anchored) {
      return Double.POSITIVE_INFINITY; // case (3)
    }
    Optional<Detour.Chain> chain = anchorChain(from, to, a, b, cones);
    if (chain.isEmpty()) {
      return Double.POSITIVE_INFINITY;
    }
    List<Vector3D> via = chain.get().via();
    double sumS = 0;
    Vector3D p = a;
    for (int i = 0; i <= via.size(); i++) {
      Vector3D q = i < via.size() ? via.get(i) : b;
      double legDeg = EigenaxisModel.angleDeg(p, q);
      double slackDeg = (i == 0 ? da * endFactor(legDeg) : 0) + (i == via.size() ? db * endFactor(legDeg) : 0);
      if (!clearsWidened(p, q, cones, refS, halfS, slackDeg)) {
        return Double.POSITIVE_INFINITY; // case (3): the anchor chain is not robustly clear
      }
      double lengthUp = legDeg + (i == 0 ? da : 0) + (i == via.size() ? db : 0);
      sumS += model.profile().seconds(Math.min(180, lengthUp + 1e-9));
      p = q;
    }
    return sumS + model.settleS(); // case (2)
  }

  /** True when the still arc p→q clears every cone at refS, widened by its drift over halfS, by slackDeg more. */
  private static boolean clearsWidened(Vector3D p, Vector3D q, List<KeepOut> cones, double refS, double halfS,
      double slackDeg) {
    if (!Double.isFinite(slackDeg)) {
      return false;
    }
    for (KeepOut c : cones) {
      double widen = c.maxDriftDegPerS() * halfS;
      if (Detour.distanceToArcDeg(c.axis(refS), p, q) - c.radiusDeg(refS) - widen - slackDeg < Detour.CHECK_MARGIN_DEG) {
        return false;
      }
    }
    return true;
  }

  /** The detour between two anchors around the quasi-still cones at the span's middle, widened over the span. */
  private Optional<Detour.Chain> anchorChain(int from, int to, Vector3D a, Vector3D b, List<KeepOut> cones) {
    long key = (long) (from + 1) * (tracks.size() + 1) + to;
    return anchorChains.computeIfAbsent(key, k -> {
      double refS = 0.5 * (keepOuts.fromS() + keepOuts.toS());
      double halfS = 0.5 * (keepOuts.toS() - keepOuts.fromS());
      double widen = 0;
      for (KeepOut c : cones) {
        widen = Math.max(widen, c.maxDriftDegPerS() * halfS);
      }
      // The anchors' radii (at most 0.006 deg from orbit) go into the widening too, so the actual legs clear.
      PointingTrack.Anchor af = anchor(from == START ? start : tracks.get(from));
      PointingTrack.Anchor at = anchor(tracks.get(to));
      widen += 2 * (af.radiusDeg() + at.radiusDeg());
      for (Detour.Chain c : Detour.candidates(a, b, refS, cones, widen, model.profile())) {
        if (robust(a, b, c, cones, refS, halfS, af.radiusDeg(), at.radiusDeg())) {
          return Optional.of(c);
        }
      }
      return Optional.empty();
    });
  }

  private static boolean robust(Vector3D a, Vector3D b, Detour.Chain chain, List<KeepOut> cones, double refS,
      double halfS, double ra, double rb) {
    List<Vector3D> via = chain.via();
    Vector3D p = a;
    for (int i = 0; i <= via.size(); i++) {
      Vector3D q = i < via.size() ? via.get(i) : b;
      double legDeg = EigenaxisModel.angleDeg(p, q);
      double slack = (i == 0 ? ra * endFactor(legDeg) : 0) + (i == via.size() ? rb * endFactor(legDeg) : 0);
      if (!clearsWidened(p, q, cones, refS, halfS, slack)) {
        return false;
      }
      p = q;
    }
    return true;
  }

  /**
   * The slew of the exact leg from {@code from} departing at {@code departureS} to {@code to} arriving at
   * {@code arrivalS}: its seconds (infinite when impossible), the instant it departs and its waypoints.
   */
  @Override
  public Slew slew(int from, int to, double departureS, double arrivalS) {
    PointingTrack f = from == START ? start : tracks.get(from);
    PointingTrack t = tracks.get(to);
    if (f == null || sameTarget(f, t)) {
      return new Slew(0, departureS, List.of());
    }
    Vector3D a = f.inertialDirection(departureS);
    Vector3D b = t.inertialDirection(arrivalS);
    double angleDeg = EigenaxisModel.angleDeg(a, b);
    List<KeepOut> cones = keepOuts.none() ? List.of() : keepOuts.between(from, to);
    if (cones.isEmpty()) {
      return new Slew(model.secondsForAngle(angleDeg), departureS, List.of());
    }
    if (angleDeg == 0) {
      return new Slew(0, departureS, List.of());
    }
    Slew early = planAt(from, to, a, b, departureS, cones);
    if (early == null) {
      return new Slew(Double.POSITIVE_INFINITY, departureS, List.of());
    }
    double slack = arrivalS - departureS - early.seconds();
    if (slack <= 0 || Detour.restClear(b, departureS + early.seconds(), arrivalS, cones)) {
      return early; // departs at the previous end and waits (if at all) at the next start direction
    }
    // Depart just in time instead, waiting at the previous end direction.
    double late = arrivalS - early.seconds();
    for (int i = 0; i < 3 && late > departureS; i++) {
      Slew s = planAt(from, to, a, b, late, cones);
      if (s == null) {
        break;
      }
      if (late + s.seconds() <= arrivalS) {
        if (Detour.restClear(a, departureS, late, cones)) {
          return new Slew(s.seconds(), late, s.via());
        }
        break;
      }
      late = arrivalS - s.seconds() - 0.5;
    }
    return new Slew(Double.POSITIVE_INFINITY, departureS, List.of());
  }

  /** The quickest checked path from a to b departing at tS with its settle, or null when none keeps the cones. */
  private Slew planAt(int from, int to, Vector3D a, Vector3D b, double tS, List<KeepOut> cones) {
    RestToRest profile = model.profile();
    double settle = model.settleS();
    if (Detour.legClear(a, b, tS, profile, cones)) {
      double moving = profile.seconds(EigenaxisModel.angleDeg(a, b));
      return Detour.restClear(b, tS + moving, tS + moving + settle, cones) ? new Slew(moving + settle, tS, List.of())
          : null;
    }
    PointingTrack f = from == START ? start : tracks.get(from);
    PointingTrack t = tracks.get(to);
    List<Detour.Chain> chains;
    if (anchor(f) != null && anchor(t) != null && keepOuts.quasiStill()) {
      chains = anchorChain(from, to, anchor(f).direction(), anchor(t).direction(), cones).stream().toList();
    } else {
      double estimateS = profile.seconds(EigenaxisModel.angleDeg(a, b)) * 1.5 + settle;
      double widen = 0;
      for (KeepOut c : cones) {
        widen = Math.max(widen, c.maxDriftDegPerS() * estimateS);
      }
      chains = Detour.candidates(a, b, tS + 0.5 * estimateS, cones, widen, profile);
    }
    for (Detour.Chain c : chains) {
      Detour.Chain actual = Detour.Chain.of(a, c.via(), b, profile);
      if (Detour.chainClear(a, actual, b, tS, profile, cones)
          && Detour.restClear(b, tS + actual.movingS(), tS + actual.movingS() + settle, cones)) {
        return new Slew(actual.movingS() + settle, tS, actual.via());
      }
    }
    return null;
  }

  /** How far a track can be from its midpoint direction over an interval of half-width h. */
  private static double drift(PointingTrack track, double h, double minS, double maxS) {
    if (h == 0) {
      return 0;
    }
    double byRate = track.maxAngularRateDegPerS(minS, maxS) * h;
    PointingTrack.Anchor a = track.anchor();
    return a == null ? byRate : Math.min(byRate, 2 * a.radiusDeg());
  }

  @Override
  public double[] exactS(int[] order, double[] departureS, double[] arrivalS) {
    Intervals.checkSequence(order, departureS, arrivalS, tracks.size());
    return Paths.along(path(), order, departureS, arrivalS);
  }

  /** Legs depend on the two requests and instants only; without a start track the first leg is 0 s. */
  @Override
  public Path path() {
    return StatelessPath.start((from, to, departure, arrival) -> {
      PointingTrack f = from == START ? start : tracks.get(from);
      PointingTrack t = tracks.get(to);
      if (!keepOuts.none()) {
        return slew(from, to, departure, arrival).seconds();
      }
      return f == null || sameTarget(f, t) ? 0 : model.secondsForAngle(EigenaxisModel.angleDeg(
          f.inertialDirection(departure), t.inertialDirection(arrival)));
    });
  }

  /** True unless every line of sight (and the start's) has an anchor: then the bounds depend on no time. */
  @Override
  public boolean timeDependent() {
    return timeDependent;
  }
}
