package dev.sequencer.charts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.Observation;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.w3c.dom.Document;
import org.w3c.dom.Element;

/**
 * The sky chart of each resource of a plan with several resources (format addition A6): drawn from that
 * resource's site (its elevation limit, its mask), with a numbered marker for each of its observations and for no
 * other, the resource id as the title.
 */
class SkyChartResourcesTest {
  private static final String SVG = "http://www.w3.org/2000/svg";

  @ParameterizedTest
  @ValueSource(strings = {NetworkPlans.NETWORK, NetworkPlans.STATION})
  void eachResourcesSkyChartMarksItsOwnObservationsInOrder(String file) throws Exception {
    NetworkPlans.Planned p = NetworkPlans.of(file);
    PlanGeometry g = new PlanGeometry(p.scenario(), NetworkPlans.CTX);
    List<ResourcePlan> plans = ResourcePlan.of(p.scenario(), p.timeline());
    assertEquals(p.scenario().resources().size(), plans.size());
    for (ResourcePlan plan : plans) {
      Document d = TimelineChartResourcesTest.parse(ChartFiles.svgDocument(SkyChart.create(g, plan), SkyChart.WIDTH_PX,
          SkyChart.HEIGHT_PX));
      List<Element> markers = TimelineChartResourcesTest.groups(d, "observation-start");
      List<Observation> mine = p.timeline().observations().stream().filter(o -> plan.id().equals(o.resource())).toList();
      assertTrue(!mine.isEmpty(), plan.id() + " observes");
      assertEquals(mine.size(), markers.size(), plan.id() + ": one marker per observation of this resource");
      for (int k = 0; k < mine.size(); k++) {
        assertEquals(mine.get(k).id(), markers.get(k).getAttribute("data-request"), plan.id() + " marker " + (k + 1));
        assertEquals(Integer.toString(k + 1), markers.get(k).getAttribute("data-number"));
        assertEquals("#1f4ea0", ((Element) markers.get(k).getElementsByTagNameNS(SVG, "path").item(0))
            .getAttribute("fill"), "the marker is drawn, filled");
      }
      String text = d.getDocumentElement().getTextContent();
      assertTrue(text.contains(plan.id()), "titled with the resource");
      assertTrue(text.contains("; " + mine.size() + " observations,"), "the subtitle counts its own");
      Double limit = plan.scenario().constraints().elevationMinDeg();
      assertTrue(text.contains(String.format(java.util.Locale.ROOT, "elevation limit %.0f\u00b0", limit)),
          plan.id() + ": its own elevation limit " + limit);
    }
  }
}
