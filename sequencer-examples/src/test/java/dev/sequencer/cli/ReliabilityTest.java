package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.io.TimelineFile;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Timeline;
import dev.sequencer.sequence.cpsat.NativeSolver;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

/**
 * Time limits, determinism, impossible required requests, output safety and the native-solver message,
 * through the command line. Scenarios are invented ({@link Synthetic}).
 */
class ReliabilityTest {
  private static final Instant NIGHT = Instant.parse("2031-03-01T18:00:00Z");

  /** plan -o, then check on the written file; both must succeed. */
  static Runs.Run planAndCheck(Path scenario, Path dir, String... planArgs) {
    Path tl = dir.resolve(scenario.getFileName() + ".timeline.json");
    String[] args = Stream.concat(Stream.of("plan", scenario.toString(), "-o", tl.toString()), Stream.of(planArgs))
        .toArray(String[]::new);
    Runs.Run plan = Runs.run(args);
    Runs.assertNoStackTrace(plan);
    assertEquals(0, plan.code(), plan::all);
    Runs.Run check = Runs.run("check", scenario.toString(), tl.toString());
    assertEquals(0, check.code(), check::all);
    return plan;
  }

  @Test
  void aLargeNightWithAShortLimitGetsAValidPlan(@TempDir Path dir) {
    // 800 windows-only requests over 24 h, 3 s limit: every phase (model build, bound, solve, LNS, repair,
    // validation) must leave a plan with its bound. How long the run takes against its limit is measured,
    // not asserted here: PlannerFuzzBenchmark and docs/benchmarks.md ("Time limits").
    Path s = Synthetic.write(Synthetic.windowsOnly(Synthetic.base(NIGHT, 24, 30), 800, new Random(11)),
        dir.resolve("s800.json"));
    Runs.Run plan = Runs.run("plan", s.toString(), "--time-limit", "3", "--workers", "2", "-o",
        dir.resolve("t.json").toString());
    assertEquals(0, plan.code(), plan::all);
    assertTrue(plan.out().contains("status FEASIBLE") || plan.out().contains("status OPTIMAL"), plan::all);
    assertTrue(plan.out().matches("(?s).*gap \\d+\\.\\d%.*"), plan::all);
    Runs.Run check = Runs.run("check", s.toString(), dir.resolve("t.json").toString());
    assertEquals(0, check.code(), check::all);
  }

  @Test
  void aLimitTheWindowsUseUpSaysSoEvenWhenQuiet(@TempDir Path dir) {
    // The bundled LEO day (300 requests, 24 h of orbit geometry) cannot have its windows computed in 0.1 s on
    // any machine, so the greedy baseline gets no time: found by CI, where a 5 s limit gave 54 observations
    // of 85 and an idle 2-core machine gave 0 without a word. The plan is still written and valid (exit 0),
    // and a warning (kept by --quiet) says why it is thin.
    Path tl = dir.resolve("t.json");
    Runs.Run cut = Runs.run("plan", "src/main/resources/scenarios/leo-telescope-day.json", "--solver", "greedy",
        "--time-limit", "0.1", "-q", "-o", tl.toString());
    Runs.assertNoStackTrace(cut);
    assertEquals(0, cut.code(), cut::all);
    assertTrue(cut.err().contains("warning: greedy stopped at the time limit")
        && cut.err().contains("warning: the time limit was too short"), cut::all);
    assertTrue(Files.exists(tl), cut::all);
    // Control: a small night whose baseline takes milliseconds is not warned about.
    Path s = Synthetic.write(Synthetic.windowsOnly(Synthetic.base(NIGHT, 8, 45), 40, new Random(5)),
        dir.resolve("s40.json"));
    Runs.Run fine = Runs.run("plan", s.toString(), "--solver", "greedy", "--time-limit", "5");
    assertEquals(0, fine.code(), fine::all);
    assertTrue(!fine.all().contains("warning"), fine::all);
  }

  @Test
  void reproducibleRunsWriteByteIdenticalTimelines(@TempDir Path dir) throws Exception {
    // --time-limit with --reproducible is a budget of 2 deterministic units, not 2 wall-clock seconds.
    Path s = Synthetic.write(Synthetic.windowsOnly(Synthetic.base(NIGHT, 8, 45), 40, new Random(5)),
        dir.resolve("s40.json"));
    byte[][] files = new byte[2][];
    for (int run = 0; run < 2; run++) {
      Path tl = dir.resolve("t" + run + ".json");
      Runs.Run r = Runs.run("plan", s.toString(), "--reproducible", "--time-limit", "2", "--seed", "3",
          "--workers", "2", "-o",
          tl.toString());
      assertEquals(0, r.code(), r::all);
      files[run] = Files.readAllBytes(tl);
    }
    assertArrayEquals(files[0], files[1]);
  }

  @Test
  void impossibleRequiredRequestsExitOneAndNameTheConflict(@TempDir Path dir) {
    // R2 and R4: 1800 s each, both only in the same 45 min: 60 min of work in 45 min. R1, R3 are free.
    ObjectNode sc = Synthetic.windowsOnly(Synthetic.base(NIGHT, 8, 30), 4, new Random(2));
    for (int k : new int[] {1, 3}) {
      ObjectNode q = (ObjectNode) sc.get("requests").get(k);
      q.put("required", true).put("durationS", 1800);
      q.putArray("windows").addArray().add("2031-03-01T20:00:00Z").add("2031-03-01T20:45:00Z");
    }
    Path s = Synthetic.write(sc, dir.resolve("clash.json"));
    Runs.Run r = Runs.run("plan", s.toString(), "--time-limit", "5", "--workers", "1");
    Runs.assertNoStackTrace(r);
    assertEquals(1, r.code(), r::all);
    assertTrue(r.out().contains("no plan (INFEASIBLE)"), r::all);
    assertTrue(r.out().contains("conflict: required requests S2, S4 cannot all be scheduled: mutual overlap"),
        r::all);
  }

  @Test
  void anAbsurdPriorityIsRefusedByPlanWithItsPath(@TempDir Path dir) {
    // Found by CliMutationProperties: priority 1e308 overflowed CP-SAT's integer objective (exit 3).
    ObjectNode sc = Synthetic.windowsOnly(Synthetic.base(NIGHT, 3, 6), 2, new Random(4));
    ((ObjectNode) sc.get("requests").get(0)).put("priority", 1e308);
    Path s = Synthetic.write(sc, dir.resolve("huge.json"));
    for (String solver : List.of("cpsat", "greedy")) {
      Runs.Run r = Runs.run("plan", s.toString(), "--solver", solver, "--time-limit", "1");
      Runs.assertNoStackTrace(r);
      assertEquals(2, r.code(), r::all);
      assertTrue(r.err().contains("requests[0] (id \"S1\").priority: the planner takes priorities up to 1e9"),
          r::all);
    }
  }

  @Test
  void fractionalDurationsAreRefusedByPlanWithTheirPath(@TempDir Path dir) {
    ObjectNode sc = Synthetic.windowsOnly(Synthetic.base(NIGHT, 3, 6), 2, new Random(4));
    ((ObjectNode) sc.get("requests").get(1)).put("durationS", 600.5);
    Runs.Run r = Runs.run("plan", Synthetic.write(sc, dir.resolve("frac.json")).toString(), "--time-limit", "1");
    Runs.assertNoStackTrace(r);
    assertEquals(2, r.code(), r::all);
    assertTrue(r.err().contains("requests[1] (id \"S2\").durationS: the planner needs a whole number of seconds"),
        r::all);
  }

  @Test
  void serialisationFailureLeavesTheExistingFileUntouched(@TempDir Path dir) throws Exception {
    Path target = dir.resolve("timeline.json");
    Files.writeString(target, "previous contents\n");
    Timeline bad = new Timeline(PlanStatus.FEASIBLE, Double.NaN, 0, null, List.of(), List.of());
    assertThrows(IllegalArgumentException.class, () -> TimelineFile.write(bad, target));
    assertEquals("previous contents\n", Files.readString(target));
    try (Stream<Path> files = Files.list(dir)) {
      assertEquals(List.of(target), files.toList(), "a temporary file was left behind");
    }
  }

  @Test
  void aSuccessfulWriteReplacesTheWholeFileAndLeavesNoTemporaryFile(@TempDir Path dir) throws Exception {
    Path target = dir.resolve("timeline.json");
    Files.writeString(target, "x".repeat(100_000)); // longer than any new content: no tail may survive
    Timeline t = new Timeline(PlanStatus.OPTIMAL, 0, 0, 0.0, List.of(), List.of());
    TimelineFile.write(t, target);
    assertEquals(TimelineFile.toJson(t), Files.readString(target));
    try (Stream<Path> files = Files.list(dir)) {
      assertEquals(List.of(target), files.toList());
    }
  }

  @Test
  void anOutputIntoAMissingFolderIsACleanError(@TempDir Path dir) {
    Path s = Synthetic.write(Synthetic.windowsOnly(Synthetic.base(NIGHT, 8, 30), 3, new Random(1)),
        dir.resolve("s.json"));
    for (String cmd : List.of("plan", "windows")) {
      Runs.Run r = Runs.run(cmd, s.toString(), "-o", dir.resolve("no/such/folder/out.json").toString());
      Runs.assertNoStackTrace(r);
      assertEquals(2, r.code(), r::all);
      assertTrue(r.err().contains("--output: cannot write " + dir.resolve("no/such/folder/out.json")
          + ": the folder " + dir.resolve("no/such/folder") + " does not exist"), r::all);
      assertTrue(r.out().isEmpty(), "the check must come before any work\n" + r.all());
    }
  }

  @Test
  void aMissingNativeSolverIsReportedWithExitThree() {
    StringWriter err = new StringWriter();
    CommandLine cl = new CommandLine(new SequencerCli());
    cl.setErr(new PrintWriter(err, true));
    NativeSolver.Unavailable e = new NativeSolver.Unavailable("the OR-Tools native solver could not be loaded "
        + "on this platform (os.name \"Plan9\", os.arch \"mips\")", new UnsatisfiedLinkError("none"));
    int code = new Failures().handleExecutionException(e, cl, null);
    assertEquals(3, code);
    assertTrue(err.toString().startsWith("the OR-Tools native solver could not be loaded"), err.toString());
    assertTrue(!err.toString().contains("Exception") && !err.toString().contains("internal error"), err.toString());
  }
}
