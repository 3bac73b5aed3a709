package dev.sequencer.cli;

import static dev.sequencer.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The command line on the bundled two-site network (format addition A6): plan, CSV, check, windows and inspect. */
class ResourcesCliTest {
  private static final Path NETWORK = Path.of("src/main/resources/scenarios/network-two-sites-night.json");

  @Test
  void planWritesTheResourceOfEveryObservationAndCheckAcceptsIt(@TempDir Path dir) throws Exception {
    Path timeline = dir.resolve("t.json");
    Path csv = dir.resolve("t.csv");
    CliTest.Run r = run("plan", NETWORK.toString(), "--solver", "greedy", "--time-limit", "15", "-o", timeline.toString(),
        "--csv", csv.toString());
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("  resource"), "the table has a resource column: " + r.out());
    JsonNode t = new ObjectMapper().readTree(timeline.toFile());
    for (JsonNode o : t.get("observations")) {
      String res = o.get("resource").textValue();
      assertTrue(res.equals("desert-1m") || res.equals("plateau-60cm"), o.toString());
    }
    List<String> lines = Files.readAllLines(csv);
    assertTrue(lines.get(0).endsWith(",resource"), lines.get(0));
    long withResource = lines.stream().skip(1).filter(l -> l.contains(",yes,"))
        .filter(l -> l.endsWith(",desert-1m") || l.endsWith(",plateau-60cm")).count();
    assertEquals(t.get("observations").size(), withResource, "every scheduled line names its resource");
    CliTest.Run check = run("check", NETWORK.toString(), timeline.toString());
    assertEquals(0, check.code(), check.out() + check.err());
  }

  @Test
  void windowsAndInspectSpeakPerResource(@TempDir Path dir) throws Exception {
    Path out = dir.resolve("w.json");
    CliTest.Run r = run("windows", NETWORK.toString(), "-o", out.toString());
    assertEquals(0, r.code(), r.err());
    JsonNode w = new ObjectMapper().readTree(out.toFile()).get("windows");
    long north = 0;
    long south = 0;
    for (JsonNode e : w) {
      north += "desert-1m".equals(e.get("resource").textValue()) ? 1 : 0;
      south += "plateau-60cm".equals(e.get("resource").textValue()) ? 1 : 0;
    }
    // 100 requests; 2 restricted to the first site, 1 to the second: 99 and 98 entries.
    assertEquals(99, north);
    assertEquals(98, south);
    CliTest.Run i = run("inspect", NETWORK.toString());
    assertEquals(0, i.code(), i.err());
    assertTrue(i.out().contains("resource    desert-1m: observer ground site lat 24.6200"), i.out());
    assertTrue(i.out().contains("observable  on plateau-60cm: "), i.out());
  }
}
