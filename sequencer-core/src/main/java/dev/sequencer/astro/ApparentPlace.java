package dev.sequencer.astro;

import java.util.Objects;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.util.FastMath;
import org.hipparchus.util.MathUtils;
import org.orekit.frames.Frame;
import org.orekit.time.AbsoluteDate;
import org.orekit.utils.Constants;
import org.orekit.utils.ExtendedPositionProvider;
import org.orekit.utils.IERSConventions;

/**
 * A geocentric apparent place: right ascension and declination in degrees on the true equator and
 * equinox of {@code date} (Orekit's TOD frame, IERS 2010 conventions), as printed in almanacs.
 *
 * <p>{@code distanceM} is the light-time distance in metres, or {@link Double#POSITIVE_INFINITY} for a
 * bare direction. Right ascension is in [0, 360).
 */
public record ApparentPlace(AbsoluteDate date, double raDeg, double decDeg, double distanceM) {
  /** Light-time iterations; the second already changes the Moon's retarded epoch by under 1 microsecond. */
  private static final int LIGHT_TIME_ITERATIONS = 3;

  public ApparentPlace {
    Objects.requireNonNull(date, "date");
    if (!Double.isFinite(raDeg) || !Double.isFinite(decDeg) || Math.abs(decDeg) > 90.0) {
      throw new IllegalArgumentException("apparent place: raDeg " + raDeg + ", decDeg " + decDeg
          + " (need finite values and |decDeg| <= 90)");
    }
    if (!(distanceM > 0.0)) {
      throw new IllegalArgumentException("apparent place: distanceM must be > 0, got " + distanceM);
    }
  }

  /** A direction with no distance, e.g. a star's apparent place taken from a catalogue of date. */
  public static ApparentPlace ofDirection(AbsoluteDate date, double raDeg, double decDeg) {
    return new ApparentPlace(date, raDeg, decDeg, Double.POSITIVE_INFINITY);
  }

  /**
   * The apparent place of a body whose provider gives geometric geocentric positions.
   *
   * <p>Light-time and annual aberration are applied together by taking the geocentric position at the
   * retarded epoch {@code date - distance / c}: to first order in v/c, the Earth's motion during the
   * light-time equals the aberration shift (Meeus, Astronomical Algorithms, 2nd ed., ch. 25 uses this
   * for the Sun's -20.4898"/R). The neglected second-order terms are below 0.001 arcsec. Nutation and
   * precession come from Orekit's GCRF to TOD transform. Diurnal aberration (at most 0.3 arcsec) and
   * gravitational light deflection (under 0.01 arcsec at the Sun's limb distance from any target we use
   * here: the Sun itself is not deflected) are not applied.
   */
  public static ApparentPlace raDecOfDate(ExtendedPositionProvider body, AbsoluteDate date, AstroContext ctx) {
    Frame gcrf = ctx.inertial();
    Vector3D position = body.getPosition(date, gcrf);
    for (int i = 0; i < LIGHT_TIME_ITERATIONS; i++) {
      double lightTimeS = position.getNorm() / Constants.SPEED_OF_LIGHT;
      position = body.getPosition(date.shiftedBy(-lightTimeS), gcrf);
    }
    Vector3D ofDate = gcrf.getStaticTransformTo(trueOfDate(ctx), date).transformVector(position);
    double ra = FastMath.toDegrees(MathUtils.normalizeAngle(ofDate.getAlpha(), FastMath.PI));
    ra = ra >= 360.0 ? 0.0 : ra; // normalizeAngle can round a tiny negative angle up to 2 pi
    double dec = FastMath.toDegrees(ofDate.getDelta());
    return new ApparentPlace(date, ra, dec, position.getNorm());
  }

  /**
   * The same apparent direction as a GCRF unit vector: precession and nutation are undone, aberration
   * and light-time are kept (this is where the body is seen, expressed on ICRS axes).
   */
  public Vector3D gcrfDirection(AstroContext ctx) {
    Vector3D ofDate = new Vector3D(FastMath.toRadians(raDeg), FastMath.toRadians(decDeg));
    return trueOfDate(ctx).getStaticTransformTo(ctx.inertial(), date).transformVector(ofDate);
  }

  private static Frame trueOfDate(AstroContext ctx) {
    return ctx.dataContext().getFrames().getTOD(IERSConventions.IERS_2010, true);
  }
}
