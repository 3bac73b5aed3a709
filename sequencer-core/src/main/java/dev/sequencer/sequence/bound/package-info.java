/**
 * Proven upper bounds on total priority from relaxations of the routing model; each relaxation's validity is
 * argued in its Javadoc.
 */
package dev.sequencer.sequence.bound;
