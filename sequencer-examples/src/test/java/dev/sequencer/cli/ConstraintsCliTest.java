package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The A2 constraints and a request's own constraints through inspect, windows and plan. */
class ConstraintsCliTest {
  /**
   * An invented site at 31.5 N: HIGH (dec +20) culminates at 78.5 deg, LOW (dec -40) at 18.5 deg (common
   * practice: 90 - latitude + dec), below the 30 deg that airmass 2 needs (Kasten and Young: X = 2 at
   * about 29.9 deg), so LOW is never visible and the airmass is why. HIGH2 replaces the airmass limit and
   * removes the Moon rule.
   */
  private static final String SCENARIO = """
      { "format": 1, "name": "invented A2 night",
        "horizon": { "start": "2031-03-01T20:00:00Z", "end": "2031-03-02T04:00:00Z" },
        "observer": { "ground": { "latitudeDeg": 31.5, "longitudeDeg": -20.25, "altitudeM": 900 } },
        "constraints": { "sunElevationMaxDeg": -12, "airmassMax": 2.0, "hourAngleMinH": -4, "hourAngleMaxH": 4,
                         "moonIlluminationMax": 0.9 },
        "slew": { "model": "fixed", "seconds": 30 },
        "requests": [
          { "id": "HIGH", "target": { "raDeg": 120, "decDeg": 20 }, "durationS": 600, "priority": 2 },
          { "id": "LOW", "target": { "raDeg": 120, "decDeg": -40 }, "durationS": 600, "priority": 5 },
          { "id": "HIGH2", "target": { "raDeg": 125, "decDeg": 22 }, "durationS": 600, "priority": 1,
            "constraints": { "airmassMax": 1.3, "moonIlluminationMax": null } }
        ] }
      """;

  private static Path write(Path dir, String text) throws Exception {
    Path f = dir.resolve("a2.json");
    Files.writeString(f, text);
    return f;
  }

  @Test
  void inspectShowsTheNewConstraintsAndTheRequestsOwn(@TempDir Path dir) throws Exception {
    Runs.Run r = Runs.run("inspect", write(dir, SCENARIO).toString());
    assertEquals(0, r.code(), r::all);
    assertTrue(r.out().contains("constraints Sun elevation <= -12.0 deg, airmass <= 2.00, hour angle >= -4.00 h, "
        + "hour angle <= 4.00 h, Moon illumination <= 0.90 or Moon down"), r::all);
    assertTrue(r.out().contains("own rules   HIGH2: airmass <= 1.30, moonIlluminationMax removed"), r::all);
  }

  @Test
  void inspectNotesAGroundOnlyConstraintGivenToAnOrbitObserver(@TempDir Path dir) throws Exception {
    String orbit = SCENARIO.replace("\"ground\": { \"latitudeDeg\": 31.5, \"longitudeDeg\": -20.25, \"altitudeM\": 900 }",
        "\"orbit\": { \"keplerian\": { \"epoch\": \"2031-03-01T20:00:00Z\", \"semiMajorAxisKm\": 7000, "
            + "\"eccentricity\": 0.001, \"inclinationDeg\": 98, \"raanDeg\": 0, \"argumentOfPerigeeDeg\": 0, "
            + "\"meanAnomalyDeg\": 0 } }");
    Runs.Run r = Runs.run("inspect", write(dir, orbit).toString());
    assertEquals(0, r.code(), r::all);
    assertTrue(r.out().contains("note        airmassMax applies to ground observers only; it changes nothing in this "
        + "scenario"), r::all);
  }

  @Test
  void windowsNamesTheAirmassForTheNeverVisibleRequest(@TempDir Path dir) throws Exception {
    Runs.Run r = Runs.run("windows", write(dir, SCENARIO).toString());
    assertEquals(0, r.code(), r::all);
    assertTrue(r.out().matches("(?s).*LOW\\s+0\\s+0\\.0\\s+never visible \\(airmass removes the most time\\).*"), r::all);
  }

  @Test
  void planNamesTheAirmassInTheUnscheduledReason(@TempDir Path dir) throws Exception {
    Runs.Run r = Runs.run("plan", write(dir, SCENARIO).toString(), "--solver", "greedy");
    assertEquals(0, r.code(), r::all);
    assertTrue(r.out().contains("LOW          not scheduled: never visible (airmass removes the most time)"), r::all);
  }
}
