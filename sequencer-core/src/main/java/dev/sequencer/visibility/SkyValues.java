package dev.sequencer.visibility;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.util.FastMath;
import org.orekit.bodies.GeodeticPoint;
import org.orekit.time.AbsoluteDate;
import org.orekit.time.TimeScalarFunction;
import org.orekit.utils.IERSConventions;
import org.orekit.utils.PVCoordinatesProvider;

/**
 * The values a person reads beside a plan, computed by the same machinery as the visibility windows (the
 * sampled observer, Sun, Moon and Earth axes of {@link Chunk}, the target tracks, the margin functions):
 * a request's observed elevation, airmass and Moon separation at an instant; the Moon's elevation and
 * illuminated fraction; the local apparent sidereal time; the passes of an orbiting target over a ground
 * site; the point below an orbiting observer.
 *
 * <p>Defined over the scenario's horizon (instants outside it are clamped to its ends). Values are the
 * visibility engine's: elevation is refracted by the site's model (format A1), airmass is Kasten and Young
 * (1989) on that elevation, the Moon separation is from the observer's position along the apparent line of
 * sight. Not thread-safe (caches one target track per request).
 */
public final class SkyValues {
  /** Sample step of the pass search, seconds: a pass above the threshold shorter than this can be missed. */
  public static final double PASS_STEP_S = 10.0;

  private final Scenario scenario;
  private final AstroContext ctx;
  private final GroundSite site;
  private final double[] siteEnu;
  private final Chunk chunk;
  private final AbsoluteDate origin;
  private final TimeScalarFunction gast;
  private final Map<String, TargetTrack> tracks = new HashMap<>();
  private final Scratch s = new Scratch();

  private SkyValues(Scenario scenario, AstroContext ctx) {
    this.scenario = scenario;
    this.ctx = ctx;
    this.site = scenario.observer() instanceof GroundSite g ? g : null;
    this.siteEnu = site == null ? null : SiteFrame.enuItrf(site);
    this.origin = ctx.date(scenario.horizon().start());
    double horizonS = ctx.date(scenario.horizon().end()).durationFrom(origin);
    PVCoordinatesProvider orbit = scenario.observer() instanceof OrbitObserver o
        ? Observers.motion(o, ctx, origin, origin.shiftedBy(horizonS)) : null;
    boolean needTeme = scenario.requests().stream().anyMatch(r -> r.target() instanceof OrbitingTarget);
    this.chunk = Chunk.build(ctx, origin, 0, Math.max(horizonS, 1e-3), VisibilityCalculator.DEFAULT_MAX_STEP_S, site,
        orbit, needTeme);
    this.gast = IERSConventions.IERS_2010.getGASTFunction(ctx.timeScales().getUT1(IERSConventions.IERS_2010, true),
        ctx.dataContext().getFrames().getEOPHistory(IERSConventions.IERS_2010, true), ctx.timeScales());
  }

  /** The values of {@code scenario} (samples its horizon once, like one chunk of the window computation). */
  public static SkyValues of(Scenario scenario, AstroContext ctx) {
    return new SkyValues(scenario, ctx);
  }

  /** True at a ground site (elevation, airmass, Moon elevation, sidereal time and passes are defined). */
  public boolean atGroundSite() {
    return site != null;
  }

  /** True for an orbiting observer (the sub-observer point is defined). */
  public boolean inOrbit() {
    return scenario.observer() instanceof OrbitObserver;
  }

  /** The request's observed elevation at the site, degrees (refracted by the site's model); NaN elsewhere. */
  public double elevationDeg(Request r, Instant t) {
    if (site == null || scenario.observer() == null) {
      return Double.NaN;
    }
    loadTarget(r, t);
    return site.observedElevationDeg(ConstraintFunction.targetElevationDeg(s));
  }

  /** The request's geometric elevation at the site, degrees (no refraction); NaN elsewhere. */
  public double geometricElevationDeg(Request r, Instant t) {
    if (site == null) {
      return Double.NaN;
    }
    loadTarget(r, t);
    return ConstraintFunction.targetElevationDeg(s);
  }

  /**
   * Relative airmass of the request at {@code t} (Kasten and Young on the observed elevation, as the
   * airmass constraint uses it); NaN when the target is at or below the horizon or there is no site.
   */
  public double airmass(Request r, Instant t) {
    double el = elevationDeg(r, t);
    return el > 0 ? Airmass.of(el) : Double.NaN;
  }

  /** Angle between the request's line of sight and the Moon seen from the observer, degrees; NaN without an observer. */
  public double moonSeparationDeg(Request r, Instant t) {
    if (scenario.observer() == null) {
      return Double.NaN;
    }
    loadTarget(r, t);
    return ConstraintFunction.separationDeg(s, s.moon);
  }

  /** The Moon's geometric (unrefracted) topocentric elevation at the site, degrees; NaN elsewhere. */
  public double moonElevationDeg(Instant t) {
    if (site == null) {
      return Double.NaN;
    }
    loadShared(t);
    return ConstraintFunction.bodyElevationDeg(s, s.moon, s.obs);
  }

  /** The Sun's geometric topocentric elevation at the site, degrees; NaN elsewhere. */
  public double sunElevationDeg(Instant t) {
    if (site == null) {
      return Double.NaN;
    }
    loadShared(t);
    return ConstraintFunction.bodyElevationDeg(s, s.sun, s.obs);
  }

  /** The lowest observed elevation with an airmass of at most {@code airmass} (>= 1), degrees (Kasten and Young). */
  public static double elevationForAirmassDeg(double airmass) {
    return Airmass.minElevationDeg(airmass);
  }

  /** The Moon's illuminated fraction, (1 + cos i) / 2 with i its geocentric phase angle, in [0, 1]. */
  public double moonIlluminatedFraction(Instant t) {
    loadShared(t);
    return (1 + Math.cos(Math.toRadians(ConstraintFunction.moonPhaseAngleDeg(s)))) / 2;
  }

  /**
   * Local apparent sidereal time at the site, hours in [0, 24): Greenwich apparent sidereal time (Orekit,
   * IERS 2010 conventions; UT1 = UTC in the offline context) plus the site's east longitude; NaN elsewhere.
   */
  public double localSiderealTimeH(Instant t) {
    if (site == null) {
      return Double.NaN;
    }
    double deg = FastMath.toDegrees(gast.value(ctx.date(t))) + site.longitudeDeg();
    double h = (deg / 15.0) % 24.0;
    return h < 0 ? h + 24.0 : h;
  }

  /** Geodetic latitude and longitude of the point below an orbiting observer, degrees {lat, lon}; null elsewhere. */
  public double[] subObserverLatLonDeg(Instant t) {
    if (!inOrbit()) {
      return null;
    }
    loadShared(t);
    Vector3D itrf = new Vector3D(Vec.dot(s.obs, s.ix), Vec.dot(s.obs, s.iy), Vec.dot(s.obs, s.iz));
    GeodeticPoint gp = ctx.earth().transform(itrf, ctx.earthFixed(), ctx.date(t));
    return new double[] {FastMath.toDegrees(gp.getLatitude()), FastMath.toDegrees(gp.getLongitude())};
  }

  /** One pass of an orbiting target over the site: rise, culmination and set, geometric elevation. */
  public record Pass(Instant rise, Instant culmination, double culminationElevationDeg, Instant set,
      boolean risesBeforeHorizon, boolean setsAfterHorizon) {}

  /**
   * The passes of the request's orbiting target above {@code thresholdDeg} of geometric elevation over
   * the horizon, in time order: rise and set to 1 ms (bisection on {@link #PASS_STEP_S} samples),
   * culmination to 0.1 s (golden section). A pass under way at a horizon end starts or ends there (and
   * says so). Empty at no site or for other targets.
   */
  public List<Pass> passes(Request r, double thresholdDeg) {
    List<Pass> out = new ArrayList<>();
    if (site == null || !(r.target() instanceof OrbitingTarget)) {
      return out;
    }
    double endS = chunk.t1S;
    int n = Math.max(2, (int) Math.ceil(endS / PASS_STEP_S) + 1);
    double step = endS / (n - 1);
    double prevT = 0;
    double prevV = el(r, 0) - thresholdDeg;
    Double riseS = prevV > 0 ? 0.0 : null;
    boolean early = prevV > 0;
    for (int k = 1; k < n; k++) {
      double t = k == n - 1 ? endS : k * step;
      double v = el(r, t) - thresholdDeg;
      if (prevV <= 0 && v > 0) {
        riseS = root(r, thresholdDeg, prevT, t);
        early = false;
      } else if (prevV > 0 && v <= 0 && riseS != null) {
        out.add(pass(r, riseS, root(r, thresholdDeg, prevT, t), early, false));
        riseS = null;
      }
      prevT = t;
      prevV = v;
    }
    if (riseS != null) {
      out.add(pass(r, riseS, endS, early, true));
    }
    return out;
  }

  private Pass pass(Request r, double riseS, double setS, boolean early, boolean late) {
    // Golden section for the highest elevation; a pass has one maximum (SGP4 elevation is unimodal over one pass).
    double a = riseS;
    double b = setS;
    double g = (Math.sqrt(5) - 1) / 2;
    double c = b - g * (b - a);
    double d = a + g * (b - a);
    double fc = el(r, c);
    double fd = el(r, d);
    while (b - a > 0.1) {
      if (fc > fd) {
        b = d;
        d = c;
        fd = fc;
        c = b - g * (b - a);
        fc = el(r, c);
      } else {
        a = c;
        c = d;
        fc = fd;
        d = a + g * (b - a);
        fd = el(r, d);
      }
    }
    double m = (a + b) / 2;
    return new Pass(instant(riseS), instant(m), el(r, m), instant(setS), early, late);
  }

  private double root(Request r, double thresholdDeg, double lo, double hi) {
    double flo = el(r, lo) - thresholdDeg;
    while (hi - lo > 1e-3) {
      double mid = (lo + hi) / 2;
      double fm = el(r, mid) - thresholdDeg;
      if ((fm > 0) == (flo > 0)) {
        lo = mid;
        flo = fm;
      } else {
        hi = mid;
      }
    }
    return (lo + hi) / 2;
  }

  private double el(Request r, double tS) {
    load(r, tS);
    return ConstraintFunction.targetElevationDeg(s);
  }

  private Instant instant(double tS) {
    return ctx.instant(origin.shiftedBy(tS)).truncatedTo(java.time.temporal.ChronoUnit.MILLIS);
  }

  private double seconds(Instant t) {
    double x = ctx.date(t).durationFrom(origin);
    return Math.max(chunk.t0S, Math.min(chunk.t1S, x));
  }

  private void loadShared(Instant t) {
    s.load(chunk, -1, seconds(t), false);
    if (siteEnu != null) {
      Vec.combine(siteEnu[0], s.ix, siteEnu[1], s.iy, siteEnu[2], s.iz, s.east);
      Vec.combine(siteEnu[3], s.ix, siteEnu[4], s.iy, siteEnu[5], s.iz, s.north);
      Vec.combine(siteEnu[6], s.ix, siteEnu[7], s.iy, siteEnu[8], s.iz, s.up);
    }
  }

  private void loadTarget(Request r, Instant t) {
    load(r, seconds(t));
  }

  private void load(Request r, double tS) {
    TargetTrack track = tracks.computeIfAbsent(r.id(), id -> {
      TargetTrack tt = TargetTrack.of(r.target(), ctx);
      tt.prepare(chunk);
      return tt;
    });
    VisibilityCalculator.load(chunk, -1, tS, track.needsTeme(), track, siteEnu, s);
  }
}
