package dev.sequencer.report;

import static dev.sequencer.report.Html.cell;
import static dev.sequencer.report.Html.esc;
import static dev.sequencer.report.Html.num;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.WindowsFile.ResourceWindows;
import dev.sequencer.charts.ChartFiles;
import dev.sequencer.charts.GroundMap;
import dev.sequencer.charts.NightChart;
import dev.sequencer.charts.PlanGeometry;
import dev.sequencer.charts.ResourcePlan;
import dev.sequencer.charts.SkyChart;
import dev.sequencer.charts.TimeAxes;
import dev.sequencer.charts.TimelineChart;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Group;
import dev.sequencer.model.Observation;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.visibility.SkyValues;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.UnaryOperator;
import org.jfree.chart.JFreeChart;

/**
 * Builds the night report of one plan as a single HTML page. Nothing is fetched: the charts are inline
 * SVG (drawn by JFreeChart through the project's own SVG writer), the style and the table-sorting script
 * are inline, and no font is loaded (the browser's sans-serif). Opening {@code night.html#sort=-6} sorts
 * the observations table by its 6th column, descending, as a click on the header does.
 */
public final class NightReport {
  /** The safety caution every report carries (same words as the command line's). */
  public static final String CAUTION = "Plans are advisory. Pointing an instrument near the Sun or commanding a real "
      + "slew can damage hardware. Check every plan with your own flight-rule and safety checks before use; local "
      + "rules and licensed practice take precedence over this tool.";

  private static final DateTimeFormatter HMS = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss", Locale.ROOT)
      .withZone(java.time.ZoneOffset.UTC);

  /**
   * The zone of "local time" and how it was chosen (shown beside it), e.g. the nautical zone of a site's longitude.
   *
   * @param zone the zone
   * @param note how it was chosen, or null
   */
  public record LocalZone(ZoneId zone, String note) {}

  /**
   * What a report shows.
   *
   * @param scenario the scenario
   * @param timeline the plan
   * @param windows each request's visibility windows (request order)
   * @param gap the solver's relative gap, or null when not known (then it is derived from the bound)
   * @param warnings warnings to show (reader warnings, re-check violations), may be empty
   * @param reasons the unscheduled requests' reasons in words (id to text); missing ids use the timeline's
   * @param zone the zone of "local time"
   * @param zoneNote how that zone was chosen, or null
   * @param violations what the validator found wrong with the timeline (empty when it is valid)
   * @param resourceWindows with several resources (A6), each resource's windows (empty with one observer)
   * @param resourceZones with several resources (A6), the zone of "local time" of each resource, by id: its
   *     section and its night chart use it; a resource not in the map gets {@code zone} and {@code zoneNote}
   */
  public record Input(Scenario scenario, Timeline timeline, List<RequestWindows> windows, Double gap,
      List<String> warnings, Map<String, String> reasons, ZoneId zone, String zoneNote, List<String> violations,
      List<ResourceWindows> resourceWindows, Map<String, LocalZone> resourceZones) {
    public Input {
      windows = List.copyOf(windows);
      warnings = List.copyOf(warnings);
      reasons = Map.copyOf(reasons);
      violations = List.copyOf(violations);
      resourceWindows = List.copyOf(resourceWindows);
      resourceZones = Map.copyOf(resourceZones);
    }

    /** What a report shows, every resource (A6) in the one {@code zone}. */
    public Input(Scenario scenario, Timeline timeline, List<RequestWindows> windows, Double gap, List<String> warnings,
        Map<String, String> reasons, ZoneId zone, String zoneNote, List<String> violations,
        List<ResourceWindows> resourceWindows) {
      this(scenario, timeline, windows, gap, warnings, reasons, zone, zoneNote, violations, resourceWindows, Map.of());
    }

    /** What a report of a scenario with one observer shows. */
    public Input(Scenario scenario, Timeline timeline, List<RequestWindows> windows, Double gap, List<String> warnings,
        Map<String, String> reasons, ZoneId zone, String zoneNote, List<String> violations) {
      this(scenario, timeline, windows, gap, warnings, reasons, zone, zoneNote, violations, List.of());
    }

    /** The zone of "local time" of resource {@code id} (A6): its own, else the report's. */
    LocalZone zoneOf(String id) {
      return resourceZones.getOrDefault(id, new LocalZone(zone, zoneNote));
    }
  }

  /**
   * One lane of the lane chart: the one observer's, or one per resource (A6), with the sky values and the
   * darkness limit (null: none set) of its site for the shading.
   */
  record Lane(String name, List<Observation> observations, SkyValues sky, Double sunLimitDeg) {}

  private final Input in;
  private final AstroContext ctx;
  private final SkyValues sky;
  private final TimeAxes axes;
  /** Each resource's share of the plan (A6), in file order; empty with one observer. */
  private final List<ResourcePlan> plans;
  /** The sky values of each resource with an observer, by id (A6). */
  private final Map<String, SkyValues> skies = new HashMap<>();
  private final StringBuilder b = new StringBuilder(1 << 18);
  private int charts;

  private NightReport(Input in, AstroContext ctx) {
    this.in = in;
    this.ctx = ctx;
    this.sky = in.scenario().observer() == null ? null : SkyValues.of(in.scenario(), ctx);
    this.axes = new TimeAxes(in.zone(), in.zoneNote(), sky);
    this.plans = ResourcePlan.of(in.scenario(), in.timeline());
    plans.stream().filter(p -> p.scenario().observer() != null)
        .forEach(p -> skies.put(p.id(), SkyValues.of(p.scenario(), ctx)));
  }

  /** The report's HTML text. */
  public static String html(Input in, AstroContext ctx) {
    return new NightReport(in, ctx).build();
  }

  private Scenario s() {
    return in.scenario();
  }

  private Timeline t() {
    return in.timeline();
  }

  private String build() {
    String title = s().name() == null ? "observing plan" : s().name();
    b.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
        .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
        .append("<title>").append(esc(title)).append(" \u2014 night report</title>\n<style>\n").append(CSS)
        .append("</style>\n</head>\n<body>\n");
    b.append("<h1>").append(esc(title)).append("</h1>\n");
    b.append("<p class=\"caution\" id=\"caution\"><strong>Caution.</strong> ").append(esc(CAUTION)).append("</p>\n");
    summary();
    lanes();
    chartsSection();
    resources();
    observations();
    passes();
    unscheduled();
    constraints();
    b.append("<footer>Horizon ").append(esc(s().horizon().start().toString())).append(" to ")
        .append(esc(s().horizon().end().toString())).append("; astronomy: ").append(esc(ctx.description()))
        .append(". Made by the sequencer's report command; every value is computed by the library.</footer>\n");
    b.append("<script>\n").append(SCRIPT).append("</script>\n</body>\n</html>\n");
    return b.toString();
  }

  // ------------------------------------------------------------------ summary

  private void summary() {
    Timeline t = t();
    b.append("<section id=\"summary\"><h2>Summary</h2>\n");
    if (!in.violations().isEmpty()) {
      b.append("<div class=\"bad\" id=\"violations\"><strong>This timeline fails the re-check against the scenario"
          + " (").append(in.violations().size()).append(" violation(s)); do not use it.</strong><ul>");
      in.violations().forEach(v -> b.append("<li>").append(esc(v)).append("</li>"));
      b.append("</ul></div>\n");
    }
    b.append("<dl class=\"summary\">\n");
    dt("status", esc(t.status().toString()) + " \u2014 " + esc(statusWords()));
    dt("priority", num(t.priority(), 2) + " collected" + boundWords());
    dt("observations", t.observations().size() + " scheduled, " + t.unscheduled().size() + " not ("
        + s().requests().stream().filter(Request::required).count() + " required requests in the scenario)");
    dt("slew total", num(t.slewSeconds(), 0) + " s (exact, as re-checked)");
    if (!plans.isEmpty()) {
      dt("resources", plans.size() + ": " + esc(String.join(", ", plans.stream().map(p -> p.id() + " ("
          + p.timeline().observations().size() + " observations)").toList())) + "; each has its section below");
    }
    double[] totals = plans.isEmpty() ? totals(t) : new double[3];
    for (ResourcePlan p : plans) { // each resource's span, idle and exposure (A6): they overlap in time
      double[] each = totals(p.timeline());
      Arrays.setAll(totals, i -> totals[i] + each[i]);
    }
    dt("idle total", num(totals[1], 0) + (plans.isEmpty() ? " s between the first slew and the last end ("
        + percent(totals[1], totals[0]) + " of that span)" : " s between each resource's first slew and its last end, "
        + "summed over the resources (" + percent(totals[1], totals[0]) + " of those spans)"));
    dt("observing", num(totals[2], 0) + " s of exposure");
    if (sky != null && sky.atGroundSite()) {
      Instant mid = mid();
      dt("Moon", "illuminated " + num(100 * sky.moonIlluminatedFraction(mid), 0) + " % at " + hm(mid)
          + " UTC; elevation " + num(sky.moonElevationDeg(mid), 1) + "\u00b0 then");
      dt("local time", zoneWords(axes, mid));
    }
    b.append("</dl>\n");
    if (!in.warnings().isEmpty()) {
      b.append("<div class=\"warn\" id=\"warnings\"><strong>Warnings</strong><ul>");
      in.warnings().forEach(w -> b.append("<li>").append(esc(w)).append("</li>"));
      b.append("</ul></div>\n");
    }
    b.append("</section>\n");
  }

  /** "UTC+02:00 (nautical zone of the longitude; …)": the zone's name at {@code at} and how it was chosen, HTML. */
  private static String zoneWords(TimeAxes zone, Instant at) {
    return esc(zone.zoneName(at)) + (zone.zoneNote() == null ? "" : " (" + esc(zone.zoneNote()) + ")");
  }

  /** The time axes of resource {@code plan} (A6): its own zone of "local time", its sky values. */
  private TimeAxes axesOf(ResourcePlan plan) {
    LocalZone z = in.zoneOf(plan.id());
    return new TimeAxes(z.zone(), z.note(), skies.get(plan.id()));
  }

  private void dt(String term, String html) {
    b.append("<dt>").append(esc(term)).append("</dt><dd>").append(html).append("</dd>\n");
  }

  private String statusWords() {
    return switch (t().status()) {
      case OPTIMAL -> "no plan collects more priority (then less slew) than this one";
      case FEASIBLE -> "a valid plan; the search stopped before proving it the best";
      case INFEASIBLE -> "the required requests cannot all be scheduled together";
      default -> "no plan was found in the time given";
    };
  }

  private String boundWords() {
    Double bound = t().bound();
    if (bound == null) {
      return "; no upper bound is known, so how far this is from the best is not known";
    }
    double gap = in.gap() != null && Double.isFinite(in.gap()) ? in.gap()
        : bound <= 0 ? 0 : Math.max(0, (bound - t().priority()) / bound);
    if (gap <= 1e-9) {
      return " of a proven upper bound of " + num(bound, 2) + ": gap 0 %, nothing better exists";
    }
    return " of a proven upper bound of " + num(bound, 2) + ": gap " + num(100 * gap, 1)
        + " %, a better plan could collect at most " + num(bound - t().priority(), 2) + " more";
  }

  /** {span, idle, exposure} seconds: span from the first slew's start to the last end. */
  static double[] totals(Timeline t) {
    if (t.observations().isEmpty()) {
      return new double[] {0, 0, 0};
    }
    Observation first = t.observations().get(0);
    Observation last = t.observations().get(t.observations().size() - 1);
    double span = Duration.between(first.start(), last.end()).toMillis() / 1000.0 + first.slewSeconds();
    double exposure = t.observations().stream().mapToDouble(Observation::durationS).sum();
    double busy = exposure + t.observations().stream().mapToDouble(Observation::slewSeconds).sum();
    return new double[] {span, Math.max(0, span - busy), exposure};
  }

  private static String percent(double part, double whole) {
    return whole <= 0 ? "0 %" : num(100 * part / whole, 1) + " %";
  }

  private Instant mid() {
    Instant a = s().horizon().start();
    return a.plus(Duration.between(a, s().horizon().end()).dividedBy(2));
  }

  private static String hm(Instant t) {
    return HMS.format(t).substring(11, 16);
  }

  // ------------------------------------------------------------------ lanes

  private void lanes() {
    List<Lane> lanes = plans.isEmpty()
        ? List.of(new Lane(observerName(s()), t().observations(), sky, s().constraints().sunElevationMaxDeg()))
        : plans.stream().map(p -> new Lane(p.id(), p.timeline().observations(), skies.get(p.id()),
            p.scenario().constraints().sunElevationMaxDeg())).toList();
    int w = 1400;
    int left = 160;
    int laneH = 34;
    int top = 24;
    int h = top + laneH * lanes.size() + 30;
    long t0 = s().horizon().start().toEpochMilli();
    long t1 = s().horizon().end().toEpochMilli();
    double k = (w - left - 20) / (double) Math.max(1, t1 - t0);
    b.append("<section id=\"lanes\"><h2>Timeline by resource</h2>\n<svg class=\"chart lanes\" id=\"lane-chart\" "
        + "role=\"img\" viewBox=\"0 0 ").append(w).append(' ').append(h).append("\" xmlns=\"http://www.w3.org/2000/svg\">\n");
    charts++;
    for (int i = 0; i < lanes.size(); i++) {
      // each lane shaded by the Sun at its own site; the outer lanes' shading reaches into the margins
      double y0 = i == 0 ? top - 4 : top + i * laneH;
      double y1 = i == lanes.size() - 1 ? top + laneH * lanes.size() + 4 : top + (i + 1) * laneH;
      shadeLane(lanes.get(i), left, k, t0, t1, y0, y1 - y0);
    }
    for (long hour = (t0 / 3_600_000 + 1) * 3_600_000; hour < t1; hour += 3_600_000) {
      double x = left + (hour - t0) * k;
      b.append("<line class=\"grid\" x1=\"").append(num(x, 1)).append("\" y1=\"").append(top - 6).append("\" x2=\"")
          .append(num(x, 1)).append("\" y2=\"").append(top + laneH * lanes.size() + 4).append("\"/>");
      b.append("<text class=\"tick\" x=\"").append(num(x, 1)).append("\" y=\"").append(h - 6).append("\">")
          .append(hm(Instant.ofEpochMilli(hour))).append("</text>\n");
    }
    for (int i = 0; i < lanes.size(); i++) {
      Lane lane = lanes.get(i);
      double y = top + i * laneH;
      b.append("<text class=\"lane-name\" x=\"6\" y=\"").append(num(y + laneH / 2.0 + 5, 1)).append("\">")
          .append(esc(lane.name())).append("</text>\n");
      b.append("<g class=\"lane\" data-lane=\"").append(esc(lane.name())).append("\">\n");
      for (Observation o : lane.observations()) {
        long a = o.start().toEpochMilli();
        long e = o.end().toEpochMilli();
        long sl = Math.round(o.slewSeconds() * 1000);
        if (sl > 0) {
          rect(left + (a - sl - t0) * k, y + 6, sl * k, laneH - 12, "slew", o.id() + ": slew and settle "
              + num(o.slewSeconds(), 1) + " s");
        }
        rect(left + (a - t0) * k, y + 4, Math.max(1, (e - a) * k), laneH - 8, "obs", o.id() + ": " + HMS.format(o.start())
            + " to " + HMS.format(o.end()).substring(11) + " UTC");
      }
      b.append("</g>\n");
    }
    b.append("<text class=\"tick\" x=\"").append(left).append("\" y=\"14\">UTC; blue: observation, orange: slew and "
        + "settle before it, yellow: Sun above the darkness limit (hover for times)</text>\n</svg>\n</section>\n");
  }

  /** Shades, over {@code [y, y + height]}, the times the Sun is above the lane's darkness limit at its site. */
  private void shadeLane(Lane lane, int left, double k, long t0, long t1, double y, double height) {
    if (lane.sky() == null || !lane.sky().atGroundSite()) {
      return;
    }
    double limit = lane.sunLimitDeg() == null ? -12 : lane.sunLimitDeg();
    long step = 120_000;
    Long from = null;
    for (long ms = t0; ms <= t1 + step; ms += step) {
      long at = Math.min(ms, t1);
      boolean bright = at < t1 && lane.sky().sunElevationDeg(Instant.ofEpochMilli(at)) > limit;
      if (bright && from == null) {
        from = at;
      } else if (!bright && from != null) {
        rect(left + (from - t0) * k, y, (at - from) * k, height, "sun", "Sun above " + num(limit, 0) + "\u00b0");
        from = null;
      }
      if (at == t1) {
        break;
      }
    }
  }

  private void rect(double x, double y, double w, double h, String cls, String title) {
    b.append("<rect class=\"").append(cls).append("\" x=\"").append(num(x, 1)).append("\" y=\"").append(num(y, 1))
        .append("\" width=\"").append(num(Math.max(0.5, w), 1)).append("\" height=\"").append(num(h, 1)).append("\"><title>")
        .append(esc(title)).append("</title></rect>\n");
  }

  /** The observer of {@code view} in a few words: "site 24.62°, 33.91°", "spacecraft", or "resource" without one. */
  private static String observerName(Scenario view) {
    if (view.observer() instanceof GroundSite g) {
      return String.format(Locale.ROOT, "site %.2f\u00b0, %.2f\u00b0", g.latitudeDeg(), g.longitudeDeg());
    }
    if (view.observer() instanceof OrbitObserver) {
      return "spacecraft";
    }
    return "resource";
  }

  // ------------------------------------------------------------------ charts

  private void chartsSection() {
    ChartFiles.headless();
    PlanGeometry g = new PlanGeometry(s(), ctx);
    b.append("<section id=\"charts\"><h2>Charts</h2>\n");
    TimeAxes ax = sky != null && sky.atGroundSite() ? axes : null;
    if (plans.isEmpty()) {
      chart("timeline-chart", "The plan by request: visibility windows, observations, slews; unscheduled requests "
          + "below with their reasons; \"!\" marks a required request, p its priority.",
          TimelineChart.create(g, in.windows(), t(), true, in.reasons(), ax), TimelineChart.WIDTH_PX,
          TimelineChart.heightPx(s(), t(), true, ax));
    } else {
      chart("timeline-chart", "The plan by resource: one lane group per resource with its observations, their "
          + "visibility windows from that resource and its slews, shaded by the Sun at its site; unscheduled requests "
          + "below with their reasons; \"!\" marks a required request, p its priority.",
          TimelineChart.createByResource(g, in.resourceWindows(), t(), true, in.reasons(), ax), TimelineChart.WIDTH_PX,
          TimelineChart.heightPx(s(), t(), true, ax));
    }
    observerCharts(g, null);
    b.append("</section>\n");
  }

  /**
   * The charts drawn from one observer: the night chart at a ground site, the sky chart (unless every target is
   * an Earth point), the ground map; of the one observer for {@code plan} null, else of that resource (A6), with
   * its id in the titles and the chart ids.
   */
  private void observerCharts(PlanGeometry g, ResourcePlan plan) {
    Scenario view = plan == null ? s() : plan.scenario();
    Timeline part = plan == null ? t() : plan.timeline();
    SkyValues here = plan == null ? sky : skies.get(plan.id());
    String suffix = plan == null ? "" : "-" + plan.fileName();
    UnaryOperator<JFreeChart> titled = plan == null ? c -> c : plan::titled;
    if (here != null && here.atGroundSite()) {
      chart("night-chart" + suffix, "The night: the scheduled targets' elevation (thick while observed), the Sun and "
          + "the Moon, the Moon's illuminated fraction, airmass levels; local and sidereal time above.",
          titled.apply(NightChart.create(view, part, here, plan == null ? axes : axesOf(plan))), NightChart.WIDTH_PX,
          NightChart.HEIGHT_PX);
    }
    boolean onlyEarthPoints = !view.requests().isEmpty()
        && view.requests().stream().allMatch(r -> r.target() instanceof EarthPoint);
    if (view.observer() != null && !onlyEarthPoints) { // Earth points have no place on the sky: the ground map shows them
      chart("sky-chart" + suffix, here != null && here.atGroundSite() ? "The sky at the site, observations numbered "
          + "in order." : "Targets on the sky with the Sun and Moon keep-outs.",
          plan == null ? SkyChart.create(g, part) : SkyChart.create(g, plan), SkyChart.WIDTH_PX, SkyChart.HEIGHT_PX);
    }
    if (here != null && GroundMap.applies(view, here)) {
      chart("ground-map" + suffix, "The ground track and the Earth-point targets (no coastlines are drawn).",
          titled.apply(GroundMap.create(view, part, here)), GroundMap.WIDTH_PX, GroundMap.HEIGHT_PX);
    }
  }

  // ------------------------------------------------------------------ resources (A6)

  /**
   * One section per resource: its observer, at a ground site its zone of "local time" (which its night chart's
   * local-time axis uses), its counts, the constraints in force on it (its own fields over the scenario's) and the
   * charts drawn from it.
   */
  private void resources() {
    if (plans.isEmpty()) {
      return;
    }
    PlanGeometry g = new PlanGeometry(s(), ctx);
    b.append("<section id=\"resources\"><h2>Resources</h2>\n");
    for (ResourcePlan p : plans) {
      Timeline part = p.timeline();
      b.append("<section class=\"resource\" id=\"resource-").append(esc(p.fileName())).append("\" data-resource=\"")
          .append(esc(p.id())).append("\"><h3>").append(esc(p.id())).append("</h3>\n<dl class=\"summary\">\n");
      dt("observer", esc(observerName(p.scenario())));
      if (skies.containsKey(p.id()) && skies.get(p.id()).atGroundSite()) {
        dt("local time", zoneWords(axesOf(p), mid()));
      }
      dt("observations", part.observations().size() + " scheduled on it; " + part.unscheduled().size()
          + " requests it may observe are not scheduled");
      dt("priority", num(part.priority(), 2) + " collected on it");
      dt("slew total", num(part.slewSeconds(), 0) + " s");
      dt("observing", num(totals(part)[2], 0) + " s of exposure");
      b.append("</dl>\n<h4>Constraints in force</h4>\n");
      constraintsTable("constraints-" + p.fileName(), p.scenario(), p.resource());
      observerCharts(g, p);
      b.append("</section>\n");
    }
    b.append("</section>\n");
  }

  private void chart(String id, String caption, JFreeChart chart, int w, int h) {
    b.append("<figure>").append(ChartFiles.svgInline(chart, w, h, id)).append("<figcaption>").append(esc(caption))
        .append("</figcaption></figure>\n");
    charts++;
  }

  // ------------------------------------------------------------------ tables

  private void observations() {
    boolean site = sky != null && sky.atGroundSite() || skies.values().stream().anyMatch(SkyValues::atGroundSite);
    boolean several = !plans.isEmpty();
    b.append("<section id=\"observations\"><h2>Observations</h2>\n<p class=\"hint\">Click a column to sort (again to "
        + "reverse). Airmass and elevation are at the site").append(several ? " of the observation's resource" : "")
        .append(", refracted as the constraints use them; the Moon separation is from the observer along the apparent "
        + "line of sight.</p>\n");
    b.append("<table class=\"sortable\" id=\"observations-table\"><thead><tr>");
    List<String> heads = new ArrayList<>(List.of("#", "id"));
    if (several) {
      heads.add("resource");
    }
    heads.addAll(List.of("start (UTC)", "end (UTC)", "target", "priority", "required"));
    if (site) {
      heads.addAll(List.of("airmass at start", "airmass at end", "elevation at start [\u00b0]", "LST at start"));
    }
    heads.addAll(List.of("Moon separation [\u00b0]", "slew before [s]", "duration [s]"));
    // A4, A5 after the others, so that a column's number (#sort=N) is the same with them or without
    boolean visits = s().requests().stream().anyMatch(Request::hasVisits);
    boolean groups = !s().groups().isEmpty();
    boolean configurations = hasConfigurations();
    if (visits) {
      heads.add("visit");
    }
    if (groups) {
      heads.add("group");
    }
    if (configurations) {
      heads.add("configuration");
    }
    heads.forEach(hd -> b.append("<th>").append(esc(hd)).append("</th>"));
    b.append("</tr></thead>\n<tbody>\n");
    int k = 0;
    for (Observation o : t().observations()) {
      k++;
      Request r = s().request(o.id()).orElse(null);
      SkyValues at = several ? skies.get(o.resource()) : sky;
      b.append("<tr>").append(cell(Integer.toString(k), Integer.toString(k))).append(cell(esc(o.id()), o.id()));
      if (several) {
        String res = o.resource() == null ? "" : o.resource();
        b.append(cell(esc(res), res));
      }
      b.append(cell(HMS.format(o.start()), o.start().toString())).append(cell(HMS.format(o.end()), o.end().toString()))
          .append(cell(esc(targetText(r)), targetText(r)))
          .append(cell(r == null || r.priority() == null ? "\u2013" : num(r.priority(), 2),
              r == null || r.priority() == null ? "" : Double.toString(r.priority())))
          .append(cell(r != null && r.required() ? "required" : "", r != null && r.required() ? "1" : "0"));
      if (site) {
        boolean ground = at != null && at.atGroundSite();
        double x0 = r == null || !ground ? Double.NaN : at.airmass(r, o.start());
        double x1 = r == null || !ground ? Double.NaN : at.airmass(r, o.end());
        double el = r == null || !ground ? Double.NaN : at.elevationDeg(r, o.start());
        double lst = !ground ? Double.NaN : at.localSiderealTimeH(o.start());
        b.append(cell(num(x0, 3), key(x0))).append(cell(num(x1, 3), key(x1))).append(cell(num(el, 2), key(el)))
            .append(cell(hms(lst), key(lst)));
      }
      double moon = r == null || at == null ? Double.NaN : at.moonSeparationDeg(r, o.start());
      b.append(cell(num(moon, 1), key(moon))).append(cell(num(o.slewSeconds(), 1), key(o.slewSeconds())))
          .append(cell(num(o.durationS(), 0), key(o.durationS())));
      if (visits) {
        boolean repeated = r != null && r.hasVisits() && o.visit() != null;
        b.append(cell(repeated ? o.visit() + "/" + r.visits().count() : "",
            repeated ? Integer.toString(o.visit()) : ""));
      }
      if (groups) {
        groupCell(o.id());
      }
      if (configurations) {
        String label = r == null ? "" : r.configuration();
        b.append(cell(label.isEmpty() ? "(default)" : esc(label), label));
      }
      b.append("</tr>\n");
    }
    b.append("</tbody></table>\n</section>\n");
  }

  /**
   * The group cell of request {@code id} (A5): the group's id and, in an ordered group, the member's place in it
   * ("CHAIN1 2/3"); empty for a request in no group. Sorted by group, then place.
   */
  private void groupCell(String id) {
    Group g = s().groupOf(id).orElse(null);
    if (g == null) {
      b.append(cell("", ""));
      return;
    }
    int place = g.members().indexOf(id) + 1;
    String text = g.ordered() ? g.id() + " " + place + "/" + g.members().size() : g.id();
    b.append(cell(esc(text), String.format(Locale.ROOT, "%s %04d", g.id(), g.ordered() ? place : 0)));
  }

  /** True when some request names a configuration (A5) other than the default {@code ""}. */
  private boolean hasConfigurations() {
    return s().requests().stream().anyMatch(r -> !r.configuration().isEmpty());
  }

  private static String key(double v) {
    return Double.isFinite(v) ? Double.toString(v) : "";
  }

  /** Hours as "HH:MM:SS". */
  static String hms(double hours) {
    if (!Double.isFinite(hours)) {
      return "\u2013";
    }
    long s = Math.round(hours * 3600) % 86400;
    return String.format(Locale.ROOT, "%02d:%02d:%02d", s / 3600, s / 60 % 60, s % 60);
  }

  private static String targetText(Request r) {
    if (r == null || r.target() == null) {
      return "";
    }
    if (r.target() instanceof RaDec rd) {
      return String.format(Locale.ROOT, "RA %.4f\u00b0 Dec %+.4f\u00b0", rd.raDeg(), rd.decDeg());
    }
    if (r.target() instanceof EarthPoint ep) {
      return String.format(Locale.ROOT, "Earth point %.3f\u00b0, %.3f\u00b0", ep.latitudeDeg(), ep.longitudeDeg());
    }
    if (r.target() instanceof OrbitingTarget ot) {
      return "TLE object " + ot.tle().line1().substring(2, 7).trim();
    }
    return r.target().toString();
  }

  private void passes() {
    List<Request> tle = s().requests().stream().filter(r -> r.target() instanceof OrbitingTarget).toList();
    // the one observer, or each resource (A6) at a ground site, with its id and the requests it may observe
    List<ResourcePlan> at = plans.stream().filter(p -> skies.containsKey(p.id()) && skies.get(p.id()).atGroundSite())
        .toList();
    if (tle.isEmpty() || (plans.isEmpty() ? sky == null || !sky.atGroundSite() : at.isEmpty())) {
      return;
    }
    boolean several = !plans.isEmpty();
    Double elMin = s().constraints().elevationMinDeg();
    b.append("<section id=\"passes\"><h2>Passes of the orbiting targets</h2>\n<p class=\"hint\">Rise and set at the "
        + "geometric horizon (0\u00b0, no refraction, no mask), culmination at the highest geometric elevation; "
        + "from the TLE by SGP4.").append(elMin == null ? "" : " The scenario asks for at least " + num(elMin, 1)
        + "\u00b0 to observe.").append(several ? " One row per pass and resource; \"scheduled\": observed on that "
        + "resource during the pass." : "").append("</p>\n<table class=\"sortable\" id=\"passes-table\"><thead><tr>");
    List<String> heads = new ArrayList<>(List.of("request"));
    if (several) {
      heads.add("resource");
    }
    heads.addAll(List.of("object", "pass", "rise (UTC)", "culmination (UTC)", "max elevation [\u00b0]", "set (UTC)",
        "scheduled"));
    heads.forEach(hd -> b.append("<th>").append(esc(hd)).append("</th>"));
    b.append("</tr></thead>\n<tbody>\n");
    for (Request r : tle) {
      if (several) {
        for (ResourcePlan p : at) {
          if (r.allows(p.id())) {
            passRows(r, p.id(), skies.get(p.id()), p.timeline());
          }
        }
      } else {
        passRows(r, null, sky, t());
      }
    }
    b.append("</tbody></table>\n</section>\n");
  }

  /** The rows of {@code r}'s passes seen with {@code here} ({@code resource} null: the one observer's). */
  private void passRows(Request r, String resource, SkyValues here, Timeline part) {
    int k = 0;
    for (SkyValues.Pass p : here.passes(r, 0.0)) {
      k++;
      boolean observed = part.observations().stream().anyMatch(o -> o.id().equals(r.id())
          && !o.end().isBefore(p.rise()) && !o.start().isAfter(p.set()));
      b.append("<tr>").append(cell(esc(r.id()), r.id()));
      if (resource != null) {
        b.append(cell(esc(resource), resource));
      }
      b.append(cell(esc(targetText(r)), targetText(r)))
          .append(cell(Integer.toString(k), Integer.toString(k)))
          .append(cell(HMS.format(p.rise()) + (p.risesBeforeHorizon() ? " (up at the horizon start)" : ""),
              p.rise().toString()))
          .append(cell(HMS.format(p.culmination()), p.culmination().toString()))
          .append(cell(num(p.culminationElevationDeg(), 2), key(p.culminationElevationDeg())))
          .append(cell(HMS.format(p.set()) + (p.setsAfterHorizon() ? " (still up at the horizon end)" : ""),
              p.set().toString()))
          .append(cell(observed ? "yes" : "", observed ? "1" : "0")).append("</tr>\n");
    }
  }

  private void unscheduled() {
    b.append("<section id=\"unscheduled\"><h2>Not scheduled</h2>\n");
    if (t().unscheduled().isEmpty()) {
      b.append("<p>Every request is in the plan.</p>\n</section>\n");
      return;
    }
    boolean groups = !s().groups().isEmpty();
    b.append("<table class=\"sortable\" id=\"unscheduled-table\"><thead><tr><th>id</th><th>priority</th><th>required</th>"
        + "<th>target</th>").append(groups ? "<th>group</th>" : "").append("<th>reason</th></tr></thead>\n<tbody>\n");
    for (Unscheduled u : t().unscheduled()) {
      Request r = s().request(u.id()).orElse(null);
      String reason = in.reasons().getOrDefault(u.id(), u.reason());
      b.append("<tr>").append(cell(esc(u.id()), u.id()))
          .append(cell(r == null || r.priority() == null ? "\u2013" : num(r.priority(), 2),
              r == null || r.priority() == null ? "" : Double.toString(r.priority())))
          .append(cell(r != null && r.required() ? "required" : "", r != null && r.required() ? "1" : "0"))
          .append(cell(esc(targetText(r)), targetText(r)));
      if (groups) {
        groupCell(u.id());
      }
      b.append(cell(esc(reason), reason)).append("</tr>\n");
    }
    b.append("</tbody></table>\n</section>\n");
  }

  private void constraints() {
    b.append("<section id=\"constraints\"><h2>Constraints in force</h2>\n");
    b.append("<h3>").append(esc(plans.isEmpty() ? observerName(s()) : "every resource (a resource's own fields replace "
        + "these: see its section under Resources)")).append("</h3>\n");
    constraintsTable("constraints-table", s(), null);
    List<Request> own = s().requests().stream().filter(r -> !r.constraints().equals(
        dev.sequencer.model.ConstraintOverrides.none())).toList();
    if (!own.isEmpty()) {
      b.append("<h3>Requests with constraints of their own</h3>\n<ul id=\"request-constraints\">\n");
      for (Request r : own) {
        List<String> parts = new ArrayList<>();
        for (ConstraintField f : ConstraintField.values()) {
          Object v = f.valueIn(r.constraints().given());
          if (v != null) {
            parts.add(f.key() + " " + v);
          }
        }
        r.constraints().removed().forEach(f -> parts.add(f.key() + " removed"));
        b.append("<li>").append(esc(r.id())).append(": ").append(esc(String.join(", ", parts))).append("</li>\n");
      }
      b.append("</ul>\n");
    }
    b.append("</section>\n");
  }

  /**
   * The table of the constraint fields in force in {@code view}, its horizon mask and refraction at a ground
   * site and its slew model (not for the top level of a scenario with resources, whose slew is unused); for a
   * {@code resource} (A6) a column says whether each value is the resource's own or the scenario's, and the
   * fields the resource removes are listed as removed.
   */
  private void constraintsTable(String id, Scenario view, Resource resource) {
    b.append("<table id=\"").append(esc(id)).append("\"><thead><tr><th>field</th><th>value</th>")
        .append(resource == null ? "" : "<th>from</th>").append("</tr></thead><tbody>\n");
    Constraints c = view.constraints();
    int shown = 0;
    for (ConstraintField f : ConstraintField.values()) {
      Object v = f.valueIn(c);
      boolean removed = resource != null && resource.constraints().removed().contains(f);
      if (v != null || removed) {
        b.append("<tr><td>").append(esc(f.key())).append("</td><td>")
            .append(esc(removed ? "none (removed by this resource)" : v.toString())).append("</td>")
            .append(resource == null ? "" : "<td>" + (resource.constraints().mentions(f) ? "resource" : "scenario")
                + "</td>").append("</tr>\n");
        shown++;
      }
    }
    String blank = resource == null ? "" : "<td></td>";
    if (view.observer() instanceof GroundSite g) {
      b.append("<tr><td>horizon mask</td><td>").append(g.horizonMask().isEmpty() ? "none" : esc(mask(g)))
          .append("</td>").append(blank).append("</tr>\n");
      b.append("<tr><td>refraction</td><td>").append(g.refraction() == null ? "none (geometric elevations)"
          : esc(g.refraction().toString())).append("</td>").append(blank).append("</tr>\n");
    }
    if (!view.hasResources()) {
      b.append("<tr><td>slew</td><td>").append(esc(slewText(view.slew()))).append("</td>").append(blank)
          .append("</tr>\n");
    }
    b.append("</tbody></table>\n");
    if (shown == 0) {
      b.append(resource == null ? "<p>The scenario sets no constraint fields: only the observer's geometry limits "
          + "visibility.</p>\n" : "<p>No constraint fields apply to this resource: only its observer's geometry limits "
          + "visibility.</p>\n");
    }
  }

  private static String mask(GroundSite g) {
    StringBuilder m = new StringBuilder();
    for (AzEl p : g.horizonMask()) {
      m.append(m.length() == 0 ? "" : ", ").append(String.format(Locale.ROOT, "az %.0f\u00b0 el %.0f\u00b0",
          p.azimuthDeg(), p.elevationDeg()));
    }
    return m.toString();
  }

  private static String slewText(SlewSettings sl) {
    if (sl instanceof SlewSettings.AltAz a) {
      return String.format(Locale.ROOT, "altaz: azimuth %.2f\u00b0/s, elevation %.2f\u00b0/s, settle %.0f s",
          a.azimuthRateDegPerS(), a.elevationRateDegPerS(), a.settleS());
    }
    if (sl instanceof SlewSettings.Eigenaxis e) {
      return String.format(Locale.ROOT, "eigenaxis: %.2f\u00b0/s, %.3f\u00b0/s\u00b2, settle %.0f s", e.rateDegPerS(),
          e.accelDegPerS2(), e.settleS());
    }
    if (sl instanceof SlewSettings.Fixed f) {
      return String.format(Locale.ROOT, "fixed: %.0f s between observations", f.seconds());
    }
    if (sl instanceof SlewSettings.Matrix) {
      return "matrix: seconds between each pair of requests, given in the scenario";
    }
    return String.valueOf(sl);
  }

  /** Charts drawn (for tests). */
  int charts() {
    return charts;
  }

  private static final String CSS = """
      body{font-family:sans-serif;margin:1.2em auto;max-width:1440px;padding:0 1em;color:#222;background:#fff}
      h1{font-size:1.6em;margin:.2em 0}h2{font-size:1.25em;border-bottom:1px solid #ccc;margin-top:1.6em}
      .caution{background:#fff4e0;border:1px solid #e0a040;padding:.6em .8em}
      .bad{background:#fde8e8;border:1px solid #c33;padding:.6em .8em}.warn{background:#fffbe0;border:1px solid #cb3;padding:.4em .8em}
      dl.summary{display:grid;grid-template-columns:max-content auto;gap:.25em 1em}dt{font-weight:bold}dd{margin:0}
      svg.chart{width:100%;height:auto;display:block;border:1px solid #eee}
      figure{margin:1em 0}figcaption{color:#555;font-size:.9em}
      table{border-collapse:collapse;font-size:.88em;margin:.5em 0}th,td{border:1px solid #ccc;padding:.2em .45em;text-align:left}
      th{background:#f2f4f8}table.sortable th{cursor:pointer}th.asc:after{content:" \\u25b2"}th.desc:after{content:" \\u25bc"}
      tbody tr:nth-child(even){background:#fafafa}.hint{color:#555;font-size:.9em}
      rect.obs{fill:#1f4ea0}rect.slew{fill:#eb7814}rect.sun{fill:#fad778;opacity:.6}line.grid{stroke:#bbb;stroke-width:.6}
      text.tick{font-size:12px;fill:#444}text.lane-name{font-size:13px;font-weight:bold}
      footer{margin-top:2em;color:#666;font-size:.85em}
      """;

  /** Sorting: numbers by value, text by text, blanks last; "#sort=N" or "#sort=-N" sorts the observations on load. */
  private static final String SCRIPT = """
      (function () {
        'use strict';
        function keyOf(row, col) {
          var c = row.cells[col];
          return c ? (c.getAttribute('data-v') || '') : '';
        }
        function sortTable(table, col, desc) {
          var body = table.tBodies[0];
          var rows = Array.prototype.slice.call(body.rows);
          var numeric = rows.every(function (r) { var k = keyOf(r, col); return k === '' || isFinite(Number(k)); });
          rows.sort(function (a, b) {
            var x = keyOf(a, col), y = keyOf(b, col);
            if (x === '' || y === '') { return x === y ? 0 : (x === '' ? 1 : -1); }
            var d = numeric ? Number(x) - Number(y) : (x < y ? -1 : x > y ? 1 : 0);
            return desc ? -d : d;
          });
          rows.forEach(function (r) { body.appendChild(r); });
          Array.prototype.forEach.call(table.tHead.rows[0].cells, function (th, i) {
            th.className = i === col ? (desc ? 'desc' : 'asc') : '';
          });
        }
        Array.prototype.forEach.call(document.querySelectorAll('table.sortable'), function (table) {
          Array.prototype.forEach.call(table.tHead.rows[0].cells, function (th, i) {
            th.addEventListener('click', function () { sortTable(table, i, th.className === 'asc'); });
          });
        });
        var m = /^#sort=(-?)(\\d+)$/.exec(window.location.hash);
        var obs = document.getElementById('observations-table');
        if (m && obs) {
          var col = Number(m[2]) - 1;
          if (col >= 0 && col < obs.tHead.rows[0].cells.length) { sortTable(obs, col, m[1] === '-'); }
        }
        document.body.setAttribute('data-ready', 'yes');
      })();
      """;
}
