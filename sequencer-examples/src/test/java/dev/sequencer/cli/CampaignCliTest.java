package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code campaign} and {@code sweep}: exit codes, messages with paths, outputs checked first, files written. */
class CampaignCliTest {
  /** Five invented fields at an invented site (31.2 S, 69.6 W). */
  private static String scenario() {
    Random r = new Random(77);
    StringBuilder b = new StringBuilder("{ \"format\": 1, \"name\": \"cli campaign fields\",\n"
        + " \"horizon\": { \"start\": \"2031-04-01T00:00:00Z\", \"end\": \"2031-04-02T00:00:00Z\" },\n"
        + " \"observer\": { \"ground\": { \"latitudeDeg\": -31.2, \"longitudeDeg\": -69.6, \"altitudeM\": 2300 } },\n"
        + " \"constraints\": { \"elevationMinDeg\": 30, \"sunElevationMaxDeg\": -15 },\n"
        + " \"slew\": { \"model\": \"fixed\", \"seconds\": 60 },\n \"requests\": [\n");
    for (int i = 0; i < 5; i++) {
      b.append(String.format(Locale.ROOT, "  { \"id\": \"C%d\", \"target\": { \"raDeg\": %.2f, \"decDeg\": %.2f }, "
          + "\"durationS\": 600, \"priority\": %d }%s%n", i + 1, 150 + r.nextDouble() * 60, -60 + r.nextDouble() * 40,
          1 + r.nextInt(9), i < 4 ? "," : ""));
    }
    return b.append(" ]\n}\n").toString();
  }

  private static final String CAMPAIGN = """
      { "format": 1, "name": "cli season", "scenario": "scenario.json", "firstNight": "2031-04-01", "nights": 3,
        "programme": [ { "id": "C1", "seasonVisits": 2 } ],
        "weather": { "seed": 5, "clearNightProbability": 0.3, "failureFraction": 0.1 } }""";

  private static Path files(Path dir) throws IOException {
    Files.writeString(dir.resolve("scenario.json"), scenario());
    Files.writeString(dir.resolve("campaign.json"), CAMPAIGN);
    return dir.resolve("campaign.json");
  }

  @Test
  void aSeasonWritesReproducibleCsvAndAPicture(@TempDir Path dir) throws IOException {
    Path c = files(dir);
    Runs.Run r = Runs.run("campaign", c.toString(), "--strategy", "greedy,best-now", "--time-limit", "0.2",
        "--nights-csv", dir.resolve("n1.csv").toString(), "--totals-csv", dir.resolve("t.csv").toString(),
        "--chart", dir.resolve("c.png").toString());
    assertEquals(0, r.code(), r::all);
    List<String> nights = Files.readAllLines(dir.resolve("n1.csv"));
    assertEquals(1 + 2 * 3, nights.size(), "header + 3 nights x 2 strategies");
    assertEquals(3, Files.readAllLines(dir.resolve("t.csv")).size());
    byte[] png = Files.readAllBytes(dir.resolve("c.png"));
    assertTrue(png.length > 1000 && png[1] == 'P' && png[2] == 'N' && png[3] == 'G');
    Runs.Run again = Runs.run("campaign", c.toString(), "--strategy", "greedy,best-now", "--time-limit", "0.2",
        "--nights-csv", dir.resolve("n2.csv").toString());
    assertEquals(0, again.code(), again::all);
    assertEquals(nights, Files.readAllLines(dir.resolve("n2.csv")), "same file, same CSV");
  }

  @Test
  void badCampaignInputIsExit2WithItsPath(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("scenario.json"), scenario());
    Files.writeString(dir.resolve("bad.json"), CAMPAIGN.replace("\"nights\": 3", "\"nigths\": 3"));
    Runs.Run r = Runs.run("campaign", dir.resolve("bad.json").toString(), "--nights-csv",
        dir.resolve("n.csv").toString());
    assertEquals(2, r.code(), r::all);
    assertTrue(r.err().contains("nigths: unknown field (did you mean nights?)"), r::all);
    assertTrue(r.err().contains("nights: is required"), r::all);
    assertFalse(Files.exists(dir.resolve("n.csv")));
    Runs.assertNoStackTrace(r);
    Runs.Run s = Runs.run("campaign", files(dir).toString(), "--strategy", "cpsat,gredy");
    assertEquals(2, s.code(), s::all);
    assertTrue(s.err().contains("--strategy: must be one of cpsat, greedy, best-now (was gredy)"), s::all);
  }

  @Test
  void outputTargetsAreCheckedBeforeAnyWork(@TempDir Path dir) throws IOException {
    Runs.Run r = Runs.run("campaign", files(dir).toString(), "--chart", dir.resolve("no/such/c.png").toString());
    assertEquals(2, r.code(), r::all);
    assertTrue(r.err().contains("--chart: cannot write"), r::all);
    Runs.Run bad = Runs.run("campaign", files(dir).toString(), "--chart", dir.resolve("c.gif").toString());
    assertEquals(2, bad.code(), bad::all);
    assertTrue(bad.err().contains("--chart: must end in .png or .svg"), bad::all);
  }

  @Test
  void aSweepWritesRowsSummaryAndBoxPlots(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("scenario.json"), scenario().replace("2031-04-02T00:00:00Z",
        "2031-04-01T04:00:00Z"));
    Files.writeString(dir.resolve("sweep.json"), """
        { "format": 1, "scenario": "scenario.json",
          "axes": { "solver": ["greedy", "best-now"], "workers": [1],
                    "slew": [ { "model": "fixed", "seconds": 30 }, { "model": "fixed", "seconds": 1800 } ] } }""");
    Path out = dir.resolve("out");
    Runs.Run r = Runs.run("sweep", dir.resolve("sweep.json").toString(), "-o", out.toString(), "--svg");
    assertEquals(0, r.code(), r::all);
    assertEquals(5, Files.readAllLines(out.resolve("runs.csv")).size());
    assertEquals(1 + 2 + 1 + 2, Files.readAllLines(out.resolve("summary.csv")).size());
    for (String axis : List.of("solver", "workers", "slew")) {
      assertTrue(Files.readString(out.resolve("box-" + axis + ".svg")).contains("<svg"), axis);
    }
    Runs.Run bad = Runs.run("sweep", dir.resolve("sweep.json").toString(), "-o", out.toString(), "--threads", "0");
    assertEquals(2, bad.code(), bad::all);
  }
}
