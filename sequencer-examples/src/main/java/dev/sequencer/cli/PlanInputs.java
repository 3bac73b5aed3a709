package dev.sequencer.cli;

import dev.sequencer.io.Problem;
import dev.sequencer.io.ScenarioException;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.sequence.PlanningProblem;
import java.util.ArrayList;
import java.util.List;

/**
 * Valid scenario parts the planner cannot take yet, reported like bad input (exit code 2, with the
 * JSON path) before planning starts: durations (and flexible minimum exposures and steps) that are not
 * whole seconds and priorities or values above {@link #MAX_PRIORITY}.
 */
final class PlanInputs {
  /** Largest priority the planner takes (see {@link PlanningProblem#MAX_PRIORITY}). */
  static final double MAX_PRIORITY = PlanningProblem.MAX_PRIORITY;

  private PlanInputs() {}

  /** Throws a {@link ScenarioException} naming every request the planner cannot take. */
  static void check(Scenario s, String source) {
    List<Problem> problems = new ArrayList<>();
    for (int i = 0; i < s.requests().size(); i++) {
      Request r = s.requests().get(i);
      String path = "requests[" + i + "] (id \"" + r.id() + "\")";
      if (r.isFlexible()) {
        checkFlexible(r, path, problems);
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

  /** Flexible exposure: whole-second minimum and step, values the integer objective can hold. */
  private static void checkFlexible(Request r, String path, List<Problem> problems) {
    var f = r.flexible();
    if (f.minDurationS() != Math.rint(f.minDurationS())) {
      problems.add(new Problem(path + ".minDurationS", "the planner needs a whole number of seconds (was "
          + f.minDurationS() + ")", Double.toString(f.minDurationS())));
    }
    if (f.durationStepS() != Math.rint(f.durationStepS())) {
      problems.add(new Problem(path + ".durationStepS", "the planner needs a whole number of seconds (was "
          + f.durationStepS() + ")", Double.toString(f.durationStepS())));
    }
    for (int q = 0; q < f.utility().size(); q++) {
      double v = f.utility().get(q).value();
      if (v > MAX_PRIORITY) {
        problems.add(new Problem(path + ".utility[" + q + "][1]", "the planner takes values up to 1e9 (was " + v
            + ")", Double.toString(v)));
      }
    }
  }
}
