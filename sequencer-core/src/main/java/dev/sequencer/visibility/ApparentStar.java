package dev.sequencer.visibility;

import dev.sequencer.astro.Aberration;
import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.RaDec;
import dev.sequencer.slew.PointingTrack;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.orekit.time.AbsoluteDate;

/**
 * A fixed RA/Dec target pointed at its apparent direction (annual aberration for the observer's velocity,
 * the format's A1 convention), seen from a ground site (with azimuth and elevation) or from orbit.
 *
 * <p>Rates. The catalogue direction is fixed, so the apparent direction turns only as the observer's
 * velocity does: at most {@link Aberration#maxRateDegPerS} (about 1.2e-9 deg/s for a ground site, 0.004"
 * an hour; about 2e-6 deg/s from LEO). Its {@link #anchor()} is the catalogue direction with radius the
 * largest aberration, {@link Aberration#maxDisplacementDeg} of the observer's top speed (20.9" for the
 * Earth, about 26" from LEO), which keeps eigenaxis transitions between fixed targets time-independent.
 *
 * <p>Seen from a ground site at geodetic latitude phi, with w the Earth's rotation rate and a the
 * aberration rate, from the spherical-astronomy derivatives (common practice) dEl/dt = -w cos(phi) sin(A)
 * and dA/dt = w (sin phi - cos phi cos A tan El): |dEl/dt| <= w |cos phi| + a and
 * |dA/dt| <= w (|sin phi| + |cos phi| tan|El|) + a / cos El, both rounded up by {@link #MARGIN}.
 * |El| over [t0, t1] is bounded by the smaller of (i) the interval bound
 * |El(t0) + El(t1)| / 2 + (w |cos phi| + a)(t1 - t0) / 2 and (ii) the culminations: the target is never
 * higher than 90 - |phi - dec| nor lower than |phi + dec| - 90, with dec the declination of date (the
 * apparent direction against the Earth's rotation axis, plus {@link #DEC_MARGIN_DEG} for its slow change).
 * Using the J2000 declination instead, as an earlier version did, is up to 0.3 deg wrong in 2020-2060 and
 * made the bound optimistic near culmination.
 */
final class ApparentStar implements PointingTrack {
  /** Earth rotation rate, deg/s (360.98564736629 deg per UT1 day; common practice). */
  static final double EARTH_RATE_DEG_PER_S = PointingTracks.EARTH_RATE_DEG_PER_S;
  /** Relative margin on the rate bounds (the rotation rate of the true equator adds under 1e-7). */
  static final double MARGIN = 1 + 1e-6;
  /** Margin on the declination of date over one interval (nutation and aberration move it < 0.01"/h). */
  static final double DEC_MARGIN_DEG = 1e-3;

  private final Vector3D catalogue;
  private final ObserverVelocity velocity;
  private final double aberrationRateDegPerS;
  private final Anchor anchor;
  private final AstroContext ctx;
  private final AbsoluteDate origin;
  private final double[] enu;
  private final double latitudeDeg;
  private final double sinPhi;
  private final double cosPhi;

  private ApparentStar(RaDec rd, ObserverVelocity velocity, AstroContext ctx, AbsoluteDate origin, GroundSite site) {
    double[] v = TargetTrack.unit(rd.raDeg(), rd.decDeg());
    this.catalogue = new Vector3D(v[0], v[1], v[2]);
    this.velocity = velocity;
    this.aberrationRateDegPerS = Aberration.maxRateDegPerS(velocity.maxSpeedMps(), velocity.maxAccelerationMps2());
    this.anchor = new Anchor(catalogue, Aberration.maxDisplacementDeg(velocity.maxSpeedMps()));
    this.ctx = ctx;
    this.origin = origin;
    this.enu = site == null ? null : SiteFrame.enuItrf(site);
    this.latitudeDeg = site == null ? 0 : site.latitudeDeg();
    this.sinPhi = site == null ? 0 : Math.abs(Math.sin(Math.toRadians(site.latitudeDeg())));
    this.cosPhi = site == null ? 0 : Math.abs(Math.cos(Math.toRadians(site.latitudeDeg())));
  }

  /** Seen from a ground site. */
  static ApparentStar fromSite(RaDec rd, GroundSite site, ObserverVelocity velocity, AstroContext ctx,
      AbsoluteDate origin) {
    return new ApparentStar(rd, velocity, ctx, origin, site);
  }

  /** Seen from an orbit observer (no azimuth and elevation). */
  static ApparentStar fromOrbit(RaDec rd, ObserverVelocity velocity, AstroContext ctx, AbsoluteDate origin) {
    return new ApparentStar(rd, velocity, ctx, origin, null);
  }

  @Override
  public Vector3D inertialDirection(double tS) {
    return Aberration.apparent(catalogue, velocity.at(tS));
  }

  @Override
  public double maxAngularRateDegPerS(double t0S, double t1S) {
    return aberrationRateDegPerS;
  }

  @Override
  public Anchor anchor() {
    return anchor;
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
    return MARGIN * (EARTH_RATE_DEG_PER_S * cosPhi + aberrationRateDegPerS);
  }

  @Override
  public double maxAzimuthRateDegPerS(double t0S, double t1S) {
    if (enu == null) {
      return PointingTrack.super.maxAzimuthRateDegPerS(t0S, t1S);
    }
    double elAbsMax = Math.min(maxAbsElevationDeg(t0S, t1S),
        Math.abs(azEl(t0S).elevationDeg() + azEl(t1S).elevationDeg()) / 2
            + maxElevationRateDegPerS(t0S, t1S) * (t1S - t0S) / 2);
    if (elAbsMax >= 89.999) {
      return Double.POSITIVE_INFINITY; // through the zenith (or nadir) the azimuth can flip: no finite bound
    }
    double cosEl = Math.cos(Math.toRadians(elAbsMax));
    return MARGIN * (EARTH_RATE_DEG_PER_S * (sinPhi + cosPhi * Math.tan(Math.toRadians(elAbsMax)))
        + aberrationRateDegPerS / cosEl);
  }

  /** The larger of the upper and the (negated) lower culmination, from the declination of date at both ends. */
  private double maxAbsElevationDeg(double t0S, double t1S) {
    double best = 0;
    for (double t : new double[] {t0S, t1S}) {
      Vector3D pole = ctx.earthFixed().getStaticTransformTo(ctx.inertial(), origin.shiftedBy(t))
          .transformVector(Vector3D.PLUS_K);
      double dec = Math.toDegrees(Math.asin(Math.max(-1, Math.min(1, Vector3D.dotProduct(inertialDirection(t), pole)))));
      double upper = 90 - Math.abs(latitudeDeg - dec);
      double lower = 90 - Math.abs(latitudeDeg + dec);
      best = Math.max(best, Math.max(upper, lower) + DEC_MARGIN_DEG);
    }
    return best;
  }
}
