package dev.sequencer.visibility;

import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Target;
import java.util.ArrayList;
import java.util.List;
import java.util.function.ToDoubleFunction;

/**
 * One constraint as a margin function of the loaded {@link Scratch}: degrees, non-negative exactly when
 * the constraint holds.
 *
 * <p>Every margin is an angle, so one edge accuracy and one tolerance fit all: airmass is expressed as
 * the elevation above the one where the airmass reaches its limit, the hour angle in degrees of hour
 * angle (15 deg per hour), the Moon's illuminated fraction as the phase angle beyond the one where the
 * fraction reaches its limit.
 *
 * @param name the constraint's name as shown to users ("Sun separation", ...)
 * @param targetIndependent true when the margin does not depend on the target (darkness at a site)
 * @param margin the margin in degrees
 * @param maxRateDegPerS a proven bound on how fast the margin changes, degrees per second, or NaN when
 *     none is known (then {@link RootScan} estimates one from the samples)
 */
record ConstraintFunction(String name, boolean targetIndependent, ToDoubleFunction<Scratch> margin,
    double maxRateDegPerS) {
  /** Earth radius of the spec's spherical limb and shadow models, metres. */
  static final double EARTH_RADIUS_M = 6_378_137.0;
  /** Solar radius of the spec's umbra model, metres. */
  static final double SUN_RADIUS_M = 695_700_000.0;

  static final String SUN = "Sun separation";
  static final String MOON = "Moon separation";
  static final String LIMB = "Earth limb";
  static final String ELEVATION = "elevation";
  static final String ELEVATION_MAX = "elevation max";
  static final String DARKNESS = "darkness";
  static final String SUNLIT = "target sunlit";
  static final String AIRMASS = "airmass";
  static final String HOUR_ANGLE = "hour angle";
  static final String MOON_ELEVATION = "Moon elevation";
  static final String MOON_ILLUMINATION = "Moon illumination";
  static final String DAYLIGHT = "daylight";
  static final String OFF_NADIR = "off-nadir";

  /**
   * Bound on the rate of a body's elevation at a point on the Earth, deg/s: the Earth's rotation
   * (0.004178 deg/s; |dh/dt| = w cos(phi) |sin A| for a fixed direction, common practice) plus the Sun's
   * own motion (about 1 deg/day); 3 % margin.
   */
  static final double SUN_ELEVATION_RATE_DEG_PER_S = 0.0043;
  /**
   * Bound on the rate of the Moon's topocentric elevation and of its geocentric phase angle, deg/s: the
   * Earth's rotation (0.004178) plus the Moon's own motion (at most about 15.4 deg/day = 0.00018) plus
   * the change of its parallax (at most 1.02 deg times the elevation rate in rad/s, 0.00008); the phase
   * angle moves at the elongation rate, below 0.0002. Rounded up to 0.005.
   */
  static final double MOON_RATE_DEG_PER_S = 0.005;
  /**
   * Bound on the rate of a fixed target's hour angle, deg/s: the sidereal rate 360.9856 deg per day
   * (0.0041781 deg/s); precession, nutation and aberration add under 1e-7 deg/s. 1 % margin.
   */
  static final double HOUR_ANGLE_RATE_DEG_PER_S = 1.01 * 360.98564736629 / 86400.0;
  private static final double UNKNOWN_RATE = Double.NaN;

  /** The constraints that apply to a target kind under a scenario's observer and constraints. */
  static List<ConstraintFunction> forTarget(Constraints c, GroundSite site, Target target) {
    List<ConstraintFunction> list = new ArrayList<>();
    if (c.sunSeparationMinDeg() != null) {
      double min = c.sunSeparationMinDeg();
      list.add(new ConstraintFunction(SUN, false, s -> separationDeg(s, s.sun) - min, UNKNOWN_RATE));
    }
    if (c.moonSeparationMinDeg() != null) {
      double min = c.moonSeparationMinDeg();
      list.add(new ConstraintFunction(MOON, false, s -> separationDeg(s, s.moon) - min, UNKNOWN_RATE));
    }
    if (site != null) {
      addGround(list, c, site, target);
    } else if (target instanceof EarthPoint) {
      addEarthPoint(list, c);
    } else if (c.earthLimbMinDeg() != null) {
      double min = c.earthLimbMinDeg();
      list.add(new ConstraintFunction(LIMB, false, s -> limbClearanceDeg(s) - min, UNKNOWN_RATE));
    }
    if (target instanceof OrbitingTarget && c.sunlitRequired()) {
      list.add(new ConstraintFunction(SUNLIT, false, ConstraintFunction::sunlitMarginDeg, UNKNOWN_RATE));
    }
    return list;
  }

  private static void addGround(List<ConstraintFunction> list, Constraints c, GroundSite site, Target target) {
    Double elMin = c.elevationMinDeg();
    boolean noMask = site.horizonMask().isEmpty();
    list.add(new ConstraintFunction(ELEVATION, false, s -> {
      double el = site.observedElevationDeg(targetElevationDeg(s));
      double floor;
      if (noMask) {
        floor = elMin != null ? elMin : 0.0;
      } else {
        double mask = site.maskElevationDeg(azimuthDeg(s.los, s.east, s.north));
        floor = elMin != null ? Math.max(elMin, mask) : mask;
      }
      return el - floor;
    }, UNKNOWN_RATE));
    if (c.elevationMaxDeg() != null) {
      double max = c.elevationMaxDeg();
      list.add(new ConstraintFunction(ELEVATION_MAX, false, s -> max - site.observedElevationDeg(targetElevationDeg(s)), UNKNOWN_RATE));
    }
    if (c.airmassMax() != null) {
      double floor = Airmass.minElevationDeg(c.airmassMax());
      list.add(new ConstraintFunction(AIRMASS, false, s -> site.observedElevationDeg(targetElevationDeg(s)) - floor,
          UNKNOWN_RATE));
    }
    addSunElevation(list, c, false);
    if (c.moonElevationMaxDeg() != null) {
      double max = c.moonElevationMaxDeg();
      list.add(new ConstraintFunction(MOON_ELEVATION, true, s -> max - bodyElevationDeg(s, s.moon, s.obs),
          MOON_RATE_DEG_PER_S));
    }
    if (c.moonIlluminationMax() != null) {
      double minPhaseDeg = Math.toDegrees(Math.acos(2 * c.moonIlluminationMax() - 1));
      list.add(new ConstraintFunction(MOON_ILLUMINATION, true,
          s -> Math.max(-bodyElevationDeg(s, s.moon, s.obs), moonPhaseAngleDeg(s) - minPhaseDeg),
          MOON_RATE_DEG_PER_S));
    }
    if (target instanceof RaDec && (c.hourAngleMinH() != null || c.hourAngleMaxH() != null)) {
      double lo = 15 * (c.hourAngleMinH() != null ? c.hourAngleMinH() : -12.0);
      double hi = 15 * (c.hourAngleMaxH() != null ? c.hourAngleMaxH() : 12.0);
      double centre = (lo + hi) / 2;
      double half = (hi - lo) / 2;
      double lonDeg = site.longitudeDeg();
      list.add(new ConstraintFunction(HOUR_ANGLE, false,
          s -> half - Math.abs(wrapDeg(hourAngleDeg(s.los, s.ix, s.iy, lonDeg) - centre)),
          HOUR_ANGLE_RATE_DEG_PER_S));
    }
  }

  private static void addEarthPoint(List<ConstraintFunction> list, Constraints c) {
    double elMin = c.elevationMinDeg() != null ? c.elevationMinDeg() : 0.0;
    list.add(new ConstraintFunction(ELEVATION, false, s -> {
      // The spacecraft's elevation seen from the point: the reversed line of sight against the point's up.
      s.tmp2[0] = -s.los[0];
      s.tmp2[1] = -s.los[1];
      s.tmp2[2] = -s.los[2];
      return elevationDeg(s.tmp2, s.up) - elMin;
    }, UNKNOWN_RATE));
    addSunElevation(list, c, true);
    if (c.offNadirMaxDeg() != null) {
      double max = c.offNadirMaxDeg();
      list.add(new ConstraintFunction(OFF_NADIR, false, s -> max - offNadirDeg(s), UNKNOWN_RATE));
    }
  }

  /**
   * Darkness (Sun at most so high) and daylight (at least so high): at the ground site, or at the Earth
   * point itself when {@code atEarthPoint} (then the margin depends on the target).
   */
  private static void addSunElevation(List<ConstraintFunction> list, Constraints c, boolean atEarthPoint) {
    ToDoubleFunction<Scratch> sunElevation = atEarthPoint
        ? s -> bodyElevationDeg(s, s.sun, s.target) : s -> bodyElevationDeg(s, s.sun, s.obs);
    if (c.sunElevationMaxDeg() != null) {
      double max = c.sunElevationMaxDeg();
      list.add(new ConstraintFunction(DARKNESS, !atEarthPoint, s -> max - sunElevation.applyAsDouble(s),
          SUN_ELEVATION_RATE_DEG_PER_S));
    }
    if (c.sunElevationMinDeg() != null) {
      double min = c.sunElevationMinDeg();
      list.add(new ConstraintFunction(DAYLIGHT, !atEarthPoint, s -> sunElevation.applyAsDouble(s) - min,
          SUN_ELEVATION_RATE_DEG_PER_S));
    }
  }

  /**
   * The target's elevation that the elevation limits, the horizon mask and the airmass use: the
   * topocentric elevation of the line of sight, geometric. The one place where the refracted (observed)
   * elevation of the format's A1 replaces it for sites that give {@code refraction}.
   */
  /** The geometric elevation of the target; the elevation limits, the mask and airmass use it refracted (A1). */
  static double targetElevationDeg(Scratch s) {
    return elevationDeg(s.los, s.up);
  }

  /**
   * Elevation of a body's centre seen from {@code from} (a GCRF position), against {@code s.up}: geometric,
   * never refracted (format A1). Uses {@code s.tmp2}.
   */
  static double bodyElevationDeg(Scratch s, double[] body, double[] from) {
    Vec.sub(body, from, s.tmp2);
    Vec.normalize(s.tmp2);
    return elevationDeg(s.tmp2, s.up);
  }

  /**
   * The Moon's geocentric phase angle (Sun-Moon-Earth, at the Moon), degrees in [0, 180]; the illuminated
   * fraction is (1 + cos i) / 2. Uses {@code s.tmp} and {@code s.tmp2}.
   */
  static double moonPhaseAngleDeg(Scratch s) {
    Vec.sub(s.sun, s.moon, s.tmp);
    s.tmp2[0] = -s.moon[0];
    s.tmp2[1] = -s.moon[1];
    s.tmp2[2] = -s.moon[2];
    return Math.toDegrees(Vec.angle(s.tmp, s.tmp2));
  }

  /**
   * Local hour angle of a direction, degrees in [-180, 180): the site's east longitude minus the
   * direction's longitude in the Earth-fixed frame. In that frame the direction's longitude is its right
   * ascension on the true equator and equinox of date minus the Greenwich apparent sidereal time (the
   * frame's z axis is the celestial pole of date and it turns by GAST from the equinox), so this is
   * LAST - RA of date. Polar motion (zero in the offline context, under 0.5 arcsec otherwise) is ignored.
   *
   * @param ix the Earth-fixed x axis in GCRF
   * @param iy the Earth-fixed y axis in GCRF
   */
  static double hourAngleDeg(double[] dir, double[] ix, double[] iy, double siteLongitudeDeg) {
    double lonOfDirection = Math.toDegrees(Math.atan2(Vec.dot(dir, iy), Vec.dot(dir, ix)));
    return wrapDeg(siteLongitudeDeg - lonOfDirection);
  }

  /** An angle wrapped to [-180, 180). */
  static double wrapDeg(double a) {
    double w = a - 360.0 * Math.floor((a + 180.0) / 360.0);
    return w >= 180.0 ? w - 360.0 : w;
  }

  /** Angle between the line of sight and the direction from the observer to the Earth's centre, degrees. */
  static double offNadirDeg(Scratch s) {
    s.tmp[0] = -s.obs[0];
    s.tmp[1] = -s.obs[1];
    s.tmp[2] = -s.obs[2];
    return Math.toDegrees(Vec.angle(s.los, s.tmp));
  }

  /** Angle between the line of sight and a body seen from the observer, degrees. */
  static double separationDeg(Scratch s, double[] body) {
    Vec.sub(body, s.obs, s.tmp);
    return Math.toDegrees(Vec.angle(s.los, s.tmp));
  }

  /** Elevation of a unit direction above the plane normal to {@code up}, degrees. */
  static double elevationDeg(double[] dir, double[] up) {
    double d = Math.max(-1.0, Math.min(1.0, Vec.dot(dir, up)));
    return Math.toDegrees(Math.asin(d));
  }

  /** Azimuth from north through east, degrees in [0, 360). */
  static double azimuthDeg(double[] dir, double[] east, double[] north) {
    double az = Math.toDegrees(Math.atan2(Vec.dot(dir, east), Vec.dot(dir, north)));
    return az < 0 ? az + 360.0 : az;
  }

  /**
   * Spec: clearance = angle(line of sight, direction to the Earth's centre) - asin(R / distance), with
   * a spherical Earth of radius 6378.137 km.
   */
  static double limbClearanceDeg(Scratch s) {
    s.tmp[0] = -s.obs[0];
    s.tmp[1] = -s.obs[1];
    s.tmp[2] = -s.obs[2];
    double r = Vec.norm(s.tmp);
    return Math.toDegrees(Vec.angle(s.los, s.tmp) - Math.asin(Math.min(1.0, EARTH_RADIUS_M / r)));
  }

  /**
   * Umbra margin seen from the target: angle between the Earth's and the Sun's centres minus (apparent
   * Earth radius - apparent Sun radius). Negative exactly inside the umbra cone of a spherical Sun past a
   * spherical Earth; the penumbra counts as sunlit (spec).
   */
  static double sunlitMarginDeg(Scratch s) {
    double[] p = s.target;
    s.tmp[0] = -p[0];
    s.tmp[1] = -p[1];
    s.tmp[2] = -p[2];
    double rEarth = Vec.norm(s.tmp);
    Vec.sub(s.sun, p, s.tmp2);
    double rSun = Vec.norm(s.tmp2);
    double sep = Vec.angle(s.tmp, s.tmp2);
    double earthAng = Math.asin(Math.min(1.0, EARTH_RADIUS_M / rEarth));
    double sunAng = Math.asin(Math.min(1.0, SUN_RADIUS_M / rSun));
    return Math.toDegrees(sep - (earthAng - sunAng));
  }
}
