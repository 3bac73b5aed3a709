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

  /**
   * The network with visits and groups (A4–A6), written as a user would: eight fields wanted twice at least an
   * hour apart, and a calibration chain that must stay on one telescope. The plan passes the validator, its
   * visits are numbered in time order across the two sites, the chain is on one site, and a re-plan after
   * losing a site keeps every rule; these scenarios were refused (exit 2) before.
   */
  @Test
  void visitsAndAOneSiteChainPlanAndReplanOnTheNetwork(@TempDir Path dir) throws Exception {
    ObjectMapper json = new ObjectMapper();
    com.fasterxml.jackson.databind.node.ObjectNode root = (com.fasterxml.jackson.databind.node.ObjectNode)
        json.readTree(NETWORK.toFile());
    com.fasterxml.jackson.databind.node.ArrayNode requests = (com.fasterxml.jackson.databind.node.ArrayNode)
        root.get("requests");
    List<String> chain = new java.util.ArrayList<>();
    for (int i = 0; i < requests.size(); i++) {
      com.fasterxml.jackson.databind.node.ObjectNode q = (com.fasterxml.jackson.databind.node.ObjectNode) requests.get(i);
      if (i < 8) {
        q.putObject("visits").put("count", 2).put("minSeparationS", 3600);
      } else if (chain.size() < 3 && !q.path("required").asBoolean(false)) {
        chain.add(q.get("id").textValue());
      }
    }
    com.fasterxml.jackson.databind.node.ObjectNode g = root.putArray("groups").addObject();
    g.put("id", "CAL").put("ordered", true).put("sameResource", true);
    chain.forEach(g.putArray("members")::add);
    Path scenario = dir.resolve("network-visits.json");
    json.writeValue(scenario.toFile(), root);
    Path timeline = dir.resolve("t.json");
    CliTest.Run r = run("plan", scenario.toString(), "--time-limit", "10", "--workers", "2", "-o",
        timeline.toString());
    assertEquals(0, r.code(), r.out() + r.err());
    Timeline t = TimelineFile.read(timeline);
    java.util.Map<String, List<Observation>> byId = new java.util.HashMap<>();
    t.observations().forEach(o -> byId.computeIfAbsent(o.id(), x -> new java.util.ArrayList<>()).add(o));
    long twice = byId.values().stream().filter(v -> v.size() == 2).count();
    assertTrue(twice >= 1, "some field gets both visits: " + r.out());
    for (List<Observation> v : byId.values()) {
      if (v.size() == 2) {
        assertEquals(Integer.valueOf(1), v.get(0).visit(), v.toString());
        assertEquals(Integer.valueOf(2), v.get(1).visit(), v.toString());
        assertTrue(java.time.Duration.between(v.get(0).start(), v.get(1).start()).getSeconds() >= 3600, v.toString());
      }
    }
    assertTrue(chain.stream().flatMap(id -> byId.getOrDefault(id, List.of()).stream()).map(Observation::resource)
        .distinct().count() <= 1, "the chain stays on one site: " + r.out());
    assertEquals(0, run("check", scenario.toString(), timeline.toString()).code());
    // The southern site is lost in the middle of its night (the required F013 is the northern site's alone).
    List<Observation> south = t.observations().stream().filter(o -> o.resource().equals("plateau-60cm")).toList();
    Observation mid = south.get(south.size() / 2);
    Path out = dir.resolve("r.json");
    CliTest.Run re = run("replan", scenario.toString(), "--previous", timeline.toString(), "--now",
        mid.start().plusSeconds(30).toString(), "--unavailable", "plateau-60cm", "--time-limit", "6", "--workers",
        "2", "-o", out.toString());
    assertEquals(0, re.code(), re.out() + re.err());
    CliTest.Run check = run("check", scenario.toString(), out.toString());
    assertEquals(0, check.code(), check.out() + check.err());
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
