package dev.sequencer.planner;

import dev.sequencer.model.Observation;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Timeline;
import dev.sequencer.slew.Transitions;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.hipparchus.geometry.euclidean.threed.Vector3D;

/**
 * Writes each planned slew's departure ({@code slewStart}) and waypoints ({@code slewVia}) into a timeline
 * (spec A3), from the same {@link Transitions#slew} the planner timed it with: whenever keep-outs during
 * slews are on for an eigenaxis model. Observations already done or running keep what they carry.
 * Directions are written as RA/Dec of the GCRF unit vectors (GCRF and ICRS axes agree to milliarcseconds).
 */
final class SlewPaths {
  private SlewPaths() {}

  static Timeline annotate(Scenario s, Transitions tr, Timeline t) {
    if (!s.slew().keepOutDuringSlew() || !"eigenaxis".equals(s.slew().model()) || s.observer() == null) {
      return t;
    }
    Map<String, Integer> index = new HashMap<>();
    for (int k = 0; k < s.requests().size(); k++) {
      index.put(s.requests().get(k).id(), k);
    }
    Instant origin = s.horizon().start();
    List<Observation> out = new ArrayList<>();
    int prev = Transitions.START;
    double prevEndS = 0;
    for (Observation o : t.observations()) {
      Integer k = index.get(o.id());
      boolean frozen = Observation.DONE.equals(o.state()) || Observation.RUNNING.equals(o.state());
      double startS = seconds(origin, o.start());
      if (k == null || frozen) {
        out.add(o);
      } else {
        Transitions.Slew slew = tr.slew(prev, k, prevEndS, startS);
        if (Double.isNaN(slew.seconds())) {
          out.add(o);
        } else {
          List<RaDec> via = slew.via().stream().map(SlewPaths::raDec).toList();
          long ms = Math.round(slew.departureS() * 1000);
          out.add(o.withSlew(origin.plusMillis(ms).isAfter(o.start()) ? o.start() : origin.plusMillis(ms), via));
        }
      }
      if (k != null) {
        prev = k;
      }
      prevEndS = seconds(origin, o.end());
    }
    return new Timeline(t.status(), t.priority(), t.slewSeconds(), t.bound(), out, t.unscheduled());
  }

  /**
   * {@link #annotate(Scenario, Transitions, Timeline)} for several resources (A6): each resource's
   * observations, in time order, with its own view of the scenario and its transitions ({@code perResource}
   * in the file order of the resources); the timeline's order is kept.
   */
  static Timeline annotate(Scenario s, List<Transitions> perResource, Timeline t) {
    List<Observation> out = new ArrayList<>(t.observations());
    for (int r = 0; r < s.resources().size(); r++) {
      String id = s.resources().get(r).id();
      List<Integer> at = new ArrayList<>();
      List<Observation> mine = new ArrayList<>();
      for (int q = 0; q < out.size(); q++) {
        if (id.equals(out.get(q).resource())) {
          at.add(q);
          mine.add(out.get(q));
        }
      }
      Timeline part = annotate(s.forResource(s.resources().get(r)), perResource.get(r),
          new Timeline(t.status(), 0, 0, null, mine, List.of()));
      for (int i = 0; i < at.size(); i++) {
        out.set(at.get(i), part.observations().get(i));
      }
    }
    return new Timeline(t.status(), t.priority(), t.slewSeconds(), t.bound(), out, t.unscheduled());
  }

  private static double seconds(Instant origin, Instant t) {
    return java.time.Duration.between(origin, t).toNanos() * 1e-9;
  }

  private static RaDec raDec(Vector3D u) {
    double ra = Math.toDegrees(Math.atan2(u.getY(), u.getX()));
    return new RaDec(ra < 0 ? ra + 360 : ra, Math.toDegrees(Math.asin(Math.max(-1, Math.min(1, u.getZ())))));
  }
}
