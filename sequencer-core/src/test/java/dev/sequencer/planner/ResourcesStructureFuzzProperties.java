package dev.sequencer.planner;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Group;
import dev.sequencer.model.Scenario;
import dev.sequencer.sequence.SequencerOptions;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * Visits and groups on several resources (format additions A4–A6) with real geometry: scenarios of every kind
 * ({@link FuzzScenarios}) spread over 2–3 resources ({@link FuzzScenarios#withResources}) with repeated
 * visits, an all-or-nothing group and a chain ({@link FuzzScenarios#withStructure}), each group asking for
 * one resource one time in two. Through the façade, so every plan has passed the independent validator —
 * visits numbered in time order across resources, separations between visits on different resources, one
 * per window over the merged windows, one resource per group — or it is a bug (thrown). CP-SAT is never below
 * greedy, and each plan is re-planned at a random instant ({@link PlannerFuzzProperties#replan}, a resource
 * lost one time in two).
 */
class ResourcesStructureFuzzProperties {
  private static final AstroContext CTX = AstroContext.offline();

  /** The tries of {@link StructureReplanProperties}: every observer kind, a seed, CP-SAT or greedy. */
  @Provide
  Arbitrary<StructureReplanProperties.Try> tries() {
    return new StructureReplanProperties().tries();
  }

  @Property(tries = 16, shrinking = net.jqwik.api.ShrinkingMode.OFF)
  void visitsAndGroupsOnSeveralResourcesKeepEveryRule(@ForAll("tries") StructureReplanProperties.Try t) {
    check(t);
  }

  static void check(StructureReplanProperties.Try t) {
    Random rnd = new Random(t.seed());
    Scenario s = FuzzScenarios.withStructure(FuzzScenarios.withResources(FuzzScenarios.generate(t.kind(), t.seed(),
        CTX), rnd), rnd);
    List<Group> groups = new ArrayList<>();
    for (Group g : s.groups()) {
      groups.add(new Group(g.id(), g.members(), g.allOrNothing(), g.ordered(), g.maxGapS(), rnd.nextBoolean()));
    }
    s = new Scenario(s.format(), s.name(), s.horizon(), s.observer(), s.constraints(), s.slew(), s.startPointing(),
        s.requests(), s.solver(), groups, s.reconfiguration(), s.startConfiguration(), s.resources());
    SequencerOptions base = SequencerOptions.defaults().withTimeLimitS(2).withWorkers(2).withReproducible(2);
    String what = t + ": " + FuzzScenarios.describe(s) + ", groups " + s.groups();
    PlanOutcome greedy = Planner.plan(s, CTX, base.withSolver(SequencerOptions.Solver.GREEDY));
    PlanOutcome mine = t.solver() == SequencerOptions.Solver.GREEDY ? greedy : Planner.plan(s, CTX, base);
    assertTrue(mine.result().hasPlan(), what + ": no plan (nothing is required): " + mine.result().message());
    assertTrue(mine.result().totalPriority() >= greedy.result().totalPriority() - 1e-6, what + ": priority "
        + mine.result().totalPriority() + " below greedy's " + greedy.result().totalPriority());
    PlannerFuzzProperties.replan(s, mine.timeline(), base, new Random(t.seed() + 47), what);
  }
}
