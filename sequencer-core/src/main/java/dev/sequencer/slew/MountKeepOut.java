package dev.sequencer.slew;

import dev.sequencer.model.AzEl;
import java.util.List;

/**
 * The Sun keep-out along an alt-az mount's slews (spec A3): each axis moves from its start to its end value
 * with its own rest-to-rest profile, both starting at the departure; then the mount rests at the end
 * direction (settle, and any wait) until the arrival. Every part must keep each {@link SiteKeepOut}'s
 * minimum separation.
 *
 * <p><b>Exact check ({@link #clear}).</b> The moving part is sampled every Δ seconds with Δ chosen so that
 * the line of sight moves at most {@value #STEP_DEG}° between samples: its great-circle speed is at most
 * |daz/dt|·cos(el) + |del/dt| ≤ azimuth rate + elevation rate. Between two samples the line of sight is
 * within Δ/2 · (that speed) of one of them and the cone's axis within Δ/2 · (its drift), so a path whose
 * samples all keep clearance ≥ Δ/2 · (speed + drift) keeps the cone everywhere (a Lipschitz argument, no
 * root finding). The cone's drift here is {@link SiteKeepOut#maxSiteDriftDegPerS}, in the site's frame. The rest at the end direction is checked the same way with only the cone moving. The
 * check can refuse a path that grazes the cone by less than that margin (≤ {@value #STEP_DEG}° plus the
 * Sun's motion over one step): conservative, never unsafe.
 *
 * <p><b>Bound ({@link #mayBind}).</b> For a pairwise bound over departure and arrival ranges: the path's
 * elevation stays between the two ends' (each axis moves monotonically), and its unwrapped azimuth within
 * the given distance of the from azimuth. With the cone's axis S at the middle of the time span, which it
 * leaves by at most ρ = drift · half-span, any path point P has sep(P, S(t)) ≥ sep(P, S) − ρ, and for
 * P in an azimuth–elevation box with azimuth gap Δ to S and elevation gap g:
 * cos sep(P, S) = cos(el_P − el_S) − cos el_P cos el_S (1 − cos Δaz) ≤ cos g − c_P c_S (1 − cos Δ), with
 * c_P the least cos el_P over the box. When that lower bound minus ρ reaches the minimum the keep-out cannot
 * bind anywhere in the ranges: the leg is the one without keep-out and the ordinary bound holds.
 */
final class MountKeepOut {
  /** Largest motion of the line of sight between two samples, degrees. */
  static final double STEP_DEG = 0.1;
  /** Longest step while only the cone moves (a rest), seconds. */
  static final double REST_STEP_S = 60;

  /** Spacing of the table of each cone's axis used by {@link #mayBind}, seconds. */
  static final double TABLE_STEP_S = 60;
  /** Most table entries per cone (longer spans use a coarser step). */
  static final int MAX_TABLE = 200_000;

  private final List<SiteKeepOut> cones;
  private final double tableFromS;
  private final double tableStepS;
  /** Per cone: azimuth and elevation of the axis at tableFromS + i·tableStepS. */
  private final double[][] tableAz;
  private final double[][] tableEl;

  /** Keep-outs for slews within [fromS, toS] (the axes are tabulated there once, for the pairwise bounds). */
  MountKeepOut(List<SiteKeepOut> cones, double fromS, double toS) {
    this.cones = List.copyOf(cones);
    double span = Math.max(0, toS - fromS);
    int n = cones.isEmpty() ? 0 : (int) Math.min(MAX_TABLE, Math.ceil(span / TABLE_STEP_S)) + 1;
    this.tableFromS = fromS;
    this.tableStepS = n > 1 ? span / (n - 1) : TABLE_STEP_S;
    this.tableAz = new double[this.cones.size()][n];
    this.tableEl = new double[this.cones.size()][n];
    for (int c = 0; c < this.cones.size(); c++) {
      for (int i = 0; i < n; i++) {
        AzEl a = this.cones.get(c).azEl(fromS + i * tableStepS);
        tableAz[c][i] = a.azimuthDeg();
        tableEl[c][i] = a.elevationDeg();
      }
    }
  }

  /** No keep-outs. */
  static MountKeepOut empty() {
    return new MountKeepOut(List.of(), 0, 0);
  }

  boolean none() {
    return cones.isEmpty();
  }

  /**
   * True when the two-axis path from (fromAz, fromEl) to (toAz, toEl) (unwrapped azimuths, degrees), moving
   * from {@code departureS} with the model's axis profiles, then resting at the end until {@code arrivalS},
   * keeps every cone.
   */
  boolean clear(AltAzModel model, double fromAzDeg, double fromElDeg, double toAzDeg, double toElDeg,
      double departureS, double arrivalS) {
    if (cones.isEmpty()) {
      return true;
    }
    double dAz = toAzDeg - fromAzDeg;
    double dEl = toElDeg - fromElDeg;
    double azS = model.azimuthAxis().seconds(Math.abs(dAz));
    double elS = model.elevationAxis().seconds(Math.abs(dEl));
    double moveS = Math.max(azS, elS);
    double speed = model.azimuthAxis().rateDegPerS() + model.elevationAxis().rateDegPerS();
    for (SiteKeepOut c : cones) {
      double drift = c.maxSiteDriftDegPerS();
      if (moveS > 0) {
        int n = (int) Math.min(1_000_000, Math.max(1, Math.ceil(moveS * speed / STEP_DEG)));
        double step = moveS / n;
        double margin = 0.5 * step * (speed + drift);
        for (int i = 0; i <= n; i++) {
          double t = i * step;
          double az = fromAzDeg + Math.signum(dAz) * model.azimuthAxis().angleAt(Math.abs(dAz), t);
          double el = fromElDeg + Math.signum(dEl) * model.elevationAxis().angleAt(Math.abs(dEl), t);
          if (clearanceDeg(c, az, el, departureS + t) < margin) {
            return false;
          }
        }
      }
      double restFrom = departureS + moveS;
      double restTo = Math.max(restFrom, arrivalS);
      int m = (int) Math.max(1, Math.ceil((restTo - restFrom) / REST_STEP_S));
      double step = (restTo - restFrom) / m;
      for (int i = 0; i <= m; i++) {
        if (clearanceDeg(c, toAzDeg, toElDeg, restFrom + i * step) < 0.5 * step * drift) {
          return false;
        }
      }
    }
    return true;
  }

  /** Clearance of the direction (az, el) from cone {@code c} at {@code tS}: separation minus radius, degrees. */
  static double clearanceDeg(SiteKeepOut c, double azDeg, double elDeg, double tS) {
    AzEl s = c.azEl(tS);
    return separationDeg(azDeg, elDeg, s.azimuthDeg(), s.elevationDeg()) - c.radiusDeg(tS) - c.azElErrorDeg();
  }

  /** Great-circle separation of two azimuth–elevation directions, degrees (haversine, well-conditioned). */
  static double separationDeg(double az1Deg, double el1Deg, double az2Deg, double el2Deg) {
    double p1 = Math.toRadians(el1Deg);
    double p2 = Math.toRadians(el2Deg);
    double dp = p2 - p1;
    double dl = Math.toRadians(az2Deg - az1Deg);
    double h = Math.sin(dp / 2) * Math.sin(dp / 2) + Math.cos(p1) * Math.cos(p2) * Math.sin(dl / 2) * Math.sin(dl / 2);
    return Math.toDegrees(2 * Math.asin(Math.min(1, Math.sqrt(h))));
  }

  /**
   * False when no cone can bind on any path whose elevation lies in [elLoDeg, elHiDeg] and whose unwrapped
   * azimuth lies in [azLoDeg, azHiDeg], over [fromS, toS] (class comment); true when one may. Two proofs,
   * either suffices: the box against the axis at the nearest tabulated instant to the middle, less how far
   * the axis can move in the rest of the span; or the elevation gap alone, against the axis's highest
   * elevation over the span (the table's highest entry in it plus the drift over half a table step).
   */
  boolean mayBind(double azLoDeg, double azHiDeg, double elLoDeg, double elHiDeg, double fromS, double toS) {
    for (int c = 0; c < cones.size(); c++) {
      SiteKeepOut cone = cones.get(c);
      double rate = cone.maxSiteDriftDegPerS();
      double radius = Math.max(cone.radiusDeg(fromS), Math.max(cone.radiusDeg(0.5 * (fromS + toS)), cone.radiusDeg(toS)))
          + cone.azElErrorDeg();
      int n = tableAz[c].length;
      int i0 = (int) Math.floor((fromS - tableFromS) / tableStepS);
      int i1 = (int) Math.ceil((toS - tableFromS) / tableStepS);
      if (n == 0 || i0 < 0 || i1 >= n) {
        double mid = 0.5 * (fromS + toS);
        AzEl s = cone.azEl(mid);
        if (lowerSeparationDeg(azLoDeg, azHiDeg, elLoDeg, elHiDeg, s.azimuthDeg(), s.elevationDeg())
            - rate * 0.5 * (toS - fromS) < radius) {
          return true;
        }
        continue;
      }
      int im = (int) Math.round((0.5 * (fromS + toS) - tableFromS) / tableStepS);
      double tm = tableFromS + im * tableStepS;
      double rho = rate * Math.max(Math.abs(toS - tm), Math.abs(tm - fromS));
      if (lowerSeparationDeg(azLoDeg, azHiDeg, elLoDeg, elHiDeg, tableAz[c][im], tableEl[c][im]) - rho >= radius) {
        continue;
      }
      double highest = Double.NEGATIVE_INFINITY;
      for (int i = i0; i <= i1; i++) {
        highest = Math.max(highest, tableEl[c][i]);
      }
      highest += rate * 0.5 * tableStepS;
      // Separation is at least the elevation difference: the least path elevation minus the axis's highest.
      if (Math.max(-90, elLoDeg) - highest >= radius) {
        continue;
      }
      return true;
    }
    return false;
  }

  /** A lower bound on the separation between any point of the azimuth–elevation box and (azS, elS), degrees. */
  static double lowerSeparationDeg(double azLoDeg, double azHiDeg, double elLoDeg, double elHiDeg, double azSDeg,
      double elSDeg) {
    double lo = Math.max(-90, elLoDeg);
    double hi = Math.min(90, elHiDeg);
    double gap = elSDeg < lo ? lo - elSDeg : elSDeg > hi ? elSDeg - hi : 0;
    double dAz;
    if (azHiDeg - azLoDeg >= 360) {
      dAz = 0;
    } else {
      // Azimuth gap from azS to the interval, on the circle.
      double rel = ((azSDeg - azLoDeg) % 360 + 360) % 360; // azS measured from azLo, in [0, 360)
      double width = azHiDeg - azLoDeg;
      dAz = rel <= width ? 0 : Math.min(rel - width, 360 - rel);
    }
    // cos is concave on [-90, 90]: its least value over [lo, hi] is at an end.
    double cosP = Math.min(Math.cos(Math.toRadians(lo)), Math.cos(Math.toRadians(hi)));
    double cosS = Math.cos(Math.toRadians(elSDeg));
    double cosSep = Math.cos(Math.toRadians(gap)) - Math.max(0, cosP) * Math.max(0, cosS)
        * (1 - Math.cos(Math.toRadians(dAz)));
    return Math.toDegrees(Math.acos(Math.max(-1, Math.min(1, cosSep))));
  }
}
