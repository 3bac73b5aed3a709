package dev.sequencer.cli;

import dev.sequencer.charts.PlanGeometry;
import dev.sequencer.io.AtomicFiles;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.Observation;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Timeline;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Optional;

/**
 * The plan as CSV for spreadsheets: a header, then one line per observation in time order with id,
 * start and end (ISO-8601 UTC), duration and transition before it (seconds), priority, and the pointing at
 * the start (RA/Dec, and azimuth/elevation at a ground site; empty cells where {@link PlanGeometry} gives
 * none), the start and end again as "yyyy-MM-dd HH:mm:ss" UTC (which spreadsheets parse as dates), then one
 * line per unscheduled request with its reason; last the visit number (A4; for an unscheduled request with
 * visits, how many are missing), the configuration label and the group (A5), and the resource that makes the
 * observation (A6; empty with one observer, whose pointing the azimuth and elevation are then in). Comma
 * separated, '.' decimals; fields containing a comma,
 * quote or line break are quoted (RFC 4180).
 */
final class PlanCsv {
  static final String HEADER = "id,start,end,duration_s,transition_before_s,priority,ra_deg,dec_deg,azimuth_deg,elevation_deg,"
      + "start_utc,end_utc,scheduled,reason,visit,visits_missing,configuration,group,resource";
  /** "2031-10-14 18:02:11": the form spreadsheets read as a date and time (ISO-8601's 'T' and 'Z' they often do not). */
  private static final java.time.format.DateTimeFormatter SHEET = java.time.format.DateTimeFormatter
      .ofPattern("yyyy-MM-dd HH:mm:ss", Locale.ROOT).withZone(java.time.ZoneOffset.UTC);

  private PlanCsv() {}

  /** The CSV text without reasons in words (the timeline's own reasons). */
  static String toCsv(Timeline t, PlanGeometry g) {
    return toCsv(t, g, java.util.Map.of());
  }

  /**
   * The CSV text, header first, lines ending in "\n": the observations in time order, then the unscheduled
   * requests (no times, "no" in {@code scheduled}, the reason from {@code reasons} or the timeline's).
   */
  static String toCsv(Timeline t, PlanGeometry g, java.util.Map<String, String> reasons) {
    StringBuilder b = new StringBuilder(HEADER).append('\n');
    java.util.Map<String, PlanGeometry> byResource = new java.util.HashMap<>();
    for (Observation o : t.observations()) {
      PlanGeometry here = o.resource() == null ? g : byResource.computeIfAbsent(o.resource(), g::forResource);
      Optional<Request> r = g.scenario().request(o.id());
      Optional<RaDec> rd = r.flatMap(x -> here.raDec(x, o.start()));
      Optional<AzEl> ae = r.flatMap(x -> here.azEl(x, o.start()));
      Double priority = r.map(Request::priority).orElse(null);
      b.append(quote(o.id())).append(',').append(o.start()).append(',').append(o.end()).append(',')
          .append(num(o.durationS(), 3)).append(',').append(num(o.slewSeconds(), 3)).append(',')
          .append(priority == null ? "" : num(priority, 6)).append(',')
          .append(rd.map(p -> num(p.raDeg(), 5)).orElse("")).append(',')
          .append(rd.map(p -> num(p.decDeg(), 5)).orElse("")).append(',')
          .append(ae.map(p -> num(p.azimuthDeg(), 4)).orElse("")).append(',')
          .append(ae.map(p -> num(p.elevationDeg(), 4)).orElse("")).append(',')
          .append(SHEET.format(o.start())).append(',').append(SHEET.format(o.end())).append(",yes,,")
          .append(o.visit() == null ? "" : o.visit().toString()).append(",,").append(structure(g, o.id())).append(',')
          .append(o.resource() == null ? "" : quote(o.resource())).append('\n');
    }
    for (dev.sequencer.model.Unscheduled u : t.unscheduled()) {
      Double priority = g.scenario().request(u.id()).map(Request::priority).orElse(null);
      b.append(quote(u.id())).append(",,,,,").append(priority == null ? "" : num(priority, 6)).append(",,,,,,,no,")
          .append(quote(reasons.getOrDefault(u.id(), u.reason()))).append(",,")
          .append(u.visitsMissing() == null ? "" : u.visitsMissing().toString()).append(',').append(structure(g, u.id()))
          .append(",\n");
    }
    return b.toString();
  }

  /** The request's configuration label and group id (A5), as two cells. */
  private static String structure(PlanGeometry g, String id) {
    String configuration = g.scenario().request(id).map(Request::configuration).orElse("");
    String group = g.scenario().groupOf(id).map(dev.sequencer.model.Group::id).orElse("");
    return quote(configuration) + "," + quote(group);
  }

  /** Writes the CSV to {@code file} atomically (temporary file, then move). */
  static void write(Timeline t, PlanGeometry g, java.util.Map<String, String> reasons, Path file) {
    AtomicFiles.writeUtf8(file, toCsv(t, g, reasons));
  }

  private static String num(double v, int decimals) {
    String s = String.format(Locale.ROOT, "%." + decimals + "f", v);
    // Trim trailing zeros so whole seconds read as "600", not "600.000".
    if (s.contains(".")) {
      s = s.replaceAll("0+$", "");
      s = s.endsWith(".") ? s.substring(0, s.length() - 1) : s;
    }
    return s.equals("-0") ? "0" : s;
  }

  private static String quote(String s) {
    if (s.contains(",") || s.contains("\"") || s.contains("\n") || s.contains("\r")) {
      return "\"" + s.replace("\"", "\"\"") + "\"";
    }
    return s;
  }
}
