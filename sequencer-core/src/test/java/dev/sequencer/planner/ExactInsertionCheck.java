package dev.sequencer.planner;

import dev.sequencer.model.Observation;
import dev.sequencer.model.Request;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import dev.sequencer.model.Unscheduled;
import dev.sequencer.validate.PlanValidator;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The test side of "lost to conflicts": tries to insert an unscheduled request into a timeline at the
 * earliest second its exact slew allows in each gap and window, the other observations unchanged, and asks
 * the validator. The candidate start comes from the slew models' exact legs ({@code Transitions.exactS}),
 * shared with the planner (not an outside check); the verdict is the validator's.
 */
public final class ExactInsertionCheck {
  private ExactInsertionCheck() {}

  /**
   * A description of an insertion of request {@code id} that the validator accepts, or null when none:
   * for each gap and each window, the earliest second at which the exact slew from the previous
   * observation arrives, the other observations unchanged (their slews recomputed).
   */
  public static String insertionThatFits(Scenario s, Geometry g, PlanValidator validator, Timeline t, String id) {
    int k = indexOf(s, id);
    Request req = s.requests().get(k);
    long d = Math.round(req.minDurationS());
    Map<String, Integer> index = new HashMap<>();
    for (int i = 0; i < s.requests().size(); i++) {
      index.put(s.requests().get(i).id(), i);
    }
    List<TimeWindow> windows = g.windows().stream().filter(w -> w.id().equals(id)).findFirst()
        .map(RequestWindows::intervals).orElse(List.of());
    List<Observation> obs = t.observations();
    Instant t0 = s.horizon().start();
    for (int q = 0; q <= obs.size(); q++) {
      Instant gapStart = q == 0 ? t0 : obs.get(q - 1).end();
      Instant gapEnd = q == obs.size() ? s.horizon().end() : obs.get(q).start();
      for (TimeWindow w : windows) {
        Instant from = w.start().isAfter(gapStart) ? w.start() : gapStart;
        long sec = (long) Math.ceil(seconds(t0, from) - 1e-9);
        for (int step = 0; step < 200; step++) {
          Instant start = t0.plusSeconds(sec);
          if (start.plusSeconds(d).isAfter(w.end()) || start.plusSeconds(d).isAfter(gapEnd)) {
            break;
          }
          double[] legs = legs(s, g, t, q, k, start, start.plusSeconds(d), index);
          double leg = legs[q];
          if (!(leg < Double.POSITIVE_INFINITY)) {
            sec++;
            continue;
          }
          double arrive = seconds(t0, gapStart) + leg;
          if (arrive > sec + 1e-6) {
            sec = Math.max(sec + 1, (long) Math.ceil(arrive - 1e-6));
            continue;
          }
          if (!java.util.Arrays.stream(legs).allMatch(x -> x < Double.POSITIVE_INFINITY)) {
            break; // a later leg became impossible (the mount's cable wrap): no insertion here
          }
          Timeline candidate = inserted(s, t, q, req, start, start.plusSeconds(d), legs, index);
          if (validator.violations(candidate).isEmpty()) {
            return "the validator accepts it at " + start + " before " + (q < obs.size() ? obs.get(q).id() : "the end");
          }
          break;
        }
      }
    }
    return null;
  }

  /** The exact legs of the plan with request k at [start, end] before position q (the others unchanged). */
  private static double[] legs(Scenario s, Geometry g, Timeline t, int q, int k, Instant start, Instant end,
      Map<String, Integer> index) {
    List<Instant[]> times = new ArrayList<>();
    List<Integer> order = new ArrayList<>();
    for (Observation o : t.observations()) {
      times.add(new Instant[] {o.start(), o.end()});
      order.add(index.get(o.id()));
    }
    times.add(q, new Instant[] {start, end});
    order.add(q, k);
    Instant t0 = s.horizon().start();
    int m = order.size();
    int[] o = new int[m];
    double[] dep = new double[m];
    double[] arr = new double[m];
    for (int i = 0; i < m; i++) {
      o[i] = order.get(i);
      dep[i] = i == 0 ? 0 : seconds(t0, times.get(i - 1)[1]);
      arr[i] = seconds(t0, times.get(i)[0]);
    }
    return g.transitions().exactS(o, dep, arr);
  }

  /** The timeline with {@code req} at [start, end] before position q and the slews {@code legs}. */
  private static Timeline inserted(Scenario s, Timeline t, int q, Request req, Instant start, Instant end,
      double[] legs, Map<String, Integer> index) {
    List<Observation> obs = new ArrayList<>(t.observations());
    Double value = req.isFlexible() ? req.flexible().valueAt(req.minDurationS()) : null;
    obs.add(q, new Observation(req.id(), start, end, 0, value, null));
    List<Observation> out = new ArrayList<>();
    double slew = 0;
    double priority = 0;
    for (int i = 0; i < obs.size(); i++) {
      Observation o = obs.get(i);
      out.add(new Observation(o.id(), o.start(), o.end(), legs[i], o.value(), o.state()));
      slew += legs[i];
      Request r = s.requests().get(index.get(o.id()));
      priority += r.isFlexible() ? o.value() : r.priority();
    }
    List<Unscheduled> unscheduled = t.unscheduled().stream().filter(u -> !u.id().equals(req.id())).toList();
    return new Timeline(t.status(), priority, slew, t.bound(), out, unscheduled);
  }

  private static int indexOf(Scenario s, String id) {
    for (int i = 0; i < s.requests().size(); i++) {
      if (s.requests().get(i).id().equals(id)) {
        return i;
      }
    }
    throw new IllegalArgumentException(id);
  }

  private static double seconds(Instant t0, Instant t) {
    Duration d = Duration.between(t0, t);
    return d.getSeconds() + d.getNano() * 1e-9;
  }
}
