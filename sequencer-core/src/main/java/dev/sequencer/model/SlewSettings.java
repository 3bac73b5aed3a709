package dev.sequencer.model;

import java.util.List;

/** The slew model named in a scenario's {@code slew} object, with its parameters. */
public sealed interface SlewSettings {

  /** The model's name as written in the file. */
  String model();

  /**
   * Whether the Sun separation and Earth-limb minima hold along every slew too (spec A3, default
   * {@code true}). Only {@code eigenaxis} and {@code altaz} define a slew path; {@code fixed} and
   * {@code matrix} have none, so for them this is always {@code false} (nothing can be checked along a
   * path that is not known).
   */
  boolean keepOutDuringSlew();

  /** Rest-to-rest rotation about the eigenaxis: rate and acceleration limits plus settle. */
  record Eigenaxis(double rateDegPerS, double accelDegPerS2, double settleS, boolean keepOutDuringSlew)
      implements SlewSettings {
    public Eigenaxis {
      Checks.finite("rateDegPerS", rateDegPerS);
      Checks.finite("accelDegPerS2", accelDegPerS2);
      Checks.finite("settleS", settleS);
    }

    /** Keep-outs hold during slews (the format's default). */
    public Eigenaxis(double rateDegPerS, double accelDegPerS2, double settleS) {
      this(rateDegPerS, accelDegPerS2, settleS, true);
    }

    /** A copy with keep-outs during slews on or off. */
    public Eigenaxis withKeepOutDuringSlew(boolean on) {
      return new Eigenaxis(rateDegPerS, accelDegPerS2, settleS, on);
    }

    @Override
    public String model() {
      return "eigenaxis";
    }
  }

  /**
   * A two-axis alt-az mount; each axis has its own rate and acceleration, the slower axis sets the time.
   * {@code azimuthRangeDeg} is the mount's allowed unwrapped azimuth [min, max] (cable wrap), or
   * {@code null} for an unlimited azimuth axis.
   */
  record AltAz(
      double azimuthRateDegPerS,
      double elevationRateDegPerS,
      double azimuthAccelDegPerS2,
      double elevationAccelDegPerS2,
      double settleS,
      List<Double> azimuthRangeDeg,
      boolean keepOutDuringSlew)
      implements SlewSettings {
    /** Keep-outs hold during slews (the format's default). */
    public AltAz(double azimuthRateDegPerS, double elevationRateDegPerS, double azimuthAccelDegPerS2,
        double elevationAccelDegPerS2, double settleS, List<Double> azimuthRangeDeg) {
      this(azimuthRateDegPerS, elevationRateDegPerS, azimuthAccelDegPerS2, elevationAccelDegPerS2, settleS,
          azimuthRangeDeg, true);
    }

    /** A copy with keep-outs during slews on or off. */
    public AltAz withKeepOutDuringSlew(boolean on) {
      return new AltAz(azimuthRateDegPerS, elevationRateDegPerS, azimuthAccelDegPerS2, elevationAccelDegPerS2,
          settleS, azimuthRangeDeg, on);
    }

    public AltAz {
      Checks.finite("azimuthRateDegPerS", azimuthRateDegPerS);
      Checks.finite("elevationRateDegPerS", elevationRateDegPerS);
      Checks.finite("azimuthAccelDegPerS2", azimuthAccelDegPerS2);
      Checks.finite("elevationAccelDegPerS2", elevationAccelDegPerS2);
      Checks.finite("settleS", settleS);
      azimuthRangeDeg = azimuthRangeDeg == null ? null : List.copyOf(azimuthRangeDeg);
    }

    @Override
    public String model() {
      return "altaz";
    }
  }

  /** The same overhead between any two requests (and from the start pointing). */
  record Fixed(double seconds) implements SlewSettings {
    public Fixed {
      Checks.finite("seconds", seconds);
    }

    @Override
    public boolean keepOutDuringSlew() {
      return false; // no slew path is defined
    }

    @Override
    public String model() {
      return "fixed";
    }
  }

  /**
   * A user table by request order: {@code seconds.get(i).get(j)} from request i to request j, and
   * {@code fromStartSeconds.get(j)} from the start state to request j (all zero when absent).
   */
  record Matrix(List<List<Double>> seconds, List<Double> fromStartSeconds) implements SlewSettings {
    public Matrix {
      seconds = seconds.stream().map(List::copyOf).toList();
      fromStartSeconds = fromStartSeconds == null ? null : List.copyOf(fromStartSeconds);
    }

    @Override
    public boolean keepOutDuringSlew() {
      return false; // no slew path is defined
    }

    @Override
    public String model() {
      return "matrix";
    }
  }
}
