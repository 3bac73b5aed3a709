package dev.sequencer.slew;

import dev.sequencer.model.AzEl;

/**
 * A keep-out cone seen from a ground site (the Sun's, spec A3): as {@link KeepOut}, with the axis also as
 * topocentric azimuth and elevation, which is what an alt-az mount's two-axis path is written in.
 */
public interface SiteKeepOut extends KeepOut {
  /** The axis as azimuth (north through east) and elevation at the site at {@code tS}, degrees. */
  AzEl azEl(double tS);

  /**
   * Upper bound on the great-circle rate of the axis in the site's frame, deg/s (for the Sun: the Earth's
   * rotation plus the Sun's own motion), and on the rate of the radius.
   */
  double maxSiteDriftDegPerS();

  /**
   * Bound on the error of {@link #azEl} against the true axis, degrees (an interpolated table's); the mount's
   * checks widen the cone by it. Zero for an exact axis.
   */
  default double azElErrorDeg() {
    return 0;
  }
}
