package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import dev.sequencer.model.AzEl;
import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.KeplerianElements;
import dev.sequencer.model.Observer;
import dev.sequencer.model.OrbitObserver;
import dev.sequencer.model.OrbitSpec;
import dev.sequencer.model.Pointing;
import dev.sequencer.model.Refraction;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.TimeWindow;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads an {@code observer} (ground site, TLE or Keplerian orbit) and a {@code startPointing}, in the object
 * that holds them: the scenario's top level, or one resource (A6).
 */
final class ObserverParser {
  static final List<String> OBSERVER = List.of("ground", "orbit");
  static final List<String> GROUND = List.of("latitudeDeg", "longitudeDeg", "altitudeM", "horizonMask", "refraction");
  static final List<String> REFRACTION = List.of("pressureHPa", "temperatureC");
  static final List<String> ORBIT = List.of("tle", "keplerian");
  static final List<String> KEPLERIAN =
      List.of("epoch", "semiMajorAxisKm", "eccentricity", "inclinationDeg", "raanDeg", "argumentOfPerigeeDeg",
          "meanAnomalyDeg");
  static final List<String> AZ_EL = List.of("azimuthDeg", "elevationDeg");
  /** Equatorial radius of the Earth (WGS-84), km: the smallest allowed semi-major axis and perigee. */
  static final double EARTH_RADIUS_KM = 6378.137;

  /** An observer as read ({@code null} when absent or invalid) and its kind as far as the reader could tell. */
  record Read(Observer observer, ObserverKind kind) {}

  private final Problems p;
  private final TimeWindow horizon;

  /** {@code horizon} is null when it was invalid (then epochs are not checked against it). */
  ObserverParser(Problems problems, TimeWindow horizon) {
    this.p = problems;
    this.horizon = horizon;
  }

  /** The {@code observer} field of {@code owner}. */
  Read observer(Fields owner) {
    Fields o = owner.object("observer", false, OBSERVER);
    if (o == null) {
      return new Read(null, owner.has("observer") ? ObserverKind.INVALID : ObserverKind.NONE);
    }
    if (o.has("ground") == o.has("orbit")) {
      p.add(o.path(), "must have exactly one of \"ground\" or \"orbit\"", Problems.text(owner.get("observer", false)));
      return new Read(null, ObserverKind.INVALID);
    }
    int before = p.count();
    Observer result;
    ObserverKind kind;
    if (o.has("ground")) {
      kind = ObserverKind.GROUND;
      result = ground(o.object("ground", true, GROUND));
    } else {
      kind = ObserverKind.ORBIT;
      Fields orbit = o.object("orbit", true, ORBIT);
      OrbitSpec spec = orbit == null ? null : orbit(orbit);
      result = spec == null ? null : new OrbitObserver(spec);
    }
    return new Read(p.count() == before ? result : null, kind);
  }

  private GroundSite ground(Fields g) {
    if (g == null) {
      return null;
    }
    Double lat = g.number("latitudeDeg", true, Range.LATITUDE);
    Double lon = g.number("longitudeDeg", true, Range.LONGITUDE);
    Double alt = g.number("altitudeM", true, Range.ALTITUDE_M);
    List<AzEl> mask = new ArrayList<>();
    ArrayNode maskNode = g.array("horizonMask", false);
    if (maskNode != null) {
      for (int i = 0; i < maskNode.size(); i++) {
        String path = g.path("horizonMask") + "[" + i + "]";
        JsonNode pt = maskNode.get(i);
        if (Values.isArray(pt, path, p, 2, "an [azimuthDeg, elevationDeg] pair")) {
          Double az = Values.number(pt.get(0), path + "[0]", p, Range.closed(0, 360));
          Double el = Values.number(pt.get(1), path + "[1]", p, Range.ELEVATION);
          if (az != null && el != null) {
            mask.add(new AzEl(az, el));
          }
        }
      }
    }
    Refraction refraction = null;
    Fields r = g.object("refraction", false, REFRACTION);
    if (r != null) {
      Double pressure = r.number("pressureHPa", true, Range.closed(0, 1200));
      Double temperature = r.number("temperatureC", true, Range.closed(-90, 60));
      refraction = pressure == null || temperature == null ? null : new Refraction(pressure, temperature);
    }
    return lat == null || lon == null || alt == null ? null : new GroundSite(lat, lon, alt, mask, refraction);
  }

  private OrbitSpec orbit(Fields orbit) {
    if (orbit.has("tle") == orbit.has("keplerian")) {
      p.add(orbit.path(), "must have exactly one of \"tle\" or \"keplerian\"", null);
      return null;
    }
    if (orbit.has("tle")) {
      return TleCheck.read(orbit.get("tle", true), orbit.path("tle"), p, horizon);
    }
    Fields k = orbit.object("keplerian", true, KEPLERIAN);
    if (k == null) {
      return null;
    }
    int before = p.count();
    Instant epoch = k.instant("epoch", true);
    Double a = k.number("semiMajorAxisKm", true, Range.above(EARTH_RADIUS_KM));
    Double e = k.number("eccentricity", true, new Range(0, true, 1, false));
    Double i = k.number("inclinationDeg", true, Range.closed(0, 180));
    Double raan = k.number("raanDeg", true, Range.ANY);
    Double argp = k.number("argumentOfPerigeeDeg", true, Range.ANY);
    Double m = k.number("meanAnomalyDeg", true, Range.ANY);
    if (a != null && e != null && a * (1 - e) <= EARTH_RADIUS_KM) {
      p.add(k.path("eccentricity"), String.format(java.util.Locale.ROOT,
          "perigee radius %.3f km (semiMajorAxisKm * (1 - eccentricity)) is inside the Earth (radius %.3f km)",
          a * (1 - e), EARTH_RADIUS_KM), Range.num(e));
    }
    if (epoch != null) {
      Epochs.check(epoch, horizon, k.path("epoch"), epoch.toString(), p, "elements",
          "the motion is integrated from it (two-body + J2, no drag), slower and further from the real orbit");
    }
    return p.count() == before ? new KeplerianElements(epoch, a, e, i, raan, argp, m) : null;
  }

  /**
   * The {@code startPointing} field of {@code owner} (absent: null): RA/Dec, or azimuth/elevation for a
   * ground observer, the azimuth inside an {@code altaz} slew's range when it gives one.
   */
  Pointing startPointing(Fields owner, ObserverKind kind, SlewSettings slew) {
    JsonNode n = owner.get("startPointing", false);
    if (n == null) {
      return null;
    }
    String path = owner.path("startPointing");
    if (n.isObject() && (n.has("azimuthDeg") || n.has("elevationDeg"))) {
      Fields f = Fields.of(n, path, p, AZ_EL);
      Range azRange = new Range(0, true, 360, false);
      if (slew instanceof SlewSettings.AltAz altaz && altaz.azimuthRangeDeg() != null) {
        azRange = Range.closed(altaz.azimuthRangeDeg().get(0), altaz.azimuthRangeDeg().get(1));
      }
      Double az = f.number("azimuthDeg", true, azRange);
      Double el = f.number("elevationDeg", true, Range.ELEVATION);
      if (kind != ObserverKind.GROUND && kind != ObserverKind.INVALID) {
        p.add(path, "an azimuth/elevation pointing needs a ground observer", null);
        return null;
      }
      return az == null || el == null ? null : new AzElPointing(az, el);
    }
    return ScenarioParser.raDec(n, path, p);
  }
}
