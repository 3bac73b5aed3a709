package dev.sequencer.cli;

import dev.sequencer.io.Problem;
import dev.sequencer.io.ScenarioException;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import java.util.ArrayList;
import java.util.List;

/**
 * Valid scenario parts the planner cannot take yet, reported like bad input (exit code 2, with the
 * JSON path) before planning starts: flexible exposures, durations that are not whole seconds and
 * priorities above {@link #MAX_PRIORITY}.
 */
final class PlanInputs {
  /**
   * Largest priority the planner takes: CP-SAT needs integer priorities (scaled by up to 1000), and their
   * sum over 10,000 requests must stay far below 2^63 (1e9 x 1000 x 1e4 = 1e16).
   */
  static final double MAX_PRIORITY = 1e9;

  private PlanInputs() {}

  /** Throws a {@link ScenarioException} naming every request the planner cannot take. */
  static void check(Scenario s, String source) {
    List<Problem> problems = new ArrayList<>();
    for (int i = 0; i < s.requests().size(); i++) {
      Request r = s.requests().get(i);
      String path = "requests[" + i + "] (id \"" + r.id() + "\")";
      if (r.isFlexible()) {
        problems.add(new Problem(path, "flexible exposure (minDurationS/maxDurationS/utility) is not supported "
            + "by the planner yet; give durationS and priority instead", null));
      } else if (r.priority() > MAX_PRIORITY) {
        problems.add(new Problem(path + ".priority", "the planner takes priorities up to 1e9 (was " + r.priority()
            + ")", Double.toString(r.priority())));
      } else if (r.durationS() != Math.rint(r.durationS())) {
        problems.add(new Problem(path + ".durationS", "the planner needs a whole number of seconds (was "
            + r.durationS() + ")", Double.toString(r.durationS())));
      }
    }
    if (!problems.isEmpty()) {
      throw new ScenarioException(source, problems);
    }
  }
}
