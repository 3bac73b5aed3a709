package dev.sequencer.examples;

/**
 * Example (b): an invented space telescope in a 550 km sun-synchronous orbit (Keplerian elements,
 * Brouwer-Lyddane propagation) over 24 h. 300 fixed fields, rest-to-rest eigenaxis slews (0.6 deg/s,
 * 0.02 deg/s², 30 s settle), keep-outs of 50 deg from the Sun, 15 deg from the Moon and 20 deg above the
 * Earth's limb. Run: {@code java -cp sequencer.jar dev.sequencer.examples.LeoTelescopeDay
 * [timeline.json [seconds]]}.
 */
public final class LeoTelescopeDay {
  /** The bundled scenario. */
  public static final String SCENARIO = "/scenarios/leo-telescope-day.json";

  private LeoTelescopeDay() {}

  public static void main(String[] args) {
    Embedding.main(SCENARIO, args, 30);
  }
}
