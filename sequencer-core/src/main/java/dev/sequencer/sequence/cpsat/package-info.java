/**
 * OR-Tools CP-SAT: the prize-collecting routing model ({@link dev.sequencer.sequence.cpsat.RoutingModel}) with
 * its time buckets, the large-neighbourhood search over it, and the native library loader.
 */
package dev.sequencer.sequence.cpsat;
