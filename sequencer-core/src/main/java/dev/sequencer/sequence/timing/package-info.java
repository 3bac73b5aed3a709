/**
 * When observations can start: {@link dev.sequencer.sequence.timing.ArcCosts} (the model's never-optimistic
 * transition seconds and timing under them) and {@link dev.sequencer.sequence.timing.ExactTimer} (the slew
 * models' exact legs: the one exact timer of compaction, repair, greedy and re-planning).
 */
package dev.sequencer.sequence.timing;
