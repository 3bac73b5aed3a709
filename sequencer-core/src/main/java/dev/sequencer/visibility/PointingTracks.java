package dev.sequencer.visibility;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Pointing;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.Request;
import dev.sequencer.model.Target;
import org.orekit.utils.PVCoordinatesProvider;
import dev.sequencer.model.Scenario;
import dev.sequencer.slew.PointingTrack;
import java.util.ArrayList;
import java.util.List;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.orekit.time.AbsoluteDate;

/**
 * The instrument's pointing for each request over time, from the scenario's geometry, for the slew models.
 *
 * <p>Supported: fixed RA/Dec targets from an orbit observer (a constant inertial direction) and from a ground
 * site (constant inertial direction; azimuth and elevation turning with the Earth); orbiting objects seen
 * from a ground site and Earth points seen from orbit ({@link MovingTracks}). Rate bounds for a fixed
 * star at geodetic latitude phi, from the spherical-astronomy derivatives (common practice):
 * |dEl/dt| = w cos(phi) |sin A| &lt;= w and |dA/dt| = w |sin(phi) - cos(phi) cos(A) tan(El)| &lt;=
 * w (|sin phi| + |cos phi| tan El), with w the Earth's rotation rate and El bounded over the interval by
 * its larger end value plus w times the interval length.
 */
public final class PointingTracks {
  /** Earth rotation rate, deg/s (360.9856 deg per solar day; common practice). */
  static final double EARTH_RATE_DEG_PER_S = 360.98564736629 / 86400.0;

  private PointingTracks() {}

  /** One track per request, in request order. */
  public static List<PointingTrack> of(Scenario scenario, AstroContext ctx) {
    List<PointingTrack> out = new ArrayList<>();
    AbsoluteDate origin = ctx.date(scenario.horizon().start());
    GroundSite site = scenario.observer() instanceof GroundSite g ? g : null;
    PVCoordinatesProvider orbit = null;
    double perigeeRadius = 0;
    double perigeeSpeed = 0;
    if (scenario.observer() instanceof OrbitObserver o) {
      orbit = Observers.motion(o, ctx, origin, ctx.date(scenario.horizon().end()));
      double[] rv = Observers.perigeeRadiusAndSpeed(o, ctx);
      perigeeRadius = rv[0];
      perigeeSpeed = rv[1];
    }
    for (Request r : scenario.requests()) {
      Target t = r.target();
      if (t instanceof RaDec rd) {
        out.add(site == null ? PointingTrack.fixed(rd) : new StarFromSite(rd, site, ctx, origin));
      } else if (t instanceof OrbitingTarget ot && site != null) {
        out.add(MovingTracks.objectFromSite(ot, site, ctx, origin));
      } else if (t instanceof EarthPoint ep && orbit != null) {
        out.add(MovingTracks.pointFromOrbit(ep, orbit, perigeeRadius, perigeeSpeed, ctx, origin));
      } else {
        throw new UnsupportedOperationException("requests " + r.id() + ": slew model '" + scenario.slew().model()
            + "' cannot follow this target from this observer (an orbiting object seen from orbit); use the "
            + "'fixed' or 'matrix' slew model");
      }
    }
    return out;
  }

  /** The start pointing as a track, or {@code null} when the scenario gives none. */
  public static PointingTrack start(Scenario scenario, AstroContext ctx) {
    Pointing p = scenario.startPointing();
    if (p == null) {
      return null;
    }
    if (p instanceof RaDec rd) {
      return scenario.observer() instanceof GroundSite g
          ? new StarFromSite(rd, g, ctx, ctx.date(scenario.horizon().start()))
          : PointingTrack.fixed(rd);
    }
    AzElPointing ae = (AzElPointing) p;
    PointingTrack parked = PointingTrack.parked(ae);
    GroundSite site = (GroundSite) scenario.observer();
    AbsoluteDate origin = ctx.date(scenario.horizon().start());
    double[] enu = SiteFrame.enuItrf(site);
    double az = Math.toRadians(ae.azimuthDeg());
    double el = Math.toRadians(ae.elevationDeg());
    double e = Math.cos(el) * Math.sin(az);
    double n = Math.cos(el) * Math.cos(az);
    double u = Math.sin(el);
    Vector3D itrf = new Vector3D(e * enu[0] + n * enu[3] + u * enu[6], e * enu[1] + n * enu[4] + u * enu[7],
        e * enu[2] + n * enu[5] + u * enu[8]);
    // A parked mount whose line of sight turns with the Earth (for an eigenaxis model from the ground).
    return new PointingTrack() {
      @Override
      public Vector3D inertialDirection(double tS) {
        return ctx.earthFixed().getStaticTransformTo(ctx.inertial(), origin.shiftedBy(tS)).transformVector(itrf);
      }

      @Override
      public double maxAngularRateDegPerS(double t0S, double t1S) {
        return EARTH_RATE_DEG_PER_S;
      }

      @Override
      public AzEl azEl(double tS) {
        return parked.azEl(tS);
      }

      @Override
      public double maxAzimuthRateDegPerS(double t0S, double t1S) {
        return 0;
      }

      @Override
      public double maxElevationRateDegPerS(double t0S, double t1S) {
        return 0;
      }
    };
  }

  /** A fixed star seen from a ground site: constant inertial direction, az/el turning with the Earth. */
  private static final class StarFromSite implements PointingTrack {
    private final Vector3D u;
    private final double[] enu;
    private final double sinPhi;
    private final double cosPhi;
    private final AstroContext ctx;
    private final AbsoluteDate origin;
    private final double culminationDeg;

    StarFromSite(RaDec rd, GroundSite site, AstroContext ctx, AbsoluteDate origin) {
      double[] v = TargetTrack.unit(rd.raDeg(), rd.decDeg());
      this.u = new Vector3D(v[0], v[1], v[2]);
      this.enu = SiteFrame.enuItrf(site);
      this.sinPhi = Math.abs(Math.sin(Math.toRadians(site.latitudeDeg())));
      this.cosPhi = Math.abs(Math.cos(Math.toRadians(site.latitudeDeg())));
      this.ctx = ctx;
      this.origin = origin;
      this.culminationDeg = 90 - Math.abs(site.latitudeDeg() - rd.decDeg());
    }

    @Override
    public Vector3D inertialDirection(double tS) {
      return u;
    }

    @Override
    public double maxAngularRateDegPerS(double t0S, double t1S) {
      return 0;
    }

    @Override
    public AzEl azEl(double tS) {
      return SiteFrame.azEl(ctx, origin.shiftedBy(tS), enu, u);
    }

    @Override
    public double maxAzimuthRateDegPerS(double t0S, double t1S) {
      // The star is never higher than at upper culmination, 90 - |latitude - declination| (common practice).
      double elMax = Math.min(culminationDeg, Math.max(azEl(t0S).elevationDeg(), azEl(t1S).elevationDeg())
          + EARTH_RATE_DEG_PER_S * (t1S - t0S));
      if (elMax >= 89.999) {
        return Double.POSITIVE_INFINITY; // through the zenith the azimuth can flip: no finite bound
      }
      return EARTH_RATE_DEG_PER_S * (sinPhi + cosPhi * Math.tan(Math.toRadians(elMax)));
    }

    @Override
    public double maxElevationRateDegPerS(double t0S, double t1S) {
      return EARTH_RATE_DEG_PER_S * cosPhi;
    }
  }
}
