package dev.sequencer.model;

/** A fixed ICRS (J2000) direction in degrees; no proper motion or parallax. */
public record RaDec(double raDeg, double decDeg) implements Target, Pointing {
  public RaDec {
    Checks.finite("raDeg", raDeg);
    Checks.finite("decDeg", decDeg);
  }
}
