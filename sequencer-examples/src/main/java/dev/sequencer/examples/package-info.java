/**
 * Example programs that embed the library (scenario, visibility, slews, sequencer, validator, timeline
 * file) on the bundled invented scenarios, and the generator of those scenarios.
 */
package dev.sequencer.examples;
