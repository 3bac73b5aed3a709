package dev.sequencer.sequence;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.sequence.bound.BucketRelaxation;
import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.search.GreedyPlanner;
import dev.sequencer.sequence.search.InsertionSearch;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.sequence.timing.ExactTimer;
import java.util.Arrays;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import org.junit.jupiter.api.Test;

/**
 * The insertion search and the LP bound against exhaustive enumeration (the search of
 * {@link BruteForceProperties}, which enumerates every ordered subset at earliest starts) on small random
 * instances with asymmetric tables that break the triangle inequality, and on generated nights.
 */
class InsertionAndBoundProperties {
  private final BruteForceProperties instances = new BruteForceProperties();

  @Property(tries = 80)
  void insertionSearchKeepsPlansFeasibleAndNeverBeatsTheOptimum(@ForAll("instances") BruteForceProperties.Instance inst) {
    PlanningProblem p = inst.problem();
    long[] best = BruteForceProperties.exhaustive(p); // {4 × priority, transition}, null = no complete plan
    ArcCosts arcs = new ArcCosts(p);
    Plan greedy = new GreedyPlanner(p, new ExactTimer(p)).plan();
    Plan out = new InsertionSearch(p, arcs, 7).improve(greedy, Long.MAX_VALUE, 40);
    assertTrue(arcs.feasible(out), () -> "infeasible: " + out);
    assertTrue(missingRequired(p, out) <= missingRequired(p, greedy), "fewer required requests than its start");
    if (missingRequired(p, out) > 0) {
      return;
    }
    assertEquals(out.size(), Arrays.stream(out.order()).distinct().count(), "a request planned twice");
    if (hasAllRequired(p, greedy)) {
      assertTrue(out.prize(p) >= greedy.prize(p), "worse than its start");
    }
    assertTrue(out.priority(p) <= best[0] / 4.0 + 1e-9, "beats the exhaustive optimum");
  }

  /** The search reaches the exhaustive optimum's priority on most small instances (a quality check, not a proof). */
  @Test
  void insertionSearchUsuallyFindsTheOptimum() {
    int tried = 0;
    int optimal = 0;
    for (long seed = 1; seed <= 150; seed++) {
      PlanningProblem p = BruteForceProperties.instance(seed).problem();
      Plan greedy = new GreedyPlanner(p, new ExactTimer(p)).plan();
      long[] best = BruteForceProperties.exhaustive(p);
      if (best == null || !hasAllRequired(p, greedy)) {
        continue;
      }
      ArcCosts arcs = new ArcCosts(p);
      Plan out = new InsertionSearch(p, arcs, 1).improve(greedy, Long.MAX_VALUE, 200);
      tried++;
      optimal += Math.abs(out.priority(p) - best[0] / 4.0) < 1e-9 ? 1 : 0;
    }
    assertTrue(tried >= 100, "too few usable instances: " + tried);
    assertTrue(optimal >= 0.95 * tried, optimal + " of " + tried + " at the exhaustive optimum");
  }

  @Property(tries = 80)
  void relaxationBoundsTheExhaustiveOptimum(@ForAll("instances") BruteForceProperties.Instance inst) {
    PlanningProblem p = inst.problem();
    long[] best = BruteForceProperties.exhaustive(p);
    ArcCosts arcs = new ArcCosts(p);
    for (boolean predecessors : new boolean[] {false, true}) {
      double bound = BucketRelaxation.bound(p, arcs, 10, predecessors);
      if (best != null) {
        assertTrue(bound >= best[0] / 4.0 - 1e-9, "bound " + bound + " below the optimum " + best[0] / 4.0
            + (predecessors ? " (with predecessor rows)" : " (capacity only)"));
      }
    }
  }

  @Test
  void predecessorRowsTightenTheNightBound() {
    // NightScenario n = 200, seed 1: capacity only 488.2, with predecessor rows 484.4 (measured when the rows
    // were added); the plan found in 60 s collects about 462, so both bound it.
    PlanningProblem p = NightScenario.generate(200, 1);
    ArcCosts arcs = new ArcCosts(p);
    double capacityOnly = BucketRelaxation.bound(p, arcs, 30, false);
    double withPredecessors = BucketRelaxation.bound(p, arcs, 30, true);
    assertTrue(withPredecessors < capacityOnly - 2, withPredecessors + " vs " + capacityOnly);
    Plan greedy = new GreedyPlanner(p, new ExactTimer(p)).plan();
    assertTrue(withPredecessors >= greedy.priority(p), "below the greedy plan's priority");
  }

  private static boolean hasAllRequired(PlanningProblem p, Plan plan) {
    return missingRequired(p, plan) == 0;
  }

  private static int missingRequired(PlanningProblem p, Plan plan) {
    boolean[] in = new boolean[p.size()];
    for (int k : plan.order()) {
      in[k] = true;
    }
    int missing = 0;
    for (int k = 0; k < p.size(); k++) {
      missing += p.tasks().get(k).required() && !in[k] ? 1 : 0;
    }
    return missing;
  }

  @net.jqwik.api.Provide
  net.jqwik.api.Arbitrary<BruteForceProperties.Instance> instances() {
    return instances.instances();
  }
}
