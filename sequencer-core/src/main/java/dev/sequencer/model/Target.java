package dev.sequencer.model;

/** What a request points at: a fixed {@link RaDec}, an {@link OrbitingTarget} or an {@link EarthPoint}. */
public sealed interface Target permits RaDec, OrbitingTarget, EarthPoint {}
