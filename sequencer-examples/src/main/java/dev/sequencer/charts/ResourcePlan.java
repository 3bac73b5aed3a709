package dev.sequencer.charts;

import dev.sequencer.model.Observation;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import java.awt.Font;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.title.TextTitle;

/**
 * One resource's share of a plan with several resources (format addition A6), as the charts and the report
 * draw it: the scenario as the resource sees it ({@link Scenario#forResource}: its observer, slew model and
 * start pointing, its constraints over the scenario's field by field) and a timeline of its own: its
 * observations in time order, the unscheduled requests it may observe, and its priority and slew totals over
 * its observations (no bound: the plan's bound is the whole network's).
 *
 * @param resource the resource
 * @param scenario the scenario as {@code resource} sees it
 * @param timeline its part of the plan
 * @param fileName the resource id made safe for a file name, distinct among the scenario's resources
 *     ({@link ChartFiles#fileNames})
 */
public record ResourcePlan(Resource resource, Scenario scenario, Timeline timeline, String fileName) {

  /** The share of every resource of {@code s} in {@code t}, in the scenario's file order; empty with one observer. */
  public static List<ResourcePlan> of(Scenario s, Timeline t) {
    Map<String, String> names = ChartFiles.fileNames(s.resources().stream().map(Resource::id).toList());
    List<ResourcePlan> out = new ArrayList<>();
    for (Resource r : s.resources()) {
      List<Observation> mine = t.observations().stream().filter(o -> r.id().equals(o.resource())).toList();
      List<Unscheduled> open = t.unscheduled().stream()
          .filter(u -> s.request(u.id()).map(q -> q.allows(r.id())).orElse(true)).toList();
      Timeline part = new Timeline(t.status(), priority(s, mine),
          mine.stream().mapToDouble(Observation::slewSeconds).sum(), null, mine, open);
      out.add(new ResourcePlan(r, s.forResource(r), part, names.get(r.id())));
    }
    return out;
  }

  /** The resource's id. */
  public String id() {
    return resource.id();
  }

  /**
   * {@code chart} titled with this resource's id, its former title (the scenario's name) moved to the first
   * subtitle; the same chart.
   */
  public JFreeChart titled(JFreeChart chart) {
    if (chart.getTitle() != null) {
      chart.addSubtitle(0, new TextTitle(chart.getTitle().getText(), new Font(Font.SANS_SERIF, Font.PLAIN, 13)));
    }
    chart.setTitle(id());
    return chart;
  }

  /**
   * The priority {@code observations} collect: each its request's priority, or for a flexible request the
   * value the observation carries (the rule the validator checks the timeline's total by); 0 for an unknown id.
   */
  public static double priority(Scenario s, List<Observation> observations) {
    double sum = 0;
    for (Observation o : observations) {
      sum += s.request(o.id()).map(r -> r.priority() != null ? r.priority() : o.value() != null ? o.value() : 0.0)
          .orElse(0.0);
    }
    return sum;
  }
}
