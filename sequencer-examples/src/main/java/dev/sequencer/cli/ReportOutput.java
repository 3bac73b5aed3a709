package dev.sequencer.cli;

import dev.sequencer.charts.TimeAxes;
import dev.sequencer.io.AtomicFiles;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Observer;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
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

  /**
   * The zone of "local time" at {@code observer}: {@code --zone} when given, else the site's nautical zone (UTC for
   * a spacecraft, or without an observer).
   */
  static ZoneId zone(String zoneArg, Observer observer) {
    if (zoneArg != null) {
      try {
        return ZoneId.of(zoneArg.trim());
      } catch (DateTimeException e) {
        throw new InputException("--zone: '" + zoneArg + "' is not a time zone (give a region such as Africa/Cairo "
            + "or an offset such as +02:00)");
      }
    }
    return observer instanceof GroundSite g ? TimeAxes.nauticalZone(g.longitudeDeg()) : ZoneId.of("UTC");
  }

  /** How the zone of {@link #zone} was chosen, for the axis label. */
  static String zoneNote(String zoneArg, Observer observer) {
    if (zoneArg != null) {
      return "--zone";
    }
    return observer instanceof GroundSite ? "nautical zone of the longitude; --zone to choose" : null;
  }

  /** With several resources (A6), each resource's zone of "local time" by id, by the rule of {@link #zone}. */
  static Map<String, NightReport.LocalZone> resourceZones(String zoneArg, Scenario s) {
    Map<String, NightReport.LocalZone> out = new LinkedHashMap<>();
    for (Resource r : s.resources()) {
      out.put(r.id(), new NightReport.LocalZone(zone(zoneArg, r.observer()), zoneNote(zoneArg, r.observer())));
    }
    return out;
  }

  /** Writes the report of {@code t} to {@code file} and says so on {@code out}. */
  static void write(Pipeline p, Timeline t, Double gap, List<String> warnings, List<String> violations, String zoneArg,
      Path file, PrintWriter out) {
    Map<String, String> reasons = new LinkedHashMap<>();
    for (Unscheduled u : t.unscheduled()) {
      reasons.put(u.id(), Explained.of(u, p.visibility()));
    }
    NightReport.Input in = new NightReport.Input(p.scenario(), t, p.windows(), gap, warnings, reasons,
        zone(zoneArg, p.scenario().observer()), zoneNote(zoneArg, p.scenario().observer()), violations,
        p.windowsByResource(), resourceZones(zoneArg, p.scenario()));
    AtomicFiles.writeUtf8(file, NightReport.html(in, p.astro()));
    out.println("wrote " + file);
  }
}
