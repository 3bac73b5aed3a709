/**
 * Independent checks of plans: {@link dev.sequencer.validate.PlanValidator} re-checks a timeline against
 * the requests, their visibility windows and the exact transition times, without sharing the sequencer's
 * assumptions (this package does not see {@code dev.sequencer.sequence}).
 */
package dev.sequencer.validate;
