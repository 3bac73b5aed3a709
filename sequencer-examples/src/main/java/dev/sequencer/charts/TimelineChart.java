package dev.sequencer.charts;

import dev.sequencer.model.Observation;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.text.SimpleDateFormat;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TimeZone;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.DateAxis;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.StandardXYBarPainter;
import org.jfree.chart.renderer.xy.XYBarRenderer;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.data.xy.XYIntervalSeries;
import org.jfree.data.xy.XYIntervalSeriesCollection;

/**
 * The plan against time: one row per scheduled request in start order (optionally the unscheduled ones
 * below), its visibility windows as light bands, the observation as a dark bar and the slew/settle
 * before it in orange; at a ground site, daylight and twilight (Sun above the scenario's darkness limit,
 * else above -12 deg) shaded. Time axis in UTC, optionally local time and local sidereal time below it.
 * Row labels carry "!" for a required request and the priority ("R3 ! p5"); unscheduled rows their reason.
 */
public final class TimelineChart {
  /** Width of the picture, pixels. */
  public static final int WIDTH_PX = 1400;
  private static final int ROW_PX = 18;
  private static final int FRAME_PX = 200;
  /** Sun elevation step for the shading, seconds (the Sun moves about 1.25 deg of elevation in 5 min). */
  private static final long SUN_STEP_S = 120;
  private static final Color OBSERVATION = new Color(31, 78, 160);
  private static final Color TRANSITION = new Color(235, 120, 20);
  private static final Color WINDOW = new Color(150, 200, 240);
  private static final Color DAY = new Color(250, 215, 120, 150);
  private static final Color TWILIGHT = new Color(250, 235, 190, 140);
  private static final Font TICK_FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 12);
  private static final Font LABEL_FONT = new Font(Font.SANS_SERIF, Font.BOLD, 14);

  private TimelineChart() {}

  /** Picture height for this plan, pixels: a frame plus one row per drawn request. */
  public static int heightPx(Timeline t, boolean includeUnscheduled) {
    return FRAME_PX + ROW_PX * Math.max(4, rows(t, includeUnscheduled).size());
  }

  /** Picture height with the local and sidereal time axes, pixels. */
  public static int heightPx(Timeline t, boolean includeUnscheduled, TimeAxes axes) {
    return heightPx(t, includeUnscheduled) + (axes == null ? 0 : 110);
  }

  /** The chart of {@code timeline} over the scenario's horizon, UTC only, the timeline's own reasons. */
  public static JFreeChart create(PlanGeometry geometry, List<RequestWindows> windows, Timeline timeline,
      boolean includeUnscheduled) {
    return create(geometry, windows, timeline, includeUnscheduled, Map.of(), null);
  }

  /**
   * The chart of {@code timeline}: each row labelled with the request id, "!" when required and its
   * priority; unscheduled rows (when included) say why, from {@code reasons} (id to words) or the
   * timeline's reason; {@code axes}, when not null, adds local time and local sidereal time below UTC.
   */
  public static JFreeChart create(PlanGeometry geometry, List<RequestWindows> windows, Timeline timeline,
      boolean includeUnscheduled, Map<String, String> reasons, TimeAxes axes) {
    ChartFiles.headless();
    Scenario s = geometry.scenario();
    List<String> rows = rows(timeline, includeUnscheduled);
    Map<String, Integer> rowOf = new HashMap<>();
    for (int i = 0; i < rows.size(); i++) {
      rowOf.put(rows.get(i), i);
    }
    XYIntervalSeries obs = new XYIntervalSeries("observation");
    XYIntervalSeries slews = new XYIntervalSeries("slew and settle");
    XYIntervalSeries vis = new XYIntervalSeries("visibility window");
    for (Observation o : timeline.observations()) {
      int row = rowOf.get(o.id());
      add(obs, row, 0.32, o.start(), o.end());
      if (o.slewSeconds() > 0) {
        add(slews, row, 0.32, o.start().minusMillis(Math.round(o.slewSeconds() * 1000)), o.start());
      }
    }
    for (RequestWindows w : windows) {
      Integer row = rowOf.get(w.id());
      if (row != null) {
        for (TimeWindow tw : w.intervals()) {
          add(vis, row, 0.45, tw.start(), tw.end());
        }
      }
    }
    XYPlot plot = new XYPlot();
    plot.setOrientation(PlotOrientation.HORIZONTAL);
    // Dataset 0 is drawn last (on top) under the default reverse rendering order.
    plot.setDataset(0, collection(obs));
    plot.setRenderer(0, bars(OBSERVATION));
    plot.setDataset(1, collection(slews));
    plot.setRenderer(1, bars(TRANSITION));
    plot.setDataset(2, collection(vis));
    plot.setRenderer(2, bars(WINDOW));

    Map<String, String> why = new HashMap<>();
    timeline.unscheduled().forEach(u -> why.put(u.id(), reasons.getOrDefault(u.id(), u.reason())));
    String[] labels = rows.stream().map(id -> label(s, id) + (rowOf.get(id) < timeline.observations().size() ? ""
        : " \u2014 not scheduled: " + shorten(why.get(id)))).toArray(String[]::new);
    SymbolAxis rowAxis = new SymbolAxis(null, labels.length == 0 ? new String[] {""} : labels);
    rowAxis.setInverted(true);
    rowAxis.setGridBandsVisible(true);
    rowAxis.setTickLabelFont(TICK_FONT);
    rowAxis.setRange(-0.6, Math.max(0.6, rows.size() - 0.4));
    plot.setDomainAxis(rowAxis);

    DateAxis timeAxis = new DateAxis("time (UTC)");
    timeAxis.setTimeZone(TimeZone.getTimeZone("UTC"));
    boolean multiDay = s.horizon().durationS() > 20 * 3600;
    SimpleDateFormat fmt = new SimpleDateFormat(multiDay ? "MM-dd HH:mm" : "HH:mm", Locale.ROOT);
    fmt.setTimeZone(TimeZone.getTimeZone("UTC"));
    timeAxis.setDateFormatOverride(fmt);
    timeAxis.setRange(s.horizon().start().toEpochMilli(), s.horizon().end().toEpochMilli());
    timeAxis.setTickLabelFont(TICK_FONT);
    timeAxis.setLabelFont(LABEL_FONT);
    plot.setRangeAxis(timeAxis);
    plot.setRangeAxisLocation(org.jfree.chart.axis.AxisLocation.TOP_OR_LEFT);
    if (axes != null) {
      int i = 1;
      for (org.jfree.chart.axis.ValueAxis a : new org.jfree.chart.axis.ValueAxis[] {
          axes.localAxis(s.horizon().start(), s.horizon().end(), multiDay),
          axes.siderealAxis(s.horizon().start(), s.horizon().end())}) {
        if (a != null) {
          a.setTickLabelFont(TICK_FONT);
          a.setLabelFont(LABEL_FONT);
          plot.setRangeAxis(i, a);
          plot.setRangeAxisLocation(i, org.jfree.chart.axis.AxisLocation.BOTTOM_OR_RIGHT);
          i++;
        }
      }
    }
    plot.setRangeGridlinePaint(new Color(160, 160, 160));
    plot.setBackgroundPaint(Color.WHITE);
    plot.setDomainGridlinesVisible(false);

    String shading = shadeSun(plot, geometry);

    JFreeChart chart = new JFreeChart(title(s), new Font(Font.SANS_SERIF, Font.BOLD, 18), plot, true);
    chart.setBackgroundPaint(Color.WHITE);
    chart.getLegend().setItemFont(TICK_FONT);
    chart.getLegend().setPosition(RectangleEdge.BOTTOM);
    String sub = String.format(Locale.ROOT, "%s, %d scheduled, %d not; priority %.1f, bound %s, slew total %.0f s%s",
        timeline.status(), timeline.observations().size(), timeline.unscheduled().size(), timeline.priority(),
        timeline.bound() == null ? "-" : String.format(Locale.ROOT, "%.1f", timeline.bound()), timeline.slewSeconds(),
        shading.isEmpty() ? "" : "; " + shading);
    chart.addSubtitle(new TextTitle(sub, new Font(Font.SANS_SERIF, Font.PLAIN, 13)));
    return chart;
  }

  /** "R3 ! p5": the id, "!" for a required request, the priority. */
  static String label(Scenario s, String id) {
    return s.request(id).map(r -> id + (r.required() ? " !" : "") + (r.priority() == null ? "" : " p" + number(r.priority())))
        .orElse(id);
  }

  private static String number(double v) {
    return v == Math.rint(v) && Math.abs(v) < 1e9 ? Long.toString((long) v) : String.format(Locale.ROOT, "%.2f", v);
  }

  private static String shorten(String reason) {
    if (reason == null) {
      return "";
    }
    reason = reason.startsWith("not scheduled: ") ? reason.substring("not scheduled: ".length()) : reason;
    return reason.length() <= 70 ? reason : reason.substring(0, 67) + "...";
  }

  private static String title(Scenario s) {
    return s.name() == null ? "observing plan" : s.name();
  }

  /** Request ids, one per row: scheduled in start order, then (optionally) the unscheduled in file order. */
  private static List<String> rows(Timeline t, boolean includeUnscheduled) {
    List<String> ids = new ArrayList<>();
    t.observations().forEach(o -> ids.add(o.id()));
    if (includeUnscheduled) {
      t.unscheduled().stream().map(Unscheduled::id).forEach(ids::add);
    }
    return ids;
  }

  private static void add(XYIntervalSeries series, int row, double halfHeight, Instant from, Instant to) {
    series.add(row, row - halfHeight, row + halfHeight, from.toEpochMilli(), from.toEpochMilli(), to.toEpochMilli());
  }

  private static XYIntervalSeriesCollection collection(XYIntervalSeries series) {
    XYIntervalSeriesCollection c = new XYIntervalSeriesCollection();
    c.addSeries(series);
    return c;
  }

  private static XYBarRenderer bars(Color color) {
    XYBarRenderer r = new XYBarRenderer();
    r.setUseYInterval(true);
    r.setBarPainter(new StandardXYBarPainter());
    r.setShadowVisible(false);
    r.setDrawBarOutline(false);
    r.setSeriesPaint(0, color);
    r.setSeriesOutlineStroke(0, new BasicStroke(0.5f));
    return r;
  }

  /**
   * Shades, at a ground site, the times the Sun is above 0 deg (day) and above the darkness limit
   * (twilight); returns the legend sentence, or "" without a site. Edges are good to one sample step.
   */
  private static String shadeSun(XYPlot plot, PlanGeometry g) {
    if (g.site() == null) {
      return "";
    }
    Double limitOrNull = g.scenario().constraints().sunElevationMaxDeg();
    double limit = limitOrNull == null ? -12 : limitOrNull;
    Instant t0 = g.scenario().horizon().start();
    Instant t1 = g.scenario().horizon().end();
    Instant dayFrom = null;
    Instant twiFrom = null;
    for (Instant t = t0; !t.isAfter(t1.plusSeconds(SUN_STEP_S)); t = t.plusSeconds(SUN_STEP_S)) {
      Instant at = t.isAfter(t1) ? t1 : t;
      boolean last = !at.isBefore(t1);
      double el = g.sunElevationDeg(at);
      boolean day = el > 0 && !last;
      boolean twi = el > limit && !last;
      if (day && dayFrom == null) {
        dayFrom = at;
      } else if (!day && dayFrom != null) {
        marker(plot, dayFrom, at, DAY);
        dayFrom = null;
      }
      if (twi && twiFrom == null) {
        twiFrom = at;
      } else if (!twi && twiFrom != null) {
        marker(plot, twiFrom, at, TWILIGHT);
        twiFrom = null;
      }
      if (last) {
        break;
      }
    }
    return String.format(Locale.ROOT, "shaded: Sun above %.0f\u00b0 (darker: above 0\u00b0)", limit);
  }

  private static void marker(XYPlot plot, Instant from, Instant to, Color color) {
    if (Duration.between(from, to).isZero()) {
      return;
    }
    IntervalMarker m = new IntervalMarker(from.toEpochMilli(), to.toEpochMilli(), color);
    plot.addRangeMarker(m, Layer.BACKGROUND);
  }
}
