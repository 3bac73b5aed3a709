package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.io.TimelineFile;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Timeline;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code sequencer replan} end to end: files, states, exit codes. */
class ReplanCliTest {
  private static final Path DEMO = Path.of("src/main/resources/scenarios/demo-night.json");

  @Test
  void replanOfTheDemoNightKeepsHistoryAndPassesCheck(@TempDir Path dir) {
    Path tl = dir.resolve("t.json");
    Runs.Run plan = Runs.run("plan", DEMO.toString(), "--solver", "greedy", "-o", tl.toString());
    assertEquals(0, plan.code(), plan::all);
    Timeline prev = TimelineFile.read(tl);
    Observation aborted = prev.observations().get(3);
    Instant now = aborted.start().plusSeconds(30);
    Path out = dir.resolve("r.json");
    Runs.Run r = Runs.run("replan", DEMO.toString(), "--previous", tl.toString(), "--now", now.toString(),
        "--done", prev.observations().get(0).id(), "--failed", aborted.id(), "--time-limit", "3", "--workers", "2",
        "-o", out.toString());
    assertEquals(0, r.code(), r::all);
    Timeline t = TimelineFile.read(out);
    for (int k = 0; k < 3; k++) {
      assertEquals(prev.observations().get(k).id(), t.observations().get(k).id());
      assertEquals(prev.observations().get(k).start(), t.observations().get(k).start());
      assertEquals(Observation.DONE, t.observations().get(k).state());
    }
    for (Observation o : t.observations().subList(3, t.observations().size())) {
      assertEquals(Observation.PLANNED, o.state(), o.id());
      assertFalse(o.start().isBefore(now), o.id() + " starts before now");
    }
    assertTrue(r.out().contains("status FEASIBLE"), r.out());
    Runs.Run check = Runs.run("check", DEMO.toString(), out.toString());
    assertEquals(0, check.code(), check::all);
  }

  @Test
  void badOptionsExitTwoNamingTheOption(@TempDir Path dir) {
    Path tl = dir.resolve("t.json");
    assertEquals(0, Runs.run("plan", DEMO.toString(), "--solver", "greedy", "-o", tl.toString()).code());
    String s = DEMO.toString();
    String p = tl.toString();
    String[][] cases = {
        {"--now", "tonight", "--now: must be an ISO-8601 UTC instant"},
        {"--done", "NOPE", "--done: id \"NOPE\" is not an observation of the previous timeline"},
        {"--stability", "-1", "--stability: must be a number >= 0 (was -1)"},
    };
    for (String[] c : cases) {
      String now = c[0].equals("--now") ? c[1] : "2031-10-14T20:00:00Z";
      Runs.Run r = c[0].equals("--now")
          ? Runs.run("replan", s, "--previous", p, "--now", now)
          : Runs.run("replan", s, "--previous", p, "--now", now, c[0], c[1]);
      assertEquals(2, r.code(), r::all);
      assertTrue(r.err().contains(c[2]), r::all);
      Runs.assertNoStackTrace(r);
    }
    Runs.Run missing = Runs.run("replan", s, "--previous", dir.resolve("none.json").toString(), "--now", "2031-10-14T20:00:00Z");
    assertEquals(2, missing.code(), missing::all);
    assertTrue(missing.err().contains("none.json"), missing::all);
  }

  @Test
  void requiredRequestWithNoTimeLeftExitsOne(@TempDir Path dir) {
    // R (required, 600 s) may only start in [0, 100] s (window [0, 700] s); the fixed slew is 60 s, so it is
    // planned at 60 s. Aborted 50 s later, it has no allowed start left: no plan, exit 1.
    Instant h0 = Instant.parse("2031-05-04T20:00:00Z");
    ObjectNode s = Synthetic.base(h0, 2, 60);
    ObjectNode r = ((ArrayNode) s.get("requests")).addObject();
    r.put("id", "R").put("durationS", 600).put("priority", 5).put("required", true);
    r.putArray("windows").addArray().add(h0.toString()).add(h0.plusSeconds(700).toString());
    ObjectNode q = ((ArrayNode) s.get("requests")).addObject();
    q.put("id", "Q").put("durationS", 600).put("priority", 1);
    q.putArray("windows").addArray().add(h0.toString()).add(h0.plusSeconds(7200).toString());
    Path file = Synthetic.write(s, dir.resolve("s.json"));
    Path tl = dir.resolve("t.json");
    assertEquals(0, Runs.run("plan", file.toString(), "--time-limit", "2", "-o", tl.toString()).code());
    assertEquals(h0.plusSeconds(60), TimelineFile.read(tl).observations().get(0).start(), "precondition");
    Runs.Run run = Runs.run("replan", file.toString(), "--previous", tl.toString(), "--now",
        h0.plusSeconds(110).toString(), "--failed", "R", "--time-limit", "2");
    assertEquals(1, run.code(), run::all);
    assertTrue(run.out().contains("no plan (INFEASIBLE)"), run::all);
    Runs.assertNoStackTrace(run);
  }

  @Test
  void helpShowsTheOptions() {
    Runs.Run r = Runs.run("replan", "--help");
    assertEquals(0, r.code());
    for (String o : new String[] {"--previous", "--now", "--done", "--failed", "--drop-failed", "--stability"}) {
      assertTrue(r.out().contains(o), o);
    }
    assertTrue(Files.exists(DEMO));
  }

  @Test
  void replanOfTheCadenceNightInsideAChainAndBetweenVisitsKeepsTheirRules(@TempDir Path dir) {
    // The bundled cadence night: ordered all-or-nothing chains with maxGapS 600 (calibrator, field, calibrator),
    // three visits at least 40 min apart, all or nothing for F001. Re-planned while the first calibrator of a
    // chain runs, and after F001's first visit: the chain's rest and F001's other visits are then owed.
    Path cadence = Path.of("src/main/resources/scenarios/cadence-queue-night.json");
    Path tl = dir.resolve("t.json");
    Runs.Run plan = Runs.run("plan", cadence.toString(), "--solver", "greedy", "-o", tl.toString());
    assertEquals(0, plan.code(), plan::all);
    Timeline prev = TimelineFile.read(tl);
    for (String id : List.of("CAL1A", "F001")) {
      Observation first = prev.observations().stream().filter(o -> o.id().equals(id)).findFirst().orElseThrow();
      Instant now = id.equals("F001") ? first.end().plusSeconds(60) : first.start().plusSeconds(30);
      Path out = dir.resolve("r-" + id + ".json");
      Runs.Run r = Runs.run("replan", cadence.toString(), "--previous", tl.toString(), "--now", now.toString(),
          "--time-limit", "4", "--workers", "2", "-o", out.toString());
      assertEquals(0, r.code(), r::all);
      Timeline t = TimelineFile.read(out);
      List<Observation> mine = t.observations().stream().filter(o -> o.id().equals(id)).toList();
      assertEquals(id.equals("F001") ? Observation.DONE : Observation.RUNNING, mine.get(0).state(), r.out());
      if (id.equals("F001")) {
        assertEquals(3, mine.size(), "all or nothing: once begun, every visit: " + r.out());
        for (int v = 0; v < 3; v++) {
          assertEquals(v + 1, mine.get(v).visit(), "visits numbered in time order");
        }
      } else {
        List<String> chain = t.observations().stream().map(Observation::id)
            .filter(x -> List.of("CAL1A", "F005", "CAL1B").contains(x)).toList();
        assertEquals(List.of("CAL1A", "F005", "CAL1B"), chain, "the chain's rest, in order: " + r.out());
      }
      Runs.Run check = Runs.run("check", cadence.toString(), out.toString());
      assertEquals(0, check.code(), check::all);
    }
  }
}
