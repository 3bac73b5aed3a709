package dev.sequencer.charts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.Group;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Timeline;
import java.awt.geom.PathIterator;
import java.awt.geom.Point2D;
import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

/**
 * Groups (format addition A5) in the timeline chart, read back from its SVG: one
 * {@code <g class="group-link" data-group="…">} per group with two members or more scheduled, holding one line
 * from the end of each member's bar to the start of the next member's (in start order, across rows and lane
 * groups) and the group's id once; none for a group with one member scheduled.
 */
class TimelineChartGroupsTest {
  private static final String SVG = "http://www.w3.org/2000/svg";
  private static final String OBSERVATION_FILL = "#1f4ea0";
  /** Half a pixel: the SVG writer rounds coordinates to 0.01 px; bars and links come from the same axis mapping. */
  private static final double PX = 0.5;

  /** The first and last point of an SVG path's data. */
  private static Point2D[] ends(Element path) {
    PathIterator it = SvgRaster.path(path.getAttribute("d")).getPathIterator(null);
    double[] c = new double[6];
    Point2D first = null;
    Point2D last = null;
    for (; !it.isDone(); it.next()) {
      int type = it.currentSegment(c);
      if (type == PathIterator.SEG_MOVETO || type == PathIterator.SEG_LINETO) {
        last = new Point2D.Double(c[0], c[1]);
        first = first == null ? last : first;
      }
    }
    return new Point2D[] {first, last};
  }

  private static List<Element> children(Element e, String tag) {
    List<Element> out = new ArrayList<>();
    NodeList l = e.getElementsByTagNameNS(SVG, tag);
    for (int i = 0; i < l.getLength(); i++) {
      out.add((Element) l.item(i));
    }
    return out;
  }

  /** The links a group should get: its members' observations in start order, each pair of different members. */
  private static List<Observation[]> expectedLinks(Group g, Timeline t) {
    List<Observation> members = t.observations().stream().filter(o -> g.members().contains(o.id()))
        .sorted(Comparator.comparing(Observation::start)).toList();
    List<Observation[]> out = new ArrayList<>();
    for (int i = 1; i < members.size(); i++) {
      if (!members.get(i - 1).id().equals(members.get(i).id())) {
        out.add(new Observation[] {members.get(i - 1), members.get(i)});
      }
    }
    return out;
  }

  /**
   * Checks every group-link element of {@code d} against the timeline: the groups linked, in the scenario's order;
   * one line per pair of consecutive members from the end of the first's bar ({@code bars}) to the start of the
   * next's; the id written once.
   */
  private static void assertLinks(Document d, List<Group> groups, Timeline t, Map<Observation, Rectangle2D> bars) {
    List<Element> links = TimelineChartResourcesTest.groups(d, "group-link");
    List<String> linked = groups.stream().filter(g -> !expectedLinks(g, t).isEmpty()).map(Group::id).toList();
    assertEquals(linked, links.stream().map(e -> e.getAttribute("data-group")).toList(),
        "one link element per group with two members scheduled, in the scenario's order");
    for (Element e : links) {
      Group g = groups.stream().filter(x -> x.id().equals(e.getAttribute("data-group"))).findFirst().orElseThrow();
      List<Observation[]> pairs = expectedLinks(g, t);
      List<Element> lines = children(e, "path");
      assertEquals(pairs.size(), lines.size(), g.id() + ": one line per pair of consecutive members");
      for (int i = 0; i < pairs.size(); i++) {
        Point2D[] ends = ends(lines.get(i));
        Rectangle2D from = bars.get(pairs.get(i)[0]);
        Rectangle2D to = bars.get(pairs.get(i)[1]);
        String what = g.id() + " " + pairs.get(i)[0].id() + " -> " + pairs.get(i)[1].id();
        assertEquals(from.getMaxX(), ends[0].getX(), PX, what + ": starts at the end of the first bar");
        assertEquals(from.getCenterY(), ends[0].getY(), PX, what + ": on the first bar's row");
        assertEquals(to.getMinX(), ends[1].getX(), PX, what + ": ends at the start of the next bar");
        assertEquals(to.getCenterY(), ends[1].getY(), PX, what + ": on the next bar's row");
      }
      List<String> texts = children(e, "text").stream().map(Element::getTextContent).toList();
      assertEquals(List.of(g.id()), texts, g.id() + ": labelled once");
    }
  }

  @Test
  void consecutiveMembersAreLinkedFromTheEndOfOneBarToTheStartOfTheNext() throws Exception {
    NetworkPlans.Planned p = InventedPlans.groupsNight();
    Timeline t = p.timeline();
    Map<String, Long> scheduled = new HashMap<>();
    t.observations().forEach(o -> scheduled.merge(o.id(), 1L, Long::sum));
    assertTrue(List.of("CHN-1", "CHN-2", "CHN-3", "PR-1", "PR-2", "SOLO-1").stream().allMatch(scheduled::containsKey)
        && !scheduled.containsKey("SOLO-2"), "precondition: chain and pair whole, SOLO-2 never up: "
        + t.observations());
    assertEquals(2L, scheduled.get("FLD-1"), "precondition: both visits of FLD-1");

    int height = TimelineChart.heightPx(p.scenario(), t, false, null);
    Document d = TimelineChartResourcesTest.parse(ChartFiles.svgDocument(TimelineChart.create(
        new PlanGeometry(p.scenario(), NetworkPlans.CTX), p.geometry().windows(), t, false), TimelineChart.WIDTH_PX,
        height));
    // One observer: the bars are untagged; the rows are the requests in the order of their first observation,
    // the visits of one request side by side on its row, so bars by (row, x) are the observations by (row, start).
    List<Rectangle2D> drawn = new ArrayList<>();
    for (Element path : children(d.getDocumentElement(), "path")) {
      if (OBSERVATION_FILL.equals(path.getAttribute("fill"))) {
        drawn.add(SvgRaster.path(path.getAttribute("d")).getBounds2D());
      }
    }
    drawn.remove(drawn.size() - 1); // the legend's swatch
    drawn.sort(Comparator.comparingDouble((Rectangle2D r) -> Math.round(r.getCenterY()))
        .thenComparingDouble(Rectangle2D::getMinX));
    List<String> rowOrder = t.observations().stream().map(Observation::id).distinct().toList();
    List<Observation> byRow = t.observations().stream().sorted(Comparator.comparingInt((Observation o) ->
        rowOrder.indexOf(o.id())).thenComparing(Observation::start)).toList();
    assertEquals(byRow.size(), drawn.size(), "one bar per observation");
    Map<Observation, Rectangle2D> bars = new LinkedHashMap<>();
    for (int i = 0; i < byRow.size(); i++) {
      bars.put(byRow.get(i), drawn.get(i));
    }
    assertLinks(d, p.scenario().groups(), t, bars);
    assertEquals(List.of("CHAIN", "PAIR"), TimelineChartResourcesTest.groups(d, "group-link").stream()
        .map(e -> e.getAttribute("data-group")).toList(), "SOLO has one member scheduled: nothing to link");
  }

  @Test
  void aGroupAcrossTwoResourcesIsLinkedAcrossTheirLaneGroups() throws Exception {
    NetworkPlans.Planned p = InventedPlans.twoZones();
    Timeline t = p.timeline();
    Observation first = t.observations().stream().filter(o -> o.id().equals("RLY-1")).findFirst().orElseThrow();
    Observation second = t.observations().stream().filter(o -> o.id().equals("RLY-2")).findFirst().orElseThrow();
    assertTrue(first.resource().equals("east-ridge") && second.resource().equals("west-mesa"), "precondition");

    PlanGeometry g = new PlanGeometry(p.scenario(), NetworkPlans.CTX);
    Document d = TimelineChartResourcesTest.parse(ChartFiles.svgDocument(TimelineChart.createByResource(g,
        p.windowsByResource(), t, true, Map.of(), null), TimelineChart.WIDTH_PX,
        TimelineChart.heightPx(p.scenario(), t, true, null)));
    Map<Observation, Rectangle2D> bars = new LinkedHashMap<>();
    for (Element bar : TimelineChartResourcesTest.groups(d, "observation")) {
      Observation o = t.observations().stream().filter(x -> x.id().equals(bar.getAttribute("data-request"))
          && x.resource().equals(bar.getAttribute("data-resource"))).findFirst().orElseThrow();
      bars.put(o, SvgRaster.path(children(bar, "path").get(0).getAttribute("d")).getBounds2D());
    }
    assertLinks(d, p.scenario().groups(), t, bars);
    Map<String, Rectangle2D> bands = new HashMap<>();
    for (Element band : TimelineChartResourcesTest.groups(d, "lane-group")) {
      bands.put(band.getAttribute("data-resource"), SvgRaster.path(children(band, "path").get(0).getAttribute("d"))
          .getBounds2D());
    }
    Point2D[] ends = ends(children(TimelineChartResourcesTest.groups(d, "group-link").get(0), "path").get(0));
    assertTrue(bands.get("east-ridge").contains(ends[0]) && bands.get("west-mesa").contains(ends[1]),
        "from the east-ridge band to the west-mesa band");
  }
}
