package dev.sequencer.cli;

import static dev.sequencer.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Path;
import java.time.Instant;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The contact plan of a station (issue 16): {@code windows} writes each orbiting target's passes (rise,
 * culmination with its elevation, set) beside its windows, and {@code inspect} lists them, on the bundled
 * tracking night (one site, 60 invented objects) and the two-antenna station (per resource).
 *
 * <p>The checks tie two computations of the library that share no code path: the visibility engine's windows
 * (elevation limit 20°, Sun and sunlit rules) and the pass search of {@code SkyValues} (geometric elevation
 * over the horizon). A window needs the target above 20°, so it lies inside a pass above 0° whose culmination
 * reaches 20° (a fact of the trade; refraction raises the apparent elevation by well under 0.1° at 20°, which
 * the tolerance covers). Not an outside check: {@code SkyValues}' passes are checked against Orekit's
 * {@code ElevationDetector} and {@code ElevationExtremumDetector} in its own test.
 */
class PassesCliTest {
  private static final Path TRACKING = Path.of("src/main/resources/scenarios/satellite-tracking-night.json");
  private static final Path STATION = Path.of("src/main/resources/scenarios/station-two-antennas-night.json");

  @Test
  void windowsFileHoldsEachPassAroundItsWindowsAndInspectListsThem(@TempDir Path dir) throws Exception {
    Path out = dir.resolve("w.json");
    CliTest.Run r = run("windows", TRACKING.toString(), "-o", out.toString());
    assertEquals(0, r.code(), r.err());
    int passes = 0;
    int windows = 0;
    for (JsonNode e : new ObjectMapper().readTree(out.toFile()).get("windows")) {
      JsonNode ps = e.get("passes");
      assertTrue(ps != null && ps.size() > 0, "an object of a night's station has passes: " + e);
      Instant previousSet = null;
      for (JsonNode p : ps) {
        Instant rise = Instant.parse(p.get("rise").textValue());
        Instant culmination = Instant.parse(p.get("culmination").textValue());
        Instant set = Instant.parse(p.get("set").textValue());
        assertTrue(!culmination.isBefore(rise) && !set.isBefore(culmination), p.toString());
        assertTrue(previousSet == null || rise.isAfter(previousSet), "passes in time order: " + ps);
        previousSet = set;
        passes++;
      }
      for (JsonNode w : e.get("intervals")) {
        Instant start = Instant.parse(w.get(0).textValue());
        Instant end = Instant.parse(w.get(1).textValue());
        JsonNode holding = null;
        for (JsonNode p : ps) {
          if (!start.isBefore(Instant.parse(p.get("rise").textValue()))
              && !end.isAfter(Instant.parse(p.get("set").textValue()))) {
            holding = p;
          }
        }
        assertTrue(holding != null, e.get("id") + ": window " + w + " inside one of its passes " + ps);
        assertTrue(holding.get("culminationElevationDeg").doubleValue() >= 20 - 0.1,
            e.get("id") + ": a pass holding a window culminates above the 20° limit: " + holding);
        windows++;
      }
    }
    assertTrue(windows > 30, "the night has windows: " + windows);
    assertEquals(passes, r.out().lines().filter(l -> l.startsWith("  pass ")).count(), "one printed line per pass");
    CliTest.Run i = run("inspect", TRACKING.toString());
    assertEquals(0, i.code(), i.err());
    assertEquals(passes, i.out().lines().filter(l -> l.startsWith("pass        SAT")).count(), i.out());
    assertTrue(i.out().lines().anyMatch(l -> l.matches("pass        SAT\\S+ #1: rise \\S+Z, culmination \\S+Z at "
        + "\\d+\\.\\d deg, set \\S+Z")), i.out());
  }

  @Test
  void withSeveralAntennasEachEntryHasItsResourcesPasses(@TempDir Path dir) throws Exception {
    Path out = dir.resolve("w.json");
    CliTest.Run r = run("windows", STATION.toString(), "-o", out.toString());
    assertEquals(0, r.code(), r.err());
    JsonNode all = new ObjectMapper().readTree(out.toFile()).get("windows");
    int withPasses = 0;
    for (JsonNode e : all) {
      withPasses += e.has("passes") && e.get("passes").size() > 0 ? 1 : 0;
    }
    // The two dishes stand at one site: every entry (request, dish) of an object that rises has its passes.
    assertTrue(withPasses > all.size() / 2, withPasses + " of " + all.size());
    CliTest.Run i = run("inspect", STATION.toString());
    assertTrue(i.out().contains(" on dish-a #1: rise ") && i.out().contains(" on dish-b #1: rise "), i.out());
  }
}
