package dev.sequencer.visibility;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.stream.IntStream;
import org.orekit.utils.PVCoordinatesProvider;
import org.orekit.time.AbsoluteDate;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Computes each request's visibility windows over a scenario's horizon.
 *
 * <p>The horizon is processed in chunks ({@link #DEFAULT_CHUNK_S}); per chunk the observer, Sun, Moon and
 * Earth axes are sampled once on a grid of at most {@link #DEFAULT_MAX_STEP_S}, then every request is
 * evaluated on that grid (in parallel) and its sign changes refined (see {@link RootScan}). Memory is
 * bounded by one chunk of samples plus the windows found, whatever the horizon's length.
 *
 * <p>Step: a window or gap longer than the grid step always contains a sample, so with the default
 * 30 s step no window or gap of 30 s or more can be missed, whatever the angular rates; shorter ones
 * are caught by the slope check of {@link RootScan} when the estimated slope allows, and always (down to
 * 1 s) for the constraints with a proven rate bound (Sun and Moon elevation, Moon phase, hour angle). Interpolation of
 * the sampled state is cubic (see {@link SampledVectors}): at 30 s its error is below a metre for a LEO
 * orbit, far below the 0.1 s edge accuracy.
 *
 * <p>Immutable; one calculator may be shared by threads.
 */
public final class VisibilityCalculator {
  private static final Logger LOG = LoggerFactory.getLogger(VisibilityCalculator.class);

  /** Default grid step, seconds: no window or gap of this length or more is missed. */
  public static final double DEFAULT_MAX_STEP_S = 30.0;
  /** Default chunk length, seconds. */
  public static final double DEFAULT_CHUNK_S = 6 * 3600.0;
  /** Name used for time removed by the request's own windows. */
  public static final String REQUEST_WINDOWS = "request windows";

  private final AstroContext ctx;
  private final double maxStepS;
  private final double chunkS;
  private final int threads;

  /** A calculator with the default step and chunk, using every core. */
  public VisibilityCalculator(AstroContext ctx) {
    this(ctx, DEFAULT_MAX_STEP_S, DEFAULT_CHUNK_S, Runtime.getRuntime().availableProcessors());
  }

  private VisibilityCalculator(AstroContext ctx, double maxStepS, double chunkS, int threads) {
    if (!(maxStepS > 0) || !(chunkS >= maxStepS) || threads < 1) {
      throw new IllegalArgumentException(
          "step " + maxStepS + " s, chunk " + chunkS + " s, threads " + threads + ": need 0 < step <= chunk, threads >= 1");
    }
    this.ctx = ctx;
    this.maxStepS = maxStepS;
    this.chunkS = chunkS;
    this.threads = threads;
  }

  /** A copy with another grid step. */
  public VisibilityCalculator withMaxStepS(double v) {
    return new VisibilityCalculator(ctx, v, Math.max(chunkS, v), threads);
  }

  /** A copy with another chunk length. */
  public VisibilityCalculator withChunkS(double v) {
    return new VisibilityCalculator(ctx, maxStepS, v, threads);
  }

  /** A copy using this many threads. */
  public VisibilityCalculator withThreads(int v) {
    return new VisibilityCalculator(ctx, maxStepS, chunkS, v);
  }

  /** The astronomy context in use. */
  public AstroContext context() {
    return ctx;
  }

  /** Windows of every request of the scenario, in request order. */
  public List<RequestVisibility> compute(Scenario scenario) {
    long t0 = System.nanoTime();
    List<RequestVisibility> out = computeAll(scenario);
    if (LOG.isDebugEnabled()) {
      LOG.debug("visibility: {} requests, {} windows, in {} ms", out.size(),
          out.stream().mapToInt(v -> v.intervals().size()).sum(), (System.nanoTime() - t0) / 1_000_000);
    }
    return out;
  }

  private List<RequestVisibility> computeAll(Scenario scenario) {
    AbsoluteDate origin = ctx.date(scenario.horizon().start());
    double horizonS = ctx.date(scenario.horizon().end()).durationFrom(origin);
    List<Request> requests = scenario.requests();
    int n = requests.size();
    List<List<double[]>> allowed = new ArrayList<>(n);
    for (Request r : requests) {
      allowed.add(allowedByRequest(r, origin, horizonS));
    }
    if (scenario.observer() == null) {
      List<RequestVisibility> out = new ArrayList<>(n);
      for (int i = 0; i < n; i++) {
        Map<String, Double> removed = new LinkedHashMap<>();
        removed.put(REQUEST_WINDOWS, horizonS - Intervals.total(allowed.get(i)));
        out.add(new RequestVisibility(requests.get(i).id(), toWindows(allowed.get(i), origin), removed));
      }
      return out;
    }
    GroundSite site = scenario.observer() instanceof GroundSite g ? g : null;
    PVCoordinatesProvider orbit = scenario.observer() instanceof OrbitObserver o
        ? Observers.motion(o, ctx, origin, origin.shiftedBy(horizonS)) : null;
    List<TargetTrack> tracks = new ArrayList<>(n);
    List<List<ConstraintFunction>> functions = new ArrayList<>(n);
    boolean needTeme = false;
    for (Request r : requests) {
      TargetTrack t = TargetTrack.of(r.target(), ctx);
      tracks.add(t);
      needTeme |= t.needsTeme();
      functions.add(ConstraintFunction.forTarget(scenario.constraintsFor(r), site, r.target()));
    }
    double[] siteEnu = site == null ? null : SiteFrame.enuItrf(site);
    List<List<double[]>> windows = new ArrayList<>(n);
    List<Map<String, Double>> satisfied = new ArrayList<>(n);
    for (int i = 0; i < n; i++) {
      windows.add(new ArrayList<>());
      satisfied.add(new LinkedHashMap<>());
    }
    ForkJoinPool pool = new ForkJoinPool(threads);
    try {
      for (double c0 = 0; c0 < horizonS; c0 += chunkS) {
        double c1 = Math.min(horizonS, c0 + chunkS);
        if (c1 - c0 <= 1e-9) {
          break;
        }
        Chunk chunk = Chunk.build(ctx, origin, c0, c1, maxStepS, site, orbit, needTeme);
        final double chunkStart = c0;
        final double chunkEnd = c1;
        pool.submit(() -> IntStream.range(0, n).parallel().forEach(i -> {
          ChunkResult res = evaluate(chunk, tracks.get(i), functions.get(i), siteEnu);
          List<double[]> clipped = Intervals.intersect(res.windows, clip(allowed.get(i), chunkStart, chunkEnd));
          synchronized (windows.get(i)) {
            for (double[] w : clipped) {
              Intervals.append(windows.get(i), w);
            }
            res.satisfiedS.forEach((k, v) -> satisfied.get(i).merge(k, v, Double::sum));
          }
        })).get();
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("visibility computation interrupted", e);
    } catch (ExecutionException e) {
      Throwable cause = e.getCause();
      if (cause instanceof RuntimeException re) {
        throw re;
      }
      throw new IllegalStateException(cause);
    } finally {
      pool.shutdown();
    }
    List<RequestVisibility> out = new ArrayList<>(n);
    for (int i = 0; i < n; i++) {
      Map<String, Double> removed = new LinkedHashMap<>();
      for (ConstraintFunction f : functions.get(i)) {
        removed.put(f.name(), Math.max(0, horizonS - satisfied.get(i).getOrDefault(f.name(), 0.0)));
      }
      removed.put(REQUEST_WINDOWS, Math.max(0, horizonS - Intervals.total(allowed.get(i))));
      out.add(new RequestVisibility(requests.get(i).id(), toWindows(windows.get(i), origin), removed));
    }
    return out;
  }

  /** Windows and per-constraint satisfied seconds of one request over one chunk. */
  private record ChunkResult(List<double[]> windows, Map<String, Double> satisfiedS) {}

  private static ChunkResult evaluate(Chunk chunk, TargetTrack track, List<ConstraintFunction> fns,
      double[] siteEnu) {
    track.prepare(chunk);
    boolean teme = track.needsTeme();
    Scratch s = new Scratch();
    int n = chunk.n;
    int m = fns.size();
    double[] times = new double[n];
    double[][] values = new double[m][n];
    for (int k = 0; k < n; k++) {
      times[k] = chunk.time(k);
      load(chunk, k, times[k], teme, track, siteEnu, s);
      for (int c = 0; c < m; c++) {
        values[c][k] = fns.get(c).margin().applyAsDouble(s);
      }
    }
    List<double[]> result = new ArrayList<>();
    result.add(new double[] {chunk.t0S, chunk.t1S});
    Map<String, Double> satisfied = new LinkedHashMap<>();
    RootScan scan = new RootScan();
    for (int c = 0; c < m; c++) {
      ConstraintFunction f = fns.get(c);
      List<double[]> ok = scan.positive(times, values[c], t -> {
        load(chunk, -1, t, teme, track, siteEnu, s);
        return f.margin().applyAsDouble(s);
      }, f.maxRateDegPerS());
      satisfied.merge(f.name(), Intervals.total(ok), Double::sum);
      result = Intervals.intersect(result, ok);
    }
    return new ChunkResult(result, satisfied);
  }

  static void load(Chunk chunk, int k, double t, boolean teme, TargetTrack track, double[] siteEnu,
      Scratch s) {
    s.load(chunk, k, t, teme);
    if (siteEnu != null) {
      Vec.combine(siteEnu[0], s.ix, siteEnu[1], s.iy, siteEnu[2], s.iz, s.east);
      Vec.combine(siteEnu[3], s.ix, siteEnu[4], s.iy, siteEnu[5], s.iz, s.north);
      Vec.combine(siteEnu[6], s.ix, siteEnu[7], s.iy, siteEnu[8], s.iz, s.up);
    }
    track.fill(chunk, k, t, s);
  }

  private static List<double[]> clip(List<double[]> list, double a, double b) {
    return Intervals.intersect(list, List.<double[]>of(new double[] {a, b}));
  }

  /** The request's own windows (or the whole horizon) in seconds from the horizon start, clipped. */
  private List<double[]> allowedByRequest(Request r, AbsoluteDate origin, double horizonS) {
    List<double[]> out = new ArrayList<>();
    if (r.windows().isEmpty()) {
      out.add(new double[] {0, horizonS});
      return out;
    }
    for (TimeWindow w : r.windows()) {
      double a = Math.max(0, ctx.date(w.start()).durationFrom(origin));
      double b = Math.min(horizonS, ctx.date(w.end()).durationFrom(origin));
      if (a <= b) {
        Intervals.append(out, new double[] {a, b});
      }
    }
    return out;
  }

  /** Converts to instants, rounding inward to the millisecond so every reported instant is feasible. */
  private List<TimeWindow> toWindows(List<double[]> list, AbsoluteDate origin) {
    List<TimeWindow> out = new ArrayList<>(list.size());
    for (double[] w : list) {
      Instant a = ceilMs(ctx.instant(origin.shiftedBy(w[0])));
      Instant b = floorMs(ctx.instant(origin.shiftedBy(w[1])));
      if (!b.isBefore(a)) {
        out.add(new TimeWindow(a, b));
      }
    }
    return out;
  }

  private static Instant floorMs(Instant t) {
    return t.truncatedTo(ChronoUnit.MILLIS);
  }

  private static Instant ceilMs(Instant t) {
    Instant f = t.truncatedTo(ChronoUnit.MILLIS);
    return f.equals(t) ? f : f.plusMillis(1);
  }
}
