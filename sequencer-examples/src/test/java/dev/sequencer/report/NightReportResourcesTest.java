package dev.sequencer.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.charts.NetworkPlans;
import dev.sequencer.charts.ResourcePlan;
import dev.sequencer.examples.Embedding;
import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
import dev.sequencer.planner.PlanOutcome;
import dev.sequencer.planner.Planner;
import dev.sequencer.sequence.SequencerOptions;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The night report of a plan with several resources (format addition A6), read from its HTML: a resource column
 * in the observations table, one section per resource (observer, counts, its constraints in force, its charts),
 * one lane per resource; and the report of one observer without any of it.
 */
class NightReportResourcesTest {
  private static final Pattern CELL = Pattern.compile("<td data-v=\"([^\"]*)\">");

  /** Reports built so far, by file: each scenario's report is built once per test run (it is read, not changed). */
  private static final Map<String, String> REPORTS = new java.util.concurrent.ConcurrentHashMap<>();

  static String report(String file) {
    return REPORTS.computeIfAbsent(file, f -> {
      NetworkPlans.Planned p = NetworkPlans.of(f);
      return NightReport.html(new NightReport.Input(p.scenario(), p.timeline(), List.of(), null, List.of(), Map.of(),
          ZoneId.of("UTC"), null, List.of(), p.windowsByResource()), NetworkPlans.CTX);
    });
  }

  /** The text between {@code from} (included) and the next {@code to} after it. */
  static String between(String html, String from, String to) {
    int a = html.indexOf(from);
    assertTrue(a >= 0, "no " + from);
    int e = html.indexOf(to, a + from.length());
    return html.substring(a, e < 0 ? html.length() : e);
  }

  static int count(String text, String regex) {
    Matcher m = Pattern.compile(regex).matcher(text);
    int n = 0;
    while (m.find()) {
      n++;
    }
    return n;
  }

  /** Each body row's sort keys (one per cell). */
  private static List<List<String>> rows(String table) {
    List<List<String>> out = new ArrayList<>();
    for (String tr : table.substring(table.indexOf("<tbody>")).split("<tr>")) {
      List<String> cells = new ArrayList<>();
      Matcher m = CELL.matcher(tr);
      while (m.find()) {
        cells.add(m.group(1));
      }
      if (!cells.isEmpty()) {
        out.add(cells);
      }
    }
    return out;
  }

  @ParameterizedTest
  @ValueSource(strings = {NetworkPlans.NETWORK, NetworkPlans.STATION})
  void observationsTableNamesTheResourceOfEveryRow(String file) {
    List<Observation> obs = NetworkPlans.of(file).timeline().observations();
    String table = between(report(file), "<table class=\"sortable\" id=\"observations-table\">", "</table>");
    assertTrue(table.contains("<tr><th>#</th><th>id</th><th>resource</th><th>start (UTC)</th>"), "third column");
    List<List<String>> rows = rows(table);
    assertEquals(obs.size(), rows.size());
    for (int i = 0; i < obs.size(); i++) {
      assertEquals(List.of(Integer.toString(i + 1), obs.get(i).id(), obs.get(i).resource()), rows.get(i).subList(0, 3));
      // the airmass is the one at the observation's own site: a number, not a blank
      assertFalse(rows.get(i).get(8).isEmpty(), obs.get(i).id() + " airmass");
    }
  }

  @ParameterizedTest
  @ValueSource(strings = {NetworkPlans.NETWORK, NetworkPlans.STATION})
  void eachResourceHasASectionWithItsObserverCountsConstraintsAndCharts(String file) {
    NetworkPlans.Planned p = NetworkPlans.of(file);
    Scenario s = p.scenario();
    String html = report(file);
    assertEquals(s.resources().size(), count(html, "<section class=\"resource\""), "one section per resource");
    List<ResourcePlan> plans = ResourcePlan.of(s, p.timeline());
    int at = 0;
    for (ResourcePlan plan : plans) {
      Resource r = plan.resource();
      String open = "<section class=\"resource\" id=\"resource-" + plan.fileName() + "\" data-resource=\"" + r.id()
          + "\"><h3>" + r.id() + "</h3>";
      assertTrue(html.indexOf(open) > at, r.id() + ": its section, in the scenario's order");
      at = html.indexOf(open);
      String section = between(html, open, "</section>");
      long n = p.timeline().observations().stream().filter(o -> r.id().equals(o.resource())).count();
      GroundSite site = (GroundSite) r.observer();
      assertTrue(section.contains(String.format(Locale.ROOT, "<dt>observer</dt><dd>site %.2f\u00b0, %.2f\u00b0</dd>",
          site.latitudeDeg(), site.longitudeDeg())), r.id() + " observer");
      assertTrue(section.contains("<dt>observations</dt><dd>" + n + " scheduled on it"), r.id() + " count " + n);
      assertTrue(section.contains(String.format(Locale.ROOT, "<dt>priority</dt><dd>%.2f collected on it</dd>",
          plan.timeline().priority())), r.id() + " priority");
      assertTrue(section.contains(String.format(Locale.ROOT, "<dt>slew total</dt><dd>%.0f s</dd>",
          plan.timeline().slewSeconds())), r.id() + " slew");

      // constraints in force: the scenario's with the resource's own fields over them, each said where it is from
      String constraints = between(section, "<table id=\"constraints-" + plan.fileName() + "\">", "</table>");
      int fields = 0;
      for (ConstraintField f : ConstraintField.values()) {
        Object v = f.valueIn(s.forResource(r).constraints());
        if (v != null) {
          fields++;
          assertTrue(constraints.contains("<tr><td>" + f.key() + "</td><td>" + v + "</td><td>"
              + (r.constraints().mentions(f) ? "resource" : "scenario") + "</td></tr>"), r.id() + " " + f.key());
        }
      }
      assertEquals(fields + 3, count(constraints, "<tr><td>"), "the fields, the mask, refraction and slew");

      // its charts: the night at its site and its sky with one marker per observation on it
      assertEquals(2, count(section, "<svg[^>]*class=\"chart"), r.id() + ": night and sky charts");
      String sky = between(section, "<svg id=\"sky-chart-" + plan.fileName() + "\"", "</svg>");
      assertEquals(n, count(sky, "<g class=\"observation-start\""), r.id() + ": markers on its sky chart");
      assertTrue(section.contains("<svg id=\"night-chart-" + plan.fileName() + "\""));
    }
    // the network's own constraints once, for every resource
    assertTrue(html.contains("<h3>every resource (a resource&#39;s own fields replace these"), "scenario level");
  }

  @Test
  void laneChartHasALanePerResourceAndTheTimelineChartItsLaneGroups() {
    NetworkPlans.Planned p = NetworkPlans.of(NetworkPlans.NETWORK);
    String html = report(NetworkPlans.NETWORK);
    String lanes = between(html, "<svg class=\"chart lanes\"", "</svg>");
    String timeline = between(html, "<svg id=\"timeline-chart\"", "</svg>");
    for (Resource r : p.scenario().resources()) {
      long n = p.timeline().observations().stream().filter(o -> r.id().equals(o.resource())).count();
      String lane = between(lanes, "<g class=\"lane\" data-lane=\"" + r.id() + "\">", "</g>");
      assertEquals(n, count(lane, "<rect class=\"obs\""), r.id() + ": its observations in its lane");
      assertEquals(1, count(timeline, "<g class=\"lane-group\" data-resource=\"" + r.id() + "\">"), r.id());
      assertEquals(n, count(timeline, "<g class=\"observation\" data-request=\"[^\"]+\" data-resource=\"" + r.id()
          + "\">"), r.id() + ": its bars in the timeline chart");
    }
    // lanes, timeline, and the night and sky charts of each of the two sites
    assertEquals(6, count(html, "<svg[^>]*class=\"chart"), "charts");
    assertEquals(2, count(lanes, "<rect class=\"sun\" x=\"160.0\""), "each lane shaded from the evening on");
    assertTrue(html.contains(NightReport.CAUTION), "the caution");
    String stripped = html.replace("http://www.w3.org/2000/svg", "").replace("http://www.w3.org/1999/xlink", "");
    assertFalse(stripped.contains("http://") || stripped.contains("https://"), "nothing fetched");
  }

  @Test
  void reportOfOneObserverHasNoResourceSectionsOrColumn() {
    Scenario s = Embedding.bundled("/scenarios/demo-night.json");
    PlanOutcome o = Planner.plan(s, NetworkPlans.CTX, SequencerOptions.from(s.solverOrDefaults())
        .withSolver(SequencerOptions.Solver.GREEDY).withTimeLimitS(5));
    String html = NightReport.html(new NightReport.Input(s, o.timeline(), o.geometry().windows(), null, List.of(),
        Map.of(), ZoneId.of("UTC"), null, List.of()), NetworkPlans.CTX);
    assertFalse(html.contains("id=\"resources\"") || html.contains("<th>resource</th>"));
    assertEquals(1, count(html, "<g class=\"lane\" data-lane="), "one lane, the site's");
    assertFalse(html.contains("lane-group"), "no lane groups in the timeline chart");
    assertEquals(4, count(html, "<svg[^>]*class=\"chart"), "lanes, timeline, night, sky");
  }
}
