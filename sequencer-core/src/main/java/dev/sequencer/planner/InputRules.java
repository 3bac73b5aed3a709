package dev.sequencer.planner;

import dev.sequencer.io.Problem;
import dev.sequencer.io.ScenarioException;
import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.sequence.problem.Task;
import java.util.ArrayList;
import java.util.List;

/**
 * The rules a scenario must meet to be planned, beyond the file format's: whole-second durations (and
 * flexible minimum exposures and steps), priorities and values the integer objective can hold (at most
 * {@link Task#MAX_PRIORITY}). One owner: the
 * planner, {@code inspect} and {@code replan} all apply these, so "valid" means the same everywhere.
 * Every problem is reported at once, with its JSON path, as a {@link ScenarioException}.
 */
public final class InputRules {
  private InputRules() {}

  /** Throws naming every request the planner cannot take; {@code source} names the input in the message. */
  public static void check(Scenario s, String source) {
    List<Problem> problems = problems(s);
    if (!problems.isEmpty()) {
      throw new ScenarioException(source, problems);
    }
  }

  /** Every rule broken by {@code s}, in file order (empty when it can be planned). */
  public static List<Problem> problems(Scenario s) {
    List<Problem> problems = new ArrayList<>();
    for (int i = 0; i < s.requests().size(); i++) {
      Request r = s.requests().get(i);
      String path = "requests[" + i + "] (id \"" + r.id() + "\")";
      if (r.isFlexible()) {
        checkFlexible(r.flexible(), path, problems);
        continue;
      }
      if (r.priority() > Task.MAX_PRIORITY) {
        problems.add(new Problem(path + ".priority", "the planner takes priorities up to 1e9 (was " + r.priority()
            + ")", Double.toString(r.priority())));
      }
      if (r.durationS() != Math.rint(r.durationS())) {
        problems.add(new Problem(path + ".durationS", "the planner needs a whole number of seconds (was "
            + r.durationS() + ")", Double.toString(r.durationS())));
      }
    }
    return problems;
  }

  /** Flexible exposure: whole-second minimum and step, values the integer objective can hold. */
  private static void checkFlexible(FlexibleExposure f, String path, List<Problem> problems) {
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
      if (v > Task.MAX_PRIORITY) {
        problems.add(new Problem(path + ".utility[" + q + "][1]", "the planner takes values up to 1e9 (was " + v
            + ")", Double.toString(v)));
      }
    }
  }
}
