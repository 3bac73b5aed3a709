/**
 * Slew-time models ({@code eigenaxis}, {@code altaz}, {@code fixed}, {@code matrix}), built through
 * {@link dev.sequencer.slew.SlewModel} from the requests' {@link dev.sequencer.slew.PointingTrack}s, and the
 * {@link dev.sequencer.slew.Transitions} view the sequencer and validator use: a never-optimistic bound
 * per pair of requests over a departure interval, and the exact transitions along a sequence at its
 * actual times. Formulas and the bound's derivation: docs/slew.md.
 *
 * <p>Times are seconds from the start of the planning horizon ({@code tS}); durations are seconds.
 */
package dev.sequencer.slew;
