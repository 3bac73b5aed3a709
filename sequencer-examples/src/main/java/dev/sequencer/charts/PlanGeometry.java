package dev.sequencer.charts;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.astro.Topocentric;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import java.time.Instant;
import java.util.HashMap;
import java.util.Map;
import java.util.Optional;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.util.FastMath;
import org.orekit.bodies.GeodeticPoint;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.propagation.analytical.tle.TLEPropagator;
import org.orekit.time.AbsoluteDate;

/**
 * Where a plan points, for pictures and spreadsheets: each request's line of sight as RA/Dec and, at a
 * ground site, as azimuth/elevation; the Sun's elevation at the site; the Sun and Moon directions.
 *
 * <p>Supported: fixed RA/Dec targets from any observer; orbiting targets (TLE, SGP4) from a ground site,
 * as the topocentric geometric direction (no light time, aberration or refraction, as the scenario format
 * says). Earth points, and orbiting targets seen from a spacecraft, give no pointing here (empty). Sun and
 * Moon directions are geocentric: from low Earth orbit the Moon's parallax (at most about 1 deg) is
 * neglected, which is fine for a picture but not for a keep-out check. Not thread-safe (caches propagators).
 */
public final class PlanGeometry {
  private final Scenario scenario;
  private final AstroContext ctx;
  private final GroundSite site;
  private final Topocentric topo;
  private final Vector3D siteItrfM;
  private final Map<String, TLEPropagator> propagators = new HashMap<>();

  /** The geometry of {@code scenario} in the context {@code ctx}. */
  public PlanGeometry(Scenario scenario, AstroContext ctx) {
    this.scenario = scenario;
    this.ctx = ctx;
    this.site = scenario.observer() instanceof GroundSite g ? g : null;
    this.topo = site == null ? null : Topocentric.of(ctx, site);
    this.siteItrfM = site == null ? null : ctx.earth().transform(new GeodeticPoint(
        FastMath.toRadians(site.latitudeDeg()), FastMath.toRadians(site.longitudeDeg()), site.altitudeM()));
  }

  /**
   * The geometry of resource {@code id} of a scenario with several resources (A6): its own observer over the
   * same requests; this geometry itself for {@code null} (one observer) or an unknown id.
   */
  public PlanGeometry forResource(String id) {
    if (id == null) {
      return this;
    }
    return scenario.resource(id).map(r -> new PlanGeometry(scenario.forResource(r), ctx)).orElse(this);
  }

  /** The scenario. */
  public Scenario scenario() {
    return scenario;
  }

  /** The ground site, or {@code null} for a spacecraft or no observer. */
  public GroundSite site() {
    return site;
  }

  /** The request's line of sight at {@code t} as RA/Dec (ICRS axes), when this class supports its target. */
  public Optional<RaDec> raDec(Request r, Instant t) {
    return direction(r, t).map(PlanGeometry::toRaDec);
  }

  /** The request's azimuth/elevation at {@code t} at the ground site; empty without a site or support. */
  public Optional<AzEl> azEl(Request r, Instant t) {
    if (topo == null) {
      return Optional.empty();
    }
    return direction(r, t).map(d -> topo.azEl(d, ctx.date(t)));
  }

  /** The Sun's geometric elevation at the ground site, degrees; NaN without a site. */
  public double sunElevationDeg(Instant t) {
    if (topo == null) {
      return Double.NaN;
    }
    AbsoluteDate d = ctx.date(t);
    return topo.azElOfPosition(ctx.sun().getPosition(d, ctx.inertial()), d).elevationDeg();
  }

  /** The Sun's geocentric direction as RA/Dec. */
  public RaDec sun(Instant t) {
    return toRaDec(ctx.sun().getPosition(ctx.date(t), ctx.inertial()));
  }

  /** The Moon's geocentric direction as RA/Dec. */
  public RaDec moon(Instant t) {
    return toRaDec(ctx.moon().getPosition(ctx.date(t), ctx.inertial()));
  }

  private Optional<Vector3D> direction(Request r, Instant t) {
    if (r.target() instanceof RaDec rd) {
      double ra = FastMath.toRadians(rd.raDeg());
      double dec = FastMath.toRadians(rd.decDeg());
      return Optional.of(new Vector3D(FastMath.cos(dec) * FastMath.cos(ra), FastMath.cos(dec) * FastMath.sin(ra),
          FastMath.sin(dec)));
    }
    if (r.target() instanceof OrbitingTarget ot && site != null) {
      TLEPropagator p = propagators.computeIfAbsent(r.id(), id -> TLEPropagator.selectExtrapolator(
          new TLE(ot.tle().line1(), ot.tle().line2(), ctx.utc()), ctx.dataContext().getFrames().getTEME()));
      AbsoluteDate d = ctx.date(t);
      Vector3D target = p.getPosition(d, ctx.inertial());
      Vector3D siteGcrf = ctx.earthFixed().getStaticTransformTo(ctx.inertial(), d).transformPosition(siteItrfM);
      return Optional.of(target.subtract(siteGcrf));
    }
    return Optional.empty();
  }

  static RaDec toRaDec(Vector3D v) {
    double ra = FastMath.toDegrees(FastMath.atan2(v.getY(), v.getX()));
    double dec = FastMath.toDegrees(FastMath.asin(FastMath.max(-1, FastMath.min(1, v.getZ() / v.getNorm()))));
    return new RaDec(ra < 0 ? ra + 360 : ra, dec);
  }
}
