package dev.sequencer.charts;

import dev.sequencer.campaign.CampaignResult;
import dev.sequencer.campaign.NightRecord;
import dev.sequencer.campaign.SweepRow;
import java.awt.BasicStroke;
import java.awt.Color;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.category.BoxAndWhiskerRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.statistics.DefaultBoxAndWhiskerCategoryDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * The pictures of seasons and sweeps: the programme's completion over the season (collected value, solid,
 * and remaining value, dashed, against the night; one colour per strategy), and one box plot per sweep axis
 * (priority, or a campaign's collected value, per value of the axis).
 */
public final class SeasonCharts {
  public static final int WIDTH_PX = 1100;
  public static final int HEIGHT_PX = 650;
  private static final Color[] COLOURS = {new Color(31, 78, 160), new Color(200, 80, 20), new Color(40, 140, 60),
      new Color(130, 60, 160), new Color(120, 120, 120)};

  private SeasonCharts() {}

  /** Collected and remaining value against the night, one pair of lines per strategy. */
  public static JFreeChart completion(List<CampaignResult> results, String title) {
    ChartFiles.headless();
    XYSeriesCollection data = new XYSeriesCollection();
    for (CampaignResult r : results) {
      XYSeries collected = new XYSeries(r.strategy() + " collected");
      XYSeries remaining = new XYSeries(r.strategy() + " remaining");
      collected.add(0, 0);
      remaining.add(0, r.programmeValue());
      for (NightRecord n : r.nights()) {
        collected.add(n.night(), n.collectedTotal());
        remaining.add(n.night(), n.remaining());
      }
      data.addSeries(collected);
      data.addSeries(remaining);
    }
    XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer(true, false);
    for (int k = 0; k < results.size(); k++) {
      Color c = COLOURS[k % COLOURS.length];
      renderer.setSeriesPaint(2 * k, c);
      renderer.setSeriesPaint(2 * k + 1, c);
      renderer.setSeriesStroke(2 * k, new BasicStroke(2.5f));
      renderer.setSeriesStroke(2 * k + 1, new BasicStroke(2.0f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
          new float[] {8f, 6f}, 0f));
    }
    NumberAxis x = new NumberAxis("night");
    x.setStandardTickUnits(NumberAxis.createIntegerTickUnits());
    XYPlot plot = new XYPlot(data, x, new NumberAxis("programme value (priority units)"), renderer);
    plot.setBackgroundPaint(Color.WHITE);
    plot.setDomainGridlinePaint(Color.LIGHT_GRAY);
    plot.setRangeGridlinePaint(Color.LIGHT_GRAY);
    JFreeChart chart = new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
    chart.setBackgroundPaint(Color.WHITE);
    return chart;
  }

  /** One box per value of {@code axis}: the spread of the runs' priority (campaigns: collected value). */
  public static JFreeChart box(List<SweepRow> rows, String axis, String title) {
    ChartFiles.headless();
    Map<String, List<Double>> groups = new LinkedHashMap<>();
    for (SweepRow r : rows) {
      groups.computeIfAbsent(r.axisValue(axis), k -> new ArrayList<>()).add(r.priority());
    }
    DefaultBoxAndWhiskerCategoryDataset data = new DefaultBoxAndWhiskerCategoryDataset();
    groups.forEach((value, list) -> data.add(list, "priority", value));
    BoxAndWhiskerRenderer renderer = new BoxAndWhiskerRenderer();
    renderer.setSeriesPaint(0, COLOURS[0]);
    renderer.setMeanVisible(false);
    renderer.setMaxOutlierVisible(true);
    CategoryPlot plot = new CategoryPlot(data, new CategoryAxis(axis), new NumberAxis("priority collected"),
        renderer);
    plot.setBackgroundPaint(Color.WHITE);
    plot.setRangeGridlinePaint(Color.LIGHT_GRAY);
    JFreeChart chart = new JFreeChart(title, JFreeChart.DEFAULT_TITLE_FONT, plot, false);
    chart.setBackgroundPaint(Color.WHITE);
    return chart;
  }
}
