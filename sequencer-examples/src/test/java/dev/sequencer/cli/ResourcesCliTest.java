package dev.sequencer.cli;

import static dev.sequencer.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.sequencer.io.TimelineFile;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Timeline;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

/**
 * The command line on the bundled two-site network (format addition A6): plan, CSV, check, windows, inspect and
 * replan, and the pictures of {@code --plot}.
 */
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

  @Test
  void replanAfterOneSiteIsLostKeepsTheOtherGoingOrSaysWhichRequiredFieldIsStranded(@TempDir Path dir)
      throws Exception {
    Path timeline = dir.resolve("t.json");
    assertEquals(0, run("plan", NETWORK.toString(), "--solver", "greedy", "--time-limit", "15", "-o",
        timeline.toString()).code());
    Timeline prev = TimelineFile.read(timeline);
    List<Observation> south = prev.observations().stream().filter(o -> o.resource().equals("plateau-60cm")).toList();
    Observation running = south.get(south.size() / 2);
    Instant now = running.start().plusSeconds(60);
    Path out = dir.resolve("r.json");
    CliTest.Run r = run("replan", NETWORK.toString(), "--previous", timeline.toString(), "--now", now.toString(),
        "--unavailable", "plateau-60cm", "--time-limit", "8", "--workers", "2", "-o", out.toString());
    assertEquals(0, r.code(), r.out() + r.err());
    assertTrue(r.out().contains("  resource"), "the table has a resource column: " + r.out());
    assertTrue(r.out().contains(running.id() + " was running on plateau-60cm"), r.out());
    Timeline t = TimelineFile.read(out);
    long planned = 0;
    for (Observation o : t.observations()) {
      if (Observation.PLANNED.equals(o.state())) {
        assertEquals("desert-1m", o.resource(), "nothing new on the lost site: " + o);
        assertTrue(!o.start().isBefore(now), o.id());
        planned++;
      }
    }
    assertTrue(planned > 0, "the other site keeps observing: " + r.out());
    CliTest.Run check = run("check", NETWORK.toString(), out.toString());
    assertEquals(0, check.code(), check.out() + check.err());
    // The required field F013 never rises above the second site's limit (its windows there are empty): losing
    // the first site before F013 is observed leaves no plan, and the answer says why.
    Observation f013 = prev.observations().stream().filter(o -> o.id().equals("F013")).findFirst().orElseThrow();
    assertEquals("desert-1m", f013.resource(), "precondition");
    Instant before = f013.start().minusSeconds(600);
    CliTest.Run stranded = run("replan", NETWORK.toString(), "--previous", timeline.toString(), "--now",
        before.toString(), "--unavailable", "desert-1m", "--time-limit", "4", "--workers", "2");
    assertEquals(1, stranded.code(), stranded.out() + stranded.err());
    assertTrue(stranded.out().contains("no plan (INFEASIBLE): only unavailable resources could still observe the "
        + "required request(s) F013"), stranded.out());
    Runs.Run bad = Runs.run("replan", NETWORK.toString(), "--previous", timeline.toString(), "--now", now.toString(),
        "--unavailable", "west-2m", "--time-limit", "2");
    assertEquals(2, bad.code(), bad::all);
    assertTrue(bad.err().contains("--unavailable") && bad.err().contains("\"west-2m\""), bad::all);
    Runs.assertNoStackTrace(bad);
  }

  @Test
  void plotDrawsTheLaneGroupsAndASkyChartPerResource(@TempDir Path dir) throws Exception {
    Path timeline = dir.resolve("t.json");
    String prefix = dir.resolve("net").toString();
    CliTest.Run r = run("plan", NETWORK.toString(), "--solver", "greedy", "--time-limit", "15", "-o", timeline.toString(),
        "--plot", prefix);
    assertEquals(0, r.code(), r.err());
    List<String> files = List.of("net-timeline.png", "net-timeline.svg", "net-sky-desert-1m.png", "net-sky-desert-1m.svg",
        "net-sky-plateau-60cm.png", "net-sky-plateau-60cm.svg");
    for (String f : files) {
      assertTrue(r.out().contains("wrote " + dir.resolve(f)), f + " reported: " + r.out());
      assertTrue(Files.size(dir.resolve(f)) > 1000, f);
    }
    try (var listed = Files.list(dir)) {
      assertEquals(files.size(), listed.filter(f -> f.getFileName().toString().startsWith("net-")).count(),
          "no sky chart of the whole scenario, which has no site");
    }
    JsonNode t = new ObjectMapper().readTree(timeline.toFile());
    for (String res : List.of("desert-1m", "plateau-60cm")) {
      long observed = 0;
      for (JsonNode o : t.get("observations")) {
        observed += res.equals(o.get("resource").textValue()) ? 1 : 0;
      }
      Document sky = svg(dir.resolve("net-sky-" + res + ".svg"));
      assertTrue(observed > 0, res);
      assertEquals(observed, groups(sky, "observation-start"), res + ": one marker per observation on it");
    }
    Document tl = svg(dir.resolve("net-timeline.svg"));
    assertEquals(2, groups(tl, "lane-group"), "a lane group per resource");
    assertEquals(t.get("observations").size(), groups(tl, "observation"));
  }

  @Test
  void plotPrefixIsCheckedForEveryResourceFileBeforeTheRun(@TempDir Path dir) throws Exception {
    // A folder where the second resource's sky chart would go: refused before any work, naming that file.
    Path blocker = Files.createDirectory(dir.resolve("net-sky-plateau-60cm.svg"));
    CliTest.Run r = run("plan", NETWORK.toString(), "--solver", "greedy", "--plot", dir.resolve("net").toString());
    assertEquals(2, r.code(), r.out() + r.err());
    assertTrue(r.err().contains("--plot: cannot write " + blocker + ": it is a folder"), r.err());
  }

  private static Document svg(Path file) throws Exception {
    DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
    f.setNamespaceAware(true);
    return f.newDocumentBuilder().parse(file.toFile());
  }

  /** How many {@code <g>} elements of this class. */
  private static long groups(Document d, String cls) {
    NodeList l = d.getElementsByTagNameNS("http://www.w3.org/2000/svg", "g");
    long n = 0;
    for (int i = 0; i < l.getLength(); i++) {
      n += cls.equals(((Element) l.item(i)).getAttribute("class")) ? 1 : 0;
    }
    return n;
  }
}
