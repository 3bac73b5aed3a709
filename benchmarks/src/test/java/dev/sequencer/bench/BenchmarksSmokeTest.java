package dev.sequencer.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * Smoke run of the benchmark programs on small sizes: they run, and their built-in comparison with Orekit's
 * event detectors holds (edges within 1 s, the visibility issue's tolerance). No timing is asserted: speed
 * figures live in docs/benchmarks.md.
 */
class BenchmarksSmokeTest {
  @Test
  void visibilityBenchmarkRunsAndAgreesWithOrekitDetectors() {
    VisibilityBenchmark.Figures leo = VisibilityBenchmark.leoFixedTargets(12, 3);
    assertEquals(0, leo.windowCountMismatches(), leo.toString());
    assertTrue(leo.maxEdgeDiffS() < 1.0, leo.toString());
    VisibilityBenchmark.Figures ground = VisibilityBenchmark.groundOrbitingTargets(6, 2);
    assertEquals(0, ground.windowCountMismatches(), ground.toString());
    assertTrue(ground.maxEdgeDiffS() < 1.0, ground.toString());
  }
}
