/**
 * Immutable records for the scenario, its requests and targets, visibility windows and the plan
 * (timeline). Field names follow {@code shared/spec/scenario-format.md}; units travel in the names
 * (degrees, seconds, metres, kilometres), instants are UTC {@link java.time.Instant}s.
 *
 * <p>Depends on nothing of ours. Records check only what a single value can check (finite numbers,
 * non-null parts); cross-field rules with JSON paths live in {@code dev.sequencer.io}.
 */
package dev.sequencer.model;
