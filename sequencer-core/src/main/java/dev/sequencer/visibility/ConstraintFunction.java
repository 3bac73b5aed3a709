package dev.sequencer.visibility;

import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.Target;
import java.util.ArrayList;
import java.util.List;
import java.util.function.ToDoubleFunction;

/**
 * One constraint as a margin function of the loaded {@link Scratch}: degrees, non-negative exactly when
 * the constraint holds.
 *
 * @param name the constraint's name as shown to users ("Sun separation", ...)
 * @param targetIndependent true when the margin does not depend on the target (darkness at a site)
 * @param margin the margin in degrees
 */
record ConstraintFunction(String name, boolean targetIndependent, ToDoubleFunction<Scratch> margin) {
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

  /** The constraints that apply to a target kind under a scenario's observer and constraints. */
  static List<ConstraintFunction> forTarget(Constraints c, GroundSite site, Target target) {
    List<ConstraintFunction> list = new ArrayList<>();
    if (c.sunSeparationMinDeg() != null) {
      double min = c.sunSeparationMinDeg();
      list.add(new ConstraintFunction(SUN, false, s -> separationDeg(s, s.sun) - min));
    }
    if (c.moonSeparationMinDeg() != null) {
      double min = c.moonSeparationMinDeg();
      list.add(new ConstraintFunction(MOON, false, s -> separationDeg(s, s.moon) - min));
    }
    if (site != null) {
      addGround(list, c, site);
    } else if (target instanceof EarthPoint) {
      addEarthPoint(list, c);
    } else if (c.earthLimbMinDeg() != null) {
      double min = c.earthLimbMinDeg();
      list.add(new ConstraintFunction(LIMB, false, s -> limbClearanceDeg(s) - min));
    }
    if (target instanceof OrbitingTarget && c.sunlitRequired()) {
      list.add(new ConstraintFunction(SUNLIT, false, ConstraintFunction::sunlitMarginDeg));
    }
    return list;
  }

  private static void addGround(List<ConstraintFunction> list, Constraints c, GroundSite site) {
    Double elMin = c.elevationMinDeg();
    boolean noMask = site.horizonMask().isEmpty();
    list.add(new ConstraintFunction(ELEVATION, false, s -> {
      double el = site.observedElevationDeg(elevationDeg(s.los, s.up)); // refracted when the site says so (A1)
      double floor;
      if (noMask) {
        floor = elMin != null ? elMin : 0.0;
      } else {
        double mask = site.maskElevationDeg(azimuthDeg(s.los, s.east, s.north));
        floor = elMin != null ? Math.max(elMin, mask) : mask;
      }
      return el - floor;
    }));
    if (c.elevationMaxDeg() != null) {
      double max = c.elevationMaxDeg();
      list.add(new ConstraintFunction(ELEVATION_MAX, false, s -> max - site.observedElevationDeg(elevationDeg(s.los, s.up))));
    }
    if (c.sunElevationMaxDeg() != null) {
      double max = c.sunElevationMaxDeg();
      list.add(new ConstraintFunction(DARKNESS, true, s -> {
        Vec.sub(s.sun, s.obs, s.tmp2);
        Vec.normalize(s.tmp2);
        return max - elevationDeg(s.tmp2, s.up);
      }));
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
    }));
    if (c.sunElevationMaxDeg() != null) {
      double max = c.sunElevationMaxDeg();
      list.add(new ConstraintFunction(DARKNESS, false, s -> {
        Vec.sub(s.sun, s.target, s.tmp2);
        Vec.normalize(s.tmp2);
        return max - elevationDeg(s.tmp2, s.up);
      }));
    }
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
