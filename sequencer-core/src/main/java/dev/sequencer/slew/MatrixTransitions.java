package dev.sequencer.slew;

/** A user-supplied transition table by request order, with a row from the start pointing. */
final class MatrixTransitions implements Transitions {
  private final double[][] seconds;
  private final double[] fromStart;

  MatrixTransitions(double[][] seconds, double[] fromStartSeconds) {
    int n = seconds.length;
    this.seconds = new double[n][];
    for (int i = 0; i < n; i++) {
      if (seconds[i].length != n) {
        throw new IllegalArgumentException(
            "seconds[" + i + "]: " + seconds[i].length + " columns, but the table has " + n + " rows");
      }
      for (int j = 0; j < n; j++) {
        checkEntry("seconds[" + i + "][" + j + "]", seconds[i][j]);
      }
      this.seconds[i] = seconds[i].clone();
    }
    if (fromStartSeconds == null) {
      this.fromStart = new double[n];
    } else {
      if (fromStartSeconds.length != n) {
        throw new IllegalArgumentException(
            "fromStartSeconds: " + fromStartSeconds.length + " entries, but the table has " + n + " rows");
      }
      for (int j = 0; j < n; j++) {
        checkEntry("fromStartSeconds[" + j + "]", fromStartSeconds[j]);
      }
      this.fromStart = fromStartSeconds.clone();
    }
  }

  private static void checkEntry(String path, double v) {
    if (!(v >= 0) || Double.isInfinite(v)) {
      throw new IllegalArgumentException(path + ": must be a finite number >= 0 (was " + v + ")");
    }
  }

  @Override
  public int size() {
    return seconds.length;
  }

  @Override
  public double boundS(int from, int to, double departureMinS, double departureMaxS, double arrivalMinS,
      double arrivalMaxS) {
    return from == START ? fromStart[to] : seconds[from][to];
  }

  @Override
  public double[] exactS(int[] order, double[] departureS, double[] arrivalS) {
    Intervals.checkSequence(order, departureS, arrivalS, seconds.length);
    return Paths.along(path(), order, departureS, arrivalS);
  }

  @Override
  public Path path() {
    return StatelessPath.start((from, to, departure, arrival) -> from == START ? fromStart[to] : seconds[from][to]);
  }

  @Override
  public boolean timeDependent() {
    return false;
  }
}
