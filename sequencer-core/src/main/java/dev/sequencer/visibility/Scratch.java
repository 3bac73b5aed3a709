package dev.sequencer.visibility;

/** Per-thread working vectors for one evaluation instant (GCRF, metres; unit vectors where noted). */
final class Scratch {
  /** Observer position. */
  final double[] obs = new double[3];
  /** Sun and Moon geocentric positions. */
  final double[] sun = new double[3];
  final double[] moon = new double[3];
  /** ITRF axes in GCRF. */
  final double[] ix = new double[3];
  final double[] iy = new double[3];
  final double[] iz = new double[3];
  /** TEME axes in GCRF. */
  final double[] tx = new double[3];
  final double[] ty = new double[3];
  final double[] tz = new double[3];
  /** Unit line of sight from the observer to the target. */
  final double[] los = new double[3];
  /** Target position (orbiting objects, Earth points). */
  final double[] target = new double[3];
  /** Observer's local east, north, up (ground sites) or the Earth point's up (orbit observers). */
  final double[] east = new double[3];
  final double[] north = new double[3];
  final double[] up = new double[3];
  final double[] tmp = new double[3];
  final double[] tmp2 = new double[3];
  /** Observer velocity relative to the solar-system barycentre, m/s (annual aberration). */
  final double[] obsVel = new double[3];

  /** Fills the shared (target-independent) state at sample k or, when k < 0, at time tS. */
  void load(Chunk c, int k, double tS, boolean teme) {
    if (k >= 0) {
      c.observer.get(k, obs);
      c.observerVelocity.get(k, obsVel);
      c.sun.get(k, sun);
      c.moon.get(k, moon);
      c.itrfX.get(k, ix);
      c.itrfY.get(k, iy);
      c.itrfZ.get(k, iz);
      if (teme) {
        c.temeX.get(k, tx);
        c.temeY.get(k, ty);
        c.temeZ.get(k, tz);
      }
    } else {
      c.observer.at(tS, obs);
      c.observerVelocity.at(tS, obsVel);
      c.sun.at(tS, sun);
      c.moon.at(tS, moon);
      c.itrfX.at(tS, ix);
      c.itrfY.at(tS, iy);
      c.itrfZ.at(tS, iz);
      if (teme) {
        c.temeX.at(tS, tx);
        c.temeY.at(tS, ty);
        c.temeZ.at(tS, tz);
      }
    }
  }
}
