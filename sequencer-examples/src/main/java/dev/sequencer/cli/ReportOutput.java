package dev.sequencer.cli;

import dev.sequencer.charts.TimeAxes;
import dev.sequencer.io.AtomicFiles;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.report.NightReport;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.DateTimeException;
import java.time.ZoneId;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Writes the HTML night report for {@code report}, {@code plan --report} and {@code demo}. */
final class ReportOutput {
  private ReportOutput() {}

  /** The zone of "local time": {@code --zone} when given, else the site's nautical zone (UTC for a spacecraft). */
  static ZoneId zone(String zoneArg, dev.sequencer.model.Scenario s) {
    if (zoneArg != null) {
      try {
        return ZoneId.of(zoneArg.trim());
      } catch (DateTimeException e) {
        throw new InputException("--zone: '" + zoneArg + "' is not a time zone (give a region such as Africa/Cairo "
            + "or an offset such as +02:00)");
      }
    }
    return s.observer() instanceof GroundSite g ? TimeAxes.nauticalZone(g.longitudeDeg()) : ZoneId.of("UTC");
  }

  /** How the zone was chosen, for the axis label. */
  static String zoneNote(String zoneArg, dev.sequencer.model.Scenario s) {
    if (zoneArg != null) {
      return "--zone";
    }
    return s.observer() instanceof GroundSite ? "nautical zone of the longitude; --zone to choose" : null;
  }

  /** Writes the report of {@code t} to {@code file} and says so on {@code out}. */
  static void write(Pipeline p, Timeline t, Double gap, List<String> warnings, List<String> violations, String zoneArg,
      Path file, PrintWriter out) {
    Map<String, String> reasons = new LinkedHashMap<>();
    for (Unscheduled u : t.unscheduled()) {
      reasons.put(u.id(), Explained.of(u, p.visibility()));
    }
    NightReport.Input in = new NightReport.Input(p.scenario(), t, p.windows(), gap, warnings, reasons,
        zone(zoneArg, p.scenario()), zoneNote(zoneArg, p.scenario()), violations, p.windowsByResource());
    AtomicFiles.writeUtf8(file, NightReport.html(in, p.astro()));
    out.println("wrote " + file);
  }
}
