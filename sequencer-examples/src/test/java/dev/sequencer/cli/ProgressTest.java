package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;

/** Progress output: plain lines when redirected, one line redrawn in place on a terminal. */
class ProgressTest {
  @Test
  void redirectedOutputGetsOnePlainLinePerSolution() {
    StringWriter s = new StringWriter();
    try (Progress p = Progress.to(new PrintWriter(s), false).start()) {
      p.onProgress(1, 10, 100, Double.NaN, 0.5);
      p.onProgress(2, 12, 90, 20, 1.5);
    }
    String out = s.toString();
    assertFalse(out.contains("\r"), out);
    String[] lines = out.split("\n");
    assertEquals(2, lines.length, out);
    assertTrue(lines[0].contains("plan 1: priority 10.0") && lines[0].contains("bound -"), lines[0]);
    assertTrue(lines[1].contains("plan 2: priority 12.0") && lines[1].contains("bound 20.0"), lines[1]);
  }

  @Test
  void terminalOutputRedrawsOneLineAndEndsIt() {
    StringWriter s = new StringWriter();
    try (Progress p = Progress.to(new PrintWriter(s), true).start()) {
      p.onProgress(1, 10, 100, 30, 0.5);
      p.onProgress(2, 12, 90, Double.NaN, 1.5); // a later report without a bound keeps the known one
    }
    String out = s.toString();
    assertTrue(out.startsWith("\r"), out);
    assertTrue(out.endsWith("\n"), out);
    assertEquals(1, out.chars().filter(c -> c == '\n').count(), out);
    String last = out.substring(out.lastIndexOf('\r') + 1).trim();
    assertTrue(last.contains("2 plans found") && last.contains("best priority 12.0") && last.contains("bound 30.0"), last);
  }

  @Test
  void aConsoleIsATerminalOnlyWhenItSaysSo() {
    // JDK 17 to 21: System.console() is null unless input and output are a terminal; no isTerminal().
    assertFalse(Progress.isTerminal(null, null));
    assertTrue(Progress.isTerminal(new Object(), null));
    // JDK 22 and later: a console may exist with output redirected; isTerminal() decides.
    assertFalse(Progress.isTerminal(new Object(), c -> false));
    assertTrue(Progress.isTerminal(new Object(), c -> true));
    assertFalse(Progress.isTerminal(null, c -> true));
  }

  @Test
  void quietOutputGetsNoProgress() {
    QuietOutput q = new QuietOutput();
    try (Progress p = Progress.to(q, true).start()) {
      p.onProgress(1, 10, 100, Double.NaN, 0.5);
    }
    StringWriter err = new StringWriter();
    q.finish(1, new PrintWriter(err));
    assertEquals("", err.toString());
  }
}
