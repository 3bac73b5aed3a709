package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.io.WindowsFile;
import dev.sequencer.model.RequestWindows;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The command line's behaviour: exit codes, messages, files. */
class CliTest {
  private static final Path DEMO = Path.of("src/main/resources/scenarios/demo-night.json");

  record Run(int code, String out, String err) {}

  static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = SequencerCli.execute(new PrintWriter(out), new PrintWriter(err), args);
    return new Run(code, out.toString(), err.toString());
  }

  @Test
  void inspectValidScenarioPrintsSummaryAndExitsZero() {
    Run r = run("inspect", DEMO.toString());
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("requests    40 {fixed RA/Dec=40}"), r.out());
    assertTrue(r.out().contains("horizon     2031-10-14T15:00:00Z .. 2031-10-15T05:00:00Z (14.00 h)"), r.out());
  }

  @Test
  void leapSecondsFileIsUsedAndBadOnesExitTwo(@TempDir Path dir) throws Exception {
    // A Leap_Second.dat-style file whose validity ends before the demo night (2031-10-14): inspect then
    // warns with that file's date, which shows the file replaced the bundled table.
    Path old = Files.writeString(dir.resolve("Leap_Second.dat"), "#  File expires on 28 June 2030\n"
        + "    41317.0    1  1 1972       10\n");
    Run r = run("inspect", DEMO.toString(), "--leap-seconds", old.toString());
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("warning     the horizon ends after 2030-06-28"), r.out());
    Run bad = run("windows", DEMO.toString(), "--leap-seconds", dir.resolve("missing.list").toString());
    assertEquals(2, bad.code(), bad.err());
    assertTrue(bad.err().contains("missing.list: no such file (--leap-seconds)"), bad.err());
    Path broken = Files.writeString(dir.resolve("broken.list"), "#@ 4023129600\n2272060800 11\n");
    Run refused = run("windows", DEMO.toString(), "--leap-seconds", broken.toString());
    assertEquals(2, refused.code(), refused.err());
    assertTrue(refused.err().contains("must start with TAI-UTC = 10 s on 1972-01-01"), refused.err());
    Run both = run("windows", DEMO.toString(), "--leap-seconds", old.toString(), "--orekit-data", dir.toString());
    assertEquals(2, both.code(), both.err());
    assertTrue(both.err().contains("give one or the other"), both.err());
  }

  @Test
  void inspectSaysWhichKeepOutsHoldDuringSlews(@TempDir Path dir) throws Exception {
    // Spec A3: the keep-outs during slews are on by default; inspect says which, and says so when off.
    Path leo = Path.of("src/main/resources/scenarios/leo-telescope-day.json");
    Run on = run("inspect", leo.toString());
    assertEquals(0, on.code(), on.out() + on.err());
    assertTrue(on.out().contains("keep-outs   during slews: Sun >= 50 deg, Earth limb >= 20 deg along every slew "
        + "path"), on.out());
    Path off = dir.resolve("off.json");
    Files.writeString(off, Files.readString(leo).replace("\"model\": \"eigenaxis\",",
        "\"model\": \"eigenaxis\", \"keepOutDuringSlew\": false,"));
    Run r = run("inspect", off.toString());
    assertEquals(0, r.code(), r.out() + r.err());
    assertTrue(r.out().contains("keep-outs   during slews: off"), r.out());
  }

  @Test
  void inspectBrokenScenarioListsEveryProblemWithPathAndExitsTwo(@TempDir Path dir) throws Exception {
    Path bad = dir.resolve("bad.json");
    Files.writeString(bad, "{\"format\":1,\"horizon\":{\"start\":\"2031-01-01T00:00:00Z\",\"end\":\"2030-01-01T00:00:00Z\"},"
        + "\"slew\":{\"model\":\"fixed\",\"seconds\":60},"
        + "\"requests\":[{\"id\":\"A\",\"durationS\":-5,\"priority\":1,\"windows\":[[\"2031-01-01T00:00:00Z\",\"2031-01-01T01:00:00Z\"]]}]}");
    Run r = run("inspect", bad.toString());
    assertEquals(2, r.code());
    assertTrue(r.err().contains("horizon.end: end 2030-01-01T00:00:00Z is before start 2031-01-01T00:00:00Z"), r.err());
    assertTrue(r.err().contains("requests[0] (id \"A\").durationS: must be >= 0 (was -5)"), r.err());
    assertFalse(r.err().contains("Exception"), r.err());
  }

  @Test
  void malformedJsonAndMissingFileExitTwoWithoutStackTrace(@TempDir Path dir) throws Exception {
    Path bad = dir.resolve("bad.json");
    Files.writeString(bad, "{\"format\": 1, \"horizon\": ");
    Run r = run("inspect", bad.toString());
    assertEquals(2, r.code());
    assertFalse(r.err().contains("\tat "), r.err());
    Run missing = run("windows", dir.resolve("nope.json").toString());
    assertEquals(2, missing.code());
    assertTrue(missing.err().contains("nope.json"), missing.err());
  }

  @Test
  void everyCommandHelpCarriesTheCaution() {
    for (String cmd : List.of("demo", "inspect", "windows", "plan", "check")) {
      Run r = run(cmd, "--help");
      assertEquals(0, r.code());
      assertTrue(r.out().contains("plans are advisory"), cmd + ": " + r.out());
    }
    assertTrue(run("--help").out().contains("plans are advisory"));
  }

  @Test
  void planWritesATimelineThatCheckAccepts(@TempDir Path dir) throws Exception {
    Path tl = dir.resolve("t.json");
    Run r = run("plan", DEMO.toString(), "--solver", "greedy", "-o", tl.toString());
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("status FEASIBLE"), r.out());
    Run c = run("check", DEMO.toString(), tl.toString());
    assertEquals(0, c.code(), c.out() + c.err());
    // A timeline whose first observation is moved one hour earlier must be rejected with exit code 1.
    String json = Files.readString(tl);
    var m = java.util.regex.Pattern.compile("\"start\": \"(2031-10-1[45]T[0-9:.]+Z)\"").matcher(json);
    assertTrue(m.find(), json);
    java.time.Instant moved = java.time.Instant.parse(m.group(1)).minusSeconds(3600);
    Path broken = dir.resolve("broken.json");
    Files.writeString(broken, json.replaceFirst(java.util.regex.Pattern.quote(m.group(1)), moved.toString()));
    Run bad = run("check", DEMO.toString(), broken.toString());
    assertEquals(1, bad.code(), bad.out() + bad.err()); // a valid file with a violating plan: exit 1, not 2
  }

  @Test
  void windowsWritesTheSpecFileForEveryRequest(@TempDir Path dir) {
    Path out = dir.resolve("w.json");
    Run r = run("windows", DEMO.toString(), "-o", out.toString());
    assertEquals(0, r.code(), r.err());
    List<RequestWindows> w = WindowsFile.read(out);
    assertEquals(40, w.size());
    // Darkness (Sun below -12 deg) at 24.6 N in mid-October lasts about 10 h: no window may be longer.
    // (Common practice: astronomical night at that latitude and season is about 10-11 h.)
    w.forEach(x -> assertTrue(x.totalS() <= 11 * 3600, x.id() + " " + x.totalS()));
    assertTrue(w.stream().anyMatch(x -> !x.intervals().isEmpty()));
  }

  @Test
  void demoWritesTimelineWindowsCsvAndPicturesThatCheckAccepts(@TempDir Path dir) throws Exception {
    Path out = dir.resolve("demo-out");
    Run r = run("demo", "-o", out.toString(), "--solver", "greedy");
    assertEquals(0, r.code(), r.out() + r.err());
    assertTrue(r.out().contains("check: valid"), r.out());
    for (String f : List.of("timeline.json", "windows.json", "plan.csv", "night.html", "demo-timeline.png", "demo-timeline.svg",
        "demo-sky.png", "demo-sky.svg")) {
      assertTrue(Files.size(out.resolve(f)) > 0, f);
      assertTrue(r.out().contains(out.resolve(f).toString()), "summary names " + f + ": " + r.out());
    }
    // PNG signature (ISO/IEC 15948, section 5.2) and an SVG root element.
    byte[] png = Files.readAllBytes(out.resolve("demo-sky.png"));
    assertEquals(0x89, png[0] & 0xff);
    assertEquals("PNG", new String(png, 1, 3, java.nio.charset.StandardCharsets.US_ASCII));
    assertTrue(Files.readString(out.resolve("demo-timeline.svg")).contains("<svg"));
    // The written timeline passes the same re-check as the check command, from the copy in the jar.
    Path scenario = dir.resolve("demo-night.json");
    Files.copy(DEMO, scenario);
    assertEquals(0, run("check", scenario.toString(), out.resolve("timeline.json").toString()).code());
    // One CSV line per observation, in timeline order, each with 19 fields and the observation's start (ISO-8601
    // and again as "yyyy-MM-dd HH:mm:ss"), then one line per unscheduled request with its reason.
    var timeline = dev.sequencer.io.TimelineFile.read(out.resolve("timeline.json"));
    List<String> csv = Files.readAllLines(out.resolve("plan.csv"));
    assertEquals(PlanCsv.HEADER, csv.get(0));
    assertEquals(timeline.observations().size() + timeline.unscheduled().size() + 1, csv.size());
    for (int k = 0; k < timeline.observations().size(); k++) {
      String[] f = csv.get(k + 1).split(",", -1);
      var o = timeline.observations().get(k);
      assertEquals(19, f.length, csv.get(k + 1));
      assertEquals(o.id(), f[0]);
      assertEquals(o.start().toString(), f[1]);
      assertEquals(o.start().truncatedTo(java.time.temporal.ChronoUnit.SECONDS).toString().replace("T", " ").replace("Z", ""), f[10]);
      assertEquals("yes", f[12]);
      assertEquals(o.durationS(), Double.parseDouble(f[3]), 1e-3);
      assertEquals(o.slewSeconds(), Double.parseDouble(f[4]), 1e-3);
      // The site's elevation limit is 25 deg: every start pointing is above it (independent geometry).
      assertTrue(Double.parseDouble(f[9]) >= 25 - 0.01, csv.get(k + 1));
    }
    for (int k = 0; k < timeline.unscheduled().size(); k++) {
      String line = csv.get(timeline.observations().size() + 1 + k);
      var u = timeline.unscheduled().get(k);
      assertTrue(line.startsWith(u.id() + ",,,,,"), line);
      assertTrue(line.contains(",no,"), line);
      assertFalse(line.contains(",no,,"), "a reason: " + line);
    }
  }

  @Test
  void planWithOrbitingTargetsAndFixedSlewsWritesCsvAndPlots(@TempDir Path dir) throws Exception {
    Path scenario = Path.of("src/main/resources/scenarios/satellite-tracking-night.json");
    Run r = run("plan", scenario.toString(), "--solver", "greedy", "--csv", dir.resolve("p.csv").toString(),
        "--plot", dir.resolve("p").toString());
    assertEquals(0, r.code(), r.out() + r.err());
    for (String f : List.of("p.csv", "p-timeline.png", "p-timeline.svg", "p-sky.png", "p-sky.svg")) {
      assertTrue(Files.size(dir.resolve(f)) > 0, f);
    }
    List<String> csv = Files.readAllLines(dir.resolve("p.csv"));
    assertTrue(csv.size() > 1, "no observation in " + csv);
    // Orbiting targets from a ground site: az/el filled, and at least the 20 deg elevation limit.
    csv.stream().skip(1).filter(line -> line.split(",", -1)[12].equals("yes"))
        .forEach(line -> assertTrue(Double.parseDouble(line.split(",", -1)[9]) >= 20 - 0.01, line));
  }
}
