package dev.sequencer.model;

/** The instrument's initial pointing: an inertial {@link RaDec} or a mount {@link AzElPointing}. */
public sealed interface Pointing permits RaDec, AzElPointing {}
