package dev.sequencer.model;

import java.time.LocalDate;
import java.util.List;
import java.util.Objects;

/**
 * A season to simulate (the campaign file, docs/campaigns.md): the scenario whose observer, constraints,
 * slew model and requests are planned each night ({@code scenarioFile}, relative to the campaign file; its
 * horizon is replaced by each night's), the first night (the local evening's date), the number of nights,
 * the darkness limit ({@code null}: the scenario's {@code sunElevationMaxDeg}), what each request still
 * needs ({@code programme}; a request not listed needs one visit), the seeded weather, and the priority
 * ageing per night waited (0: none).
 */
public record Campaign(int format, String name, String scenarioFile, LocalDate firstNight, int nights,
    Double darknessSunElevationMaxDeg, List<Need> programme, Weather weather, double priorityAgeingPerNight) {
  /** The only campaign format version this library reads. */
  public static final int FORMAT = 1;

  public Campaign {
    Objects.requireNonNull(scenarioFile, "scenarioFile");
    Objects.requireNonNull(firstNight, "firstNight");
    Objects.requireNonNull(weather, "weather");
    programme = List.copyOf(programme);
    Checks.finiteOrNull("darknessSunElevationMaxDeg", darknessSunElevationMaxDeg);
    Checks.finite("priorityAgeingPerNight", priorityAgeingPerNight);
  }

  /** A copy with other weather (a sweep's weather seed). */
  public Campaign withWeather(Weather w) {
    return new Campaign(format, name, scenarioFile, firstNight, nights, darknessSunElevationMaxDeg, programme, w,
        priorityAgeingPerNight);
  }

  /**
   * What one request still needs: {@code visits} successful observations on different nights, or (when
   * {@code exposureS} is given) that many seconds of successful exposure in total.
   */
  public record Need(String id, int visits, Double exposureS) {
    public Need {
      Objects.requireNonNull(id, "id");
      Checks.finiteOrNull("exposureS", exposureS);
    }
  }

  /**
   * Seeded weather: each night is clear with {@code clearNightProbability}; otherwise it has 1 to
   * {@code cloudBlocksMax} cloud blocks, each of a length uniform in [{@code cloudBlockMinS},
   * {@code cloudBlockMaxS}] placed uniformly in the night. Independently, each observation attempt fails
   * with probability {@code failureFraction} (guiding, instrument).
   */
  public record Weather(long seed, double clearNightProbability, int cloudBlocksMax, double cloudBlockMinS,
      double cloudBlockMaxS, double failureFraction) {
    public Weather {
      Checks.finite("clearNightProbability", clearNightProbability);
      Checks.finite("cloudBlockMinS", cloudBlockMinS);
      Checks.finite("cloudBlockMaxS", cloudBlockMaxS);
      Checks.finite("failureFraction", failureFraction);
    }

    /** A copy with another seed. */
    public Weather withSeed(long s) {
      return new Weather(s, clearNightProbability, cloudBlocksMax, cloudBlockMinS, cloudBlockMaxS, failureFraction);
    }
  }
}
