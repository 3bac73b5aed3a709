package dev.sequencer.sequence.search;

import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.sequence.timing.ExactTimer;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.function.ToLongFunction;
import java.util.stream.IntStream;

/**
 * Three classic constructions for time windows, tried when greedy misses required requests (tight windows,
 * as in routing benchmarks with every request required): every schedulable request in the order of its
 * latest start, of its window midpoint, and of its earliest start, each timed exactly
 * ({@link ExactTimer#schedule}, what does not fit is left out); the must-be-last request goes last.
 */
public final class DeadlineOrders {
  private DeadlineOrders() {}

  /** The three plans, in the order above. */
  public static List<Plan> plans(PlanningProblem problem, ExactTimer timer) {
    List<ToLongFunction<Task>> keys = List.of(
        Task::latestStartS, t -> t.earliestStartS() + t.latestStartS(), Task::earliestStartS);
    List<Plan> out = new ArrayList<>();
    for (ToLongFunction<Task> key : keys) {
      int[] order = IntStream.range(0, problem.size())
          .filter(k -> problem.task(k).schedulable() && k != problem.mustBeLastIndex())
          .boxed()
          .sorted(Comparator.comparingLong((Integer k) -> key.applyAsLong(problem.task(k))).thenComparingInt(k -> k))
          .mapToInt(Integer::intValue).toArray();
      if (problem.mustBeLastIndex() >= 0 && problem.task(problem.mustBeLastIndex()).schedulable()) {
        order = IntStream.concat(java.util.Arrays.stream(order), IntStream.of(problem.mustBeLastIndex())).toArray();
      }
      long[] durs = java.util.Arrays.stream(order).mapToLong(k -> problem.task(k).durationS()).toArray();
      out.add(timer.schedule(order, durs).plan());
    }
    return out;
  }
}
