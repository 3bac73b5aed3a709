package dev.sequencer.visibility;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.Pointing;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.slew.KeepOut;
import dev.sequencer.slew.KeepOuts;
import dev.sequencer.slew.SiteKeepOut;
import java.util.ArrayList;
import java.util.List;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.orekit.frames.Frame;
import org.orekit.time.AbsoluteDate;
import org.orekit.utils.PVCoordinatesProvider;

/**
 * The cones slews keep out of (spec A3) from a scenario's constraints: the Sun keep-out
 * ({@code sunSeparationMinDeg}) for every observer, and from orbit the Earth's disc widened by
 * {@code earthLimbMinDeg} (for slews between sky pointings: a slew to or from an Earth point looks at the
 * Earth by design). Scenario-wide values; a request's own {@code constraints} do not change its slews.
 *
 * <p>The Sun's axis is its geocentric direction; seen from the observer it differs by the parallax, at
 * most (observer distance from the Earth's centre) / (Sun distance) (4.7e-5 rad, 0.0027°, from 7,000 km),
 * added to the radius as {@link #SUN_PARALLAX_DEG} for observers up to 10,000 km. Its drift bound is
 * {@link #SUN_RATE_DEG_PER_S}. The Earth cone's axis is the direction to the Earth's centre, its radius
 * asin(R/r) + earthLimbMinDeg with the spherical Earth of the visibility constraints; its drift bound
 * is v/r + R·v/(r·√(r² − R²)) at the perigee radius less 2 % and perigee speed plus 2 % (the axis turns
 * at most at v/r, the radius changes at most at that second term since |dr/dt| ≤ v).
 */
public final class SlewKeepOuts {
  /** Bound on the Sun's geocentric rate: 1.02 deg/day at perihelion (common practice), with 8 % margin. */
  static final double SUN_RATE_DEG_PER_S = 1.1 / 86400.0;
  /**
   * Bound on the Sun's rate in a ground site's frame: the Earth's rotation (360.9856° per day of 86,400 s,
   * common practice) plus the Sun's own 1.1°/day, deg/s.
   */
  static final double SUN_SITE_RATE_DEG_PER_S = (360.9856 + 1.1) / 86400.0;
  /** The Sun's parallax bound for observers within 10,000 km of the Earth's centre, degrees. */
  static final double SUN_PARALLAX_DEG = Math.toDegrees(1.0e7 / 1.495978707e11);

  /** Spacing of the table of the Sun's geocentric GCRF direction, seconds. */
  static final double SUN_TABLE_STEP_S = 600;
  /**
   * Bound on that table's interpolation error, degrees: the direction turns at most at 1.1°/day (1.3e-7
   * rad/s, {@link #SUN_RATE_DEG_PER_S}) with |p''| of the order of its square, so linear interpolation over
   * 600 s is within h²·ω²/8 ≈ 1e-9 rad; taken as 1e-5° (over a thousand times larger, which also covers the
   * Earth's orbital eccentricity) and added to the cone's radius.
   */
  static final double SUN_TABLE_ERROR_DEG = 1e-5;
  /** Spacing of the Sun's table in a ground site's axes (alt-az keep-out checks), seconds. */
  static final double SITE_TABLE_STEP_S = 60;
  /**
   * Bound on the table's interpolation error, degrees. The Sun's site direction p(t) turns at most at
   * ω = {@link #SUN_SITE_RATE_DEG_PER_S} (in rad/s, 7.3e-5), so |p''| ≤ ω² (rotation about a nearly fixed
   * axis; the Sun's own acceleration is far smaller), and linear interpolation over a step h is within
   * h²·ω²/8 = 2.4e-6 rad (1.4e-4°) of p, which normalising does not enlarge beyond first order. Taken
   * 7 times larger; the alt-az checks widen the cone by it.
   */
  static final double SITE_TABLE_ERROR_DEG = 1e-3;

  private SlewKeepOuts() {}

  /** The scenario's keep-outs during slews; {@link KeepOuts#NONE} when off or when no minimum is given. */
  public static KeepOuts of(Scenario s, AstroContext ctx) {
    Constraints c = s.constraints();
    if (!s.slew().keepOutDuringSlew() || s.observer() == null || c == null) {
      return KeepOuts.NONE;
    }
    AbsoluteDate origin = ctx.date(s.horizon().start());
    double horizonS = ctx.date(s.horizon().end()).durationFrom(origin);
    List<KeepOut> always = new ArrayList<>();
    List<KeepOut> skyOnly = new ArrayList<>();
    Frame gcrf = ctx.inertial();
    if (c.sunSeparationMinDeg() != null) {
      double radius = Math.min(180, c.sunSeparationMinDeg() + SUN_PARALLAX_DEG);
      always.add(s.observer() instanceof GroundSite site
          ? new SiteSun(ctx, origin, gcrf, radius, SiteFrame.enuItrf(site), -PointingTracks.MARGIN_S,
              horizonS + PointingTracks.MARGIN_S)
          : new SunCone(ctx, origin, gcrf, radius, -PointingTracks.MARGIN_S, horizonS + PointingTracks.MARGIN_S));
    }
    if (c.earthLimbMinDeg() != null && s.observer() instanceof OrbitObserver o) {
      PVCoordinatesProvider orbit = Observers.motion(o, ctx, origin.shiftedBy(-PointingTracks.MARGIN_S),
          origin.shiftedBy(horizonS + PointingTracks.MARGIN_S));
      double[] rv = Observers.perigeeRadiusAndSpeed(o, ctx);
      double r = rv[0];
      double v = rv[1];
      double earth = ConstraintFunction.EARTH_RADIUS_M;
      double drift = Math.toDegrees(v / r + earth * v / (r * Math.sqrt(Math.max(1, r * r - earth * earth))));
      double limbMin = c.earthLimbMinDeg();
      skyOnly.add(new KeepOut() {
        @Override
        public Vector3D axis(double tS) {
          return orbit.getPosition(origin.shiftedBy(tS), gcrf).negate().normalize();
        }

        @Override
        public double radiusDeg(double tS) {
          double d = orbit.getPosition(origin.shiftedBy(tS), gcrf).getNorm();
          return Math.min(180, Math.toDegrees(Math.asin(Math.min(1, earth / d))) + limbMin);
        }

        @Override
        public double maxDriftDegPerS() {
          return drift;
        }

        @Override
        public String name() {
          return "Earth limb";
        }
      });
    }
    boolean[] sky = new boolean[s.requests().size()];
    for (int k = 0; k < sky.length; k++) {
      Request q = s.requests().get(k);
      sky[k] = !(q.target() instanceof EarthPoint);
    }
    Pointing p = s.startPointing();
    return new KeepOuts(always, skyOnly, sky, p instanceof RaDec, -PointingTracks.MARGIN_S,
        horizonS + PointingTracks.MARGIN_S);
  }

  /** The Sun keep-out: the Sun's geocentric GCRF direction, the scenario's radius (plus parallax). */
  private static class SunCone implements KeepOut {
    final AstroContext ctx;
    final AbsoluteDate origin;
    final Frame gcrf;
    final double radius;
    private final double fromS;
    /** The Sun's GCRF direction every {@link #SUN_TABLE_STEP_S} from fromS, filled on first use of each entry. */
    private final Vector3D[] table;

    SunCone(AstroContext ctx, AbsoluteDate origin, Frame gcrf, double radius, double fromS, double toS) {
      this.ctx = ctx;
      this.origin = origin;
      this.gcrf = gcrf;
      this.radius = radius;
      this.fromS = fromS;
      this.table = new Vector3D[(int) Math.ceil(Math.max(0, toS - fromS) / SUN_TABLE_STEP_S) + 2];
    }

    /** Inside the table's span, the normalised linear interpolation of two entries (error: {@link #SUN_TABLE_ERROR_DEG}). */
    @Override
    public Vector3D axis(double tS) {
      double x = (tS - fromS) / SUN_TABLE_STEP_S;
      int i = (int) Math.floor(x);
      if (i < 0 || i + 1 >= table.length) {
        return exact(tS);
      }
      double f = x - i;
      return new Vector3D(1 - f, entry(i), f, entry(i + 1)).normalize();
    }

    private Vector3D entry(int i) {
      Vector3D v = table[i];
      if (v == null) {
        v = exact(fromS + i * SUN_TABLE_STEP_S); // idempotent; Vector3D is immutable, so a racing write is safe
        table[i] = v;
      }
      return v;
    }

    private Vector3D exact(double tS) {
      return ctx.sun().getPosition(origin.shiftedBy(tS), gcrf).normalize();
    }

    @Override
    public double radiusDeg(double tS) {
      return radius + SUN_TABLE_ERROR_DEG;
    }

    @Override
    public double maxDriftDegPerS() {
      return SUN_RATE_DEG_PER_S;
    }

    @Override
    public String name() {
      return "Sun";
    }
  }

  /**
   * The Sun keep-out seen from a ground site: the same GCRF cone (for eigenaxis slews from the ground), also
   * in the site's azimuth and elevation (for the alt-az mount's two-axis path), geometric, of the centre.
   */
  private static final class SiteSun extends SunCone implements SiteKeepOut {
    private final double[] enu;
    private final double tableFromS;
    private final int tableSize;
    /** The Sun's unit vector in the site's east-north-up axes every {@link #SITE_TABLE_STEP_S}; built on first use. */
    private volatile double[][] table;

    SiteSun(AstroContext ctx, AbsoluteDate origin, Frame gcrf, double radius, double[] enu, double fromS, double toS) {
      super(ctx, origin, gcrf, radius, fromS, toS);
      this.enu = enu;
      this.tableFromS = fromS;
      this.tableSize = (int) Math.ceil(Math.max(0, toS - fromS) / SITE_TABLE_STEP_S) + 2;
    }

    /**
     * The axis in the site's azimuth and elevation: inside the table's span, the normalised linear
     * interpolation of the tabulated east-north-up vectors (within {@link #azElErrorDeg}); outside, exact.
     */
    @Override
    public AzEl azEl(double tS) {
      double x = (tS - tableFromS) / SITE_TABLE_STEP_S;
      int i = (int) Math.floor(x);
      if (i < 0 || i + 1 >= tableSize) {
        return SiteFrame.azEl(ctx, origin.shiftedBy(tS), enu, axis(tS));
      }
      double[][] t = table();
      double f = x - i;
      double e = (1 - f) * t[i][0] + f * t[i + 1][0];
      double n = (1 - f) * t[i][1] + f * t[i + 1][1];
      double u = (1 - f) * t[i][2] + f * t[i + 1][2];
      double norm = Math.sqrt(e * e + n * n + u * u);
      double az = Math.toDegrees(Math.atan2(e, n));
      return new AzEl(az < 0 ? az + 360 : az, Math.toDegrees(Math.asin(Math.max(-1, Math.min(1, u / norm)))));
    }

    private double[][] table() {
      double[][] t = table;
      if (t == null) {
        synchronized (this) {
          t = table;
          if (t == null) {
            t = new double[tableSize][];
            for (int i = 0; i < tableSize; i++) {
              double tS = tableFromS + i * SITE_TABLE_STEP_S;
              AzEl a = SiteFrame.azEl(ctx, origin.shiftedBy(tS), enu, axis(tS));
              double az = Math.toRadians(a.azimuthDeg());
              double el = Math.toRadians(a.elevationDeg());
              t[i] = new double[] {Math.cos(el) * Math.sin(az), Math.cos(el) * Math.cos(az), Math.sin(el)};
            }
            table = t;
          }
        }
      }
      return t;
    }

    @Override
    public double azElErrorDeg() {
      return SITE_TABLE_ERROR_DEG;
    }

    @Override
    public double maxSiteDriftDegPerS() {
      return SUN_SITE_RATE_DEG_PER_S;
    }
  }
}
