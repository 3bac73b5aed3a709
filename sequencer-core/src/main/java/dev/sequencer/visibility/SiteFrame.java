package dev.sequencer.visibility;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.GroundSite;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.orekit.time.AbsoluteDate;

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

  /**
   * Topocentric azimuth (north through east, [0, 360)) and geometric elevation, degrees, of a GCRF unit
   * direction at {@code date}, for a site whose {@link #enuItrf} is {@code enu}.
   */
  static AzEl azEl(AstroContext ctx, AbsoluteDate date, double[] enu, Vector3D gcrfDirection) {
    Vector3D d = ctx.inertial().getStaticTransformTo(ctx.earthFixed(), date).transformVector(gcrfDirection);
    double e = d.getX() * enu[0] + d.getY() * enu[1] + d.getZ() * enu[2];
    double n = d.getX() * enu[3] + d.getY() * enu[4] + d.getZ() * enu[5];
    double u = d.getX() * enu[6] + d.getY() * enu[7] + d.getZ() * enu[8];
    double az = Math.toDegrees(Math.atan2(e, n));
    return new AzEl(az < 0 ? az + 360 : az, Math.toDegrees(Math.asin(Math.max(-1, Math.min(1, u)))));
  }
}
