package dev.sequencer.campaign;

import java.util.Locale;
import java.util.Random;

/**
 * Generated campaign inputs: an invented ground site ("Cerro Inventado", 29.3 S, 70.7 W, 2200 m) or an
 * invented orbiting observer, and n invented fixed RA/Dec fields (random RA, Dec in [-70, 10] deg,
 * durations 300-900 s in whole minutes, priorities 1-10), as scenario JSON text; and campaign JSON.
 */
public final class CampaignFixtures {
  private CampaignFixtures() {}

  /** A ground-site scenario with n fields and this slew object (JSON); horizon is a placeholder night. */
  public static String groundScenario(int n, long seed, String slewJson) {
    return scenario(n, seed, slewJson, """
        "observer": { "ground": { "latitudeDeg": -29.3, "longitudeDeg": -70.7, "altitudeM": 2200 } },
        "constraints": { "elevationMinDeg": 30, "sunElevationMaxDeg": -12, "moonSeparationMinDeg": 10 },""", "");
  }

  /** An orbit (Keplerian, 700 km sun-synchronous-like) scenario with n fields; nights are UTC days. */
  public static String orbitScenario(int n, long seed) {
    return scenario(n, seed, "{ \"model\": \"eigenaxis\", \"rateDegPerS\": 1.0, \"accelDegPerS2\": 0.05, \"settleS\": 20 }",
        """
        "observer": { "orbit": { "keplerian": { "epoch": "2031-03-01T00:00:00Z", "semiMajorAxisKm": 7078,
          "eccentricity": 0.001, "inclinationDeg": 98.2, "raanDeg": 40, "argumentOfPerigeeDeg": 0,
          "meanAnomalyDeg": 0 } } },
        "constraints": { "sunSeparationMinDeg": 45, "earthLimbMinDeg": 15 },""", "");
  }

  private static String scenario(int n, long seed, String slewJson, String observerAndConstraints, String extra) {
    Random r = new Random(seed);
    StringBuilder b = new StringBuilder();
    b.append("{ \"format\": 1, \"name\": \"generated campaign fields\",\n");
    b.append("  \"horizon\": { \"start\": \"2031-03-01T00:00:00Z\", \"end\": \"2031-03-02T00:00:00Z\" },\n");
    b.append(observerAndConstraints).append('\n');
    b.append("  \"slew\": ").append(slewJson).append(",\n");
    b.append("  \"requests\": [\n");
    for (int i = 0; i < n; i++) {
      b.append(String.format(Locale.ROOT, "    { \"id\": \"F%03d\", \"target\": { \"raDeg\": %.3f, \"decDeg\": %.3f },"
          + " \"durationS\": %d, \"priority\": %d }%s%n", i + 1, r.nextDouble() * 360, -70 + r.nextDouble() * 80,
          60 * (5 + r.nextInt(11)), 1 + r.nextInt(10), i + 1 < n ? "," : ""));
    }
    b.append("  ]").append(extra).append("\n}\n");
    return b.toString();
  }

  /** Altaz slew of a small telescope. */
  public static final String ALTAZ = "{ \"model\": \"altaz\", \"azimuthRateDegPerS\": 3, \"elevationRateDegPerS\": 2, "
      + "\"azimuthAccelDegPerS2\": 1, \"elevationAccelDegPerS2\": 1, \"settleS\": 10 }";

  /** Eigenaxis slew between fixed RA/Dec fields (time-independent transitions). */
  public static final String EIGENAXIS = "{ \"model\": \"eigenaxis\", \"rateDegPerS\": 1.0, \"accelDegPerS2\": 0.2, "
      + "\"settleS\": 15 }";

  /** A campaign over scenario.json: {@code nights} from 2031-03-01, cloudy weather, some failures. */
  public static String campaign(int nights, long weatherSeed, String programme, double ageing) {
    return String.format(Locale.ROOT, """
        { "format": 1, "name": "generated season", "scenario": "scenario.json", "firstNight": "2031-03-01",
          "nights": %d,
          "programme": [%s],
          "weather": { "seed": %d, "clearNightProbability": 0.5, "cloudBlocksMax": 3, "cloudBlockMinS": 1200,
                       "cloudBlockMaxS": 5400, "failureFraction": 0.05 },
          "priorityAgeingPerNight": %s }
        """, nights, programme, weatherSeed, Double.toString(ageing));
  }
}
