package dev.sequencer.planner;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.EarthPoint;
import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.Observer;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.Pointing;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.Target;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Tle;
import dev.sequencer.model.UtilityPoint;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.hipparchus.util.FastMath;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.utils.Constants;

/**
 * Random but realistic scenarios of every kind a user writes (invented sites, satellites and fields; the
 * same seed gives the same scenario). Fields are drawn around the local sidereal time of the site's
 * midnight so that most are observable; masks have a raised sector that binds above the elevation limit;
 * some requests are required (mostly ones that are likely to fit), some flexible (fixed fields from the ground
 * and from orbit, windows-only requests; satellite passes and Earth points stay fixed so that the seeds
 * recorded in tests keep their scenarios).
 */
public final class FuzzScenarios {
  /** The kinds of scenario, each a kind of user. */
  public enum Kind {
    /** A ground telescope: fixed fields, alt-az mount with cable wrap, binding mask, darkness, Moon. */
    GROUND_FIELDS_ALTAZ,
    /** A ground telescope with a fixed overhead per slew (what many queue tools assume). */
    GROUND_FIELDS_FIXED,
    /** A ground station: alt-az antenna or telescope tracking satellites given as TLEs. */
    STATION_TLE_ALTAZ,
    /** A space telescope on a TLE orbit: fixed fields, eigenaxis slews, Sun and limb keep-outs. */
    LEO_TLE_FIELDS,
    /** An Earth-observation satellite on Keplerian elements imaging points on the ground. */
    LEO_KEPLER_EARTH_POINTS,
    /** No observer: windows given per request, a slew table. */
    NO_OBSERVER_MATRIX
  }

  private static final Instant EARLIEST = Instant.parse("2030-01-01T00:00:00Z");

  private FuzzScenarios() {}

  /** The scenario of this kind and seed (8 to 20 requests). */
  public static Scenario generate(Kind kind, long seed, AstroContext ctx) {
    Random rnd = new Random(seed * 31 + kind.ordinal());
    int n = 8 + rnd.nextInt(13);
    return switch (kind) {
      case GROUND_FIELDS_ALTAZ -> groundFields(rnd, n, true);
      case GROUND_FIELDS_FIXED -> groundFields(rnd, n, false);
      case STATION_TLE_ALTAZ -> station(rnd, n, ctx);
      case LEO_TLE_FIELDS -> leoFields(rnd, n, ctx);
      case LEO_KEPLER_EARTH_POINTS -> earthPoints(rnd, n);
      case NO_OBSERVER_MATRIX -> noObserver(rnd, n);
    };
  }

  /** A night from local 18 h to 06 h at a random site and date, fields around the midnight sidereal time. */
  private static Scenario groundFields(Random rnd, int n, boolean altaz) {
    double lat = -50 + 100 * rnd.nextDouble();
    double lon = -180 + 360 * rnd.nextDouble();
    Instant midnight = localMidnight(rnd, lon);
    TimeWindow horizon = new TimeWindow(midnight.minusSeconds(6 * 3600), midnight.plusSeconds(6 * 3600));
    double lst = localSiderealDeg(midnight, lon);
    double elevationMin = 15 + 10 * rnd.nextDouble();
    GroundSite site = new GroundSite(round(lat), round(lon), 200 + rnd.nextInt(2500), mask(rnd, elevationMin));
    Constraints c = Constraints.builder().sunElevationMaxDeg(-12).elevationMinDeg(round(elevationMin))
        .elevationMaxDeg(86).moonSeparationMinDeg(10 + rnd.nextInt(25)).build();
    SlewSettings slew = altaz
        ? new SlewSettings.AltAz(1 + 3 * rnd.nextDouble(), 1 + 2 * rnd.nextDouble(), 0.5 + rnd.nextDouble(),
            0.5 + rnd.nextDouble(), 5 + rnd.nextInt(20), rnd.nextBoolean() ? List.of(-270.0, 270.0) : null)
        : new SlewSettings.Fixed(30 + rnd.nextInt(90));
    List<Request> requests = new ArrayList<>();
    for (int k = 0; k < n; k++) {
      double ra = norm(lst + (-70 + 140 * rnd.nextDouble()));
      double dec = Math.max(-89, Math.min(89, lat + (-55 + 110 * rnd.nextDouble())));
      requests.add(request(rnd, "F" + k, new RaDec(round(ra), round(dec)), 300 + 60 * rnd.nextInt(20),
          true, horizon));
    }
    Pointing start = altaz && rnd.nextBoolean() ? new AzElPointing(rnd.nextInt(360), 30 + rnd.nextInt(50)) : null;
    return scenario("fuzz ground fields", horizon, site, c, slew, start, requests);
  }

  /** A ground station over 12 h tracking LEO objects (TLEs with epoch at the horizon start). */
  private static Scenario station(Random rnd, int n, AstroContext ctx) {
    double lat = -60 + 120 * rnd.nextDouble();
    double lon = -180 + 360 * rnd.nextDouble();
    Instant t0 = EARLIEST.plusSeconds(3600L * rnd.nextInt(24 * 365 * 5));
    TimeWindow horizon = new TimeWindow(t0, t0.plusSeconds(12 * 3600));
    double elevationMin = 10 + 10 * rnd.nextDouble();
    GroundSite site = new GroundSite(round(lat), round(lon), 100 + rnd.nextInt(1000), mask(rnd, elevationMin));
    boolean optical = rnd.nextInt(3) == 0;
    Constraints.Builder cb = Constraints.builder().elevationMinDeg(round(elevationMin)).elevationMaxDeg(85);
    if (optical) {
      cb.sunElevationMaxDeg(-6).targetSunlitRequired(true);
    } else if (rnd.nextBoolean()) {
      // A dish avoiding the Sun by day: the keep-out binds observations and, by default, slews (spec A3).
      cb.sunSeparationMinDeg(10 + rnd.nextInt(25));
    }
    SlewSettings slew = new SlewSettings.AltAz(3 + 4 * rnd.nextDouble(), 2 + 3 * rnd.nextDouble(),
        1 + 2 * rnd.nextDouble(), 1 + 2 * rnd.nextDouble(), 2 + rnd.nextInt(10),
        rnd.nextBoolean() ? List.of(-270.0, 270.0) : null);
    List<Request> requests = new ArrayList<>();
    for (int k = 0; k < n; k++) {
      requests.add(request(rnd, "SAT" + (91000 + k), new OrbitingTarget(tle(rnd, 91000 + k, t0, ctx)),
          60 + 30 * rnd.nextInt(8), false, horizon));
    }
    return scenario("fuzz station", horizon, site, cb.build(), slew, null, requests);
  }

  /** A space telescope on a TLE orbit, 6 h, fixed fields anywhere on the sky. */
  private static Scenario leoFields(Random rnd, int n, AstroContext ctx) {
    Instant t0 = EARLIEST.plusSeconds(3600L * rnd.nextInt(24 * 365 * 5));
    TimeWindow horizon = new TimeWindow(t0, t0.plusSeconds(6 * 3600));
    Observer obs = new OrbitObserver(tle(rnd, 92000, t0, ctx));
    Constraints c = Constraints.builder().sunSeparationMinDeg(40 + rnd.nextInt(20)).moonSeparationMinDeg(10)
        .earthLimbMinDeg(10 + rnd.nextInt(15)).build();
    SlewSettings slew = new SlewSettings.Eigenaxis(0.3 + rnd.nextDouble(), 0.01 + 0.05 * rnd.nextDouble(),
        10 + rnd.nextInt(30));
    List<Request> requests = new ArrayList<>();
    for (int k = 0; k < n; k++) {
      double ra = 360 * rnd.nextDouble();
      double dec = Math.toDegrees(Math.asin(2 * rnd.nextDouble() - 1));
      requests.add(request(rnd, "S" + k, new RaDec(round(ra), round(dec)), 300 + 60 * rnd.nextInt(15), true, horizon));
    }
    return scenario("fuzz space telescope", horizon, obs, c, slew, new RaDec(0, 0), requests);
  }

  /** An imaging satellite on Keplerian elements, 12 h, points on the ground within its latitude reach. */
  private static Scenario earthPoints(Random rnd, int n) {
    Instant t0 = EARLIEST.plusSeconds(3600L * rnd.nextInt(24 * 365 * 5));
    TimeWindow horizon = new TimeWindow(t0, t0.plusSeconds(12 * 3600));
    double inclination = 45 + 53 * rnd.nextDouble();
    // Ordinary osculating elements as users write them (near-circular, any angles).
    KeplerianElements k = new KeplerianElements(t0, 6878.137 + 300 * rnd.nextDouble(), 0.002 * rnd.nextDouble(),
        round(inclination), round(360 * rnd.nextDouble()), round(360 * rnd.nextDouble()), round(360 * rnd.nextDouble()));
    Constraints c = Constraints.builder().elevationMinDeg(30 + 20 * rnd.nextDouble()).build();
    SlewSettings slew = new SlewSettings.Eigenaxis(0.5 + 2 * rnd.nextDouble(), 0.05 + 0.2 * rnd.nextDouble(),
        5 + rnd.nextInt(20));
    List<Request> requests = new ArrayList<>();
    for (int q = 0; q < n; q++) {
      double lat = (-inclination + 2 * inclination * rnd.nextDouble()) * 0.9;
      double lon = -180 + 360 * rnd.nextDouble();
      requests.add(request(rnd, "P" + q, new EarthPoint(round(lat), round(lon), 0), 10 + 10 * rnd.nextInt(6), false,
          horizon));
    }
    return scenario("fuzz imager", horizon, new OrbitObserver(k), c, slew, null, requests);
  }

  /** No observer: each request with 1 to 3 windows of its own, a random table or a fixed overhead. */
  private static Scenario noObserver(Random rnd, int n) {
    Instant t0 = EARLIEST.plusSeconds(3600L * rnd.nextInt(24 * 365 * 5));
    long h = 4 * 3600;
    TimeWindow horizon = new TimeWindow(t0, t0.plusSeconds(h));
    List<Request> requests = new ArrayList<>();
    for (int k = 0; k < n; k++) {
      List<TimeWindow> w = new ArrayList<>();
      int count = 1 + rnd.nextInt(3);
      for (int q = 0; q < count; q++) {
        long a = rnd.nextInt((int) (h - 600));
        long len = 300 + rnd.nextInt(3000);
        w.add(new TimeWindow(t0.plusSeconds(a), t0.plusSeconds(Math.min(h, a + len))));
      }
      w.sort((x, y) -> x.start().compareTo(y.start()));
      List<TimeWindow> merged = new ArrayList<>();
      for (TimeWindow x : w) {
        if (!merged.isEmpty() && !x.start().isAfter(merged.get(merged.size() - 1).end())) {
          TimeWindow last = merged.remove(merged.size() - 1);
          merged.add(new TimeWindow(last.start(), x.end().isAfter(last.end()) ? x.end() : last.end()));
        } else {
          merged.add(x);
        }
      }
      requests.add(request(rnd, "W" + k, null, 120 + 60 * rnd.nextInt(10), true, horizon).withWindows(merged));
    }
    SlewSettings slew;
    if (rnd.nextBoolean()) {
      List<List<Double>> table = new ArrayList<>();
      for (int i = 0; i < n; i++) {
        List<Double> row = new ArrayList<>();
        for (int j = 0; j < n; j++) {
          row.add(i == j ? 0.0 : (double) (10 + rnd.nextInt(200)));
        }
        table.add(row);
      }
      List<Double> fromStart = new ArrayList<>();
      for (int j = 0; j < n; j++) {
        fromStart.add((double) rnd.nextInt(100));
      }
      slew = new SlewSettings.Matrix(table, fromStart);
    } else {
      slew = new SlewSettings.Fixed(rnd.nextInt(120));
    }
    return scenario("fuzz windows only", horizon, null, Constraints.none(), slew, null, requests);
  }

  /**
   * A request: fixed (duration, priority 1–10, one decimal one time in four) or, when allowed and one time
   * in four, flexible from half to twice the duration on a 60 s grid with a concave or linear curve. None
   * is required: {@link #withRequired} marks some once the windows are known.
   */
  private static Request request(Random rnd, String id, Target target, long durationS, boolean flexibleAllowed,
      TimeWindow horizon) {
    boolean required = false;
    if (flexibleAllowed && rnd.nextInt(4) == 0) {
      long min = Math.max(60, 60 * (durationS / 120));
      long max = Math.max(min + 60, 60 * (2 * durationS / 60));
      double v0 = 1 + rnd.nextInt(5);
      double v1 = v0 + 1 + rnd.nextInt(5);
      List<UtilityPoint> curve = rnd.nextBoolean()
          ? List.of(new UtilityPoint(min, v0), new UtilityPoint(max, v1))
          : List.of(new UtilityPoint(min, v0), new UtilityPoint((min + max) / 2.0, v0 + 0.8 * (v1 - v0)),
              new UtilityPoint(max, v1));
      return new Request(id, target, null, null, required, List.of(), new FlexibleExposure(min, max, 60, curve));
    }
    double priority = rnd.nextInt(4) == 0 ? 1 + rnd.nextInt(90) / 10.0 : 1 + rnd.nextInt(10);
    return new Request(id, target, (double) durationS, priority, required, List.of(), null);
  }

  private static Scenario scenario(String name, TimeWindow horizon, Observer observer, Constraints c,
      SlewSettings slew, Pointing start, List<Request> requests) {
    return new Scenario(Scenario.FORMAT, name, horizon, observer, c, slew, start, requests, null);
  }

  /**
   * A copy with 0 to 3 required requests: one time in three none; else each drawn from {@code planned}
   * (requests some plan holds, so that a plan with them exists) seven times in ten, from all requests
   * otherwise (possibly never visible or in conflict: the infeasible and no-plan paths).
   */
  public static Scenario withRequired(Scenario s, List<String> planned, Random rnd) {
    if (rnd.nextInt(3) == 0) {
      return s;
    }
    java.util.Set<String> required = new java.util.HashSet<>();
    int count = 1 + rnd.nextInt(3);
    for (int i = 0; i < count; i++) {
      if (!planned.isEmpty() && rnd.nextInt(10) < 7) {
        required.add(planned.get(rnd.nextInt(planned.size())));
      } else {
        required.add(s.requests().get(rnd.nextInt(s.requests().size())).id());
      }
    }
    return s.withRequests(s.requests().stream().map(r -> r.withRequired(required.contains(r.id()))).toList());
  }

  /**
   * A copy with the rules people write on top (format additions A4, A5): one request in four with 2–3 visits
   * (separations of 0–60 min, a maximum one time in three, one per window one time in three, all or nothing
   * one time in four), and up to two groups over requests without visits: one all or nothing, one ordered
   * (a maximum gap one time in three). A request is in at most one group.
   */
  public static Scenario withStructure(Scenario s, Random rnd) {
    List<Request> requests = new ArrayList<>();
    for (Request q : s.requests()) {
      if (rnd.nextInt(4) == 0) {
        double min = 300 * rnd.nextInt(13);
        Double max = rnd.nextInt(3) == 0 ? min + 1800 + 300 * rnd.nextInt(24) : null;
        requests.add(q.withVisits(new dev.sequencer.model.Visits(2 + rnd.nextInt(2), min, max, rnd.nextInt(3) == 0,
            rnd.nextInt(4) == 0)));
      } else {
        requests.add(q);
      }
    }
    List<String> plain = new ArrayList<>(requests.stream().filter(q -> !q.hasVisits()).map(Request::id).toList());
    java.util.Collections.shuffle(plain, rnd);
    List<dev.sequencer.model.Group> groups = new ArrayList<>();
    if (plain.size() >= 2 && rnd.nextBoolean()) {
      groups.add(new dev.sequencer.model.Group("ALL", List.copyOf(plain.subList(0, 2)), true, false, null, false));
      plain = plain.subList(2, plain.size());
    }
    if (plain.size() >= 2) {
      int n = Math.min(plain.size(), 2 + rnd.nextInt(2));
      groups.add(new dev.sequencer.model.Group("CHAIN", List.copyOf(plain.subList(0, n)), rnd.nextBoolean(), true,
          rnd.nextInt(3) == 0 ? 600.0 + 300 * rnd.nextInt(12) : null, false));
    }
    return new Scenario(s.format(), s.name() + " with visits and groups", s.horizon(), s.observer(), s.constraints(),
        s.slew(), s.startPointing(), requests, s.solver(), groups, s.reconfiguration(), s.startConfiguration(),
        s.resources());
  }

  /**
   * The same requests on 2 or 3 resources (format addition A6): the scenario's own observer, slew model and
   * start pointing as the first; the others a ground site moved by a few degrees (a network: other sky,
   * a night shifted by up to an hour) with a stricter elevation minimum, or for a spacecraft a twin on the
   * same orbit with a stricter Sun keep-out, or without an observer the same table; each request restricted
   * to one random resource one time in five.
   */
  public static Scenario withResources(Scenario s, Random rnd) {
    int m = 2 + rnd.nextInt(2);
    List<dev.sequencer.model.Resource> resources = new ArrayList<>();
    resources.add(new dev.sequencer.model.Resource("r1", s.observer(), s.slew(), s.startPointing(), null, null));
    for (int r = 2; r <= m; r++) {
      Observer o = s.observer();
      Constraints own = Constraints.none();
      if (o instanceof GroundSite g) {
        o = new GroundSite(Math.max(-80, Math.min(80, g.latitudeDeg() + (rnd.nextDouble() * 12 - 6))),
            norm(g.longitudeDeg() + rnd.nextDouble() * 30 - 15), g.altitudeM(), g.horizonMask(), g.refraction());
        double min = s.constraints().elevationMinDeg() == null ? 10 : s.constraints().elevationMinDeg();
        own = Constraints.builder().elevationMinDeg(min + 5).build();
      } else if (o instanceof OrbitObserver && s.constraints().sunSeparationMinDeg() != null) {
        own = Constraints.builder().sunSeparationMinDeg(s.constraints().sunSeparationMinDeg() + 10).build();
      }
      resources.add(new dev.sequencer.model.Resource("r" + r, o, s.slew(), s.startPointing(),
          dev.sequencer.model.ConstraintOverrides.setting(own), null));
    }
    List<Request> requests = new ArrayList<>();
    for (Request q : s.requests()) {
      requests.add(rnd.nextInt(5) == 0 ? q.withResources(List.of("r" + (1 + rnd.nextInt(m)))) : q);
    }
    return new Scenario(s.format(), s.name() + " on " + m + " resources", s.horizon(), null, s.constraints(),
        s.slew(), null, requests, s.solver(), s.groups(), s.reconfiguration(), s.startConfiguration(), resources);
  }

  /** A mask with a raised sector (up to 25° above the elevation limit) that binds for some targets, across 0°/360° one time in three. */
  private static List<AzEl> mask(Random rnd, double elevationMin) {
    double centre = rnd.nextInt(3) == 0 ? 0 : rnd.nextInt(360);
    double half = 20 + rnd.nextInt(40);
    double peak = elevationMin + 5 + rnd.nextInt(20);
    List<AzEl> out = new ArrayList<>();
    out.add(new AzEl(norm(centre - half - 10), Math.max(0, elevationMin - 10)));
    out.add(new AzEl(norm(centre - half), peak));
    out.add(new AzEl(norm(centre + half), peak));
    out.add(new AzEl(norm(centre + half + 10), Math.max(0, elevationMin - 10)));
    out.add(new AzEl(norm(centre + 180), rnd.nextInt(8)));
    return out;
  }

  /** An invented LEO object (450–1400 km, inclination 40–99°) with an epoch at {@code epoch}. */
  private static Tle tle(Random rnd, int satnum, Instant epoch, AstroContext ctx) {
    double altitudeKm = 450 + 950 * rnd.nextDouble();
    double a = Constants.WGS84_EARTH_EQUATORIAL_RADIUS + altitudeKm * 1000;
    double meanMotion = Math.sqrt(Constants.WGS84_EARTH_MU / (a * a * a));
    TLE t = new TLE(satnum, 'U', 2031, 100 + satnum % 900, "A", 0, 999, ctx.date(epoch), meanMotion, 0, 0,
        0.0005 + 0.005 * rnd.nextDouble(), FastMath.toRadians(40 + 59 * rnd.nextDouble()),
        FastMath.toRadians(360 * rnd.nextDouble()), FastMath.toRadians(360 * rnd.nextDouble()),
        FastMath.toRadians(360 * rnd.nextDouble()), 1, 0.0, ctx.utc());
    return new Tle(t.getLine1(), t.getLine2());
  }

  /** A random date's local midnight at longitude {@code lon} (UTC = 24 h − lon/15). */
  private static Instant localMidnight(Random rnd, double lon) {
    Instant day = EARLIEST.plusSeconds(86_400L * rnd.nextInt(365 * 5));
    return day.plusSeconds((long) ((24 - lon / 15) * 3600) % 86_400);
  }

  /**
   * Local mean sidereal time, degrees: GMST = 280.46061837 + 360.98564736629 (JD − 2451545.0) (Meeus,
   * Astronomical Algorithms, 2nd ed., eq. 12.4, from memory); here only to aim fields at the night sky.
   */
  private static double localSiderealDeg(Instant t, double lon) {
    double jd = t.getEpochSecond() / 86_400.0 + 2440587.5;
    return norm(280.46061837 + 360.98564736629 * (jd - 2451545.0) + lon);
  }

  private static double norm(double deg) {
    return ((deg % 360) + 360) % 360;
  }

  private static double round(double v) {
    return Math.rint(v * 1000) / 1000;
  }

  /** A one-line description for failure messages. */
  public static String describe(Scenario s) {
    return String.format(Locale.ROOT, "%s, %d requests, horizon %s", s.name(), s.requests().size(), s.horizon());
  }
}
