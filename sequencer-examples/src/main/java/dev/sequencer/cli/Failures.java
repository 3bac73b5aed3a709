package dev.sequencer.cli;

import dev.sequencer.io.Problem;
import dev.sequencer.io.ScenarioException;
import dev.sequencer.sequence.cpsat.NativeSolver;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.NoSuchFileException;
import picocli.CommandLine;
import picocli.CommandLine.IExecutionExceptionHandler;
import picocli.CommandLine.ParseResult;

/**
 * Turns exceptions into messages and exit codes: bad input prints every problem, one a line, and exits
 * 2; anything else is our bug and exits 3 with a one-line message (the stack trace only with
 * {@code SEQUENCER_DEBUG=1}). Never a bare stack trace for bad input.
 */
final class Failures implements IExecutionExceptionHandler {
  @Override
  public int handleExecutionException(Exception ex, CommandLine cl, ParseResult parsed) {
    PrintWriter err = cl.getErr();
    Throwable t = ex;
    if (t instanceof UncheckedIOException u && u.getCause() != null) {
      if (u.getMessage() != null && u.getMessage().startsWith("cannot write ")) {
        err.println(u.getMessage() + ": " + Outputs.why(u.getCause()));
        return SequencerCli.EXIT_INVALID_INPUT;
      }
      t = u.getCause();
    }
    if (t instanceof ScenarioException se) {
      for (Problem p : se.problems()) {
        err.println(p);
      }
      err.println(se.problems().size() + " problem(s) in " + se.source());
      return SequencerCli.EXIT_INVALID_INPUT;
    }
    if (t instanceof NoSuchFileException nf) {
      err.println(nf.getFile() + ": no such file");
      return SequencerCli.EXIT_INVALID_INPUT;
    }
    if (t instanceof java.io.IOException io) {
      err.println("cannot read or write a file: " + io.getMessage());
      return SequencerCli.EXIT_INVALID_INPUT;
    }
    if (t instanceof InputException ie) {
      err.println(ie.getMessage());
      return SequencerCli.EXIT_INVALID_INPUT;
    }
    if (t instanceof NativeSolver.Unavailable nu) {
      err.println(nu.getMessage());
      return SequencerCli.EXIT_INTERNAL;
    }
    err.println("internal error (please report it): " + t);
    if ("1".equals(System.getenv("SEQUENCER_DEBUG"))) {
      t.printStackTrace(err);
    }
    return SequencerCli.EXIT_INTERNAL;
  }
}
