package dev.sequencer.bench;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.visibility.PointingTracks;
import java.time.Instant;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.slew.PointingTrack;
import dev.sequencer.slew.SlewModel;
import dev.sequencer.slew.Transitions;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * Transition times per second for each slew model: one exact leg, or one interval bound, between two of
 * 64 requests picked in turn. {@code fixedExact} is the baseline (a constant). Targets: random fixed RA/Dec
 * (eigenaxis), random stars seen from latitude 40° N (alt-az, cable wrap [-270°, 270°]); the moving
 * variants give every eigenaxis target a drift of 0.01 deg/s. Departures cycle through the first hour.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
public class SlewBenchmark {
  private static final int N = 64;
  private static final double SIDEREAL_DEG_PER_S = 360.0 / 86164.0905;

  private Transitions[] fixed;
  private Transitions[] matrix;
  private Transitions[] eigenaxis;
  private Transitions[] eigenaxisMoving;
  private Transitions[] altaz;
  private Transitions[] eigenaxisApparent;
  private Transitions[] altazApparent;
  private int i;
  private int j = 1;
  private double departureS;

  @Setup
  public void setUp() {
    SplittableRandom random = new SplittableRandom(42);
    List<PointingTrack> fixedTracks = new ArrayList<>();
    List<PointingTrack> movingTracks = new ArrayList<>();
    List<PointingTrack> stars = new ArrayList<>();
    List<Request> fields = new ArrayList<>();
    double[][] table = new double[N][N];
    for (int k = 0; k < N; k++) {
      double ra = random.nextDouble(0, 360);
      double dec = Math.toDegrees(Math.asin(random.nextDouble(-1, 1)));
      fixedTracks.add(PointingTrack.fixed(new RaDec(ra, dec)));
      fields.add(Request.of("F" + k, new RaDec(ra, dec), 600, 1));
      movingTracks.add(drifting(ra, dec, 0.01));
      stars.add(star(40, random.nextDouble(-20, 80), random.nextDouble(-60, 60)));
      for (int m = 0; m < N; m++) {
        table[k][m] = k == m ? 0 : random.nextDouble(5, 120);
      }
    }
    SlewModel eigen = SlewModel.eigenaxis(1.0, 0.05, 20);
    SlewModel mount = SlewModel.altaz(new SlewSettings.AltAz(3, 2, 1, 1, 10, List.of(-270.0, 270.0)), -90, 90);
    fixed = new Transitions[N];
    matrix = new Transitions[N];
    eigenaxis = new Transitions[N];
    eigenaxisMoving = new Transitions[N];
    altaz = new Transitions[N];
    eigenaxisApparent = new Transitions[N];
    altazApparent = new Transitions[N];
    // The production tracks: the same fields seen from an invented site at 40 deg N, at their apparent
    // direction (annual aberration; ApparentStar in the visibility package).
    Instant t0 = Instant.parse("2031-10-14T15:00:00Z");
    Scenario night = new Scenario(1, "bench", new TimeWindow(t0, t0.plusSeconds(14 * 3600)),
        new GroundSite(40, 10, 0, List.of()), Constraints.none(), new SlewSettings.Eigenaxis(1.0, 0.05, 20), null,
        fields, null);
    List<PointingTrack> apparent = PointingTracks.of(night, AstroContext.offline());
    List<PointingTrack> none = Arrays.asList(new PointingTrack[N]);
    for (int k = 0; k < N; k++) { // transitions[k] starts at request k, so START -> j is the leg k -> j
      fixed[k] = SlewModel.fixed(60).transitions(none, null);
      matrix[k] = SlewModel.matrix(table, table[k]).transitions(none, null);
      eigenaxis[k] = eigen.transitions(fixedTracks, fixedTracks.get(k));
      eigenaxisMoving[k] = eigen.transitions(movingTracks, movingTracks.get(k));
      altaz[k] = mount.transitions(stars, stars.get(k));
      eigenaxisApparent[k] = eigen.transitions(apparent, apparent.get(k));
      altazApparent[k] = mount.transitions(apparent, apparent.get(k));
    }
  }

  private double[] next() {
    i = (i + 1) % N;
    j = (j + 7) % N;
    if (j == i) {
      j = (j + 1) % N;
    }
    departureS = (departureS + 37) % 3600;
    return new double[] {departureS};
  }

  private double exact(Transitions[] t) {
    double[] departure = next();
    double[] arrival = {departure[0] + 120};
    return t[i].exactS(new int[] {j}, departure, arrival)[0];
  }

  private double bound(Transitions[] t) {
    double[] departure = next();
    double[] arrival = {departure[0] + 120};
    return t[i].boundS(Transitions.START, j, departure[0], departure[0] + 300, arrival[0], arrival[0] + 300);
  }

  @Benchmark
  public double fixedExact() {
    return exact(fixed);
  }

  @Benchmark
  public double matrixExact() {
    return exact(matrix);
  }

  @Benchmark
  public double eigenaxisExact() {
    return exact(eigenaxis);
  }

  @Benchmark
  public double eigenaxisBound() {
    return bound(eigenaxis);
  }

  @Benchmark
  public double eigenaxisMovingExact() {
    return exact(eigenaxisMoving);
  }

  @Benchmark
  public double eigenaxisMovingBound() {
    return bound(eigenaxisMoving);
  }

  @Benchmark
  public double altazExact() {
    return exact(altaz);
  }

  @Benchmark
  public double altazBound() {
    return bound(altaz);
  }

  @Benchmark
  public double eigenaxisApparentExact() {
    return exact(eigenaxisApparent);
  }

  @Benchmark
  public double eigenaxisApparentBound() {
    return bound(eigenaxisApparent);
  }

  @Benchmark
  public double altazApparentExact() {
    return exact(altazApparent);
  }

  @Benchmark
  public double altazApparentBound() {
    return bound(altazApparent);
  }

  /** A direction drifting along a great circle at {@code rateDegPerS}. */
  private static PointingTrack drifting(double raDeg, double decDeg, double rateDegPerS) {
    double ra = Math.toRadians(raDeg);
    double dec = Math.toRadians(decDeg);
    Vector3D u = new Vector3D(Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec));
    Vector3D v = u.orthogonal();
    return new PointingTrack() {
      @Override
      public Vector3D inertialDirection(double tS) {
        double a = Math.toRadians(rateDegPerS * tS);
        return new Vector3D(Math.cos(a), u, Math.sin(a), v);
      }

      @Override
      public double maxAngularRateDegPerS(double t0S, double t1S) {
        return rateDegPerS;
      }
    };
  }

  /**
   * A star at a site, spherical formulas (sin e = sin φ sin δ + cos φ cos δ cos H); rate bounds
   * |de/dt| <= ω cos φ and |dA/dt| <= ω (|sin φ| + cos φ tan |e|max), |e|max over the interval from its
   * end values and the elevation rate, as derived for the slew tests' StarTrack.
   */
  private static PointingTrack star(double latitudeDeg, double decDeg, double hourAngle0Deg) {
    double phi = Math.toRadians(latitudeDeg);
    double dec = Math.toRadians(decDeg);
    double elevationRate = SIDEREAL_DEG_PER_S * Math.cos(phi);
    return new PointingTrack() {
      @Override
      public Vector3D inertialDirection(double tS) {
        throw new UnsupportedOperationException("ground track");
      }

      @Override
      public double maxAngularRateDegPerS(double t0S, double t1S) {
        throw new UnsupportedOperationException("ground track");
      }

      @Override
      public AzEl azEl(double tS) {
        double h = Math.toRadians(hourAngle0Deg + SIDEREAL_DEG_PER_S * tS);
        double e = Math.asin(Math.sin(phi) * Math.sin(dec) + Math.cos(phi) * Math.cos(dec) * Math.cos(h));
        double a = Math.toDegrees(Math.atan2(-Math.cos(dec) * Math.sin(h),
            Math.sin(dec) * Math.cos(phi) - Math.cos(dec) * Math.cos(h) * Math.sin(phi)));
        return new AzEl(a < 0 ? a + 360 : a, Math.toDegrees(e));
      }

      @Override
      public double maxAzimuthRateDegPerS(double t0S, double t1S) {
        double maxAbsElevationDeg = Math.max(Math.abs(azEl(t0S).elevationDeg()), Math.abs(azEl(t1S).elevationDeg()))
            + 0.5 * Math.abs(t1S - t0S) * elevationRate;
        return maxAbsElevationDeg >= 90 ? Double.POSITIVE_INFINITY
            : SIDEREAL_DEG_PER_S * (Math.abs(Math.sin(phi)) + Math.cos(phi) * Math.tan(Math.toRadians(maxAbsElevationDeg)));
      }

      @Override
      public double maxElevationRateDegPerS(double t0S, double t1S) {
        return elevationRate;
      }
    };
  }
}
