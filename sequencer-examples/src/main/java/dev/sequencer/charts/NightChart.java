package dev.sequencer.charts;

import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import dev.sequencer.visibility.SkyValues;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.text.SimpleDateFormat;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.TimeZone;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.DateAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * The night at a ground site against time: the observed elevation of every scheduled target (thin over the
 * night, thick while it is observed, numbered in plan order), the Sun's and the Moon's elevation, the
 * Moon's illuminated fraction (right axis, per cent), airmass 1.5, 2 and 3 as dashed lines; UTC below,
 * local time and local sidereal time above. Every value comes from {@link SkyValues}.
 */
public final class NightChart {
  /** Width and height of the picture, pixels. */
  public static final int WIDTH_PX = 1400;
  public static final int HEIGHT_PX = 640;
  /** Most targets drawn as whole-night curves (more would be a grey blur); beyond, only the observed parts. */
  static final int MAX_CURVES = 60;
  private static final Font TICK_FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 12);
  private static final Font LABEL_FONT = new Font(Font.SANS_SERIF, Font.BOLD, 13);
  private static final Color CURVE = new Color(150, 185, 225);
  private static final Color OBSERVED = new Color(31, 78, 160);
  private static final Color MOON = new Color(90, 90, 90);
  private static final Color SUN = new Color(230, 150, 0);
  private static final Color ILLUMINATION = new Color(150, 90, 170);

  private NightChart() {}

  /** The sampling step over {@code [from, to]}, seconds: 2 min, coarser on long horizons (about 1,500 samples). */
  static long stepS(Instant from, Instant to) {
    long span = to.getEpochSecond() - from.getEpochSecond();
    return Math.max(120, span / 1500);
  }

  /** The chart; requires a ground site ({@code sky.atGroundSite()}). */
  public static JFreeChart create(Scenario s, Timeline t, SkyValues sky, TimeAxes axes) {
    if (!sky.atGroundSite()) {
      throw new IllegalArgumentException("the night chart needs a ground site");
    }
    ChartFiles.headless();
    Instant from = s.horizon().start();
    Instant to = s.horizon().end();
    long step = stepS(from, to);
    XYSeriesCollection elevations = new XYSeriesCollection();
    XYLineAndShapeRenderer er = new XYLineAndShapeRenderer(true, false);
    er.setDrawSeriesLineAsPath(true); // one SVG path per series, not one element per segment (keeps the report small)
    XYSeries sun = new XYSeries("Sun elevation", false);
    XYSeries moon = new XYSeries("Moon elevation", false);
    XYSeries illum = new XYSeries("Moon illuminated [%] (right axis)", false);
    for (Instant at = from; !at.isAfter(to); at = at.plusSeconds(step)) {
      long ms = at.toEpochMilli();
      sun.add(ms, clampLow(sky.sunElevationDeg(at)));
      moon.add(ms, clampLow(sky.moonElevationDeg(at)));
      illum.add(ms, 100 * sky.moonIlluminatedFraction(at));
    }
    elevations.addSeries(sun);
    er.setSeriesPaint(0, SUN);
    er.setSeriesStroke(0, new BasicStroke(2f));
    elevations.addSeries(moon);
    er.setSeriesPaint(1, MOON);
    er.setSeriesStroke(1, new BasicStroke(2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {7f, 4f}, 0f));
    XYSeries observed = new XYSeries("observed (thick), numbered in order", false);
    boolean curves = t.observations().size() <= MAX_CURVES;
    XYSeries night = new XYSeries("scheduled target elevation", false);
    List<XYTextAnnotation> numbers = new java.util.ArrayList<>();
    int k = 0;
    for (Observation o : t.observations()) {
      k++;
      Optional<Request> r = s.request(o.id());
      if (r.isEmpty()) {
        continue;
      }
      if (curves) {
        for (Instant at = from; !at.isAfter(to); at = at.plusSeconds(step)) {
          double el = sky.elevationDeg(r.get(), at);
          night.add(at.toEpochMilli(), el > 0 ? el : Double.NaN);
        }
        night.add(Double.NaN, Double.NaN);
      }
      long obsStep = Math.max(10, Math.min(step, (long) (o.durationS() / 10)));
      for (Instant at = o.start(); ; at = at.plusSeconds(obsStep)) {
        Instant when = at.isAfter(o.end()) ? o.end() : at;
        observed.add(when.toEpochMilli(), sky.elevationDeg(r.get(), when));
        if (!when.isBefore(o.end())) {
          break;
        }
      }
      observed.add(Double.NaN, Double.NaN);
      XYTextAnnotation n = new XYTextAnnotation(Integer.toString(k), o.start().toEpochMilli(),
          Math.min(88, sky.elevationDeg(r.get(), o.start()) + 2.5));
      n.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 10));
      n.setTextAnchor(TextAnchor.BOTTOM_LEFT);
      numbers.add(n);
    }
    if (curves) {
      elevations.addSeries(night);
      er.setSeriesPaint(elevations.getSeriesCount() - 1, CURVE);
      er.setSeriesStroke(elevations.getSeriesCount() - 1, new BasicStroke(1f));
    }
    elevations.addSeries(observed);
    er.setSeriesPaint(elevations.getSeriesCount() - 1, OBSERVED);
    er.setSeriesStroke(elevations.getSeriesCount() - 1, new BasicStroke(3.5f));

    DateAxis utc = new DateAxis("time (UTC)");
    utc.setTimeZone(TimeZone.getTimeZone("UTC"));
    boolean multiDay = s.horizon().durationS() > 20 * 3600;
    SimpleDateFormat fmt = new SimpleDateFormat(multiDay ? "MM-dd HH:mm" : "HH:mm", Locale.ROOT);
    fmt.setTimeZone(TimeZone.getTimeZone("UTC"));
    utc.setDateFormatOverride(fmt);
    utc.setRange(from.toEpochMilli(), to.toEpochMilli());
    NumberAxis elAxis = new NumberAxis("observed elevation [deg]");
    elAxis.setRange(0, 90);
    elAxis.setTickUnit(new NumberTickUnit(15));
    XYPlot plot = new XYPlot(elevations, utc, elAxis, er);
    plot.setBackgroundPaint(Color.WHITE);
    plot.setDomainGridlinePaint(new Color(190, 190, 190));
    plot.setRangeGridlinePaint(new Color(190, 190, 190));
    int axis = 1;
    for (ValueAxis a : new ValueAxis[] {axes.localAxis(from, to, multiDay), axes.siderealAxis(from, to)}) {
      if (a != null) {
        style(a);
        plot.setDomainAxis(axis, a);
        plot.setDomainAxisLocation(axis, AxisLocation.TOP_OR_LEFT);
        axis++;
      }
    }
    NumberAxis pct = new NumberAxis("Moon illuminated [%]");
    pct.setRange(0, 100);
    style(pct);
    plot.setRangeAxis(1, pct);
    plot.setRangeAxisLocation(1, AxisLocation.BOTTOM_OR_RIGHT);
    XYSeriesCollection il = new XYSeriesCollection(illum);
    plot.setDataset(1, il);
    plot.mapDatasetToRangeAxis(1, 1);
    XYLineAndShapeRenderer ir = new XYLineAndShapeRenderer(true, false);
    ir.setDrawSeriesLineAsPath(true);
    ir.setSeriesPaint(0, ILLUMINATION);
    ir.setSeriesStroke(0, new BasicStroke(1.5f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {2f, 3f}, 0f));
    plot.setRenderer(1, ir);
    for (double x : new double[] {1.5, 2, 3}) {
      ValueMarker m = new ValueMarker(SkyValues.elevationForAirmassDeg(x), new Color(120, 120, 120),
          new BasicStroke(0.8f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {3f, 3f}, 0f));
      m.setLabel(String.format(Locale.ROOT, "airmass %s", x == Math.rint(x) ? Integer.toString((int) x) : Double.toString(x)));
      m.setLabelFont(TICK_FONT);
      m.setLabelAnchor(RectangleAnchor.TOP_LEFT);
      m.setLabelTextAnchor(TextAnchor.BOTTOM_LEFT);
      plot.addRangeMarker(m, Layer.BACKGROUND);
    }
    numbers.forEach(plot::addAnnotation);
    style(utc);
    style(elAxis);
    JFreeChart chart = new JFreeChart(s.name() == null ? "the night" : s.name(), new Font(Font.SANS_SERIF, Font.BOLD, 18),
        plot, true);
    chart.setBackgroundPaint(Color.WHITE);
    chart.getLegend().setItemFont(TICK_FONT);
    chart.getLegend().setPosition(RectangleEdge.BOTTOM);
    Instant mid = from.plusSeconds((to.getEpochSecond() - from.getEpochSecond()) / 2);
    chart.addSubtitle(new TextTitle(String.format(Locale.ROOT,
        "elevations at the site, refracted as the constraints use them; Moon %.0f%% illuminated at %s UTC",
        100 * sky.moonIlluminatedFraction(mid), mid.toString().substring(11, 16)), new Font(Font.SANS_SERIF, Font.PLAIN, 13)));
    return chart;
  }

  private static double clampLow(double el) {
    return el < -5 ? Double.NaN : el;
  }

  private static void style(ValueAxis a) {
    a.setTickLabelFont(TICK_FONT);
    a.setLabelFont(LABEL_FONT);
  }
}
