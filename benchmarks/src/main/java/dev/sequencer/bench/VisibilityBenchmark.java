package dev.sequencer.bench;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Tle;
import dev.sequencer.visibility.J2Reference;
import dev.sequencer.visibility.OrekitReference;
import dev.sequencer.visibility.RequestVisibility;
import dev.sequencer.visibility.VisibilityCalculator;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.util.FastMath;
import org.orekit.bodies.GeodeticPoint;
import org.orekit.frames.Frame;
import org.orekit.frames.TopocentricFrame;
import org.orekit.propagation.Propagator;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.propagation.analytical.tle.TLEPropagator;
import org.orekit.propagation.events.ElevationDetector;
import org.orekit.propagation.events.EventDetector;
import org.orekit.propagation.events.FunctionalDetector;
import org.orekit.propagation.events.handlers.ContinueOnEvent;
import org.orekit.time.AbsoluteDate;

/**
 * Visibility speed: (1) 1,000 fixed targets seen from a LEO observer over 24 h with Sun, Moon and
 * Earth-limb constraints; (2) 200 orbiting objects from a ground site over one night. Each against one
 * Orekit event-detector propagation per target, measured on a sample in the same run, with the largest
 * edge difference between the two.
 *
 * <p>Run: {@code java -cp benchmarks/target/benchmarks.jar dev.sequencer.bench.VisibilityBenchmark [sample]}
 */
public final class VisibilityBenchmark {
  private static final AstroContext CTX = AstroContext.offline();
  private static final Instant T0 = Instant.parse("2031-03-10T00:00:00Z");

  private VisibilityBenchmark() {}

  public static void main(String[] args) {
    int sample = args.length > 0 ? Integer.parseInt(args[0]) : 30;
    System.out.println(leoFixedTargets(1000, sample));
    System.out.println(groundOrbitingTargets(200, sample));
  }

  /** Result line of one benchmark. */
  record Figures(String name, int targets, double oursS, double peakHeapMb, double referencePerTargetS,
      int sampled, double maxEdgeDiffS, int windowCountMismatches) {
    @Override
    public String toString() {
      double refTotal = referencePerTargetS * targets;
      return String.format(Locale.ROOT,
          "%s: %d targets, ours %.2f s (peak heap %.0f MB); Orekit detectors %.3f s/target on %d sampled "
              + "-> %.1f s for all (ratio %.0fx); max edge difference %.3f s; window-count mismatches %d",
          name, targets, oursS, peakHeapMb, referencePerTargetS, sampled, refTotal, refTotal / oursS,
          maxEdgeDiffS, windowCountMismatches);
    }
  }

  static Figures leoFixedTargets(int count, int sample) {
    Random rnd = new Random(1);
    KeplerianElements k = new KeplerianElements(T0, 6_378.137 + 550, 0.0005, 97.5, 100, 0, 0);
    List<Request> reqs = new ArrayList<>();
    for (int i = 0; i < count; i++) {
      double ra = 360 * rnd.nextDouble();
      double dec = Math.toDegrees(Math.asin(2 * rnd.nextDouble() - 1));
      reqs.add(Request.of("S" + i, new RaDec(ra, dec), 300, 1));
    }
    Constraints c = Constraints.builder().sunSeparationMinDeg(45).moonSeparationMinDeg(10).earthLimbMinDeg(15).build();
    Scenario s = scenario(new OrbitObserver(k), c, reqs, 24 * 3600);
    Frame gcrf = CTX.inertial();
    return run("LEO, fixed targets, 24 h, Sun+Moon+limb", s, sample, i -> {
      Vector3D u = direction((RaDec) reqs.get(i).target());
      return new FunctionalDetector().withFunction(st -> {
        Vector3D r = st.getPosition(gcrf);
        AbsoluteDate t = st.getDate();
        double limb = Vector3D.angle(u, r.negate()) - FastMath.asin(6_378_137.0 / r.getNorm()) - Math.toRadians(15);
        double sun = Vector3D.angle(u, CTX.sun().getPosition(t, gcrf).subtract(r)) - Math.toRadians(45);
        double moon = Vector3D.angle(u, CTX.moon().getPosition(t, gcrf).subtract(r)) - Math.toRadians(10);
        return FastMath.min(limb, FastMath.min(sun, moon));
      }).withMaxCheck(10.0).withThreshold(1e-3).withHandler(new ContinueOnEvent());
    }, i -> leoPropagator(k));
  }

  static Figures groundOrbitingTargets(int count, int sample) {
    Random rnd = new Random(2);
    GroundSite site = new GroundSite(24.62, 33.91, 820, List.of());
    List<Request> reqs = new ArrayList<>();
    List<TLE> tles = new ArrayList<>();
    for (int i = 0; i < count; i++) {
      AbsoluteDate epoch = CTX.date(T0.minusSeconds(7200));
      double n = (13.5 + 2.0 * rnd.nextDouble()) * 2 * Math.PI / 86400.0;
      TLE tle = new TLE(91000 + i, 'U', 2030, 1, "A", 0, 999, epoch, n, 0, 0, 0.001 + 0.01 * rnd.nextDouble(),
          Math.toRadians(40 + 60 * rnd.nextDouble()), Math.toRadians(360 * rnd.nextDouble()),
          Math.toRadians(360 * rnd.nextDouble()), Math.toRadians(360 * rnd.nextDouble()), 100, 0.0, CTX.utc());
      tles.add(tle);
      reqs.add(Request.of("O" + i, new OrbitingTarget(new Tle(tle.getLine1(), tle.getLine2())), 120, 1));
    }
    Constraints c = Constraints.builder().elevationMinDeg(20).build();
    Scenario s = scenario(site, c, reqs, 12 * 3600);
    TopocentricFrame topo = new TopocentricFrame(CTX.earth(),
        new GeodeticPoint(Math.toRadians(site.latitudeDeg()), Math.toRadians(site.longitudeDeg()), site.altitudeM()), "site");
    return run("ground site, orbiting objects, 12 h night, elevation >= 20", s, sample,
        i -> new ElevationDetector(10.0, 1e-3, topo).withConstantElevation(Math.toRadians(20))
            .withHandler(new ContinueOnEvent()),
        i -> TLEPropagator.selectExtrapolator(tles.get(i), CTX.dataContext().getFrames().getTEME()));
  }

  private static Figures run(String name, Scenario s, int sample,
      java.util.function.IntFunction<EventDetector> detector, java.util.function.IntFunction<Propagator> prop) {
    VisibilityCalculator calc = new VisibilityCalculator(CTX);
    calc.compute(s.withRequests(s.requests().subList(0, Math.min(20, s.requests().size())))); // warm-up
    resetPeaks();
    long t0 = System.nanoTime();
    List<RequestVisibility> ours = calc.compute(s);
    double oursS = (System.nanoTime() - t0) * 1e-9;
    double peakMb = peakHeapMb();
    AbsoluteDate start = CTX.date(s.horizon().start());
    AbsoluteDate end = CTX.date(s.horizon().end());
    int step = Math.max(1, s.requests().size() / sample);
    double refTime = 0;
    int sampled = 0;
    double maxDiff = 0;
    int mismatches = 0;
    for (int i = 0; i < s.requests().size() && sampled < sample; i += step) {
      long r0 = System.nanoTime();
      List<double[]> ref = OrekitReference.windows(prop.apply(i), detector.apply(i), start, end);
      refTime += (System.nanoTime() - r0) * 1e-9;
      sampled++;
      List<TimeWindow> w = ours.get(i).intervals();
      if (w.size() != ref.size()) {
        mismatches++;
        continue;
      }
      for (int j = 0; j < w.size(); j++) {
        maxDiff = Math.max(maxDiff, Math.abs(CTX.date(w.get(j).start()).durationFrom(start) - ref.get(j)[0]));
        maxDiff = Math.max(maxDiff, Math.abs(CTX.date(w.get(j).end()).durationFrom(start) - ref.get(j)[1]));
      }
    }
    return new Figures(name, s.requests().size(), oursS, peakMb, refTime / sampled, sampled, maxDiff, mismatches);
  }

  /** The format's reference motion (two-body + J2, numerical), set up apart from the library. */
  private static Propagator leoPropagator(KeplerianElements k) {
    return J2Reference.propagator(k, CTX);
  }

  private static Vector3D direction(RaDec rd) {
    return new Vector3D(Math.toRadians(rd.raDeg()), Math.toRadians(rd.decDeg()));
  }

  private static Scenario scenario(dev.sequencer.model.Observer o, Constraints c, List<Request> reqs, double lengthS) {
    return new Scenario(1, "bench", new TimeWindow(T0, T0.plusSeconds((long) lengthS)), o, c,
        new SlewSettings.Fixed(0), null, reqs, null);
  }

  private static void resetPeaks() {
    System.gc();
    for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
      p.resetPeakUsage();
    }
  }

  private static double peakHeapMb() {
    long sum = 0;
    for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
      if (p.getType() == MemoryType.HEAP) {
        sum += p.getPeakUsage().getUsed();
      }
    }
    return sum / 1e6;
  }
}
