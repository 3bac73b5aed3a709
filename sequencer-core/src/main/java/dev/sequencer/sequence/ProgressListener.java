package dev.sequencer.sequence;

/** Receives a report each time the sequencer finds a better plan; called from solver threads. */
@FunctionalInterface
public interface ProgressListener {
  /**
   * A new incumbent: solutions found so far, its total priority and total model transition seconds, the
   * proven upper bound on priority known at that moment ({@code Double.NaN} when none) and seconds since
   * {@code plan} was called.
   */
  void onProgress(int solutions, double priority, double transitionS, double boundPriority, double elapsedS);
}
