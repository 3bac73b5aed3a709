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
 * The Sun's geometric geocentric position from the truncated VSOP87 Earth series (Meeus, Astronomical
 * Algorithms, 2nd ed., ch. 25 "higher accuracy" method, ch. 32 and Appendix III): at most 0.65 arcsec in
 * direction and 400 km (2.7e-6 AU) in distance over 2020-2060, measured against SOFA's epv00
 * ({@code SofaReferenceTest}); the distance error is the truncation of the series (no single term
 * dominates it).
 *
 * <p>The geocentric Sun is the Earth's heliocentric (L, B, R) reversed, corrected to the FK5 system
 * (Meeus eq. 32.3, -0.09 arcsec), and placed in Orekit's mean ecliptic and equinox of date frame
 * ({@link Frames#getEcliptic(IERSConventions)}, IERS 2010), from which Orekit transforms it to any frame.
 * Distances are in metres with 1 AU = 149 597 870 700 m (IAU 2012). Time is TT used as TD (TDB - TT is
 * below 2 ms, about 1e-4 arcsec of solar motion). No light-time or aberration is applied; see
 * {@link ApparentPlace}.
 *
 * <p>The series is evaluated on any Hipparchus field, so derivatives (and hence the velocity that
 * {@link ExtendedPositionProvider#getPVCoordinates(AbsoluteDate, Frame)} derives from them) are exact
 * derivatives of the truncated series. Immutable and thread-safe.
 */
final class SunSeries implements ExtendedPositionProvider {
  /** 1 AU in metres (IAU 2012 Resolution B2). */
  static final double AU_M = Constants.IAU_2012_ASTRONOMICAL_UNIT;

  private static final double ARCSEC_RAD = FastMath.toRadians(1.0 / 3600.0);

  private final AbsoluteDate j2000Tt;
  private final Frame eclipticOfDate;

  SunSeries(TimeScales timeScales, Frames frames) {
    this.j2000Tt = timeScales.getJ2000Epoch();
    this.eclipticOfDate = frames.getEcliptic(IERSConventions.IERS_2010);
  }

  @Override
  public Vector3D getPosition(AbsoluteDate date, Frame frame) {
    Binary64 t = new Binary64(date.durationFrom(j2000Tt) / Constants.JULIAN_CENTURY);
    Vector3D ecliptic = eclipticPositionM(t).toVector3D();
    return eclipticOfDate.getStaticTransformTo(frame, date).transformPosition(ecliptic);
  }

  @Override
  public <T extends CalculusFieldElement<T>> FieldVector3D<T> getPosition(FieldAbsoluteDate<T> date, Frame frame) {
    T t = date.durationFrom(j2000Tt).divide(Constants.JULIAN_CENTURY);
    return eclipticOfDate.getStaticTransformTo(frame, date).transformPosition(eclipticPositionM(t));
  }

  /**
   * Geocentric Sun in the mean ecliptic and equinox of date, metres.
   *
   * @param t Julian centuries of TT from J2000.0
   */
  static <T extends CalculusFieldElement<T>> FieldVector3D<T> eclipticPositionM(T t) {
    T tau = t.divide(10.0);
    // Geocentric Sun = heliocentric Earth reversed (Meeus ch. 25): longitude + pi, latitude negated.
    T lambda = Vsop87Earth.longitudeRad(tau).add(FastMath.PI);
    T beta = Vsop87Earth.latitudeRad(tau).negate();
    T r = Vsop87Earth.radiusAu(tau).multiply(AU_M);
    // FK5 correction, Meeus eq. 32.3 (lambda' = lambda - 1.397 deg T - 0.00031 deg T^2).
    T lambdaPrime = lambda.subtract(t.multiply(FastMath.toRadians(1.397)))
        .subtract(t.square().multiply(FastMath.toRadians(0.00031)));
    T cosLp = lambdaPrime.cos();
    T sinLp = lambdaPrime.sin();
    T dLambda = cosLp.add(sinLp).multiply(beta.tan()).multiply(0.03916).subtract(0.09033).multiply(ARCSEC_RAD);
    T dBeta = cosLp.subtract(sinLp).multiply(0.03916 * ARCSEC_RAD);
    return new FieldVector3D<>(lambda.add(dLambda), beta.add(dBeta)).scalarMultiply(r);
  }
}
