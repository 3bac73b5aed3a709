package dev.sequencer.examples;

/**
 * Example (c): an invented optical ground station tracking 60 invented low-orbit objects at night. Each
 * object is a TLE built with Orekit's constructor (valid checksums, satellite numbers 90001-90060, epoch at
 * the horizon start); an object can be observed only while it is sunlit, the site's Sun is below -6 deg and
 * it is between 20 and 85 deg high. The mount is alt-az (5 and 4 deg/s, 2 deg/s^2, 5 s settle, cable wrap
 * [-270, 270] deg); each slew goes to the object's pointing at the start of its observation, which moves
 * with the object. Run: {@code java -cp sequencer.jar
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
