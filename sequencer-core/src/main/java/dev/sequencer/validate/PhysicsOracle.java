package dev.sequencer.validate;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Constraints;
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
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.util.FastMath;
import org.orekit.bodies.GeodeticPoint;
import org.orekit.frames.Frame;
import org.orekit.frames.TopocentricFrame;
import org.orekit.orbits.KeplerianOrbit;
import org.orekit.orbits.PositionAngleType;
import org.orekit.propagation.Propagator;
import org.orekit.propagation.analytical.BrouwerLyddanePropagator;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.propagation.analytical.tle.TLEPropagator;
import org.orekit.time.AbsoluteDate;
import org.orekit.utils.Constants;
import org.orekit.utils.TimeStampedPVCoordinates;

/**
 * Re-checks every constraint of the scenario from the physics at the observation's own instants: the
 * start, the end and every {@link #STEP_S} seconds between. Written apart from the visibility engine on
 * purpose (no shared code, no grid, no interpolation, no root finding): each instant is a direct Orekit
 * evaluation (topocentric frames, propagators, the context's Sun and Moon), with the scenario format's
 * definitions of each constraint. Fixed targets are taken at their apparent direction (annual aberration,
 * the format's A1), with a first-order formula of its own.
 *
 * <p>Tolerance: a margin may be below its limit by {@link #TOLERANCE_DEG} (0.01°) plus 0.1 s times the
 * margin's rate of change (measured between samples): the visibility windows' edges are accurate to about
 * 0.1 s, and a fast line of sight (an Earth point seen from LEO, up to about 1°/s) moves further than
 * 0.01° in that time. Between samples a constraint could dip for less than a step; the windows' own
 * check covers that case.
 */
public final class PhysicsOracle implements ObservabilityOracle {
  /** Sampling step inside an observation, seconds. */
  public static final double STEP_S = 5.0;
  /** Allowed shortfall of a margin, degrees. */
  public static final double TOLERANCE_DEG = 0.01;
  /** Edge accuracy the tolerance covers, seconds. */
  private static final double EDGE_S = 0.1;
  private static final double EARTH_RADIUS_M = 6_378_137.0;
  private static final double SUN_RADIUS_M = 695_700_000.0;

  private final AstroContext ctx;
  private final Scenario scenario;
  private final Constraints c;
  private final Frame gcrf;
  private final TopocentricFrame site;
  private final Propagator orbit;
  private final Map<String, Object> targetCache = new HashMap<>();

  public PhysicsOracle(Scenario scenario, AstroContext ctx) {
    this.ctx = ctx;
    this.scenario = scenario;
    this.c = scenario.constraints();
    this.gcrf = ctx.inertial();
    if (scenario.observer() instanceof GroundSite g) {
      site = new TopocentricFrame(ctx.earth(), new GeodeticPoint(FastMath.toRadians(g.latitudeDeg()),
          FastMath.toRadians(g.longitudeDeg()), g.altitudeM()), "site");
      orbit = null;
    } else if (scenario.observer() instanceof OrbitObserver o) {
      site = null;
      orbit = propagator(o);
    } else {
      site = null;
      orbit = null;
    }
  }

  @Override
  public synchronized List<String> violations(Request r, Instant start, Instant end) {
    List<String> out = new ArrayList<>();
    if (scenario.observer() == null || r.target() == null) {
      return out; // no geometry: the request's own windows are checked by the validator
    }
    AbsoluteDate t0 = ctx.date(start);
    double length = ctx.date(end).durationFrom(t0);
    int n = Math.max(1, (int) Math.ceil(length / STEP_S));
    Map<String, double[]> previous = new HashMap<>();
    for (int i = 0; i <= n; i++) {
      double dt = Math.min(length, i * length / n);
      AbsoluteDate t = t0.shiftedBy(dt);
      Map<String, Double> margins = margins(r, t);
      for (Map.Entry<String, Double> m : margins.entrySet()) {
        double[] prev = previous.get(m.getKey());
        double rate = prev == null || dt == prev[0] ? 0 : Math.abs(m.getValue() - prev[1]) / (dt - prev[0]);
        double tolerance = TOLERANCE_DEG + rate * EDGE_S;
        if (m.getValue() < -tolerance) {
          out.add(String.format(Locale.ROOT, "observation %s at %s: %s violated by %.4f deg", r.id(),
              ctx.instant(t), m.getKey(), -m.getValue()));
          return out; // one violation per observation is enough to reject it
        }
        previous.put(m.getKey(), new double[] {dt, m.getValue()});
      }
    }
    return out;
  }

  /** Each applicable constraint's margin in degrees (>= 0 when it holds), by name. */
  private Map<String, Double> margins(Request r, AbsoluteDate t) {
    Map<String, Double> m = new HashMap<>();
    Vector3D obs = site != null ? site.getPosition(t, gcrf) : orbit.getPosition(t, gcrf);
    Vector3D target = targetPosition(r, t); // null for a direction
    TimeStampedPVCoordinates sunPv = ctx.sun().getPVCoordinates(t, gcrf);
    Vector3D los = target == null ? apparent(direction((RaDec) r.target()), observerVelocity(sunPv, t))
        : target.subtract(obs).normalize();
    Vector3D sun = sunPv.getPosition();
    Vector3D moon = ctx.moon().getPosition(t, gcrf);
    if (c.sunSeparationMinDeg() != null) {
      m.put("Sun separation", FastMath.toDegrees(Vector3D.angle(los, sun.subtract(obs))) - c.sunSeparationMinDeg());
    }
    if (c.moonSeparationMinDeg() != null) {
      m.put("Moon separation", FastMath.toDegrees(Vector3D.angle(los, moon.subtract(obs))) - c.moonSeparationMinDeg());
    }
    if (site != null) {
      GroundSite g = (GroundSite) scenario.observer();
      Vector3D farPoint = obs.add(1e12, los); // a point along the line of sight, far beyond the site
      double el = g.observedElevationDeg(FastMath.toDegrees(site.getElevation(farPoint, gcrf, t))); // A1 refraction
      double az = FastMath.toDegrees(site.getAzimuth(farPoint, gcrf, t));
      double floor = g.horizonMask().isEmpty()
          ? (c.elevationMinDeg() != null ? c.elevationMinDeg() : 0.0)
          : (c.elevationMinDeg() != null ? Math.max(c.elevationMinDeg(), g.maskElevationDeg(az)) : g.maskElevationDeg(az));
      m.put("elevation", el - floor);
      if (c.elevationMaxDeg() != null) {
        m.put("elevation max", c.elevationMaxDeg() - el);
      }
      if (c.sunElevationMaxDeg() != null) {
        m.put("darkness", c.sunElevationMaxDeg() - FastMath.toDegrees(site.getElevation(sun, gcrf, t)));
      }
    } else if (r.target() instanceof EarthPoint ep) {
      TopocentricFrame point = new TopocentricFrame(ctx.earth(), new GeodeticPoint(
          FastMath.toRadians(ep.latitudeDeg()), FastMath.toRadians(ep.longitudeDeg()), ep.altitudeM()), "point");
      double elMin = c.elevationMinDeg() != null ? c.elevationMinDeg() : 0.0;
      m.put("elevation", FastMath.toDegrees(point.getElevation(obs, gcrf, t)) - elMin);
      if (c.sunElevationMaxDeg() != null) {
        m.put("darkness", c.sunElevationMaxDeg() - FastMath.toDegrees(point.getElevation(sun, gcrf, t)));
      }
    } else if (c.earthLimbMinDeg() != null) {
      double limb = Vector3D.angle(los, obs.negate()) - FastMath.asin(EARTH_RADIUS_M / obs.getNorm());
      m.put("Earth limb", FastMath.toDegrees(limb) - c.earthLimbMinDeg());
    }
    if (r.target() instanceof OrbitingTarget && c.sunlitRequired()) {
      Vector3D toEarth = target.negate();
      Vector3D toSun = sun.subtract(target);
      double umbra = FastMath.asin(EARTH_RADIUS_M / toEarth.getNorm()) - FastMath.asin(SUN_RADIUS_M / toSun.getNorm());
      m.put("target sunlit", FastMath.toDegrees(Vector3D.angle(toEarth, toSun) - umbra));
    }
    return m;
  }

  private Vector3D targetPosition(Request r, AbsoluteDate t) {
    if (r.target() instanceof OrbitingTarget ot) {
      Propagator p = (Propagator) targetCache.computeIfAbsent(r.id(), k -> TLEPropagator.selectExtrapolator(
          new TLE(ot.tle().line1(), ot.tle().line2(), ctx.utc()), ctx.dataContext().getFrames().getTEME()));
      return p.getPosition(t, gcrf);
    }
    if (r.target() instanceof EarthPoint ep) {
      Vector3D itrf = ctx.earth().transform(new GeodeticPoint(
          FastMath.toRadians(ep.latitudeDeg()), FastMath.toRadians(ep.longitudeDeg()), ep.altitudeM()));
      return ctx.earthFixed().getStaticTransformTo(gcrf, t).transformPosition(itrf);
    }
    return null;
  }

  /**
   * Annual aberration to first order in v/c, u' = (u + v/c) / |u + v/c| (Meeus, Astronomical Algorithms,
   * 2nd ed., ch. 23, in vector form; the second-order terms are below 0.002"): written apart from the
   * engine's relativistic formula on purpose.
   */
  private static Vector3D apparent(Vector3D u, Vector3D velocityMps) {
    return u.add(1.0 / Constants.SPEED_OF_LIGHT, velocityMps).normalize();
  }

  /**
   * The observer's velocity relative to the solar-system barycentre: the Earth's heliocentric velocity
   * (minus the geocentric Sun's; the Sun's own barycentric motion is at most 0.011" of aberration) plus,
   * for an orbit observer, its geocentric velocity. Diurnal aberration (<= 0.32") is neglected, as the
   * format allows.
   */
  private Vector3D observerVelocity(TimeStampedPVCoordinates sun, AbsoluteDate t) {
    Vector3D earth = sun.getVelocity().negate();
    return orbit == null ? earth : earth.add(orbit.getPVCoordinates(t, gcrf).getVelocity());
  }

  private static Vector3D direction(RaDec rd) {
    return new Vector3D(FastMath.toRadians(rd.raDeg()), FastMath.toRadians(rd.decDeg()));
  }

  /** TLE: SGP4/SDP4; Keplerian: Brouwer-Lyddane with EIGEN-5C zonal terms (the model the format's docs name). */
  private Propagator propagator(OrbitObserver o) {
    if (o.orbit() instanceof Tle tle) {
      return TLEPropagator.selectExtrapolator(new TLE(tle.line1(), tle.line2(), ctx.utc()),
          ctx.dataContext().getFrames().getTEME());
    }
    KeplerianElements k = (KeplerianElements) o.orbit();
    KeplerianOrbit orb = new KeplerianOrbit(k.semiMajorAxisKm() * 1000.0, k.eccentricity(),
        FastMath.toRadians(k.inclinationDeg()), FastMath.toRadians(k.argumentOfPerigeeDeg()),
        FastMath.toRadians(k.raanDeg()), FastMath.toRadians(k.meanAnomalyDeg()), PositionAngleType.MEAN,
        ctx.dataContext().getFrames().getEME2000(), ctx.date(k.epoch()), Constants.EIGEN5C_EARTH_MU);
    return new BrouwerLyddanePropagator(orb, Constants.EIGEN5C_EARTH_EQUATORIAL_RADIUS, Constants.EIGEN5C_EARTH_MU,
        Constants.EIGEN5C_EARTH_C20, Constants.EIGEN5C_EARTH_C30, Constants.EIGEN5C_EARTH_C40,
        Constants.EIGEN5C_EARTH_C50, BrouwerLyddanePropagator.M2);
  }
}
