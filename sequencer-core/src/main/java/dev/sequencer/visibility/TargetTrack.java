package dev.sequencer.visibility;

import dev.sequencer.astro.Aberration;
import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Target;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.orekit.bodies.GeodeticPoint;
import org.orekit.frames.Frame;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.propagation.analytical.tle.TLEPropagator;

/**
 * Where one target is: fills the unit line of sight (and the target position when it has one) into a
 * {@link Scratch} whose shared state is already loaded.
 */
abstract class TargetTrack {

  /** Prepares per-chunk data (propagation of orbiting targets on the chunk grid). */
  void prepare(Chunk chunk) {}

  /** Fills {@code s.los} (and {@code s.target}, {@code s.up} where relevant) at sample k or time tS. */
  abstract void fill(Chunk chunk, int k, double tS, Scratch s);

  /** True when this target needs the TEME axes (TLE objects). */
  boolean needsTeme() {
    return false;
  }

  static TargetTrack of(Target target, AstroContext ctx) {
    if (target instanceof RaDec rd) {
      return new Fixed(rd);
    } else if (target instanceof OrbitingTarget ot) {
      return new Orbiting(ot, ctx);
    } else if (target instanceof EarthPoint ep) {
      return new Ground(ep, ctx);
    }
    throw new IllegalArgumentException("no target");
  }

  /** Unit vector of an ICRS direction (GCRF axes). */
  static double[] unit(double raDeg, double decDeg) {
    double ra = Math.toRadians(raDeg);
    double dec = Math.toRadians(decDeg);
    return new double[] {Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec)};
  }

  /**
   * A fixed ICRS direction pointed at its apparent direction: annual aberration for the observer's
   * barycentric velocity (A1). No parallax, proper motion, light deflection or diurnal aberration.
   */
  static final class Fixed extends TargetTrack {
    private final double[] u;

    Fixed(RaDec rd) {
      u = unit(rd.raDeg(), rd.decDeg());
    }

    @Override
    void fill(Chunk chunk, int k, double tS, Scratch s) {
      Aberration.apparent(u, s.obsVel, s.los);
    }
  }

  /** An object on a TLE, propagated with SGP4/SDP4 in TEME on the chunk grid, then interpolated. */
  static final class Orbiting extends TargetTrack {
    private final TLEPropagator propagator;
    private final Frame teme;
    private SampledVectors temePos;

    Orbiting(OrbitingTarget ot, AstroContext ctx) {
      TLE tle = new TLE(ot.tle().line1(), ot.tle().line2(), ctx.utc());
      teme = ctx.dataContext().getFrames().getTEME();
      propagator = TLEPropagator.selectExtrapolator(tle, teme);
    }

    @Override
    boolean needsTeme() {
      return true;
    }

    @Override
    void prepare(Chunk chunk) {
      temePos = new SampledVectors(chunk.t0S, chunk.stepS, chunk.n);
      for (int k = 0; k < chunk.n; k++) {
        Vector3D p = propagator.getPosition(chunk.origin.shiftedBy(chunk.time(k)), teme);
        temePos.set(k, p.getX(), p.getY(), p.getZ());
      }
    }

    @Override
    void fill(Chunk chunk, int k, double tS, Scratch s) {
      if (k >= 0) {
        temePos.get(k, s.tmp);
      } else {
        temePos.at(tS, s.tmp);
      }
      Vec.combine(s.tmp[0], s.tx, s.tmp[1], s.ty, s.tmp[2], s.tz, s.target);
      Vec.sub(s.target, s.obs, s.los);
      Vec.normalize(s.los);
    }
  }

  /** A point on the Earth (WGS-84), rotating with the Earth. */
  static final class Ground extends TargetTrack {
    private final double[] itrf;
    private final double[] upItrf;

    Ground(EarthPoint ep, AstroContext ctx) {
      GeodeticPoint gp = new GeodeticPoint(
          Math.toRadians(ep.latitudeDeg()), Math.toRadians(ep.longitudeDeg()), ep.altitudeM());
      Vector3D p = ctx.earth().transform(gp);
      itrf = new double[] {p.getX(), p.getY(), p.getZ()};
      Vector3D z = gp.getZenith();
      upItrf = new double[] {z.getX(), z.getY(), z.getZ()};
    }

    @Override
    void fill(Chunk chunk, int k, double tS, Scratch s) {
      Vec.combine(itrf[0], s.ix, itrf[1], s.iy, itrf[2], s.iz, s.target);
      Vec.combine(upItrf[0], s.ix, upItrf[1], s.iy, upItrf[2], s.iz, s.up);
      Vec.sub(s.target, s.obs, s.los);
      Vec.normalize(s.los);
    }
  }
}
