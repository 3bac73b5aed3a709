package dev.sequencer.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

/**
 * Standard output under {@code --quiet}: held back while the command runs. At the end, on success only
 * the warnings are printed, to standard error; on any other exit code everything the command printed
 * goes to standard error, so the reason for the exit (no plan, the violations) is never lost. Progress
 * writes nothing here (see {@link Progress#to}).
 */
final class QuietOutput extends PrintWriter {
  private final StringWriter held;

  private QuietOutput(StringWriter held) {
    super(held);
    this.held = held;
  }

  QuietOutput() {
    this(new StringWriter());
  }

  /** Prints what must not be lost to {@code err}, as described above. */
  void finish(int exitCode, PrintWriter err) {
    flush();
    for (String line : held.toString().split("\n", -1)) {
      if (line.isEmpty()) {
        continue;
      }
      if (exitCode != 0 || line.startsWith("warning")) {
        err.println(line);
      }
    }
    err.flush();
  }
}
