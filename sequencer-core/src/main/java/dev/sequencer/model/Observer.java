package dev.sequencer.model;

/** The observing asset: a {@link GroundSite} or an {@link OrbitObserver}; a scenario may have none. */
public sealed interface Observer permits GroundSite, OrbitObserver {}
