/**
 * The planning problem in solver units: {@link dev.sequencer.sequence.problem.Task} (a request with its exposure
 * options and spans), {@link dev.sequencer.sequence.problem.PlanningProblem}, {@link dev.sequencer.sequence.problem.Plan},
 * the integer objective {@link dev.sequencer.sequence.problem.Prizes} and the one ranking of plans,
 * {@link dev.sequencer.sequence.problem.Score}. Depends on {@code model} and the {@code slew} interfaces only.
 */
package dev.sequencer.sequence.problem;
