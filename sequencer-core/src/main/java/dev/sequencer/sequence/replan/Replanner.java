package dev.sequencer.sequence.replan;

import dev.sequencer.io.Problem;
import dev.sequencer.io.ScenarioException;
import dev.sequencer.model.Group;
import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.model.Visits;
import dev.sequencer.sequence.ProgressListener;
import dev.sequencer.sequence.Seeds;
import dev.sequencer.sequence.Sequencer;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.SequencerResult;
import dev.sequencer.sequence.problem.Plan;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.problem.Prizes;
import dev.sequencer.sequence.problem.Reasons;
import dev.sequencer.sequence.problem.Sections;
import dev.sequencer.sequence.problem.Task;
import dev.sequencer.slew.Transitions;
import dev.sequencer.sequence.SelfCheck;
import dev.sequencer.validate.TimelineCheck;
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
 * frozen observation. The requests are the scenario's own (a flexible request keeps its curve); the
 * stability of the plan enters through the objective ({@link Prizes#withBonuses}): in the default
 * lexicographic mode each scaled value is multiplied by M = (tail requests + tail successor pairs + 1)
 * and each kept tail request and kept successor pair (the pair from the frozen observation to the first
 * tail request included) earns 1, so priority comes first, then stability, then slew; with a weight w,
 * the bonus is w priority units per kept request or pair. The tail is the sequencer's warm start (or,
 * without warm start, its fallback), so the new plan is never worse than the rest of the previous plan by
 * that order. The merged night passes the validator, with the re-planning instant, once. Bad re-planning
 * input (an unknown id, an instant after the horizon) is a {@link ScenarioException} of source
 * {@link #INPUT}. Stateless.
 *
 * <p>With several resources (format addition A6; {@code full} built by {@link PlanningProblem#ofSections})
 * each resource departs on its own: from the end pointing of its own running (or last done) observation, no
 * earlier than that observation's end and now. The sub-problem is again a sections problem: its horizon
 * starts at the earliest such departure (a resource departing there is put first), every other resource's
 * marker is pinned at its own departure, and its transitions are its own {@link DepartureTransitions}.
 * Resources listed as unavailable ({@link ReplanOptions#unavailable}) get no section; an observation running
 * on one counts as failed unless listed as done. Stability is counted per resource: a kept tail request is one
 * planned again on the same resource, a kept pair two consecutive observations of one resource.
 */
public final class Replanner {
  /** Reason for a failed request that is not retried. */
  public static final String FAILED_DROPPED = "failed; not retried (drop-failed)";
  /** Reason for a request only resources out of service could still observe (several resources). */
  public static final String RESOURCES_UNAVAILABLE = "only unavailable resources could still observe it";
  /** Reason for a request whose windows all close before the re-planned part begins. */
  public static final String NO_TIME_LEFT = "no visibility window left after the re-planning instant";
  /** The objective must stay far below CP-SAT's exact range (2^53) even with the stability multiplier. */
  static final double MAX_OBJECTIVE = 1e15;

  /** Source name of the re-planning input in a {@link ScenarioException}: its problems name "previous", "now", "done" or "failed". */
  public static final String INPUT = "re-planning input";

  private static ScenarioException badInput(String field, String message) {
    return new ScenarioException(INPUT, List.of(new Problem(field, message, null)));
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
    /** The resources of {@code full}, or null for one observer. */
    private final Sections fullSec;
    private final Timeline previous;
    private final Instant now;
    private final Set<String> done;
    private final Set<String> failed;
    private final ReplanOptions options;
    private final TimelineCheck validator;
    /** Request id → request index of {@code full}. */
    private final Map<String, Integer> index = new HashMap<>();
    private final List<Observation> frozen = new ArrayList<>();
    private final List<Observation> tail = new ArrayList<>();
    /** Ids of observations failed by the caller or lost with an unavailable resource. */
    private final Set<String> failedIds = new HashSet<>();
    private final StringBuilder notes = new StringBuilder();
    private PlanningProblem sub;
    private int[] subToFull;
    private int[] fullToSub;
    /** What the visits and groups rules ask of the rest of the night (set with the sub-problem). */
    private Residual residual;
    /** Sub-problem section of each resource of {@code full} (-1: unavailable); {0} for one observer. */
    private int[] subSectionOf;

    ReplanRun(PlanningProblem full, Timeline previous, Instant now, Set<String> done, Set<String> failed,
        ReplanOptions options) {
      this.full = full;
      this.fullSec = full.sections();
      this.previous = previous;
      this.now = now;
      this.done = done;
      this.failed = failed;
      this.options = options;
      TimelineCheck v = options.validator() != null ? options.validator() : SelfCheck.of(full);
      this.validator = v.withNow(now);
      for (int k = 0; k < full.requests().size(); k++) {
        index.put(full.requests().get(k).id(), k);
      }
      failedIds.addAll(failed);
    }

    /** Number of resources (1 for one observer). */
    private int resourceCount() {
      return fullSec == null ? 1 : fullSec.count();
    }

    /** Resource index of an observation (0 for one observer). */
    private int resourceOf(Observation o) {
      return fullSec == null ? 0 : o.resource() == null ? -1 : fullSec.resourceIds().indexOf(o.resource());
    }

    private boolean unavailable(int resource) {
      return fullSec != null && options.unavailable().contains(fullSec.resourceId(resource));
    }

    ReplanResult execute() {
      if (now.isAfter(full.horizon().end())) {
        throw badInput("now", "must not be after the horizon end " + full.horizon().end() + " (was " + now + ")");
      }
      checkUnavailable();
      classify();
      checkFrozen();
      Instant departure = departure(firstToDepart());
      buildSubProblem();
      double tailPriority = 0;
      for (Observation o : tail) {
        tailPriority += o.value() != null ? o.value() : full.requests().get(index.get(o.id())).priority();
      }
      double frozenPriority = priorityOf(frozen);
      boolean anything = sub != null && sub.tasks().stream().anyMatch(t -> t.schedulable() || t.required());
      if (!anything) {
        List<String> lost = requiredLeft();
        if (!lost.isEmpty()) {
          String message = "no resource left for the required request(s) " + String.join(", ", lost);
          Timeline none = new Timeline(PlanStatus.INFEASIBLE, frozenPriority, slewOf(frozen), null, frozen,
              unscheduled(Map.of(), "not planned: " + message, List.of()));
          return new ReplanResult(none, ReplanResult.Source.NONE, 0, tailPriority, Double.NaN, tail.size(), 0, 0,
              departure, message, notes.toString().trim());
        }
        Timeline t = merged(List.of(), PlanStatus.OPTIMAL, frozenPriority);
        check(t);
        return new ReplanResult(t, ReplanResult.Source.SOLVER, 0, tailPriority, 0, tail.size(), 0, 0, departure, "",
            notes.toString().trim());
      }
      Plan tailPlan = tailPlan();
      Seeds seeds = options.warmStart() ? new Seeds(List.of(tailPlan), List.of())
          : new Seeds(List.of(), List.of(tailPlan));
      SequencerOptions so = options.sequencer().withValidator(r -> violations(r, frozenPriority));
      ProgressListener l = so.listener();
      if (l != null) {
        // Progress speaks of the whole night, as the summary does.
        so = so.withListener((n, p, slew, bound, elapsed) -> l.onProgress(n, frozenPriority + p, slew,
            Double.isNaN(bound) ? bound : frozenPriority + bound, elapsed));
      }
      SequencerResult r = new Sequencer().plan(sub, so, seeds);
      String sequencerNotes = r.stats().notesText();
      if (!r.hasPlan()) {
        String message = r.message().isEmpty() ? "no plan" : r.message();
        List<String> stranded = requiredOnlyOnUnavailable();
        if (!stranded.isEmpty()) {
          message = "only unavailable resources could still observe the required request(s) "
              + String.join(", ", stranded) + "; " + message;
        }
        Timeline none = new Timeline(r.status(), frozenPriority, slewOf(frozen), null, frozen,
            unscheduled(Map.of(), "not planned: " + message, List.of()));
        return new ReplanResult(none, ReplanResult.Source.NONE, 0, tailPriority, Double.NaN, tail.size(), 0, 0,
            departure, message, (notes + sequencerNotes).trim());
      }
      Timeline timeline = mergedFrom(r, frozenPriority);
      ReplanResult.Source source = "PREFERRED".equals(r.stats().source()) || "FALLBACK".equals(r.stats().source())
          ? ReplanResult.Source.PREVIOUS_TAIL : ReplanResult.Source.SOLVER;
      if (source == ReplanResult.Source.PREVIOUS_TAIL) {
        notes.append("the rest of the previous plan ranks at least as high as every plan the search found and is "
            + "kept. ");
      }
      List<Observation> planned = timeline.observations().subList(frozen.size(), timeline.observations().size());
      Map<String, Integer> tailKeys = new HashMap<>();
      tail.forEach(o -> tailKeys.merge(key(o), 1, Integer::sum));
      int keptRequests = 0;
      for (Observation o : planned) {
        if (tailKeys.getOrDefault(key(o), 0) > 0) {
          tailKeys.merge(key(o), -1, Integer::sum);
          keptRequests++;
        }
      }
      Set<String> tailArcs = successorArcs(tail);
      int keptArcs = (int) successorArcs(planned).stream().filter(tailArcs::contains).count();
      return new ReplanResult(timeline, source, r.totalPriority(), tailPriority, r.stats().ownPriority(), tail.size(),
          keptRequests, keptArcs, departure, "", (notes + sequencerNotes).trim());
    }

    /** An observation's request on its resource: what "kept" compares. */
    private static String key(Observation o) {
      return o.id() + "@" + o.resource();
    }

    /** The one check of the new plan: merged with the frozen observations, the whole night validated at now. */
    private List<String> violations(SequencerResult r, double frozenPriority) {
      return validator.violations(mergedFrom(r, frozenPriority));
    }

    private void check(Timeline t) {
      List<String> v = validator.violations(t);
      if (!v.isEmpty()) {
        throw new IllegalStateException("the re-plan failed its re-check (a bug): " + v);
      }
    }

    /** The unavailable resources must be resources of the scenario. */
    private void checkUnavailable() {
      for (String id : new java.util.TreeSet<>(options.unavailable())) {
        if (fullSec == null) {
          throw badInput("unavailable", "the scenario has one observer and no resources; \"" + id
              + "\" cannot be unavailable");
        }
        if (!fullSec.resourceIds().contains(id)) {
          throw badInput("unavailable", "id \"" + id + "\" is not a resource of the scenario (resources: "
              + String.join(", ", fullSec.resourceIds()) + ")");
        }
      }
    }

    /** Splits the previous observations into frozen (done, running), failed and the tail; checks the ids. */
    private void classify() {
      for (String id : done) {
        if (failed.contains(id)) {
          throw badInput("done", "id \"" + id + "\" is also listed as failed");
        }
      }
      Set<String> planned = new HashSet<>();
      List<Observation> obs = previous.observations();
      for (int k = 0; k < obs.size(); k++) {
        Observation o = obs.get(k);
        if (!index.containsKey(o.id())) {
          throw badInput("previous", "observations[" + k + "]: id \"" + o.id() + "\" is not a request of the scenario");
        }
        checkResource(k, o);
        planned.add(o.id());
        boolean started = o.start().isBefore(now);
        // For a request with visits a listed id names its last visit started before now (the one running or
        // just ended); earlier ones follow the usual rule, later ones are the tail (at least one must have
        // started: checked below).
        boolean listed = (failed.contains(o.id()) || done.contains(o.id()))
            && (!full.requests().get(index.get(o.id())).hasVisits() || k == lastStarted(obs, o.id()));
        if (listed) {
          if (!started) {
            String field = failed.contains(o.id()) ? "failed" : "done";
            throw badInput(field, "observation \"" + o.id() + "\" starts at " + o.start() + ", not before now "
                + now + ": it cannot be " + field + " yet");
          }
          if (done.contains(o.id())) {
            frozen.add(withState(o, Observation.DONE));
          }
        } else if (!o.end().isAfter(now)) {
          frozen.add(withState(o, Observation.DONE));
        } else if (started && unavailable(resourceOf(o)) && !Observation.DONE.equals(o.state())) {
          failedIds.add(o.id());
          notes.append("observation ").append(o.id()).append(" was running on ").append(o.resource())
              .append(", unavailable from now: counted as failed. ");
        } else if (started) {
          frozen.add(withState(o, Observation.DONE.equals(o.state()) ? Observation.DONE : Observation.RUNNING));
        } else if (Observation.DONE.equals(o.state()) || Observation.RUNNING.equals(o.state())) {
          throw badInput("previous", "observations[" + k + "] (id \"" + o.id() + "\") is " + o.state()
              + " but starts at " + o.start() + ", after now " + now);
        } else {
          tail.add(o);
        }
      }
      for (String id : done) {
        if (!planned.contains(id)) {
          throw badInput("done", "id \"" + id + "\" is not an observation of the previous timeline");
        }
      }
      for (String id : union(done, failed)) {
        boolean anyStarted = obs.stream().anyMatch(o -> o.id().equals(id) && o.start().isBefore(now));
        if (planned.contains(id) && !anyStarted) {
          String field = failed.contains(id) ? "failed" : "done";
          throw badInput(field, "no visit of \"" + id + "\" starts before now " + now + ": it cannot be " + field
              + " yet");
        }
      }
      renumberFrozenVisits();
      for (String id : failed) {
        if (!planned.contains(id)) {
          throw badInput("failed", "id \"" + id + "\" is not an observation of the previous timeline");
        }
      }
    }

    /** Index in {@code obs} of the last observation of {@code id} that starts before now; -1 when none. */
    private int lastStarted(List<Observation> obs, String id) {
      int last = -1;
      for (int k = 0; k < obs.size(); k++) {
        if (obs.get(k).id().equals(id) && obs.get(k).start().isBefore(now)) {
          last = k;
        }
      }
      return last;
    }

    private static Set<String> union(Set<String> a, Set<String> b) {
      Set<String> out = new java.util.TreeSet<>(a);
      out.addAll(b);
      return out;
    }

    /** Visits kept are numbered 1, 2, … in time order again (a failed visit before them is gone). */
    private void renumberFrozenVisits() {
      List<Observation> copy = renumbered(frozen);
      frozen.clear();
      frozen.addAll(copy);
    }

    /** {@code obs} with the visits of each request with visits numbered 1, 2, … in list (time) order. */
    private List<Observation> renumbered(List<Observation> obs) {
      Map<String, Integer> seen = new HashMap<>();
      List<Observation> out = new ArrayList<>();
      for (Observation o : obs) {
        boolean several = full.requests().get(index.get(o.id())).hasVisits();
        out.add(several ? o.withVisit(seen.merge(o.id(), 1, Integer::sum)) : o.withVisit(null));
      }
      return out;
    }

    /** Observations of request {@code id} among the frozen ones. */
    private int frozenCount(String id) {
      return (int) frozen.stream().filter(o -> o.id().equals(id)).count();
    }

    /** With several resources every previous observation names one of them; with one observer none. */
    private void checkResource(int k, Observation o) {
      String field = "previous";
      String where = "observations[" + k + "] (id \"" + o.id() + "\").resource";
      if (fullSec == null && o.resource() != null) {
        throw badInput(field, where + ": \"" + o.resource() + "\", but the scenario has one observer and no resources");
      }
      if (fullSec != null && resourceOf(o) < 0) {
        throw badInput(field, where + ": " + (o.resource() == null ? "missing" : "\"" + o.resource() + "\" is not")
            + " a resource of the scenario (resources: " + String.join(", ", fullSec.resourceIds()) + ")");
      }
    }

    private static Observation withState(Observation o, String state) {
      return new Observation(o.id(), o.start(), o.end(), o.slewSeconds(), o.value(), state, o.slewStart(), o.slewVia(),
          o.visit(), o.resource());
    }

    /** The frozen observations must be valid against the scenario (required flags aside): else bad input. */
    private void checkFrozen() {
      Set<String> in = new HashSet<>();
      frozen.forEach(o -> in.add(o.id()));
      List<Unscheduled> rest = new ArrayList<>();
      for (Request q : full.requests()) {
        int n = frozenCount(q.id());
        if (n < q.visits().count()) {
          rest.add(new Unscheduled(q.id(), "-", q.hasVisits() && n > 0 ? q.visits().count() - n : null));
        }
      }
      List<String> violations = validator.withRequiredIgnored().violations(
          new Timeline(PlanStatus.FEASIBLE, priorityOf(frozen), slewOf(frozen), null, frozen, rest));
      if (!violations.isEmpty()) {
        throw badInput("previous", "the done and running observations are not valid for this scenario: "
            + String.join("; ", violations));
      }
    }

    /** Priority of observations: each flexible one's value, each fixed one's priority. */
    private double priorityOf(List<Observation> obs) {
      double p = 0;
      for (Observation o : obs) {
        Request r = full.requests().get(index.get(o.id()));
        p += r.isFlexible() ? (o.value() == null ? 0 : o.value()) : r.priority();
      }
      return p;
    }

    private static double slewOf(List<Observation> obs) {
      return obs.stream().mapToDouble(Observation::slewSeconds).sum();
    }

    /** Scenario seconds of an instant, with the fraction. */
    private double fullSeconds(Instant t) {
      Duration d = Duration.between(full.horizonStart(), t);
      return d.getSeconds() + d.getNano() * 1e-9;
    }

    /** The frozen observations of one resource, in time order. */
    private List<Observation> frozenOn(int resource) {
      return frozen.stream().filter(o -> resourceOf(o) == resource).toList();
    }

    /** Resource r's departure: the later of now and the end of its last frozen observation (the horizon start at the earliest). */
    private Instant departure(int resource) {
      Instant d = now.isBefore(full.horizonStart()) ? full.horizonStart() : now;
      List<Observation> mine = frozenOn(resource);
      if (!mine.isEmpty() && mine.get(mine.size() - 1).end().isAfter(d)) {
        d = mine.get(mine.size() - 1).end();
      }
      return d;
    }

    /** Scenario seconds of resource r's departure, rounded up to a whole second, within the horizon. */
    private long departureS(int resource) {
      return Math.min(full.horizonS(), PlanningProblem.ceilSeconds(full.horizonStart(), departure(resource)));
    }

    /** The available resource that departs first (the first in file order among equals); -1 when none is. */
    private int firstToDepart() {
      int best = -1;
      for (int r = 0; r < resourceCount(); r++) {
        if (!unavailable(r) && (best < 0 || departureS(r) < departureS(best))) {
          best = r;
        }
      }
      return best < 0 ? 0 : best;
    }

    /** Required requests neither frozen nor in the sub-problem's reach (no resource left). */
    private List<String> requiredLeft() {
      return full.requests().stream().filter(q -> q.required() && frozenCount(q.id()) < q.visits().count())
          .map(Request::id).toList();
    }

    /** The remaining requests from each resource's departure to the horizon end. */
    private void buildSubProblem() {
      residual = new Residual();
      List<Integer> keep = new ArrayList<>();
      for (int k = 0; k < full.requests().size(); k++) {
        Request q = full.requests().get(k);
        // Required ones, and those a begun all-or-nothing rule now asks for, are retried all the same.
        boolean dropped = options.dropFailed() && failedIds.contains(q.id()) && !residual.request(q).required();
        if (frozenCount(q.id()) < q.visits().count() && !dropped) {
          keep.add(k);
        }
      }
      subToFull = keep.stream().mapToInt(Integer::intValue).toArray();
      fullToSub = new int[full.requests().size()];
      java.util.Arrays.fill(fullToSub, -1);
      for (int q = 0; q < subToFull.length; q++) {
        fullToSub[subToFull[q]] = q;
      }
      List<Request> requests = new ArrayList<>();
      Set<String> ids = new HashSet<>();
      for (int k : subToFull) {
        requests.add(residual.request(full.requests().get(k)));
        ids.add(full.requests().get(k).id());
      }
      int first = firstToDepart();
      long offsetS = departureS(first);
      TimeWindow h = new TimeWindow(full.horizonStart().plusSeconds(offsetS), full.horizon().end());
      subSectionOf = new int[resourceCount()];
      java.util.Arrays.fill(subSectionOf, -1);
      if (fullSec == null) {
        subSectionOf[0] = 0;
        List<RequestWindows> windows = full.windows().stream().filter(w -> ids.contains(w.id()))
            .map(residual::windows).toList();
        PlanningProblem p = PlanningProblem.of(h, requests, residual.groups(ids), windows,
            departures(full.requestTransitions(), 0, offsetS));
        p = residual.boundFirstMembers(residual.clipFirstVisits(p));
        int last = full.mustBeLastIndex();
        p = last >= 0 && fullToSub[full.structure().requestOf(last)] >= 0 ? p.withMustBeLast(full.task(last).id()) : p;
        sub = p.withPrizes(stabilityPrizes(p));
        return;
      }
      List<Integer> order = new ArrayList<>();
      for (int r = 0; r < resourceCount(); r++) {
        if (!unavailable(r) && r != first) {
          order.add(r);
        }
      }
      if (unavailable(first)) {
        return; // no resource left: nothing to plan (sub stays null)
      }
      order.add(0, first);
      List<String> subIds = new ArrayList<>();
      List<List<RequestWindows>> windows = new ArrayList<>();
      List<Transitions> transitions = new ArrayList<>();
      long[] ready = new long[order.size()];
      for (int i = 0; i < order.size(); i++) {
        int r = order.get(i);
        subSectionOf[r] = i;
        subIds.add(fullSec.resourceId(r));
        String resource = fullSec.resourceId(r);
        windows.add(fullSec.windows(r).stream().filter(w -> ids.contains(w.id()))
            .map(w -> residual.windowsOn(w, resource)).toList());
        transitions.add(departures(fullSec.transitions(r), r, offsetS));
        ready[i] = departureS(r) - offsetS;
      }
      PlanningProblem p = PlanningProblem.ofSections(h, requests, residual.groups(ids), subIds, windows, transitions,
          ready);
      p = residual.boundFirstMembers(residual.clipFirstVisits(p));
      sub = p.withPrizes(stabilityPrizes(p));
    }

    /**
     * What the rules of visits (A4) and groups (A5) ask of the rest of the night, given the frozen
     * observations. A request with visits part done keeps its remaining visits: at least
     * {@code minSeparationS} after the last visit done started (windows clipped), the first of them at most
     * {@code maxSeparationS} after it (that task's latest start clipped), none in a window that holds a done
     * visit ({@code onePerWindow}: those windows removed); all-or-nothing once begun means the rest is
     * required. A group with a member done: all or nothing makes every other member required; ordered
     * means the members after the last one done start after it ends (windows clipped) and the members before
     * it can no longer be observed (windows removed); with {@code maxGapS} and all or nothing the next member
     * (required, so the next scheduled) starts at most that long after it (its latest start clipped); when
     * the group is not all or nothing, whichever member is scheduled first starts at most that long after it
     * ({@link PlanningProblem#withFirstLatestStarts}). A member failed and not retried closes the rest of its
     * all-or-nothing group.
     * The merged night is checked by the validator against the scenario's own rules.
     */
    private final class Residual {
      /** Earliest start (scenario instant) for a request's remaining observations, by id. */
      private final Map<String, Instant> notBefore = new HashMap<>();
      /** Requests that may no longer be observed, with the reason (an ordered group has moved past them, ...). */
      private final Map<String, String> closed = new HashMap<>();
      private final Set<String> mustComplete = new HashSet<>();
      /** Latest start (scenario instant) of a group member next after one done, by id. */
      private final Map<String, Instant> latestStart = new HashMap<>();
      /** Ordered groups with maxGapS part done, not all or nothing: latest start of the first member scheduled. */
      private final Map<String, Instant> firstLatestStart = new HashMap<>();

      Residual() {
        for (Group g : full.groups()) {
          List<String> done = g.members().stream().filter(id -> frozenCount(id) > 0).toList();
          if (done.isEmpty()) {
            continue;
          }
          int lastDone = -1;
          for (int i = 0; i < g.members().size(); i++) {
            lastDone = frozenCount(g.members().get(i)) > 0 ? i : lastDone;
          }
          boolean more = false;
          for (int i = 0; i < g.members().size(); i++) {
            String id = g.members().get(i);
            if (frozenCount(id) > 0) {
              continue;
            }
            if (g.allOrNothing()) {
              mustComplete.add(id);
            }
            if (g.ordered() && i < lastDone) {
              closed.put(id, "group " + g.id() + " is ordered and a later member, " + g.members().get(lastDone)
                  + ", is already observed");
            } else if (g.ordered()) {
              more = true;
              Instant end = lastEnd(g.members().get(lastDone));
              notBefore.merge(id, end, (a, b) -> a.isAfter(b) ? a : b);
            }
          }
          if (g.ordered() && g.maxGapS() != null && more && g.allOrNothing()) {
            // Every remaining member is required, so the next one is the next scheduled: it starts at most
            // maxGapS after the last one done ends.
            String next = g.members().get(lastDone + 1);
            latestStart.put(next, lastEnd(g.members().get(lastDone)).plusNanos(Math.round(g.maxGapS() * 1e9)));
          } else if (g.ordered() && g.maxGapS() != null && more) {
            // Any remaining member may be the next scheduled: the first one present is bounded (the model's rule).
            firstLatestStart.put(g.id(), lastEnd(g.members().get(lastDone)).plusNanos(Math.round(g.maxGapS() * 1e9)));
          }
        }
        for (Group g : full.groups()) {
          // All or nothing, not begun, one member failed and not retried: the others can no longer be observed.
          boolean begun = g.members().stream().anyMatch(id -> frozenCount(id) > 0);
          String gone = g.members().stream().filter(id -> options.dropFailed() && failedIds.contains(id)
              && !full.requests().get(index.get(id)).required()).findFirst().orElse(null);
          if (g.allOrNothing() && !begun && gone != null) {
            for (String id : g.members()) {
              if (!id.equals(gone)) {
                closed.putIfAbsent(id, "group " + g.id() + " is all or nothing and " + gone + " failed and is not "
                    + "retried");
              }
            }
          }
        }
      }

      /** Why request {@code id} may no longer be observed; null when it may. */
      String closedReason(String id) {
        return closed.get(id);
      }

      private Instant lastEnd(String id) {
        return latest(id, Observation::end);
      }

      private Instant lastStart(String id) {
        return latest(id, Observation::start);
      }

      /** The latest of {@code field} over the frozen observations of request {@code id} (null when none). */
      private Instant latest(String id, java.util.function.Function<Observation, Instant> field) {
        Instant out = null;
        for (Observation o : frozen) {
          if (o.id().equals(id) && (out == null || field.apply(o).isAfter(out))) {
            out = field.apply(o);
          }
        }
        return out;
      }

      /** The request's remaining visits, required when its rules now ask for all of them. */
      Request request(Request q) {
        int n = frozenCount(q.id());
        Visits v = q.visits();
        boolean complete = q.required() || mustComplete.contains(q.id()) || (n > 0 && v.allOrNothing());
        Request out = q;
        if (n > 0) {
          out = out.withVisits(new Visits(v.count() - n, v.minSeparationS(), v.maxSeparationS(), v.onePerWindow(),
              v.allOrNothing() && n == 0));
        }
        // A closed request keeps a required flag: it has no window left, so the re-plan says INFEASIBLE.
        return out.withRequired(complete);
      }

      /** The request's windows with what its rules and the frozen observations leave. */
      RequestWindows windows(RequestWindows w) {
        if (closed.containsKey(w.id())) {
          return new RequestWindows(w.id(), List.of());
        }
        Request q = full.requests().get(index.get(w.id()));
        Instant from = notBefore.get(w.id());
        List<Observation> mine = frozen.stream().filter(o -> o.id().equals(w.id())).toList();
        if (!mine.isEmpty() && q.hasVisits()) {
          Instant sep = lastStart(w.id()).plusNanos(Math.round(q.visits().minSeparationS() * 1e9));
          from = from == null || sep.isAfter(from) ? sep : from;
        }
        List<TimeWindow> out = new ArrayList<>();
        List<TimeWindow> passes = q.visits().onePerWindow() ? passesDone(w.id(), mine) : List.of();
        for (TimeWindow t : w.intervals()) {
          boolean holdsDone = q.visits().onePerWindow()
              && (mine.stream().anyMatch(o -> o.start().isBefore(t.end()) && t.start().isBefore(o.end()))
              || passes.stream().anyMatch(x -> !x.start().isAfter(t.end()) && !t.start().isAfter(x.end())));
          if (holdsDone || from != null && !t.end().isAfter(from)) {
            continue;
          }
          out.add(from != null && t.start().isBefore(from) ? new TimeWindow(from, t.end()) : t);
        }
        return new RequestWindows(w.id(), out);
      }

      /**
       * {@link #windows(RequestWindows)} on {@code resource} (A6): none there when the request's group keeps its
       * members on one resource and a member is already observed (done or running) on another.
       */
      RequestWindows windowsOn(RequestWindows w, String resource) {
        for (Group g : full.groups()) {
          if (g.sameResource() && g.members().contains(w.id()) && frozen.stream()
              .anyMatch(o -> g.members().contains(o.id()) && o.resource() != null && !o.resource().equals(resource))) {
            return new RequestWindows(w.id(), List.of());
          }
        }
        return windows(w);
      }

      /**
       * With several resources (A4, A6), the windows of request {@code id} on every resource merged (joined
       * across gaps under a second, as the planner's {@code Structure} does) that hold a visit done: one per
       * window counts each of them as used on every resource. Empty with one resource.
       */
      private List<TimeWindow> passesDone(String id, List<Observation> done) {
        if (fullSec == null || done.isEmpty()) {
          return List.of();
        }
        List<TimeWindow> all = new ArrayList<>();
        for (int r = 0; r < fullSec.count(); r++) {
          fullSec.windows(r).stream().filter(x -> x.id().equals(id)).forEach(x -> all.addAll(x.intervals()));
        }
        all.sort(java.util.Comparator.comparing(TimeWindow::start));
        List<TimeWindow> merged = new ArrayList<>();
        for (TimeWindow t : all) {
          TimeWindow last = merged.isEmpty() ? null : merged.get(merged.size() - 1);
          if (last != null && !t.start().isAfter(last.end().plusSeconds(1))) {
            merged.set(merged.size() - 1, new TimeWindow(last.start(), t.end().isAfter(last.end()) ? t.end() : last.end()));
          } else {
            merged.add(t);
          }
        }
        return merged.stream().filter(x -> done.stream().anyMatch(o -> o.start().isBefore(x.end())
            && x.start().isBefore(o.end()))).toList();
      }

      /** The scenario's groups over the requests still to plan, each as its rules now read. */
      List<Group> groups(Set<String> ids) {
        List<Group> out = new ArrayList<>();
        for (Group g : full.groups()) {
          List<String> rest = g.members().stream().filter(ids::contains).filter(id -> !closed.containsKey(id)).toList();
          boolean begun = g.members().stream().anyMatch(id -> frozenCount(id) > 0);
          if (!rest.isEmpty()) {
            out.add(new Group(g.id(), rest, g.allOrNothing() && !begun, g.ordered(), g.maxGapS(), g.sameResource()));
          }
        }
        return out;
      }

      /** {@code p} with the first-member latest starts of {@link #firstLatestStart}, in whole seconds of its clock. */
      PlanningProblem boundFirstMembers(PlanningProblem p) {
        if (firstLatestStart.isEmpty()) {
          return p;
        }
        Map<String, Long> s = new HashMap<>();
        firstLatestStart.forEach((id, t) -> s.put(id,
            (long) Math.floor(Duration.between(p.horizonStart(), t).toNanos() * 1e-9 + 1e-9)));
        return p.withFirstLatestStarts(s);
      }

      /**
       * Latest starts: the first remaining visit of each request part done with {@code maxSeparationS}, and the
       * member next after the last one done of an all-or-nothing ordered group with {@code maxGapS}.
       */
      PlanningProblem clipFirstVisits(PlanningProblem p) {
        List<Task> tasks = new ArrayList<>(p.tasks());
        boolean changed = false;
        for (int k = 0; k < tasks.size(); k++) {
          if (p.isMarker(k)) {
            continue;
          }
          Request q = p.requests().get(p.structure().requestOf(k));
          Request original = full.requests().get(index.get(q.id()));
          Double max = original.visits().maxSeparationS();
          boolean firstLeft = p.structure().visitOf(k) == 1; // on whichever resource
          Instant latest = null;
          String why = null;
          if (max != null && firstLeft && frozenCount(q.id()) > 0) {
            latest = lastStart(q.id()).plusNanos(Math.round(max * 1e9));
            why = "no window within maxSeparationS of the last visit done";
          } else if (latestStart.containsKey(q.id())) {
            latest = latestStart.get(q.id());
            why = "no window within its group's maxGapS of the member done before it";
          }
          if (latest != null) {
            long s = (long) Math.floor(Duration.between(p.horizonStart(), latest).toNanos() * 1e-9 + 1e-9)
                + (p.sections() == null ? 0 : p.sections().offsetS(p.sections().sectionOf(k)));
            tasks.set(k, tasks.get(k).withLatestStart(s, why));
            changed = true;
          }
        }
        return changed ? p.withTasks(tasks) : p;
      }
    }

    /** Resource r's transitions (indexed by request) from its frozen observations on, on the sub-problem's clock. */
    private DepartureTransitions departures(Transitions requestTransitions, int resource, long offsetS) {
      List<Observation> mine = frozenOn(resource);
      int[] fo = new int[mine.size()];
      double[] fd = new double[mine.size()];
      double[] fa = new double[mine.size()];
      for (int q = 0; q < mine.size(); q++) {
        fo[q] = index.get(mine.get(q).id());
        fd[q] = q == 0 ? 0.0 : fullSeconds(mine.get(q - 1).end());
        fa[q] = fullSeconds(mine.get(q).start());
      }
      double fromEndS = mine.isEmpty() ? 0.0 : fullSeconds(mine.get(mine.size() - 1).end());
      return new DepartureTransitions(requestTransitions, subToFull, fo, fd, fa, fromEndS, offsetS);
    }

    /**
     * The sub-problem task of a previous observation: its request's option on its resource, or (visits) the
     * request's remaining visit of the same rank among its tail observations; -1 when none.
     */
    private int subTask(PlanningProblem p, Observation o) {
      int q = fullToSub[index.get(o.id())];
      if (q < 0) {
        return -1;
      }
      Sections sec = p.sections();
      int rank = 0;
      for (Observation t : tail) {
        if (t == o) {
          break;
        }
        rank += t.id().equals(o.id()) ? 1 : 0;
      }
      if (sec == null) {
        for (int k = 0; k < p.size(); k++) {
          if (p.structure().requestOf(k) == q && rank-- == 0) {
            return k;
          }
        }
        return -1;
      }
      int section = subSectionOf[resourceOf(o)];
      for (int k : sec.requestOptions(q)) {
        if (sec.sectionOf(k) == section && p.structure().visitOf(k) == rank + 1) {
          return k; // the remaining visit of that rank (visits are numbered in time order on every resource)
        }
      }
      return -1;
    }

    /** The tail observations of each sub-problem section, in section order. */
    private List<List<Observation>> tailBySection(PlanningProblem p) {
      int sections = p.sections() == null ? 1 : p.sections().count();
      List<List<Observation>> out = new ArrayList<>();
      for (int i = 0; i < sections; i++) {
        out.add(new ArrayList<>());
      }
      for (Observation o : tail) {
        int i = subSectionOf[resourceOf(o)];
        if (i >= 0) {
          out.get(i).add(o);
        }
      }
      return out;
    }

    /** The sub-problem's objective with the stability bonuses of the class comment (none when switched off or too large). */
    private Prizes stabilityPrizes(PlanningProblem p) {
      Prizes plain = p.prizes();
      if (tail.isEmpty() || (!options.lexicographic() && options.stabilityWeight() == 0)) {
        return plain;
      }
      List<long[]> arcs = new ArrayList<>();
      long[] bonus = new long[p.size()];
      List<List<Observation>> bySection = tailBySection(p);
      for (int i = 0; i < bySection.size(); i++) {
        // Each section opens at the last frozen observation of its resource (or its start pointing): START for
        // the first, its marker for the others. The pair from it to the first tail request counts too; a request
        // no longer in the sub-problem breaks the chain.
        int prev = i == 0 ? Transitions.START : p.sections().markerOf(i);
        boolean linked = true;
        for (Observation o : bySection.get(i)) {
          int k = subTask(p, o);
          if (k < 0) {
            linked = false;
            continue;
          }
          bonus[k] = 1;
          if (linked) {
            arcs.add(new long[] {prev, k, 1});
          }
          prev = k;
          linked = true;
        }
      }
      long multiplier;
      long unit;
      if (options.lexicographic()) {
        multiplier = tail.size() + arcs.size() + 1L;
        unit = 1;
      } else {
        double wScaled = options.stabilityWeight() * plain.factor();
        multiplier = Math.abs(wScaled - Math.rint(wScaled)) < 1e-9 ? 1 : 1000;
        unit = Math.round(wScaled * multiplier);
      }
      double maxPrize = 0;
      for (int k = 0; k < p.size(); k++) {
        maxPrize = Math.max(maxPrize, plain.maxPrize(k));
      }
      if ((maxPrize * multiplier + unit) * Math.max(1, p.size()) * 2 > MAX_OBJECTIVE) {
        notes.append("stability is not weighed in the objective here (priorities too large); the rest of the previous "
            + "plan is still the warm start. ");
        return plain;
      }
      for (int k = 0; k < bonus.length; k++) {
        bonus[k] *= unit;
      }
      for (long[] a : arcs) {
        a[2] = unit;
      }
      return plain.withBonuses(multiplier, bonus, arcs);
    }

    /**
     * The tail as a plan of the sub-problem: its requests in order at their previous starts and exposures,
     * section by section with each marker at its pin (the incumbent times it exactly and leaves out what no
     * longer fits).
     */
    private Plan tailPlan() {
      List<long[]> rows = new ArrayList<>();
      Sections sec = sub.sections();
      List<List<Observation>> bySection = tailBySection(sub);
      for (int i = 0; i < bySection.size(); i++) {
        long offset = sec == null ? 0 : sec.offsetS(i);
        if (i > 0) {
          int marker = sec.markerOf(i);
          rows.add(new long[] {marker, sub.task(marker).earliestStartS(), 0});
        }
        for (Observation o : bySection.get(i)) {
          int k = subTask(sub, o);
          if (k < 0 || !sub.task(k).schedulable()) {
            continue;
          }
          Task t = sub.task(k);
          long s = Math.max(0, PlanningProblem.ceilSeconds(sub.horizonStart(), o.start())) + offset;
          long d = Math.round(o.durationS());
          try {
            t.option(d);
          } catch (IllegalStateException e) {
            d = t.durationS(); // an exposure the scenario no longer offers: the shortest one
          }
          rows.add(new long[] {k, s, d});
        }
      }
      int[] order = rows.stream().mapToInt(r -> (int) r[0]).toArray();
      long[] starts = rows.stream().mapToLong(r -> r[1]).toArray();
      long[] durs = rows.stream().mapToLong(r -> r[2]).toArray();
      return new Plan(order, starts, durs);
    }

    /**
     * "R|A->B" for each consecutive pair of one resource R, the resource's last frozen observation (or START)
     * before its first included.
     */
    private Set<String> successorArcs(List<Observation> seq) {
      Set<String> out = new HashSet<>();
      Map<String, String> prev = new HashMap<>();
      for (Observation o : frozen) {
        prev.put(String.valueOf(o.resource()), o.id());
      }
      for (Observation o : seq) {
        String r = String.valueOf(o.resource());
        out.add(r + "|" + prev.getOrDefault(r, "\u0000START") + "->" + o.id());
        prev.put(r, o.id());
      }
      return out;
    }

    /** The sequencer's plan after the frozen observations, with its status and the whole night's bound. */
    private Timeline mergedFrom(SequencerResult r, double frozenPriority) {
      List<Observation> planned = new ArrayList<>();
      for (SequencerResult.Planned p : r.observations()) {
        planned.add(new Observation(p.id(), p.start(), p.end(), p.transitionS(), p.value(), Observation.PLANNED,
            null, null, null, p.resource()));
      }
      Map<String, Integer> in = new HashMap<>();
      planned.forEach(o -> in.merge(o.id(), 1, Integer::sum));
      List<Observation> obs = new ArrayList<>(frozen);
      obs.addAll(planned);
      obs = renumbered(obs);
      double bound = Double.isNaN(r.boundPriority()) ? Double.NaN : frozenPriority + r.boundPriority();
      double priority = frozenPriority + r.totalPriority();
      return new Timeline(r.status(), priority, slewOf(frozen) + r.totalTransitionS(),
          Double.isNaN(bound) ? null : Math.max(bound, priority), obs, unscheduled(in, null, r.unscheduled()));
    }

    /** The frozen observations only (nothing left to plan). */
    private Timeline merged(List<Observation> planned, PlanStatus status, double frozenPriority) {
      List<Observation> obs = new ArrayList<>(frozen);
      obs.addAll(planned);
      return new Timeline(status, frozenPriority, slewOf(frozen), frozenPriority, obs,
          unscheduled(Map.of(), null, List.of()));
    }

    /** The tasks of request k of {@code p} (its options with several resources), {@code q} its index there. */
    private static List<Task> tasksOf(PlanningProblem p, int q) {
      if (p.sections() == null) {
        List<Task> out = new ArrayList<>();
        for (int k = 0; k < p.size(); k++) {
          if (p.structure().requestOf(k) == q) {
            out.add(p.task(k)); // its visits
          }
        }
        return out;
      }
      List<Task> out = new ArrayList<>();
      for (int k : p.sections().requestOptions(q)) {
        out.add(p.task(k)); // every visit's option on every resource
      }
      return out;
    }

    /**
     * Every request neither frozen nor in {@code planned}, with its reason: the sequencer's when it gives one
     * ({@code fromSequencer}), else {@code notPlannedReason}, else dropped as failed / no window left / only
     * unavailable resources left.
     */
    private List<Unscheduled> unscheduled(Map<String, Integer> plannedCount, String notPlannedReason,
        List<Unscheduled> fromSequencer) {
      Map<String, String> given = new HashMap<>();
      fromSequencer.forEach(u -> given.put(u.id(), u.reason()));
      Map<String, Integer> observed = new HashMap<>();
      frozen.forEach(o -> observed.merge(o.id(), 1, Integer::sum));
      plannedCount.forEach((id, n) -> observed.merge(id, n, Integer::sum));
      List<Unscheduled> out = new ArrayList<>();
      for (int k = 0; k < full.requests().size(); k++) {
        Request request = full.requests().get(k);
        String id = request.id();
        int n = observed.getOrDefault(id, 0);
        if (n >= request.visits().count()) {
          continue;
        }
        Integer missing = request.hasVisits() ? request.visits().count() - n : null;
        List<Task> mine = tasksOf(full, k);
        boolean everSchedulable = mine.stream().anyMatch(Task::schedulable);
        int q = fullToSub[k]; // set with the sub-problem, before any timeline is built
        String reason;
        String closedWhy = residual == null ? null : residual.closedReason(id);
        if (q < 0) {
          reason = FAILED_DROPPED;
        } else if (closedWhy != null) {
          reason = closedWhy;
        } else if (sub == null || tasksOf(sub, q).stream().noneMatch(Task::schedulable)) {
          reason = !everSchedulable ? mine.get(0).emptyReason()
              : onlyUnavailable(k) ? RESOURCES_UNAVAILABLE : NO_TIME_LEFT;
        } else if (notPlannedReason != null) {
          reason = notPlannedReason;
        } else {
          reason = given.getOrDefault(id, Reasons.LOST_TO_CONFLICTS);
        }
        out.add(new Unscheduled(id, reason, missing));
      }
      return out;
    }

    /** Required requests still to observe that only unavailable resources could observe. */
    private List<String> requiredOnlyOnUnavailable() {
      Set<String> frozenIds = new HashSet<>();
      frozen.forEach(o -> frozenIds.add(o.id()));
      List<String> out = new ArrayList<>();
      for (int k = 0; k < full.requests().size(); k++) {
        Request q = full.requests().get(k);
        if (q.required() && !frozenIds.contains(q.id()) && tasksOf(full, k).stream().anyMatch(Task::schedulable)
            && onlyUnavailable(k)) {
          out.add(q.id());
        }
      }
      return out;
    }

    /** True when every resource on which full request k can be scheduled at all is unavailable. */
    private boolean onlyUnavailable(int k) {
      if (fullSec == null || options.unavailable().isEmpty()) {
        return false;
      }
      for (int o : fullSec.requestOptions(k)) {
        if (full.task(o).schedulable() && !unavailable(fullSec.sectionOf(o))) {
          return false;
        }
      }
      return true;
    }
  }
}
