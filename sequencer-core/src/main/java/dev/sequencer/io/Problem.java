package dev.sequencer.io;

import java.util.Objects;

/**
 * One thing wrong with an input file: where ({@code path}, e.g. {@code requests[3] (id "R4").durationS};
 * empty for the whole document), what ({@code message}, which repeats the offending value) and the
 * offending value as written in the file ({@code null} when the field is missing).
 */
public record Problem(String path, String message, String value) {
  public Problem {
    Objects.requireNonNull(path, "path");
    Objects.requireNonNull(message, "message");
  }

  /** {@code path: message}, or the message alone for the whole document. */
  @Override
  public String toString() {
    return path.isEmpty() ? message : path + ": " + message;
  }
}
