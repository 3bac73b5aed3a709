/**
 * JSON in and out: the scenario file ({@link dev.sequencer.io.ScenarioReader},
 * {@link dev.sequencer.io.ScenarioWriter}), the visibility windows file
 * ({@link dev.sequencer.io.WindowsFile}) and the timeline file ({@link dev.sequencer.io.TimelineFile}),
 * as specified in {@code shared/spec/scenario-format.md}.
 *
 * <p>Readers check every rule of the format and report all problems at once in a
 * {@link dev.sequencer.io.ScenarioException}, each with a field path such as
 * {@code requests[3] (id "R4").durationS}. Writers are byte-stable (same model, same bytes), write
 * what the readers read back as an equal model, and replace files atomically. Depends on {@code model}
 * (and on Orekit's TLE format check and parser, so that a TLE accepted here is one Orekit reads).
 */
package dev.sequencer.io;
