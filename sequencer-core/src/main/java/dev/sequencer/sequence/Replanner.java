package dev.sequencer.sequence;

import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.sequence.PlanningProblem.Task;
import dev.sequencer.validate.PlanValidator;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * Re-plans the rest of a night from "now" (the scenario format's re-planning extension): done and
 * running observations are kept, nothing new starts before now, and the new plan departs from the end
 * pointing of the running (or last done) observation, no earlier than its end and now.
 *
 * <p>Previous observations are classified in time order: listed as failed → failed (re-planned like any
 * other request unless {@code dropFailed}; required requests are always retried); listed as done, ended
 * by now, or already marked done → done; started before now → running; the rest (not started) is the
 * previous plan's <em>tail</em>. Requests of the scenario that the previous timeline does not plan (new
 * ones, earlier losers) are candidates too.
 *
 * <p>The remaining requests form a {@link PlanningProblem} whose horizon starts at the departure
 * (rounded up to a whole second) and whose transitions ({@link DepartureTransitions}) start from the
 * frozen observation. The tail is the sequencer's preferred order (warm start, and its fallback inside
 * the sequencer) and, re-timed at exact transitions where it no longer fits as it was, a candidate of its
 * own: the better of the sequencer's plan and that tail is returned, ranked by priority, stability score
 * and slew as {@link ReplanOptions} says (stability score = kept tail requests + kept tail successor
 * arcs, the arc from the frozen observation to the first tail request included). Inside the solver the
 * score's request part is an objective term (see docs/model.md); the arc part only ranks the candidates.
 * Every returned plan passes {@link PlanValidator} with the re-planning instant. Stateless.
 */
public final class Replanner {
  /** Reason for a failed request that is not retried. */
  public static final String FAILED_DROPPED = "failed; not retried (drop-failed)";
  /** Reason for a request whose windows all close before the re-planned part begins. */
  public static final String NO_TIME_LEFT = "no visibility window left after the re-planning instant";

  /** Bad re-planning input: {@code field} is "previous", "now", "done" or "failed". */
  public static final class BadInput extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;
    private final String field;

    BadInput(String field, String message) {
      super(field + ": " + message);
      this.field = field;
    }

    /** The input at fault. */
    public String field() {
      return field;
    }
  }

  /**
   * Re-plans {@code full} (the whole scenario) after {@code previous} at {@code now}; {@code done} and
   * {@code failed} are ids of previous observations.
   */
  public ReplanResult replan(PlanningProblem full, Timeline previous, Instant now, Set<String> done,
      Set<String> failed, ReplanOptions options) {
    return new ReplanRun(full, previous, Objects.requireNonNull(now, "now"), Set.copyOf(done), Set.copyOf(failed),
        options).execute();
  }

  /** The state of one re-plan. */
  private static final class ReplanRun {
    private final PlanningProblem full;
    private final Timeline previous;
    private final Instant now;
    private final Set<String> done;
    private final Set<String> failed;
    private final ReplanOptions options;
    private final Map<String, Integer> index = new HashMap<>();
    private final List<Observation> frozen = new ArrayList<>();
    private final List<Observation> tail = new ArrayList<>();
    private final StringBuilder notes = new StringBuilder();
    private PlanningProblem sub;
    private int[] subToFull;
    private int[] fullToSub;
    private long offsetS;
    private double bonusMultiplier = 1;

    ReplanRun(PlanningProblem full, Timeline previous, Instant now, Set<String> done, Set<String> failed,
        ReplanOptions options) {
      this.full = full;
      this.previous = previous;
      this.now = now;
      this.done = done;
      this.failed = failed;
      this.options = options;
      for (int k = 0; k < full.size(); k++) {
        index.put(full.tasks().get(k).id(), k);
      }
    }

    ReplanResult execute() {
      classify();
      checkFrozen();
      Instant departure = departure();
      buildSubProblem(departure);
      int[] tailOrder = tail.stream().mapToInt(o -> fullToSub[index.get(o.id())]).filter(k -> k >= 0).toArray();
      SequencerResult solved = solve(tailOrder);
      List<Candidate> candidates = new ArrayList<>();
      PlanValidator validator = new PlanValidator(full.horizon(), full.requests(), full.windows(), full.transitions())
          .withNow(now);
      double solverPriority = Double.NaN;
      if (solved != null && solved.hasPlan()) {
        Candidate c = fromSolver(solved);
        List<String> v = validator.violations(c.timeline);
        if (!v.isEmpty()) {
          throw new IllegalStateException("the re-plan failed its re-check (a bug): " + v);
        }
        solverPriority = c.newPriority;
        candidates.add(c);
      } else if (solved == null) {
        candidates.add(candidate(List.of(), List.of(), Candidate.Kind.SOLVER, PlanStatus.OPTIMAL));
      }
      Candidate t = exactTail();
      List<String> tv = validator.violations(t.timeline);
      if (tv.isEmpty()) {
        candidates.add(t);
      } else {
        notes.append("the previous tail is not a valid plan any more: ").append(tv.get(0)).append(". ");
      }
      double tailPriority = tail.stream().mapToDouble(o -> full.tasks().get(index.get(o.id())).priority()).sum();
      Candidate best = null;
      for (Candidate c : candidates) {
        if (best == null || better(c, best)) {
          best = c;
        }
      }
      String sequencerNotes = solved == null ? "" : solved.stats().notes();
      if (best == null) {
        String message = solved.message().isEmpty() ? "no plan" : solved.message();
        Timeline none = merged(List.of(), List.of(), solved.status(), Double.NaN, "not planned: " + message);
        return new ReplanResult(none, ReplanResult.Source.NONE, 0, tailPriority, solverPriority, tail.size(), 0, 0,
            departure, message, (notes + sequencerNotes).trim());
      }
      Timeline timeline = best.timeline;
      if (best.kind == Candidate.Kind.SOLVER && solved != null) {
        timeline = withStatusAndBound(best, solved);
      } else {
        timeline = new Timeline(PlanStatus.FEASIBLE, timeline.priority(), timeline.slewSeconds(),
            solved == null ? null : wholeBound(solved, timeline.priority()), timeline.observations(),
            timeline.unscheduled());
      }
      List<String> v = validator.violations(timeline);
      if (!v.isEmpty()) {
        throw new IllegalStateException("the re-plan failed its re-check (a bug): " + v);
      }
      ReplanResult.Source source = best.kind == Candidate.Kind.SOLVER ? ReplanResult.Source.SOLVER
          : ReplanResult.Source.PREVIOUS_TAIL;
      if (source == ReplanResult.Source.PREVIOUS_TAIL) {
        notes.append("the rest of the previous plan ranks at least as high as the sequencer's plan and is kept. ");
      }
      return new ReplanResult(timeline, source, best.newPriority, tailPriority, solverPriority, tail.size(),
          best.keptRequests, best.keptArcs, departure, "", (notes + sequencerNotes).trim());
    }

    /** Splits the previous observations into frozen (done, running), failed and the tail; checks the ids. */
    private void classify() {
      for (String id : done) {
        if (failed.contains(id)) {
          throw new BadInput("done", "id \"" + id + "\" is also listed as failed");
        }
      }
      Set<String> planned = new HashSet<>();
      List<Observation> obs = previous.observations();
      for (int k = 0; k < obs.size(); k++) {
        Observation o = obs.get(k);
        if (!index.containsKey(o.id())) {
          throw new BadInput("previous", "observations[" + k + "]: id \"" + o.id() + "\" is not a request of the scenario");
        }
        planned.add(o.id());
        boolean started = o.start().isBefore(now);
        if (failed.contains(o.id()) || done.contains(o.id())) {
          if (!started) {
            String field = failed.contains(o.id()) ? "failed" : "done";
            throw new BadInput(field, "observation \"" + o.id() + "\" starts at " + o.start() + ", not before now "
                + now + ": it cannot be " + field + " yet");
          }
          if (done.contains(o.id())) {
            frozen.add(withState(o, Observation.DONE));
          }
        } else if (!o.end().isAfter(now)) {
          frozen.add(withState(o, Observation.DONE));
        } else if (started) {
          frozen.add(withState(o, Observation.DONE.equals(o.state()) ? Observation.DONE : Observation.RUNNING));
        } else if (Observation.DONE.equals(o.state()) || Observation.RUNNING.equals(o.state())) {
          throw new BadInput("previous", "observations[" + k + "] (id \"" + o.id() + "\") is " + o.state()
              + " but starts at " + o.start() + ", after now " + now);
        } else {
          tail.add(o);
        }
      }
      for (String id : done) {
        if (!planned.contains(id)) {
          throw new BadInput("done", "id \"" + id + "\" is not an observation of the previous timeline");
        }
      }
      for (String id : failed) {
        if (!planned.contains(id)) {
          throw new BadInput("failed", "id \"" + id + "\" is not an observation of the previous timeline");
        }
      }
    }

    private static Observation withState(Observation o, String state) {
      return new Observation(o.id(), o.start(), o.end(), o.slewSeconds(), o.value(), state);
    }

    /** The frozen observations must be valid against the scenario (required flags aside): else bad input. */
    private void checkFrozen() {
      List<Request> relaxed = full.requests().stream().map(r -> r.withRequired(false)).toList();
      PlanValidator v = new PlanValidator(full.horizon(), relaxed, full.windows(), full.transitions()).withNow(now);
      double p = 0;
      double s = 0;
      for (Observation o : frozen) {
        p += full.tasks().get(index.get(o.id())).priority();
        s += o.slewSeconds();
      }
      Set<String> in = new HashSet<>();
      frozen.forEach(o -> in.add(o.id()));
      List<Unscheduled> rest = full.tasks().stream().filter(t -> !in.contains(t.id()))
          .map(t -> new Unscheduled(t.id(), "-")).toList();
      List<String> violations = v.violations(new Timeline(PlanStatus.FEASIBLE, p, s, null, frozen, rest));
      if (!violations.isEmpty()) {
        throw new BadInput("previous", "the done and running observations are not valid for this scenario: "
            + String.join("; ", violations));
      }
    }

    /** Scenario seconds of an instant, with the fraction. */
    private double fullSeconds(Instant t) {
      Duration d = Duration.between(full.horizonStart(), t);
      return d.getSeconds() + d.getNano() * 1e-9;
    }

    /** The later of now and the end of the last frozen observation (the horizon start at the earliest). */
    private Instant departure() {
      Instant d = now.isBefore(full.horizonStart()) ? full.horizonStart() : now;
      if (!frozen.isEmpty() && frozen.get(frozen.size() - 1).end().isAfter(d)) {
        d = frozen.get(frozen.size() - 1).end();
      }
      return d;
    }

    /** The remaining requests from the departure (rounded up to a whole second) to the horizon end. */
    private void buildSubProblem(Instant departure) {
      offsetS = Math.min(full.horizonS(), PlanningProblem.ceilSeconds(full.horizonStart(), departure));
      Set<String> frozenIds = new HashSet<>();
      frozen.forEach(o -> frozenIds.add(o.id()));
      Set<Integer> tailIdx = new HashSet<>();
      tail.forEach(o -> tailIdx.add(index.get(o.id())));
      List<Integer> keep = new ArrayList<>();
      for (int k = 0; k < full.size(); k++) {
        Task t = full.tasks().get(k);
        boolean dropped = options.dropFailed() && failed.contains(t.id()) && !t.required();
        if (!frozenIds.contains(t.id()) && !dropped) {
          keep.add(k);
        }
      }
      subToFull = keep.stream().mapToInt(Integer::intValue).toArray();
      fullToSub = new int[full.size()];
      java.util.Arrays.fill(fullToSub, -1);
      for (int q = 0; q < subToFull.length; q++) {
        fullToSub[subToFull[q]] = q;
      }
      chooseBonus(tailIdx);
      List<Request> requests = new ArrayList<>();
      Set<String> ids = new HashSet<>();
      for (int k : subToFull) {
        Request r = full.requests().get(k);
        ids.add(r.id());
        requests.add(new Request(r.id(), r.target(), r.durationS(), subPriority(k, tailIdx.contains(k)), r.required(),
            r.windows(), r.flexible()));
      }
      List<RequestWindows> windows = full.windows().stream().filter(w -> ids.contains(w.id())).toList();
      int[] fo = new int[frozen.size()];
      double[] fd = new double[frozen.size()];
      double[] fa = new double[frozen.size()];
      for (int q = 0; q < frozen.size(); q++) {
        fo[q] = index.get(frozen.get(q).id());
        fd[q] = q == 0 ? 0.0 : fullSeconds(frozen.get(q - 1).end());
        fa[q] = fullSeconds(frozen.get(q).start());
      }
      double fromEndS = frozen.isEmpty() ? 0.0 : fullSeconds(frozen.get(frozen.size() - 1).end());
      DepartureTransitions tr = new DepartureTransitions(full.transitions(), subToFull, fo, fd, fa, fromEndS, offsetS);
      TimeWindow h = new TimeWindow(full.horizonStart().plusSeconds(offsetS), full.horizon().end());
      PlanningProblem p = PlanningProblem.of(h, requests, windows, tr);
      int last = full.mustBeLastIndex();
      sub = last >= 0 && fullToSub[last] >= 0 ? p.withMustBeLast(full.tasks().get(last).id()) : p;
    }

    /**
     * Lexicographic mode: priorities times M = f·(tail size + 1), plus 1 per tail request, where f makes
     * every priority whole ({@link PriorityScale}): one unit of priority outweighs every kept request.
     * Skipped (with a note) when the products could overflow the solver's integers.
     */
    private void chooseBonus(Set<Integer> tailIdx) {
      if (!options.lexicographic() || tailIdx.isEmpty()) {
        return;
      }
      double m = new PriorityScale(full).factor() * (double) (tailIdx.size() + 1);
      double maxP = 0;
      for (int k : subToFull) {
        maxP = Math.max(maxP, full.tasks().get(k).priority());
      }
      if (m * maxP * Math.max(1, subToFull.length) * 1000 > 1e15) {
        notes.append("stability is only a tie-break among candidates here (priorities too large to weigh it in the "
            + "solver). ");
        return;
      }
      bonusMultiplier = m;
    }

    private double subPriority(int k, boolean inTail) {
      double p = full.tasks().get(k).priority();
      if (options.lexicographic()) {
        return bonusMultiplier == 1 ? p : bonusMultiplier * p + (inTail ? 1 : 0);
      }
      return p + (inTail ? options.stabilityWeight() : 0);
    }

    /** Runs the sequencer on the sub-problem; null when nothing is left to plan. */
    private SequencerResult solve(int[] tailOrder) {
      boolean any = sub.tasks().stream().anyMatch(t -> t.schedulable() || t.required());
      if (!any) {
        return null;
      }
      Sequencer s = new Sequencer();
      return options.warmStart() ? s.plan(sub, options.sequencer(), tailOrder) : s.plan(sub, options.sequencer());
    }

    /** One candidate new plan with its merged timeline and score parts. */
    private static final class Candidate {
      enum Kind { SOLVER, TAIL }

      Kind kind;
      Timeline timeline;
      double newPriority;
      double slewS;
      int keptRequests;
      int keptArcs;
    }

    private Candidate fromSolver(SequencerResult r) {
      List<Observation> obs = new ArrayList<>();
      for (SequencerResult.Planned p : r.observations()) {
        obs.add(new Observation(p.id(), p.start(), p.end(), p.transitionS(), null, Observation.PLANNED));
      }
      return candidate(obs, List.of(), Candidate.Kind.SOLVER, PlanStatus.FEASIBLE);
    }

    private Candidate candidate(List<Observation> planned, List<Unscheduled> extra, Candidate.Kind kind,
        PlanStatus status) {
      Candidate c = new Candidate();
      c.kind = kind;
      c.timeline = merged(planned, extra, status, Double.NaN, null);
      for (Observation o : planned) {
        c.newPriority += full.tasks().get(index.get(o.id())).priority();
        c.slewS += o.slewSeconds();
      }
      Set<String> tailIds = new HashSet<>();
      tail.forEach(o -> tailIds.add(o.id()));
      c.keptRequests = (int) planned.stream().filter(o -> tailIds.contains(o.id())).count();
      Set<String> arcs = successorArcs(tail);
      for (String a : successorArcs(planned)) {
        if (arcs.contains(a)) {
          c.keptArcs++;
        }
      }
      return c;
    }

    /** "A->B" for each consecutive pair, the frozen observation (or START) before the first included. */
    private Set<String> successorArcs(List<Observation> seq) {
      Set<String> out = new HashSet<>();
      String prev = frozen.isEmpty() ? "\u0000START" : frozen.get(frozen.size() - 1).id();
      for (Observation o : seq) {
        out.add(prev + "->" + o.id());
        prev = o.id();
      }
      return out;
    }

    /**
     * The tail at exact transitions: each observation at the first allowed second at or after both its
     * previous start and the previous end plus the exact leg (checked at that start), dropped when none.
     */
    private Candidate exactTail() {
      List<Integer> order = new ArrayList<>();
      List<Double> departures = new ArrayList<>();
      List<Double> arrivals = new ArrayList<>();
      List<Observation> planned = new ArrayList<>();
      long prevEnd = 0;
      for (Observation o : tail) {
        int j = fullToSub[index.get(o.id())];
        Task t = sub.tasks().get(j);
        if (!t.schedulable()) {
          continue;
        }
        long s = t.firstStartAtOrAfter(Math.max(prevEnd, PlanningProblem.ceilSeconds(sub.horizonStart(), o.start())));
        double leg = Double.NaN;
        boolean ok = false;
        for (int step = 0; s >= 0 && step < 64 && !ok; step++) {
          leg = legAt(order, departures, arrivals, j, prevEnd, s);
          if (leg < Double.POSITIVE_INFINITY && prevEnd + leg <= s + 1e-9) {
            ok = true;
          } else {
            long next = leg < Double.POSITIVE_INFINITY ? prevEnd + ArcCosts.ceilS(leg) : s + 1;
            s = t.firstStartAtOrAfter(Math.max(s + 1, next));
          }
        }
        if (!ok) {
          continue;
        }
        order.add(j);
        departures.add((double) prevEnd);
        arrivals.add((double) s);
        planned.add(new Observation(o.id(), sub.instant(s), sub.instant(s + t.durationS()), leg, null,
            Observation.PLANNED));
        prevEnd = s + t.durationS();
      }
      return candidate(planned, List.of(), Candidate.Kind.TAIL, PlanStatus.FEASIBLE);
    }

    private double legAt(List<Integer> order, List<Double> dep, List<Double> arr, int j, long departS, long startS) {
      int m = order.size();
      int[] o = new int[m + 1];
      double[] d = new double[m + 1];
      double[] a = new double[m + 1];
      for (int q = 0; q < m; q++) {
        o[q] = order.get(q);
        d[q] = dep.get(q);
        a[q] = arr.get(q);
      }
      o[m] = j;
      d[m] = departS;
      a[m] = startS;
      return sub.transitions().exactS(o, d, a)[m];
    }

    /** Frozen observations, then {@code planned}; every other request unscheduled with its reason. */
    private Timeline merged(List<Observation> planned, List<Unscheduled> extra, PlanStatus status, double bound,
        String notPlannedReason) {
      List<Observation> obs = new ArrayList<>(frozen);
      obs.addAll(planned);
      Set<String> in = new HashSet<>();
      double p = 0;
      double s = 0;
      for (Observation o : obs) {
        in.add(o.id());
        p += full.tasks().get(index.get(o.id())).priority();
        s += o.slewSeconds();
      }
      List<Unscheduled> uns = new ArrayList<>(extra);
      for (int k = 0; k < full.size(); k++) {
        Task t = full.tasks().get(k);
        if (in.contains(t.id())) {
          continue;
        }
        int q = fullToSub[k];
        String reason;
        if (q < 0) {
          reason = FAILED_DROPPED;
        } else if (sub.tasks().get(q).schedulable()) {
          reason = notPlannedReason != null ? notPlannedReason : PlanningProblem.LOST_TO_CONFLICTS;
        } else {
          reason = t.schedulable() ? NO_TIME_LEFT : t.emptyReason();
        }
        uns.add(new Unscheduled(t.id(), reason));
      }
      return new Timeline(status, p, s, Double.isNaN(bound) ? null : bound, obs, uns);
    }

    /** Ranks by priority, then stability, then slew (lexicographic), or priority + w·stability, then slew. */
    private boolean better(Candidate a, Candidate b) {
      double w = options.lexicographic() ? 0 : options.stabilityWeight();
      double va = a.newPriority + w * (a.keptRequests + a.keptArcs);
      double vb = b.newPriority + w * (b.keptRequests + b.keptArcs);
      double eps = 1e-9 * Math.max(1, Math.abs(vb));
      if (Math.abs(va - vb) > eps) {
        return va > vb;
      }
      if (options.lexicographic()) {
        int sa = a.keptRequests + a.keptArcs;
        int sb = b.keptRequests + b.keptArcs;
        if (sa != sb) {
          return sa > sb;
        }
      }
      return a.slewS < b.slewS - 1e-6;
    }

    /** The solver's status (OPTIMAL only when its objective orders priority exactly) and the whole-night bound. */
    private Timeline withStatusAndBound(Candidate c, SequencerResult r) {
      boolean exactPriority = options.lexicographic() || options.stabilityWeight() == 0;
      PlanStatus status = r.status() == PlanStatus.OPTIMAL && exactPriority ? PlanStatus.OPTIMAL : PlanStatus.FEASIBLE;
      Timeline t = c.timeline;
      return new Timeline(status, t.priority(), t.slewSeconds(), wholeBound(r, t.priority()), t.observations(),
          t.unscheduled());
    }

    /**
     * Proven bound on the whole night's priority: frozen priority + the sub-problem's bound in real units
     * (lexicographic: Σ M·p + kept ≤ B gives Σ p ≤ B / M; weighted: Σ p ≤ Σ p + w·kept ≤ B); null if none.
     */
    private Double wholeBound(SequencerResult r, double planPriority) {
      if (Double.isNaN(r.boundPriority())) {
        return null;
      }
      double frozenP = frozen.stream().mapToDouble(o -> full.tasks().get(index.get(o.id())).priority()).sum();
      double b = frozenP + r.boundPriority() / bonusMultiplier;
      return Math.max(b, planPriority);
    }
  }
}
