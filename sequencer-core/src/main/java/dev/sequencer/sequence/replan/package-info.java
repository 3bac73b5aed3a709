/**
 * Re-planning the rest of a night from "now": frozen history, the departure from the running observation,
 * stability bonuses in the objective and the previous tail as warm start.
 */
package dev.sequencer.sequence.replan;
