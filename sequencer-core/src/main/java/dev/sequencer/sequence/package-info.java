/**
 * The sequencer: turns visibility windows and transition times into an ordered timeline that first
 * maximises total priority and then minimises total transition time.
 *
 * <p>{@link dev.sequencer.sequence.PlanningProblem} is the integer-second view of a scenario,
 * {@link dev.sequencer.sequence.Sequencer} the entry point, {@link dev.sequencer.sequence.SequencerResult}
 * its answer. The CP-SAT formulation is described in {@code docs/model.md}. Times are integer seconds
 * from the start of the horizon ({@code startS}); transitions are ceilings of
 * {@link dev.sequencer.slew.Transitions#boundS} in the model and exact values in the result.
 */
package dev.sequencer.sequence;
