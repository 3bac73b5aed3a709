package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Command-line habits: --version everywhere, "did you mean", malformed JSON in our words, --quiet, --verbose. */
class CliHabitsTest {
  private static final Path DEMO = Path.of("src/main/resources/scenarios/demo-night.json");

  /** The project version, from the build (not from the file the program reads). */
  private static String version() {
    String v = System.getProperty("sequencer.build.version");
    assumeTrue(v != null, "run through Maven (sequencer.build.version)");
    return v;
  }

  @Test
  void everyCommandPrintsTheVersion() {
    List<List<String>> asks = new ArrayList<>();
    asks.add(List.of("--version"));
    asks.add(List.of("-V"));
    for (String cmd : List.of("demo", "inspect", "windows", "plan", "replan", "check", "campaign", "sweep",
        "help")) {
      asks.add(List.of(cmd, "--version"));
      asks.add(List.of(cmd, "-V"));
    }
    for (List<String> a : asks) {
      Runs.Run r = Runs.run(a.toArray(String[]::new));
      assertEquals(0, r.code(), r::all);
      assertTrue(r.out().startsWith("sequencer " + version() + "\n"), r::all);
      assertTrue(r.out().contains("Java " + System.getProperty("java.version")), r::all);
    }
  }

  @Test
  void aMistypedCommandGetsTheNearestOnes() {
    Runs.Run r = Runs.run("pln", DEMO.toString());
    assertEquals(2, r.code(), r::all);
    assertEquals("sequencer: 'pln' is not a command (did you mean plan or replan?)\nTry 'sequencer --help'.",
        r.err().strip(), r::all);
    Runs.Run w = Runs.run("windwos");
    assertTrue(w.err().startsWith("sequencer: 'windwos' is not a command (did you mean windows"), w::all);
    Runs.Run none = Runs.run("zzz");
    assertTrue(none.err().startsWith("sequencer: 'zzz' is not a command\n"), none::all);
  }

  @Test
  void aMistypedOptionGetsTheNearestOne() {
    Runs.Run r = Runs.run("plan", DEMO.toString(), "--time-limt", "3");
    assertEquals(2, r.code(), r::all);
    assertTrue(r.err().startsWith("sequencer plan: unknown option '--time-limt' (did you mean --time-limit?)\n"
        + "Try 'sequencer plan --help'."), r::all);
    assertTrue(r.out().isEmpty(), r::all);
  }

  @Test
  void malformedJsonNamesFileLineColumnAndWhatWasExpected(@TempDir Path dir) throws Exception {
    Path f = Files.writeString(dir.resolve("night.json"), "{\n  \"format\": 1,\n  \"name\": \"x\",\n}\n");
    Runs.Run r = Runs.run("inspect", f.toString());
    Runs.assertNoStackTrace(r);
    assertEquals(2, r.code(), r::all);
    assertEquals("malformed JSON at line 4, column 1 of " + f + ": expected a field name in double quotes, found '}' "
        + "(JSON allows no comma before '}')\n1 problem(s) in " + f, r.err().strip(), r::all);
  }

  @Test
  void quietPrintsNothingOnSuccess(@TempDir Path dir) {
    Path out = dir.resolve("demo-out");
    Runs.Run r = Runs.run("demo", "--quiet", "--solver", "greedy", "-o", out.toString());
    assertEquals(0, r.code(), r::all);
    assertEquals("", r.out(), r::all);
    assertEquals("", r.err(), r::all);
    assertTrue(Files.isRegularFile(out.resolve("timeline.json")), "the work was done");
    // The option is accepted before the command name as well; warnings still come, on standard error.
    Runs.Run before = Runs.run("-q", "inspect", DEMO.toString());
    assertEquals(0, before.code(), before::all);
    assertEquals("", before.out(), before::all);
    assertTrue(before.err().lines().allMatch(l -> l.startsWith("warning")), before::all);
  }

  @Test
  void quietStillSaysWhyACommandFailed(@TempDir Path dir) throws Exception {
    Path tl = dir.resolve("t.json");
    assertEquals(0, Runs.run("plan", DEMO.toString(), "--solver", "greedy", "-o", tl.toString()).code());
    // Move the first observation by a second: it no longer matches its duration or transition.
    String text = Files.readString(tl);
    String first = text.substring(text.indexOf("\"start\": \"") + 10, text.indexOf("\"start\": \"") + 30);
    Path broken = Files.writeString(dir.resolve("broken.json"), text.replaceFirst(java.util.regex.Pattern.quote(first),
        java.time.Instant.parse(first).plusSeconds(1).toString()));
    Runs.Run r = Runs.run("check", "--quiet", DEMO.toString(), broken.toString());
    assertEquals(1, r.code(), r::all);
    assertEquals("", r.out(), r::all);
    assertTrue(r.err().contains("violation(s)"), r::all);
  }

  @Test
  void quietAndHelpStillPrintHelp() {
    Runs.Run r = Runs.run("plan", "--quiet", "--help");
    assertEquals(0, r.code(), r::all);
    assertTrue(r.out().contains("--time-limit"), r::all);
  }

  /**
   * --verbose logs each phase at debug level to standard error; without it nothing is logged. Child JVMs:
   * slf4j-simple fixes a logger's level when the logger is made, once per JVM.
   */
  @Test
  void verboseLogsThePhasesToStandardError(@TempDir Path dir) throws Exception {
    String[] quietRun = child(dir, "windows", DEMO.toString(), "-o", dir.resolve("w.json").toString());
    assertFalse(quietRun[1].contains("DEBUG"), quietRun[1]);
    String[] verboseRun = child(dir, "windows", DEMO.toString(), "-o", dir.resolve("w.json").toString(), "--verbose");
    String log = verboseRun[1];
    assertTrue(log.contains("DEBUG ScenarioReader - read " + DEMO + ": 40 requests, in "), log);
    assertTrue(log.contains("DEBUG VisibilityCalculator - visibility: 40 requests, "), log);
    assertTrue(log.contains("DEBUG AtomicFiles - wrote " + dir.resolve("w.json")), log);
    assertTrue(log.contains("DEBUG SequencerCli - sequencer windows: exit 0 after "), log);
    assertFalse(verboseRun[0].contains("DEBUG"), "log lines stay out of standard output");
  }

  /** Runs the command line in a child JVM; returns {stdout, stderr}. */
  private static String[] child(Path dir, String... args) throws Exception {
    List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
        "-cp", System.getProperty("java.class.path"), SequencerCli.class.getName()));
    cmd.addAll(List.of(args));
    Path out = dir.resolve("child.out");
    Path err = dir.resolve("child.err");
    Process p = new ProcessBuilder(cmd).redirectOutput(out.toFile()).redirectError(err.toFile()).start();
    if (!p.waitFor(120, TimeUnit.SECONDS)) {
      p.destroyForcibly();
    }
    String[] both = {Files.readString(out, StandardCharsets.UTF_8), Files.readString(err, StandardCharsets.UTF_8)};
    assertEquals(0, p.exitValue(), both[0] + both[1]);
    return both;
  }
}
