package dev.sequencer.report;

import static dev.sequencer.report.NightReportResourcesTest.between;
import static dev.sequencer.report.NightReportResourcesTest.count;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.charts.InventedPlans;
import dev.sequencer.charts.NetworkPlans;
import dev.sequencer.charts.ResourcePlan;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;

/**
 * The night report of two imaging spacecraft (format addition A6, Earth-point targets): one ground map per
 * resource, in that resource's section, titled with its id, drawn from its own orbit (the two ground tracks
 * differ) and numbering its own observations only.
 */
class NightReportGroundMapsTest {
  /** The ground map's order numbers (GroundMap writes them in a 10 pt font, its tick labels in 12 pt). */
  private static final Pattern NUMBER = Pattern.compile("<text [^>]*font-size=\"10\"[^>]*>([0-9]+)</text>");
  /** An orange line: the ground track over the horizon, or its legend swatch. */
  private static final Pattern TRACK = Pattern.compile("<path d=\"([^\"]+)\" fill=\"none\" stroke=\"#eb7814\"");

  @Test
  void eachOrbitingResourceHasAGroundMapOfItsOwn() {
    NetworkPlans.Planned p = InventedPlans.imagingFleet();
    String html = NightReport.html(new NightReport.Input(p.scenario(), p.timeline(), List.of(), null, List.of(),
        Map.of(), ZoneId.of("UTC"), null, List.of(), p.windowsByResource()), NetworkPlans.CTX);
    List<ResourcePlan> plans = ResourcePlan.of(p.scenario(), p.timeline());
    assertEquals(plans.size(), count(html, "<svg id=\"ground-map"), "one ground map per resource, none other");
    List<String> tracks = new ArrayList<>();
    for (ResourcePlan plan : plans) {
      int n = plan.timeline().observations().size();
      assertTrue(n >= 2, plan.id() + ": precondition, its Earth points observed: " + plan.timeline());
      String section = between(html, "<section class=\"resource\" id=\"resource-" + plan.fileName() + "\"",
          "</section>");
      assertTrue(section.contains("<dt>observer</dt><dd>spacecraft</dd>"), plan.id());
      // Earth points only: no sky chart, the ground map alone
      assertEquals(1, count(section, "<svg[^>]*class=\"chart"), plan.id() + ": its one chart");
      String map = between(section, "<svg id=\"ground-map-" + plan.fileName() + "\"", "</svg>");
      assertTrue(map.contains(">" + plan.id() + "</text>"), plan.id() + ": the map titled with its id");
      List<String> numbers = new ArrayList<>();
      Matcher m = NUMBER.matcher(map);
      while (m.find()) {
        numbers.add(m.group(1));
      }
      assertEquals(IntStream.rangeClosed(1, n).mapToObj(Integer::toString).toList(), numbers,
          plan.id() + ": its own observations numbered in order");
      String track = "";
      Matcher t = TRACK.matcher(map);
      while (t.find()) { // the longest orange line: the track, not the legend's swatch
        track = t.group(1).length() > track.length() ? t.group(1) : track;
      }
      assertTrue(count(track, "L") > 100, plan.id() + ": a ground track");
      tracks.add(track);
    }
    assertFalse(tracks.get(0).equals(tracks.get(1)), "each map follows its own spacecraft's orbit (same track drawn)");
  }
}
