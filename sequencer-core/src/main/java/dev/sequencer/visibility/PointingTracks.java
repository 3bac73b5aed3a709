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
 * <p>Supported: fixed RA/Dec targets from an orbit observer and from a ground site, pointed at their
 * apparent direction (annual aberration, {@link ApparentStar}; azimuth and elevation turning with the Earth
 * from a ground site); orbiting objects seen from a ground site and Earth points seen from orbit
 * ({@link MovingTracks}). The observer's velocity for the aberration is tabulated once per scenario over
 * the horizon and {@link #MARGIN_S} either side (a slew may end after the horizon).
 */
public final class PointingTracks {
  /** Earth rotation rate, deg/s (360.9856 deg per solar day; common practice). */
  static final double EARTH_RATE_DEG_PER_S = 360.98564736629 / 86400.0;

  /** Seconds before and after the horizon covered by the observer-velocity table. */
  static final double MARGIN_S = 3600.0;

  private PointingTracks() {}

  private static ObserverVelocity velocity(Scenario scenario, AstroContext ctx, AbsoluteDate origin) {
    double horizonS = ctx.date(scenario.horizon().end()).durationFrom(origin);
    return ObserverVelocity.of(scenario.observer(), ctx, origin, -MARGIN_S, horizonS + MARGIN_S);
  }

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
    ObserverVelocity velocity = scenario.observer() != null
        && scenario.requests().stream().anyMatch(r -> r.target() instanceof RaDec) ? velocity(scenario, ctx, origin)
        : null;
    for (Request r : scenario.requests()) {
      Target t = r.target();
      if (t instanceof RaDec rd) {
        out.add(scenario.observer() == null ? PointingTrack.fixed(rd) // no geometry: matrix and fixed models only
            : site == null ? ApparentStar.fromOrbit(rd, velocity, ctx, origin)
            : ApparentStar.fromSite(rd, site, velocity, ctx, origin));
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
      AbsoluteDate origin = ctx.date(scenario.horizon().start());
      if (scenario.observer() == null) {
        return PointingTrack.fixed(rd); // no observer: no velocity, only the matrix and fixed models apply
      }
      ObserverVelocity velocity = velocity(scenario, ctx, origin);
      return scenario.observer() instanceof GroundSite g ? ApparentStar.fromSite(rd, g, velocity, ctx, origin)
          : ApparentStar.fromOrbit(rd, velocity, ctx, origin);
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
}
