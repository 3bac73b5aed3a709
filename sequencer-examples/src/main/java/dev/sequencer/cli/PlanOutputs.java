package dev.sequencer.cli;

import dev.sequencer.charts.ChartFiles;
import dev.sequencer.charts.PlanGeometry;
import dev.sequencer.charts.ResourcePlan;
import dev.sequencer.charts.SkyChart;
import dev.sequencer.charts.TimelineChart;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import org.jfree.chart.JFreeChart;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/** Writes what {@code plan} and {@code demo} produce besides the timeline file: the CSV and the pictures. */
final class PlanOutputs {
  /**
   * What {@code --plot PREFIX} appends to the prefix for {@code s}, in the order the files are written: the
   * timeline chart, then the sky chart, or with several resources (A6) one sky chart per resource in file order,
   * "-sky-ID" with the id made safe for a file name ({@link ChartFiles#fileNames}).
   */
  static List<String> plotSuffixes(Scenario s) {
    List<String> skies = s.hasResources()
        ? ChartFiles.fileNames(s.resources().stream().map(dev.sequencer.model.Resource::id).toList()).values().stream()
            .map(part -> "-sky-" + part).toList()
        : List.of("-sky");
    List<String> out = new ArrayList<>(List.of("-timeline.png", "-timeline.svg"));
    skies.forEach(sky -> out.addAll(List.of(sky + ".png", sky + ".svg")));
    return out;
  }

  private static final Logger LOG = LoggerFactory.getLogger(PlanOutputs.class);

  private PlanOutputs() {}

  /** Writes the CSV of {@code timeline} and reports the path. */
  static void csv(Pipeline p, Timeline timeline, Path file, PrintWriter out) {
    java.util.Map<String, String> reasons = new java.util.LinkedHashMap<>();
    timeline.unscheduled().forEach(u -> reasons.put(u.id(), Explained.of(u, p.visibility())));
    PlanCsv.write(timeline, new PlanGeometry(p.scenario(), p.astro()), reasons, file);
    out.println("wrote " + file);
  }

  /**
   * Writes PREFIX-timeline.png/.svg and PREFIX-sky.png/.svg (with several resources PREFIX-sky-ID.png/.svg for
   * each, {@link #plotSuffixes}); returns the paths. {@code prefix} may name a directory part ("out/night" gives
   * out/night-timeline.png).
   */
  static List<Path> plots(Pipeline p, Timeline timeline, String prefix, boolean includeUnscheduled, PrintWriter out) {
    long t0 = System.nanoTime();
    ChartFiles.headless();
    Scenario s = p.scenario();
    PlanGeometry g = new PlanGeometry(s, p.astro());
    List<Path> written = new ArrayList<>();
    Iterator<String> suffix = plotSuffixes(s).iterator();
    JFreeChart tl = s.hasResources()
        ? TimelineChart.createByResource(g, p.windowsByResource(), timeline, includeUnscheduled, Map.of(), null)
        : TimelineChart.create(g, p.windows(), timeline, includeUnscheduled);
    int h = TimelineChart.heightPx(s, timeline, includeUnscheduled, null);
    written.add(write(tl, TimelineChart.WIDTH_PX, h, Path.of(prefix + suffix.next())));
    written.add(write(tl, TimelineChart.WIDTH_PX, h, Path.of(prefix + suffix.next())));
    List<JFreeChart> skies = s.hasResources()
        ? ResourcePlan.of(s, timeline).stream().map(r -> SkyChart.create(g, r)).toList()
        : List.of(SkyChart.create(g, timeline));
    for (JFreeChart sky : skies) {
      written.add(write(sky, SkyChart.WIDTH_PX, SkyChart.HEIGHT_PX, Path.of(prefix + suffix.next())));
      written.add(write(sky, SkyChart.WIDTH_PX, SkyChart.HEIGHT_PX, Path.of(prefix + suffix.next())));
    }
    written.forEach(f -> out.println("wrote " + f));
    LOG.debug("charts: {} files in {} ms", written.size(), (System.nanoTime() - t0) / 1_000_000);
    return written;
  }

  private static Path write(JFreeChart chart, int w, int h, Path file) {
    if (file.toString().endsWith(".png")) {
      ChartFiles.png(chart, w, h, file);
    } else {
      ChartFiles.svg(chart, w, h, file);
    }
    return file;
  }
}
