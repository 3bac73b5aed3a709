package dev.sequencer.visibility;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.GroundSite;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.orekit.bodies.GeodeticPoint;
import org.orekit.frames.Frame;
import org.orekit.frames.StaticTransform;
import org.orekit.utils.PVCoordinatesProvider;
import org.orekit.time.AbsoluteDate;
import org.orekit.utils.PVCoordinates;

/**
 * One stretch of the horizon sampled on a regular grid: the observer's GCRF position and barycentric
 * velocity, the Sun and Moon, the Earth-fixed axes and the TEME axes expressed in GCRF. Shared by every target of the chunk, so the
 * observer is propagated once per horizon and not once per target.
 */
final class Chunk {
  final double t0S;
  final double t1S;
  final double stepS;
  final int n;
  final AbsoluteDate origin;
  final SampledVectors observer;
  final SampledVectors sun;
  final SampledVectors moon;
  /** ITRF x, y, z axes in GCRF. */
  final SampledVectors itrfX;
  final SampledVectors itrfY;
  final SampledVectors itrfZ;
  /** Observer velocity relative to the solar-system barycentre, m/s (annual aberration of fixed targets). */
  final SampledVectors observerVelocity;
  /** TEME x, y, z axes in GCRF (only when orbiting targets need them). */
  final SampledVectors temeX;
  final SampledVectors temeY;
  final SampledVectors temeZ;

  private Chunk(double t0S, double t1S, double stepS, int n, AbsoluteDate origin, boolean needTeme) {
    this.t0S = t0S;
    this.t1S = t1S;
    this.stepS = stepS;
    this.n = n;
    this.origin = origin;
    observer = new SampledVectors(t0S, stepS, n);
    sun = new SampledVectors(t0S, stepS, n);
    moon = new SampledVectors(t0S, stepS, n);
    observerVelocity = new SampledVectors(t0S, stepS, n);
    itrfX = new SampledVectors(t0S, stepS, n);
    itrfY = new SampledVectors(t0S, stepS, n);
    itrfZ = new SampledVectors(t0S, stepS, n);
    temeX = needTeme ? new SampledVectors(t0S, stepS, n) : null;
    temeY = needTeme ? new SampledVectors(t0S, stepS, n) : null;
    temeZ = needTeme ? new SampledVectors(t0S, stepS, n) : null;
  }

  /** Time of sample k, seconds from the horizon start. */
  double time(int k) {
    return t0S + k * stepS;
  }

  /**
   * Samples [t0S, t1S] on a regular grid whose step is the largest one not above {@code maxStepS} that
   * divides the chunk exactly, so the first and last samples are the chunk's ends.
   */
  static Chunk build(
      AstroContext ctx,
      AbsoluteDate origin,
      double t0S,
      double t1S,
      double maxStepS,
      GroundSite site,
      PVCoordinatesProvider orbitObserver,
      boolean needTeme) {
    int n = Math.max(2, (int) Math.ceil((t1S - t0S) / maxStepS - 1e-9) + 1);
    double stepS = (t1S - t0S) / (n - 1);
    Chunk c = new Chunk(t0S, t1S, stepS, n, origin, needTeme);
    Frame gcrf = ctx.inertial();
    Frame itrf = ctx.earthFixed();
    Frame teme = needTeme ? ctx.dataContext().getFrames().getTEME() : null;
    Vector3D sitePos = null;
    if (site != null) {
      GeodeticPoint gp = new GeodeticPoint(
          Math.toRadians(site.latitudeDeg()), Math.toRadians(site.longitudeDeg()), site.altitudeM());
      sitePos = ctx.earth().transform(gp);
    }
    for (int k = 0; k < n; k++) {
      AbsoluteDate date = origin.shiftedBy(c.time(k));
      StaticTransform toGcrf = itrf.getStaticTransformTo(gcrf, date);
      put(c.itrfX, k, toGcrf.transformVector(Vector3D.PLUS_I));
      put(c.itrfY, k, toGcrf.transformVector(Vector3D.PLUS_J));
      put(c.itrfZ, k, toGcrf.transformVector(Vector3D.PLUS_K));
      if (teme != null) {
        StaticTransform temeToGcrf = teme.getStaticTransformTo(gcrf, date);
        put(c.temeX, k, temeToGcrf.transformVector(Vector3D.PLUS_I));
        put(c.temeY, k, temeToGcrf.transformVector(Vector3D.PLUS_J));
        put(c.temeZ, k, temeToGcrf.transformVector(Vector3D.PLUS_K));
      }
      // The Earth's velocity relative to the barycentre ~ minus the geocentric Sun's (see Aberration).
      PVCoordinates sun = ctx.sun().getPVCoordinates(date, gcrf);
      Vector3D velocity = sun.getVelocity().negate();
      if (sitePos != null) {
        put(c.observer, k, toGcrf.transformPosition(sitePos));
      } else if (orbitObserver != null) {
        PVCoordinates pv = orbitObserver.getPVCoordinates(date, gcrf);
        put(c.observer, k, pv.getPosition());
        velocity = velocity.add(pv.getVelocity());
      }
      put(c.observerVelocity, k, velocity);
      put(c.sun, k, sun.getPosition());
      put(c.moon, k, ctx.moon().getPosition(date, gcrf));
    }
    return c;
  }

  private static void put(SampledVectors s, int k, Vector3D v) {
    s.set(k, v.getX(), v.getY(), v.getZ());
  }
}
