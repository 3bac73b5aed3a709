package dev.sequencer.astro;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.model.AzEl;
import dev.sequencer.model.GroundSite;
import java.util.List;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.hipparchus.util.FastMath;
import org.junit.jupiter.api.Test;
import org.orekit.time.AbsoluteDate;

class TopocentricTest {
  private static final AstroContext CTX = AstroContext.offline();

  @Test
  void venusFromNavalObservatoryMatchesMeeusExample13b() {
    // Meeus, Astronomical Algorithms, 2nd ed., Example 13.b (from memory of the book): Venus seen from the
    // US Naval Observatory, phi = +38d55m17s, L = 77d03m56s West, 1987 April 10 at 19h21m00s UT, apparent
    // alpha = 23h09m16.641s, delta = -6d43m11.61s. Result A = 68.0337 deg from the SOUTH (Meeus'
    // convention), i.e. 248.0337 deg from north, h = 15.1249 deg.
    // The book's UT is UT1 (its sidereal time is computed from it); it is passed here as UTC, and the offline
    // context takes UT1 = UTC, so both compute the same Earth rotation: no 0.9 s UT1 - UTC uncertainty
    // enters. What differs: the book's 4-decimal rounding (0.00005 deg) and its sidereal time (IAU 1982
    // GMST with IAU 1980 nutation, Ex. 12.b) against IAU 2006/2000A here, a few milliseconds of time, i.e.
    // up to 0.00005 deg of hour angle. Tolerance 0.0001 deg for both (measured: A 0.000093, h 0.000062).
    AbsoluteDate date = new AbsoluteDate(1987, 4, 10, 19, 21, 0.0, CTX.utc());
    double raDeg = 15.0 * (23 + 9 / 60.0 + 16.641 / 3600.0);
    double decDeg = -(6 + 43 / 60.0 + 11.61 / 3600.0);
    Vector3D gcrf = ApparentPlace.ofDirection(date, raDeg, decDeg).gcrfDirection(CTX);
    GroundSite usno = new GroundSite(38 + 55 / 60.0 + 17 / 3600.0, -(77 + 3 / 60.0 + 56 / 3600.0), 0.0, List.of());
    AzEl venus = Topocentric.of(CTX, usno).azEl(gcrf, date);
    assertEquals(68.0337 + 180.0, venus.azimuthDeg(), 0.0001);
    assertEquals(15.1249, venus.elevationDeg(), 0.0001);
  }

  @Test
  void horizontalToGcrfIsTheInverseOfGcrfToHorizontal() {
    // Pure geometry: az/el -> GCRF -> az/el must round-trip to rounding (1e-10 deg), at the horizon,
    // high up, and across north (azimuth 359.9 deg).
    Topocentric site = Topocentric.of(CTX, new GroundSite(-24.6, -70.4, 2_635.0, List.of()));
    AbsoluteDate date = new AbsoluteDate(2031, 5, 5, 3, 0, 0.0, CTX.utc());
    for (AzEl in : List.of(new AzEl(10.0, 0.0), new AzEl(123.4, 56.7), new AzEl(359.9, 89.0), new AzEl(270, -5))) {
      Vector3D gcrf = site.gcrfDirection(in, date);
      assertEquals(1.0, gcrf.getNorm(), 1e-15);
      AzEl out = site.azEl(gcrf, date);
      assertEquals(in.azimuthDeg(), out.azimuthDeg(), 1e-10);
      assertEquals(in.elevationDeg(), out.elevationDeg(), 1e-10);
    }
  }

  @Test
  void pointAboveTheSiteIsAtTheZenith() {
    // A position 1000 km along the site's local vertical (ellipsoid normal) is at elevation 90 deg; checks
    // that azElOfPosition subtracts the site position. Treated as a direction from the geocentre, the same
    // vector is off the zenith by about the geodetic - geocentric latitude difference (0.19 deg at 52 deg,
    // reduced by the 1000 km: ~0.16 deg), which shows the test can tell the two paths apart.
    GroundSite s = new GroundSite(52.0, 5.0, 100.0, List.of());
    Topocentric site = Topocentric.of(CTX, s);
    AbsoluteDate date = new AbsoluteDate(2031, 1, 1, 0, 0, 0.0, CTX.utc());
    Vector3D sitePosition = site.frame().getStaticTransformTo(CTX.inertial(), date).transformPosition(Vector3D.ZERO);
    Vector3D up = site.gcrfDirection(new AzEl(0.0, 90.0), date);
    assertEquals(90.0, site.azElOfPosition(sitePosition.add(1.0e6, up), date).elevationDeg(), 1e-9);
    double asDirectionDeg = site.azEl(sitePosition.add(1.0e6, up), date).elevationDeg();
    assertTrue(asDirectionDeg < 89.9, "geocentric direction elevation " + asDirectionDeg + " deg");
  }

  @Test
  void moonParallaxLowersItsElevation() {
    // Diurnal parallax: the topocentric Moon is lower than its geocentric direction by about
    // asin(R_earth / Delta * cos h) (Meeus ch. 40, first order; about 0.9 deg near the horizon).
    // Tolerance 0.01 deg covers the ellipsoid vs sphere (site radius 6365-6378 km) and second-order terms.
    Topocentric site = Topocentric.of(CTX, new GroundSite(45.0, 0.0, 0.0, List.of()));
    AbsoluteDate start = new AbsoluteDate(2031, 3, 1, 0, 0, 0.0, CTX.utc());
    int checked = 0;
    for (int hour = 0; hour < 48; hour += 3) {
      AbsoluteDate date = start.shiftedBy(hour * 3600.0);
      Vector3D moon = CTX.moon().getPosition(date, CTX.inertial());
      AzEl geocentric = site.azEl(moon, date);
      AzEl topocentric = site.azElOfPosition(moon, date);
      if (geocentric.elevationDeg() < 0) {
        continue;
      }
      Vector3D sitePosition = site.frame().getStaticTransformTo(CTX.inertial(), date).transformPosition(Vector3D.ZERO);
      double expectedDeg = FastMath.toDegrees(FastMath.asin(
          sitePosition.getNorm() / moon.getNorm() * FastMath.cos(FastMath.toRadians(geocentric.elevationDeg()))));
      assertEquals(expectedDeg, geocentric.elevationDeg() - topocentric.elevationDeg(), 0.01);
      checked++;
    }
    assertTrue(checked >= 3, "the Moon was above the horizon at only " + checked + " samples");
  }
}
