package dev.sequencer.astro;

import java.util.Objects;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.util.FastMath;
import org.hipparchus.util.MathUtils;
import org.orekit.bodies.GeodeticPoint;
import org.orekit.frames.Frame;
import org.orekit.frames.TopocentricFrame;
import org.orekit.time.AbsoluteDate;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.GroundSite;

/**
 * Geometric horizontal coordinates at a ground site: azimuth from north through east in [0, 360) and
 * elevation above the plane normal to the WGS-84 ellipsoid, both in degrees, for GCRF inputs.
 *
 * <p>No refraction, no diurnal aberration (at most 0.3 arcsec). In the offline context the Earth's
 * orientation has no EOP corrections (UT1 = UTC, no polar motion), which moves an az/el by at most about
 * 0.004 deg. Immutable and thread-safe.
 */
public final class Topocentric {
  private final AstroContext ctx;
  private final TopocentricFrame frame;

  private Topocentric(AstroContext ctx, TopocentricFrame frame) {
    this.ctx = ctx;
    this.frame = frame;
  }

  /** The horizon frame of {@code site} on the context's Earth; the site's horizon mask is not used here. */
  public static Topocentric of(AstroContext ctx, GroundSite site) {
    Objects.requireNonNull(ctx, "ctx");
    Objects.requireNonNull(site, "site");
    GeodeticPoint point = new GeodeticPoint(
        FastMath.toRadians(site.latitudeDeg()), FastMath.toRadians(site.longitudeDeg()), site.altitudeM());
    String name = String.format("site(%.6f, %.6f, %.1f m)", site.latitudeDeg(), site.longitudeDeg(), site.altitudeM());
    return new Topocentric(ctx, new TopocentricFrame(ctx.earth(), point, name));
  }

  /** Az/el of a direction at infinity (a star, or any GCRF direction; need not be a unit vector). */
  public AzEl azEl(Vector3D gcrfDirection, AbsoluteDate date) {
    return toAzEl(ctx.inertial().getStaticTransformTo(frame, date).transformVector(gcrfDirection));
  }

  /** Az/el of a geocentric GCRF position in metres, seen from the site (includes the diurnal parallax). */
  public AzEl azElOfPosition(Vector3D gcrfPosition, AbsoluteDate date) {
    return toAzEl(ctx.inertial().getStaticTransformTo(frame, date).transformPosition(gcrfPosition));
  }

  /** The GCRF unit vector of a horizontal direction at {@code date}; inverse of {@link #azEl}. */
  public Vector3D gcrfDirection(AzEl azEl, AbsoluteDate date) {
    double az = FastMath.toRadians(azEl.azimuthDeg());
    double el = FastMath.toRadians(azEl.elevationDeg());
    // Topocentric axes: x east, y north, z zenith.
    Vector3D local = new Vector3D(FastMath.sin(az) * FastMath.cos(el), FastMath.cos(az) * FastMath.cos(el),
        FastMath.sin(el));
    return frame.getStaticTransformTo(ctx.inertial(), date).transformVector(local);
  }

  /** The Orekit horizon frame, for callers that need Orekit event detectors. */
  Frame frame() {
    return frame;
  }

  private static AzEl toAzEl(Vector3D local) {
    double az = FastMath.atan2(local.getX(), local.getY());
    double el = FastMath.atan2(local.getZ(), FastMath.hypot(local.getX(), local.getY()));
    double azDeg = FastMath.toDegrees(MathUtils.normalizeAngle(az, FastMath.PI));
    // normalizeAngle can round a tiny negative angle up to exactly 2 pi; keep the documented [0, 360).
    return new AzEl(azDeg >= 360.0 ? 0.0 : azDeg, FastMath.toDegrees(el));
  }
}
