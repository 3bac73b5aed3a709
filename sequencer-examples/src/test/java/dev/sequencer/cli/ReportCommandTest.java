package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.io.TimelineFile;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Timeline;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code sequencer report}: exit codes, checked outputs, the re-check, and what the page says (no browser). */
class ReportCommandTest {
  private static final Path DEMO = Path.of("src/main/resources/scenarios/demo-night.json");
  @TempDir static Path dir;
  private static Path timeline;

  @BeforeAll
  static void plan() {
    timeline = dir.resolve("t.json");
    Runs.Run r = Runs.run("plan", DEMO.toString(), "--solver", "greedy", "-o", timeline.toString());
    assertEquals(0, r.code(), r::all);
  }

  @Test
  void validTimelineGivesAReportAndExitZero() throws Exception {
    Path html = dir.resolve("night.html");
    Runs.Run r = Runs.run("report", DEMO.toString(), timeline.toString(), "-o", html.toString(), "--zone", "Africa/Cairo");
    assertEquals(0, r.code(), r::all);
    String page = Files.readString(html);
    Timeline t = TimelineFile.read(timeline);
    assertTrue(page.startsWith("<!DOCTYPE html>"));
    assertTrue(page.contains("Plans are advisory"), "the caution");
    assertFalse(page.contains("id=\"violations\""));
    for (Observation o : t.observations()) {
      assertTrue(page.contains("<td data-v=\"" + o.id() + "\">"), o.id());
    }
    assertTrue(page.contains("local time (EET"), "the zone asked for names the local-time axis");
    assertTrue(page.contains("id=\"constraints-table\"") && page.contains("moonSeparationMinDeg"));
  }

  @Test
  void tamperedTimelineIsReportedAsFailingAndExitsOne() throws Exception {
    Timeline t = TimelineFile.read(timeline);
    List<Observation> obs = new ArrayList<>(t.observations());
    // The last observation moved to end at the horizon's end, 05:00 UTC: in daylight at the site.
    int last = obs.size() - 1;
    Observation o = obs.get(last);
    java.time.Instant end = java.time.Instant.parse("2031-10-15T05:00:00Z");
    obs.set(last, new Observation(o.id(), end.minusMillis(Math.round(o.durationS() * 1000)), end, o.slewSeconds(),
        o.value(), o.state(), null, List.of()));
    Path bad = dir.resolve("bad.json");
    TimelineFile.write(new Timeline(t.status(), t.priority(), t.slewSeconds(), t.bound(), obs, t.unscheduled()), bad);
    Path html = dir.resolve("bad.html");
    Runs.Run r = Runs.run("report", DEMO.toString(), bad.toString(), "-o", html.toString());
    assertEquals(1, r.code(), r::all);
    assertTrue(Files.readString(html).contains("fails the re-check"));
  }

  @Test
  void badZoneAndUnwritableOutputAreInputErrors() {
    Runs.Run zone = Runs.run("report", DEMO.toString(), timeline.toString(), "-o", dir.resolve("z.html").toString(),
        "--zone", "Mars/Olympus");
    assertEquals(2, zone.code(), zone::all);
    assertTrue(zone.err().contains("--zone: 'Mars/Olympus' is not a time zone"), zone::all);
    assertFalse(Files.exists(dir.resolve("z.html")));
    Runs.Run out = Runs.run("report", DEMO.toString(), timeline.toString(), "-o", "/proc/night.html");
    assertEquals(2, out.code(), out::all);
    assertTrue(out.err().startsWith("--output: cannot write /proc/night.html"), out::all);
    Runs.Run missing = Runs.run("report", DEMO.toString(), timeline.toString());
    assertEquals(2, missing.code(), missing::all);
  }
}
