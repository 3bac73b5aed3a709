package dev.sequencer.sequence.problem;

/** The reasons the planner gives for an unscheduled request (the timeline's {@code unscheduled[].reason}). */
public final class Reasons {
  /** A request without any visibility window. */
  public static final String NEVER_VISIBLE = "never visible";
  /** A request whose windows are all too short (after inward rounding to whole seconds). */
  public static final String WINDOWS_TOO_SHORT = "windows shorter than its duration";
  /** Prefix of the reason of a schedulable request the plan leaves out; the rest names what took its time. */
  public static final String LOST_TO_CONFLICTS = "lost to conflicts";
  /**
   * A request no exact slew from the start pointing reaches inside its windows (the slew's time, or the
   * keep-outs during slews), given only when the plan is empty, so nothing else could lead to it.
   */
  public static final String UNREACHABLE_FROM_START = "no slew from the start pointing reaches it inside its "
      + "windows (slew time, or the keep-outs during slews)";
  /** A schedulable request exact repair did not get to before the time limit. */
  public static final String NOT_RECHECKED = "not scheduled: the time limit ended before it was re-checked with the exact slews";
  /** A request that fits the plan but would add nothing to its score (a value of 0 there). */
  public static final String NO_GAIN = "not scheduled: observing it would collect no more priority";
  /** A request left out because the planning run had no plan to put it in. */
  public static final String NO_PLAN = "not planned: no plan holds every required request";
  /** Requests of an infeasible run. */
  public static final String INFEASIBLE = "not planned: the required requests are infeasible";

  private Reasons() {}

  /**
   * {@code reason} for task k with what the rules between tasks add (A4, A5): for a member of an ordered
   * group whose every start lies before the earliest end of the previous member, "group G incomplete: X has
   * no window after Y"; for a member of an all-or-nothing group, the group's name and which members the
   * plan lacks.
   */
  public static String withRules(PlanningProblem p, int k, Plan plan, String reason) {
    Structure st = p.structure();
    Structure.GroupRule g = st.groupOf(k);
    if (g == null) {
      return reason;
    }
    int i = st.memberOf(k);
    if (g.ordered()) {
      for (int j = 0; j < g.members().length; j++) {
        int a = g.members()[j][0];
        int b = g.members()[Math.min(j + 1, g.members().length - 1)][0];
        if (j + 1 < g.members().length && p.task(a).schedulable() && p.task(b).schedulable()
            && p.task(b).latestStartS() < p.task(a).earliestStartS() + p.task(a).durationS()) {
          return "group " + g.id() + " incomplete: " + p.requestId(b) + " has no window after " + p.requestId(a);
        }
      }
    }
    if (!g.allOrNothing()) {
      return reason;
    }
    boolean[] in = plan.membership(p.size());
    java.util.List<String> lacking = new java.util.ArrayList<>();
    for (int[] member : g.members()) {
      for (int t : member) {
        if (!in[t] && !lacking.contains(p.requestId(t))) {
          lacking.add(p.requestId(t));
        }
      }
    }
    String self = p.requestId(g.members()[i][0]);
    return "group " + g.id() + " (all or nothing) not scheduled: " + String.join(", ", lacking)
        + " not in the plan; " + self + ": " + reason;
  }
}
