package dev.sequencer.cli;

/** Bad command-line input found by a command itself (exit code 2). */
final class InputException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  InputException(String message) {
    super(message);
  }
}
