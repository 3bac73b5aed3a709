package dev.sequencer.charts;

import dev.sequencer.model.AzEl;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Observation;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYShapeAnnotation;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.CrosshairState;
import org.jfree.chart.plot.PlotRenderingInfo;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYItemRendererState;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * Where the plan points on the sky. At a ground site: an azimuth/elevation polar plot (zenith at the
 * centre, horizon on the outer circle, north up, east right as on a map seen from above) with the horizon
 * mask shaded, the elevation limit dashed, each observation's track and the slews between them, numbered in
 * order. For a spacecraft: an RA/Dec map (RA increasing to the left) with every target, the Sun and Moon
 * keep-out circles at the plan's midpoint and the slew path in order.
 *
 * <p>With several resources (format addition A6) each resource has its own chart ({@link #create(PlanGeometry,
 * ResourcePlan)}): its observer, its constraints, its observations only, the resource id in the title; in the SVG
 * each observation's marker is a group {@code <g class="observation-start" data-request="…" data-number="k">}.
 */
public final class SkyChart {
  /** Width and height of the picture, pixels. */
  public static final int WIDTH_PX = 1000;
  public static final int HEIGHT_PX = 1060; // title and legend take about 60 px: keeps the sky circular
  /** Track sample step during an observation, seconds. */
  private static final long TRACK_STEP_S = 30;
  private static final Font TICK_FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 13);
  private static final Font LABEL_FONT = new Font(Font.SANS_SERIF, Font.BOLD, 15);
  private static final Font NUMBER_FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 11);
  private static final Color PATH = new Color(31, 78, 160);
  private static final Color SLEW = new Color(235, 120, 20);

  private SkyChart() {}

  /** The sky chart of {@code timeline}: polar at a ground site, RA/Dec otherwise. */
  public static JFreeChart create(PlanGeometry geometry, Timeline timeline) {
    return create(geometry, timeline, false);
  }

  /**
   * The sky chart of one resource's share of a plan with several resources (A6), drawn from that resource's
   * observer ({@code geometry} is the whole scenario's, or already the resource's).
   */
  public static JFreeChart create(PlanGeometry geometry, ResourcePlan plan) {
    return plan.titled(create(geometry.forResource(plan.id()), plan.timeline(), true));
  }

  /** {@code tagged}: each observation's marker an SVG group naming the request and its number in order. */
  private static JFreeChart create(PlanGeometry geometry, Timeline timeline, boolean tagged) {
    ChartFiles.headless();
    JFreeChart chart = geometry.site() != null ? polar(geometry, timeline, tagged) : raDec(geometry, timeline, tagged);
    chart.setBackgroundPaint(Color.WHITE);
    if (chart.getLegend() != null) {
      chart.getLegend().setItemFont(TICK_FONT);
      chart.getLegend().setPosition(RectangleEdge.BOTTOM);
    }
    return chart;
  }

  // ---------------------------------------------------------------- ground site: az/el polar plot

  /** Projection: radius = 90 - elevation (zenith distance), north up, east right. */
  private static double px(double azDeg, double elDeg) {
    return (90 - elDeg) * Math.sin(Math.toRadians(azDeg));
  }

  private static double py(double azDeg, double elDeg) {
    return (90 - elDeg) * Math.cos(Math.toRadians(azDeg));
  }

  private static JFreeChart polar(PlanGeometry g, Timeline t, boolean tagged) {
    Scenario s = g.scenario();
    GroundSite site = g.site();
    XYSeries tracks = new XYSeries("observation track", false);
    XYSeries slews = new XYSeries("slew (end of one to start of next)", false);
    XYSeries starts = new XYSeries("observation start", false);
    List<Map<String, String>> startTags = new ArrayList<>();
    List<XYTextAnnotation> numbers = new ArrayList<>();
    AzEl previousEnd = null;
    int k = 0;
    int labelEvery = Math.max(1, t.observations().size() / 60);
    for (Observation o : t.observations()) {
      k++;
      Optional<Request> r = s.request(o.id());
      if (r.isEmpty() || g.azEl(r.get(), o.start()).isEmpty()) {
        continue;
      }
      AzEl start = g.azEl(r.get(), o.start()).get();
      if (previousEnd != null) {
        slews.add(px(previousEnd.azimuthDeg(), previousEnd.elevationDeg()), py(previousEnd.azimuthDeg(), previousEnd.elevationDeg()));
        slews.add(px(start.azimuthDeg(), start.elevationDeg()), py(start.azimuthDeg(), start.elevationDeg()));
        slews.add(Double.NaN, Double.NaN);
      }
      starts.add(px(start.azimuthDeg(), start.elevationDeg()), py(start.azimuthDeg(), start.elevationDeg()));
      startTags.add(tag(o, k));
      AzEl a = start;
      for (Instant at = o.start(); ; at = at.plusSeconds(TRACK_STEP_S)) {
        Instant when = at.isAfter(o.end()) ? o.end() : at;
        a = g.azEl(r.get(), when).get();
        tracks.add(px(a.azimuthDeg(), a.elevationDeg()), py(a.azimuthDeg(), a.elevationDeg()));
        if (!when.isBefore(o.end())) {
          break;
        }
      }
      tracks.add(Double.NaN, Double.NaN);
      previousEnd = a;
      if ((k - 1) % labelEvery == 0) {
        XYTextAnnotation n = new XYTextAnnotation(Integer.toString(k), px(start.azimuthDeg(), start.elevationDeg()) + 1.2,
            py(start.azimuthDeg(), start.elevationDeg()) + 1.2);
        n.setFont(NUMBER_FONT);
        n.setTextAnchor(TextAnchor.BOTTOM_LEFT);
        numbers.add(n);
      }
    }
    XYSeriesCollection data = new XYSeriesCollection();
    data.addSeries(tracks);
    data.addSeries(slews);
    data.addSeries(starts);
    XYLineAndShapeRenderer r = new TaggedShapes(tagged ? Map.of(2, startTags) : Map.of());
    r.setDrawSeriesLineAsPath(true);
    r.setSeriesPaint(0, PATH);
    r.setSeriesStroke(0, new BasicStroke(3f));
    r.setSeriesShapesVisible(0, false);
    r.setSeriesPaint(1, SLEW);
    r.setSeriesStroke(1, new BasicStroke(1.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {5f, 4f}, 0f));
    r.setSeriesShapesVisible(1, false);
    r.setSeriesPaint(2, PATH);
    r.setSeriesLinesVisible(2, false);
    r.setSeriesShape(2, new Ellipse2D.Double(-3.5, -3.5, 7, 7));

    XYPlot plot = new XYPlot(data, axis(-100, 100), axis(-100, 100), r);
    plot.setBackgroundPaint(Color.WHITE);
    plot.setDomainGridlinesVisible(false);
    plot.setRangeGridlinesVisible(false);
    plot.setOutlineVisible(false);
    addMask(plot, site);
    addGrid(plot);
    Constraints c = s.constraints();
    if (c.elevationMinDeg() != null) {
      double rr = 90 - c.elevationMinDeg();
      plot.addAnnotation(new XYShapeAnnotation(new Ellipse2D.Double(-rr, -rr, 2 * rr, 2 * rr),
          new BasicStroke(2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {8f, 5f}, 0f),
          new Color(200, 30, 30)));
      XYTextAnnotation lbl = new XYTextAnnotation(String.format(Locale.ROOT, "elevation limit %.0f\u00b0", c.elevationMinDeg()),
          rr * Math.sin(Math.toRadians(225)) + 3, rr * Math.cos(Math.toRadians(225)) + 3);
      lbl.setFont(TICK_FONT);
      lbl.setPaint(new Color(200, 30, 30));
      lbl.setTextAnchor(TextAnchor.BOTTOM_LEFT);
      plot.addAnnotation(lbl);
    }
    numbers.forEach(plot::addAnnotation);
    JFreeChart chart = new JFreeChart(title(s), new Font(Font.SANS_SERIF, Font.BOLD, 18), plot, true);
    chart.addSubtitle(new TextTitle(String.format(Locale.ROOT,
        "alt-az sky at the site (%.2f\u00b0, %.2f\u00b0): zenith at centre, horizon on the outer circle, north up, "
            + "east right; grey = below the horizon mask; %d observations, numbered in order",
        site.latitudeDeg(), site.longitudeDeg(), t.observations().size()), new Font(Font.SANS_SERIF, Font.PLAIN, 12)));
    return chart;
  }

  private static NumberAxis axis(double lo, double hi) {
    NumberAxis a = new NumberAxis();
    a.setRange(lo, hi);
    a.setVisible(false);
    return a;
  }

  /** Shades the sky below the horizon mask: the ring between the mask and the horizon circle. */
  private static void addMask(XYPlot plot, GroundSite site) {
    Path2D.Double ring = new Path2D.Double(Path2D.WIND_EVEN_ODD);
    ring.moveTo(px(0, 0), py(0, 0));
    for (int az = 1; az <= 360; az++) {
      ring.lineTo(px(az, 0), py(az, 0));
    }
    ring.closePath();
    double m0 = Math.max(0, site.maskElevationDeg(0));
    ring.moveTo(px(0, m0), py(0, m0));
    for (int az = 1; az <= 360; az++) {
      double m = Math.max(0, site.maskElevationDeg(az));
      ring.lineTo(px(az, m), py(az, m));
    }
    ring.closePath();
    plot.addAnnotation(new XYShapeAnnotation(ring, new BasicStroke(1f), new Color(110, 110, 110),
        new Color(190, 190, 190, 170)));
  }

  /** Elevation circles every 30 deg and azimuth spokes every 30 deg, labelled. */
  private static void addGrid(XYPlot plot) {
    Color grid = new Color(150, 150, 150);
    for (int el = 0; el < 90; el += 30) {
      double rr = 90 - el;
      plot.addAnnotation(new XYShapeAnnotation(new Ellipse2D.Double(-rr, -rr, 2 * rr, 2 * rr),
          new BasicStroke(el == 0 ? 1.5f : 0.8f), grid));
      XYTextAnnotation a = new XYTextAnnotation(el + "\u00b0", 1.5, rr - 1.5);
      a.setFont(TICK_FONT);
      a.setPaint(Color.DARK_GRAY);
      a.setTextAnchor(TextAnchor.TOP_LEFT);
      plot.addAnnotation(a);
    }
    String[] names = {"N", "30", "60", "E", "120", "150", "S", "210", "240", "W", "300", "330"};
    for (int i = 0; i < 12; i++) {
      int az = 30 * i;
      plot.addAnnotation(new org.jfree.chart.annotations.XYLineAnnotation(0, 0, px(az, 0), py(az, 0),
          new BasicStroke(0.5f), grid));
      XYTextAnnotation a = new XYTextAnnotation(names[i], px(az, -6), py(az, -6));
      a.setFont(i % 3 == 0 ? LABEL_FONT : TICK_FONT);
      a.setTextAnchor(TextAnchor.CENTER);
      plot.addAnnotation(a);
    }
  }

  // ---------------------------------------------------------------- spacecraft: RA/Dec map

  private static JFreeChart raDec(PlanGeometry g, Timeline t, boolean tagged) {
    Scenario s = g.scenario();
    XYSeries scheduled = new XYSeries("scheduled target", false);
    XYSeries other = new XYSeries("not scheduled", false);
    XYSeries path = new XYSeries("slew path, in order", false);
    List<Map<String, String>> scheduledTags = new ArrayList<>();
    RaDec previous = null;
    int k = 0;
    for (Observation o : t.observations()) {
      k++;
      Optional<RaDec> p = s.request(o.id()).flatMap(r -> g.raDec(r, o.start()));
      if (p.isEmpty()) {
        continue;
      }
      scheduled.add(p.get().raDeg(), p.get().decDeg());
      scheduledTags.add(tag(o, k));
      if (previous != null && Math.abs(previous.raDeg() - p.get().raDeg()) > 180) {
        path.add(Double.NaN, Double.NaN); // the straight RA/Dec line would cross the whole map: break it
      }
      path.add(p.get().raDeg(), p.get().decDeg());
      previous = p.get();
    }
    Instant mid = midpoint(s, t);
    for (Unscheduled u : t.unscheduled()) {
      s.request(u.id()).flatMap(r -> g.raDec(r, mid)).ifPresent(p -> other.add(p.raDeg(), p.decDeg()));
    }
    RaDec sun = g.sun(mid);
    RaDec moon = g.moon(mid);
    XYSeries sunSeries = new XYSeries("Sun and its keep-out", false);
    XYSeries moonSeries = new XYSeries("Moon and its keep-out", false);
    Double sunSep = s.constraints().sunSeparationMinDeg();
    Double moonSep = s.constraints().moonSeparationMinDeg();
    if (sunSep != null) {
      circle(sunSeries, sun, sunSep);
    }
    if (moonSep != null) {
      circle(moonSeries, moon, moonSep);
    }
    XYSeries bodies = new XYSeries("Sun / Moon centre", false);
    bodies.add(sun.raDeg(), sun.decDeg());
    bodies.add(moon.raDeg(), moon.decDeg());

    XYSeriesCollection data = new XYSeriesCollection();
    data.addSeries(path);
    data.addSeries(scheduled);
    data.addSeries(other);
    data.addSeries(sunSeries);
    data.addSeries(moonSeries);
    data.addSeries(bodies);
    XYLineAndShapeRenderer r = new TaggedShapes(tagged ? Map.of(1, scheduledTags) : Map.of());
    r.setSeriesPaint(0, SLEW);
    r.setSeriesStroke(0, new BasicStroke(1.2f));
    r.setSeriesShapesVisible(0, false);
    r.setSeriesPaint(1, PATH);
    r.setSeriesLinesVisible(1, false);
    r.setSeriesShape(1, new Ellipse2D.Double(-3.5, -3.5, 7, 7));
    r.setSeriesPaint(2, new Color(150, 150, 150));
    r.setSeriesLinesVisible(2, false);
    r.setSeriesShape(2, new Ellipse2D.Double(-2.5, -2.5, 5, 5));
    r.setSeriesPaint(3, new Color(220, 150, 0));
    r.setSeriesStroke(3, new BasicStroke(2.5f));
    r.setSeriesShapesVisible(3, false);
    r.setSeriesPaint(4, new Color(90, 90, 170));
    r.setSeriesStroke(4, new BasicStroke(2.5f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {8f, 5f}, 0f));
    r.setSeriesShapesVisible(4, false);
    r.setSeriesPaint(5, Color.BLACK);
    r.setSeriesLinesVisible(5, false);
    r.setSeriesShape(5, new Ellipse2D.Double(-6, -6, 12, 12));

    NumberAxis raAxis = new NumberAxis("right ascension [deg] (ICRS)");
    raAxis.setRange(0, 360);
    raAxis.setInverted(true);
    raAxis.setTickUnit(new org.jfree.chart.axis.NumberTickUnit(30));
    NumberAxis decAxis = new NumberAxis("declination [deg]");
    decAxis.setRange(-90, 90);
    decAxis.setTickUnit(new org.jfree.chart.axis.NumberTickUnit(30));
    for (NumberAxis a : List.of(raAxis, decAxis)) {
      a.setTickLabelFont(TICK_FONT);
      a.setLabelFont(LABEL_FONT);
    }
    XYPlot plot = new XYPlot(data, raAxis, decAxis, r);
    plot.setBackgroundPaint(Color.WHITE);
    plot.setDomainGridlinePaint(new Color(180, 180, 180));
    plot.setRangeGridlinePaint(new Color(180, 180, 180));
    for (var body : List.of(new Object[] {"Sun", sun}, new Object[] {"Moon", moon})) {
      RaDec p = (RaDec) body[1];
      XYTextAnnotation a = new XYTextAnnotation((String) body[0], p.raDeg(), p.decDeg() + 4);
      a.setFont(LABEL_FONT);
      a.setTextAnchor(TextAnchor.BOTTOM_CENTER);
      plot.addAnnotation(a);
    }
    JFreeChart chart = new JFreeChart(title(s), new Font(Font.SANS_SERIF, Font.BOLD, 18), plot, true);
    chart.addSubtitle(new TextTitle(String.format(Locale.ROOT,
        "targets on the sky; Sun%s and Moon%s keep-out circles at the plan's midpoint %s (geocentric); %d observations",
        sunSep == null ? "" : String.format(Locale.ROOT, " %.0f\u00b0", sunSep),
        moonSep == null ? "" : String.format(Locale.ROOT, " %.0f\u00b0", moonSep),
        mid.truncatedTo(java.time.temporal.ChronoUnit.MINUTES), t.observations().size()),
        new Font(Font.SANS_SERIF, Font.PLAIN, 12)));
    return chart;
  }

  /** The SVG group of the {@code k}-th observation's marker. */
  private static Map<String, String> tag(Observation o, int k) {
    return Map.of("class", "observation-start", "data-request", o.id(), "data-number", Integer.toString(k));
  }

  /** Lines and shapes whose shapes of some series are each wrapped in an SVG group (see {@link SvgGroups}). */
  private static final class TaggedShapes extends XYLineAndShapeRenderer {
    private final Map<Integer, List<Map<String, String>>> tags;

    /** {@code tags}: series index to the group of each item, by item index. */
    TaggedShapes(Map<Integer, List<Map<String, String>>> tags) {
      this.tags = Map.copyOf(tags);
    }

    @Override
    public void drawItem(Graphics2D g2, XYItemRendererState state, Rectangle2D dataArea, PlotRenderingInfo info,
        XYPlot plot, ValueAxis domainAxis, ValueAxis rangeAxis, XYDataset dataset, int series, int item,
        CrosshairState crosshairState, int pass) {
      List<Map<String, String>> mine = tags.get(series);
      SvgGroups.around(g2, mine != null && isItemPass(pass) && item < mine.size() ? mine.get(item) : null,
          () -> super.drawItem(g2, state, dataArea, info, plot, domainAxis, rangeAxis, dataset, series, item,
              crosshairState, pass));
    }
  }

  /** The midpoint between the first observation's start and the last one's end (the horizon's without any). */
  static Instant midpoint(Scenario s, Timeline t) {
    Instant a = t.observations().isEmpty() ? s.horizon().start() : t.observations().get(0).start();
    Instant b = t.observations().isEmpty() ? s.horizon().end() : t.observations().get(t.observations().size() - 1).end();
    return a.plus(Duration.between(a, b).dividedBy(2));
  }

  /** The small circle of {@code radiusDeg} around {@code centre}, broken where it wraps in RA. */
  private static void circle(XYSeries series, RaDec centre, double radiusDeg) {
    double ra = Math.toRadians(centre.raDeg());
    double dec = Math.toRadians(centre.decDeg());
    double[] c = {Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec)};
    double[] u = {-Math.sin(ra), Math.cos(ra), 0}; // east at the centre
    double[] v = {-Math.sin(dec) * Math.cos(ra), -Math.sin(dec) * Math.sin(ra), Math.cos(dec)}; // north
    double rho = Math.toRadians(radiusDeg);
    double prevRa = Double.NaN;
    for (int k = 0; k <= 360; k++) {
      double th = Math.toRadians(k);
      double x = c[0] * Math.cos(rho) + (u[0] * Math.cos(th) + v[0] * Math.sin(th)) * Math.sin(rho);
      double y = c[1] * Math.cos(rho) + (u[1] * Math.cos(th) + v[1] * Math.sin(th)) * Math.sin(rho);
      double z = c[2] * Math.cos(rho) + (u[2] * Math.cos(th) + v[2] * Math.sin(th)) * Math.sin(rho);
      RaDec p = PlanGeometry.toRaDec(new org.hipparchus.geometry.euclidean.threed.Vector3D(x, y, z));
      if (!Double.isNaN(prevRa) && Math.abs(p.raDeg() - prevRa) > 180) {
        series.add(Double.NaN, Double.NaN);
      }
      series.add(p.raDeg(), p.decDeg());
      prevRa = p.raDeg();
    }
  }

  private static String title(Scenario s) {
    return s.name() == null ? "observing plan" : s.name();
  }
}
