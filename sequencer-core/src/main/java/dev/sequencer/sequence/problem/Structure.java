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
  /**
   * The visits of one request: per visit (in visit order) its tasks, one per resource that may observe it
   * (a single task with one resource), and the rules between consecutive visits.
   */
  public record VisitRule(int request, int[][] visits, long minSeparationS, long maxSeparationS, boolean onePerWindow,
      boolean allOrNothing) {
    /** True when a maximum separation is given. */
    public boolean hasMax() {
      return maxSeparationS >= 0;
    }

    /** Number of visits. */
    public int count() {
      return visits.length;
    }

    /** Every task of the rule, visit by visit. */
    public int[] tasks() {
      return Arrays.stream(visits).flatMapToInt(Arrays::stream).toArray();
    }
  }

  /**
   * One group: per member (in list order) its tasks (one per visit and, with several resources, per
   * resource), whether all or none are scheduled, whether members follow in list order, the largest gap from
   * a member's end to the next member's start ({@code -1} for none), and whether all members must be on one
   * resource (A6).
   */
  public record GroupRule(String id, int[][] members, boolean allOrNothing, boolean ordered, long maxGapS,
      boolean sameResource, long firstLatestStartS) {
    /** A group without the one-resource rule. */
    public GroupRule(String id, int[][] members, boolean allOrNothing, boolean ordered, long maxGapS) {
      this(id, members, allOrNothing, ordered, maxGapS, false);
    }

    /** A group as the format gives it: no member observed before the horizon. */
    public GroupRule(String id, int[][] members, boolean allOrNothing, boolean ordered, long maxGapS,
        boolean sameResource) {
      this(id, members, allOrNothing, ordered, maxGapS, sameResource, Long.MAX_VALUE);
    }

    /**
     * True when the first member scheduled has a latest start ({@code firstLatestStartS}, on the resources'
     * common clock): a re-plan of an ordered group with {@code maxGapS} whose earlier members are observed, the
     * next one scheduled at most that gap after the last one's end, whichever member it is.
     */
    public boolean hasFirstLatestStart() {
      return firstLatestStartS != Long.MAX_VALUE;
    }

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
      for (int[] options : this.visits.get(v).visits()) {
        for (int k : options) {
          visitRuleOf[k] = v;
        }
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

  /**
   * These rules with the first member scheduled of the named groups bounded: at most {@code latestS} (group id
   * to seconds on the common clock; see {@link GroupRule#hasFirstLatestStart}).
   */
  public Structure withFirstLatestStarts(java.util.Map<String, Long> latestS) {
    List<GroupRule> out = new ArrayList<>();
    for (GroupRule g : groups) {
      Long l = latestS.get(g.id());
      out.add(l == null ? g : new GroupRule(g.id(), g.members(), g.allOrNothing(), g.ordered(), g.maxGapS(),
          g.sameResource(), l));
    }
    return new Structure(requestOf, visitOf, visits, out, sections);
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

  /** Task k's planner seconds {@code s} on its own resource's clock (the same with one resource). */
  private long realS(int k, long s) {
    return sections == null ? s : sections.localS(k, s);
  }

  /** Offset of task k's section (0 with one resource). */
  private long offsetS(int k) {
    return sections == null ? 0 : sections.offsetS(sections.sectionOf(k));
  }

  /**
   * The earliest start the rules allow task k, given the observations placed before it ({@code order},
   * {@code startS}, {@code endS}, first {@code count} entries): after the latest placed visit's start plus the
   * minimum separation, after the end of every placed earlier member of an ordered group. Times compare on
   * the resources' own clocks (several resources, A6), so a visit on one resource keeps its separation from a
   * visit on another.
   */
  public long earliestStartS(int k, int[] order, long[] startS, long[] endS, int count) {
    long lo = Long.MIN_VALUE;
    int v = visitRuleOf[k];
    int g = groupOf[k];
    boolean ordered = g >= 0 && groups.get(g).ordered();
    if (v < 0 && !ordered) {
      return 0; // no rule orders k after anything: not worth a scan of the plan
    }
    for (int q = 0; q < count; q++) {
      int j = order[q];
      if (v >= 0 && visitRuleOf[j] == v) {
        lo = Math.max(lo, realS(j, startS[q]) + visits.get(v).minSeparationS());
      }
      if (ordered && groupOf[j] == g && memberOf[j] < memberOf[k]) {
        lo = Math.max(lo, realS(j, endS[q]));
      }
    }
    return lo == Long.MIN_VALUE ? 0 : Math.max(0, lo + offsetS(k));
  }

  /**
   * The latest start the rules allow task k after the same placed observations: within the maximum
   * separation of the latest placed visit, within the maximum gap after the end of the placed member that
   * comes last in list order; {@code Long.MAX_VALUE} when nothing limits it.
   */
  public long latestStartS(int k, int[] order, long[] startS, long[] endS, int count) {
    int v = visitRuleOf[k];
    int g = groupOf[k];
    boolean gap = g >= 0 && groups.get(g).ordered() && groups.get(g).hasMaxGap();
    boolean sep = v >= 0 && visits.get(v).hasMax();
    if (!sep && !gap) {
      return Long.MAX_VALUE;
    }
    long lastVisit = Long.MIN_VALUE;
    int lastMember = -1;
    long lastMemberEnd = Long.MIN_VALUE;
    for (int q = 0; q < count; q++) {
      int j = order[q];
      if (sep && visitRuleOf[j] == v) {
        lastVisit = Math.max(lastVisit, realS(j, startS[q]));
      }
      if (gap && groupOf[j] == g && memberOf[j] < memberOf[k] && (memberOf[j] > lastMember
          || memberOf[j] == lastMember && realS(j, endS[q]) > lastMemberEnd)) {
        lastMember = memberOf[j];
        lastMemberEnd = realS(j, endS[q]);
      }
    }
    long hi = Long.MAX_VALUE;
    if (lastVisit != Long.MIN_VALUE) {
      hi = Math.min(hi, lastVisit + visits.get(v).maxSeparationS());
    }
    if (lastMember >= 0) {
      hi = Math.min(hi, lastMemberEnd + groups.get(g).maxGapS());
    } else if (gap && groups.get(g).hasFirstLatestStart()) {
      hi = Math.min(hi, groups.get(g).firstLatestStartS()); // no earlier member placed: k would be the first
    }
    return hi == Long.MAX_VALUE ? hi : hi + offsetS(k);
  }

  /** The task of visit {@code visit} (0-based) of {@code rule} on the resource of task {@code like}. */
  private int visitTask(VisitRule rule, int visit, int like) {
    int[] options = rule.visits()[visit];
    if (sections == null) {
      return options[0];
    }
    for (int k : options) {
      if (sections.sectionOf(k) == sections.sectionOf(like)) {
        return k;
      }
    }
    throw new IllegalStateException("visit " + (visit + 1) + " of request " + rule.request() + " has no task on "
        + "the resource of task " + like);
  }

  /**
   * The windows one-per-window counts in, on the resources' own clock: the spans of every task of the rule
   * merged, joining spans less than a second apart (the inward rounding of two overlapping windows leaves such
   * a gap). With several resources (A4, A6) a pass seen by two antennas is one window; with one, the visits'
   * tasks differ where a re-plan clipped one of them (the first visit left ends at its maxSeparationS from the
   * visit done), and a clipped span is still part of the window it was clipped from.
   */
  public List<Span> mergedWindows(PlanningProblem p, VisitRule rule) {
    List<Span> all = new ArrayList<>();
    for (int t : rule.tasks()) {
      long off = offsetS(t);
      for (Span sp : p.task(t).spans()) {
        all.add(new Span(sp.fromS() - off, sp.toS() - off));
      }
    }
    all.sort(java.util.Comparator.comparingLong(Span::fromS));
    List<Span> merged = new ArrayList<>();
    for (Span sp : all) {
      Span last = merged.isEmpty() ? null : merged.get(merged.size() - 1);
      if (last != null && sp.fromS() <= last.toS() + 1) {
        merged.set(merged.size() - 1, new Span(last.fromS(), Math.max(last.toS(), sp.toS())));
      } else {
        merged.add(sp);
      }
    }
    return merged;
  }

  /**
   * The plan with its visits numbered in time order and every observation that breaks a rule left out:
   * walking in time order (on the resources' own clocks with several), a visit that starts too soon or too
   * late after the previous kept visit, or in the same window as a kept visit (one per window; with several
   * resources their windows merged), or that does not fit the task of its visit number, is dropped, and so is, with several resources, every option of a request
   * observed once after its first; then requests with all-or-nothing visits that lack some; then, per group
   * in list order, with one resource asked (A6) every member on another resource than the first kept one's,
   * for an ordered group a member that starts before the previous kept member ends or after its maximum gap;
   * then all-or-nothing groups that lack some member's visits. Returns {@code plan} itself when it keeps every
   * rule. Starts are unchanged, so a plan that was timed stays timed as long as leaving an observation out
   * never lengthens the slew that replaces it (true of the models here up to their state, which the exact
   * timer re-checks).
   */
  public Plan prune(PlanningProblem p, Plan plan) {
    if (isEmpty()) {
      return plan;
    }
    int n = plan.size();
    int[] order = plan.order().clone();
    boolean[] keep = new boolean[n];
    Arrays.fill(keep, true);
    Integer[] byTime = new Integer[n];
    for (int q = 0; q < n; q++) {
      byTime[q] = q;
    }
    if (sections != null) {
      Arrays.sort(byTime, java.util.Comparator.comparingLong(q -> realS(order[q], plan.startS()[q])));
      boolean[] held = new boolean[sections.unitCount()];
      for (int q : byTime) {
        int u = sections.unitOf(order[q]);
        if (u >= 0 && visitRuleOf[order[q]] < 0) {
          keep[q] = !held[u];
          held[u] = true;
        }
      }
    }
    for (VisitRule rule : visits) {
      int next = 0;
      int last = -1;
      List<Span> used = new ArrayList<>();
      List<Span> merged = rule.onePerWindow() ? mergedWindows(p, rule) : null;
      for (int q : byTime) {
        if (visitRuleOf[order[q]] < 0 || visits.get(visitRuleOf[order[q]]) != rule) {
          continue;
        }
        long s = realS(order[q], plan.startS()[q]);
        long gapS = last < 0 ? 0 : s - realS(order[last], plan.startS()[last]);
        boolean ok = last < 0 || gapS >= rule.minSeparationS() && (!rule.hasMax() || gapS <= rule.maxSeparationS());
        Span span = null;
        if (ok && rule.onePerWindow()) {
          span = spanHolding(merged, s, plan.durationS()[q]);
          ok = span == null || !used.contains(span);
        }
        // Renumbered, the observation must fit the task of its new visit number: the visits of one request are
        // alike except in a re-plan, where the first visit left may carry a latest start (maxSeparationS from
        // the visit done) that a later one does not; a visit that cannot be the next one is no visit.
        if (ok && next < rule.count() && p.task(visitTask(rule, next, order[q])).fits(plan.startS()[q],
            plan.durationS()[q])) {
          order[q] = visitTask(rule, next++, order[q]);
          last = q;
          if (span != null) {
            used.add(span);
          }
        } else {
          keep[q] = false;
        }
      }
      if (rule.allOrNothing() && next < rule.count()) {
        for (int q = 0; q < n; q++) {
          if (visitRuleOf[order[q]] >= 0 && visits.get(visitRuleOf[order[q]]) == rule) {
            keep[q] = false;
          }
        }
      }
    }
    for (GroupRule group : groups) {
      if (group.sameResource() && sections != null) {
        int section = -1;
        for (int q : byTime) {
          int k = order[q];
          if (keep[q] && groupOf[k] >= 0 && groups.get(groupOf[k]) == group) {
            section = section < 0 ? sections.sectionOf(k) : section;
            keep[q] = sections.sectionOf(k) == section;
          }
        }
      }
      if (group.ordered()) {
        int lastMember = -1;
        long lastEnd = 0;
        for (int q : byTime) {
          int k = order[q];
          if (!keep[q] || groupOf[k] < 0 || groups.get(groupOf[k]) != group) {
            continue;
          }
          long s = realS(k, plan.startS()[q]);
          boolean ok = lastMember < 0 ? !group.hasMaxGap() || s <= group.firstLatestStartS()
              : memberOf[k] > lastMember && s >= lastEnd && (!group.hasMaxGap() || s <= lastEnd + group.maxGapS());
          if (ok) {
            lastMember = memberOf[k];
            lastEnd = realS(k, plan.endS(q));
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
        if (sections != null) {
          wanted = 0; // one task per visit is wanted, not one per resource
          for (int[] m : group.members()) {
            wanted += visitsOfMember(m);
          }
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

  /** Number of visits among a member's tasks (its distinct units with several resources). */
  private int visitsOfMember(int[] tasks) {
    return (int) Arrays.stream(tasks).map(sections::unitOf).distinct().count();
  }

  private static Span spanHolding(List<Span> spans, long s, long d) {
    for (Span sp : spans) {
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
