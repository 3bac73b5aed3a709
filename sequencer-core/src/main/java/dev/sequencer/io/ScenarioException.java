package dev.sequencer.io;

import java.util.List;

/**
 * Bad input in a scenario, windows or timeline file: every problem found, in file order.
 * {@link #path()} and {@link #value()} are those of the first problem; {@link #getMessage()} lists one
 * problem per line.
 */
public final class ScenarioException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  private final String source;
  private final List<Problem> problems;

  /** {@code source} names the input (a file name, or e.g. "scenario") for the message's first line. */
  public ScenarioException(String source, List<Problem> problems) {
    super(format(source, problems));
    if (problems.isEmpty()) {
      throw new IllegalArgumentException("a ScenarioException needs at least one problem");
    }
    this.source = source;
    this.problems = List.copyOf(problems);
  }

  /** The name of the input the problems were found in. */
  public String source() {
    return source;
  }

  /** Every problem found, in the order the reader met them; never empty. */
  public List<Problem> problems() {
    return problems;
  }

  /** Path of the first problem. */
  public String path() {
    return problems.get(0).path();
  }

  /** Offending value of the first problem, or {@code null} when a field is missing. */
  public String value() {
    return problems.get(0).value();
  }

  private static String format(String source, List<Problem> problems) {
    StringBuilder sb = new StringBuilder();
    sb.append(source).append(": ").append(problems.size()).append(problems.size() == 1 ? " problem" : " problems");
    for (Problem p : problems) {
      sb.append('\n').append(p);
    }
    return sb.toString();
  }
}
