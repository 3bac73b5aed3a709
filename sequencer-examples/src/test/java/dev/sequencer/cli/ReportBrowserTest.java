package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.io.TimelineFile;
import dev.sequencer.model.Timeline;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The night report opened in a real browser: headless Chromium (Debian's {@code chromium}; {@code .ci/run}
 * installs it when missing) loads each report from a file, runs its script, and hands back the DOM as it
 * stands after the script ({@code --dump-dom}) and a screenshot ({@code --screenshot}, written under
 * {@code target/report-screens/} for people to look at). Chromium prints every console message of the
 * page on standard error ({@code --enable-logging=stderr}); the report logs nothing, so any such line
 * (a script error, a refused resource) fails the test.
 *
 * <p>Why Chromium's own command line and not a WebDriver client: it needs no further dependency (a
 * WebDriver client brings dozens of jars into the dependency-convergence check) and no driver process,
 * and the two things asked of the browser (the DOM after scripts, a picture) are its own flags. Skipped,
 * with a message saying so, only when no Chromium can be found.
 */
class ReportBrowserTest {
  private static final Path SCREENS = Path.of("target", "report-screens");
  private static String browser;

  @BeforeAll
  static void findBrowser() {
    String env = System.getenv("SEQUENCER_CHROMIUM");
    for (String c : env != null ? List.of(env) : List.of("chromium", "chromium-browser", "google-chrome")) {
      for (String dir : System.getenv().getOrDefault("PATH", "").split(java.io.File.pathSeparator)) {
        if (!c.contains("/") && Files.isExecutable(Path.of(dir, c))) {
          browser = Path.of(dir, c).toString();
          return;
        }
      }
      if (c.contains("/") && Files.isExecutable(Path.of(c))) {
        browser = c;
        return;
      }
    }
  }

  private static void needBrowser() {
    Assumptions.assumeTrue(browser != null, "no Chromium on PATH (nor SEQUENCER_CHROMIUM): install Debian's chromium "
        + "(apt-get install -y chromium chromium-driver; .ci/run does this) to run the browser tests");
  }

  /** What Chromium gave back: the DOM after the page's script and the console lines. */
  record Page(String dom, List<String> console) {}

  private static Page open(Path html, String fragment, String screenshotName) throws Exception {
    String url = html.toAbsolutePath().toUri() + (fragment == null ? "" : fragment);
    List<String> cmd = new ArrayList<>(List.of(browser, "--headless", "--no-sandbox", "--disable-gpu",
        "--disable-extensions", "--no-first-run", "--hide-scrollbars", "--enable-logging=stderr", "--v=0",
        "--user-data-dir=" + Files.createTempDirectory("chromium-profile")));
    if (screenshotName != null) {
      Files.createDirectories(SCREENS);
      cmd.add("--window-size=1440,2400");
      cmd.add("--screenshot=" + SCREENS.resolve(screenshotName).toAbsolutePath());
    } else {
      cmd.add("--dump-dom");
    }
    cmd.add(url);
    Path err = Files.createTempFile("chromium", ".err");
    Process p = new ProcessBuilder(cmd).redirectError(err.toFile()).start();
    String dom;
    try (InputStream in = p.getInputStream()) {
      dom = new String(in.readAllBytes(), java.nio.charset.StandardCharsets.UTF_8);
    }
    assertTrue(p.waitFor(120, TimeUnit.SECONDS), "chromium did not finish");
    List<String> console = Files.readAllLines(err).stream().filter(l -> l.contains(":CONSOLE")).toList();
    return new Page(dom, console);
  }

  private static int count(String text, String regex) {
    Matcher m = Pattern.compile(regex).matcher(text);
    int n = 0;
    while (m.find()) {
      n++;
    }
    return n;
  }

  /** The body of the table with this id. */
  private static String tbody(String dom, String id) {
    int at = dom.indexOf("id=\"" + id + "\"");
    assertTrue(at >= 0, "no table " + id);
    int from = dom.indexOf("<tbody>", at);
    return dom.substring(from, dom.indexOf("</tbody>", from));
  }

  private static Timeline planWithReport(Path scenario, Path dir, String name) throws IOException {
    Path tl = dir.resolve(name + ".json");
    Path html = dir.resolve(name + ".html");
    Runs.Run r = Runs.run("plan", scenario.toString(), "--solver", "greedy", "-o", tl.toString(), "--report",
        html.toString());
    assertEquals(0, r.code(), r::all);
    assertTrue(r.out().contains("wrote " + html), r::all);
    return TimelineFile.read(tl);
  }

  private static Path bundled(String name, Path dir) throws IOException {
    Path f = dir.resolve(name);
    Files.copy(Path.of("src/main/resources/scenarios", name), f);
    return f;
  }

  private static void assertSelfContained(String html) {
    // Nothing fetched: no external script, style, font or image; the only URLs are the SVG namespaces.
    String stripped = html.replace("http://www.w3.org/2000/svg", "").replace("http://www.w3.org/1999/xlink", "");
    assertFalse(stripped.contains("http://") || stripped.contains("https://"), "a network address in the report");
    assertFalse(Pattern.compile("<(script|img|link|iframe)[^>]*\\s(src|href)=").matcher(html).find(), "an external resource");
    assertFalse(html.contains("@import") || html.contains("@font-face") || html.contains("url(http"));
  }

  /**
   * Opens the report and checks what every report shows: self-contained, no console message, the script ran to
   * its end, a row per observation and per unscheduled request of {@code t}, {@code charts} charts, the caution.
   */
  private static Page openAndCheck(Path html, Timeline t, int charts) throws Exception {
    assertSelfContained(Files.readString(html));
    Page page = open(html, null, null);
    assertEquals(List.of(), page.console(), "console messages");
    assertTrue(page.dom().contains("data-ready=\"yes\""), "the report's script did not run to its end");
    assertEquals(t.observations().size(), count(tbody(page.dom(), "observations-table"), "<tr>"), "observation rows");
    assertEquals(t.unscheduled().size(), count(tbody(page.dom(), "unscheduled-table"), "<tr>"), "unscheduled rows");
    assertEquals(charts, count(page.dom(), "<svg[^>]*class=\"chart"), "charts");
    assertTrue(page.dom().contains("Plans are advisory"), "the caution");
    return page;
  }

  @Test
  void demoNightReportShowsEveryRowAndChartWithoutConsoleErrors(@TempDir Path dir) throws Exception {
    needBrowser();
    Timeline t = planWithReport(bundled("demo-night.json", dir), dir, "demo");
    Path html = dir.resolve("demo.html");
    // lanes, timeline, night, sky: four charts at a ground site
    Page page = openAndCheck(html, t, 4);
    assertFalse(page.dom().contains("id=\"passes\""), "no pass table without orbiting targets");
    // Sorted on load by the 6th column (priority), descending, as a click on its header does.
    Page sorted = open(html, "#sort=-6", null);
    assertEquals(List.of(), sorted.console());
    Matcher m = Pattern.compile("<tr><td data-v=\"\\d+\">\\d+</td>(?:<td[^>]*>.*?</td>){4}<td data-v=\"([^\"]*)\"")
        .matcher(tbody(sorted.dom(), "observations-table"));
    List<Double> priorities = new ArrayList<>();
    while (m.find()) {
      priorities.add(Double.parseDouble(m.group(1)));
    }
    assertEquals(t.observations().size(), priorities.size());
    for (int i = 1; i < priorities.size(); i++) {
      assertTrue(priorities.get(i) <= priorities.get(i - 1), "not sorted by priority, descending: " + priorities);
    }
    open(html, null, "demo-night.png");
    assertTrue(Files.size(SCREENS.resolve("demo-night.png")) > 10_000, "screenshot written");
  }

  @Test
  void networkReportShowsEachResourceWithItsChartsWithoutConsoleErrors(@TempDir Path dir) throws Exception {
    needBrowser();
    // Two invented telescope sites sharing one queue (format addition A6).
    Timeline t = planWithReport(bundled("network-two-sites-night.json", dir), dir, "network");
    Path html = dir.resolve("network.html");
    // lanes and timeline, then each site's night and sky charts
    Page page = openAndCheck(html, t, 6);
    for (String res : List.of("desert-1m", "plateau-60cm")) {
      long mine = t.observations().stream().filter(o -> res.equals(o.resource())).count();
      int at = page.dom().indexOf("<section class=\"resource\" id=\"resource-" + res + "\"");
      assertTrue(at >= 0, res + ": its section");
      String section = page.dom().substring(at, page.dom().indexOf("</section>", at));
      assertEquals(mine, count(section, "<g class=\"observation-start\""), res + ": markers on its sky chart");
      assertEquals(2, count(section, "<svg[^>]*class=\"chart"), res + ": its night and sky charts");
      assertTrue(mine > 0 && section.contains("<dd>" + mine + " scheduled on it"), res + ": its count");
    }
    // Sorted on load by the 3rd column, the resource: all of the first site's rows, then the second's.
    Page sorted = open(html, "#sort=3", null);
    assertEquals(List.of(), sorted.console());
    Matcher m = Pattern.compile("<tr><td data-v=\"\\d+\">\\d+</td><td[^>]*>[^<]*</td><td data-v=\"([^\"]*)\"")
        .matcher(tbody(sorted.dom(), "observations-table"));
    List<String> resources = new ArrayList<>();
    while (m.find()) {
      resources.add(m.group(1));
    }
    assertEquals(t.observations().stream().map(o -> o.resource()).sorted().toList(), resources, "sorted by resource");
    open(html, null, "network-two-sites-night.png");
    assertTrue(Files.size(SCREENS.resolve("network-two-sites-night.png")) > 10_000, "screenshot written");
  }

  @Test
  void stationReportHasAPassTableForEveryTleObject(@TempDir Path dir) throws Exception {
    needBrowser();
    Path scenario = bundled("satellite-tracking-night.json", dir);
    Timeline t = planWithReport(scenario, dir, "station");
    Page page = open(dir.resolve("station.html"), null, null);
    open(dir.resolve("station.html"), null, "satellite-tracking-night.png");
    assertEquals(List.of(), page.console(), "console messages");
    assertTrue(page.dom().contains("data-ready=\"yes\""));
    String passes = tbody(page.dom(), "passes-table");
    int rows = count(passes, "<tr>");
    assertTrue(rows >= 60, "at least one pass of each of the 60 objects over 12 h: " + rows);
    // every scheduled observation lies in a pass marked scheduled
    assertTrue(count(passes, ">yes</td>") >= Math.min(1, t.observations().size()));
    assertEquals(t.observations().size(), count(tbody(page.dom(), "observations-table"), "<tr>"));
  }

  @Test
  void earthImagingReportHasAGroundMap(@TempDir Path dir) throws Exception {
    needBrowser();
    // An invented spacecraft on Keplerian elements imaging invented Earth points for 6 h.
    ObjectNode s = Synthetic.base(Instant.parse("2031-06-01T00:00:00Z"), 6, 20);
    s.putObject("observer").putObject("orbit").putObject("keplerian").put("epoch", "2031-06-01T00:00:00Z")
        .put("semiMajorAxisKm", 6978.137).put("eccentricity", 0.001).put("inclinationDeg", 97.8).put("raanDeg", 30)
        .put("argumentOfPerigeeDeg", 0).put("meanAnomalyDeg", 0);
    s.putObject("constraints").put("elevationMinDeg", 20);
    java.util.Random rnd = new java.util.Random(4);
    var reqs = (com.fasterxml.jackson.databind.node.ArrayNode) s.get("requests");
    for (int i = 0; i < 30; i++) {
      ObjectNode q = reqs.addObject();
      q.put("id", "E" + (i + 1));
      q.putObject("target").put("latitudeDeg", -70 + 140 * rnd.nextDouble())
          .put("longitudeDeg", -180 + 360 * rnd.nextDouble()).put("altitudeM", 0);
      q.put("durationS", 30);
      q.put("priority", 1 + rnd.nextInt(5));
    }
    Path scenario = Synthetic.write(s, dir.resolve("imaging.json"));
    Timeline t = planWithReport(scenario, dir, "imaging");
    Page page = open(dir.resolve("imaging.html"), null, null);
    open(dir.resolve("imaging.html"), null, "earth-imaging.png");
    assertEquals(List.of(), page.console(), "console messages");
    assertTrue(page.dom().contains("id=\"ground-map\""), "ground map");
    // lanes, timeline, ground map (no sky chart: Earth points are not on the sky)
    assertEquals(3, count(page.dom(), "<svg[^>]*class=\"chart"), "charts");
    assertEquals(t.observations().size(), count(tbody(page.dom(), "observations-table"), "<tr>"));
    assertTrue(t.observations().size() > 0, "some Earth point is seen in 6 h");
  }
}
