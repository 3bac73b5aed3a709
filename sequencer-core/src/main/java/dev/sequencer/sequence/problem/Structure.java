package dev.sequencer.sequence.problem;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The rules that tie tasks together (format additions A4 and A5), in solver units: each request's visits
 * (its tasks in visit order, start-to-start separations, one per window, all or nothing) and the groups
 * (their members' tasks in list order, all or nothing, order and maximum gap). One owner of what these
 * rules mean for a plan: the CP-SAT model states them as constraints, {@link #earliestStartS} and
 * {@link #latestStartS} let the exact timer respect them, and {@link #prune} turns any plan into one that
 * keeps them by leaving observations out (every heuristic's plan passes through it).
 *
 * <p>Visits of one request are interchangeable (same target, duration, windows and value), so visit v
 * (1-based) is the v-th in time: the model breaks the symmetry with "visit v + 1 starts after visit v"
 * and "visit v + 1 only with visit v", which loses no plan. Separations are whole seconds: the minimum
 * rounded up and the maximum rounded down, so every plan kept here keeps the rule as written. Immutable.
 */
public final class Structure {
  /** The visits of one request: its tasks in visit order and the rules between consecutive visits. */
  public record VisitRule(int request, int[] tasks, long minSeparationS, long maxSeparationS, boolean onePerWindow,
      boolean allOrNothing) {
    /** True when a maximum separation is given. */
    public boolean hasMax() {
      return maxSeparationS >= 0;
    }
  }

  /**
   * One group: per member (in list order) its tasks (one per visit), whether all or none are scheduled,
   * whether members follow in list order, and the largest gap from a member's end to the next member's
   * start ({@code -1} for none).
   */
  public record GroupRule(String id, int[][] members, boolean allOrNothing, boolean ordered, long maxGapS) {
    /** True when a maximum gap is given. */
    public boolean hasMaxGap() {
      return maxGapS >= 0;
    }
  }

  /** No rules: every task is its own request, observed once. */
  public static Structure none(int tasks) {
    int[] identity = new int[tasks];
    int[] one = new int[tasks];
    for (int k = 0; k < tasks; k++) {
      identity[k] = k;
      one[k] = 1;
    }
    return new Structure(identity, one, List.of(), List.of());
  }

  private final int[] requestOf;
  private final int[] visitOf;
  private final List<VisitRule> visits;
  private final List<GroupRule> groups;
  private final int[] visitRuleOf;
  private final int[] groupOf;
  private final int[] memberOf;
  private final Sections sections;

  /** Rules without resources (A6). */
  public Structure(int[] requestOf, int[] visitOf, List<VisitRule> visits, List<GroupRule> groups) {
    this(requestOf, visitOf, visits, groups, null);
  }

  /** Rules of a problem whose tasks are options on several resources ({@code sections}; null for one). */
  public Structure(int[] requestOf, int[] visitOf, List<VisitRule> visits, List<GroupRule> groups,
      Sections sections) {
    this.sections = sections;
    this.requestOf = requestOf.clone();
    this.visitOf = visitOf.clone();
    this.visits = List.copyOf(visits);
    this.groups = List.copyOf(groups);
    int n = requestOf.length;
    visitRuleOf = new int[n];
    groupOf = new int[n];
    memberOf = new int[n];
    Arrays.fill(visitRuleOf, -1);
    Arrays.fill(groupOf, -1);
    Arrays.fill(memberOf, -1);
    for (int v = 0; v < this.visits.size(); v++) {
      for (int k : this.visits.get(v).tasks()) {
        visitRuleOf[k] = v;
      }
    }
    for (int g = 0; g < this.groups.size(); g++) {
      int[][] m = this.groups.get(g).members();
      for (int i = 0; i < m.length; i++) {
        for (int k : m[i]) {
          groupOf[k] = g;
          memberOf[k] = i;
        }
      }
    }
  }

  /** True when no rule ties tasks together. */
  public boolean isEmpty() {
    return visits.isEmpty() && groups.isEmpty() && sections == null;
  }

  /** The resources' sections (A6), or null with one resource. */
  public Sections sections() {
    return sections;
  }

  /** Number of tasks. */
  public int size() {
    return requestOf.length;
  }

  /** Index (scenario order) of the request task k observes; -1 for a section marker ({@link Sections}). */
  public int requestOf(int k) {
    return requestOf[k];
  }

  /** Visit number of task k (1-based; 1 for a request observed once). */
  public int visitOf(int k) {
    return visitOf[k];
  }

  /** The visit rules (requests with more than one visit, or all-or-nothing visits). */
  public List<VisitRule> visits() {
    return visits;
  }

  /** The groups. */
  public List<GroupRule> groups() {
    return groups;
  }

  /** The visit rule of task k, or null. */
  public VisitRule visitRuleOf(int k) {
    return visitRuleOf[k] < 0 ? null : visits.get(visitRuleOf[k]);
  }

  /** The group of task k, or null. */
  public GroupRule groupOf(int k) {
    return groupOf[k] < 0 ? null : groups.get(groupOf[k]);
  }

  /** Position of task k's request in its group's member list, or -1. */
  public int memberOf(int k) {
    return memberOf[k];
  }

  /**
   * The earliest start the rules allow task k, given the observations placed before it ({@code order},
   * {@code startS}, {@code endS}, first {@code count} entries, in time order): after the previous visit's
   * start plus the minimum separation, after the end of the previous member of an ordered group.
   */
  public long earliestStartS(int k, int[] order, long[] startS, long[] endS, int count) {
    long lo = 0;
    int v = visitRuleOf[k];
    int g = groupOf[k];
    for (int q = count - 1; q >= 0; q--) {
      int j = order[q];
      if (v >= 0 && visitRuleOf[j] == v) {
        lo = Math.max(lo, startS[q] + visits.get(v).minSeparationS());
        v = -1;
      }
      if (g >= 0 && groupOf[j] == g && groups.get(g).ordered() && memberOf[j] < memberOf[k]) {
        lo = Math.max(lo, endS[q]);
        g = -1;
      }
    }
    return lo;
  }

  /**
   * The latest start the rules allow task k after the same placed observations: within the maximum
   * separation of the previous visit, within the maximum gap after the previous member's end;
   * {@code Long.MAX_VALUE} when nothing limits it.
   */
  public long latestStartS(int k, int[] order, long[] startS, long[] endS, int count) {
    long hi = Long.MAX_VALUE;
    int v = visitRuleOf[k];
    int g = groupOf[k];
    for (int q = count - 1; q >= 0; q--) {
      int j = order[q];
      if (v >= 0 && visitRuleOf[j] == v) {
        if (visits.get(v).hasMax()) {
          hi = Math.min(hi, startS[q] + visits.get(v).maxSeparationS());
        }
        v = -1;
      }
      if (g >= 0 && groupOf[j] == g && groups.get(g).ordered() && memberOf[j] < memberOf[k]) {
        if (groups.get(g).hasMaxGap()) {
          hi = Math.min(hi, endS[q] + groups.get(g).maxGapS());
        }
        g = -1;
      }
    }
    return hi;
  }

  /**
   * The plan with its visits numbered in time order and every observation that breaks a rule left out:
   * walking in time order, a visit that starts too soon or too late after the previous kept visit, or in
   * the same span as a kept visit (one per window), is dropped (and, with several resources, every option of
   * a request after its first); then requests with all-or-nothing visits
   * that lack some; then, per ordered group in list order, a member that starts before the previous kept
   * member ends or after its maximum gap; then all-or-nothing groups that lack some member's visits.
   * Returns {@code plan} itself when it keeps every rule. Starts are unchanged, so a plan that was timed
   * stays timed as long as leaving an observation out never lengthens the slew that replaces it (true of
   * the models here up to their state, which the exact timer re-checks).
   */
  public Plan prune(PlanningProblem p, Plan plan) {
    if (isEmpty()) {
      return plan;
    }
    int n = plan.size();
    int[] order = plan.order().clone();
    boolean[] keep = new boolean[n];
    Arrays.fill(keep, true);
    if (sections != null) {
      boolean[] held = new boolean[sections.unitCount()];
      for (int q = 0; q < n; q++) {
        int u = sections.unitOf(order[q]);
        if (u >= 0) {
          keep[q] = !held[u];
          held[u] = true;
        }
      }
    }
    for (VisitRule rule : visits) {
      int next = 0;
      int last = -1;
      List<Span> used = new ArrayList<>();
      for (int q = 0; q < n; q++) {
        if (visitRuleOf[order[q]] < 0 || visits.get(visitRuleOf[order[q]]) != rule) {
          continue;
        }
        long s = plan.startS()[q];
        boolean ok = last < 0 || s - plan.startS()[last] >= rule.minSeparationS()
            && (!rule.hasMax() || s - plan.startS()[last] <= rule.maxSeparationS());
        Span span = null;
        if (ok && rule.onePerWindow()) {
          span = spanHolding(p.task(order[q]), s, plan.durationS()[q]);
          ok = span == null || !used.contains(span);
        }
        if (ok && next < rule.tasks().length) {
          order[q] = rule.tasks()[next++];
          last = q;
          if (span != null) {
            used.add(span);
          }
        } else {
          keep[q] = false;
        }
      }
      if (rule.allOrNothing() && next < rule.tasks().length) {
        for (int q = 0; q < n; q++) {
          if (visitRuleOf[order[q]] >= 0 && visits.get(visitRuleOf[order[q]]) == rule) {
            keep[q] = false;
          }
        }
      }
    }
    for (GroupRule group : groups) {
      if (group.ordered()) {
        int lastMember = -1;
        long lastEnd = 0;
        for (int q = 0; q < n; q++) {
          int k = order[q];
          if (!keep[q] || groupOf[k] < 0 || groups.get(groupOf[k]) != group) {
            continue;
          }
          long s = plan.startS()[q];
          boolean ok = lastMember < 0 || memberOf[k] > lastMember && s >= lastEnd
              && (!group.hasMaxGap() || s <= lastEnd + group.maxGapS());
          if (ok) {
            lastMember = memberOf[k];
            lastEnd = plan.endS(q);
          } else {
            keep[q] = false;
          }
        }
      }
      if (group.allOrNothing()) {
        int wanted = 0;
        for (int[] m : group.members()) {
          wanted += m.length;
        }
        int held = 0;
        for (int q = 0; q < n; q++) {
          held += keep[q] && groupOf[order[q]] >= 0 && groups.get(groupOf[order[q]]) == group ? 1 : 0;
        }
        if (held < wanted) {
          for (int q = 0; q < n; q++) {
            if (groupOf[order[q]] >= 0 && groups.get(groupOf[order[q]]) == group) {
              keep[q] = false;
            }
          }
        }
      }
    }
    int m = 0;
    for (boolean b : keep) {
      m += b ? 1 : 0;
    }
    if (m == n && Arrays.equals(order, plan.order())) {
      return plan;
    }
    int[] o = new int[m];
    long[] st = new long[m];
    long[] du = new long[m];
    int i = 0;
    for (int q = 0; q < n; q++) {
      if (keep[q]) {
        o[i] = order[q];
        st[i] = plan.startS()[q];
        du[i] = plan.durationS()[q];
        i++;
      }
    }
    return new Plan(o, st, du);
  }

  private static Span spanHolding(Task t, long s, long d) {
    for (Span sp : t.spans()) {
      if (sp.holds(s, d)) {
        return sp;
      }
    }
    return null;
  }

  /** True when {@code plan} keeps every rule as it is (visits numbered in time order included). */
  public boolean holds(PlanningProblem p, Plan plan) {
    return prune(p, plan) == plan;
  }
}
