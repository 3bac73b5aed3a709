package dev.sequencer.sequence.search;

import dev.sequencer.sequence.cpsat.NeighbourhoodSearch;
import dev.sequencer.sequence.cpsat.RoutingModel;
import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.timing.ArcCosts;
import java.util.function.Consumer;

/**
 * The search after the joint CP-SAT solve on problems with flexible exposures: rounds of our LNS
 * ({@link NeighbourhoodSearch}, CP-SAT on time slices with the rest fixed) alternate with the
 * exposure-aware moves on the whole plan ({@link ExposureMoves}), which let time flow between slices and
 * change the observed set with exact exposure re-allocation. Every kept plan is a strict improvement
 * and model-feasible.
 *
 * <p>Reproducible mode: the LNS rounds are charged to the deterministic budget in chunks and the moves
 * are bounded by their evaluation count only, so the run does not depend on the wall clock.
 */
public final class FlexibleSearch {
  /** Wall-clock seconds (or deterministic units) of LNS between two rounds of moves. */
  static final double LNS_CHUNK_S = 3.0;
  /**
   * Evaluated (state, exposure) pairs charged as one deterministic unit in reproducible mode: about a
   * second of one core of the development machine (300 requests: 1.4e8 pairs took about 5 s under load).
   */
  public static final double EVALUATIONS_PER_UNIT = 3e7;

  private final PlanningProblem problem;
  private final ArcCosts arcs;
  private final ExposureMoves moves;
  public FlexibleSearch(PlanningProblem problem, ArcCosts arcs) {
    this.problem = problem;
    this.arcs = arcs;
    this.moves = new ExposureMoves(problem, arcs);
  }

  /** Number of accepted exposure-aware moves so far. */
  public int moveCount() {
    return moves.moves;
  }

  /**
   * The moves alone on {@code plan} (no CP-SAT): never worse in scaled value; bounded by
   * {@code deadlineNanos}, or in reproducible mode by {@code deterministicUnits} only.
   */
  public Plan moves(Plan plan, long deadlineNanos, boolean reproducible, double deterministicUnits) {
    Plan out = reproducible ? moves.improve(plan, Long.MAX_VALUE, (long) (deterministicUnits * EVALUATIONS_PER_UNIT))
        : moves.improve(plan, deadlineNanos, Long.MAX_VALUE);
    if (!arcs.feasible(out)) {
      throw new IllegalStateException("exposure moves produced an infeasible plan (a bug): " + out);
    }
    return out;
  }

  /**
   * Alternates LNS chunks of {@code lns} with rounds of moves until {@code deadlineNanos} (or, in
   * reproducible mode, until {@code deterministicBudget} is spent); {@code onImprove} sees each better plan.
   */
  public Plan improve(Plan current, NeighbourhoodSearch lns, long deadlineNanos, double deterministicBudget,
      RoutingModel.Params params, Consumer<Plan> onImprove) {
    double budgetLeft = deterministicBudget;
    boolean reproducible = params.reproducible();
    while (reproducible ? budgetLeft > 0 : System.nanoTime() < deadlineNanos - 50_000_000L) {
      long chunkEnd = Math.min(deadlineNanos, System.nanoTime() + (long) (LNS_CHUNK_S * 1e9));
      double chunkDet = Math.min(LNS_CHUNK_S, budgetLeft);
      budgetLeft -= chunkDet;
      current = lns.improve(current, reproducible ? deadlineNanos : chunkEnd, chunkDet, params, onImprove);
      Plan moved = moves(current, deadlineNanos, reproducible, Math.max(0, budgetLeft));
      budgetLeft -= moves.evaluations() / EVALUATIONS_PER_UNIT;
      if (better(moved, current)) {
        current = moved;
        onImprove.accept(current);
      }
    }
    return current;
  }

  /** True when {@code a} ranks above {@code b} under the model transitions. */
  private boolean better(Plan a, Plan b) {
    return arcs.score(a).betterThan(arcs.score(b));
  }
}
