package dev.sequencer.slew;

/**
 * The {@link Transitions.Path} of a model whose legs depend only on the two requests and the two instants
 * (fixed, matrix, eigenaxis): the state is the last request.
 */
record StatelessPath(Leg leg, int last) implements Transitions.Path {
  /** One exact leg from {@code from} (or {@link Transitions#START}) departing at {@code departureS} to {@code to} arriving at {@code arrivalS}. */
  @FunctionalInterface
  interface Leg {
    double seconds(int from, int to, double departureS, double arrivalS);
  }

  static Transitions.Path start(Leg leg) {
    return new StatelessPath(leg, Transitions.START);
  }

  @Override
  public double legS(int to, double departureS, double arrivalS) {
    return leg.seconds(last, to, departureS, arrivalS);
  }

  @Override
  public Transitions.Path then(int to, double departureS, double arrivalS) {
    return new StatelessPath(leg, to);
  }

  /** The last request: every later leg depends on it alone. */
  @Override
  public Object state() {
    return last;
  }
}
