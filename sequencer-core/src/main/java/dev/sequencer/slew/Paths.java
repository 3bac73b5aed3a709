package dev.sequencer.slew;

/** Whole sequences evaluated leg by leg along a {@link Transitions.Path}. */
final class Paths {
  private Paths() {}

  /** The legs of a whole sequence from {@code start}: the common body of {@link Transitions#exactS}. */
  static double[] along(Transitions.Path start, int[] order, double[] departureS, double[] arrivalS) {
    double[] out = new double[order.length];
    Transitions.Path p = start;
    for (int k = 0; k < order.length; k++) {
      out[k] = p.legS(order[k], departureS[k], arrivalS[k]);
      p = p.then(order[k], departureS[k], arrivalS[k]);
    }
    return out;
  }
}
