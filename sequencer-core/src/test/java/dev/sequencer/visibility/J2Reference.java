package dev.sequencer.visibility;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.KeplerianElements;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.hipparchus.util.FastMath;
import org.orekit.attitudes.FrameAlignedProvider;
import org.orekit.forces.gravity.HolmesFeatherstoneAttractionModel;
import org.orekit.forces.gravity.potential.GravityFieldFactory;
import org.orekit.forces.gravity.potential.NormalizedSphericalHarmonicsProvider;
import org.orekit.forces.gravity.potential.TideSystem;
import org.orekit.frames.Frame;
import org.orekit.orbits.KeplerianOrbit;
import org.orekit.orbits.OrbitType;
import org.orekit.orbits.PositionAngleType;
import org.orekit.propagation.SpacecraftState;
import org.orekit.propagation.ToleranceProvider;
import org.orekit.propagation.numerical.NumericalPropagator;

/**
 * An outside reference for the format's Keplerian motion (A1), set up apart from {@link KeplerianMotion}:
 * Orekit's numerical propagator with the Holmes-Featherstone gravity model of a field holding only the
 * normalised C20 = -J2 / sqrt(5) (a constant field built here, no data file), about the Earth-fixed frame,
 * the format's mu, R and J2, Dormand-Prince 8(5,3) at 0.01 mm, started from the elements in EME2000. Shared
 * by the visibility tests and the visibility benchmark (test-jar).
 */
public final class J2Reference {
  /** Format A1 constants (EGM96). */
  public static final double MU = 398600.4418e9;
  public static final double R = 6_378_136.3;
  public static final double J2 = 1.0826267e-3;

  private J2Reference() {}

  /** A fresh propagator of {@code k}; each call integrates on its own. */
  public static NumericalPropagator propagator(KeplerianElements k, AstroContext ctx) {
    Frame eme2000 = ctx.dataContext().getFrames().getEME2000();
    KeplerianOrbit orbit = new KeplerianOrbit(k.semiMajorAxisKm() * 1000, k.eccentricity(),
        FastMath.toRadians(k.inclinationDeg()), FastMath.toRadians(k.argumentOfPerigeeDeg()),
        FastMath.toRadians(k.raanDeg()), FastMath.toRadians(k.meanAnomalyDeg()), PositionAngleType.MEAN, eme2000,
        ctx.date(k.epoch()), MU);
    double[][] tol = ToleranceProvider.getDefaultToleranceProvider(1e-5).getTolerances(orbit, OrbitType.CARTESIAN);
    NumericalPropagator p = new NumericalPropagator(new DormandPrince853Integrator(1e-4, 120, tol[0], tol[1]),
        new FrameAlignedProvider(ctx.inertial()));
    p.setOrbitType(OrbitType.CARTESIAN);
    NormalizedSphericalHarmonicsProvider field = GravityFieldFactory.getNormalizedProvider(R, MU, TideSystem.UNKNOWN,
        new double[][] {{0.0}, {0.0, 0.0}, {-J2 / FastMath.sqrt(5.0), 0.0, 0.0}},
        new double[][] {{0.0}, {0.0, 0.0}, {0.0, 0.0, 0.0}});
    p.addForceModel(new HolmesFeatherstoneAttractionModel(ctx.earthFixed(), field));
    p.setInitialState(new SpacecraftState(orbit));
    return p;
  }
}
