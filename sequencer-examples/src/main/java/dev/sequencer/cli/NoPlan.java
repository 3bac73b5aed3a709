package dev.sequencer.cli;

import dev.sequencer.sequence.RequiredConflicts;
import dev.sequencer.sequence.SequencerResult;
import java.io.PrintWriter;

/**
 * What {@code plan} prints and returns when there is no plan: INFEASIBLE lists the conflicting required
 * requests and why, NO_SOLUTION_IN_TIME says so; both exit with {@link #EXIT_NO_PLAN}.
 */
final class NoPlan {
  /** Exit code of {@code plan} when the input is well-formed but no plan came out. */
  static final int EXIT_NO_PLAN = 1;

  private NoPlan() {}

  /** Prints the reason when {@code result} has no plan; returns the exit code (0 with a plan). */
  static int report(SequencerResult result, PrintWriter out) {
    if (result.hasPlan()) {
      return 0;
    }
    out.println("no plan (" + result.status() + "): " + result.message());
    for (RequiredConflicts.Conflict c : result.conflicts()) {
      out.println("  conflict: " + c);
    }
    return EXIT_NO_PLAN;
  }
}
