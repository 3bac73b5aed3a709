package dev.sequencer.slew;

import java.util.List;

/**
 * Eigenaxis transitions between possibly moving lines of sight. The exact leg is the rest-to-rest slew
 * between the line of sight of the previous request at its end (t_d) and that of the next at its start
 * (t_a): s(angle(from(t_d), to(t_a))), 0 when the two coincide.
 *
 * Two tracks with the same {@link PointingTrack.Anchor anchor} direction follow one catalogue target: the
 * mount keeps tracking it, so that leg is 0 s.
 *
 * <p>Bound over departures [a, b] and arrivals [c, e], with midpoints m_d, m_a and half-widths h_d, h_a: by
 * the triangle inequality on the sphere and because a track moves no faster than its maximum rate,
 * angle(from(t_d), to(t_a)) <= angle(from(m_d), to(m_a)) + D_from + D_to, with D = L·h (or, for an anchored
 * track, at most twice its anchor radius), never more than 180°; s is non-decreasing in the angle, so s of
 * that bound is never below the exact leg.
 *
 * <p><b>Time-independent</b> when every track (and the start) has an anchor (fixed targets, pointed at their
 * apparent direction, which moves by at most the annual aberration, 20.9" from the ground): the bound is
 * then s(angle(anchor_from, anchor_to) + r_from + r_to), the same for every departure and arrival, and never
 * below the exact leg at any time (triangle inequality through the anchors). It exceeds the exact leg by
 * the time to turn at most 2 (r_from + r_to), about 0.023° from the ground: 0.02 s at 1°/s.
 */
final class EigenaxisTransitions implements Transitions {
  private final EigenaxisModel model;
  private final List<PointingTrack> tracks;
  private final PointingTrack start;

  private final boolean timeDependent;

  EigenaxisTransitions(EigenaxisModel model, List<PointingTrack> tracks, PointingTrack startOrNull) {
    this.model = model;
    this.tracks = List.copyOf(tracks);
    this.start = startOrNull;
    boolean moving = start != null && anchor(start) == null;
    for (PointingTrack t : this.tracks) {
      moving |= anchor(t) == null;
    }
    this.timeDependent = moving;
  }

  /** The track's anchor; a track that declares none but never moves is its own anchor with radius 0. */
  private static PointingTrack.Anchor anchor(PointingTrack t) {
    PointingTrack.Anchor a = t.anchor();
    if (a == null && t.maxAngularRateDegPerS(-1e9, 1e9) == 0) {
      return new PointingTrack.Anchor(t.inertialDirection(0), 0);
    }
    return a;
  }

  /** True when both tracks follow the same catalogue target (equal anchor directions). */
  private static boolean sameTarget(PointingTrack f, PointingTrack t) {
    PointingTrack.Anchor a = f.anchor();
    PointingTrack.Anchor b = t.anchor();
    return a != null && b != null && a.direction().equals(b.direction());
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
    if (sameTarget(f, t)) {
      return 0;
    }
    if (!timeDependent) {
      PointingTrack.Anchor af = anchor(f);
      PointingTrack.Anchor at = anchor(t);
      double radiusDeg = af.radiusDeg() + at.radiusDeg();
      double angleDeg = EigenaxisModel.angleDeg(af.direction(), at.direction());
      return radiusDeg == 0 ? model.secondsForAngle(angleDeg == 0 ? 0 : Math.min(180, angleDeg + 1e-9))
          : model.secondsForAngle(Math.min(180, angleDeg + radiusDeg + 1e-9));
    }
    double md = departure.mid();
    double hd = departure.half();
    double ma = arrival.mid();
    double ha = arrival.half();
    double driftDeg = drift(f, hd, departureMinS, departureMaxS) + drift(t, ha, arrivalMinS, arrivalMaxS);
    double angleDeg = EigenaxisModel.angleDeg(f.inertialDirection(md), t.inertialDirection(ma)) + driftDeg;
    if (Double.isNaN(angleDeg)) {
      return Double.POSITIVE_INFINITY;
    }
    // 1e-9 deg covers the different order of the floating-point operations in the exact legs.
    return driftDeg > 0 ? model.movingSecondsForAngle(Math.min(180, angleDeg + 1e-9))
        : model.secondsForAngle(angleDeg == 0 ? 0 : Math.min(180, angleDeg + 1e-9));
  }

  /** How far a track can be from its midpoint direction over an interval of half-width h. */
  private static double drift(PointingTrack track, double h, double minS, double maxS) {
    if (h == 0) {
      return 0;
    }
    double byRate = track.maxAngularRateDegPerS(minS, maxS) * h;
    PointingTrack.Anchor a = track.anchor();
    return a == null ? byRate : Math.min(byRate, 2 * a.radiusDeg());
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
      PointingTrack t = tracks.get(to);
      return f == null || sameTarget(f, t) ? 0 : model.secondsForAngle(EigenaxisModel.angleDeg(
          f.inertialDirection(departure), t.inertialDirection(arrival)));
    });
  }

  /** True unless every line of sight (and the start's) has an anchor: then the bounds depend on no time. */
  @Override
  public boolean timeDependent() {
    return timeDependent;
  }
}
