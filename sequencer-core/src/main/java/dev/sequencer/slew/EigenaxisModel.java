package dev.sequencer.slew;

import java.util.List;
import org.hipparchus.geometry.euclidean.threed.Vector3D;

/**
 * Rest-to-rest rotation about the eigenaxis: the angle between the two lines of sight, covered with the
 * {@link RestToRest} profile, plus settle. An unchanged pointing (angle exactly 0 at departure) takes 0 s,
 * settle included, so the time obeys the triangle inequality with or without settle. A slew to a moving
 * target that ends after its departure always pays the settle.
 */
final class EigenaxisModel implements SlewModel {
  private final RestToRest profile;
  private final double settleS;

  EigenaxisModel(double rateDegPerS, double accelDegPerS2, double settleS) {
    this.profile = new RestToRest(rateDegPerS, accelDegPerS2);
    if (!(settleS >= 0) || Double.isInfinite(settleS)) {
      throw new IllegalArgumentException("settleS: must be a finite number >= 0 (was " + settleS + ")");
    }
    this.settleS = settleS;
  }

  RestToRest profile() {
    return profile;
  }

  double settleS() {
    return settleS;
  }

  /**
   * Angle between two directions in degrees, in [0, 180]. atan2(|a×b|, a·b) keeps full precision for
   * nearly aligned and nearly opposite vectors, where acos of the dot product loses half the digits.
   */
  static double angleDeg(Vector3D a, Vector3D b) {
    return Math.toDegrees(Math.atan2(Vector3D.crossProduct(a, b).getNorm(), Vector3D.dotProduct(a, b)));
  }

  /** Seconds for a rotation of {@code angleDeg}: 0 when 0, else the profile plus settle. */
  double secondsForAngle(double angleDeg) {
    return angleDeg > 0 ? movingSecondsForAngle(angleDeg) : 0;
  }

  /** Seconds for a rotation that ends later than it starts: the profile plus settle, even for 0°. */
  double movingSecondsForAngle(double angleDeg) {
    return profile.seconds(angleDeg) + settleS;
  }

  /** Seconds between two fixed lines of sight. */
  double seconds(Vector3D from, Vector3D to) {
    return secondsForAngle(angleDeg(from, to));
  }

  @Override
  public Transitions transitions(List<PointingTrack> tracks, PointingTrack startTrackOrNull) {
    return new EigenaxisTransitions(this, tracks, startTrackOrNull);
  }

  @Override
  public Transitions transitions(List<PointingTrack> tracks, PointingTrack startTrackOrNull, KeepOuts keepOuts) {
    return new EigenaxisTransitions(this, tracks, startTrackOrNull, keepOuts);
  }
}
