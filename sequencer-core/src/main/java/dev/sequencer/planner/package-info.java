/**
 * The library's front door: {@link dev.sequencer.planner.Planner} takes a scenario and an astronomy context
 * and runs the whole chain (input rules, visibility windows, slew transitions, planning, the one
 * independent check) under one time budget; the command line and the embedding examples call it alike.
 */
package dev.sequencer.planner;
