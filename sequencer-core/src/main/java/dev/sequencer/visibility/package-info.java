/**
 * Visibility: when each request's target satisfies every constraint of the scenario.
 *
 * <p>The observer's state and the Sun and Moon are sampled once per horizon chunk on a time grid, every
 * target's constraint functions are evaluated on that grid together, each sign change is bracketed and
 * refined with a Hipparchus bracketing solver, and intervals are intersected per request. The Orekit calls
 * live here; angles are radians inside, degrees at the boundary.
 */
package dev.sequencer.visibility;
