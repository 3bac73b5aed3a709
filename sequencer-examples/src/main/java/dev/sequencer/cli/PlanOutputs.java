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

/** Writes what {@code plan} and {@code demo} produce besides the timeline file: the CSV and the pictures. */
final class PlanOutputs {
  private PlanOutputs() {}

  /** Writes the CSV of {@code timeline} and reports the path. */
  static void csv(Pipeline p, Timeline timeline, Path file, PrintWriter out) {
    PlanCsv.write(timeline, new PlanGeometry(p.scenario(), p.astro()), file);
    out.println("wrote " + file);
  }

  /**
   * Writes PREFIX-timeline.png/.svg and PREFIX-sky.png/.svg; returns the four paths. {@code prefix} may
   * name a directory part ("out/night" gives out/night-timeline.png).
   */
  static List<Path> plots(Pipeline p, Timeline timeline, String prefix, boolean includeUnscheduled, PrintWriter out) {
    ChartFiles.headless();
    PlanGeometry g = new PlanGeometry(p.scenario(), p.astro());
    List<Path> written = new ArrayList<>();
    JFreeChart tl = TimelineChart.create(g, p.windows(), timeline, includeUnscheduled);
    int h = TimelineChart.heightPx(timeline, includeUnscheduled);
    written.add(write(tl, TimelineChart.WIDTH_PX, h, Path.of(prefix + "-timeline.png")));
    written.add(write(tl, TimelineChart.WIDTH_PX, h, Path.of(prefix + "-timeline.svg")));
    JFreeChart sky = SkyChart.create(g, timeline);
    written.add(write(sky, SkyChart.WIDTH_PX, SkyChart.HEIGHT_PX, Path.of(prefix + "-sky.png")));
    written.add(write(sky, SkyChart.WIDTH_PX, SkyChart.HEIGHT_PX, Path.of(prefix + "-sky.svg")));
    written.forEach(f -> out.println("wrote " + f));
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
