package dev.sequencer.report;

import static dev.sequencer.report.NightReportResourcesTest.between;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.charts.InventedPlans;
import dev.sequencer.charts.NetworkPlans;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * Local time per resource (format addition A6) in the night report: with two sites three zones apart, each
 * resource's section states its own zone of "local time" and its night chart's local-time axis is in that zone
 * (read from the tick labels: the local row is the UTC row shifted by the zone's offset).
 */
class NightReportZonesTest {
  /** A tick label "HH:MM" with its position and measured width. */
  private static final Pattern TICK = Pattern.compile(
      "<text x=\"(-?[0-9.]+)\" y=\"(-?[0-9.]+)\"[^>]*? textLength=\"([0-9.]+)\"[^>]*>([0-9]{2}):([0-9]{2})</text>");
  private static final String NOTE = "nautical zone of the longitude; --zone to choose";

  /**
   * The constant shifts, minutes mod 1440, between two rows of "HH:MM" tick labels of {@code svg}: for each two
   * rows (by y) with at least three labels centred at the same x (within 1 px), the one difference all of those
   * have, when they have one.
   */
  static Set<Integer> shifts(String svg) {
    Map<Double, List<double[]>> rows = new TreeMap<>(); // y -> {centre x, minutes}
    Matcher m = TICK.matcher(svg);
    while (m.find()) {
      double centre = Double.parseDouble(m.group(1)) + Double.parseDouble(m.group(3)) / 2;
      double y = Math.round(Double.parseDouble(m.group(2)) * 10) / 10.0;
      rows.computeIfAbsent(y, k -> new ArrayList<>()).add(new double[] {centre,
          Integer.parseInt(m.group(4)) * 60 + Integer.parseInt(m.group(5))});
    }
    Set<Integer> out = new TreeSet<>();
    for (List<double[]> a : rows.values()) {
      for (List<double[]> b : rows.values()) {
        if (a == b) {
          continue;
        }
        Set<Integer> diffs = new TreeSet<>();
        int matched = 0;
        for (double[] p : a) {
          for (double[] q : b) {
            if (Math.abs(p[0] - q[0]) < 1) {
              diffs.add(Math.floorMod((int) (q[1] - p[1]), 1440));
              matched++;
            }
          }
        }
        if (matched >= 3 && diffs.size() == 1) {
          out.addAll(diffs);
        }
      }
    }
    return out;
  }

  @Test
  void eachResourceStatesItsZoneAndItsNightChartIsInIt() {
    NetworkPlans.Planned p = InventedPlans.twoZones();
    Map<String, NightReport.LocalZone> zones = Map.of(
        "east-ridge", new NightReport.LocalZone(ZoneOffset.ofHours(4), NOTE),
        "west-mesa", new NightReport.LocalZone(ZoneOffset.ofHours(1), NOTE));
    String html = NightReport.html(new NightReport.Input(p.scenario(), p.timeline(), List.of(), null, List.of(),
        Map.of(), ZoneId.of("UTC"), null, List.of(), p.windowsByResource(), zones), NetworkPlans.CTX);
    for (Map.Entry<String, Integer> e : Map.of("east-ridge", 4, "west-mesa", 1).entrySet()) {
      String section = between(html, "<section class=\"resource\" id=\"resource-" + e.getKey() + "\"", "</section>");
      String name = "UTC+0" + e.getValue() + ":00";
      assertTrue(section.contains("<dt>local time</dt><dd>" + name + " (" + NOTE + ")</dd>"), e.getKey() + ": zone");
      String night = between(section, "<svg id=\"night-chart-" + e.getKey() + "\"", "</svg>");
      assertTrue(night.contains(">local time (" + name + ", " + NOTE + ")</text>"), e.getKey() + ": axis label");
      // UTC, local and sidereal rows: local - UTC is the zone's offset (and UTC - local its complement); the
      // sidereal row gains about 10 s an hour on UTC, so no constant shift to or from it
      int offset = 60 * e.getValue();
      assertEquals(Set.of(offset, 1440 - offset), shifts(night), e.getKey() + ": local ticks shifted by the zone");
    }
    assertTrue(!html.contains("<dt>local time</dt><dd>UTC ("), "no resource is left in UTC");
  }

  @Test
  void aResourceNotGivenAZoneKeepsTheReportsOne() {
    NetworkPlans.Planned p = InventedPlans.twoZones();
    String html = NightReport.html(new NightReport.Input(p.scenario(), p.timeline(), List.of(), null, List.of(),
        Map.of(), ZoneOffset.ofHours(3), "--zone", List.of(), p.windowsByResource(),
        Map.of("west-mesa", new NightReport.LocalZone(ZoneOffset.ofHours(1), NOTE))), NetworkPlans.CTX);
    String east = between(html, "<section class=\"resource\" id=\"resource-east-ridge\"", "</section>");
    assertTrue(east.contains("<dt>local time</dt><dd>UTC+03:00 (--zone)</dd>"), east);
    assertEquals(Set.of(180, 1260), shifts(between(east, "<svg id=\"night-chart-east-ridge\"", "</svg>")));
  }
}
