/**
 * The independent check of plans: {@link dev.sequencer.validate.PlanValidator} re-derives everything from
 * the scenario — its own pointing of every target kind, its own rest-to-rest slew times and cable-wrap
 * bookkeeping, every constraint at the observations' own instants, the keep-outs along slews (A3), each
 * resource's observations through its own view of the scenario (A6) — and
 * returns structured {@link dev.sequencer.validate.Violation}s. It shares with the planner only the model, the
 * time layer ({@link dev.sequencer.astro.AstroContext}: leap seconds, time scales, Earth frames and its Sun and
 * Moon series) and Orekit; it never sees the planner's windows, transitions or tracks (ArchitectureTest).
 */
package dev.sequencer.validate;
