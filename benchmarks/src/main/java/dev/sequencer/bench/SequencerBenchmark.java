package dev.sequencer.bench;

import dev.sequencer.sequence.DumasInstance;
import dev.sequencer.sequence.NightScenario;
import dev.sequencer.sequence.OptwInstance;
import dev.sequencer.sequence.bound.BucketRelaxation;
import dev.sequencer.sequence.bound.NgRouteRelaxation;
import dev.sequencer.sequence.timing.ArcCosts;
import dev.sequencer.sequence.problem.PlanningProblem;
import dev.sequencer.sequence.Sequencer;
import dev.sequencer.sequence.SequencerOptions;
import dev.sequencer.sequence.SequencerResult;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;

/**
 * Solver runs (not JMH): {@code dumas <timeLimitS> [prefix]} plans every Dumas n20–n60 instance and
 * compares travel with the published values; {@code night <n> <timeLimitS> <seed> [variant]} plans a
 * synthetic night and prints priority vs greedy, bound, gap, arcs, times and peak heap. Variants switch
 * one scale feature off: {@code full} (default), {@code nohint}, {@code allarcs}, {@code nolns},
 * {@code nobound}.
 */
public final class SequencerBenchmark {
  private SequencerBenchmark() {}

  public static void main(String[] args) throws Exception {
    Locale.setDefault(Locale.ROOT);
    switch (args[0]) {
      case "dumas" -> dumas(Double.parseDouble(args[1]), args.length > 2 ? args[2] : "n");
      case "network" -> network(Integer.parseInt(args[1]), Integer.parseInt(args[2]), Double.parseDouble(args[3]),
          Long.parseLong(args[4]));
      case "team1" -> teamOne(Double.parseDouble(args[1]), Integer.parseInt(args[2]), args.length > 3 ? args[3] : "");
      case "team" -> team(Double.parseDouble(args[1]), args.length > 2 ? args[2] : "");
      case "optw" -> optw(Double.parseDouble(args[1]), args.length > 2 ? args[2] : "");
      case "optwbound" -> optwBound(Double.parseDouble(args[1]), Integer.parseInt(args[2]), args.length > 3 ? args[3] : "");
      case "cadence" -> cadence(Integer.parseInt(args[1]), Double.parseDouble(args[2]), Long.parseLong(args[3]));
      case "night" -> night(Integer.parseInt(args[1]), Double.parseDouble(args[2]), Long.parseLong(args[3]),
          args.length > 4 ? args[4] : "full");
      default -> throw new IllegalArgumentException("usage: dumas <timeLimitS> [prefix] | team <timeLimitS> [prefix] | team1 <timeLimitS> <m> [prefix] | network <n> <sites> <timeLimitS> <seed> | optw <timeLimitS> [prefix] | optwbound <timeLimitS> <ngSize> [prefix] | night <n> <timeLimitS> <seed> [variant] | cadence <n> <timeLimitS> <seed>");
    }
  }

  private static void dumas(double timeLimitS, String prefix) throws Exception {
    Path folder = DumasInstance.folder();
    if (folder == null) {
      throw new IllegalStateException("shared/benchmarks/tsptw/dumas not found");
    }
    Map<String, Long> best = DumasInstance.bestKnownTravel(folder.resolve("best-known.csv"));
    List<Path> files;
    try (Stream<Path> s = Files.list(folder)) {
      files = s.filter(f -> f.getFileName().toString().startsWith(prefix) && f.toString().endsWith(".tsptw"))
          .sorted().toList();
    }
    List<Double> times = new ArrayList<>();
    int matched = 0;
    for (Path f : files) {
      DumasInstance inst = DumasInstance.read(f);
      PlanningProblem p = inst.toProblem();
      long t0 = System.nanoTime();
      SequencerResult r = new Sequencer().plan(p, SequencerOptions.defaults().withTimeLimitS(timeLimitS).withWorkers(2));
      double s = (System.nanoTime() - t0) * 1e-9;
      times.add(s);
      long published = best.get(inst.name());
      boolean ok = r.hasPlan() && Math.round(r.totalTransitionS()) == published;
      matched += ok ? 1 : 0;
      System.out.printf("%-12s %-19s travel %6s published %5d %s %6.2f s%n", inst.name(), r.status(),
          r.hasPlan() ? String.valueOf(Math.round(r.totalTransitionS())) : "-", published, ok ? "OK  " : "MISS", s);
    }
    times.sort(Double::compare);
    System.out.printf("dumas: %d/%d at the published optimum; median %.2f s, worst %.2f s (limit %.0f s, 2 workers)%n",
        matched, files.size(), times.get(times.size() / 2), times.get(times.size() - 1), timeLimitS);
  }

  private static List<Path> optwFiles(String prefix) throws Exception {
    Path folder = OptwInstance.folder();
    if (folder == null) {
      throw new IllegalStateException("shared/benchmarks/optw not found");
    }
    try (Stream<Path> s = Files.list(folder.resolve("solomon"))) {
      return s.filter(f -> f.getFileName().toString().startsWith(prefix) && f.toString().endsWith(".txt")).sorted().toList();
    }
  }

  /**
   * Plans every OPTW 1-series instance (29) and compares the priority with the published value; prints the
   * reported bound and gap, and whether the plan is proven optimal at the priority level.
   */
  private static void optw(double timeLimitS, String prefix) throws Exception {
    Map<String, double[]> published = OptwInstance.published(OptwInstance.folder().resolve("best-known.csv"));
    List<Double> gaps = new ArrayList<>();
    int reached = 0;
    int proven = 0;
    int files = 0;
    for (Path f : optwFiles(prefix)) {
      OptwInstance inst = OptwInstance.read(f);
      PlanningProblem p = inst.toProblem();
      long t0 = System.nanoTime();
      SequencerResult r = new Sequencer().plan(p, SequencerOptions.defaults().withTimeLimitS(timeLimitS).withWorkers(2));
      double s = (System.nanoTime() - t0) * 1e-9;
      double[] pub = published.get(inst.name());
      boolean ok = r.hasPlan() && r.totalPriority() >= pub[0] - 1e-9;
      reached += ok ? 1 : 0;
      proven += r.priorityProven() ? 1 : 0;
      gaps.add(r.gap());
      files++;
      System.out.printf("%-6s %-9s priority %5.0f published %5.0f%s %s bound %7.1f (relaxation %7.1f) gap %5.1f%% %s %6.2f s%n",
          inst.name(), r.status(), r.totalPriority(), pub[0], pub[1] > 0 ? " (opt)" : " (bk) ", ok ? "OK  " : "MISS",
          r.boundPriority(), r.stats().relaxationBound(), 100 * r.gap(), r.priorityProven() ? "proven" : "      ", s);
      System.out.println("       notes: " + r.stats().notesText());
    }
    gaps.sort(Double::compare);
    System.out.printf("optw: %d/%d at the published value, %d proven optimal (priority), reported gap median %.1f%%, "
        + "worst %.1f%% (limit %.0f s, 2 workers)%n", reached, files, proven, 100 * gaps.get(gaps.size() / 2),
        100 * gaps.get(gaps.size() - 1), timeLimitS);
  }

  /**
   * Team orienteering with time windows (several identical resources, A6): every case of team-proven.csv
   * (2-series, m = 2–4, optimum = every customer's profit), planned by CP-SAT and by greedy (each resource in
   * turn, the common practice); prints both against the proven value with the bound and gap.
   */
  private static void team(double timeLimitS, String prefix) throws Exception {
    Path folder = OptwInstance.folder();
    if (folder == null) {
      throw new IllegalStateException("shared/benchmarks/optw not found");
    }
    int reached = 0;
    int cases = 0;
    double worstGap = 0;
    for (String line : java.nio.file.Files.readAllLines(folder.resolve("team-proven.csv"))) {
      String[] f = line.split(",");
      if (f[0].equals("instance") || !f[0].startsWith(prefix)) {
        continue;
      }
      int m = Integer.parseInt(f[1]);
      double proven = Double.parseDouble(f[2]);
      OptwInstance inst = OptwInstance.read(folder.resolve("solomon-2").resolve(f[0] + ".txt"));
      PlanningProblem p = inst.toTeamProblem(m);
      Runs runs = greedyThenCpSat(p, timeLimitS);
      SequencerResult g = runs.greedy();
      SequencerResult r = runs.cpsat();
      double s = runs.cpsatS();
      boolean ok = r.hasPlan() && r.totalPriority() >= proven - 1e-9;
      reached += ok ? 1 : 0;
      cases++;
      worstGap = Math.max(worstGap, r.gap());
      System.out.printf("%-6s m=%d %-9s priority %6.0f proven %6.0f %s greedy %6.0f bound %7.1f gap %5.1f%% %6.2f s%n",
          f[0], m, r.status(), r.totalPriority(), proven, ok ? "OK  " : "MISS", g.totalPriority(), r.boundPriority(),
          100 * r.gap(), s);
    }
    System.out.printf("team: %d/%d at the proven optimum, worst reported gap %.1f%% (limit %.0f s, 2 workers)%n",
        reached, cases, 100 * worstGap, timeLimitS);
  }

  /** Greedy and CP-SAT (2 workers) on one problem, with CP-SAT's wall seconds. */
  private record Runs(SequencerResult greedy, SequencerResult cpsat, double cpsatS) {}

  private static Runs greedyThenCpSat(PlanningProblem p, double timeLimitS) {
    SequencerResult g = new Sequencer().plan(p, SequencerOptions.defaults()
        .withSolver(SequencerOptions.Solver.GREEDY).withTimeLimitS(timeLimitS));
    long t0 = System.nanoTime();
    SequencerResult r = new Sequencer().plan(p, SequencerOptions.defaults().withTimeLimitS(timeLimitS).withWorkers(2));
    return new Runs(g, r, (System.nanoTime() - t0) * 1e-9);
  }

  /**
   * The 1-series OPTW instances with {@code m} identical resources (TOPTW, no published values here): CP-SAT's
   * collected profit against greedy (each resource in turn) and against its own reported bound.
   */
  private static void teamOne(double timeLimitS, int m, String prefix) throws Exception {
    List<Double> gaps = new ArrayList<>();
    List<Double> ratios = new ArrayList<>();
    for (Path f : optwFiles(prefix)) {
      OptwInstance inst = OptwInstance.read(f);
      PlanningProblem p = inst.toTeamProblem(m);
      Runs runs = greedyThenCpSat(p, timeLimitS);
      SequencerResult g = runs.greedy();
      SequencerResult r = runs.cpsat();
      double s = runs.cpsatS();
      gaps.add(r.gap());
      ratios.add(r.totalPriority() / g.totalPriority());
      System.out.printf("%-6s m=%d %-9s priority %6.0f greedy %6.0f (ratio %.3f) bound %7.1f gap %5.1f%% %6.2f s%n",
          inst.name(), m, r.status(), r.totalPriority(), g.totalPriority(), r.totalPriority() / g.totalPriority(),
          r.boundPriority(), 100 * r.gap(), s);
    }
    gaps.sort(Double::compare);
    ratios.sort(Double::compare);
    System.out.printf("team1 m=%d: %d instances, CP-SAT/greedy median %.3f (min %.3f), reported gap median %.1f%%, "
        + "worst %.1f%% (limit %.0f s, 2 workers)%n", m, gaps.size(), ratios.get(ratios.size() / 2), ratios.get(0),
        100 * gaps.get(gaps.size() / 2), 100 * gaps.get(gaps.size() - 1), timeLimitS);
  }

  /** The bounds alone on every OPTW instance: LP and ng-route DP with the published value as the floor and with none. */
  private static void optwBound(double timeLimitS, int ngSize, String prefix) throws Exception {
    Map<String, double[]> published = OptwInstance.published(OptwInstance.folder().resolve("best-known.csv"));
    for (Path f : optwFiles(prefix)) {
      OptwInstance inst = OptwInstance.read(f);
      PlanningProblem p = inst.toProblem();
      ArcCosts arcs = new ArcCosts(p);
      double[] pub = published.get(inst.name());
      long t0 = System.nanoTime();
      double lp = BucketRelaxation.bound(p, arcs, 5);
      double lpS = (System.nanoTime() - t0) * 1e-9;
      for (double floor : new double[] {pub[0], 0}) {
        t0 = System.nanoTime();
        NgRouteRelaxation.Result r = NgRouteRelaxation.bound(p, arcs, floor, ngSize, t0 + (long) (timeLimitS * 1e9));
        double s = (System.nanoTime() - t0) * 1e-9;
        System.out.printf("%-6s published %4.0f LP %7.1f (%.1f s) ng%d floor %4.0f: bound %7.1f rounds %d labels %d%s %.2f s%n",
            inst.name(), pub[0], lp, lpS, ngSize, floor, r.bound(), r.rounds(), r.labels(),
            r.elementary() ? " elementary" : "", s);
      }
    }
  }

  /**
   * One synthetic night on a network of {@code sites} identical telescopes ({@link NightScenario#network}):
   * the joint plan (CP-SAT over all sites, the whole time limit) against planning each site in turn (the
   * common practice: site 1 with CP-SAT on every request, site 2 on what is left, …, each with an equal share
   * of the time limit) and against greedy (which on the joint problem also fills one site after the other).
   */
  private static void network(int n, int sites, double timeLimitS, long seed) {
    PlanningProblem[] p = NightScenario.network(n, sites, seed);
    double inTurn = 0;
    java.util.Set<String> taken = new java.util.HashSet<>();
    long t0 = System.nanoTime();
    for (int r = 0; r < sites; r++) {
      PlanningProblem site = p[r];
      List<dev.sequencer.model.Request> left = site.requests().stream().filter(q -> !taken.contains(q.id())).toList();
      List<dev.sequencer.model.RequestWindows> w = site.windows().stream().filter(x -> !taken.contains(x.id())).toList();
      List<Integer> keep = new ArrayList<>();
      for (int k = 0; k < site.requests().size(); k++) {
        if (!taken.contains(site.requests().get(k).id())) {
          keep.add(k);
        }
      }
      PlanningProblem rest = PlanningProblem.of(site.horizon(), left, w, subset(site.transitions(), keep));
      SequencerResult one = new Sequencer().plan(rest,
          SequencerOptions.defaults().withTimeLimitS(timeLimitS / sites).withWorkers(2).withSeed((int) seed));
      one.observations().forEach(o -> taken.add(o.id()));
      inTurn += one.totalPriority();
    }
    double inTurnS = (System.nanoTime() - t0) * 1e-9;
    SequencerResult greedy = new Sequencer().plan(p[sites],
        SequencerOptions.defaults().withSolver(SequencerOptions.Solver.GREEDY).withTimeLimitS(timeLimitS));
    long t1 = System.nanoTime();
    SequencerResult joint = new Sequencer().plan(p[sites],
        SequencerOptions.defaults().withTimeLimitS(timeLimitS).withWorkers(2).withSeed((int) seed));
    double jointS = (System.nanoTime() - t1) * 1e-9;
    System.out.printf("network n=%d sites=%d seed=%d limit=%.0fs: joint %s priority %.0f (bound %.1f, gap %.1f%%, "
            + "%.1f s), each site in turn %.0f (%.1f s, joint/in-turn %.3f), greedy %.0f (joint/greedy %.3f)%n",
        n, sites, seed, timeLimitS, joint.status(), joint.totalPriority(), joint.boundPriority(), 100 * joint.gap(),
        jointS, inTurn, inTurnS, joint.totalPriority() / inTurn, greedy.totalPriority(),
        joint.totalPriority() / greedy.totalPriority());
  }

  /** The matrix transitions of {@code t} restricted to the requests {@code keep} (in that order). */
  private static dev.sequencer.slew.Transitions subset(dev.sequencer.slew.Transitions t, List<Integer> keep) {
    int m = keep.size();
    double[][] table = new double[m][m];
    double[] fromStart = new double[m];
    for (int i = 0; i < m; i++) {
      fromStart[i] = t.boundS(dev.sequencer.slew.Transitions.START, keep.get(i), 0, 0);
      for (int j = 0; j < m; j++) {
        table[i][j] = i == j ? 0 : t.boundS(keep.get(i), keep.get(j), 0, 0);
      }
    }
    return dev.sequencer.slew.Transitions.matrix(table, fromStart);
  }

  private static void night(int n, double timeLimitS, long seed, String variant) {
    long b0 = System.nanoTime();
    PlanningProblem p = NightScenario.generate(n, seed);
    double genS = (System.nanoTime() - b0) * 1e-9;
    SequencerResult greedy = new Sequencer().plan(p,
        SequencerOptions.defaults().withSolver(SequencerOptions.Solver.GREEDY).withTimeLimitS(timeLimitS)
            .withRelaxationBound(false));
    SequencerOptions o = SequencerOptions.defaults().withTimeLimitS(timeLimitS).withWorkers(2).withSeed((int) seed);
    o = switch (variant) {
      case "full" -> o;
      case "nohint" -> o.withHint(false);
      case "allarcs" -> o.withKBest(-1);
      case "nolns" -> o.withLns(false);
      case "nobound" -> o.withRelaxationBound(false);
      default -> throw new IllegalArgumentException("unknown variant " + variant);
    };
    resetPeaks();
    long t0 = System.nanoTime();
    SequencerResult r = new Sequencer().plan(p, o);
    double s = (System.nanoTime() - t0) * 1e-9;
    SequencerResult.Stats st = r.stats();
    System.out.printf("night n=%d seed=%d limit=%.0fs variant=%s: status %s, priority %.0f (greedy %.0f, ratio %.3f),"
            + " bound %.1f (LP %.1f), gap %.1f%%, transition %.0f s, observations %d, arcs kept %d of %d feasible,"
            + " build %.2f s, solve %.2f s, wall %.2f s, LNS rounds %d (improving %d), peak heap %d MB, gen %.2f s%n",
        n, seed, timeLimitS, variant, r.status(), r.totalPriority(), greedy.totalPriority(),
        r.totalPriority() / greedy.totalPriority(), r.boundPriority(), st.relaxationBound(), 100 * r.gap(),
        r.totalTransitionS(), r.observations().size(), st.arcsKept(), st.arcsFeasible(), st.buildS(), st.solveS(), s,
        st.lnsRounds(), st.lnsImprovements(), peakHeapMb(), genS);
    System.out.println("  notes: " + st.notes());
  }

  /**
   * The synthetic night with rules ({@code NightScenario.cadence}: 20 % of requests with 3 visits, 10
   * calibration chains): greedy and CP-SAT at the same limit, priority, ratio, bound and gap, the visits and
   * chains each plan completes.
   */
  private static void cadence(int n, double timeLimitS, long seed) {
    PlanningProblem p = NightScenario.cadence(n, seed);
    SequencerResult greedy = new Sequencer().plan(p, SequencerOptions.defaults()
        .withSolver(SequencerOptions.Solver.GREEDY).withTimeLimitS(timeLimitS).withRelaxationBound(false));
    long t0 = System.nanoTime();
    SequencerResult r = new Sequencer().plan(p, SequencerOptions.defaults().withTimeLimitS(timeLimitS).withWorkers(2)
        .withSeed((int) seed));
    double s = (System.nanoTime() - t0) * 1e-9;
    System.out.printf("cadence n=%d seed=%d limit=%.0fs: status %s, priority %.0f (greedy %.0f, ratio %.3f), bound %.1f,"
            + " gap %.1f%%, observations %d (greedy %d), third visits %d (greedy %d), chains complete %d (greedy %d) of"
            + " %d, wall %.1f s%n", n, seed, timeLimitS, r.status(), r.totalPriority(), greedy.totalPriority(),
        r.totalPriority() / greedy.totalPriority(), r.boundPriority(), 100 * r.gap(), r.observations().size(),
        greedy.observations().size(), thirdVisits(r), thirdVisits(greedy), chains(p, r), chains(p, greedy),
        p.groups().size(), s);
    System.out.printf("  build %.2f s, solve %.2f s, LNS rounds %d (improving %d), phases %s%n", r.stats().buildS(),
        r.stats().solveS(), r.stats().lnsRounds(), r.stats().lnsImprovements(), r.stats().phaseS());
    System.out.println("  notes: " + r.stats().notes());
  }

  private static long thirdVisits(SequencerResult r) {
    return r.observations().stream().filter(o -> Integer.valueOf(3).equals(o.visit())).count();
  }

  /** Chains with all three members observed. */
  private static long chains(PlanningProblem p, SequencerResult r) {
    java.util.Set<String> in = new java.util.HashSet<>();
    r.observations().forEach(o -> in.add(o.id()));
    return p.groups().stream().filter(g -> in.containsAll(g.members())).count();
  }

  private static void resetPeaks() {
    for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
      pool.resetPeakUsage();
    }
  }

  private static long peakHeapMb() {
    long sum = 0;
    for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
      if (pool.getType() == MemoryType.HEAP) {
        sum += pool.getPeakUsage().getUsed();
      }
    }
    return sum >> 20;
  }
}
