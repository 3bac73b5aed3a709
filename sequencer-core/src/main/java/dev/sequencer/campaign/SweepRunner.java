package dev.sequencer.campaign;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.CampaignReader;
import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.SweepReader;
import dev.sequencer.model.Campaign;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.Sweep;
import dev.sequencer.model.Timeline;
import dev.sequencer.planner.PlanOutcome;
import dev.sequencer.planner.Planner;
import dev.sequencer.sequence.SequencerOptions;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.ExecutionException;

/**
 * The runs of a sweep and the one function that runs one of them ({@link #run(int)}): an engine maps it over
 * {@code 0 .. size()-1} (the embedded thread pool of {@link #runAll}, or a Spark job) and gets the same rows.
 * The grid is the product of the axes in a fixed order (solver, timeLimitS, workers, seed, weatherSeed,
 * slew; the last varies fastest); an absent axis keeps the input's setting. A run of a scenario is one
 * {@link Planner#plan}; a run of a campaign is one season ({@link CampaignSimulator}). In reproducible mode
 * (the default) the time limit is CP-SAT's deterministic work budget, so a row's results do not depend on
 * the machine or on the runs beside it. Thread-safe: runs share only immutable inputs.
 */
public final class SweepRunner {
  /** The axes, in grid order. */
  public static final List<String> AXES = List.of("solver", "timeLimitS", "workers", "seed", "weatherSeed", "slew");

  private final Sweep sweep;
  private final Scenario scenario;
  private final Campaign campaign;
  private final AstroContext ctx;
  private final List<int[]> grid = new ArrayList<>();

  /** A sweep over {@code scenario}, or over {@code campaign} (non-null) whose scenario is {@code scenario}. */
  public SweepRunner(Sweep sweep, Scenario scenario, Campaign campaign, AstroContext ctx) {
    this.sweep = sweep;
    this.scenario = scenario;
    this.campaign = campaign;
    this.ctx = ctx;
    int[] sizes = {sweep.solvers().size(), sweep.timeLimitsS().size(), sweep.workers().size(), sweep.seeds().size(),
        sweep.weatherSeeds().size(), sweep.slews().size()};
    build(sizes, 0, new int[sizes.length]);
  }

  /** Reads the sweep file and its input (scenario, or campaign and its scenario). */
  public static SweepRunner load(Path sweepFile, AstroContext ctx) {
    Path input = SweepReader.inputFile(sweepFile);
    Campaign c = null;
    Scenario s;
    Sweep probe = SweepReader.parse(readText(sweepFile), sweepFile.toString(), null);
    if (probe.campaign()) {
      CampaignReader.Result r = CampaignReader.read(input);
      c = r.campaign();
      s = r.scenario();
    } else {
      s = ScenarioReader.read(input).scenario();
    }
    return new SweepRunner(SweepReader.read(sweepFile, s), s, c, ctx);
  }

  private static String readText(Path p) {
    try {
      return java.nio.file.Files.readString(p);
    } catch (java.io.IOException e) {
      throw new java.io.UncheckedIOException("cannot read " + p, e);
    }
  }

  private void build(int[] sizes, int axis, int[] at) {
    if (axis == sizes.length) {
      grid.add(at.clone());
      return;
    }
    for (int v = 0; v < Math.max(1, sizes[axis]); v++) {
      at[axis] = sizes[axis] == 0 ? -1 : v;
      build(sizes, axis + 1, at);
    }
  }

  /** Number of runs. */
  public int size() {
    return grid.size();
  }

  /** The sweep being run. */
  public Sweep sweep() {
    return sweep;
  }

  /** The axes that vary (given in the file), in grid order. */
  public List<String> axes() {
    List<String> out = new ArrayList<>();
    int[] sizes = {sweep.solvers().size(), sweep.timeLimitsS().size(), sweep.workers().size(), sweep.seeds().size(),
        sweep.weatherSeeds().size(), sweep.slews().size()};
    for (int k = 0; k < sizes.length; k++) {
      if (sizes[k] > 0) {
        out.add(AXES.get(k));
      }
    }
    return out;
  }

  /** CP-SAT workers of run {@code i} (what a Spark task should reserve as {@code spark.task.cpus}). */
  public int workers(int i) {
    return options(grid.get(i)).effectiveWorkers();
  }

  private SequencerOptions options(int[] at) {
    SequencerOptions o = SequencerOptions.from(scenario.solverOrDefaults());
    boolean limitGiven = at[1] >= 0;
    if (limitGiven) {
      o = o.withTimeLimitS(sweep.timeLimitsS().get(at[1]));
    }
    if (at[2] >= 0) {
      o = o.withWorkers(sweep.workers().get(at[2]));
    }
    if (at[3] >= 0) {
      o = o.withSeed(sweep.seeds().get(at[3]));
    }
    String solver = at[0] >= 0 ? sweep.solvers().get(at[0]) : "cpsat";
    o = o.withSolver(Strategy.of(solver).solver());
    if (sweep.reproducible()) {
      o = o.withReproducible(limitGiven ? o.timeLimitS() : o.deterministicLimit());
    }
    return o;
  }

  /** Runs run {@code i} of the grid. */
  public SweepRow run(int i) {
    int[] at = grid.get(i);
    SequencerOptions o = options(at);
    String solver = at[0] >= 0 ? sweep.solvers().get(at[0]) : "cpsat";
    Scenario s = scenario;
    String slew = "scenario";
    if (at[5] >= 0) {
      SlewSettings ss = sweep.slews().get(at[5]);
      s = s.withSlew(ss);
      slew = at[5] + ":" + ss.model();
    }
    Long weatherSeed = null;
    long t0 = System.nanoTime();
    if (campaign != null) {
      Campaign c = campaign;
      if (at[4] >= 0) {
        weatherSeed = sweep.weatherSeeds().get(at[4]);
        c = c.withWeather(c.weather().withSeed(weatherSeed));
      } else {
        weatherSeed = c.weather().seed();
      }
      CampaignResult r = new CampaignSimulator(c, s, ctx, o).run(Strategy.of(solver));
      double slewS = r.nights().stream().mapToDouble(NightRecord::slewS).sum();
      return new SweepRow(i, solver, o.timeLimitS(), o.workers(), o.seed(), weatherSeed, slew, "SEASON",
          r.collected(), Double.NaN, r.remaining(), slewS, r.executed(), (System.nanoTime() - t0) * 1e-9);
    }
    PlanOutcome out = Planner.plan(s, ctx, o);
    Timeline t = out.timeline();
    return new SweepRow(i, solver, o.timeLimitS(), o.workers(), o.seed(), null, slew, t.status().name(), t.priority(),
        t.bound() == null ? Double.NaN : t.bound(), Double.NaN, t.slewSeconds(), t.observations().size(),
        out.wallS());
  }

  /**
   * Every run on a local pool of {@code threads} threads (at least 1), rows in run order. Size it by the
   * workers per run: {@code cores / workers}.
   */
  public List<SweepRow> runAll(int threads) {
    ExecutorService pool = Executors.newFixedThreadPool(Math.max(1, threads), r -> {
      Thread t = new Thread(r, "sweep-run");
      t.setDaemon(true);
      return t;
    });
    try {
      List<Future<SweepRow>> futures = new ArrayList<>();
      for (int i = 0; i < size(); i++) {
        int k = i;
        futures.add(pool.submit(() -> run(k)));
      }
      List<SweepRow> rows = new ArrayList<>();
      for (Future<SweepRow> f : futures) {
        rows.add(f.get());
      }
      return rows;
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("sweep interrupted", e);
    } catch (ExecutionException e) {
      if (e.getCause() instanceof RuntimeException re) {
        throw re;
      }
      throw new IllegalStateException(e.getCause());
    } finally {
      pool.shutdownNow();
    }
  }

  /** The embedded pool's size for this machine: cores / the most workers any run uses (at least 1). */
  public int embeddedThreads() {
    int most = 1;
    for (int i = 0; i < size(); i++) {
      most = Math.max(most, workers(i));
    }
    return Math.max(1, Runtime.getRuntime().availableProcessors() / most);
  }
}
