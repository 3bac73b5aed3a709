/**
 * Searches that produce plans: the greedy baseline, the deadline orders, the iterated insertion search, the
 * exposure allocation and moves for flexible exposures, exact repair and the two-stage baseline. Each hands
 * its plans to the caller (the run's incumbent); none decides what is returned.
 */
package dev.sequencer.sequence.search;
