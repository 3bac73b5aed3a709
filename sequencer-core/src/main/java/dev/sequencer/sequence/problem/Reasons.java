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
      for (int j = 0; j + 1 < g.members().length; j++) {
        long aEnd = Long.MAX_VALUE; // earliest end of member j, latest start of member j + 1 (own clocks)
        long bStart = Long.MIN_VALUE;
        for (int a : g.members()[j]) {
          if (p.task(a).schedulable()) {
            aEnd = Math.min(aEnd, local(p, a, p.task(a).earliestStartS() + p.task(a).durationS()));
          }
        }
        for (int b : g.members()[j + 1]) {
          if (p.task(b).schedulable()) {
            bStart = Math.max(bStart, local(p, b, p.task(b).latestStartS()));
          }
        }
        if (aEnd != Long.MAX_VALUE && bStart != Long.MIN_VALUE && bStart < aEnd) {
          return "group " + g.id() + " incomplete: " + p.requestId(g.members()[j + 1][0]) + " has no window after "
              + p.requestId(g.members()[j][0]);
        }
      }
    }
    if (!g.allOrNothing()) {
      return reason;
    }
    boolean[] in = plan.membership(p.size());
    java.util.List<String> lacking = new java.util.ArrayList<>();
    for (int[] member : g.members()) {
      int held = 0;
      for (int t : member) {
        held += in[t] ? 1 : 0;
      }
      String id = p.requestId(member[0]);
      int wanted = p.requests().stream().filter(q -> q.id().equals(id)).findFirst()
          .map(q -> q.visits().count()).orElse(1);
      if (held < wanted && !lacking.contains(id)) {
        lacking.add(id);
      }
    }
    String self = p.requestId(g.members()[i][0]);
    return "group " + g.id() + " (all or nothing) not scheduled: " + String.join(", ", lacking)
        + " not in the plan; " + self + ": " + reason;
  }

  /** Planner seconds {@code s} of task k on its own resource's clock. */
  private static long local(PlanningProblem p, int k, long s) {
    return p.sections() == null ? s : p.sections().localS(k, s);
  }
}
