package dev.sequencer.slew;

import dev.sequencer.model.AzEl;
import java.util.Arrays;
import java.util.List;

/**
 * Alt-az transitions with an unwrapped azimuth carried along the sequence.
 *
 * <p><b>Exact.</b> As the scenario format says, a leg is measured from the pointing of the previous request
 * at its end (t_d) to the pointing of the next at its start (t_a): the slower axis plus settle, 0 when
 * neither axis moves. The mount starts at the start pointing's azimuth ({@link CableWrap#initial}), or,
 * without a start pointing, on the first target's azimuth branch nearest the range centre (first leg 0 s).
 * Each leg goes to the branch of the target's azimuth nearest the current unwrapped azimuth inside the
 * range (the quicker legal way round); it is infinite if no branch is inside or the target's elevation at
 * t_a is outside the limits. During an observation the mount follows the target, so the state at the next
 * departure is the arrival branch plus the target's continuous azimuth change over the observation; if
 * that leaves the range the cable wrap ran out, and that leg and every later one are infinite (the bound
 * below assumes a legal state, so it does not cover this case).
 *
 * <p><b>Bound</b> over departures [a, b] (midpoint m_d, half-width h_d) and arrivals [c, e] (m_a, h_a).
 * Axis positions move no faster than the tracks' rate bounds, so with drifts w_f = R_az,from·h_d and
 * w_t = R_az,to·h_a, a from-branch u_k = A_from(m_d) + 360k is a possible state only if [u_k ± w_f] meets the
 * range, a to-branch v_j = A_to(m_a) + 360j is possibly legal at arrival if [v_j ± w_t] meets the range and
 * surely legal if it lies inside, and |v_j(t_a) - u_k(t_d)| <= |v_j - u_k| + w_f + w_t. For each possible
 * state the exact leg uses the nearest legal branch, which is no farther than the nearest surely legal one;
 * if there is none but the range spans 360° some branch is always legal, so the farthest possibly legal one
 * bounds it; otherwise the bound is infinite. The azimuth bound is the maximum over the possible states,
 * never more than the range span. Elevation likewise, with the bound infinite if the target's elevation
 * may leave the limits. The slew time is non-decreasing in both axis distances.
 */
final class AltAzTransitions implements Transitions {
  /** Unwrapping samples at most this azimuth change per step, so wrapped differences are the true ones. */
  private static final double UNWRAP_STEP_DEG = 90;
  private static final int MAX_UNWRAP_STEPS = 1_000_000;
  /** Added to bounded axis distances so rounding in the exact legs never exceeds the bound (1e-9 deg). */
  static final double ROUNDING_DEG = 1e-9;

  private final AltAzModel model;
  private final CableWrap wrap;
  private final List<PointingTrack> tracks;
  private final PointingTrack start;
  private final MountKeepOut keepOut;

  AltAzTransitions(AltAzModel model, List<PointingTrack> tracks, PointingTrack startOrNull, MountKeepOut keepOut) {
    this.model = model;
    this.keepOut = keepOut;
    this.wrap = model.wrap();
    this.tracks = List.copyOf(tracks);
    this.start = startOrNull;
  }

  @Override
  public int size() {
    return tracks.size();
  }

  @Override
  public boolean timeDependent() {
    return true;
  }

  @Override
  public boolean exactMayExceedBound() {
    return wrap.limited() || !keepOut.none();
  }

  @Override
  public double[] exactS(int[] order, double[] departureS, double[] arrivalS) {
    return run(order, departureS, arrivalS).seconds();
  }

  @Override
  public Path path() {
    return new MountPath(START, Double.NaN, Double.NaN, false);
  }

  /**
   * Legs along a sequence: {@code seconds[k]} as {@link #exactS}, and {@code departureAzimuthDeg[k]} the
   * mount's unwrapped azimuth when leg k leaves (NaN for k = 0 without a start track, and once lost).
   */
  record Legs(double[] seconds, double[] departureAzimuthDeg) {}

  Legs run(int[] order, double[] departureS, double[] arrivalS) {
    Intervals.checkSequence(order, departureS, arrivalS, tracks.size());
    double[] out = new double[order.length];
    double[] states = new double[order.length];
    Arrays.fill(out, Double.POSITIVE_INFINITY);
    Arrays.fill(states, Double.NaN);
    MountPath p = (MountPath) path();
    for (int k = 0; k < order.length; k++) {
      Step step = p.step(order[k], departureS[k], arrivalS[k]);
      states[k] = step.departureAzimuthDeg();
      out[k] = step.seconds();
      if (step.seconds() == Double.POSITIVE_INFINITY) {
        break; // this and every later leg are lost
      }
      p = new MountPath(order[k], arrivalS[k], step.arrivalAzimuthDeg(), false);
    }
    return new Legs(out, states);
  }

  /** One leg: its seconds (+inf when impossible), the unwrapped azimuth it leaves from and arrives at. */
  private record Step(double seconds, double departureAzimuthDeg, double arrivalAzimuthDeg) {
    static final Step LOST = new Step(Double.POSITIVE_INFINITY, Double.NaN, Double.NaN);
  }

  /**
   * The mount after observing {@code last} from {@code lastArrivalS} on, arrived at the unwrapped azimuth
   * {@code azimuthDeg} ({@link #START} before the first observation; {@code lost} once a leg was impossible).
   */
  private final class MountPath implements Path {
    private final int last;
    private final double lastArrivalS;
    private final double azimuthDeg;
    private final boolean lost;

    MountPath(int last, double lastArrivalS, double azimuthDeg, boolean lost) {
      this.last = last;
      this.lastArrivalS = lastArrivalS;
      this.azimuthDeg = azimuthDeg;
      this.lost = lost;
    }

    @Override
    public int last() {
      return last;
    }

    @Override
    public double legS(int to, double departureS, double arrivalS) {
      return step(to, departureS, arrivalS).seconds();
    }

    /** Last request, its arrival, the arrival branch and whether the path is lost: all later legs follow from them. */
    @Override
    public Object state() {
      return java.util.List.of(last, lastArrivalS, azimuthDeg, lost);
    }

    @Override
    public Path then(int to, double departureS, double arrivalS) {
      Step s = step(to, departureS, arrivalS);
      return s.seconds() == Double.POSITIVE_INFINITY ? new MountPath(to, arrivalS, Double.NaN, true)
          : new MountPath(to, arrivalS, s.arrivalAzimuthDeg(), false);
    }

    /**
     * The leg of the class comment: from the start pointing's azimuth (or, without a start track, 0 s onto
     * the first target's branch nearest the range centre), else from the arrival branch plus the previous
     * target's continuous azimuth change over its observation, to the nearest legal branch of the target.
     */
    Step step(int to, double departureS, double arrivalS) {
      if (lost) {
        return Step.LOST;
      }
      AzEl target = tracks.get(to).azEl(arrivalS);
      if (!model.elevationAllowed(target.elevationDeg())) {
        return Step.LOST;
      }
      if (last == START && start == null) {
        double v = wrap.initial(target.azimuthDeg());
        return Double.isNaN(v) ? Step.LOST : new Step(0, Double.NaN, v);
      }
      double u;
      double fromElevationDeg;
      if (last == START) {
        AzEl s = start.azEl(departureS);
        u = wrap.initial(s.azimuthDeg());
        fromElevationDeg = s.elevationDeg();
      } else {
        PointingTrack from = tracks.get(last);
        u = azimuthDeg + unwrappedChangeDeg(from, lastArrivalS, departureS);
        fromElevationDeg = from.azEl(departureS).elevationDeg();
      }
      if (Double.isNaN(u) || !wrap.contains(u)) {
        return new Step(Double.POSITIVE_INFINITY, u, Double.NaN); // the cable wrap ran out
      }
      double v = wrap.nearestLegal(target.azimuthDeg(), u);
      if (Double.isNaN(v)) {
        return new Step(Double.POSITIVE_INFINITY, u, Double.NaN);
      }
      double toEl = target.elevationDeg();
      if (keepOut.none() || !keepOut.mayBind(Math.min(u, v), Math.max(u, v), Math.min(fromElevationDeg, toEl),
          Math.max(fromElevationDeg, toEl), departureS, Math.max(departureS, arrivalS))) {
        return new Step(model.seconds(Math.abs(v - u), Math.abs(toEl - fromElevationDeg)), u, v);
      }
      return avoiding(u, fromElevationDeg, v, toEl, departureS, arrivalS);
    }

    /**
     * The Sun keep-out may bind (spec A3): the nearest legal azimuth branch when its two-axis path, departing
     * at {@code departureS}, keeps it; impossible otherwise (the planner looks for another departure or
     * order). Going the other way round is not taken yet: the validator's own alt-az slew takes the nearest
     * branch, and the two must agree before a longer way is offered.
     */
    private Step avoiding(double u, double fromEl, double v, double toEl, double departureS, double arrivalS) {
      double best = Double.POSITIVE_INFINITY;
      double bestV = Double.NaN;
      for (double w : new double[] {v}) {
        if (wrap.limited() && !wrap.contains(w)) {
          continue;
        }
        double seconds = model.seconds(Math.abs(w - u), Math.abs(toEl - fromEl));
        if (seconds < best && keepOut.clear(model, u, fromEl, w, toEl, departureS, arrivalS)) {
          best = seconds;
          bestV = w;
        }
      }
      return Double.isNaN(bestV) ? new Step(Double.POSITIVE_INFINITY, u, Double.NaN) : new Step(best, u, bestV);
    }
  }

  /**
   * The continuous change of a track's azimuth from t1S to t2S (signed), sampled in steps of at most
   * {@value #UNWRAP_STEP_DEG}° by the track's rate bound; NaN when that bound is infinite or too large.
   */
  static double unwrappedChangeDeg(PointingTrack track, double t1S, double t2S) {
    if (t1S == t2S) {
      return 0;
    }
    double lo = Math.min(t1S, t2S);
    double hi = Math.max(t1S, t2S);
    double change = unwrapPiece(track, lo, hi, track.azEl(lo).azimuthDeg(), track.azEl(hi).azimuthDeg());
    return t2S >= t1S ? change : -change;
  }

  /** Shortest piece the unwrapping splits; below it the wrapped difference is taken as the change. */
  private static final double MIN_UNWRAP_PIECE_S = 0.5;

  /**
   * The continuous azimuth change over [a, b], given the azimuths at both ends: where the rate bound
   * allows at most {@value #UNWRAP_STEP_DEG}° per step in a few steps, sampled; otherwise (a fast or
   * unbounded azimuth rate, as near the zenith) the piece is halved, down to {@link #MIN_UNWRAP_PIECE_S},
   * where the wrapped difference is taken (an azimuth flip faster than that is beyond any mount anyway).
   */
  private static double unwrapPiece(PointingTrack track, double a, double b, double azA, double azB) {
    double rate = track.maxAzimuthRateDegPerS(a, b);
    double steps = Math.ceil((b - a) * rate / UNWRAP_STEP_DEG);
    if (steps <= 1 || b - a <= MIN_UNWRAP_PIECE_S) {
      return Math.IEEEremainder(azB - azA, 360);
    }
    if (steps <= 64) {
      int n = (int) steps;
      double previous = azA;
      double sum = 0;
      for (int i = 1; i <= n; i++) {
        double az = i == n ? azB : track.azEl(a + (b - a) * i / n).azimuthDeg();
        sum += Math.IEEEremainder(az - previous, 360);
        previous = az;
      }
      return sum;
    }
    double m = 0.5 * (a + b);
    double azM = track.azEl(m).azimuthDeg();
    return unwrapPiece(track, a, m, azA, azM) + unwrapPiece(track, m, b, azM, azB);
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
    double fromAzimuthDriftDeg = hd == 0 ? 0 : f.maxAzimuthRateDegPerS(departureMinS, departureMaxS) * hd;
    double fromElevationDriftDeg = hd == 0 ? 0 : f.maxElevationRateDegPerS(departureMinS, departureMaxS) * hd;
    double toAzimuthDriftDeg = ha == 0 ? 0 : t.maxAzimuthRateDegPerS(arrivalMinS, arrivalMaxS) * ha;
    double toElevationDriftDeg = ha == 0 ? 0 : t.maxElevationRateDegPerS(arrivalMinS, arrivalMaxS) * ha;
    if (!Double.isFinite(fromAzimuthDriftDeg + fromElevationDriftDeg + toAzimuthDriftDeg + toElevationDriftDeg)) {
      return Double.POSITIVE_INFINITY; // a pointing may move arbitrarily fast (through the zenith)
    }
    AzEl pf = f.azEl(md);
    AzEl pt = t.azEl(ma);
    if (!(pt.elevationDeg() - toElevationDriftDeg >= model.elevationMinDeg()
        && pt.elevationDeg() + toElevationDriftDeg <= model.elevationMaxDeg())) {
      return Double.POSITIVE_INFINITY;
    }
    double elevationDeg = Math.min(180,
        Math.abs(pt.elevationDeg() - pf.elevationDeg()) + fromElevationDriftDeg + toElevationDriftDeg);
    double azimuthDeg = azimuthBoundDeg(wrap, pf.azimuthDeg(), fromAzimuthDriftDeg, pt.azimuthDeg(), toAzimuthDriftDeg);
    if (Double.isInfinite(azimuthDeg)) {
      return Double.POSITIVE_INFINITY;
    }
    if (!keepOut.none()) {
      // The leg can depart and arrive anywhere in the ranges; its azimuth stays within azimuthDeg of a
      // possible from state, its elevation between the ends' (MountKeepOut.mayBind). Where the keep-out may
      // bind, the exact leg may take a longer branch or be impossible: no finite bound is promised.
      double azLo = pf.azimuthDeg() - fromAzimuthDriftDeg - azimuthDeg;
      double azHi = pf.azimuthDeg() + fromAzimuthDriftDeg + azimuthDeg;
      double elLo = Math.min(pf.elevationDeg() - fromElevationDriftDeg, pt.elevationDeg() - toElevationDriftDeg);
      double elHi = Math.max(pf.elevationDeg() + fromElevationDriftDeg, pt.elevationDeg() + toElevationDriftDeg);
      if (keepOut.mayBind(azLo, azHi, elLo, elHi, departureMinS, Math.max(departureMaxS, arrivalMaxS))) {
        return Double.POSITIVE_INFINITY;
      }
    }
    double drift = fromAzimuthDriftDeg + fromElevationDriftDeg + toAzimuthDriftDeg + toElevationDriftDeg;
    // ROUNDING_DEG covers the different order of the floating-point operations in the exact legs.
    return drift > 0 ? model.movingSeconds(azimuthDeg + ROUNDING_DEG, elevationDeg + ROUNDING_DEG)
        : model.seconds(azimuthDeg, elevationDeg) == 0 ? 0
        : model.seconds(azimuthDeg + ROUNDING_DEG, elevationDeg + ROUNDING_DEG);
  }

  /** The azimuth distance bound of the class comment: max over possible states of the best legal branch. */
  static double azimuthBoundDeg(CableWrap wrap, double fromDeg, double fromDriftDeg, double toDeg, double toDriftDeg) {
    if (!wrap.limited()) {
      return Math.min(180, Math.abs(Math.IEEEremainder(toDeg - fromDeg, 360)) + fromDriftDeg + toDriftDeg);
    }
    if (fromDriftDeg >= wrap.spanDeg() || toDriftDeg >= wrap.spanDeg()) {
      return saturatedAzimuthBoundDeg(wrap, fromDeg, fromDriftDeg, toDeg, toDriftDeg);
    }
    double worstDeg = Double.NaN;
    for (long k = (long) Math.floor((wrap.minDeg() - fromDriftDeg - fromDeg) / 360);
        fromDeg + 360 * k - fromDriftDeg <= wrap.maxDeg(); k++) {
      double u = fromDeg + 360 * k;
      if (u + fromDriftDeg < wrap.minDeg()) {
        continue;
      }
      double surelyDeg = Double.POSITIVE_INFINITY;
      double possiblyDeg = Double.NaN;
      for (long j = (long) Math.floor((wrap.minDeg() - toDriftDeg - toDeg) / 360);
          toDeg + 360 * j - toDriftDeg <= wrap.maxDeg(); j++) {
        double v = toDeg + 360 * j;
        if (v + toDriftDeg < wrap.minDeg()) {
          continue;
        }
        double distanceDeg = Math.min(wrap.spanDeg(), Math.abs(v - u) + fromDriftDeg + toDriftDeg);
        possiblyDeg = Double.isNaN(possiblyDeg) ? distanceDeg : Math.max(possiblyDeg, distanceDeg);
        if (v - toDriftDeg >= wrap.minDeg() && v + toDriftDeg <= wrap.maxDeg()) {
          surelyDeg = Math.min(surelyDeg, distanceDeg);
        }
      }
      double stateDeg = Double.isFinite(surelyDeg) ? surelyDeg
          : wrap.spanDeg() >= 360 && !Double.isNaN(possiblyDeg) ? possiblyDeg
          : Double.POSITIVE_INFINITY;
      worstDeg = Double.isNaN(worstDeg) ? stateDeg : Math.max(worstDeg, stateDeg);
    }
    // No possible legal state: the from pointing can never be held, so nothing is promised.
    return Double.isNaN(worstDeg) ? Double.POSITIVE_INFINITY : worstDeg;
  }

  /**
   * {@link #azimuthBoundDeg} when a drift reaches the wrap's span (long departure intervals, or a target
   * near the zenith whose azimuth rate has no useful bound): the same value without looping over every
   * 360-degree branch the drift covers (millions of them for a drift of hours at the 360 deg/s "no bound"
   * rate). Every distance min(span, |v - u| + drifts) is then the span. A target state is surely legal
   * only when 2 x toDrift fits inside the range, which a drift of at least the span never does; whether
   * one is does not depend on the from state. So the bound is the span when some legal from state exists
   * and (some target state is surely legal, or the range covers a full turn so every state has a branch),
   * and infinite otherwise, exactly as the loops decide.
   */
  private static double saturatedAzimuthBoundDeg(CableWrap wrap, double fromDeg, double fromDriftDeg, double toDeg,
      double toDriftDeg) {
    double spanDeg = wrap.spanDeg();
    if (!someBranchWithin(fromDeg, wrap.minDeg() - fromDriftDeg, wrap.maxDeg() + fromDriftDeg)) {
      return Double.POSITIVE_INFINITY; // no possible legal from state: nothing is promised
    }
    boolean surely = toDriftDeg < spanDeg
        && someBranchWithin(toDeg, wrap.minDeg() + toDriftDeg, wrap.maxDeg() - toDriftDeg);
    boolean possibly = someBranchWithin(toDeg, wrap.minDeg() - toDriftDeg, wrap.maxDeg() + toDriftDeg);
    return surely || (spanDeg >= 360 && possibly) ? spanDeg : Double.POSITIVE_INFINITY;
  }

  /** True when some branch {@code deg + 360 k} (k an integer) lies in [lo, hi]. */
  private static boolean someBranchWithin(double deg, double lo, double hi) {
    if (!(lo <= hi)) {
      return false;
    }
    double k = Math.ceil((lo - deg) / 360);
    return deg + 360 * k <= hi;
  }
}
