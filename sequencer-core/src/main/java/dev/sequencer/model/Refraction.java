package dev.sequencer.model;

/**
 * Atmospheric refraction at a ground site (format A1, {@code observer.ground.refraction}): the
 * observed (refracted) elevation of a target from its geometric elevation, for dry air at 0.55 µm.
 *
 * <p><b>Formula.</b> For geometric elevations of 10° and more, Green's two-term model (R. M. Green,
 * Spherical Astronomy, 1985, sec. 4.31; from memory): R = A tan z + B tan³ z, with z the observed zenith
 * distance, A = γ (1 − β), B = −γ (β − γ / 2). γ = n − 1 at the site, from the dry-air refractivity of
 * Barrell and Sears (1939) at 0.55 µm, (287.604 + 1.6288/λ² + 0.0136/λ⁴) × 10⁻⁶ at 0 °C and 1013.25 hPa,
 * scaled by P/T as an ideal gas; β = 4.4474 × 10⁻⁶ T, the ratio of the atmosphere's height to the Earth's
 * radius with Stone's (1996, PASP 108, 1051) empirical adjustment. This is the model SOFA/ERFA's
 * {@code refco} implements (there with humidity and other wavelengths); with dry air at 0.55 µm the two
 * agree within 0.1" above 10°. The observed zenith distance comes from the geometric one by three
 * fixed-point steps z = z_geometric − R(z) (R changes by under 1' per degree there, so each step gains
 * two digits).
 *
 * <p>Below 10°, where tan z diverges, Bennett's formula for the refraction at apparent (observed) altitude
 * h0 (G. G. Bennett, Journal of Navigation 35, 255, 1982; Meeus, Astronomical Algorithms, 2nd ed., eq.
 * 16.3, with the factor (P / 1010 hPa) (283 K / T) given there for other conditions; from memory):
 * R = 1' / tan(h0 + 7.31 / (h0 + 4.4)) × (P / 1010) (283 / T), within 0.07' of the standard refraction
 * tables. h0 is found from the geometric elevation h by fixed-point steps h0 = h + R(h0) (each gains at
 * least half a digit). At 10° it differs from Green's model by up to about 10"; that difference is added
 * back with a weight falling linearly from 1 at 10° to 0 at 5°, so the two meet continuously and the
 * formula is Bennett's own below 5°. Below an apparent altitude of −1° (where the formula turns back) R
 * is held at its −1° value, so the observed elevation stays continuous and increasing. 34.5' at the
 * horizon for 1010 hPa and 10 °C, the usual figure.
 *
 * @param pressureHPa air pressure at the site, hPa, in [0, 1200] (0: no atmosphere, no refraction)
 * @param temperatureC air temperature at the site, °C, in [-90, 60]
 */
public record Refraction(double pressureHPa, double temperatureC) {
  /** Geometric elevation where the formula switches from Green's model to Bennett's formula. */
  public static final double SWITCH_ELEVATION_DEG = 10.0;
  /** Apparent altitude below which the refraction is held constant. */
  static final double FLOOR_ELEVATION_DEG = -1.0;
  /** Fixed-point steps for the apparent altitude below 10° (contraction at most 0.35: 1e-14 deg). */
  private static final int LOW_STEPS = 32;
  private static final double WAVELENGTH_UM = 0.55;
  private static final double ARCMIN = 1.0 / 60.0;

  public Refraction {
    Checks.finite("pressureHPa", pressureHPa);
    Checks.finite("temperatureC", temperatureC);
    if (pressureHPa < 0 || pressureHPa > 1200) {
      throw new IllegalArgumentException("pressureHPa: must be in [0, 1200] (was " + pressureHPa + ")");
    }
    if (temperatureC < -90 || temperatureC > 60) {
      throw new IllegalArgumentException("temperatureC: must be in [-90, 60] (was " + temperatureC + ")");
    }
  }

  /** Green's A and B, radians. */
  private double[] constants() {
    double t = temperatureC + 273.15;
    double l2 = WAVELENGTH_UM * WAVELENGTH_UM;
    double standard = (287.604 + 1.6288 / l2 + 0.0136 / (l2 * l2)) * 1e-6; // n - 1 at 273.15 K, 1013.25 hPa
    double gamma = standard * (pressureHPa / 1013.25) * (273.15 / t);
    double beta = 4.4474e-6 * t;
    return new double[] {gamma * (1 - beta), -gamma * (beta - gamma / 2)};
  }

  /** Green's model at observed zenith distance z (radians), degrees. */
  private static double green(double[] ab, double zRad) {
    double tz = Math.tan(zRad);
    return Math.toDegrees(ab[0] * tz + ab[1] * tz * tz * tz);
  }

  /** Green's model for a geometric elevation (>= 10°), observed zenith distance found by iteration, degrees. */
  private static double greenForGeometric(double[] ab, double geometricDeg) {
    double zGeometric = Math.toRadians(90 - geometricDeg);
    double z = zGeometric;
    for (int i = 0; i < 3; i++) {
      z = zGeometric - Math.toRadians(green(ab, z));
    }
    return green(ab, z);
  }

  /** Geometric elevation below which the low formula is Bennett's own (no blend with Green's). */
  static final double BLEND_END_DEG = 5.0;

  /** Bennett's refraction at apparent altitude h0 (degrees) for this pressure and temperature, degrees. */
  private double bennettDeg(double h0) {
    double factor = (pressureHPa / 1010.0) * (283.0 / (273.0 + temperatureC));
    double h = Math.max(FLOOR_ELEVATION_DEG, h0);
    return factor * ARCMIN / Math.tan(Math.toRadians(h + 7.31 / (h + 4.4)));
  }

  /** Bennett's refraction for a geometric elevation: the apparent altitude found by fixed-point steps. */
  private double bennettForGeometric(double geometricDeg) {
    double h0 = geometricDeg;
    for (int i = 0; i < LOW_STEPS; i++) {
      h0 = geometricDeg + bennettDeg(h0);
    }
    return bennettDeg(h0);
  }

  /** The refraction (observed minus geometric elevation), degrees; >= 0, 0 for zero pressure. */
  public double refractionDeg(double geometricElevationDeg) {
    if (pressureHPa == 0 || geometricElevationDeg >= 90) {
      return 0;
    }
    double[] ab = constants();
    if (geometricElevationDeg >= SWITCH_ELEVATION_DEG) {
      return greenForGeometric(ab, geometricElevationDeg);
    }
    double low = bennettForGeometric(geometricElevationDeg);
    if (geometricElevationDeg <= BLEND_END_DEG) {
      return low;
    }
    double gap = greenForGeometric(ab, SWITCH_ELEVATION_DEG) - bennettForGeometric(SWITCH_ELEVATION_DEG);
    double weight = (geometricElevationDeg - BLEND_END_DEG) / (SWITCH_ELEVATION_DEG - BLEND_END_DEG);
    return low + weight * gap;
  }

  /** The observed (refracted) elevation of a target at a geometric elevation, degrees. */
  public double observedElevationDeg(double geometricElevationDeg) {
    return geometricElevationDeg + refractionDeg(geometricElevationDeg);
  }
}
