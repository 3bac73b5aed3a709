package dev.sequencer.sequence.replan;

import dev.sequencer.slew.Transitions;
import java.util.Arrays;

/**
 * The transitions of a re-planning sub-problem: a subset of the scenario's requests, a clock that starts
 * {@code offsetS} seconds after the scenario's horizon start, and an initial pointing that is the end
 * pointing of the last frozen (done or running) observation rather than the scenario's start pointing.
 *
 * <p>{@link Transitions#START} of the sub-problem maps to that frozen observation (or to the scenario's
 * start pointing when nothing is frozen), departing at {@code fromEndS} (scenario seconds: its end, or 0)
 * whatever departure the caller passes: the telescope holds that pointing until the first new slew. Exact
 * legs are evaluated over the frozen observations followed by the new ones, with the departures and
 * arrivals the validator uses for the merged timeline, so models with state (an alt-az mount's unwrapped
 * azimuth) see the real history and the sequencer's legs equal the validator's.
 */
final class DepartureTransitions implements Transitions {
  private final Transitions full;
  private final int[] map;
  private final int[] frozenOrder;
  private final double[] frozenDepartureS;
  private final double[] frozenArrivalS;
  private final int from;
  private final double fromEndS;
  private final long offsetS;

  /**
   * {@code map[k]}: scenario index of sub-problem request k; {@code frozenOrder}, departures and arrivals
   * in scenario indices and seconds (departure of the first = 0, the scenario's start pointing);
   * {@code offsetS}: scenario second of the sub-problem's time 0.
   */
  DepartureTransitions(Transitions full, int[] map, int[] frozenOrder, double[] frozenDepartureS,
      double[] frozenArrivalS, double fromEndS, long offsetS) {
    this.full = full;
    this.map = map.clone();
    this.frozenOrder = frozenOrder.clone();
    this.frozenDepartureS = frozenDepartureS.clone();
    this.frozenArrivalS = frozenArrivalS.clone();
    this.from = frozenOrder.length == 0 ? START : frozenOrder[frozenOrder.length - 1];
    this.fromEndS = fromEndS;
    this.offsetS = offsetS;
  }

  @Override
  public int size() {
    return map.length;
  }

  @Override
  public double boundS(int f, int to, double departureMinS, double departureMaxS, double arrivalMinS,
      double arrivalMaxS) {
    if (f == START) {
      return full.boundS(from, map[to], fromEndS, fromEndS, arrivalMinS + offsetS, arrivalMaxS + offsetS);
    }
    return full.boundS(map[f], map[to], departureMinS + offsetS, departureMaxS + offsetS,
        arrivalMinS + offsetS, arrivalMaxS + offsetS);
  }

  @Override
  public double[] exactS(int[] order, double[] departureS, double[] arrivalS) {
    int p = frozenOrder.length;
    int m = order.length;
    int[] o = Arrays.copyOf(frozenOrder, p + m);
    double[] d = Arrays.copyOf(frozenDepartureS, p + m);
    double[] a = Arrays.copyOf(frozenArrivalS, p + m);
    for (int k = 0; k < m; k++) {
      o[p + k] = map[order[k]];
      d[p + k] = k == 0 ? fromEndS : departureS[k] + offsetS;
      a[p + k] = arrivalS[k] + offsetS;
    }
    return Arrays.copyOfRange(full.exactS(o, d, a), p, p + m);
  }

  /** The scenario's path through the frozen observations, then the new ones in sub-problem indices and clock. */
  @Override
  public Path path() {
    Path p = full.path();
    for (int q = 0; q < frozenOrder.length; q++) {
      p = p.then(frozenOrder[q], frozenDepartureS[q], frozenArrivalS[q]);
    }
    return new Shifted(p, true);
  }

  /** A path of the scenario seen in sub-problem indices and seconds; the first leg departs at {@code fromEndS}. */
  private final class Shifted implements Path {
    private final Path inner;
    private final boolean first;

    Shifted(Path inner, boolean first) {
      this.inner = inner;
      this.first = first;
    }

    @Override
    public int last() {
      if (first) {
        return START;
      }
      int k = inner.last();
      for (int q = 0; q < map.length; q++) {
        if (map[q] == k) {
          return q;
        }
      }
      throw new IllegalStateException("path ends at scenario request " + k + ", outside the sub-problem (a bug)");
    }

    @Override
    public double legS(int to, double departureS, double arrivalS) {
      return inner.legS(map[to], first ? fromEndS : departureS + offsetS, arrivalS + offsetS);
    }

    @Override
    public Path then(int to, double departureS, double arrivalS) {
      return new Shifted(inner.then(map[to], first ? fromEndS : departureS + offsetS, arrivalS + offsetS), false);
    }

    @Override
    public Object state() {
      Object s = inner.state();
      return s == null ? null : java.util.List.of(first, s);
    }
  }

  @Override
  public boolean timeDependent() {
    return full.timeDependent();
  }


  @Override
  public boolean exactMayExceedBound() {
    return full.exactMayExceedBound();
  }
}
