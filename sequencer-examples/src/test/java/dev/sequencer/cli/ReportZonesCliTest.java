package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.charts.InventedPlans;
import dev.sequencer.charts.NetworkPlans;
import dev.sequencer.io.ScenarioWriter;
import dev.sequencer.io.TimelineFile;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code sequencer report} with resources at two ground sites (format addition A6): each resource's local time is
 * the nautical zone of its own longitude, as the one observer's is (east-ridge at 65 deg E: UTC+4, west-mesa at
 * 20 deg E: UTC+1); {@code --zone} puts every resource in the zone given.
 */
class ReportZonesCliTest {
  private static final String NOTE = "nautical zone of the longitude; --zone to choose";
  @TempDir static Path dir;
  private static Path scenario;
  private static Path timeline;

  @BeforeAll
  static void files() {
    NetworkPlans.Planned p = InventedPlans.twoZones();
    scenario = dir.resolve("zones.json");
    timeline = dir.resolve("zones-timeline.json");
    ScenarioWriter.write(p.scenario(), scenario);
    TimelineFile.write(p.timeline(), timeline);
  }

  private static String section(String page, String resource) {
    int at = page.indexOf("<section class=\"resource\" id=\"resource-" + resource + "\"");
    assertTrue(at >= 0, resource + ": its section");
    return page.substring(at, page.indexOf("</section>", at));
  }

  @Test
  void eachResourceGetsTheNauticalZoneOfItsOwnLongitude() throws Exception {
    Path html = dir.resolve("zones.html");
    Runs.Run r = Runs.run("report", scenario.toString(), timeline.toString(), "-o", html.toString());
    assertEquals(0, r.code(), r::all);
    String page = Files.readString(html);
    // nautical zone: UTC + round(longitude / 15) h (65 / 15 = 4.3, 20 / 15 = 1.3)
    for (String[] e : new String[][] {{"east-ridge", "UTC+04:00"}, {"west-mesa", "UTC+01:00"}}) {
      String section = section(page, e[0]);
      assertTrue(section.contains("<dt>local time</dt><dd>" + e[1] + " (" + NOTE + ")</dd>"), e[0] + ": " + e[1]);
      assertTrue(section.contains(">local time (" + e[1] + ", " + NOTE + ")</text>"), e[0] + ": its night chart");
    }
  }

  @Test
  void zoneOptionPutsEveryResourceInThatZone() throws Exception {
    Path html = dir.resolve("zones-given.html");
    Runs.Run r = Runs.run("report", scenario.toString(), timeline.toString(), "-o", html.toString(), "--zone",
        "+02:00");
    assertEquals(0, r.code(), r::all);
    String page = Files.readString(html);
    for (String res : new String[] {"east-ridge", "west-mesa"}) {
      String section = section(page, res);
      assertTrue(section.contains("<dt>local time</dt><dd>UTC+02:00 (--zone)</dd>"), res);
      assertTrue(section.contains(">local time (UTC+02:00, --zone)</text>"), res + ": its night chart");
    }
    assertFalse(page.contains(NOTE), "no zone of a longitude when one is given");
  }
}
