package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Large and odd inputs, one named case each: no crash; a valid plan (re-checked by {@code check}) or a clear message. */
class OddInputsTest {
  private static final Instant NIGHT = Instant.parse("2031-03-01T18:00:00Z");

  @Test
  void tenThousandWindowsOnlyRequestsWithTheGreedyPlanner(@TempDir Path dir) {
    Path s = Synthetic.write(Synthetic.windowsOnly(Synthetic.base(NIGHT, 72, 20), 10_000, new Random(3)),
        dir.resolve("s10k.json"));
    Runs.Run r = ReliabilityTest.planAndCheck(s, dir, "--solver", "greedy");
    assertTrue(r.out().contains("status FEASIBLE"), r::all);
  }

  @Test
  void thirtyDayHorizonAtAGroundSite(@TempDir Path dir) {
    ObjectNode sc = Synthetic.eigenaxis(Synthetic.ground(Synthetic.base(NIGHT, 30 * 24, 0), 28.3, -16.5));
    sc.putObject("constraints").put("elevationMinDeg", 30).put("sunElevationMaxDeg", -12);
    for (int i = 0; i < 5; i++) {
      Synthetic.raDec(sc, "M" + i, 72 * i + 7.5, -20 + 12 * i, 1800, 1 + i % 4);
    }
    ReliabilityTest.planAndCheck(Synthetic.write(sc, dir.resolve("month.json")), dir, "--time-limit", "3",
        "--workers", "2");
  }

  @Test
  void targetsAtBothCelestialPoles(@TempDir Path dir) {
    // From latitude 40 N the north pole stands 40 deg high all night; the south pole never rises.
    ObjectNode sc = Synthetic.eigenaxis(Synthetic.ground(Synthetic.base(NIGHT, 10, 0), 40, 10));
    sc.putObject("constraints").put("elevationMinDeg", 20);
    Synthetic.raDec(sc, "NP", 0, 90, 600, 3);
    Synthetic.raDec(sc, "NP2", 359.999, 90, 600, 2);
    Synthetic.raDec(sc, "SP", 180, -90, 600, 5);
    Runs.Run r = ReliabilityTest.planAndCheck(Synthetic.write(sc, dir.resolve("poles.json")), dir,
        "--time-limit", "3", "--workers", "1");
    assertTrue(r.out().contains("SP           not scheduled: never visible"), r::all);
    assertTrue(r.out().contains("2 scheduled, 1 not"), r::all);
  }

  @Test
  void azimuthWrapAtZeroAnd360(@TempDir Path dir) {
    // Mask points at 0 and 360 deg, start pointing at azimuth 359.99, targets north near the meridian, so
    // slews cross the 0/360 seam. The reader takes a start azimuth as the mount's unwrapped angle, which
    // must lie in azimuthRangeDeg, so the cable wrap here is [-90, 450] (359.99 is inside it).
    ObjectNode sc = Synthetic.ground(Synthetic.base(NIGHT, 10, 0), 35, 0);
    ArrayNode mask = ((ObjectNode) sc.at("/observer/ground")).putArray("horizonMask");
    mask.addArray().add(0).add(12);
    mask.addArray().add(90).add(8);
    mask.addArray().add(270).add(8);
    mask.addArray().add(360).add(12);
    sc.putObject("slew").put("model", "altaz").put("azimuthRateDegPerS", 2).put("elevationRateDegPerS", 1.5)
        .put("azimuthAccelDegPerS2", 0.5).put("elevationAccelDegPerS2", 0.5).put("settleS", 5)
        .putArray("azimuthRangeDeg").add(-90).add(450);
    sc.putObject("startPointing").put("azimuthDeg", 359.99).put("elevationDeg", 40);
    for (int i = 0; i < 3; i++) {
      Synthetic.raDec(sc, "W" + i, 120 * i + 3, 60 + 8 * i, 900, 1 + i % 3);
    }
    ReliabilityTest.planAndCheck(Synthetic.write(sc, dir.resolve("wrap.json")), dir, "--time-limit", "3",
        "--workers", "1");
  }

  @Test
  void horizonSpanningTheLeapSecondOf2016(@TempDir Path dir) {
    // A leap second was inserted at 2016-12-31T23:59:60Z (IERS Bulletin C 52). UTC instants in the file
    // cannot name that second (Java's Instant has none); a horizon across it must still plan.
    ObjectNode sc = Synthetic.eigenaxis(Synthetic.ground(
        Synthetic.base(Instant.parse("2016-12-31T21:00:00Z"), 6, 0), 32, -5));
    sc.putObject("constraints").put("elevationMinDeg", 20);
    for (int i = 0; i < 8; i++) {
      ObjectNode q = Synthetic.raDec(sc, "L" + i, 20 * i + 40, 10 + 3 * i, 1200, 1 + i);
      if (i == 0) {
        q.putArray("windows").addArray().add("2016-12-31T23:50:00Z").add("2017-01-01T00:30:00Z");
      }
    }
    ReliabilityTest.planAndCheck(Synthetic.write(sc, dir.resolve("leap.json")), dir, "--time-limit", "3",
        "--workers", "1");
  }

  @Test
  void theLeapSecondWrittenAs60IsReadAsTheSecondBefore(@TempDir Path dir) {
    // java.time reads "23:59:60Z" as 23:59:59Z (Instant has no leap seconds); the reader inherits that.
    ObjectNode sc = Synthetic.windowsOnly(Synthetic.base(Instant.parse("2016-12-31T21:00:00Z"), 6, 0), 2,
        new Random(1));
    ((ObjectNode) sc.get("horizon")).put("end", "2016-12-31T23:59:60Z");
    Runs.Run r = Runs.run("plan", Synthetic.write(sc, dir.resolve("leap60.json")).toString());
    Runs.assertNoStackTrace(r);
    assertEquals(0, r.code(), r::all);
    assertTrue(r.out().contains("became [2016-12-31T23:49:50Z, 2016-12-31T23:59:59Z]"), r::all);
  }

  @Test
  void sitesAtLatitude89point9NorthAndSouth(@TempDir Path dir) {
    for (double lat : new double[] {89.9, -89.9}) {
      ObjectNode sc = Synthetic.eigenaxis(Synthetic.ground(Synthetic.base(NIGHT, 12, 0), lat, 123.4));
      sc.putObject("constraints").put("elevationMinDeg", 15);
      for (int i = 0; i < 6; i++) {
        Synthetic.raDec(sc, "P" + i, 60 * i, Math.signum(lat) * (30 + 10 * i), 900, 1 + i);
      }
      ReliabilityTest.planAndCheck(Synthetic.write(sc, dir.resolve("pole" + lat + ".json")), dir,
          "--time-limit", "3", "--workers", "1");
    }
  }
}
