package dev.sequencer.cli;

import dev.sequencer.sequence.ProgressListener;
import java.io.PrintWriter;
import java.util.Locale;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;

/**
 * Planner progress for the terminal: elapsed seconds, plans found by all producers, the incumbent's priority
 * (the plan that would be returned now) and the proven bound, in the user's units.
 *
 * <p>Interactive (a console): one status line redrawn in place with a carriage return, refreshed every
 * second so the elapsed time moves between solutions, and ended with a newline by {@link #close()}.
 * Redirected: one plain line per new solution, nothing else, so logs stay readable. Thread-safe: the
 * solver reports from its own threads.
 */
final class Progress implements ProgressListener, AutoCloseable {
  private final PrintWriter out;
  private final boolean interactive;
  private final long startNanos = System.nanoTime();
  private ScheduledExecutorService ticker;
  private int solutions;
  private double priority = Double.NaN;
  private double bound = Double.NaN;
  private int drawnWidth;

  private Progress(PrintWriter out, boolean interactive) {
    this.out = out;
    this.interactive = interactive;
  }

  /** Progress to {@code out}, redrawn in place when {@code interactive}; {@link #start()} begins the refresh. */
  static Progress to(PrintWriter out, boolean interactive) {
    return new Progress(out, interactive);
  }

  /** True when standard output is a terminal (no redirect). */
  static boolean consoleAttached() {
    return System.console() != null;
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
