package dev.sequencer.examples;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.ScenarioWriter;
import dev.sequencer.model.Scenario;
import dev.sequencer.sequence.SequencerOptions;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Every example runs on its bundled scenario and its plan passes the independent validator. Greedy for the
 * two large scenarios and a short reproducible CP-SAT run for the small one keep the whole class under a
 * minute.
 */
class ExamplesTest {
  private static final AstroContext CTX = AstroContext.offline();

  private static Embedding.Outcome run(String resource, SequencerOptions.Solver solver, double limitS) {
    Scenario s = Embedding.bundled(resource);
    return Embedding.plan(s, CTX, Embedding.quick(s, limitS).withSolver(solver));
  }

  private static void assertValidAndUseful(Embedding.Outcome o, int requests) {
    assertEquals(requests, o.scenario().requests().size());
    assertTrue(o.result().hasPlan(), o.result().status() + " " + o.result().message());
    // The façade ran the full validator (physics re-check included) once; an invalid plan would have thrown.
    assertTrue(o.result().stats().phaseS().containsKey("check"), o.result().stats().phaseS().toString());
    assertEquals(requests, o.timeline().observations().size() + o.timeline().unscheduled().size());
    assertTrue(o.timeline().observations().size() >= 5, "only " + o.timeline().observations().size() + " scheduled");
  }

  @Test
  void groundNightQueuePlansAndPassesTheValidator() {
    assertValidAndUseful(run(GroundNightQueue.SCENARIO, SequencerOptions.Solver.GREEDY, 5), 150);
  }

  @Test
  void leoTelescopeDayPlansAndPassesTheValidator() {
    assertValidAndUseful(run(LeoTelescopeDay.SCENARIO, SequencerOptions.Solver.GREEDY, 5), 300);
  }

  @Test
  void satelliteTrackingNightPlansWithCpSatAndPassesTheValidator() {
    // Reproducible mode (a deterministic work limit of 3 units): CP-SAT runs whatever the machine's load,
    // although the windows of 60 objects over 12 h take seconds of the wall clock.
    Scenario s = Embedding.bundled(SatelliteTrackingNight.SCENARIO);
    Embedding.Outcome o = Embedding.plan(s, CTX, Embedding.quick(s, 3).withReproducible(3));
    assertValidAndUseful(o, 60);
    assertTrue(o.result().stats().phaseS().containsKey("cp-sat"), o.result().stats().phaseS().toString());
  }

  @Test
  void bundledScenariosAreExactlyWhatTheGeneratorWrites() throws Exception {
    Path dir = Path.of("src/main/resources/scenarios");
    assertEquals(Files.readString(dir.resolve("ground-night-queue.json")), ScenarioWriter.toJson(ScenarioGenerator.groundNight()));
    assertEquals(Files.readString(dir.resolve("leo-telescope-day.json")), ScenarioWriter.toJson(ScenarioGenerator.leoTelescopeDay()));
    assertEquals(Files.readString(dir.resolve("satellite-tracking-night.json")),
        ScenarioWriter.toJson(ScenarioGenerator.satelliteTracking(CTX)));
  }
}
