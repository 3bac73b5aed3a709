package dev.sequencer.slew;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.hipparchus.geometry.euclidean.threed.Vector3D;

/**
 * Eigenaxis slews that keep out of cones (spec A3): checks of great-circle legs against cones that may
 * move, and detours around a cone through waypoints.
 *
 * <p><b>Detour.</b> When the great-circle arc from A to B enters a cone of axis S and radius ρ &lt; 90°
 * (a cone of 90° or more has a convex outside, so the direct arc of two directions outside it never
 * enters it), the shortest path around it is, on either side, the great-circle tangent from A to the
 * cone's boundary (length l_A, cos l_A = cos d_A / cos ρ), the boundary arc of central angle Φ (length
 * Φ·sin ρ) and the tangent to B: L* = l_A + Φ sin ρ + l_B. A slew made of rest-to-rest legs cannot follow
 * the boundary, so we use the tangent polygon with m vertices: tangent points T_0 = T_A, …, T_m = T_B
 * equally spaced by φ = Φ/m about S, and vertex W_i where the tangents at T_{i-1} and T_i meet, at distance
 * ρ_v from S with tan ρ_v = tan ρ / cos(φ/2) (right spherical triangle S, T, W). The chain A, W_1, …, W_m,
 * B touches the cone only at the tangent points (its legs lie on tangent great circles), and its length
 * is l_A + l_B + 2m·t with tan t = sin ρ · tan(φ/2) (the same triangle). Since
 * atan(x·tan(y)) ≤ x·tan(y) and tan is convex on [0, π/2),
 * <pre>  L_m − L* = 2m·t − Φ sin ρ ≤ Φ sin ρ · (tan(φ/2)/(φ/2) − 1)</pre>
 * so with m = {@link #MAX_WAYPOINTS} = 8 and Φ ≤ 180° the length is at most 1.3 % of a half-turn (2.3°)
 * above the shortest path around the widened cone. The time cost: each leg is rest to rest, so the chain
 * takes Σ T(l_i) + settle, and any path avoiding the cone takes at least T(L*) + settle
 * ({@link RestToRest}'s T is non-decreasing and subadditive, so a chain of total length L ≥ L* takes
 * Σ T(l_i) ≥ T(L) ≥ T(L*)). We pick, over both sides and m = 1 … 8, the chain of least Σ T(l_i) that
 * passes the timed check; the gap to the lower bound T(L*) is the length excess above plus one ramp
 * (ω/α) per extra leg, the price of rest-to-rest legs. The widening {@link #CONSTRUCTION_MARGIN_DEG} (plus
 * the drift of moving cones during the slew) is what the legs keep from the true cone.
 *
 * <p><b>Moving cones.</b> A leg departing at t0 is checked piece by piece in time: over a piece [a, b] of the
 * rest-to-rest profile the line of sight stays on the sub-arc it sweeps, and the cone at the piece's
 * midpoint has moved by at most drift·(b − a)/2 at either end, so clearance(sub-arc, cone(mid)) ≥
 * drift·(b − a)/2 proves the piece clear; a piece with negative clearance is inside; otherwise it is
 * halved, and a piece shorter than {@link #MIN_PIECE_S} that is still undecided counts as inside (never
 * optimistic). A still cone (the Sun, see {@code dev.sequencer.visibility.SlewKeepOuts}) is checked in
 * one piece.
 */
final class Detour {
  /** Most waypoints of a detour. */
  static final int MAX_WAYPOINTS = 8;
  /** How much wider than the cone the waypoints are placed, degrees. */
  static final double CONSTRUCTION_MARGIN_DEG = 0.01;
  /** The clearance a checked leg must keep, degrees: room for other code's rounding. */
  static final double CHECK_MARGIN_DEG = 1e-6;
  /** Undecided pieces of a moving check shorter than this count as inside, seconds. */
  static final double MIN_PIECE_S = 0.25;

  private Detour() {}

  /** A chain of legs: the waypoints between the two ends, each leg's seconds, their sum (no settle). */
  record Chain(List<Vector3D> via, double[] legS, double movingS) {
    static Chain of(Vector3D from, List<Vector3D> via, Vector3D to, RestToRest profile) {
      double[] legs = new double[via.size() + 1];
      Vector3D p = from;
      double sum = 0;
      for (int i = 0; i <= via.size(); i++) {
        Vector3D q = i < via.size() ? via.get(i) : to;
        legs[i] = profile.seconds(EigenaxisModel.angleDeg(p, q));
        sum += legs[i];
        p = q;
      }
      return new Chain(List.copyOf(via), legs, sum);
    }
  }

  /** Smallest angle from {@code s} to the shorter great-circle arc p→q, degrees; 0 for an undefined (antipodal) arc. */
  static double distanceToArcDeg(Vector3D s, Vector3D p, Vector3D q) {
    double lengthDeg = EigenaxisModel.angleDeg(p, q);
    if (lengthDeg < 1e-12) {
      return EigenaxisModel.angleDeg(s, p);
    }
    Vector3D n = Vector3D.crossProduct(p, q);
    if (n.getNorm() < 1e-12) {
      return 0; // opposite directions: the arc is not defined, so nothing is promised
    }
    n = n.normalize();
    Vector3D proj = s.subtract(Vector3D.dotProduct(s, n), n);
    double ends = Math.min(EigenaxisModel.angleDeg(s, p), EigenaxisModel.angleDeg(s, q));
    if (proj.getNorm() < 1e-15) {
      return Math.min(90, ends);
    }
    Vector3D r = proj.normalize();
    boolean inside = Vector3D.dotProduct(Vector3D.crossProduct(p, r), n) >= 0
        && Vector3D.dotProduct(Vector3D.crossProduct(r, q), n) >= 0;
    return inside ? Math.min(ends, EigenaxisModel.angleDeg(s, r)) : ends;
  }

  /** The direction {@code angleDeg} along the great circle from p towards q. */
  static Vector3D along(Vector3D p, Vector3D q, double angleDeg) {
    Vector3D n = Vector3D.crossProduct(p, q);
    if (n.getNorm() < 1e-15) {
      return p;
    }
    Vector3D t = Vector3D.crossProduct(n.normalize(), p);
    double a = Math.toRadians(angleDeg);
    return new Vector3D(Math.cos(a), p, Math.sin(a), t).normalize();
  }

  /** True when the still arc p→q keeps {@code margin} degrees outside every cone as it is at {@code tS}. */
  static boolean arcClearAt(Vector3D p, Vector3D q, double tS, List<KeepOut> cones, double marginDeg) {
    for (KeepOut c : cones) {
      if (distanceToArcDeg(c.axis(tS), p, q) - c.radiusDeg(tS) < marginDeg) {
        return false;
      }
    }
    return true;
  }

  /** True when the rest-to-rest leg p→q departing at {@code t0S} keeps every cone (class comment). */
  static boolean legClear(Vector3D p, Vector3D q, double t0S, RestToRest profile, List<KeepOut> cones) {
    double angleDeg = EigenaxisModel.angleDeg(p, q);
    double durationS = profile.seconds(angleDeg);
    for (KeepOut c : cones) {
      if (!pieceClear(p, q, angleDeg, t0S, 0, durationS, profile, c)) {
        return false;
      }
    }
    return true;
  }

  private static boolean pieceClear(Vector3D p, Vector3D q, double angleDeg, double t0S, double aS, double bS,
      RestToRest profile, KeepOut c) {
    Vector3D from = along(p, q, profile.angleAt(angleDeg, aS));
    Vector3D to = along(p, q, profile.angleAt(angleDeg, bS));
    double mid = t0S + 0.5 * (aS + bS);
    double clearance = distanceToArcDeg(c.axis(mid), from, to) - c.radiusDeg(mid) - CHECK_MARGIN_DEG;
    double drift = c.maxDriftDegPerS() * 0.5 * (bS - aS);
    if (clearance >= drift) {
      return true;
    }
    if (clearance < 0 || bS - aS < MIN_PIECE_S) {
      return false;
    }
    double m = 0.5 * (aS + bS);
    return pieceClear(p, q, angleDeg, t0S, aS, m, profile, c) && pieceClear(p, q, angleDeg, t0S, m, bS, profile, c);
  }

  /** True when the still direction u keeps every cone over [t0S, t1S] (the same halving as a leg). */
  static boolean restClear(Vector3D u, double t0S, double t1S, List<KeepOut> cones) {
    if (!(t1S >= t0S)) {
      return true;
    }
    for (KeepOut c : cones) {
      if (!restPieceClear(u, t0S, t1S, c)) {
        return false;
      }
    }
    return true;
  }

  private static boolean restPieceClear(Vector3D u, double a, double b, KeepOut c) {
    double mid = 0.5 * (a + b);
    double clearance = c.clearanceDeg(u, mid) - CHECK_MARGIN_DEG;
    double drift = c.maxDriftDegPerS() * 0.5 * (b - a);
    if (clearance >= drift) {
      return true;
    }
    if (clearance < 0 || b - a < MIN_PIECE_S) {
      return false;
    }
    return restPieceClear(u, a, mid, c) && restPieceClear(u, mid, b, c);
  }

  /** True when every leg of {@code chain} from {@code from} to {@code to}, departing at {@code t0S}, keeps every cone. */
  static boolean chainClear(Vector3D from, Chain chain, Vector3D to, double t0S, RestToRest profile,
      List<KeepOut> cones) {
    Vector3D p = from;
    double t = t0S;
    for (int i = 0; i <= chain.via().size(); i++) {
      Vector3D q = i < chain.via().size() ? chain.via().get(i) : to;
      if (!legClear(p, q, t, profile, cones)) {
        return false;
      }
      t += chain.legS()[i];
      p = q;
    }
    return true;
  }

  /**
   * The tangent-polygon waypoints (class comment) from a to b around the cone of axis s and radius
   * {@code radiusDeg}, going round on {@code side} (+1 or -1) with {@code m} vertices; {@code null} when
   * the construction does not exist (the cone is 90° or wider, an end is inside it or within its radius of
   * the axis's antipode, or the turn needs segments of 170° or more).
   */
  static List<Vector3D> tangentPolygon(Vector3D a, Vector3D b, Vector3D s, double radiusDeg, int side, int m) {
    if (!(radiusDeg > 0 && radiusDeg < 89.9)) {
      return null;
    }
    Tangents g = Tangents.of(a, b, s, radiusDeg);
    if (g == null) {
      return null;
    }
    double phi = g.turn(side) / m;
    if (phi >= Math.toRadians(170)) {
      return null;
    }
    double rv = Math.atan(Math.tan(g.rho) / Math.cos(phi / 2));
    double ta = g.tangentA(side);
    List<Vector3D> out = new ArrayList<>(m);
    for (int i = 1; i <= m; i++) {
      double bearing = ta + side * (i - 0.5) * phi;
      Vector3D radial = new Vector3D(Math.cos(bearing), g.e1, Math.sin(bearing), g.e2);
      out.add(new Vector3D(Math.cos(rv), s, Math.sin(rv), radial).normalize());
    }
    return out;
  }

  /**
   * The tangent construction from a and b to the cone (s, ρ): the frame (e1, e2) about s, each end's
   * bearing about s and distance to it, and the bearing offset β of its tangent point (cos β = tan ρ / tan d);
   * {@code null} when an end is inside the cone or within ρ of its axis's antipode.
   */
  private record Tangents(double rho, Vector3D e1, Vector3D e2, double da, double db, double ba, double bb,
      double betaA, double betaB) {
    static Tangents of(Vector3D a, Vector3D b, Vector3D s, double radiusDeg) {
      double rho = Math.toRadians(radiusDeg);
      double da = Math.toRadians(EigenaxisModel.angleDeg(a, s));
      double db = Math.toRadians(EigenaxisModel.angleDeg(b, s));
      if (da < rho || db < rho || da > Math.PI - rho || db > Math.PI - rho) {
        return null;
      }
      Vector3D e1 = s.orthogonal();
      Vector3D e2 = Vector3D.crossProduct(s, e1);
      return new Tangents(rho, e1, e2, da, db, Math.atan2(Vector3D.dotProduct(a, e2), Vector3D.dotProduct(a, e1)),
          Math.atan2(Vector3D.dotProduct(b, e2), Vector3D.dotProduct(b, e1)),
          Math.acos(clamp(Math.tan(rho) / Math.tan(da))), Math.acos(clamp(Math.tan(rho) / Math.tan(db))));
    }

    /** Bearing of a's tangent point going round on {@code side}. */
    double tangentA(int side) {
      return ba + side * betaA;
    }

    /** The central angle Φ between the two tangent points going round on {@code side}, in [0, 2π). */
    double turn(int side) {
      double phi = side * ((bb - side * betaB) - tangentA(side));
      return phi - 2 * Math.PI * Math.floor(phi / (2 * Math.PI));
    }
  }

  private static double clamp(double x) {
    return Math.max(-1, Math.min(1, x));
  }

  /**
   * Candidate detours from a to b around each cone that blocks the still arc at {@code tS}: both sides,
   * 1 … {@link #MAX_WAYPOINTS} waypoints, each cone widened by {@code widenDeg} plus
   * {@link #CONSTRUCTION_MARGIN_DEG}; sorted by their moving time, quickest first. They are not yet checked.
   */
  static List<Chain> candidates(Vector3D a, Vector3D b, double tS, List<KeepOut> cones, double widenDeg,
      RestToRest profile) {
    List<Chain> out = new ArrayList<>();
    for (KeepOut c : cones) {
      Vector3D s = c.axis(tS);
      double r = c.radiusDeg(tS);
      if (distanceToArcDeg(s, a, b) - r - widenDeg >= CHECK_MARGIN_DEG) {
        continue; // this cone does not block the direct arc
      }
      for (int side = -1; side <= 1; side += 2) {
        for (int m = 1; m <= MAX_WAYPOINTS; m++) {
          List<Vector3D> via = tangentPolygon(a, b, s, r + widenDeg + CONSTRUCTION_MARGIN_DEG, side, m);
          if (via != null) {
            out.add(Chain.of(a, via, b, profile));
          }
        }
      }
    }
    out.sort(Comparator.comparingDouble(Chain::movingS));
    return out;
  }

  /**
   * The lower bound of the class comment: the length of the shortest path from a to b that avoids the
   * still cone (s, radiusDeg), degrees; the direct angle when the arc is clear or the construction does
   * not apply (cone of 90° or more, or an end within the radius of the antipode of s).
   */
  static double shortestAroundDeg(Vector3D a, Vector3D b, Vector3D s, double radiusDeg) {
    double direct = EigenaxisModel.angleDeg(a, b);
    if (distanceToArcDeg(s, a, b) >= radiusDeg || radiusDeg >= 90) {
      return direct;
    }
    Tangents g = Tangents.of(a, b, s, radiusDeg);
    if (g == null) {
      return direct;
    }
    double la = Math.acos(clamp(Math.cos(g.da) / Math.cos(g.rho)));
    double lb = Math.acos(clamp(Math.cos(g.db) / Math.cos(g.rho)));
    double best = Double.POSITIVE_INFINITY;
    for (int side = -1; side <= 1; side += 2) {
      best = Math.min(best, la + lb + g.turn(side) * Math.sin(g.rho));
    }
    return Math.max(direct, Math.toDegrees(best));
  }
}
