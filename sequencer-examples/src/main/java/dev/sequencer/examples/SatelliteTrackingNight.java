package dev.sequencer.examples;

/**
 * Example (c): an invented optical ground station tracking 60 invented low-orbit objects at night. Each
 * object is a TLE built with Orekit's constructor (valid checksums, satellite numbers 90001-90060, epoch at
 * the horizon start); an object can be observed only while it is sunlit, the site's Sun is below -6 deg and
 * it is at least 20 deg high. The slew model is {@code fixed} (30 s between any two objects): the alt-az and
 * eigenaxis models need rigorous rate bounds of each pointing track, and {@code PointingTracks} has them only
 * for fixed RA/Dec targets so far. Run: {@code java -cp sequencer.jar
 * dev.sequencer.examples.SatelliteTrackingNight [timeline.json [seconds]]}.
 */
public final class SatelliteTrackingNight {
  /** The bundled scenario. */
  public static final String SCENARIO = "/scenarios/satellite-tracking-night.json";

  private SatelliteTrackingNight() {}

  public static void main(String[] args) {
    Embedding.main(SCENARIO, args, 10);
  }
}
