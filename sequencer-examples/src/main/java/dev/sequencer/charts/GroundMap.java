package dev.sequencer.charts;

import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.visibility.SkyValues;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.geom.Ellipse2D;
import java.time.Instant;
import java.util.Locale;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * For a spacecraft imaging the Earth: a longitude/latitude map (plate carrée) with the ground track over
 * the horizon (the point below the spacecraft, from {@link SkyValues}), the track during each observation
 * thick, and the Earth-point targets, scheduled (numbered in order) and not. No coastlines are drawn: the
 * map carries no geographic data, only a 30-degree graticule.
 */
public final class GroundMap {
  /** Width and height of the picture, pixels (2:1 map plus title and legend). */
  public static final int WIDTH_PX = 1400;
  public static final int HEIGHT_PX = 800;
  private static final Font TICK_FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 12);

  private GroundMap() {}

  /** True when the scenario has an orbiting observer and at least one Earth-point target. */
  public static boolean applies(Scenario s, SkyValues sky) {
    return sky.inOrbit() && s.requests().stream().anyMatch(r -> r.target() instanceof EarthPoint);
  }

  /** The map. */
  public static JFreeChart create(Scenario s, Timeline t, SkyValues sky) {
    ChartFiles.headless();
    Instant from = s.horizon().start();
    Instant to = s.horizon().end();
    long step = Math.max(30, (to.getEpochSecond() - from.getEpochSecond()) / 4000);
    XYSeries track = new XYSeries("ground track", false);
    addTrack(track, sky, from, to, step);
    XYSeries observed = new XYSeries("track while observing", false);
    XYSeries done = new XYSeries("Earth point, scheduled (numbered in order)", false);
    XYSeries not = new XYSeries("Earth point, not scheduled", false);
    XYPlot plot = new XYPlot();
    int k = 0;
    for (Observation o : t.observations()) {
      k++;
      addTrack(observed, sky, o.start(), o.end(), 5);
      observed.add(Double.NaN, Double.NaN);
      Request r = s.request(o.id()).orElse(null);
      if (r != null && r.target() instanceof EarthPoint ep) {
        done.add(ep.longitudeDeg(), ep.latitudeDeg());
        XYTextAnnotation a = new XYTextAnnotation(Integer.toString(k), ep.longitudeDeg() + 1.5, ep.latitudeDeg() + 1.5);
        a.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 10));
        a.setTextAnchor(TextAnchor.BOTTOM_LEFT);
        plot.addAnnotation(a);
      }
    }
    for (Unscheduled u : t.unscheduled()) {
      s.request(u.id()).filter(r -> r.target() instanceof EarthPoint).map(r -> (EarthPoint) r.target())
          .ifPresent(ep -> not.add(ep.longitudeDeg(), ep.latitudeDeg()));
    }
    XYSeriesCollection data = new XYSeriesCollection();
    data.addSeries(observed);
    data.addSeries(done);
    data.addSeries(not);
    data.addSeries(track);
    XYLineAndShapeRenderer r = new XYLineAndShapeRenderer();
    r.setDrawSeriesLineAsPath(true);
    r.setSeriesPaint(0, new Color(31, 78, 160));
    r.setSeriesStroke(0, new BasicStroke(4f));
    r.setSeriesShapesVisible(0, false);
    r.setSeriesPaint(1, new Color(31, 78, 160));
    r.setSeriesLinesVisible(1, false);
    r.setSeriesShape(1, new Ellipse2D.Double(-4, -4, 8, 8));
    r.setSeriesPaint(2, new Color(150, 150, 150));
    r.setSeriesLinesVisible(2, false);
    r.setSeriesShape(2, new Ellipse2D.Double(-3, -3, 6, 6));
    r.setSeriesPaint(3, new Color(235, 120, 20));
    r.setSeriesStroke(3, new BasicStroke(1f));
    r.setSeriesShapesVisible(3, false);
    NumberAxis lon = new NumberAxis("longitude [deg east]");
    lon.setRange(-180, 180);
    lon.setTickUnit(new NumberTickUnit(30));
    NumberAxis lat = new NumberAxis("geodetic latitude [deg]");
    lat.setRange(-90, 90);
    lat.setTickUnit(new NumberTickUnit(30));
    lon.setTickLabelFont(TICK_FONT);
    lat.setTickLabelFont(TICK_FONT);
    plot.setDataset(data);
    plot.setRenderer(r);
    plot.setDomainAxis(lon);
    plot.setRangeAxis(lat);
    plot.setBackgroundPaint(new Color(245, 248, 252));
    plot.setDomainGridlinePaint(new Color(170, 170, 170));
    plot.setRangeGridlinePaint(new Color(170, 170, 170));
    JFreeChart chart = new JFreeChart(s.name() == null ? "ground map" : s.name(), new Font(Font.SANS_SERIF, Font.BOLD, 18),
        plot, true);
    chart.setBackgroundPaint(Color.WHITE);
    chart.getLegend().setItemFont(TICK_FONT);
    chart.getLegend().setPosition(RectangleEdge.BOTTOM);
    chart.addSubtitle(new TextTitle(String.format(Locale.ROOT,
        "ground track every %d s over the horizon; no coastlines (the map carries no geographic data); %d observations",
        step, t.observations().size()), new Font(Font.SANS_SERIF, Font.PLAIN, 13)));
    return chart;
  }

  private static void addTrack(XYSeries series, SkyValues sky, Instant from, Instant to, long stepS) {
    double prevLon = Double.NaN;
    for (Instant at = from; ; at = at.plusSeconds(stepS)) {
      Instant when = at.isAfter(to) ? to : at;
      double[] ll = sky.subObserverLatLonDeg(when);
      if (!Double.isNaN(prevLon) && Math.abs(ll[1] - prevLon) > 180) {
        series.add(Double.NaN, Double.NaN); // crosses the antimeridian: break the line
      }
      series.add(ll[1], ll[0]);
      prevLon = ll[1];
      if (!when.isBefore(to)) {
        break;
      }
    }
  }
}
