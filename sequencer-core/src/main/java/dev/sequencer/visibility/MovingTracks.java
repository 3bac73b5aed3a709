package dev.sequencer.visibility;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.slew.PointingTrack;
import java.util.function.Function;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.orekit.bodies.GeodeticPoint;
import org.orekit.frames.Frame;
import org.orekit.frames.StaticTransform;
import org.orekit.propagation.Propagator;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.propagation.analytical.tle.TLEPropagator;
import org.orekit.time.AbsoluteDate;
import org.orekit.utils.Constants;
import org.orekit.utils.PVCoordinatesProvider;

/**
 * Pointing tracks of moving lines of sight: an orbiting object (TLE) seen from a ground site, and a point
 * on the Earth seen from an orbit observer. Both are "a target point P(t) seen from an observer point
 * O(t)", with the line of sight u = (P − O)/|P − O|.
 *
 * <p>Rate bounds (upper bounds, as {@link PointingTrack} requires). The line of sight turns at
 * |du/dt| = |v_perp| / |P − O| <= V / d_min, where V bounds the relative speed |dP/dt − dO/dt| and d_min
 * the range over the interval. V: for an orbit, the perigee speed sqrt(mu (2/r_p − 1/a)) of its mean
 * elements plus 2 % for perturbations (common practice: J2 changes LEO speeds by well under 1 %); for a
 * point on the Earth, its rotation speed 465.1 m/s·cos(latitude) plus 1 m/s; V is their sum. d_min:
 * the range at the interval's middle minus V times the half-width, but never below the gap between the
 * two bodies' geocentric distances (perigee radius − Earth-point radius, at least 1 km), a bound that
 * holds at every instant. Seen from a ground mount the topocentric frame also turns with the Earth, so
 * elevation moves at most |du/dt| + w_E, and azimuth at most that over cos(elevation), with the
 * elevation bounded over the interval by its middle value plus the elevation-rate bound times the
 * half-width (infinite when that reaches the zenith).
 */
final class MovingTracks {
  /** Earth rotation rate, rad/s. */
  private static final double EARTH_RATE_RAD_PER_S = Constants.WGS84_EARTH_ANGULAR_VELOCITY;

  private MovingTracks() {}

  /** An orbiting object seen from a ground site (alt-az and eigenaxis mounts). */
  static PointingTrack objectFromSite(OrbitingTarget target, GroundSite site, AstroContext ctx, AbsoluteDate origin) {
    TLE tle = new TLE(target.tle().line1(), target.tle().line2(), ctx.utc());
    Propagator p = TLEPropagator.selectExtrapolator(tle, ctx.dataContext().getFrames().getTEME());
    Vector3D siteItrf = ctx.earth().transform(new GeodeticPoint(
        Math.toRadians(site.latitudeDeg()), Math.toRadians(site.longitudeDeg()), site.altitudeM()));
    double orbitSpeed = perigeeSpeed(tle);
    double siteSpeed = EARTH_RATE_RAD_PER_S * Math.hypot(siteItrf.getX(), siteItrf.getY()) + 1.0;
    double minGap = Math.max(1000.0, perigeeRadius(tle) - siteItrf.getNorm());
    Frame gcrf = ctx.inertial();
    return new Track(ctx, origin, t -> p.getPosition(origin.shiftedBy(t), gcrf),
        t -> toGcrf(ctx, origin, t).transformPosition(siteItrf), orbitSpeed + siteSpeed, minGap,
        SiteFrame.enuItrf(site));
  }

  /** A point on the Earth seen from an orbit observer (eigenaxis mounts). */
  static PointingTrack pointFromOrbit(EarthPoint point, PVCoordinatesProvider observer, double observerPerigeeRadiusM,
      double observerPerigeeSpeed, AstroContext ctx, AbsoluteDate origin) {
    Vector3D pointItrf = ctx.earth().transform(new GeodeticPoint(
        Math.toRadians(point.latitudeDeg()), Math.toRadians(point.longitudeDeg()), point.altitudeM()));
    double pointSpeed = EARTH_RATE_RAD_PER_S * Math.hypot(pointItrf.getX(), pointItrf.getY()) + 1.0;
    double minGap = Math.max(1000.0, observerPerigeeRadiusM - pointItrf.getNorm());
    Frame gcrf = ctx.inertial();
    return new Track(ctx, origin, t -> toGcrf(ctx, origin, t).transformPosition(pointItrf),
        t -> observer.getPosition(origin.shiftedBy(t), gcrf), observerPerigeeSpeed + pointSpeed, minGap, null);
  }

  private static StaticTransform toGcrf(AstroContext ctx, AbsoluteDate origin, double tS) {
    return ctx.earthFixed().getStaticTransformTo(ctx.inertial(), origin.shiftedBy(tS));
  }

  /** Perigee speed of the TLE's mean orbit plus 2 %, m/s. */
  static double perigeeSpeed(TLE tle) {
    double a = semiMajorAxis(tle);
    double rp = a * (1 - tle.getE());
    return 1.02 * Math.sqrt(Constants.WGS84_EARTH_MU * (2 / rp - 1 / a));
  }

  /** Perigee radius of the TLE's mean orbit less 2 %, m. */
  static double perigeeRadius(TLE tle) {
    return 0.98 * semiMajorAxis(tle) * (1 - tle.getE());
  }

  private static double semiMajorAxis(TLE tle) {
    double n = tle.getMeanMotion();
    return Math.cbrt(Constants.WGS84_EARTH_MU / (n * n));
  }

  /** A target point seen from an observer point, both given as GCRF positions in metres. */
  private static final class Track implements PointingTrack {
    private final AstroContext ctx;
    private final AbsoluteDate origin;
    private final Function<Double, Vector3D> target;
    private final Function<Double, Vector3D> observer;
    private final double relativeSpeed;
    private final double minRange;
    private final double[] enu;

    Track(AstroContext ctx, AbsoluteDate origin, Function<Double, Vector3D> target,
        Function<Double, Vector3D> observer, double relativeSpeed, double minRange, double[] enu) {
      this.ctx = ctx;
      this.origin = origin;
      this.target = target;
      this.observer = observer;
      this.relativeSpeed = relativeSpeed;
      this.minRange = minRange;
      this.enu = enu;
    }

    private Vector3D lineOfSight(double tS) {
      return target.apply(tS).subtract(observer.apply(tS));
    }

    @Override
    public Vector3D inertialDirection(double tS) {
      return lineOfSight(tS).normalize();
    }

    @Override
    public double maxAngularRateDegPerS(double t0S, double t1S) {
      double mid = 0.5 * (t0S + t1S);
      double half = 0.5 * (t1S - t0S);
      double range = Math.max(minRange, lineOfSight(mid).getNorm() - relativeSpeed * half);
      return Math.toDegrees(relativeSpeed / range);
    }

    @Override
    public AzEl azEl(double tS) {
      if (enu == null) {
        return PointingTrack.super.azEl(tS);
      }
      return SiteFrame.azEl(ctx, origin.shiftedBy(tS), enu, inertialDirection(tS));
    }

    @Override
    public double maxElevationRateDegPerS(double t0S, double t1S) {
      if (enu == null) {
        return PointingTrack.super.maxElevationRateDegPerS(t0S, t1S);
      }
      return maxAngularRateDegPerS(t0S, t1S) + Math.toDegrees(EARTH_RATE_RAD_PER_S);
    }

    @Override
    public double maxAzimuthRateDegPerS(double t0S, double t1S) {
      if (enu == null) {
        return PointingTrack.super.maxAzimuthRateDegPerS(t0S, t1S);
      }
      double rate = maxElevationRateDegPerS(t0S, t1S);
      double elMax = Math.abs(azEl(0.5 * (t0S + t1S)).elevationDeg()) + rate * 0.5 * (t1S - t0S);
      if (elMax >= 89.999) {
        return Double.POSITIVE_INFINITY;
      }
      return rate / Math.cos(Math.toRadians(elMax));
    }
  }
}
