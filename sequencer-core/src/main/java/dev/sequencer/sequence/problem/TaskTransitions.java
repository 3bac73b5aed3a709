package dev.sequencer.sequence.problem;

import dev.sequencer.slew.Transitions;

/**
 * Request transitions seen by task: task k observes request {@code requestOf[k]} (several tasks per request
 * when it has visits, format addition A4), so every leg is the request's leg. Bounds, exact legs, paths and
 * slews are the request model's, only re-indexed; a path's state is the request path's state.
 */
final class TaskTransitions implements Transitions {
  private final Transitions requests;
  private final int[] requestOf;

  TaskTransitions(Transitions requests, int[] requestOf) {
    this.requests = requests;
    this.requestOf = requestOf.clone();
  }

  private int map(int k) {
    return k == START ? START : requestOf[k];
  }

  @Override
  public int size() {
    return requestOf.length;
  }

  @Override
  public double boundS(int from, int to, double departureMinS, double departureMaxS, double arrivalMinS,
      double arrivalMaxS) {
    return requests.boundS(map(from), map(to), departureMinS, departureMaxS, arrivalMinS, arrivalMaxS);
  }

  @Override
  public double[] exactS(int[] order, double[] departureS, double[] arrivalS) {
    int[] mapped = new int[order.length];
    for (int q = 0; q < order.length; q++) {
      mapped[q] = requestOf[order[q]];
    }
    return requests.exactS(mapped, departureS, arrivalS);
  }

  @Override
  public boolean exactMayExceedBound() {
    return requests.exactMayExceedBound();
  }

  @Override
  public boolean timeDependent() {
    return requests.timeDependent();
  }

  @Override
  public Path path() {
    return new TaskPath(requests.path(), START);
  }

  @Override
  public Slew slew(int from, int to, double departureS, double arrivalS) {
    return requests.slew(map(from), map(to), departureS, arrivalS);
  }

  /** A request path that remembers the last task. */
  private final class TaskPath implements Path {
    private final Path inner;
    private final int lastTask;

    TaskPath(Path inner, int lastTask) {
      this.inner = inner;
      this.lastTask = lastTask;
    }

    @Override
    public int last() {
      return lastTask;
    }

    @Override
    public double legS(int to, double departureS, double arrivalS) {
      return inner.legS(requestOf[to], departureS, arrivalS);
    }

    @Override
    public Path then(int to, double departureS, double arrivalS) {
      return new TaskPath(inner.then(requestOf[to], departureS, arrivalS), to);
    }

    @Override
    public Object state() {
      return inner.state();
    }
  }
}
