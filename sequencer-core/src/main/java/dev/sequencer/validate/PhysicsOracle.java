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
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.hipparchus.util.FastMath;
import org.orekit.attitudes.FrameAlignedProvider;
import org.orekit.bodies.GeodeticPoint;
import org.orekit.forces.gravity.HolmesFeatherstoneAttractionModel;
import org.orekit.forces.gravity.potential.GravityFieldFactory;
import org.orekit.forces.gravity.potential.TideSystem;
import org.orekit.forces.gravity.potential.UnnormalizedSphericalHarmonicsProvider;
import org.orekit.frames.Frame;
import org.orekit.frames.TopocentricFrame;
import org.orekit.orbits.KeplerianOrbit;
import org.orekit.orbits.OrbitType;
import org.orekit.orbits.PositionAngleType;
import org.orekit.propagation.Propagator;
import org.orekit.propagation.EphemerisGenerator;
import org.orekit.propagation.SpacecraftState;
import org.orekit.propagation.ToleranceProvider;
import org.orekit.propagation.numerical.NumericalPropagator;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.propagation.analytical.tle.TLEPropagator;
import org.orekit.time.AbsoluteDate;
import org.orekit.time.TimeScalarFunction;
import org.orekit.utils.Constants;
import org.orekit.utils.IERSConventions;
import org.orekit.utils.TimeStampedPVCoordinates;

/**
 * Re-checks every constraint of the scenario from the physics at the observation's own instants: the
 * start, the end and every {@link #STEP_S} seconds between. Written apart from the visibility engine on
 * purpose (no shared code, no grid, no interpolation, no root finding): each instant is a direct Orekit
 * evaluation (topocentric frames, propagators, the context's Sun and Moon, Orekit's sidereal time and
 * true-of-date frame for the hour angle), with the scenario format's definitions of each constraint and
 * each request's own constraints applied over the scenario's.
 *
 * <p>Every margin is in degrees: airmass as degrees of elevation (the airmass shortfall divided by its
 * slope), hour angle as degrees of hour angle (15° per hour), Moon illumination as degrees of phase
 * angle beyond the one where the illuminated fraction reaches its limit (when the Moon is up).
 * Fixed targets are taken at their apparent direction (annual aberration, the format's A1), with a
 * first-order formula of its own; target elevations are refracted when the site gives refraction.
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
  private final Frame gcrf;
  private final TopocentricFrame site;
  private final Propagator orbit;
  /** Greenwich apparent sidereal time, radians (Orekit, IERS 2010; UT1 from the context's EOP, if any). */
  private final TimeScalarFunction gast;
  private final Map<String, Object> targetCache = new HashMap<>();

  public PhysicsOracle(Scenario scenario, AstroContext ctx) {
    this.ctx = ctx;
    this.scenario = scenario;
    this.gcrf = ctx.inertial();
    this.gast = IERSConventions.IERS_2010.getGASTFunction(
        ctx.timeScales().getUT1(IERSConventions.IERS_2010, true),
        ctx.dataContext().getFrames().getEOPHistory(IERSConventions.IERS_2010, true), ctx.timeScales());
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
    Constraints c = scenario.constraintsFor(r);
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
      siteMargins(m, c, r, t, obs, los, sun, moon);
    } else if (r.target() instanceof EarthPoint ep) {
      TopocentricFrame point = new TopocentricFrame(ctx.earth(), new GeodeticPoint(
          FastMath.toRadians(ep.latitudeDeg()), FastMath.toRadians(ep.longitudeDeg()), ep.altitudeM()), "point");
      double elMin = c.elevationMinDeg() != null ? c.elevationMinDeg() : 0.0;
      m.put("elevation", FastMath.toDegrees(point.getElevation(obs, gcrf, t)) - elMin);
      double sunEl = FastMath.toDegrees(point.getElevation(sun, gcrf, t));
      if (c.sunElevationMaxDeg() != null) {
        m.put("darkness", c.sunElevationMaxDeg() - sunEl);
      }
      if (c.sunElevationMinDeg() != null) {
        m.put("daylight", sunEl - c.sunElevationMinDeg());
      }
      if (c.offNadirMaxDeg() != null) {
        m.put("off-nadir", c.offNadirMaxDeg() - FastMath.toDegrees(Vector3D.angle(los, obs.negate())));
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

  /** The margins that apply at a ground site. */
  private void siteMargins(Map<String, Double> m, Constraints c, Request r, AbsoluteDate t, Vector3D obs,
      Vector3D los, Vector3D sun, Vector3D moon) {
    GroundSite g = (GroundSite) scenario.observer();
    Vector3D farPoint = obs.add(1e12, los); // a point along the line of sight, far beyond the site
    // The target elevation the elevation limits, the mask and the airmass use: refracted when the site
    // gives refraction (the format's A1).
    double el = g.observedElevationDeg(FastMath.toDegrees(site.getElevation(farPoint, gcrf, t)));
    double az = FastMath.toDegrees(site.getAzimuth(farPoint, gcrf, t));
    double floor = g.horizonMask().isEmpty()
        ? (c.elevationMinDeg() != null ? c.elevationMinDeg() : 0.0)
        : (c.elevationMinDeg() != null ? Math.max(c.elevationMinDeg(), g.maskElevationDeg(az)) : g.maskElevationDeg(az));
    m.put("elevation", el - floor);
    if (c.elevationMaxDeg() != null) {
      m.put("elevation max", c.elevationMaxDeg() - el);
    }
    if (c.airmassMax() != null) {
      m.put("airmass", airmassMarginDeg(el, c.airmassMax()));
    }
    double sunEl = FastMath.toDegrees(site.getElevation(sun, gcrf, t));
    if (c.sunElevationMaxDeg() != null) {
      m.put("darkness", c.sunElevationMaxDeg() - sunEl);
    }
    if (c.sunElevationMinDeg() != null) {
      m.put("daylight", sunEl - c.sunElevationMinDeg());
    }
    double moonEl = FastMath.toDegrees(site.getElevation(moon, gcrf, t));
    if (c.moonElevationMaxDeg() != null) {
      m.put("Moon elevation", c.moonElevationMaxDeg() - moonEl);
    }
    if (c.moonIlluminationMax() != null) {
      // Holds when the Moon is down, or when k = (1 + cos i) / 2 <= max, i.e. i >= acos(2 max - 1).
      double phaseDeg = FastMath.toDegrees(Vector3D.angle(sun.subtract(moon), moon.negate()));
      double minPhaseDeg = FastMath.toDegrees(FastMath.acos(2 * c.moonIlluminationMax() - 1));
      m.put("Moon illumination", Math.max(-moonEl, phaseDeg - minPhaseDeg));
    }
    if (r.target() instanceof RaDec rd && (c.hourAngleMinH() != null || c.hourAngleMaxH() != null)) {
      double ha = hourAngleH(rd, t, g.longitudeDeg());
      double min = c.hourAngleMinH() != null ? c.hourAngleMinH() : -12.0;
      double max = c.hourAngleMaxH() != null ? c.hourAngleMaxH() : 12.0;
      m.put("hour angle", 15 * Math.min(ha - min, max - ha)); // degrees of hour angle
    }
  }

  /**
   * The spec's airmass (Kasten and Young 1989) against its limit, as degrees of elevation to first order:
   * (max - X(h)) / |dX/dh|; at or below the horizon, the elevation itself (the rule h > 0).
   */
  static double airmassMarginDeg(double elevationDeg, double airmassMax) {
    if (elevationDeg <= 0) {
      return elevationDeg;
    }
    double x = kastenYoung(elevationDeg);
    double slopePerDeg = Math.abs(kastenYoung(elevationDeg + 1e-4) - kastenYoung(elevationDeg - 1e-4)) / 2e-4;
    return (airmassMax - x) / Math.max(slopePerDeg, 1e-9);
  }

  private static double kastenYoung(double hDeg) {
    return 1 / (FastMath.sin(FastMath.toRadians(hDeg)) + 0.50572 * FastMath.pow(hDeg + 6.07995, -1.6364));
  }

  /**
   * Local hour angle in hours, wrapped to [-12, 12): GAST + east longitude - right ascension on the true
   * equator and equinox of date (Orekit's TOD frame).
   */
  private double hourAngleH(RaDec rd, AbsoluteDate t, double longitudeDeg) {
    Vector3D ofDate = gcrf.getStaticTransformTo(ctx.dataContext().getFrames().getTOD(IERSConventions.IERS_2010, true), t)
        .transformVector(direction(rd));
    double haDeg = FastMath.toDegrees(gast.value(t)) + longitudeDeg - FastMath.toDegrees(ofDate.getAlpha());
    double h = haDeg / 15.0;
    return h - 24.0 * Math.floor((h + 12.0) / 24.0);
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

  /**
   * TLE: SGP4/SDP4. Keplerian: the format's reference motion (A1) set up here on its own: Orekit's numerical
   * propagator with the Holmes-Featherstone model of a J2-only field (EGM96 mu, R, J2) about the Earth-fixed
   * axes, Dormand-Prince 8(5,3) at 1 mm, its dense output kept over the horizon and an hour either side.
   */
  private Propagator propagator(OrbitObserver o) {
    if (o.orbit() instanceof Tle tle) {
      return TLEPropagator.selectExtrapolator(new TLE(tle.line1(), tle.line2(), ctx.utc()),
          ctx.dataContext().getFrames().getTEME());
    }
    KeplerianElements k = (KeplerianElements) o.orbit();
    double mu = 398600.4418e9;
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
    numerical.propagate(ctx.date(scenario.horizon().start()).shiftedBy(-3600),
        ctx.date(scenario.horizon().end()).shiftedBy(3600));
    return ephemeris.getGeneratedEphemeris();
  }
}
