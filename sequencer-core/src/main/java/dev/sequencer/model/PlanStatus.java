package dev.sequencer.model;

/**
 * Outcome of a solve. OPTIMAL: proven best. FEASIBLE: a valid plan, optimality not proven.
 * INFEASIBLE: proven that the required requests cannot all be scheduled. NO_SOLUTION_IN_TIME: gave up
 * before finding any plan (not a proof of anything).
 */
public enum PlanStatus {
  OPTIMAL,
  FEASIBLE,
  INFEASIBLE,
  NO_SOLUTION_IN_TIME
}
