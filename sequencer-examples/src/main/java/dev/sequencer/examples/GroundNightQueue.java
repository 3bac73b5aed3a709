package dev.sequencer.examples;

/**
 * Example (a): an invented ground telescope's night queue. 150 fixed fields, an alt-az mount whose cable
 * wrap allows azimuths in [-270, 270] deg, darkness (Sun below -12 deg), 30 deg from the Moon, elevation
 * 25-87 deg, airmass at most 2 within 4 h of the meridian (some fields with their own limits) and a
 * horizon mask. Run: {@code java -cp sequencer.jar dev.sequencer.examples.GroundNightQueue
 * [timeline.json [seconds]]}.
 */
public final class GroundNightQueue {
  /** The bundled scenario. */
  public static final String SCENARIO = "/scenarios/ground-night-queue.json";

  private GroundNightQueue() {}

  public static void main(String[] args) {
    Embedding.main(SCENARIO, args, 20);
  }
}
