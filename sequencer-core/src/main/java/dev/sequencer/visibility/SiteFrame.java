package dev.sequencer.visibility;

import dev.sequencer.model.GroundSite;

/** The local east, north and up unit vectors of a geodetic site, in Earth-fixed axes. */
final class SiteFrame {
  private SiteFrame() {}

  /** {east x, y, z, north x, y, z, up x, y, z} for the site's geodetic latitude and longitude. */
  static double[] enuItrf(GroundSite site) {
    double phi = Math.toRadians(site.latitudeDeg());
    double lam = Math.toRadians(site.longitudeDeg());
    double sp = Math.sin(phi);
    double cp = Math.cos(phi);
    double sl = Math.sin(lam);
    double cl = Math.cos(lam);
    return new double[] {-sl, cl, 0, -sp * cl, -sp * sl, cp, cp * cl, cp * sl, sp};
  }
}
