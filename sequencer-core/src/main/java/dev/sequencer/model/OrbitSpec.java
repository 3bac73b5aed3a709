package dev.sequencer.model;

/** How an orbit is given: a {@link Tle} or {@link KeplerianElements}. */
public sealed interface OrbitSpec permits Tle, KeplerianElements {}
