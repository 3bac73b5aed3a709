package dev.sequencer.model;

import java.util.List;

/**
 * A ground site on the WGS-84 ellipsoid with a horizon mask and, optionally, refraction.
 *
 * <p>The mask lists (azimuth, minimum elevation) points, interpolated linearly in azimuth and wrapped
 * at 360 deg; an empty mask means the geometric horizon (0 deg). With {@code refraction} (nullable), the
 * target elevations compared with the elevation limits and the mask are observed ones
 * ({@link #observedElevationDeg}); without it, geometric.
 */
public record GroundSite(double latitudeDeg, double longitudeDeg, double altitudeM, List<AzEl> horizonMask,
    Refraction refraction) implements Observer {
  public GroundSite {
    Checks.finite("latitudeDeg", latitudeDeg);
    Checks.finite("longitudeDeg", longitudeDeg);
    Checks.finite("altitudeM", altitudeM);
    horizonMask = List.copyOf(horizonMask);
  }

  /** A site without refraction. */
  public GroundSite(double latitudeDeg, double longitudeDeg, double altitudeM, List<AzEl> horizonMask) {
    this(latitudeDeg, longitudeDeg, altitudeM, horizonMask, null);
  }

  /** A copy with this refraction ({@code null}: none). */
  public GroundSite withRefraction(Refraction r) {
    return new GroundSite(latitudeDeg, longitudeDeg, altitudeM, horizonMask, r);
  }

  /**
   * The elevation of a target as the constraints see it, degrees: the observed (refracted) elevation when
   * the site gives refraction, else the geometric one unchanged. The Sun's and Moon's elevations are never
   * refracted (format A1).
   */
  public double observedElevationDeg(double geometricElevationDeg) {
    return refraction == null ? geometricElevationDeg : refraction.observedElevationDeg(geometricElevationDeg);
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
