package dev.sequencer.slew;

import dev.sequencer.model.AzEl;
import java.util.Arrays;
import java.util.List;

/**
 * Alt-az transitions with an unwrapped azimuth carried along the sequence.
 *
 * <p><b>Exact.</b> The mount starts at the start pointing's azimuth ({@link CableWrap#initial}), or, without
 * a start pointing, on the first target's azimuth branch nearest the range centre (first leg 0 s). Each leg
 * leaving at t_d with unwrapped state u is the earliest T with s(T) <= T ({@link FixedPoint#earliest}),
 * where s(T) is the slew to the target's pointing at t_d + T on the branch of its azimuth nearest u inside
 * the range, infinite if no branch is inside or the target elevation is outside the limits, and with
 * settle for every T > 0 (only T = 0 with an unchanged pointing is free). The search's
 * lower bound of s after T: each axis distance shrinks no faster than the target's rate bound, and a
 * branch can only become legal once it is within that drift of the range. During the observation the mount follows the target, and the
 * state at the next departure is the arrival branch plus the target's continuous azimuth change. If that
 * leaves the range, the cable wrap ran out during the observation: that leg and every later one are
 * infinite (the bound below assumes a legal state, so it does not cover this case).
 *
 * <p><b>Bound</b> over departures [a, b], c = (a + b) / 2, h = (b - a) / 2. Axis positions move no faster
 * than the tracks' rate bounds, so with w_f = R_az,from·h and w_t = R_az,to·(h + T), a from-branch
 * u_k = A_from(c) + 360k is a possible state only if [u_k ± w_f] meets the range, a to-branch
 * v_j = A_to(c) + 360j is possibly legal at arrival if [v_j ± w_t] meets the range and surely legal if it
 * lies inside, and |v_j(t_a) - u_k(t_d)| <= |v_j - u_k| + w_f + w_t. For each possible state the exact
 * leg uses the nearest legal branch, which is no farther than the nearest surely legal one; if there is
 * none but the range spans 360° some branch is always legal, so the farthest possibly legal one bounds it;
 * otherwise the target may be unreachable and the bound is infinite. The azimuth bound is the maximum of
 * this over the possible states, never more than the range span. Elevation likewise, with the bound
 * infinite if the target's elevation may leave the limits. The slew time is non-decreasing in both axis
 * distances and they grow with T, which gives the non-decreasing G of {@link FixedPoint#bound}, started at
 * the longest possible slew. Rates of the target are taken over [a, b + that slew].
 */
final class AltAzTransitions implements Transitions {
  /** Unwrapping samples at most this azimuth change per step, so wrapped differences are the true ones. */
  private static final double UNWRAP_STEP_DEG = 90;
  private static final int MAX_UNWRAP_STEPS = 1_000_000;

  private final AltAzModel model;
  private final CableWrap wrap;
  private final List<PointingTrack> tracks;
  private final PointingTrack start;

  AltAzTransitions(AltAzModel model, List<PointingTrack> tracks, PointingTrack startOrNull) {
    this.model = model;
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
  public double[] exactS(int[] order, double[] departureS) {
    return run(order, departureS).seconds();
  }

  /**
   * Legs along a sequence: {@code seconds[k]} as {@link #exactS}, and {@code departureAzimuthDeg[k]} the
   * mount's unwrapped azimuth when leg k leaves (NaN for k = 0 without a start track, and once lost).
   */
  record Legs(double[] seconds, double[] departureAzimuthDeg) {}

  Legs run(int[] order, double[] departureS) {
    Intervals.checkSequence(order, departureS, tracks.size());
    double[] out = new double[order.length];
    double[] states = new double[order.length];
    Arrays.fill(out, Double.POSITIVE_INFINITY);
    Arrays.fill(states, Double.NaN);
    double state = Double.NaN; // unwrapped azimuth at the previous arrival
    double arrivalS = Double.NaN;
    for (int k = 0; k < order.length; k++) {
      PointingTrack to = tracks.get(order[k]);
      double td = departureS[k];
      double u;
      double fromElevationDeg;
      if (k == 0 && start == null) {
        AzEl p = to.azEl(td);
        state = model.elevationAllowed(p.elevationDeg()) ? wrap.initial(p.azimuthDeg()) : Double.NaN;
        arrivalS = td;
        if (Double.isNaN(state)) {
          break;
        }
        out[k] = 0;
        continue;
      } else if (k == 0) {
        AzEl s = start.azEl(td);
        u = wrap.initial(s.azimuthDeg());
        fromElevationDeg = s.elevationDeg();
      } else {
        PointingTrack from = tracks.get(order[k - 1]);
        u = state + unwrappedChangeDeg(from, arrivalS, td);
        fromElevationDeg = from.azEl(td).elevationDeg();
      }
      states[k] = u;
      if (Double.isNaN(u) || !wrap.contains(u)) {
        break; // the cable wrap ran out during the previous observation: this and later legs are lost
      }
      double fromAzimuthDeg = u;
      double legS = FixedPoint.earliest(tS -> {
        AzEl target = to.azEl(td + tS);
        double seconds = legS(fromAzimuthDeg, fromElevationDeg, target, tS > 0);
        if (!(seconds > tS) || Double.isInfinite(seconds)) {
          return new FixedPoint.Probe(seconds, dS -> 0);
        }
        // The next jump stays inside [T, φ(T)], so the target's rates are needed there only.
        double azimuthRate = to.maxAzimuthRateDegPerS(td + tS, td + seconds);
        double elevationRate = to.maxElevationRateDegPerS(td + tS, td + seconds);
        return new FixedPoint.Probe(seconds, dS -> model.movingSeconds(
            nearestPossibleDeg(target.azimuthDeg(), fromAzimuthDeg, azimuthRate * dS),
            Math.max(0, Math.abs(target.elevationDeg() - fromElevationDeg) - elevationRate * dS)));
      });
      if (Double.isInfinite(legS)) {
        break;
      }
      AzEl arrival = to.azEl(td + legS);
      state = wrap.nearestLegal(arrival.azimuthDeg(), u);
      arrivalS = td + legS;
      if (Double.isNaN(state)) {
        break;
      }
      out[k] = legS;
    }
    return new Legs(out, states);
  }

  /**
   * The leg from unwrapped state (azimuth, elevation) to a pointing, on the quicker legal branch; a leg
   * that ends later than it starts ({@code moving}) always pays the settle.
   */
  private double legS(double fromAzimuthDeg, double fromElevationDeg, AzEl target, boolean moving) {
    if (!model.elevationAllowed(target.elevationDeg())) {
      return Double.POSITIVE_INFINITY;
    }
    double v = wrap.nearestLegal(target.azimuthDeg(), fromAzimuthDeg);
    if (Double.isNaN(v)) {
      return Double.POSITIVE_INFINITY;
    }
    double azimuthDeg = Math.abs(v - fromAzimuthDeg);
    double elevationDeg = Math.abs(target.elevationDeg() - fromElevationDeg);
    return moving ? model.movingSeconds(azimuthDeg, elevationDeg) : model.seconds(azimuthDeg, elevationDeg);
  }

  /**
   * A lower bound on the azimuth distance from {@code fromDeg} to the target once it has drifted up to
   * {@code driftDeg}: the nearest branch that could then be legal, less the drift (infinite if none).
   */
  private double nearestPossibleDeg(double azimuthDeg, double fromDeg, double driftDeg) {
    if (!(driftDeg < 360)) {
      return 0; // also for an infinite rate bound; every branch within a turn could be the nearest
    }
    if (!wrap.limited()) {
      return Math.max(0, Math.abs(Math.IEEEremainder(azimuthDeg - fromDeg, 360)) - driftDeg);
    }
    double best = Double.POSITIVE_INFINITY;
    for (long j = (long) Math.floor((wrap.minDeg() - driftDeg - azimuthDeg) / 360);
        azimuthDeg + 360 * j - driftDeg <= wrap.maxDeg(); j++) {
      double v = azimuthDeg + 360 * j;
      if (v + driftDeg >= wrap.minDeg()) {
        best = Math.min(best, Math.max(0, Math.abs(v - fromDeg) - driftDeg));
      }
    }
    return best;
  }

  /**
   * The continuous change of a track's azimuth from t1S to t2S (signed), sampled in steps of at most
   * {@value #UNWRAP_STEP_DEG}° by the track's rate bound; NaN when that bound is infinite or too large.
   */
  static double unwrappedChangeDeg(PointingTrack track, double t1S, double t2S) {
    if (t1S == t2S) {
      return 0;
    }
    double rate = track.maxAzimuthRateDegPerS(Math.min(t1S, t2S), Math.max(t1S, t2S));
    double steps = Math.ceil(Math.abs(t2S - t1S) * rate / UNWRAP_STEP_DEG);
    if (!(steps <= MAX_UNWRAP_STEPS)) {
      return Double.NaN;
    }
    int n = Math.max(1, (int) steps);
    double previous = track.azEl(t1S).azimuthDeg();
    double sum = 0;
    for (int i = 1; i <= n; i++) {
      double a = track.azEl(t1S + (t2S - t1S) * i / n).azimuthDeg();
      sum += Math.IEEEremainder(a - previous, 360);
      previous = a;
    }
    return sum;
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
    double worstS = model.worstS();
    double fromAzimuthDriftDeg = h == 0 ? 0 : f.maxAzimuthRateDegPerS(departureMinS, departureMaxS) * h;
    double fromElevationDriftDeg = h == 0 ? 0 : f.maxElevationRateDegPerS(departureMinS, departureMaxS) * h;
    double toAzimuthRate = t.maxAzimuthRateDegPerS(departureMinS, departureMaxS + worstS);
    double toElevationRate = t.maxElevationRateDegPerS(departureMinS, departureMaxS + worstS);
    if (!Double.isFinite(fromAzimuthDriftDeg + fromElevationDriftDeg + toAzimuthRate + toElevationRate)) {
      return Double.POSITIVE_INFINITY; // a pointing may move arbitrarily fast (through the zenith)
    }
    AzEl pf = f.azEl(c);
    AzEl pt = t.azEl(c);
    return FixedPoint.bound(worstS, tS -> {
      double toAzimuthDriftDeg = toAzimuthRate * (h + tS);
      double toElevationDriftDeg = toElevationRate * (h + tS);
      if (!(pt.elevationDeg() - toElevationDriftDeg >= model.elevationMinDeg()
          && pt.elevationDeg() + toElevationDriftDeg <= model.elevationMaxDeg())) {
        return Double.POSITIVE_INFINITY;
      }
      double elevationDeg = Math.min(180,
          Math.abs(pt.elevationDeg() - pf.elevationDeg()) + fromElevationDriftDeg + toElevationDriftDeg);
      double azimuthDeg = azimuthBoundDeg(wrap, pf.azimuthDeg(), fromAzimuthDriftDeg, pt.azimuthDeg(), toAzimuthDriftDeg);
      return model.seconds(azimuthDeg, elevationDeg); // <= worstS: the distances are capped like worstS's
    });
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
