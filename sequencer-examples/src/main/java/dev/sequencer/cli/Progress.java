package dev.sequencer.cli;

import dev.sequencer.sequence.ProgressListener;
import java.io.Console;
import java.io.PrintWriter;
import java.lang.reflect.Method;
import java.util.Locale;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.function.Predicate;

/**
 * Planner progress for the terminal: elapsed seconds, plans found by all producers, the incumbent's priority
 * (the plan that would be returned now) and the proven bound, in the user's units.
 *
 * <p>Interactive (a console): one status line redrawn in place with a carriage return, refreshed every
 * second so the elapsed time moves between solutions, and ended with a newline by {@link #close()}.
 * Redirected: one plain line per new solution, nothing else, so logs stay readable. Under
 * {@code --quiet}: nothing. Thread-safe: the solver reports from its own threads.
 */
final class Progress implements ProgressListener, AutoCloseable {
  /** {@code Console.isTerminal()} (JDK 22 and later), or null on JDK 17 to 21. */
  private static final Method IS_TERMINAL = isTerminalMethod();

  private final PrintWriter out;
  private final boolean interactive;
  private final boolean silent;
  private final long startNanos = System.nanoTime();
  private ScheduledExecutorService ticker;
  private int solutions;
  private double priority = Double.NaN;
  private double bound = Double.NaN;
  private int drawnWidth;

  private Progress(PrintWriter out, boolean interactive, boolean silent) {
    this.out = out;
    this.interactive = interactive && !silent;
    this.silent = silent;
  }

  /**
   * Progress to {@code out}, redrawn in place when {@code interactive}; {@link #start()} begins the
   * refresh. Nothing at all is written to the held-back output of {@code --quiet}.
   */
  static Progress to(PrintWriter out, boolean interactive) {
    return new Progress(out, interactive, out instanceof QuietOutput);
  }

  /**
   * True when standard input and output are a terminal (no redirect). Up to JDK 21
   * {@code System.console()} is null unless both are; from JDK 22 on it may return a console even when
   * output is redirected, and {@code Console.isTerminal()} (new in JDK 22, called reflectively so the code
   * still compiles for 17) tells.
   */
  static boolean consoleAttached() {
    Console console = System.console();
    return isTerminal(console, IS_TERMINAL == null ? null : c -> {
      try {
        return (Boolean) IS_TERMINAL.invoke(c);
      } catch (ReflectiveOperationException | RuntimeException e) {
        return false; // when in doubt, plain lines: they read well on a terminal too
      }
    });
  }

  /**
   * The decision of {@link #consoleAttached()}: no console, no terminal; a console and no way to ask
   * (JDK 17 to 21, {@code isTerminal} null), a terminal; else what {@code isTerminal} says.
   */
  static <C> boolean isTerminal(C console, Predicate<C> isTerminal) {
    if (console == null) {
      return false;
    }
    return isTerminal == null || isTerminal.test(console);
  }

  private static Method isTerminalMethod() {
    try {
      return Console.class.getMethod("isTerminal");
    } catch (NoSuchMethodException e) {
      return null;
    }
  }

  /** Starts the one-second refresh of the in-place line (interactive only). */
  synchronized Progress start() {
    if (interactive && ticker == null) {
      ticker = Executors.newSingleThreadScheduledExecutor(r -> {
        Thread t = new Thread(r, "sequencer-progress");
        t.setDaemon(true);
        return t;
      });
      ticker.scheduleAtFixedRate(this::redraw, 1, 1, TimeUnit.SECONDS);
    }
    return this;
  }

  @Override
  public synchronized void onProgress(int solutionCount, double bestPriority, double transitionS,
      double boundPriority, double elapsedS) {
    solutions = solutionCount;
    priority = bestPriority;
    if (!Double.isNaN(boundPriority)) {
      bound = boundPriority;
    }
    if (silent) {
      return;
    }
    if (interactive) {
      redraw();
    } else {
      out.printf(Locale.ROOT, "  %6.1f s  plan %d: priority %.1f, exact slew %.0f s, bound %s%n", elapsedS,
          solutionCount, bestPriority, transitionS, format(boundPriority));
      out.flush();
    }
  }

  private synchronized void redraw() {
    double elapsedS = (System.nanoTime() - startNanos) * 1e-9;
    String line = String.format(Locale.ROOT, "  planning %6.1f s | %d plan%s found | best priority %s | bound %s",
        elapsedS, solutions, solutions == 1 ? "" : "s", format(priority), format(bound));
    // Pad with spaces so a shorter line fully covers the previous one.
    out.print("\r" + line + " ".repeat(Math.max(0, drawnWidth - line.length())));
    out.flush();
    drawnWidth = line.length();
  }

  private static String format(double v) {
    return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%.1f", v);
  }

  /** Stops the refresh and, on a terminal, draws the final state and ends the line. */
  @Override
  public void close() {
    ScheduledExecutorService t;
    synchronized (this) {
      t = ticker;
      ticker = null;
    }
    if (t != null) {
      t.shutdownNow();
      try {
        t.awaitTermination(2, TimeUnit.SECONDS);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
    }
    synchronized (this) {
      if (interactive && drawnWidth > 0) {
        redraw();
        out.println();
        out.flush();
      }
    }
  }
}
