package dev.sequencer.sequence;

/**
 * Receives a report each time the planner's incumbent improves: the plan that would be returned if the
 * run stopped now. Called from solver threads.
 */
@FunctionalInterface
public interface ProgressListener {
  /**
   * A new incumbent: plans found so far by all producers, its total priority (user units), its total
   * exact slew seconds (the same total the final timeline reports), the proven upper bound on priority
   * known at that moment ({@code Double.NaN} when none) and seconds since the run's clock started.
   */
  void onProgress(int solutions, double priority, double transitionS, double boundPriority, double elapsedS);
}
