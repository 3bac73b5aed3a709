package dev.sequencer.astro;

import org.hipparchus.CalculusFieldElement;
import org.hipparchus.geometry.euclidean.threed.FieldVector3D;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.util.Binary64;
import org.hipparchus.util.FastMath;
import org.orekit.frames.Frame;
import org.orekit.frames.Frames;
import org.orekit.time.AbsoluteDate;
import org.orekit.time.FieldAbsoluteDate;
import org.orekit.time.TimeScales;
import org.orekit.utils.Constants;
import org.orekit.utils.ExtendedPositionProvider;
import org.orekit.utils.IERSConventions;

/**
 * The Moon's geometric geocentric position from the truncated ELP-2000/82 series of Meeus, Astronomical
 * Algorithms, 2nd ed., ch. 47 (tables 47.A and 47.B): 2.9 arcsec RMS and 18.3 arcsec at worst in direction,
 * 6.1 km RMS and 31.7 km at worst in distance against ELP/MPP02 over 1950-2100 (the figures SOFA gives for
 * its moon98, the same series; this transcription agrees with moon98 to 0.05 arcsec, see
 * {@code SofaReferenceTest}).
 *
 * <p>Meeus' mean longitude L' includes the constant part of the lunar light-time, -0.70 arcsec (as stated in
 * ch. 47, from memory; it equals the mean motion 0.549 arcsec/s times the mean light-time 1.28 s). It is
 * added back here so that this provider is geometric like Orekit's JPL Moon, and {@link ApparentPlace}
 * can apply light-time to every body alike. Positions are in Orekit's mean ecliptic and equinox of date
 * frame (IERS 2010), transformed by Orekit to any frame; metres; TT used as TD. Evaluated on any field
 * (see {@link SunSeries}). Immutable and thread-safe.
 */
final class MoonSeries implements ExtendedPositionProvider {
  /** Constant light-time term included in Meeus' L', arcsec (removed to get a geometric position). */
  static final double LIGHT_TIME_IN_MEAN_LONGITUDE_ARCSEC = -0.70;

  /** Table 47.A: multiples of D, M, M', F; Sigma-l coefficient (1e-6 deg); Sigma-r coefficient (1e-3 km). */
  private static final int[][] LR = {
    {0, 0, 1, 0, 6288774, -20905355},
    {2, 0, -1, 0, 1274027, -3699111},
    {2, 0, 0, 0, 658314, -2955968},
    {0, 0, 2, 0, 213618, -569925},
    {0, 1, 0, 0, -185116, 48888},
    {0, 0, 0, 2, -114332, -3149},
    {2, 0, -2, 0, 58793, 246158},
    {2, -1, -1, 0, 57066, -152138},
    {2, 0, 1, 0, 53322, -170733},
    {2, -1, 0, 0, 45758, -204586},
    {0, 1, -1, 0, -40923, -129620},
    {1, 0, 0, 0, -34720, 108743},
    {0, 1, 1, 0, -30383, 104755},
    {2, 0, 0, -2, 15327, 10321},
    {0, 0, 1, 2, -12528, 0},
    {0, 0, 1, -2, 10980, 79661},
    {4, 0, -1, 0, 10675, -34782},
    {0, 0, 3, 0, 10034, -23210},
    {4, 0, -2, 0, 8548, -21636},
    {2, 1, -1, 0, -7888, 24208},
    {2, 1, 0, 0, -6766, 30824},
    {1, 0, -1, 0, -5163, -8379},
    {1, 1, 0, 0, 4987, -16675},
    {2, -1, 1, 0, 4036, -12831},
    {2, 0, 2, 0, 3994, -10445},
    {4, 0, 0, 0, 3861, -11650},
    {2, 0, -3, 0, 3665, 14403},
    {0, 1, -2, 0, -2689, -7003},
    {2, 0, -1, 2, -2602, 0},
    {2, -1, -2, 0, 2390, 10056},
    {1, 0, 1, 0, -2348, 6322},
    {2, -2, 0, 0, 2236, -9884},
    {0, 1, 2, 0, -2120, 5751},
    {0, 2, 0, 0, -2069, 0},
    {2, -2, -1, 0, 2048, -4950},
    {2, 0, 1, -2, -1773, 4130},
    {2, 0, 0, 2, -1595, 0},
    {4, -1, -1, 0, 1215, -3958},
    {0, 0, 2, 2, -1110, 0},
    {3, 0, -1, 0, -892, 3258},
    {2, 1, 1, 0, -810, 2616},
    {4, -1, -2, 0, 759, -1897},
    {0, 2, -1, 0, -713, -2117},
    {2, 2, -1, 0, -700, 2354},
    {2, 1, -2, 0, 691, 0},
    {2, -1, 0, -2, 596, 0},
    {4, 0, 1, 0, 549, -1423},
    {0, 0, 4, 0, 537, -1117},
    {4, -1, 0, 0, 520, -1571},
    {1, 0, -2, 0, -487, -1739},
    {2, 1, 0, -2, -399, 0},
    {0, 0, 2, -2, -381, -4421},
    {1, 1, 1, 0, 351, 0},
    {3, 0, -2, 0, -340, 0},
    {4, 0, -3, 0, 330, 0},
    {2, -1, 2, 0, 327, 0},
    {0, 2, 1, 0, -323, 1165},
    {1, 1, -1, 0, 299, 0},
    {2, 0, 3, 0, 294, 0},
    {2, 0, -1, -2, 0, 8752},
  };

  /** Table 47.B: multiples of D, M, M', F; Sigma-b coefficient (1e-6 deg). */
  private static final int[][] B = {
    {0, 0, 0, 1, 5128122},
    {0, 0, 1, 1, 280602},
    {0, 0, 1, -1, 277693},
    {2, 0, 0, -1, 173237},
    {2, 0, -1, 1, 55413},
    {2, 0, -1, -1, 46271},
    {2, 0, 0, 1, 32573},
    {0, 0, 2, 1, 17198},
    {2, 0, 1, -1, 9266},
    {0, 0, 2, -1, 8822},
    {2, -1, 0, -1, 8216},
    {2, 0, -2, -1, 4324},
    {2, 0, 1, 1, 4200},
    {2, 1, 0, -1, -3359},
    {2, -1, -1, 1, 2463},
    {2, -1, 0, 1, 2211},
    {2, -1, -1, -1, 2065},
    {0, 1, -1, -1, -1870},
    {4, 0, -1, -1, 1828},
    {0, 1, 0, 1, -1794},
    {0, 0, 0, 3, -1749},
    {0, 1, -1, 1, -1565},
    {1, 0, 0, 1, -1491},
    {0, 1, 1, 1, -1475},
    {0, 1, 1, -1, -1410},
    {0, 1, 0, -1, -1344},
    {1, 0, 0, -1, -1335},
    {0, 0, 3, 1, 1107},
    {4, 0, 0, -1, 1021},
    {4, 0, -1, 1, 833},
    {0, 0, 1, -3, 777},
    {4, 0, -2, 1, 671},
    {2, 0, 0, -3, 607},
    {2, 0, 2, -1, 596},
    {2, -1, 1, -1, 491},
    {2, 0, -2, 1, -451},
    {0, 0, 3, -1, 439},
    {2, 0, 2, 1, 422},
    {2, 0, -3, -1, 421},
    {2, 1, -1, 1, -366},
    {2, 1, 0, 1, -351},
    {4, 0, 0, 1, 331},
    {2, -1, 1, 1, 315},
    {2, -2, 0, -1, 302},
    {0, 0, 1, 3, -283},
    {2, 1, 1, -1, -229},
    {1, 1, 0, -1, 223},
    {1, 1, 0, 1, 223},
    {0, 1, -2, -1, -220},
    {2, 1, -1, -1, -220},
    {1, 0, 1, 1, -185},
    {2, -1, -2, -1, 181},
    {0, 1, 2, 1, -177},
    {4, 0, -2, -1, 176},
    {4, -1, -1, -1, 166},
    {1, 0, 1, -1, -164},
    {4, 0, 1, -1, 132},
    {1, 0, -1, -1, -119},
    {4, -1, 0, -1, 115},
    {2, -2, 0, 1, 107},
  };

  private final AbsoluteDate j2000Tt;
  private final Frame eclipticOfDate;

  MoonSeries(TimeScales timeScales, Frames frames) {
    this.j2000Tt = timeScales.getJ2000Epoch();
    this.eclipticOfDate = frames.getEcliptic(IERSConventions.IERS_2010);
  }

  @Override
  public Vector3D getPosition(AbsoluteDate date, Frame frame) {
    Binary64 t = new Binary64(date.durationFrom(j2000Tt) / Constants.JULIAN_CENTURY);
    Vector3D ecliptic = eclipticPositionM(t, true).toVector3D();
    return eclipticOfDate.getStaticTransformTo(frame, date).transformPosition(ecliptic);
  }

  @Override
  public <T extends CalculusFieldElement<T>> FieldVector3D<T> getPosition(FieldAbsoluteDate<T> date, Frame frame) {
    T t = date.durationFrom(j2000Tt).divide(Constants.JULIAN_CENTURY);
    return eclipticOfDate.getStaticTransformTo(frame, date).transformPosition(eclipticPositionM(t, true));
  }

  /**
   * Geocentric Moon in the mean ecliptic and equinox of date, metres.
   *
   * @param t Julian centuries of TT from J2000.0
   * @param geometric true to remove the constant light-time term of L'; false gives Meeus' printed values
   */
  static <T extends CalculusFieldElement<T>> FieldVector3D<T> eclipticPositionM(T t, boolean geometric) {
    // Fundamental arguments, Meeus eqs. 47.1-47.5 and the A1..A3, E of ch. 47, in degrees.
    T lp = poly(t, 218.3164477, 481267.88123421, -0.0015786, 1.0 / 538841, -1.0 / 65194000);
    T d = poly(t, 297.8501921, 445267.1114034, -0.0018819, 1.0 / 545868, -1.0 / 113065000);
    T m = poly(t, 357.5291092, 35999.0502909, -0.0001536, 1.0 / 24490000, 0);
    T mp = poly(t, 134.9633964, 477198.8675055, 0.0087414, 1.0 / 69699, -1.0 / 14712000);
    T f = poly(t, 93.2720950, 483202.0175233, -0.0036539, -1.0 / 3526000, 1.0 / 863310000);
    T a1 = poly(t, 119.75, 131.849, 0, 0, 0);
    T a2 = poly(t, 53.09, 479264.290, 0, 0, 0);
    T a3 = poly(t, 313.45, 481266.484, 0, 0, 0);
    T e = poly(t, 1.0, -0.002516, -0.0000074, 0, 0);
    T e2 = e.square();

    T zero = t.getField().getZero();
    T sumL = zero;
    T sumR = zero;
    for (int[] row : LR) {
      T arg = argumentRad(row, d, m, mp, f);
      T ecc = eccentricityFactor(row[1], e, e2);
      sumL = sumL.add(arg.sin().multiply(ecc).multiply(row[4]));
      sumR = sumR.add(arg.cos().multiply(ecc).multiply(row[5]));
    }
    T sumB = zero;
    for (int[] row : B) {
      T arg = argumentRad(row, d, m, mp, f);
      sumB = sumB.add(arg.sin().multiply(eccentricityFactor(row[1], e, e2)).multiply(row[4]));
    }
    // Additive terms (Venus, Jupiter, flattening of the Earth), Meeus ch. 47.
    sumL = sumL.add(sinDeg(a1).multiply(3958)).add(sinDeg(lp.subtract(f)).multiply(1962))
        .add(sinDeg(a2).multiply(318));
    sumB = sumB.add(sinDeg(lp).multiply(-2235)).add(sinDeg(a3).multiply(382))
        .add(sinDeg(a1.subtract(f)).multiply(175)).add(sinDeg(a1.add(f)).multiply(175))
        .add(sinDeg(lp.subtract(mp)).multiply(127)).add(sinDeg(lp.add(mp)).multiply(-115));

    T lambdaDeg = lp.add(sumL.multiply(1.0e-6));
    if (geometric) {
      lambdaDeg = lambdaDeg.subtract(LIGHT_TIME_IN_MEAN_LONGITUDE_ARCSEC / 3600.0);
    }
    T betaDeg = sumB.multiply(1.0e-6);
    // Distance = 385000.56 km + Sigma-r (in units of 1e-3 km, i.e. metres).
    T distanceM = sumR.add(385_000_560.0);
    return new FieldVector3D<>(FastMath.toRadians(lambdaDeg), FastMath.toRadians(betaDeg)).scalarMultiply(distanceM);
  }

  private static <T extends CalculusFieldElement<T>> T poly(T t, double c0, double c1, double c2, double c3,
      double c4) {
    return t.multiply(c4).add(c3).multiply(t).add(c2).multiply(t).add(c1).multiply(t).add(c0);
  }

  private static <T extends CalculusFieldElement<T>> T argumentRad(int[] row, T d, T m, T mp, T f) {
    return FastMath.toRadians(d.multiply(row[0]).add(m.multiply(row[1])).add(mp.multiply(row[2]))
        .add(f.multiply(row[3])));
  }

  /** Terms containing M are multiplied by E (|M| = 1) or E^2 (|M| = 2), Meeus ch. 47. */
  private static <T extends CalculusFieldElement<T>> T eccentricityFactor(int mMultiple, T e, T e2) {
    return switch (Math.abs(mMultiple)) {
      case 0 -> e.getField().getOne();
      case 1 -> e;
      default -> e2;
    };
  }

  private static <T extends CalculusFieldElement<T>> T sinDeg(T deg) {
    return FastMath.toRadians(deg).sin();
  }
}
