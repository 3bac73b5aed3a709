package dev.sequencer.sequence;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import dev.sequencer.model.PlanStatus;
import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.search.GreedyPlanner;
import dev.sequencer.sequence.search.InsertionSearch;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.sequence.timing.ExactTimer;
import java.nio.file.Path;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Published TSPTW optima: Dumas, Desrosiers, Gélinas, Solomon, "An Optimal Algorithm for the Traveling
 * Salesman Problem with Time Windows", Oper. Res. 43(2):367-371, 1995; values from the BKS column of
 * K. Helsgaun's LKH-3 Dumas table (shared/benchmarks/tsptw/dumas/best-known.csv), travel including the
 * return arc. Integer matrix, so the match must be exact.
 */
class DumasTest {
  @ParameterizedTest
  @ValueSource(strings = {"n20w20.001", "n20w40.001", "n20w60.002", "n20w80.003", "n20w100.001", "n40w20.001",
      "n40w40.002"})
  void travelEqualsPublishedOptimum(String name) throws Exception {
    PlanningProblem problem = problem(name);
    long published = published(name);
    SequencerResult r = new Sequencer().plan(problem, SequencerOptions.defaults().withTimeLimitS(5).withWorkers(2));
    assertEquals(PlanStatus.OPTIMAL, r.status(), name + ": " + r.stats());
    assertEquals(problem.size(), r.observations().size(), name + ": every customer and the return are planned");
    assertEquals("RETURN", r.observations().get(r.observations().size() - 1).id());
    assertEquals(published, r.totalTransitionS(), 0.0, name + ": travel incl. the return arc");
  }

  /**
   * Wide windows where neither greedy nor the deadline orders fit every customer: the insertion search
   * alone (deterministic iteration budget) completes the tour, and its travel is never below the
   * published optimum.
   */
  @ParameterizedTest
  @ValueSource(strings = {"n40w100.001", "n60w80.002"})
  void insertionSearchCompletesWideWindowTours(String name) throws Exception {
    PlanningProblem problem = problem(name);
    long published = published(name);
    ArcCosts arcs = new ArcCosts(problem);
    Plan greedy = new GreedyPlanner(problem, new ExactTimer(problem)).plan();
    assertTrue(greedy.size() < problem.size(), name + ": greedy alone already completes the tour");
    Plan tour = new InsertionSearch(problem, arcs, 1).improve(greedy, Long.MAX_VALUE, 3000);
    assertEquals(problem.size(), tour.size(), name + ": every customer and the return are planned");
    assertTrue(arcs.feasible(tour));
    assertEquals(problem.mustBeLastIndex(), tour.order()[tour.size() - 1], "the return is last");
    assertTrue(arcs.transitionS(tour) >= published, name + ": travel below the published optimum");
  }

  /** The instance, or the test is skipped when ../shared is absent. */
  private static PlanningProblem problem(String name) throws Exception {
    return DumasInstance.read(folder().resolve(name + ".tsptw")).toProblem();
  }

  private static long published(String name) throws Exception {
    return DumasInstance.bestKnownTravel(folder().resolve("best-known.csv")).get(name);
  }

  private static Path folder() {
    Path folder = DumasInstance.folder();
    assumeTrue(folder != null, "shared/benchmarks/tsptw/dumas not found next to the project: skipping Dumas check");
    return folder;
  }
}
