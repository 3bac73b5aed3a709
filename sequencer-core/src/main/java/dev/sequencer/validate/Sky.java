package dev.sequencer.validate;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Tle;
import java.time.Instant;
import java.util.HashMap;
import java.util.Map;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.hipparchus.util.FastMath;
import org.orekit.attitudes.FrameAlignedProvider;
import org.orekit.bodies.GeodeticPoint;
import org.orekit.forces.gravity.HolmesFeatherstoneAttractionModel;
import org.orekit.forces.gravity.potential.GravityFieldFactory;
import org.orekit.forces.gravity.potential.TideSystem;
import org.orekit.forces.gravity.potential.UnnormalizedSphericalHarmonicsProvider;
import org.orekit.frames.Frame;
import org.orekit.frames.StaticTransform;
import org.orekit.frames.TopocentricFrame;
import org.orekit.orbits.KeplerianOrbit;
import org.orekit.orbits.OrbitType;
import org.orekit.orbits.PositionAngleType;
import org.orekit.propagation.EphemerisGenerator;
import org.orekit.propagation.Propagator;
import org.orekit.propagation.SpacecraftState;
import org.orekit.propagation.ToleranceProvider;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.propagation.analytical.tle.TLEPropagator;
import org.orekit.propagation.numerical.NumericalPropagator;
import org.orekit.time.AbsoluteDate;
import org.orekit.utils.Constants;

/**
 * The validator's own geometry of one scenario, written apart from the visibility engine and the slew
 * tracks (no shared code): every position and direction is a direct Orekit evaluation at the instant asked
 * for. Shared with the planner: the scenario ({@code model}), the time scales and Earth frames of the
 * {@link AstroContext}, and its Sun and Moon series (Orekit's own celestial bodies need JPL files the offline
 * context does not have; the series are checked against SOFA and DE405 in the astro tests).
 *
 * <ul>
 *   <li>Observer: a ground site as Orekit's {@link TopocentricFrame} on the context's WGS-84 ellipsoid; a TLE
 *       orbit by Orekit's SGP4/SDP4; Keplerian elements by the format's reference motion (A1) set up here on
 *       its own: Orekit's numerical propagator with a J2-only Holmes-Featherstone field (EGM96 mu, R, J2) in
 *       Earth-fixed axes, Dormand-Prince 8(5,3) at 1 mm, dense output over the horizon and an hour either side.
 *   <li>Fixed targets: the apparent direction, annual aberration to first order in v/c,
 *       u' = (u + v/c)/|u + v/c| (Meeus, Astronomical Algorithms, 2nd ed., ch. 23, in vector form; second
 *       order below 0.002"), with v the Earth's heliocentric velocity (minus the geocentric Sun's; the Sun's
 *       barycentric motion is at most 0.011" of aberration) plus an orbit observer's own; diurnal aberration
 *       (at most 0.32") neglected as the format allows. The engine uses a relativistic formula of its own.
 *   <li>Orbiting targets: Orekit's SGP4/SDP4, geometric direction. Earth points: the geodetic point in ITRF.
 *   <li>Azimuth and elevation: the direction transformed into the site's topocentric frame (x east, y north,
 *       z zenith), geometric.
 * </ul>
 *
 * <p>Not thread-safe (caches); the validator makes one per check.
 */
final class Sky {
  static final double EARTH_RADIUS_M = 6_378_137.0;
  static final double SUN_RADIUS_M = 695_700_000.0;

  private final AstroContext ctx;
  private final Scenario scenario;
  private final Frame gcrf;
  private final TopocentricFrame site;
  private final GroundSite ground;
  private final Propagator orbit;
  private final Map<String, Propagator> tle = new HashMap<>();
  private final Map<String, Vector3D> points = new HashMap<>();

  Sky(Scenario scenario, AstroContext ctx) {
    this.ctx = ctx;
    this.scenario = scenario;
    this.gcrf = ctx.inertial();
    if (scenario.observer() instanceof GroundSite g) {
      ground = g;
      site = new TopocentricFrame(ctx.earth(), new GeodeticPoint(FastMath.toRadians(g.latitudeDeg()),
          FastMath.toRadians(g.longitudeDeg()), g.altitudeM()), "validator site");
      orbit = null;
    } else if (scenario.observer() instanceof OrbitObserver o) {
      ground = null;
      site = null;
      orbit = propagator(o);
    } else {
      ground = null;
      site = null;
      orbit = null;
    }
  }

  AstroContext ctx() {
    return ctx;
  }

  Scenario scenario() {
    return scenario;
  }

  boolean hasObserver() {
    return site != null || orbit != null;
  }

  /** The ground site, or null from orbit and without observer. */
  GroundSite ground() {
    return ground;
  }

  TopocentricFrame siteFrame() {
    return site;
  }

  AbsoluteDate date(Instant t) {
    return ctx.date(t);
  }

  Instant instant(AbsoluteDate d) {
    return ctx.instant(d);
  }

  /** The observer's GCRF position, metres. */
  Vector3D observer(AbsoluteDate t) {
    return site != null ? site.getPosition(t, gcrf) : orbit.getPosition(t, gcrf);
  }

  Vector3D sun(AbsoluteDate t) {
    return ctx.sun().getPosition(t, gcrf);
  }

  Vector3D moon(AbsoluteDate t) {
    return ctx.moon().getPosition(t, gcrf);
  }

  /** The target's GCRF position for orbiting targets and Earth points; null for a direction (fixed target). */
  Vector3D targetPosition(Request r, AbsoluteDate t) {
    if (r.target() instanceof OrbitingTarget ot) {
      return tle.computeIfAbsent(r.id(), k -> TLEPropagator.selectExtrapolator(
          new TLE(ot.tle().line1(), ot.tle().line2(), ctx.utc()), ctx.dataContext().getFrames().getTEME()))
          .getPosition(t, gcrf);
    }
    if (r.target() instanceof EarthPoint ep) {
      Vector3D itrf = points.computeIfAbsent(r.id(), k -> ctx.earth().transform(new GeodeticPoint(
          FastMath.toRadians(ep.latitudeDeg()), FastMath.toRadians(ep.longitudeDeg()), ep.altitudeM())));
      return ctx.earthFixed().getStaticTransformTo(gcrf, t).transformPosition(itrf);
    }
    return null;
  }

  /** The unit line of sight to the request's target at {@code t} (GCRF); null without target or observer. */
  Vector3D lineOfSight(Request r, AbsoluteDate t) {
    if (r.target() == null || !hasObserver()) {
      return null;
    }
    if (r.target() instanceof RaDec rd) {
      return apparent(rd, t);
    }
    return targetPosition(r, t).subtract(observer(t)).normalize();
  }

  /** The apparent direction of a catalogue direction seen by this observer at {@code t}. */
  Vector3D apparent(RaDec rd, AbsoluteDate t) {
    Vector3D earth = ctx.sun().getPVCoordinates(t, gcrf).getVelocity().negate();
    Vector3D v = orbit == null ? earth : earth.add(orbit.getPVCoordinates(t, gcrf).getVelocity());
    return direction(rd).add(1.0 / Constants.SPEED_OF_LIGHT, v).normalize();
  }

  /** The start pointing's line of sight at {@code t} (GCRF), or null without a start pointing or observer. */
  Vector3D startLineOfSight(AbsoluteDate t) {
    if (scenario.startPointing() == null || !hasObserver()) {
      return null;
    }
    if (scenario.startPointing() instanceof RaDec rd) {
      return apparent(rd, t);
    }
    AzElPointing p = (AzElPointing) scenario.startPointing();
    return toGcrf(topocentric(p.azimuthDeg(), p.elevationDeg()), t);
  }

  /** GCRF to the site's topocentric axes at {@code t}. */
  StaticTransform toTopocentric(AbsoluteDate t) {
    return gcrf.getStaticTransformTo(site, t);
  }

  /** A GCRF direction in the site's topocentric axes (east, north, zenith). */
  Vector3D toTopocentric(Vector3D gcrfDirection, AbsoluteDate t) {
    return toTopocentric(t).transformVector(gcrfDirection);
  }

  /** A topocentric direction in GCRF. */
  Vector3D toGcrf(Vector3D topocentric, AbsoluteDate t) {
    return site.getStaticTransformTo(gcrf, t).transformVector(topocentric);
  }

  /** {azimuth in [0, 360), elevation}, degrees, of a GCRF direction from the site (geometric). */
  double[] azEl(Vector3D gcrfDirection, AbsoluteDate t) {
    return azElOf(toTopocentric(gcrfDirection, t));
  }

  /** {azimuth in [0, 360), elevation}, degrees, of a topocentric vector. */
  static double[] azElOf(Vector3D enu) {
    double az = FastMath.toDegrees(FastMath.atan2(enu.getX(), enu.getY()));
    double el = FastMath.toDegrees(FastMath.atan2(enu.getZ(), FastMath.hypot(enu.getX(), enu.getY())));
    return new double[] {az < 0 ? az + 360 : az, el};
  }

  /** The topocentric unit vector of an azimuth and elevation, degrees. */
  static Vector3D topocentric(double azimuthDeg, double elevationDeg) {
    double az = FastMath.toRadians(azimuthDeg);
    double el = FastMath.toRadians(elevationDeg);
    return new Vector3D(FastMath.cos(el) * FastMath.sin(az), FastMath.cos(el) * FastMath.cos(az), FastMath.sin(el));
  }

  static Vector3D direction(RaDec rd) {
    return new Vector3D(FastMath.toRadians(rd.raDeg()), FastMath.toRadians(rd.decDeg()));
  }

  private Propagator propagator(OrbitObserver o) {
    if (o.orbit() instanceof Tle t) {
      return TLEPropagator.selectExtrapolator(new TLE(t.line1(), t.line2(), ctx.utc()),
          ctx.dataContext().getFrames().getTEME());
    }
    KeplerianElements k = (KeplerianElements) o.orbit();
    double mu = 398600.4418e9; // EGM96, the format's A1
    KeplerianOrbit orb = new KeplerianOrbit(k.semiMajorAxisKm() * 1000.0, k.eccentricity(),
        FastMath.toRadians(k.inclinationDeg()), FastMath.toRadians(k.argumentOfPerigeeDeg()),
        FastMath.toRadians(k.raanDeg()), FastMath.toRadians(k.meanAnomalyDeg()), PositionAngleType.MEAN,
        ctx.dataContext().getFrames().getEME2000(), ctx.date(k.epoch()), mu);
    UnnormalizedSphericalHarmonicsProvider j2Only = GravityFieldFactory.getUnnormalizedProvider(6_378_136.3, mu,
        TideSystem.UNKNOWN, new double[][] {{0}, {0, 0}, {-1.0826267e-3, 0, 0}}, new double[][] {{0}, {0, 0}, {0, 0, 0}});
    double[][] tolerances = ToleranceProvider.getDefaultToleranceProvider(1e-3).getTolerances(orb, OrbitType.CARTESIAN);
    NumericalPropagator numerical = new NumericalPropagator(
        new DormandPrince853Integrator(1e-3, 300, tolerances[0], tolerances[1]), new FrameAlignedProvider(gcrf));
    numerical.setOrbitType(OrbitType.CARTESIAN);
    numerical.addForceModel(new HolmesFeatherstoneAttractionModel(ctx.earthFixed(),
        GravityFieldFactory.getNormalizedProvider(j2Only)));
    numerical.setInitialState(new SpacecraftState(orb));
    EphemerisGenerator ephemeris = numerical.getEphemerisGenerator();
    // Orekit first reaches the span's start from the epoch, then records the span.
    numerical.propagate(ctx.date(scenario.horizon().start()).shiftedBy(-3600),
        ctx.date(scenario.horizon().end()).shiftedBy(3600));
    return ephemeris.getGeneratedEphemeris();
  }
}
