package dev.sequencer.slew;

import java.util.List;

/**
 * Eigenaxis transitions between possibly moving lines of sight. The exact leg is the rest-to-rest slew
 * between the line of sight of the previous request at its end (t_d) and that of the next at its start
 * (t_a): s(angle(from(t_d), to(t_a))), 0 when the two coincide.
 *
 * <p>Bound over departures [a, b] and arrivals [c, e], with midpoints m_d, m_a and half-widths h_d, h_a: by
 * the triangle inequality on the sphere and because a track moves no faster than its maximum rate,
 * angle(from(t_d), to(t_a)) <= angle(from(m_d), to(m_a)) + L_from·h_d + L_to·h_a, never more than 180°;
 * s is non-decreasing in the angle, so s of that bound is never below the exact leg.
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
  public double boundS(int from, int to, double departureMinS, double departureMaxS, double arrivalMinS,
      double arrivalMaxS) {
    Intervals.Span departure = Intervals.span("departure", departureMinS, departureMaxS);
    Intervals.Span arrival = Intervals.span("arrival", arrivalMinS, arrivalMaxS);
    if (from == START && start == null) {
      return 0;
    }
    PointingTrack f = from == START ? start : tracks.get(from);
    PointingTrack t = tracks.get(to);
    double md = departure.mid();
    double hd = departure.half();
    double ma = arrival.mid();
    double ha = arrival.half();
    double driftDeg = (hd == 0 ? 0 : f.maxAngularRateDegPerS(departureMinS, departureMaxS) * hd)
        + (ha == 0 ? 0 : t.maxAngularRateDegPerS(arrivalMinS, arrivalMaxS) * ha);
    double angleDeg = EigenaxisModel.angleDeg(f.inertialDirection(md), t.inertialDirection(ma)) + driftDeg;
    if (Double.isNaN(angleDeg)) {
      return Double.POSITIVE_INFINITY;
    }
    // 1e-9 deg covers the different order of the floating-point operations in the exact legs.
    return driftDeg > 0 ? model.movingSecondsForAngle(Math.min(180, angleDeg + 1e-9))
        : model.secondsForAngle(angleDeg == 0 ? 0 : Math.min(180, angleDeg + 1e-9));
  }

  @Override
  public double[] exactS(int[] order, double[] departureS, double[] arrivalS) {
    Intervals.checkSequence(order, departureS, arrivalS, tracks.size());
    return Paths.along(path(), order, departureS, arrivalS);
  }

  /** Legs depend on the two requests and instants only; without a start track the first leg is 0 s. */
  @Override
  public Path path() {
    return StatelessPath.start((from, to, departure, arrival) -> {
      PointingTrack f = from == START ? start : tracks.get(from);
      return f == null ? 0 : model.secondsForAngle(EigenaxisModel.angleDeg(
          f.inertialDirection(departure), tracks.get(to).inertialDirection(arrival)));
    });
  }

  /**
   * True unless every line of sight (and the start's) is still: then the legs depend on no time. A still
   * track's rate bound is 0 on any interval, a moving one's is positive on every interval, so the bound at
   * the horizon start is asked (asking over decades made a numerically propagated orbit integrate them).
   */
  @Override
  public boolean timeDependent() {
    if (start != null && start.maxAngularRateDegPerS(0, 0) != 0) {
      return true;
    }
    return tracks.stream().anyMatch(t -> t.maxAngularRateDegPerS(0, 0) != 0);
  }
}
