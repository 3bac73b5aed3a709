/**
 * The sequencer: turns visibility windows and transition times into an ordered timeline that first holds
 * every required request, then maximises total priority and then minimises total transition time.
 *
 * <p>{@link dev.sequencer.sequence.Sequencer} is the entry point and {@link dev.sequencer.sequence.SequencerResult}
 * its answer; one run owns one {@code Incumbent} (the best plan so far, timed exactly, ranked by one
 * {@link dev.sequencer.sequence.problem.Score}) and one {@link dev.sequencer.sequence.Budget}. The parts live in
 * sub-packages, each with one concept, layered bottom-up: {@code problem} (tasks, plans, prizes, scores),
 * {@code timing} (the model's transition costs and the exact timer), {@code cpsat} (the routing model and the
 * LNS over it), {@code search} (greedy, deadline orders, insertion, exposure moves, exact repair, two-stage),
 * {@code bound} (relaxations), this package (the run), {@code replan} (re-planning). Times are integer seconds
 * from the start of the horizon ({@code startS}). The CP-SAT formulation is described in {@code docs/model.md}.
 */
package dev.sequencer.sequence;
