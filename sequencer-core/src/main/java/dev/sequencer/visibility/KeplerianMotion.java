package dev.sequencer.visibility;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.KeplerianElements;
import java.util.ArrayList;
import java.util.List;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.hipparchus.util.FastMath;
import org.orekit.attitudes.FrameAlignedProvider;
import org.orekit.forces.gravity.J2OnlyPerturbation;
import org.orekit.frames.Frame;
import org.orekit.orbits.CartesianOrbit;
import org.orekit.orbits.KeplerianOrbit;
import org.orekit.orbits.OrbitType;
import org.orekit.orbits.PositionAngleType;
import org.orekit.propagation.SpacecraftState;
import org.orekit.propagation.ToleranceProvider;
import org.orekit.propagation.numerical.NumericalPropagator;
import org.orekit.propagation.sampling.OrekitStepHandler;
import org.orekit.time.AbsoluteDate;
import org.orekit.utils.PVCoordinates;
import org.orekit.utils.PVCoordinatesProvider;
import org.orekit.utils.TimeStampedPVCoordinates;

/**
 * The scenario format's reference motion for Keplerian elements (A1): osculating elements in EME2000 at
 * their epoch, two-body plus the J2 zonal term about the Earth's rotation axis (ITRF z), with the format's
 * constants, integrated numerically (Orekit {@link NumericalPropagator}, Dormand-Prince 8(5,3), 0.1 mm
 * position tolerance, Cartesian state so that any eccentricity and inclination work, circular and
 * equatorial included).
 *
 * <p>The integration runs once over the span asked for (plus {@link #PAD_S} on each side) and its dense
 * output is sampled every {@link #SAMPLE_STEP_S} s (position and velocity, GCRF); between samples the
 * position is the cubic Hermite interpolant of the two neighbouring samples. Its error is at most
 * h^4 / 384 max|r''''|: about r w^4 h^4 / 384 for an angular rate w, under 0.15 m for any perigee above
 * 6,478 km (w at most 1.7e-3 rad/s), i.e. under 0.1 arcsec seen from 100 km. A query outside the
 * sampled span extends it (the state at the span's end is integrated further), so any date works. Reads
 * are lock-free on an immutable snapshot; extensions are synchronised. Thread-safe.
 */
final class KeplerianMotion implements PVCoordinatesProvider {
  /** Format A1: EGM96 gravitational parameter, m^3/s^2. */
  static final double MU = 398600.4418e9;
  /** Format A1: EGM96 equatorial radius, m. */
  static final double EQUATORIAL_RADIUS_M = 6_378_136.3;
  /** Format A1: EGM96 J2 (unnormalised, = -C20). */
  static final double J2 = 1.0826267e-3;
  /** Spacing of the stored samples, s. */
  static final double SAMPLE_STEP_S = 30.0;
  /** Span sampled beyond each end of the interval asked for, s. */
  static final double PAD_S = 3600.0;
  /** Position tolerance of the integration, m. */
  private static final double POSITION_TOLERANCE_M = 1e-4;

  private final AstroContext ctx;
  private final Frame gcrf;
  /** Sample k is at origin + k * SAMPLE_STEP_S (k may be negative after a backward extension). */
  private final AbsoluteDate origin;
  private volatile Samples samples;

  /** An immutable contiguous block of samples k = firstK .. firstK + n - 1, and the states at its ends. */
  private record Samples(int firstK, int n, double[] pv, SpacecraftState first, SpacecraftState last) {}

  private KeplerianMotion(AstroContext ctx, AbsoluteDate origin, Samples samples) {
    this.ctx = ctx;
    this.gcrf = ctx.inertial();
    this.origin = origin;
    this.samples = samples;
  }

  /** The motion of {@code k}, sampled over [from, to] (plus the padding); other dates extend it. */
  static KeplerianMotion of(KeplerianElements k, AstroContext ctx, AbsoluteDate from, AbsoluteDate to) {
    Frame gcrf = ctx.inertial();
    KeplerianOrbit elements = new KeplerianOrbit(
        k.semiMajorAxisKm() * 1000.0,
        k.eccentricity(),
        FastMath.toRadians(k.inclinationDeg()),
        FastMath.toRadians(k.argumentOfPerigeeDeg()),
        FastMath.toRadians(k.raanDeg()),
        FastMath.toRadians(k.meanAnomalyDeg()),
        PositionAngleType.MEAN,
        ctx.dataContext().getFrames().getEME2000(),
        ctx.date(k.epoch()),
        MU);
    // Integrate in GCRF (the EME2000 frame bias is applied once, exactly, to the initial state).
    SpacecraftState initial = new SpacecraftState(
        new CartesianOrbit(elements.getPVCoordinates(gcrf), gcrf, elements.getDate(), MU));
    AbsoluteDate start = from.shiftedBy(-PAD_S);
    int n = (int) Math.ceil((to.durationFrom(start) + PAD_S) / SAMPLE_STEP_S) + 1;
    List<SpacecraftState> states = integrate(ctx, initial, start, n, SAMPLE_STEP_S);
    return new KeplerianMotion(ctx, start, block(0, states, gcrf));
  }

  /**
   * n states on the grid start + i * step (step may be negative), integrated from {@code initial}; the
   * integration from {@code initial} to {@code start} (if they differ) is not sampled.
   */
  private static List<SpacecraftState> integrate(AstroContext ctx, SpacecraftState initial, AbsoluteDate start,
      int n, double step) {
    Frame gcrf = ctx.inertial();
    double[][] tol = ToleranceProvider.getDefaultToleranceProvider(POSITION_TOLERANCE_M)
        .getTolerances(initial.getOrbit(), OrbitType.CARTESIAN);
    DormandPrince853Integrator integrator = new DormandPrince853Integrator(1e-3, 300.0, tol[0], tol[1]);
    NumericalPropagator p = new NumericalPropagator(integrator, new FrameAlignedProvider(gcrf));
    p.setOrbitType(OrbitType.CARTESIAN);
    p.addForceModel(new J2OnlyPerturbation(MU, EQUATORIAL_RADIUS_M, J2, ctx.earthFixed()));
    p.setInitialState(initial);
    List<SpacecraftState> out = new ArrayList<>(n);
    boolean forward = step > 0;
    p.getMultiplexer().add((OrekitStepHandler) interpolator -> {
      AbsoluteDate stepEnd = interpolator.getCurrentState().getDate();
      while (out.size() < n) {
        AbsoluteDate t = start.shiftedBy(out.size() * step);
        if (forward ? t.isAfter(stepEnd) : t.isBefore(stepEnd)) {
          break;
        }
        out.add(interpolator.getInterpolatedState(t));
      }
    });
    p.propagate(start, start.shiftedBy((n - 1) * step));
    if (out.size() != n) {
      throw new IllegalStateException("sampled " + out.size() + " states, expected " + n);
    }
    return out;
  }

  private static Samples block(int firstK, List<SpacecraftState> states, Frame gcrf) {
    int n = states.size();
    double[] pv = new double[6 * n];
    for (int i = 0; i < n; i++) {
      PVCoordinates c = states.get(i).getPVCoordinates(gcrf);
      put(pv, i, c);
    }
    return new Samples(firstK, n, pv, states.get(0), states.get(n - 1));
  }

  private static void put(double[] pv, int i, PVCoordinates c) {
    Vector3D p = c.getPosition();
    Vector3D v = c.getVelocity();
    pv[6 * i] = p.getX();
    pv[6 * i + 1] = p.getY();
    pv[6 * i + 2] = p.getZ();
    pv[6 * i + 3] = v.getX();
    pv[6 * i + 4] = v.getY();
    pv[6 * i + 5] = v.getZ();
  }

  @Override
  public Vector3D getPosition(AbsoluteDate date, Frame frame) {
    double[] pv = interpolate(date);
    Vector3D p = new Vector3D(pv[0], pv[1], pv[2]);
    return frame == gcrf ? p : gcrf.getStaticTransformTo(frame, date).transformPosition(p);
  }

  @Override
  public TimeStampedPVCoordinates getPVCoordinates(AbsoluteDate date, Frame frame) {
    double[] pv = interpolate(date);
    TimeStampedPVCoordinates c = new TimeStampedPVCoordinates(date, new Vector3D(pv[0], pv[1], pv[2]),
        new Vector3D(pv[3], pv[4], pv[5]));
    return frame == gcrf ? c : gcrf.getTransformTo(frame, date).transformPVCoordinates(c);
  }

  /** {x, y, z, vx, vy, vz} in GCRF at {@code date}: cubic Hermite between the two neighbouring samples. */
  private double[] interpolate(AbsoluteDate date) {
    double u = date.durationFrom(origin) / SAMPLE_STEP_S;
    Samples s = covering(u);
    int k = Math.min((int) Math.floor(u), s.firstK + s.n - 2);
    double f = u - k;
    int i = 6 * (k - s.firstK);
    double[] a = s.pv;
    double h = SAMPLE_STEP_S;
    double f2 = f * f;
    double f3 = f2 * f;
    double h00 = 2 * f3 - 3 * f2 + 1;
    double h10 = (f3 - 2 * f2 + f) * h;
    double h01 = -2 * f3 + 3 * f2;
    double h11 = (f3 - f2) * h;
    double d00 = (6 * f2 - 6 * f) / h;
    double d10 = 3 * f2 - 4 * f + 1;
    double d01 = (-6 * f2 + 6 * f) / h;
    double d11 = 3 * f2 - 2 * f;
    double[] out = new double[6];
    for (int c = 0; c < 3; c++) {
      double p0 = a[i + c];
      double v0 = a[i + 3 + c];
      double p1 = a[i + 6 + c];
      double v1 = a[i + 9 + c];
      out[c] = h00 * p0 + h10 * v0 + h01 * p1 + h11 * v1;
      out[3 + c] = d00 * p0 + d10 * v0 + d01 * p1 + d11 * v1;
    }
    return out;
  }

  /** A snapshot whose samples bracket grid position u, extending the span first when needed. */
  private Samples covering(double u) {
    Samples s = samples;
    if (u >= s.firstK && u <= s.firstK + s.n - 1) {
      return s;
    }
    synchronized (this) {
      s = samples;
      int padSamples = (int) Math.ceil(PAD_S / SAMPLE_STEP_S);
      if (u < s.firstK) {
        int more = s.firstK - (int) Math.floor(u) + padSamples;
        List<SpacecraftState> back = integrate(ctx, s.first, s.first.getDate(), more + 1, -SAMPLE_STEP_S);
        List<SpacecraftState> earlier = new ArrayList<>(back.subList(1, back.size()));
        java.util.Collections.reverse(earlier);
        s = join(block(s.firstK - more, earlier, gcrf), s);
      }
      if (u > s.firstK + s.n - 1) {
        int more = (int) Math.ceil(u) - (s.firstK + s.n - 1) + padSamples;
        List<SpacecraftState> ahead = integrate(ctx, s.last, s.last.getDate(), more + 1, SAMPLE_STEP_S);
        s = join(s, block(s.firstK + s.n, ahead.subList(1, ahead.size()), gcrf));
      }
      samples = s;
      return s;
    }
  }

  private static Samples join(Samples a, Samples b) {
    double[] pv = new double[6 * (a.n + b.n)];
    System.arraycopy(a.pv, 0, pv, 0, 6 * a.n);
    System.arraycopy(b.pv, 0, pv, 6 * a.n, 6 * b.n);
    return new Samples(a.firstK, a.n + b.n, pv, a.first, b.last);
  }
}
