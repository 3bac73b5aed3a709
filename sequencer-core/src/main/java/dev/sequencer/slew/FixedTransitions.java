package dev.sequencer.slew;


/** A constant overhead between any two requests and from the start pointing. */
final class FixedTransitions implements Transitions {
  private final int size;
  private final double seconds;

  FixedTransitions(int size, double seconds) {
    if (size < 0) {
      throw new IllegalArgumentException("size: must be >= 0 (was " + size + ")");
    }
    if (!(seconds >= 0) || Double.isInfinite(seconds)) {
      throw new IllegalArgumentException("seconds: must be a finite number >= 0 (was " + seconds + ")");
    }
    this.size = size;
    this.seconds = seconds;
  }

  @Override
  public int size() {
    return size;
  }

  @Override
  public double boundS(int from, int to, double departureMinS, double departureMaxS, double arrivalMinS,
      double arrivalMaxS) {
    return seconds;
  }

  @Override
  public double[] exactS(int[] order, double[] departureS, double[] arrivalS) {
    Intervals.checkSequence(order, departureS, arrivalS, size);
    return Paths.along(path(), order, departureS, arrivalS);
  }

  @Override
  public Path path() {
    return StatelessPath.start((from, to, departure, arrival) -> seconds);
  }

  @Override
  public boolean timeDependent() {
    return false;
  }
}
