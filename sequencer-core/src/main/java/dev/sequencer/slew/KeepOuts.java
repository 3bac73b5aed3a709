package dev.sequencer.slew;

import java.util.ArrayList;
import java.util.List;

/**
 * The cones slews keep out of (spec A3) for one scenario: {@code always} apply to every slew (the Sun);
 * {@code skyOnly} apply to slews between two sky pointings only (the Earth limb from orbit: a slew to or
 * from an Earth point looks at the Earth by design). {@code sky[k]} tells whether request k is a sky
 * pointing, {@code startSky} whether the start pointing is. [{@code fromS}, {@code toS}] is the span of
 * instants slews can happen in (the horizon with its margins), used to bound still-looking cones such as
 * the Sun over the whole plan.
 */
public record KeepOuts(List<KeepOut> always, List<KeepOut> skyOnly, boolean[] sky, boolean startSky, double fromS,
    double toS) {
  /** No keep-outs during slews. */
  public static final KeepOuts NONE = new KeepOuts(List.of(), List.of(), new boolean[0], false, 0, 0);

  /** Cones whose drift is below this are treated as still over the span (the Sun: 1.2e-5 deg/s), deg/s. */
  static final double QUASI_STILL_DEG_PER_S = 1e-4;

  public KeepOuts {
    always = List.copyOf(always);
    skyOnly = List.copyOf(skyOnly);
    sky = sky.clone();
  }

  /** True when no cone applies to any slew. */
  public boolean none() {
    return always.isEmpty() && skyOnly.isEmpty();
  }

  /** The cones of the slew from {@code from} ({@link Transitions#START} for the start pointing) to {@code to}. */
  List<KeepOut> between(int from, int to) {
    boolean fromSky = from == Transitions.START ? startSky : sky[from];
    if (skyOnly.isEmpty() || !fromSky || !sky[to]) {
      return always;
    }
    List<KeepOut> out = new ArrayList<>(always);
    out.addAll(skyOnly);
    return out;
  }

  /** True when every cone is quasi-still (see {@link #QUASI_STILL_DEG_PER_S}). */
  boolean quasiStill() {
    return always.stream().allMatch(c -> c.maxDriftDegPerS() < QUASI_STILL_DEG_PER_S)
        && skyOnly.stream().allMatch(c -> c.maxDriftDegPerS() < QUASI_STILL_DEG_PER_S);
  }
}
