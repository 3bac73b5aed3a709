package dev.sequencer.model;

import java.util.List;

/**
 * A ground site on the WGS-84 ellipsoid with a horizon mask.
 *
 * <p>The mask lists (azimuth, minimum elevation) points, interpolated linearly in azimuth and wrapped
 * at 360 deg; an empty mask means the geometric horizon (0 deg).
 */
public record GroundSite(double latitudeDeg, double longitudeDeg, double altitudeM, List<AzEl> horizonMask)
    implements Observer {
  public GroundSite {
    Checks.finite("latitudeDeg", latitudeDeg);
    Checks.finite("longitudeDeg", longitudeDeg);
    Checks.finite("altitudeM", altitudeM);
    horizonMask = List.copyOf(horizonMask);
  }

  /** Minimum elevation of the mask at {@code azimuthDeg}, linear in azimuth, 0 when the mask is empty. */
  public double maskElevationDeg(double azimuthDeg) {
    if (horizonMask.isEmpty()) {
      return 0.0;
    }
    if (horizonMask.size() == 1) {
      return horizonMask.get(0).elevationDeg();
    }
    double az = ((azimuthDeg % 360.0) + 360.0) % 360.0;
    List<AzEl> sorted = sortedMask();
    int n = sorted.size();
    for (int i = 0; i < n; i++) {
      AzEl a = sorted.get(i);
      AzEl b = sorted.get((i + 1) % n);
      double a0 = norm(a.azimuthDeg());
      double span = norm(b.azimuthDeg()) - a0;
      if (span <= 0) {
        span += 360.0;
      }
      double offset = az - a0;
      if (offset < 0) {
        offset += 360.0;
      }
      if (offset <= span) {
        double f = span == 0 ? 0 : offset / span;
        return a.elevationDeg() + f * (b.elevationDeg() - a.elevationDeg());
      }
    }
    return sorted.get(0).elevationDeg();
  }

  private List<AzEl> sortedMask() {
    return horizonMask.stream()
        .sorted((p, q) -> Double.compare(norm(p.azimuthDeg()), norm(q.azimuthDeg())))
        .toList();
  }

  private static double norm(double az) {
    return ((az % 360.0) + 360.0) % 360.0;
  }
}
