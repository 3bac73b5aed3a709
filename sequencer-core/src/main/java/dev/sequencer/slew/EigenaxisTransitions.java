package dev.sequencer.slew;

import java.util.List;

/**
 * Eigenaxis transitions between moving lines of sight. The exact leg leaving at t_d is the earliest T
 * with s(angle(from(t_d), to(t_d + T))) <= T, found by {@link FixedPoint#earliest}, where s includes the
 * settle for every T > 0 (only T = 0 with an unchanged pointing is free); the angle cannot shrink faster
 * than the target's rate bound, which gives the lower bound that search needs.
 *
 * <p>Bound over departures [a, b], with c = (a + b) / 2 and h = (b - a) / 2: by the triangle inequality on
 * the sphere and because a track moves no faster than its maximum rate, angle(from(t_d), to(t_d + T)) <=
 * angle(from(c), to(c)) + L_from·h + L_to·(h + T), never more than 180°. The slew time s is non-decreasing
 * in the angle, so G(T) = s(min(180, that)) is a non-decreasing upper bound on the exact map, and
 * B_0 = s(180) bounds every slew; {@link FixedPoint#bound} does the rest. L_to is taken over
 * [a, b + B_0], every arrival instant a slew can have.
 */
final class EigenaxisTransitions implements Transitions {
  private final EigenaxisModel model;
  private final List<PointingTrack> tracks;
  private final PointingTrack start;

  EigenaxisTransitions(EigenaxisModel model, List<PointingTrack> tracks, PointingTrack startOrNull) {
    this.model = model;
    this.tracks = List.copyOf(tracks);
    this.start = startOrNull;
  }

  @Override
  public int size() {
    return tracks.size();
  }

  @Override
  public double boundS(int from, int to, double departureMinS, double departureMaxS) {
    Intervals.check(departureMinS, departureMaxS);
    if (from == START && start == null) {
      return 0;
    }
    PointingTrack f = from == START ? start : tracks.get(from);
    PointingTrack t = tracks.get(to);
    double c = 0.5 * (departureMinS + departureMaxS);
    double h = 0.5 * (departureMaxS - departureMinS);
    double worstS = model.secondsForAngle(180);
    double rateFrom = f.maxAngularRateDegPerS(departureMinS, departureMaxS);
    double rateTo = t.maxAngularRateDegPerS(departureMinS, departureMaxS + worstS);
    double angleAtDepartureDeg =
        EigenaxisModel.angleDeg(f.inertialDirection(c), t.inertialDirection(c)) + (rateFrom + rateTo) * h;
    return FixedPoint.bound(
        worstS, tS -> model.secondsForAngle(Math.min(180, angleAtDepartureDeg + rateTo * tS)));
  }

  @Override
  public double[] exactS(int[] order, double[] departureS) {
    Intervals.checkSequence(order, departureS, tracks.size());
    double[] out = new double[order.length];
    for (int k = 0; k < order.length; k++) {
      PointingTrack f = k == 0 ? start : tracks.get(order[k - 1]);
      out[k] = f == null ? 0 : leg(f, tracks.get(order[k]), departureS[k]);
    }
    return out;
  }

  private double leg(PointingTrack from, PointingTrack to, double departureS) {
    var fromDirection = from.inertialDirection(departureS);
    return FixedPoint.earliest(tS -> {
      double angleDeg = EigenaxisModel.angleDeg(fromDirection, to.inertialDirection(departureS + tS));
      double seconds = tS == 0 ? model.secondsForAngle(angleDeg) : model.movingSecondsForAngle(angleDeg);
      if (!(seconds > tS) || Double.isInfinite(seconds)) {
        return new FixedPoint.Probe(seconds, dS -> 0);
      }
      // The next jump stays inside [T, φ(T)], so the target's rate is needed there only.
      double rateTo = to.maxAngularRateDegPerS(departureS + tS, departureS + seconds);
      return new FixedPoint.Probe(seconds,
          dS -> model.movingSecondsForAngle(Math.max(0, angleDeg - rateTo * dS)));
    });
  }

  @Override
  public boolean timeDependent() {
    return true;
  }
}
