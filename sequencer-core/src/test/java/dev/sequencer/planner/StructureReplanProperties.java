package dev.sequencer.planner;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import dev.sequencer.sequence.SequencerOptions;
import java.util.Random;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * Re-planning with the rules people write (format additions A4, A5): scenarios of every kind
 * ({@link FuzzScenarios}) with visits and groups ({@link FuzzScenarios#withStructure}) are planned, then
 * re-planned at a random instant with random done and failed observations ({@link PlannerFuzzProperties#replan}:
 * done kept, nothing new before now, each request at most its visits). Every re-plan passes the façade's
 * independent validator on the merged night — visit numbers, separations from the visits done, one per window,
 * all or nothing once begun, the order and gaps of groups (a chain with {@code maxGapS} part done included) —
 * or it is a bug (thrown); nothing is refused.
 */
class StructureReplanProperties {
  private static final AstroContext CTX = AstroContext.offline();

  /** One try's settings. */
  record Try(FuzzScenarios.Kind kind, long seed, SequencerOptions.Solver solver) {}

  @Provide
  Arbitrary<Try> tries() {
    return Combinators.combine(Arbitraries.of(FuzzScenarios.Kind.class), Arbitraries.longs().between(1, 1_000_000),
        Arbitraries.of(SequencerOptions.Solver.CPSAT, SequencerOptions.Solver.GREEDY)).as(Try::new);
  }

  @Property(tries = 24, shrinking = net.jqwik.api.ShrinkingMode.OFF)
  void replansKeepEveryRuleOfVisitsAndGroups(@ForAll("tries") Try t) {
    check(t);
  }

  /**
   * Found by this property (2026-12-04): a station's re-plan where no window is left within maxSeparationS of
   * the visit done for the first visit left, so that visit's task has no window while the later ones have
   * theirs; exact insertion put a later visit in, the prune renumbered it as the first and the plan no longer
   * fitted ("exact insertion of SAT91013#2 produced an invalid plan (a bug)"). The prune now drops a visit
   * that does not fit the task of its number.
   */
  @net.jqwik.api.Example
  void aFirstVisitLeftWithoutAWindowTakesTheLaterOnesWithIt() {
    check(new Try(FuzzScenarios.Kind.STATION_TLE_ALTAZ, 2821, SequencerOptions.Solver.GREEDY));
  }

  /**
   * Found by this property (2026-12-04): a chain's middle member failed while the members before and after it
   * were done, so the history holds a gap longer than maxGapS; the re-plan refused it as bad input ("the done
   * and running observations are not valid"). The rules' upper bounds are not judged inside the history now.
   */
  @net.jqwik.api.Example
  void aChainWhoseMiddleMemberFailedIsReplanned() {
    check(new Try(FuzzScenarios.Kind.GROUND_FIELDS_FIXED, 14627, SequencerOptions.Solver.CPSAT));
  }

  /**
   * Found by this property (2026-12-04): a re-plan from a low orbit whose new plan slews around a keep-out; the
   * re-plan's check judged the night without the slews' waypoints (as the direct slew) and stopped with "the
   * sequencer produced an invalid plan (a bug): slewSeconds is 113.068, but the slew from S0 takes 88.646 s".
   * The re-plan's check now reads the night as it is written, as the plan's check does.
   */
  @net.jqwik.api.Example
  void aReplanWithASlewAroundAKeepOutIsCheckedWithItsWaypoints() {
    check(new Try(FuzzScenarios.Kind.LEO_TLE_FIELDS, 5, SequencerOptions.Solver.GREEDY));
  }

  /**
   * Found by this property (2026-12-04): a re-plan with no observer where a request's windows overlap once the
   * re-plan clips them; the planner counted one per window in its spans while the validator asked whether one of
   * the request's own windows holds both visits, and stopped with "the sequencer produced an invalid plan (a
   * bug): visits 2 and 3 of W0 lie in one visibility window (onePerWindow)".
   */
  @net.jqwik.api.Example
  void onePerWindowIsCountedAlikeByThePlannerAndTheCheckInAReplan() {
    check(new Try(FuzzScenarios.Kind.NO_OBSERVER_MATRIX, 16999, SequencerOptions.Solver.GREEDY));
  }

  static void check(Try t) {
    Random rnd = new Random(t.seed());
    Scenario s = FuzzScenarios.withStructure(FuzzScenarios.generate(t.kind(), t.seed(), CTX), rnd);
    SequencerOptions base = SequencerOptions.defaults().withTimeLimitS(2).withWorkers(2).withReproducible(2)
        .withSolver(t.solver());
    PlanOutcome first = Planner.plan(s, CTX, base);
    String what = t + ": " + FuzzScenarios.describe(s) + ", groups " + s.groups();
    assertTrue(first.result().hasPlan(), what + ": no first plan (nothing is required): " + first.result().message());
    Timeline plan = first.timeline();
    PlannerFuzzProperties.replan(s, plan, base, new Random(t.seed() + 41), what);
    // Re-planning one second into a later visit: the earlier visits done, that one running, the rest to plan.
    plan.observations().stream().filter(o -> o.visit() != null && o.visit() > 1).findFirst().ifPresent(o ->
        PlannerFuzzProperties.replan(s, plan, base, new Random(t.seed() + 43), what, o.start().plusSeconds(1)));
  }
}
