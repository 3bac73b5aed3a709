/**
 * The night report: one self-contained HTML page (inline SVG charts, inline CSS and a little inline
 * script, nothing fetched) with a plan's summary, its charts, the observations with the values people
 * check (airmass, Moon separation, sidereal time), the passes of orbiting targets, the unscheduled
 * requests and why, and the constraints in force; with several resources (format addition A6) also a section
 * per resource with its observer, counts, constraints and charts. Every number shown comes from the library
 * ({@link dev.sequencer.visibility.SkyValues} and the timeline itself).
 */
package dev.sequencer.report;
