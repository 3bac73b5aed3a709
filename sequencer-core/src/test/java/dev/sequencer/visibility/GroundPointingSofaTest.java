package dev.sequencer.visibility;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.Aberration;
import dev.sequencer.astro.AstroContext;
import dev.sequencer.astro.Sofa;
import dev.sequencer.astro.Topocentric;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.RaDec;
import java.util.List;
import java.util.Random;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;
import org.orekit.time.AbsoluteDate;

/**
 * The whole ground-site pointing chain of a fixed RA/Dec target — ICRS direction, annual aberration,
 * precession-nutation, Earth rotation, WGS-84 vertical, azimuth and elevation — against SOFA's observed
 * place (jauAtco13 with zero pressure: no refraction) on 1,200 random dates of 2020-2060, each at a random
 * site (latitude -75..75 deg, any longitude, 0-4000 m) and a random direction. UT1 = UTC and no polar
 * motion on both sides (no EOP offline; their effect, up to 0.004 deg, is bounded in docs/astro.md).
 *
 * <p>Shared with the reference: the IAU theories (precession-nutation, Earth rotation angle) and WGS-84,
 * not their code (Orekit vs SOFA). Differences expected from what the format lets us neglect: diurnal
 * aberration, which SOFA applies (at most 0.32" x cos(latitude)), and the Sun's light deflection (at most
 * 0.1" at 5 deg from the Sun, cases closer than that are skipped), plus the 0.02" of annual aberration
 * (SofaReferenceTest). Tolerance 0.45" on the sky.
 */
class GroundPointingSofaTest {
  private static final AstroContext CTX = AstroContext.offline();

  @Test
  void apparentStarTrackAndTopocentricAgainstSofaObservedPlace() {
    Random random = new Random(20260107);
    double maxTrack = 0;
    double maxTopo = 0;
    int cases = 0;
    for (AbsoluteDate date : Sofa.randomDates(CTX, random)) {
      double lat = -75 + 150 * random.nextDouble();
      double lon = -180 + 360 * random.nextDouble();
      double alt = 4000 * random.nextDouble();
      double ra = 360 * random.nextDouble();
      double dec = Math.toDegrees(Math.asin(2 * random.nextDouble() - 1));
      RaDec rd = new RaDec(ra, dec);
      Vector3D u = new Vector3D(Math.toRadians(ra), Math.toRadians(dec));
      Vector3D sun = CTX.sun().getPosition(date, CTX.inertial());
      if (Vector3D.angle(u, sun) < Math.toRadians(5)) {
        continue;
      }
      cases++;
      GroundSite site = new GroundSite(lat, lon, alt, List.of());
      double[] sofa = Sofa.observed(CTX, date, ra, dec, lat, lon, alt);
      Vector3D reference = Sofa.horizon(sofa[0], sofa[1]);
      // The production track of the slew models and of the alt-az bounds.
      ObserverVelocity velocity = ObserverVelocity.of(site, CTX, date, -1, 1);
      AzEl track = ApparentStar.fromSite(rd, site, velocity, CTX, date).azEl(0);
      maxTrack = Math.max(maxTrack, Sofa.arcsec(Sofa.horizon(track.azimuthDeg(), track.elevationDeg()), reference));
      // The astro helper (Orekit's TopocentricFrame) on the apparent direction.
      AzEl topo = Topocentric.of(CTX, site).azEl(Aberration.apparent(u, Aberration.earthVelocityMps(CTX, date)), date);
      maxTopo = Math.max(maxTopo, Sofa.arcsec(Sofa.horizon(topo.azimuthDeg(), topo.elevationDeg()), reference));
    }
    System.out.printf("ground chain vs SOFA atco13 (%d cases): track %.3f\", Topocentric %.3f\"%n", cases, maxTrack,
        maxTopo);
    assertTrue(cases > 1100, "cases " + cases);
    assertTrue(maxTrack < 0.45, "ApparentStar az/el off SOFA by " + maxTrack + " arcsec");
    assertTrue(maxTopo < 0.45, "Topocentric az/el off SOFA by " + maxTopo + " arcsec");
  }
}
