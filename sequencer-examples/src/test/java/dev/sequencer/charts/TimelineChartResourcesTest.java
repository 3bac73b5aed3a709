package dev.sequencer.charts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.examples.Embedding;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import dev.sequencer.planner.PlanOutcome;
import dev.sequencer.planner.Planner;
import dev.sequencer.sequence.SequencerOptions;
import java.awt.geom.Rectangle2D;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Set;
import java.util.Map;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

/**
 * The timeline chart of a plan with several resources (format addition A6), read back from its SVG as XML: one
 * labelled lane group per resource in file order, every observation bar inside its own resource's band, in
 * start order, on a row whose visibility window (that resource's) holds it; and the one-observer chart as it was.
 */
class TimelineChartResourcesTest {
  private static final String SVG = "http://www.w3.org/2000/svg";
  private static final String OBSERVATION_FILL = "#1f4ea0";
  private static final String WINDOW_FILL = "#96c8f0";

  static Document parse(String svg) throws Exception {
    DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
    f.setNamespaceAware(true);
    return f.newDocumentBuilder().parse(new ByteArrayInputStream(svg.getBytes(StandardCharsets.UTF_8)));
  }

  /** The {@code <g>} elements of this class, in document order. */
  static List<Element> groups(Document d, String cls) {
    List<Element> out = new ArrayList<>();
    NodeList l = d.getElementsByTagNameNS(SVG, "g");
    for (int i = 0; i < l.getLength(); i++) {
      Element e = (Element) l.item(i);
      if (cls.equals(e.getAttribute("class"))) {
        out.add(e);
      }
    }
    return out;
  }

  /** The bounds of the first {@code <path>} inside {@code e}. */
  private static Rectangle2D firstPathBounds(Element e) {
    Element p = (Element) e.getElementsByTagNameNS(SVG, "path").item(0);
    return SvgRaster.path(p.getAttribute("d")).getBounds2D();
  }

  /** Bounds of every filled path of this colour outside any group. */
  private static List<Rectangle2D> filled(Document d, String fill) {
    List<Rectangle2D> out = new ArrayList<>();
    NodeList l = d.getElementsByTagNameNS(SVG, "path");
    for (int i = 0; i < l.getLength(); i++) {
      Element p = (Element) l.item(i);
      if (fill.equals(p.getAttribute("fill"))) {
        out.add(SvgRaster.path(p.getAttribute("d")).getBounds2D());
      }
    }
    return out;
  }

  private static String svg(NetworkPlans.Planned p) {
    PlanGeometry g = new PlanGeometry(p.scenario(), NetworkPlans.CTX);
    return ChartFiles.svgDocument(TimelineChart.createByResource(g, p.windowsByResource(), p.timeline(), true, Map.of(),
        null), TimelineChart.WIDTH_PX, TimelineChart.heightPx(p.scenario(), p.timeline(), true, null));
  }

  @ParameterizedTest
  @ValueSource(strings = {NetworkPlans.NETWORK, NetworkPlans.STATION})
  void everyObservationBarLiesInTheLaneGroupOfItsResource(String file) throws Exception {
    NetworkPlans.Planned p = NetworkPlans.of(file);
    Scenario s = p.scenario();
    Document d = parse(svg(p));

    Map<String, Rectangle2D> bands = new LinkedHashMap<>();
    for (Element g : groups(d, "lane-group")) {
      bands.put(g.getAttribute("data-resource"), firstPathBounds(g));
    }
    assertEquals(s.resources().stream().map(Resource::id).toList(), List.copyOf(bands.keySet()),
        "one lane group per resource, in the scenario's order");
    List<Rectangle2D> inOrder = List.copyOf(bands.values());
    for (int i = 1; i < inOrder.size(); i++) {
      assertTrue(inOrder.get(i).getMinY() >= inOrder.get(i - 1).getMaxY() - 0.01, "bands one below the other");
    }

    Map<String, Long> perResource = new LinkedHashMap<>();
    s.resources().forEach(r -> perResource.put(r.id(), p.timeline().observations().stream()
        .filter(o -> r.id().equals(o.resource())).count()));
    assertTrue(perResource.values().stream().allMatch(n -> n > 0), "both resources observe: " + perResource);
    List<Element> labels = groups(d, "lane-label");
    assertEquals(bands.size(), labels.size());
    double rowPx = Double.NaN;
    for (Element l : labels) {
      String res = l.getAttribute("data-resource");
      Element text = (Element) l.getElementsByTagNameNS(SVG, "text").item(0);
      assertEquals(res + " \u2014 " + perResource.get(res) + " observations", text.getTextContent().split(",")[0]);
      double y = Double.parseDouble(text.getAttribute("y"));
      Rectangle2D band = bands.get(res);
      assertTrue(y > band.getMinY() && y < band.getMinY() + 0.1 * band.getHeight(), "label at the top of its band");
      // header row plus one row per observation: every band has the same row height
      double row = band.getHeight() / (perResource.get(res) + 1);
      assertTrue(Double.isNaN(rowPx) || Math.abs(row - rowPx) < 0.01 * rowPx, res + ": row " + row + " vs " + rowPx);
      rowPx = row;
    }

    List<Element> bars = groups(d, "observation");
    assertEquals(p.timeline().observations().size(), bars.size(), "one bar per observation");
    List<String> drawn = new ArrayList<>();
    List<Rectangle2D> windows = filled(d, WINDOW_FILL);
    Map<String, List<double[]>> xyByResource = new LinkedHashMap<>();
    for (Element bar : bars) {
      String res = bar.getAttribute("data-resource");
      Rectangle2D r = firstPathBounds(bar);
      assertEquals(OBSERVATION_FILL, ((Element) bar.getElementsByTagNameNS(SVG, "path").item(0)).getAttribute("fill"));
      Rectangle2D band = bands.get(res);
      assertTrue(band != null && r.getMinY() >= band.getMinY() && r.getMaxY() <= band.getMaxY(),
          bar.getAttribute("data-request") + " on " + res + " at y " + r.getMinY() + ".." + r.getMaxY()
              + " outside its band " + band);
      assertTrue(windows.stream().anyMatch(w -> Math.abs(w.getCenterY() - r.getCenterY()) < 0.5
          && w.getMinX() <= r.getMinX() + 0.5 && w.getMaxX() >= r.getMaxX() - 0.5),
          bar.getAttribute("data-request") + ": no window of " + res + " on its row holds it");
      drawn.add(bar.getAttribute("data-request") + "@" + res);
      xyByResource.computeIfAbsent(res, k -> new ArrayList<>()).add(new double[] {r.getMinX(), r.getCenterY()});
    }
    assertEquals(p.timeline().observations().stream().map(o -> o.id() + "@" + o.resource()).sorted().toList(),
        drawn.stream().sorted().toList(), "the bars are the timeline's observations on their resources");
    // within a group the rows go down in start order (the timeline lists observations by start)
    for (List<double[]> xy : xyByResource.values()) {
      for (int i = 1; i < xy.size(); i++) {
        assertTrue(xy.get(i)[1] > xy.get(i - 1)[1] && xy.get(i)[0] >= xy.get(i - 1)[0] - 0.5, "start order");
      }
    }
  }

  @Test
  void eachResourceBandIsShadedByTheSunAtItsOwnSite() throws Exception {
    NetworkPlans.Planned p = NetworkPlans.of(NetworkPlans.NETWORK);
    Document d = parse(svg(p));
    // DAY and TWILIGHT of the chart: boxes inside a band, none across two.
    List<Rectangle2D> shades = new ArrayList<>(filled(d, "#fad778"));
    shades.addAll(filled(d, "#faebbe"));
    List<Rectangle2D> bands = groups(d, "lane-group").stream().map(TimelineChartResourcesTest::firstPathBounds).toList();
    for (Rectangle2D band : bands) {
      List<Rectangle2D> mine = shades.stream().filter(r -> r.getMinY() >= band.getMinY() - 0.01
          && r.getMaxY() <= band.getMaxY() + 0.01).toList();
      assertFalse(mine.isEmpty(), "twilight shaded in the band at " + band.getMinY());
    }
    assertEquals(shades.size(), shades.stream().filter(r -> bands.stream().anyMatch(b -> r.getMinY() >= b.getMinY()
        - 0.01 && r.getMaxY() <= b.getMaxY() + 0.01)).count(), "every shade lies in one band");
    // 24.6 deg N and 23.7 deg S in October: the northern site's evening twilight ends earlier (UTC, similar
    // longitude), so its first shade is narrower than the southern one's.
    Comparator<Rectangle2D> byX = Comparator.comparingDouble(Rectangle2D::getMinX);
    double north = shades.stream().filter(r -> r.getMaxY() <= bands.get(0).getMaxY() + 0.01).sorted(byX)
        .filter(r -> r.getMinX() <= bands.get(0).getMinX() + 0.5).mapToDouble(Rectangle2D::getMaxX).max().orElseThrow();
    double south = shades.stream().filter(r -> r.getMinY() >= bands.get(1).getMinY() - 0.01).sorted(byX)
        .filter(r -> r.getMinX() <= bands.get(1).getMinX() + 0.5).mapToDouble(Rectangle2D::getMaxX).max().orElseThrow();
    assertTrue(north < south, "evening twilight ends at x " + north + " (north) vs " + south + " (south)");
  }

  @Test
  void chartOfOneObserverHasNoLaneGroups() throws Exception {
    Scenario s = Embedding.bundled("/scenarios/demo-night.json");
    PlanOutcome o = Planner.plan(s, NetworkPlans.CTX, SequencerOptions.from(s.solverOrDefaults())
        .withSolver(SequencerOptions.Solver.GREEDY).withTimeLimitS(5));
    Timeline t = o.timeline();
    String svg = ChartFiles.svgDocument(TimelineChart.create(new PlanGeometry(s, NetworkPlans.CTX),
        o.geometry().windows(), t, true), TimelineChart.WIDTH_PX, TimelineChart.heightPx(s, t, true, null));
    Document d = parse(svg);
    assertEquals(0, d.getElementsByTagNameNS(SVG, "g").getLength(), "no groups: the chart is drawn as before");
    assertEquals(t.observations().size(), filled(d, OBSERVATION_FILL).size() - 1, "one bar per observation and the "
        + "legend's swatch");
    // one row per observation, then one per unscheduled request: the frame plus 18 px a row
    assertEquals(200 + 18 * Math.max(4, t.observations().size() + t.unscheduled().size()),
        TimelineChart.heightPx(s, t, true, null));
  }

  @Test
  void theVisitsOfARequestShareItsRow() throws Exception {
    // The bundled cadence night (A4): three visits of each of four fields; one row per request, no empty rows.
    Scenario s = Embedding.bundled("/scenarios/cadence-queue-night.json");
    PlanOutcome o = Planner.plan(s, NetworkPlans.CTX, SequencerOptions.from(s.solverOrDefaults())
        .withSolver(SequencerOptions.Solver.GREEDY).withTimeLimitS(5));
    Timeline t = o.timeline();
    long requests = t.observations().stream().map(dev.sequencer.model.Observation::id).distinct().count();
    assertTrue(requests < t.observations().size(), "precondition: some request has several visits");
    int height = TimelineChart.heightPx(s, t, false, null);
    assertEquals(200 + 18 * Math.max(4, requests), height, "one row per request");
    Document d = parse(ChartFiles.svgDocument(TimelineChart.create(new PlanGeometry(s, NetworkPlans.CTX),
        o.geometry().windows(), t, false), TimelineChart.WIDTH_PX, height));
    List<Rectangle2D> bars = filled(d, OBSERVATION_FILL);
    assertEquals(t.observations().size(), bars.size() - 1, "one bar per visit and the legend's swatch");
    Set<Long> rows = new java.util.TreeSet<>();
    bars.subList(0, bars.size() - 1).forEach(b -> rows.add(Math.round(b.getCenterY())));
    assertEquals(requests, rows.size(), "every request's row holds its bars: " + rows);
  }

  @Test
  void observationsOnAResourceTheScenarioLacksGetALaneGroupOfTheirOwn() throws Exception {
    NetworkPlans.Planned p = NetworkPlans.of(NetworkPlans.NETWORK);
    Timeline t = p.timeline();
    List<Observation> obs = new ArrayList<>(t.observations());
    obs.set(0, obs.get(0).withResource("nowhere"));
    Timeline bad = new Timeline(t.status(), t.priority(), t.slewSeconds(), t.bound(), obs, t.unscheduled());
    PlanGeometry g = new PlanGeometry(p.scenario(), NetworkPlans.CTX);
    Document d = parse(ChartFiles.svgDocument(TimelineChart.createByResource(g, p.windowsByResource(), bad, false,
        Map.of(), null), TimelineChart.WIDTH_PX, TimelineChart.heightPx(p.scenario(), bad, false, null)));
    List<String> lanes = groups(d, "lane-group").stream().map(e -> e.getAttribute("data-resource")).toList();
    assertEquals(List.of("desert-1m", "plateau-60cm", "nowhere"), lanes, "a timeline that fails its check is drawn whole");
    assertEquals(obs.size(), groups(d, "observation").size());
  }
}
