package dev.sequencer.model;

import java.util.List;
import java.util.Objects;

/**
 * The time to change the instrument's configuration between two observations (format addition A5): one
 * constant for any two different labels ({@code labels} empty), or a table indexed by {@code labels}.
 * Equal labels take 0. {@code concurrentWithSlew}: the transition is max(slew, change), otherwise slew +
 * change.
 */
public record Reconfiguration(List<String> labels, double constantS, double[][] seconds, boolean concurrentWithSlew) {
  public Reconfiguration {
    labels = List.copyOf(labels);
    Checks.finite("reconfiguration.seconds", constantS);
    if (!labels.isEmpty()) {
      Objects.requireNonNull(seconds, "seconds");
      if (seconds.length != labels.size()) {
        throw new IllegalArgumentException("reconfiguration.seconds: " + seconds.length + " rows for "
            + labels.size() + " labels");
      }
      double[][] copy = new double[seconds.length][];
      for (int i = 0; i < seconds.length; i++) {
        copy[i] = seconds[i].clone();
      }
      seconds = copy;
    }
  }

  /** The same change time between any two different labels. */
  public static Reconfiguration constant(double seconds, boolean concurrentWithSlew) {
    return new Reconfiguration(List.of(), seconds, null, concurrentWithSlew);
  }

  /** No configuration changes take time. */
  public static final Reconfiguration NONE = constant(0, true);

  /** Seconds to change from {@code from} to {@code to}; 0 for equal labels; throws for a label the table lacks. */
  public double changeS(String from, String to) {
    if (from.equals(to)) {
      return 0;
    }
    if (labels.isEmpty()) {
      return constantS;
    }
    int i = labels.indexOf(from);
    int j = labels.indexOf(to);
    if (i < 0 || j < 0) {
      throw new IllegalArgumentException("reconfiguration: no label \"" + (i < 0 ? from : to) + "\" in " + labels);
    }
    return seconds[i][j];
  }

  /** The whole transition for a slew of {@code slewS} and a change of {@code changeS}. */
  public double combine(double slewS, double changeS) {
    return concurrentWithSlew ? Math.max(slewS, changeS) : slewS + changeS;
  }

  /** The table row by row (a copy), or null for a constant. */
  public double[][] table() {
    if (seconds == null) {
      return null;
    }
    double[][] copy = new double[seconds.length][];
    for (int i = 0; i < seconds.length; i++) {
      copy[i] = seconds[i].clone();
    }
    return copy;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Reconfiguration r && labels.equals(r.labels) && constantS == r.constantS
        && java.util.Arrays.deepEquals(seconds, r.seconds) && concurrentWithSlew == r.concurrentWithSlew;
  }

  @Override
  public int hashCode() {
    return Objects.hash(labels, constantS, java.util.Arrays.deepHashCode(seconds), concurrentWithSlew);
  }
}
