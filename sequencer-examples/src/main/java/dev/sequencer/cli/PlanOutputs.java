package dev.sequencer.cli;

import dev.sequencer.charts.ChartFiles;
import dev.sequencer.charts.PlanGeometry;
import dev.sequencer.charts.SkyChart;
import dev.sequencer.charts.TimelineChart;
import dev.sequencer.model.Timeline;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.jfree.chart.JFreeChart;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/** Writes what {@code plan} and {@code demo} produce besides the timeline file: the CSV and the pictures. */
final class PlanOutputs {
  /** What {@code --plot PREFIX} appends to the prefix, in the order the files are written. */
  static final List<String> PLOT_SUFFIXES = List.of("-timeline.png", "-timeline.svg", "-sky.png", "-sky.svg");

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
   * Writes PREFIX-timeline.png/.svg and PREFIX-sky.png/.svg; returns the four paths. {@code prefix} may
   * name a directory part ("out/night" gives out/night-timeline.png).
   */
  static List<Path> plots(Pipeline p, Timeline timeline, String prefix, boolean includeUnscheduled, PrintWriter out) {
    long t0 = System.nanoTime();
    ChartFiles.headless();
    PlanGeometry g = new PlanGeometry(p.scenario(), p.astro());
    List<Path> written = new ArrayList<>();
    JFreeChart tl = TimelineChart.create(g, p.windows(), timeline, includeUnscheduled);
    int h = TimelineChart.heightPx(p.scenario(), timeline, includeUnscheduled, null);
    written.add(write(tl, TimelineChart.WIDTH_PX, h, Path.of(prefix + PLOT_SUFFIXES.get(0))));
    written.add(write(tl, TimelineChart.WIDTH_PX, h, Path.of(prefix + PLOT_SUFFIXES.get(1))));
    JFreeChart sky = SkyChart.create(g, timeline);
    written.add(write(sky, SkyChart.WIDTH_PX, SkyChart.HEIGHT_PX, Path.of(prefix + PLOT_SUFFIXES.get(2))));
    written.add(write(sky, SkyChart.WIDTH_PX, SkyChart.HEIGHT_PX, Path.of(prefix + PLOT_SUFFIXES.get(3))));
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
