package dev.sequencer.examples;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.ScenarioWriter;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.SolverSettings;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Tle;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.hipparchus.util.FastMath;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.utils.Constants;

/**
 * Writes the three bundled example scenarios (everything in them is invented: sites, spacecraft, targets,
 * satellite numbers). Deterministic: fixed seeds, so a re-run gives the same bytes.
 *
 * <p>Run: {@code java -cp sequencer-examples/target/sequencer.jar dev.sequencer.examples.ScenarioGenerator
 * sequencer-examples/src/main/resources/scenarios}.
 */
public final class ScenarioGenerator {
  private ScenarioGenerator() {}

  public static void main(String[] args) {
    Path dir = Path.of(args.length > 0 ? args[0] : "sequencer-examples/src/main/resources/scenarios");
    ScenarioWriter.write(groundNight(), dir.resolve("ground-night-queue.json"));
    ScenarioWriter.write(leoTelescopeDay(), dir.resolve("leo-telescope-day.json"));
    ScenarioWriter.write(satelliteTracking(AstroContext.offline()), dir.resolve("satellite-tracking-night.json"));
    System.out.println("wrote 3 scenarios to " + dir);
  }

  /**
   * (a) An invented ground telescope's night queue: 150 fields, alt-az mount with cable wrap, dark time, Moon,
   * airmass at most 2 within 4 h of the meridian; every 25th field asks for airmass 1.3 (a demanding
   * programme) and every 30th drops the hour-angle limit (a monitoring field taken whenever it is up).
   */
  static Scenario groundNight() {
    Random rnd = new Random(20310320L);
    // A ridge in the north (40 deg, across the 0/360 seam) above the 25 deg limit and above the airmass-2
    // elevation (about 30 deg): it binds for the circumpolar fields low in the north.
    GroundSite site = new GroundSite(27.41, -109.13, 1450, List.of(new AzEl(0, 40), new AzEl(30, 40),
        new AzEl(60, 20), new AzEl(120, 12), new AzEl(200, 8), new AzEl(280, 16), new AzEl(330, 40)));
    Constraints c = Constraints.builder().sunElevationMaxDeg(-12).moonSeparationMinDeg(30).elevationMinDeg(25)
        .elevationMaxDeg(87).airmassMax(2.0).hourAngleMinH(-4).hourAngleMaxH(4).build();
    ConstraintOverrides demanding = ConstraintOverrides.setting(Constraints.builder().airmassMax(1.3).build());
    ConstraintOverrides anyHourAngle = new ConstraintOverrides(Constraints.none(),
        EnumSet.of(ConstraintField.HOUR_ANGLE_MIN_H, ConstraintField.HOUR_ANGLE_MAX_H));
    SlewSettings slew = new SlewSettings.AltAz(2.5, 1.5, 0.8, 0.8, 12, List.of(-270.0, 270.0));
    List<Request> requests = new ArrayList<>();
    for (int k = 1; k <= 150; k++) {
      // March evening to morning sky at this longitude: right ascensions of about 4 h to 17 h transit at night.
      double ra = 60 + 200 * rnd.nextDouble();
      double dec = Math.toDegrees(Math.asin(-0.6 + 1.5 * rnd.nextDouble())); // -37 to +64 deg, uniform on the sphere
      double durationS = 60 * (5 + rnd.nextInt(26)); // 5 to 30 min
      double priority = 1 + rnd.nextInt(10);
      Request r = Request.of(String.format(Locale.ROOT, "F%03d", k), new RaDec(round(ra, 3), round(dec, 3)),
          durationS, priority);
      requests.add(k % 25 == 0 ? r.withConstraints(demanding) : k % 30 == 0 ? r.withConstraints(anyHourAngle) : r);
    }
    return new Scenario(Scenario.FORMAT, "ground night queue: invented site, 150 invented fields",
        new TimeWindow(Instant.parse("2031-03-20T00:00:00Z"), Instant.parse("2031-03-20T14:00:00Z")), site, c, slew,
        new AzElPointing(0, 70), requests, new SolverSettings(20, 2, 1));
  }

  /** (b) An invented space telescope in a 550 km sun-synchronous orbit over 24 h: 300 fields, eigenaxis slews. */
  static Scenario leoTelescopeDay() {
    Random rnd = new Random(20310601L);
    KeplerianElements orbit = new KeplerianElements(Instant.parse("2031-06-01T00:00:00Z"), 6928.137, 0.0012, 97.6,
        143.0, 90.0, 0.0);
    Constraints c = Constraints.builder().sunSeparationMinDeg(50).moonSeparationMinDeg(15).earthLimbMinDeg(20).build();
    SlewSettings slew = new SlewSettings.Eigenaxis(0.6, 0.02, 30);
    List<Request> requests = new ArrayList<>();
    for (int k = 1; k <= 300; k++) {
      double ra = 360 * rnd.nextDouble();
      double dec = Math.toDegrees(Math.asin(2 * rnd.nextDouble() - 1)); // uniform on the sphere
      double durationS = 60 * (5 + rnd.nextInt(36)); // 5 to 40 min
      double priority = 1 + rnd.nextInt(10);
      requests.add(Request.of(String.format(Locale.ROOT, "S%03d", k), new RaDec(round(ra, 3), round(dec, 3)),
          durationS, priority));
    }
    return new Scenario(Scenario.FORMAT, "space telescope day: invented 550 km sun-synchronous orbit, 300 invented fields",
        new TimeWindow(Instant.parse("2031-06-01T00:00:00Z"), Instant.parse("2031-06-02T00:00:00Z")),
        new OrbitObserver(orbit), c, slew, new RaDec(0, 0), requests, new SolverSettings(30, 2, 1));
  }

  /**
   * (c) An invented optical ground station tracking 60 invented low-orbit objects at night: TLEs built with
   * Orekit's constructor (so the checksums are right), satellite numbers 90001-90060, epoch at the horizon
   * start. The target must be sunlit while the site is dark (Sun below -6 deg).
   */
  static Scenario satelliteTracking(AstroContext ctx) {
    Random rnd = new Random(20310910L);
    Instant epoch = Instant.parse("2031-09-10T17:00:00Z");
    // Buildings in the south-west (28 deg, above the 20 deg limit) hides the low parts of some passes.
    GroundSite site = new GroundSite(38.87, 16.24, 610, List.of(new AzEl(0, 10), new AzEl(90, 15), new AzEl(180, 10),
        new AzEl(200, 28), new AzEl(260, 28), new AzEl(270, 12)));
    // elevationMaxDeg 85: an alt-az mount cannot follow an object through the zenith (the azimuth would flip).
    Constraints c = Constraints.builder().sunElevationMaxDeg(-6).elevationMinDeg(20).elevationMaxDeg(85)
        .targetSunlitRequired(true).build();
    List<Request> requests = new ArrayList<>();
    for (int k = 1; k <= 60; k++) {
      double altitudeKm = 450 + 1000 * rnd.nextDouble();
      double a = Constants.WGS84_EARTH_EQUATORIAL_RADIUS + altitudeKm * 1000;
      double meanMotionRadPerS = Math.sqrt(Constants.WGS84_EARTH_MU / (a * a * a));
      double inclinationDeg = 45 + 54 * rnd.nextDouble();
      TLE tle = new TLE(90000 + k, 'U', 2031, 100 + k, "A", 0, 999, ctx.date(epoch), meanMotionRadPerS, 0, 0,
          0.0005 + 0.005 * rnd.nextDouble(), FastMath.toRadians(inclinationDeg), FastMath.toRadians(360 * rnd.nextDouble()),
          FastMath.toRadians(360 * rnd.nextDouble()), FastMath.toRadians(360 * rnd.nextDouble()), 1, 0.0, ctx.utc());
      double durationS = 60 * (1 + rnd.nextInt(3)); // 1 to 3 min of a pass
      double priority = 1 + rnd.nextInt(10);
      requests.add(Request.of(String.format(Locale.ROOT, "SAT%05d", 90000 + k),
          new OrbitingTarget(new Tle(tle.getLine1(), tle.getLine2())), durationS, priority));
    }
    return new Scenario(Scenario.FORMAT, "satellite tracking night: invented station, 60 invented objects",
        new TimeWindow(epoch, Instant.parse("2031-09-11T05:00:00Z")), site, c,
        new SlewSettings.AltAz(5, 4, 2, 2, 5, List.of(-270.0, 270.0)), null,
        requests, new SolverSettings(10, 2, 1));
  }

  private static double round(double v, int decimals) {
    double f = Math.pow(10, decimals);
    return Math.rint(v * f) / f;
  }
}
