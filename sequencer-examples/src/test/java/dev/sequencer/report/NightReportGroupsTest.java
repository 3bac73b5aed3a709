package dev.sequencer.report;

import static dev.sequencer.report.NightReportResourcesTest.between;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.charts.InventedPlans;
import dev.sequencer.charts.NetworkPlans;
import dev.sequencer.examples.Embedding;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.planner.PlanOutcome;
import dev.sequencer.planner.Planner;
import dev.sequencer.sequence.SequencerOptions;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * Visits, groups and configurations (format additions A4, A5) in the night report, read from its HTML: the
 * observations table ends with a visit, a group and a configuration column (the earlier columns keep their
 * numbers), the unscheduled table names each request's group and keeps its reason, and the timeline chart links
 * the groups; a report without them has none of the three columns.
 */
class NightReportGroupsTest {
  /** A cell: its sort key and its text. */
  private static final Pattern CELL = Pattern.compile("<td data-v=\"([^\"]*)\">(.*?)</td>");
  private static final String HEAD = "<tr><th>#</th><th>id</th><th>start (UTC)</th><th>end (UTC)</th><th>target</th>"
      + "<th>priority</th><th>required</th>";

  private static String html(Scenario s, Timeline t, List<dev.sequencer.model.RequestWindows> windows) {
    return NightReport.html(new NightReport.Input(s, t, windows, null, List.of(), Map.of(), ZoneId.of("UTC"), null,
        List.of()), NetworkPlans.CTX);
  }

  /** Each body row's cells as {sort key, text}. */
  private static List<List<String[]>> rows(String table) {
    List<List<String[]>> out = new ArrayList<>();
    for (String tr : table.substring(table.indexOf("<tbody>")).split("<tr>")) {
      List<String[]> cells = new ArrayList<>();
      Matcher m = CELL.matcher(tr);
      while (m.find()) {
        cells.add(new String[] {m.group(1), m.group(2)});
      }
      if (!cells.isEmpty()) {
        out.add(cells);
      }
    }
    return out;
  }

  @Test
  void observationsTableEndsWithVisitGroupAndConfiguration() {
    NetworkPlans.Planned p = InventedPlans.groupsNight();
    Timeline t = p.timeline();
    String table = between(html(p.scenario(), t, p.geometry().windows()),
        "<table class=\"sortable\" id=\"observations-table\">", "</table>");
    assertTrue(table.contains(HEAD), "the first columns keep their numbers (#sort=6 is still priority)");
    assertTrue(table.contains("<th>duration [s]</th><th>visit</th><th>group</th><th>configuration</th></tr>"),
        "the three columns last");
    // What each request's last three cells say (text; sort key): the file's groups, visits and labels.
    Map<String, List<String>> expected = Map.of(
        "CHN-1", List.of("", "CHAIN 1/3", "(default)"), "CHN-2", List.of("", "CHAIN 2/3", "(default)"),
        "CHN-3", List.of("", "CHAIN 3/3", "(default)"), "PR-1", List.of("", "PAIR", "(default)"),
        "PR-2", List.of("", "PAIR", "(default)"), "SOLO-1", List.of("", "SOLO", "(default)"),
        "FLD-2", List.of("", "", "wide"));
    List<List<String[]>> rows = rows(table);
    assertEquals(t.observations().size(), rows.size());
    for (int i = 0; i < rows.size(); i++) {
      Observation o = t.observations().get(i);
      List<String[]> cells = rows.get(i);
      assertEquals(o.id(), cells.get(1)[0]);
      List<String> last = cells.subList(cells.size() - 3, cells.size()).stream().map(c -> c[1]).toList();
      List<String> want = o.id().equals("FLD-1") ? List.of(o.visit() + "/2", "", "narrow") : expected.get(o.id());
      assertEquals(want, last, o.id());
      String groupKey = cells.get(cells.size() - 2)[0];
      if (o.id().startsWith("CHN-")) {
        // sorted by group, then place in it
        assertEquals("CHAIN 000" + o.id().substring(4), groupKey, o.id());
      }
    }
    assertEquals(List.of("1/2", "2/2"), t.observations().stream().filter(o -> o.id().equals("FLD-1"))
        .map(o -> o.visit() + "/2").toList(), "precondition: both visits, in time order");
  }

  @Test
  void unscheduledTableNamesTheGroupAndKeepsTheReason() {
    NetworkPlans.Planned p = InventedPlans.groupsNight();
    Timeline t = p.timeline();
    String html = html(p.scenario(), t, p.geometry().windows());
    String table = between(html, "<table class=\"sortable\" id=\"unscheduled-table\">", "</table>");
    assertTrue(table.contains("<th>target</th><th>group</th><th>reason</th>"));
    Unscheduled solo = t.unscheduled().stream().filter(u -> u.id().equals("SOLO-2")).findFirst().orElseThrow();
    List<List<String[]>> rows = rows(table);
    assertEquals(t.unscheduled().size(), rows.size());
    List<String[]> row = rows.get(t.unscheduled().indexOf(solo));
    assertEquals(List.of("SOLO-2", "SOLO", Html.esc(solo.reason())),
        List.of(row.get(0)[1], row.get(4)[1], row.get(5)[1]),
        "the group, then the timeline's reason as before");
    // and the timeline chart links the two groups with members scheduled
    String chart = between(html, "<svg id=\"timeline-chart\"", "</svg>");
    for (String g : List.of("CHAIN", "PAIR")) {
      assertTrue(chart.contains("<g class=\"group-link\" data-group=\"" + g + "\">"), g + " linked in the chart");
    }
  }

  @Test
  void reportWithoutVisitsGroupsOrConfigurationsHasNoneOfTheColumns() {
    Scenario s = Embedding.bundled("/scenarios/demo-night.json");
    PlanOutcome o = Planner.plan(s, NetworkPlans.CTX, SequencerOptions.from(s.solverOrDefaults())
        .withSolver(SequencerOptions.Solver.GREEDY).withTimeLimitS(5));
    String html = html(s, o.timeline(), o.geometry().windows());
    String table = between(html, "<table class=\"sortable\" id=\"observations-table\">", "</table>");
    assertTrue(table.contains(HEAD) && table.contains("<th>duration [s]</th></tr>"), "as before");
    assertTrue(html.contains("<th>target</th><th>reason</th>") || !html.contains("id=\"unscheduled-table\""));
    assertTrue(!html.contains("group-link"), "no groups, no links");
  }
}
