package dev.sequencer.sequence;

import dev.sequencer.model.Group;
import dev.sequencer.model.Request;
import dev.sequencer.model.Visits;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.slew.Transitions;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/**
 * A synthetic 10-hour night: n requests at random sky positions (uniform on the sphere), 2–3 visibility
 * windows each (30 min to 3 h), durations 5–20 min, priorities 1–10 (integers), and a matrix of
 * eigenaxis-like slew times: 30 s settle + angle / (1 deg/s) + 20 s for the accelerate/decelerate ramps
 * (a rest-to-rest slew with 0.05 deg/s² reaches 1 deg/s after 20 s); 0 between identical positions.
 */
public final class NightScenario {
  public static final Instant T0 = Instant.parse("2031-05-04T20:00:00Z");
  public static final long NIGHT_S = 36_000;

  private NightScenario() {}

  /** The scenario as a planning problem; same (n, seed), same problem. */
  public static PlanningProblem generate(int n, long seed) {
    Random rnd = new Random(seed);
    double[][] xyz = new double[n + 1][];
    for (int k = 0; k <= n; k++) {
      double z = 2 * rnd.nextDouble() - 1;
      double phi = 2 * Math.PI * rnd.nextDouble();
      double r = Math.sqrt(1 - z * z);
      xyz[k] = new double[] {r * Math.cos(phi), r * Math.sin(phi), z};
    }
    List<Request> requests = new ArrayList<>();
    List<RequestWindows> windows = new ArrayList<>();
    for (int k = 0; k < n; k++) {
      String id = "R" + (k + 1);
      double dur = 60 * (5 + rnd.nextInt(16));
      double prio = 1 + rnd.nextInt(10);
      requests.add(new Request(id, null, dur, prio, false, List.of(), null));
      int count = 2 + rnd.nextInt(2);
      List<TimeWindow> w = new ArrayList<>();
      long slot = NIGHT_S / count;
      for (int q = 0; q < count; q++) {
        long len = 1800 + rnd.nextInt(3 * 3600 - 1800);
        len = Math.min(len, slot - 60);
        long a = q * slot + rnd.nextInt((int) Math.max(1, slot - len));
        w.add(new TimeWindow(T0.plusSeconds(a), T0.plusSeconds(a + len)));
      }
      windows.add(new RequestWindows(id, w));
    }
    double[][] m = new double[n][n];
    double[] fromStart = new double[n];
    for (int i = 0; i < n; i++) {
      fromStart[i] = slew(xyz[n], xyz[i]);
      for (int j = 0; j < n; j++) {
        m[i][j] = i == j ? 0 : slew(xyz[i], xyz[j]);
      }
    }
    return PlanningProblem.of(new TimeWindow(T0, T0.plusSeconds(NIGHT_S)), requests, windows,
        Transitions.matrix(m, fromStart));
  }

  /**
   * The night of {@link #generate} as a queue with rules (format additions A4, A5; the benchmark of issue 16):
   * every fifth request asks for 3 visits 40 min to 3 h apart (20 %), and 10 chains calibrator → science →
   * calibrator, ordered, all or nothing, at most 10 min between members, each chain's two calibrators (other
   * requests of the night, 5 min, priority 1) given the science request's windows. Same (n, seed), same problem.
   */
  public static PlanningProblem cadence(int n, long seed) {
    PlanningProblem base = generate(n, seed);
    List<Request> requests = new ArrayList<>(base.requests());
    List<RequestWindows> windows = new ArrayList<>(base.windows());
    for (int k = 0; k < n; k += 5) {
      requests.set(k, requests.get(k).withVisits(new Visits(3, 2400, 10800.0, false, false)));
    }
    List<Group> groups = new ArrayList<>();
    int chains = 0;
    for (int k = 1; k + 2 < n && chains < 10; k += 5 * Math.max(1, n / 50)) {
      Request science = requests.get(k + 1);
      for (int c : new int[] {k, k + 2}) {
        Request cal = requests.get(c);
        requests.set(c, new Request(cal.id(), null, 300.0, 1.0, false, List.of(), null));
        windows.set(c, new RequestWindows(cal.id(), windows.get(k + 1).intervals()));
      }
      groups.add(new Group("CHAIN" + (++chains), List.of(requests.get(k).id(), science.id(), requests.get(k + 2).id()),
          true, true, 600.0, false));
    }
    return PlanningProblem.of(base.horizon(), requests, groups, windows, base.requestTransitions());
  }

  /**
   * The same night seen from {@code sites} telescopes of one network (several resources, A6): the requests,
   * positions and slew table of {@link #generate} (identical telescopes), and per site its own 2–3 windows
   * per request drawn as in {@link #generate} from a seed of its own (a site at another longitude sees each
   * target at other times); one request in five is not visible from a site at all. Same (n, sites, seed),
   * same problem. {@code result[r]} is the problem of site r alone; {@code result[sites]} the joint one.
   */
  public static PlanningProblem[] network(int n, int sites, long seed) {
    PlanningProblem base = generate(n, seed);
    List<String> ids = new ArrayList<>();
    List<List<RequestWindows>> windows = new ArrayList<>();
    List<Transitions> transitions = new ArrayList<>();
    PlanningProblem[] out = new PlanningProblem[sites + 1];
    for (int r = 0; r < sites; r++) {
      Random rnd = new Random(seed * 31 + r + 1);
      List<RequestWindows> mine = new ArrayList<>();
      for (Request q : base.requests()) {
        if (rnd.nextInt(5) == 0) {
          continue;
        }
        int count = 2 + rnd.nextInt(2);
        List<TimeWindow> w = new ArrayList<>();
        long slot = NIGHT_S / count;
        for (int i = 0; i < count; i++) {
          long len = Math.min(1800 + rnd.nextInt(3 * 3600 - 1800), slot - 60);
          long a = i * slot + rnd.nextInt((int) Math.max(1, slot - len));
          w.add(new TimeWindow(T0.plusSeconds(a), T0.plusSeconds(a + len)));
        }
        mine.add(new RequestWindows(q.id(), w));
      }
      ids.add("site" + (r + 1));
      windows.add(mine);
      transitions.add(base.transitions());
      out[r] = PlanningProblem.of(base.horizon(), base.requests(), mine, base.transitions());
    }
    out[sites] = PlanningProblem.ofSections(base.horizon(), base.requests(), ids, windows, transitions);
    return out;
  }

  private static double slew(double[] a, double[] b) {
    double dot = Math.max(-1, Math.min(1, a[0] * b[0] + a[1] * b[1] + a[2] * b[2]));
    double angleDeg = Math.toDegrees(Math.acos(dot));
    return angleDeg < 1e-9 ? 0 : 30 + 20 + angleDeg / 1.0;
  }
}
