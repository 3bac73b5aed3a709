package dev.sequencer.astro;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.jastronomy.jsofa.JSOFA;
import org.orekit.time.AbsoluteDate;
import org.orekit.time.DateTimeComponents;

/**
 * Test helpers for the outside reference: SOFA (IAU Standards of Fundamental Astronomy) through its Java
 * port jsofa ({@code org.javastro:jsofa}, test scope). Dates go to SOFA as two-part Julian dates; vectors
 * come back as Hipparchus vectors.
 *
 * <p>No Earth-orientation data exists offline: every SOFA call here is given UT1 = UTC (dut1 = 0) and no
 * polar motion (xp = yp = 0), the same assumptions as {@link AstroContext#offline()}, so the comparisons
 * measure the computations and not the missing EOP (whose effect docs/astro.md bounds separately).
 */
public final class Sofa {
  /** Seconds per day. */
  public static final double DAY_S = 86400.0;
  /** Speed of light in AU per day (SOFA's CMPS / AU times a day). */
  public static final double C_AU_PER_DAY = 299_792_458.0 * DAY_S / 149_597_870_700.0;
  public static final double AU_M = 149_597_870_700.0;
  public static final double ARCSEC_PER_RAD = 180.0 * 3600.0 / Math.PI;

  private Sofa() {}

  /** First part of every two-part TT Julian date: J2000.0. */
  public static final double J2000_JD = 2451545.0;

  /** TT as (J2000, days since J2000 TT). */
  public static double[] tt(AstroContext ctx, AbsoluteDate date) {
    return new double[] {J2000_JD, date.durationFrom(ctx.timeScales().getJ2000Epoch()) / DAY_S};
  }

  /** UTC as SOFA's quasi Julian date (jauDtf2d), also used as UT1 (dut1 = 0). */
  public static double[] utc(AstroContext ctx, AbsoluteDate date) {
    DateTimeComponents c = date.getComponents(ctx.utc());
    try {
      JSOFA.JulianDate jd = JSOFA.jauDtf2d("UTC", c.getDate().getYear(), c.getDate().getMonth(),
          c.getDate().getDay(), c.getTime().getHour(), c.getTime().getMinute(), c.getTime().getSecond());
      return new double[] {jd.djm0, jd.djm1};
    } catch (Exception e) {
      throw new IllegalStateException(e);
    }
  }

  /** Random days per date set, and instants per day (so {@link #randomDates} gives 1,200 dates). */
  public static final int DAYS = 150;
  public static final int PER_DAY = 8;

  /**
   * 1,200 random UTC dates between 2020-01-01 and 2060-12-31 (whole milliseconds): 150 random days, 8 random
   * instants in each, in time order. Grouping them by day keeps Orekit's precession-nutation cache warm
   * (a lone date far from the last one costs it about 50 ms); 150 days still sample the 18.6-year
   * nutation and the year, and the instants every sidereal angle.
   */
  public static List<AbsoluteDate> randomDates(AstroContext ctx, Random random) {
    AbsoluteDate start = new AbsoluteDate(2020, 1, 1, 0, 0, 0.0, ctx.utc());
    double days = Math.floor(new AbsoluteDate(2060, 12, 31, 0, 0, 0.0, ctx.utc()).durationFrom(start) / DAY_S);
    List<AbsoluteDate> out = new ArrayList<>();
    for (int d = 0; d < DAYS; d++) {
      AbsoluteDate day = start.shiftedBy(Math.floor(random.nextDouble() * days) * DAY_S);
      for (int k = 0; k < PER_DAY; k++) {
        out.add(day.shiftedBy(Math.floor(random.nextDouble() * DAY_S * 1000.0) / 1000.0));
      }
    }
    out.sort(AbsoluteDate::compareTo);
    return out;
  }

  /**
   * SOFA's observed place (jauAtco13) of an ICRS direction with no refraction (pressure 0), no proper
   * motion or parallax, UT1 = UTC and no polar motion: {azimuth from north through east, elevation}, degrees.
   * SOFA applies light deflection, annual and diurnal aberration, IAU 2006/2000A precession-nutation, the
   * Earth rotation angle and the WGS-84 geodetic vertical.
   */
  public static double[] observed(AstroContext ctx, AbsoluteDate date, double raDeg, double decDeg, double latDeg,
      double lonDeg, double altM) {
    double[] u = utc(ctx, date);
    try {
      JSOFA.ObservedPositionEO o = JSOFA.jauAtco13(Math.toRadians(raDeg), Math.toRadians(decDeg), 0, 0, 0, 0,
          u[0], u[1], 0.0, Math.toRadians(lonDeg), Math.toRadians(latDeg), altM, 0.0, 0.0, 0.0, 0.0, 0.0, 0.55);
      return new double[] {Math.toDegrees(o.op.aob), 90.0 - Math.toDegrees(o.op.zob)};
    } catch (Exception e) {
      throw new IllegalStateException(e);
    }
  }

  /** The unit vector (east, north, up) of an azimuth and elevation in degrees. */
  public static Vector3D horizon(double azimuthDeg, double elevationDeg) {
    double a = Math.toRadians(azimuthDeg);
    double e = Math.toRadians(elevationDeg);
    return new Vector3D(Math.sin(a) * Math.cos(e), Math.cos(a) * Math.cos(e), Math.sin(e));
  }

  public static Vector3D vector(double[] v) {
    return new Vector3D(v[0], v[1], v[2]);
  }

  public static Vector3D times(double[][] r, Vector3D v) {
    return new Vector3D(
        r[0][0] * v.getX() + r[0][1] * v.getY() + r[0][2] * v.getZ(),
        r[1][0] * v.getX() + r[1][1] * v.getY() + r[1][2] * v.getZ(),
        r[2][0] * v.getX() + r[2][1] * v.getY() + r[2][2] * v.getZ());
  }

  /** Angle between two vectors, arcseconds (atan2 form: full precision for nearly aligned vectors). */
  public static double arcsec(Vector3D a, Vector3D b) {
    return Math.atan2(Vector3D.crossProduct(a, b).getNorm(), Vector3D.dotProduct(a, b)) * ARCSEC_PER_RAD;
  }

  /** Largest angle between the images of the three axes under two rotations, arcseconds. */
  public static double rotationArcsec(java.util.function.UnaryOperator<Vector3D> ours, double[][] sofa) {
    double max = 0;
    for (Vector3D axis : new Vector3D[] {Vector3D.PLUS_I, Vector3D.PLUS_J, Vector3D.PLUS_K}) {
      max = Math.max(max, arcsec(ours.apply(axis), times(sofa, axis)));
    }
    return max;
  }

  /** |a - b| wrapped to [0, pi], in arcseconds, for two angles in radians. */
  public static double angleDiffArcsec(double a, double b) {
    return Math.abs(Math.IEEEremainder(a - b, 2 * Math.PI)) * ARCSEC_PER_RAD;
  }
}
