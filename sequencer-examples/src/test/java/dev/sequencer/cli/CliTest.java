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
    for (String cmd : List.of("inspect", "windows", "plan", "check")) {
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
    assertTrue(bad.code() == 1 || bad.code() == 2, bad.out() + bad.err());
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
}
