package dev.sequencer.astro;

import org.orekit.bodies.CelestialBodies;
import org.orekit.data.DataContext;
import org.orekit.forces.gravity.potential.GravityFields;
import org.orekit.frames.Frames;
import org.orekit.models.earth.GeoMagneticFields;
import org.orekit.time.TimeScales;

/**
 * An immutable Orekit data context with time scales and frames only. Celestial bodies, gravity and
 * magnetic fields need data files and are refused with a message naming the alternative.
 */
final class OfflineDataContext implements DataContext {
  private final TimeScales timeScales;
  private final Frames frames;

  OfflineDataContext(TimeScales timeScales, Frames frames) {
    this.timeScales = timeScales;
    this.frames = frames;
  }

  @Override
  public TimeScales getTimeScales() {
    return timeScales;
  }

  @Override
  public Frames getFrames() {
    return frames;
  }

  @Override
  public CelestialBodies getCelestialBodies() {
    throw unavailable("celestial bodies (JPL ephemerides); use AstroContext.sun() and moon()");
  }

  @Override
  public GravityFields getGravityFields() {
    throw unavailable("gravity fields");
  }

  @Override
  public GeoMagneticFields getGeoMagneticFields() {
    throw unavailable("geomagnetic fields");
  }

  private static UnsupportedOperationException unavailable(String what) {
    return new UnsupportedOperationException(
        "the offline context has no " + what + "; pass an Orekit data directory for those");
  }
}
