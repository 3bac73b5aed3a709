package dev.sequencer.slew;

import dev.sequencer.model.Reconfiguration;
import java.util.List;

/**
 * Transitions with the instrument's configuration changes folded in (format addition A5): between two
 * requests with different configuration labels the change takes {@link Reconfiguration#changeS}, and the
 * transition is max(slew, change) when the change runs during the slew, slew + change otherwise; from
 * the start pointing the change is from the start configuration. Both combinations are monotone in the
 * slew, so an upper bound of the slew gives an upper bound of the transition and every property of the
 * slew model's bounds carries over. The slew itself (path, departure, waypoints) is the slew model's.
 */
public final class Reconfigured implements Transitions {
  private final Transitions slews;
  private final Reconfiguration change;
  private final String[] labels;
  private final String start;

  private Reconfigured(Transitions slews, Reconfiguration change, List<String> labels, String start) {
    this.slews = slews;
    this.change = change;
    this.labels = labels.toArray(new String[0]);
    this.start = start;
    if (labels.size() != slews.size()) {
      throw new IllegalArgumentException("configurations: " + labels.size() + " labels for " + slews.size()
          + " requests");
    }
  }

  /**
   * {@code slews} with the change times of {@code change} between requests labelled {@code labels} (file
   * order), starting in {@code start}; {@code slews} itself when no label differs from the start.
   */
  public static Transitions of(Transitions slews, Reconfiguration change, List<String> labels, String start) {
    if (labels.stream().allMatch(start::equals)) {
      return slews;
    }
    return new Reconfigured(slews, change, labels, start);
  }

  /** Seconds to change from the configuration after {@code from} (or the start) to that of {@code to}. */
  public double changeS(int from, int to) {
    return change.changeS(from == START ? start : labels[from], labels[to]);
  }

  @Override
  public int size() {
    return slews.size();
  }

  @Override
  public double boundS(int from, int to, double departureMinS, double departureMaxS, double arrivalMinS,
      double arrivalMaxS) {
    return change.combine(slews.boundS(from, to, departureMinS, departureMaxS, arrivalMinS, arrivalMaxS),
        changeS(from, to));
  }

  @Override
  public double[] exactS(int[] order, double[] departureS, double[] arrivalS) {
    double[] out = slews.exactS(order, departureS, arrivalS);
    int prev = START;
    for (int k = 0; k < order.length; k++) {
      out[k] = change.combine(out[k], changeS(prev, order[k]));
      prev = order[k];
    }
    return out;
  }

  @Override
  public boolean exactMayExceedBound() {
    return slews.exactMayExceedBound();
  }

  @Override
  public boolean timeDependent() {
    return slews.timeDependent();
  }

  @Override
  public Path path() {
    return new ChangePath(slews.path());
  }

  @Override
  public Slew slew(int from, int to, double departureS, double arrivalS) {
    Slew s = slews.slew(from, to, departureS, arrivalS);
    return new Slew(Double.isNaN(s.seconds()) ? s.seconds() : change.combine(s.seconds(), changeS(from, to)),
        s.departureS(), s.via());
  }

  /** A slew path whose legs carry the change time too. */
  private final class ChangePath implements Path {
    private final Path inner;

    ChangePath(Path inner) {
      this.inner = inner;
    }

    @Override
    public int last() {
      return inner.last();
    }

    @Override
    public double legS(int to, double departureS, double arrivalS) {
      return change.combine(inner.legS(to, departureS, arrivalS), changeS(inner.last(), to));
    }

    @Override
    public Path then(int to, double departureS, double arrivalS) {
      return new ChangePath(inner.then(to, departureS, arrivalS));
    }

    @Override
    public Object state() {
      return inner.state();
    }
  }
}
