package dev.sequencer.charts;

import dev.sequencer.io.WindowsFile.ResourceWindows;
import dev.sequencer.model.Group;
import dev.sequencer.model.Observation;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.Paint;
import java.awt.Stroke;
import java.awt.geom.Line2D;
import java.awt.geom.Rectangle2D;
import java.text.SimpleDateFormat;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TimeZone;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItem;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.annotations.AbstractXYAnnotation;
import org.jfree.chart.annotations.XYBoxAnnotation;
import org.jfree.chart.axis.DateAxis;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.CrosshairState;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.Marker;
import org.jfree.chart.plot.Plot;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.PlotRenderingInfo;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.StandardXYBarPainter;
import org.jfree.chart.renderer.xy.XYBarRenderer;
import org.jfree.chart.renderer.xy.XYItemRendererState;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.text.TextUtils;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYDataset;
import org.jfree.data.xy.XYIntervalSeries;
import org.jfree.data.xy.XYIntervalSeriesCollection;

/**
 * The plan against time: one row per scheduled request in start order (its visits side by side on it) (optionally the unscheduled ones
 * below), its visibility windows as light bands, the observation as a dark bar and the slew/settle
 * before it in orange; at a ground site, daylight and twilight (Sun above the scenario's darkness limit,
 * else above -12 deg) shaded. Time axis in UTC, optionally local time and local sidereal time below it.
 * Row labels carry "!" for a required request and the priority ("R3 ! p5"); unscheduled rows their reason.
 *
 * <p>With several resources (format addition A6) the rows come in one lane group per resource, in the
 * scenario's file order: a header row labelled with the resource id and its counts, then that resource's
 * observations in start order, each with that resource's windows, on a tinted band shaded by the Sun at that
 * resource's site with its own darkness limit; the unscheduled rows (when included) follow the groups, with the
 * windows of every resource. In the SVG each band is a group {@code <g class="lane-group" data-resource="…">},
 * its label one {@code <g class="lane-label" data-resource="…">} and each observation bar one
 * {@code <g class="observation" data-request="…" data-resource="…">}.
 *
 * <p>Groups (format addition A5): the scheduled members of each group are linked in start order by a thin
 * dashed line from the end of one member's bar to the start of the next member's, across rows and lane groups,
 * the group id written once beside the first link; in the SVG each group's links and label are one group
 * {@code <g class="group-link" data-group="…">}. A group with fewer than two members scheduled has no link.
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
  /** Lane-group bands, alternating. */
  private static final Color[] LANE_GROUP = {new Color(205, 215, 235, 110), new Color(215, 232, 205, 110)};
  private static final Color LABEL_BACKGROUND = new Color(255, 255, 255, 190);
  private static final Color CLEAR = new Color(0, 0, 0, 0);
  private static final Color GROUP_LINK = new Color(128, 40, 150);
  private static final BasicStroke GROUP_LINK_STROKE = new BasicStroke(1.5f, BasicStroke.CAP_BUTT,
      BasicStroke.JOIN_MITER, 4f, new float[] {5f, 3f}, 0f);
  private static final Font GROUP_LINK_FONT = new Font(Font.SANS_SERIF, Font.BOLD, 11);
  private static final Font TICK_FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 12);
  private static final Font LABEL_FONT = new Font(Font.SANS_SERIF, Font.BOLD, 14);
  private static final Font GROUP_FONT = new Font(Font.SANS_SERIF, Font.BOLD, 13);

  private TimelineChart() {}

  /**
   * Picture height for this plan, pixels: a frame plus one row per drawn request (and one header row per
   * resource, A6), plus the local and sidereal time axes when {@code axes} is not null.
   */
  public static int heightPx(Scenario s, Timeline t, boolean includeUnscheduled, TimeAxes axes) {
    return FRAME_PX + ROW_PX * Math.max(4, Rows.of(s, t, includeUnscheduled).keys().size()) + (axes == null ? 0 : 110);
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
   * {@code windows} are the one observer's (with several resources only the unscheduled rows can use them:
   * {@link #createByResource} gives each lane group its resource's own).
   */
  public static JFreeChart create(PlanGeometry geometry, List<RequestWindows> windows, Timeline timeline,
      boolean includeUnscheduled, Map<String, String> reasons, TimeAxes axes) {
    return draw(geometry, List.of(new WindowsOf(null, windows)), timeline, includeUnscheduled, reasons, axes);
  }

  /**
   * The chart of a plan with several resources (A6), in lane groups, each observation row with the windows of
   * its own resource ({@code windows}, one entry per resource); otherwise as {@link #create}.
   */
  public static JFreeChart createByResource(PlanGeometry geometry, List<ResourceWindows> windows, Timeline timeline,
      boolean includeUnscheduled, Map<String, String> reasons, TimeAxes axes) {
    return draw(geometry, windows.stream().map(w -> new WindowsOf(w.resource(), w.windows())).toList(), timeline,
        includeUnscheduled, reasons, axes);
  }

  /** Windows of one resource ({@code null}: of the one observer, or of every resource alike). */
  private record WindowsOf(String resource, List<RequestWindows> windows) {}

  /**
   * A row: a request's row in the lane group of {@code resource} (null with one observer, and for the
   * unscheduled rows), or with {@code id} null the group's header row.
   */
  private record RowKey(String resource, String id, boolean scheduled) {}

  /** One lane group (A6): its resource (null when observations name none), header row, last row, observations. */
  private record LaneGroup(String resource, int header, int last, List<Observation> observations) {}

  /** The rows of a chart, top to bottom, and its lane groups (none with one observer). */
  private record Rows(List<RowKey> keys, Map<RowKey, Integer> rowOf, List<LaneGroup> groups) {
    static Rows of(Scenario s, Timeline t, boolean includeUnscheduled) {
      List<RowKey> keys = new ArrayList<>();
      List<LaneGroup> groups = new ArrayList<>();
      if (s.hasResources()) {
        // The scenario's resources in file order, then any other resource the timeline names (a timeline that
        // fails its check still gets every observation drawn).
        Set<String> names = new LinkedHashSet<>();
        s.resources().forEach(r -> names.add(r.id()));
        t.observations().forEach(o -> names.add(o.resource()));
        for (String res : names) {
          List<Observation> mine = t.observations().stream().filter(o -> Objects.equals(res, o.resource())).toList();
          int header = keys.size();
          keys.add(new RowKey(res, null, true));
          // One row per request: the visits of a request (A4) side by side on it.
          mine.stream().map(Observation::id).distinct().forEach(id -> keys.add(new RowKey(res, id, true)));
          groups.add(new LaneGroup(res, header, keys.size() - 1, mine));
        }
      } else {
        t.observations().stream().map(Observation::id).distinct().forEach(id -> keys.add(new RowKey(null, id, true)));
      }
      if (includeUnscheduled) {
        t.unscheduled().forEach(u -> keys.add(new RowKey(null, u.id(), false)));
      }
      Map<RowKey, Integer> rowOf = new HashMap<>();
      for (int i = 0; i < keys.size(); i++) {
        rowOf.put(keys.get(i), i);
      }
      return new Rows(keys, rowOf, groups);
    }

    /** The row of {@code o}. */
    int of(Scenario s, Observation o) {
      return rowOf.get(new RowKey(s.hasResources() ? o.resource() : null, o.id(), true));
    }
  }

  private static JFreeChart draw(PlanGeometry geometry, List<WindowsOf> windows, Timeline timeline,
      boolean includeUnscheduled, Map<String, String> reasons, TimeAxes axes) {
    ChartFiles.headless();
    Scenario s = geometry.scenario();
    Rows rows = Rows.of(s, timeline, includeUnscheduled);
    XYIntervalSeries obs = new XYIntervalSeries("observation");
    XYIntervalSeries slews = new XYIntervalSeries("slew and settle");
    XYIntervalSeries vis = new XYIntervalSeries("visibility window");
    Map<Integer, Map<String, String>> obsTags = new HashMap<>(); // by row; with lane groups only
    for (Observation o : timeline.observations()) {
      int row = rows.of(s, o);
      add(obs, row, 0.32, o.start(), o.end());
      if (!rows.groups().isEmpty()) {
        obsTags.put(row, Map.of("class", "observation", "data-request", o.id(), "data-resource",
            o.resource() == null ? "" : o.resource()));
      }
      if (o.slewSeconds() > 0) {
        add(slews, row, 0.32, o.start().minusMillis(Math.round(o.slewSeconds() * 1000)), o.start());
      }
    }
    for (WindowsOf source : windows) {
      for (RequestWindows w : source.windows()) {
        // its row in the source's lane group (the one observer's row), and its unscheduled row when drawn
        for (RowKey k : List.of(new RowKey(source.resource(), w.id(), true), new RowKey(null, w.id(), false))) {
          Integer row = rows.rowOf().get(k);
          if (row == null) {
            continue;
          }
          for (TimeWindow tw : w.intervals()) {
            add(vis, row, 0.45, tw.start(), tw.end());
          }
        }
      }
    }
    XYPlot plot = new XYPlot();
    plot.setOrientation(PlotOrientation.HORIZONTAL);
    // Dataset 0 is drawn last (on top) under the default reverse rendering order.
    TaggedBars observed = new TaggedBars(obsTags);
    plot.setDataset(0, collection(obs));
    plot.setRenderer(0, bars(observed, OBSERVATION));
    plot.setDataset(1, collection(slews));
    plot.setRenderer(1, bars(new XYBarRenderer(), TRANSITION));
    plot.setDataset(2, collection(vis));
    XYBarRenderer windowBars = bars(new XYBarRenderer(), WINDOW);
    plot.setRenderer(2, windowBars);

    Map<String, String> why = new HashMap<>();
    timeline.unscheduled().forEach(u -> why.put(u.id(), reasons.getOrDefault(u.id(), u.reason())));
    String[] labels = rows.keys().stream().map(k -> k.id() == null ? "" : label(s, k.id())
        + (k.scheduled() ? "" : " \u2014 not scheduled: " + shorten(why.get(k.id())))).toArray(String[]::new);
    SymbolAxis rowAxis = new SymbolAxis(null, labels.length == 0 ? new String[] {""} : labels);
    rowAxis.setInverted(true);
    rowAxis.setGridBandsVisible(true);
    rowAxis.setTickLabelFont(TICK_FONT);
    rowAxis.setRange(-0.6, Math.max(0.6, rows.keys().size() - 0.4));
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
      for (ValueAxis a : new ValueAxis[] {
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

    String shading = rows.groups().isEmpty() ? sunWords(shadeSun(geometry, (from, to, color) -> marker(plot, from, to,
        color))) : laneGroups(plot, observed, windowBars, geometry, rows);
    boolean linked = groupLinks(plot, s, timeline, rows);

    JFreeChart chart = new JFreeChart(title(s), new Font(Font.SANS_SERIF, Font.BOLD, 18), plot, true);
    chart.setBackgroundPaint(Color.WHITE);
    chart.getLegend().setItemFont(TICK_FONT);
    chart.getLegend().setPosition(RectangleEdge.BOTTOM);
    if (linked) {
      LegendItemCollection items = plot.getLegendItems();
      items.add(new LegendItem("group (members in start order)", null, null, null, new Line2D.Double(-8, 0, 8, 0),
          GROUP_LINK_STROKE, GROUP_LINK));
      plot.setFixedLegendItems(items);
    }
    String sub = String.format(Locale.ROOT, "%s, %d scheduled, %d not; priority %.1f, bound %s, slew total %.0f s%s%s",
        timeline.status(), timeline.observations().size(), timeline.unscheduled().size(), timeline.priority(),
        timeline.bound() == null ? "-" : String.format(Locale.ROOT, "%.1f", timeline.bound()), timeline.slewSeconds(),
        rows.groups().isEmpty() ? "" : "; " + s.resources().size() + " resources", shading.isEmpty() ? "" : "; " + shading);
    chart.addSubtitle(new TextTitle(sub, new Font(Font.SANS_SERIF, Font.PLAIN, 13)));
    return chart;
  }

  /**
   * Draws the lane groups (A6): each a tinted band over its rows labelled with the resource id and its counts,
   * shaded by the Sun at its resource's site; returns the legend sentence of the shading ("" without any site).
   */
  private static String laneGroups(XYPlot plot, TaggedBars observed, XYBarRenderer background, PlanGeometry geometry,
      Rows rows) {
    Scenario s = geometry.scenario();
    Set<String> limits = new LinkedHashSet<>();
    for (int i = 0; i < rows.groups().size(); i++) {
      LaneGroup gr = rows.groups().get(i);
      double lo = gr.header() - 0.5;
      double hi = gr.last() + 0.5;
      String resource = gr.resource() == null ? "" : gr.resource();
      IntervalMarker band = new IntervalMarker(lo, hi, LANE_GROUP[i % LANE_GROUP.length]);
      observed.tag(band, Map.of("class", "lane-group", "data-resource", resource));
      plot.addDomainMarker(0, band, Layer.BACKGROUND);
      // The label is a second, clear marker in front, so that the Sun shading over the band does not cover it.
      IntervalMarker label = new IntervalMarker(lo, hi, CLEAR);
      label.setLabel(String.format(Locale.ROOT, "%s \u2014 %d observation%s, priority %s, slew total %.0f s",
          gr.resource() == null ? "no resource" : gr.resource(), gr.observations().size(),
          gr.observations().size() == 1 ? "" : "s", number(ResourcePlan.priority(s, gr.observations())),
          gr.observations().stream().mapToDouble(Observation::slewSeconds).sum()));
      label.setLabelFont(GROUP_FONT);
      label.setLabelAnchor(RectangleAnchor.TOP_LEFT);
      label.setLabelTextAnchor(TextAnchor.TOP_LEFT);
      label.setLabelBackgroundColor(LABEL_BACKGROUND);
      observed.tag(label, Map.of("class", "lane-label", "data-resource", resource));
      plot.addDomainMarker(0, label, Layer.FOREGROUND);
      PlanGeometry here = gr.resource() == null ? null : geometry.forResource(gr.resource());
      if (here != null && here != geometry) {
        // The box runs from x0 = hi to x1 = lo: on the inverted row axis that gives it a positive height.
        double limit = shadeSun(here, (from, to, color) -> background.addAnnotation(new XYBoxAnnotation(hi,
            from.toEpochMilli(), lo, to.toEpochMilli(), null, null, color), Layer.BACKGROUND));
        if (!Double.isNaN(limit)) {
          limits.add(String.format(Locale.ROOT, "%s %.0f\u00b0", gr.resource(), limit));
        }
      }
    }
    return limits.isEmpty() ? "" : "shaded: Sun above each resource's darkness limit (" + String.join(", ", limits)
        + "; darker: above 0\u00b0)";
  }
  /**
   * Adds the links of every group (A5) with at least two members scheduled: its members' observations in start
   * order, one link between each two consecutive ones of different members (visits of one member share a row and
   * are not linked); returns whether any link was drawn.
   */
  private static boolean groupLinks(XYPlot plot, Scenario s, Timeline timeline, Rows rows) {
    boolean any = false;
    for (Group gr : s.groups()) {
      List<Observation> members = timeline.observations().stream().filter(o -> gr.members().contains(o.id()))
          .sorted(Comparator.comparing(Observation::start)).toList();
      List<double[]> links = new ArrayList<>();
      for (int i = 1; i < members.size(); i++) {
        Observation from = members.get(i - 1);
        Observation to = members.get(i);
        if (!from.id().equals(to.id())) {
          links.add(new double[] {rows.of(s, from), from.end().toEpochMilli(), rows.of(s, to),
              to.start().toEpochMilli()});
        }
      }
      if (!links.isEmpty()) {
        plot.addAnnotation(new GroupLink(gr.id(), links));
        any = true;
      }
    }
    return any;
  }

  /**
   * The links of one group (A5) on the horizontal timeline plot (rows down, time across): each a dashed line
   * from (row, epoch ms) to (row, epoch ms), the group id once above the first link's start, all inside one SVG
   * group {@code <g class="group-link" data-group="…">}.
   */
  private static final class GroupLink extends AbstractXYAnnotation {
    private final String group;
    /** Each link: {row from, epoch ms from, row to, epoch ms to}. */
    private final List<double[]> links;

    GroupLink(String group, List<double[]> links) {
      this.group = group;
      this.links = List.copyOf(links);
    }

    @Override
    public void draw(Graphics2D g2, XYPlot plot, Rectangle2D dataArea, ValueAxis domainAxis, ValueAxis rangeAxis,
        int rendererIndex, PlotRenderingInfo info) {
      RectangleEdge rowEdge = Plot.resolveDomainAxisLocation(plot.getDomainAxisLocation(), plot.getOrientation());
      RectangleEdge timeEdge = Plot.resolveRangeAxisLocation(plot.getRangeAxisLocation(), plot.getOrientation());
      Paint paint = g2.getPaint();
      Stroke stroke = g2.getStroke();
      Font font = g2.getFont();
      SvgGroups.around(g2, Map.of("class", "group-link", "data-group", group), () -> {
        g2.setPaint(GROUP_LINK);
        g2.setStroke(GROUP_LINK_STROKE);
        for (double[] l : links) {
          g2.draw(new Line2D.Double(rangeAxis.valueToJava2D(l[1], dataArea, timeEdge),
              domainAxis.valueToJava2D(l[0], dataArea, rowEdge), rangeAxis.valueToJava2D(l[3], dataArea, timeEdge),
              domainAxis.valueToJava2D(l[2], dataArea, rowEdge)));
        }
        double[] first = links.get(0);
        g2.setFont(GROUP_LINK_FONT);
        TextUtils.drawAlignedString(group, g2, (float) rangeAxis.valueToJava2D(first[1], dataArea, timeEdge) + 3,
            (float) domainAxis.valueToJava2D(first[0], dataArea, rowEdge) - 4, TextAnchor.BOTTOM_LEFT);
      });
      g2.setPaint(paint);
      g2.setStroke(stroke);
      g2.setFont(font);
    }
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

  private static void add(XYIntervalSeries series, int row, double halfHeight, Instant from, Instant to) {
    series.add(row, row - halfHeight, row + halfHeight, from.toEpochMilli(), from.toEpochMilli(), to.toEpochMilli());
  }

  private static XYIntervalSeriesCollection collection(XYIntervalSeries series) {
    XYIntervalSeriesCollection c = new XYIntervalSeriesCollection();
    c.addSeries(series);
    return c;
  }

  private static <R extends XYBarRenderer> R bars(R r, Color color) {
    r.setUseYInterval(true);
    r.setBarPainter(new StandardXYBarPainter());
    r.setShadowVisible(false);
    r.setDrawBarOutline(false);
    r.setSeriesPaint(0, color);
    r.setSeriesOutlineStroke(0, new BasicStroke(0.5f));
    return r;
  }

  /**
   * Bars that wrap each bar, and each lane-group band, in an SVG group naming what it shows (see {@link SvgGroups}).
   * Bars are found by their row: the series keeps its items sorted by row, not in the order they were added.
   */
  private static final class TaggedBars extends XYBarRenderer {
    private final Map<Integer, Map<String, String>> rowTags;
    private final Map<Marker, Map<String, String>> markerTags = new IdentityHashMap<>();

    /** {@code rowTags}: the group of the bar on each row (rows without one are drawn without a group). */
    TaggedBars(Map<Integer, Map<String, String>> rowTags) {
      this.rowTags = Map.copyOf(rowTags);
    }

    void tag(Marker marker, Map<String, String> attributes) {
      markerTags.put(marker, attributes);
    }

    @Override
    public void drawItem(Graphics2D g2, XYItemRendererState state, Rectangle2D dataArea, PlotRenderingInfo info,
        XYPlot plot, ValueAxis domainAxis, ValueAxis rangeAxis, XYDataset dataset, int series, int item,
        CrosshairState crosshairState, int pass) {
      SvgGroups.around(g2, rowTags.get((int) Math.round(dataset.getXValue(series, item))), () -> super.drawItem(g2,
          state, dataArea, info, plot, domainAxis, rangeAxis, dataset, series, item, crosshairState, pass));
    }

    @Override
    public void drawDomainMarker(Graphics2D g2, XYPlot plot, ValueAxis domainAxis, Marker marker,
        Rectangle2D dataArea) {
      SvgGroups.around(g2, markerTags.get(marker), () -> super.drawDomainMarker(g2, plot, domainAxis, marker,
          dataArea));
    }
  }

  /** Receives one shaded interval. */
  private interface Shade {
    void add(Instant from, Instant to, Color color);
  }

  /**
   * Hands {@code shade}, at a ground site, the times the Sun is above 0 deg (day) and above the darkness limit
   * (twilight), in the order they end; returns the darkness limit used, degrees, or NaN without a site. Edges are
   * good to one sample step.
   */
  private static double shadeSun(PlanGeometry g, Shade shade) {
    if (g.site() == null) {
      return Double.NaN;
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
        shade.add(dayFrom, at, DAY);
        dayFrom = null;
      }
      if (twi && twiFrom == null) {
        twiFrom = at;
      } else if (!twi && twiFrom != null) {
        shade.add(twiFrom, at, TWILIGHT);
        twiFrom = null;
      }
      if (last) {
        break;
      }
    }
    return limit;
  }

  /** The legend sentence of the shading below {@code limitDeg}, or "" for NaN (no site). */
  private static String sunWords(double limitDeg) {
    return Double.isNaN(limitDeg) ? ""
        : String.format(Locale.ROOT, "shaded: Sun above %.0f\u00b0 (darker: above 0\u00b0)", limitDeg);
  }

  private static void marker(XYPlot plot, Instant from, Instant to, Color color) {
    if (Duration.between(from, to).isZero()) {
      return;
    }
    IntervalMarker m = new IntervalMarker(from.toEpochMilli(), to.toEpochMilli(), color);
    plot.addRangeMarker(m, Layer.BACKGROUND);
  }
}
