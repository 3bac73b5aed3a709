package dev.sequencer.slew;

import dev.sequencer.model.SlewSettings;
import java.util.List;

/**
 * A two-axis alt-az mount: each axis follows its own {@link RestToRest} profile, both start together, and
 * the slower axis plus settle sets the time (0 when neither axis moves). Azimuth is unwrapped and limited
 * by the {@link CableWrap}; a pointing outside [elevationMinDeg, elevationMaxDeg] is refused.
 */
final class AltAzModel implements SlewModel {
  /**
   * Axis moves at or below this many degrees are no move: what is left of a zero move after the azimuth is
   * unwrapped over an observation by summing pieces (a mount tracking one target through two back-to-back
   * observations, as the visits of one request, does not move). 1e-9 deg is 3.6 micro-arcseconds, far below
   * any mount's encoder; the validator draws the same line on its own (SlewLegs).
   */
  static final double NO_MOVE_DEG = 1e-9;

  private final RestToRest azimuth;
  private final RestToRest elevation;
  private final double settleS;
  private final CableWrap wrap;
  private final double elevationMinDeg;
  private final double elevationMaxDeg;

  AltAzModel(SlewSettings.AltAz settings, double elevationMinDeg, double elevationMaxDeg) {
    this.azimuth = new RestToRest(settings.azimuthRateDegPerS(), settings.azimuthAccelDegPerS2());
    this.elevation = new RestToRest(settings.elevationRateDegPerS(), settings.elevationAccelDegPerS2());
    if (!(settings.settleS() >= 0)) {
      throw new IllegalArgumentException("settleS: must be >= 0 (was " + settings.settleS() + ")");
    }
    this.settleS = settings.settleS();
    List<Double> range = settings.azimuthRangeDeg();
    if (range != null && range.size() != 2) {
      throw new IllegalArgumentException("azimuthRangeDeg: must have 2 entries [min, max] (has " + range.size() + ")");
    }
    this.wrap = range == null ? CableWrap.NONE : new CableWrap(range.get(0), range.get(1));
    if (!(elevationMinDeg >= -90 && elevationMinDeg < elevationMaxDeg && elevationMaxDeg <= 90)) {
      throw new IllegalArgumentException("elevation limits: must satisfy -90 <= min < max <= 90 (was ["
          + elevationMinDeg + ", " + elevationMaxDeg + "])");
    }
    this.elevationMinDeg = elevationMinDeg;
    this.elevationMaxDeg = elevationMaxDeg;
  }

  RestToRest azimuthAxis() {
    return azimuth;
  }

  RestToRest elevationAxis() {
    return elevation;
  }

  CableWrap wrap() {
    return wrap;
  }

  boolean elevationAllowed(double elevationDeg) {
    return elevationDeg >= elevationMinDeg && elevationDeg <= elevationMaxDeg;
  }

  double elevationMinDeg() {
    return elevationMinDeg;
  }

  double elevationMaxDeg() {
    return elevationMaxDeg;
  }

  /**
   * Seconds for axis moves of the given sizes (>= 0): the slower axis plus settle, 0 when neither moves
   * (more than {@link #NO_MOVE_DEG}).
   */
  double seconds(double azimuthDeg, double elevationDeg) {
    if (!(azimuthDeg > NO_MOVE_DEG) && !(elevationDeg > NO_MOVE_DEG)) {
      return 0;
    }
    return movingSeconds(azimuthDeg, elevationDeg);
  }

  /** Seconds for a slew that ends later than it starts: the slower axis plus settle, even for no move. */
  double movingSeconds(double azimuthDeg, double elevationDeg) {
    return Math.max(azimuth.seconds(azimuthDeg), elevation.seconds(elevationDeg)) + settleS;
  }

  /** The longest possible slew: the whole azimuth range (or 180° without wrap) and 180° of elevation. */
  double worstS() {
    return seconds(wrap.limited() ? wrap.spanDeg() : 180, 180);
  }

  @Override
  public Transitions transitions(List<PointingTrack> tracks, PointingTrack startTrackOrNull) {
    return new AltAzTransitions(this, tracks, startTrackOrNull, MountKeepOut.empty());
  }

  /** With the keep-outs during slews: those seen from the site ({@link SiteKeepOut}, the Sun) bind the two-axis path. */
  @Override
  public Transitions transitions(List<PointingTrack> tracks, PointingTrack startTrackOrNull, KeepOuts keepOuts) {
    List<SiteKeepOut> cones = new java.util.ArrayList<>();
    for (KeepOut c : keepOuts.always()) {
      if (c instanceof SiteKeepOut site) {
        cones.add(site);
      }
    }
    return new AltAzTransitions(this, tracks, startTrackOrNull, new MountKeepOut(cones, keepOuts.fromS(), keepOuts.toS()));
  }
}
