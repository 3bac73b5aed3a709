package dev.sequencer.validate;

import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.Observation;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.validate.Violation.Kind;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.orekit.time.AbsoluteDate;

/**
 * The validator's own slew time of every leg of a timeline, from the scenario's slew settings and its own
 * pointing ({@link Sky}); written apart from the planner's slew package.
 *
 * <p>A leg runs from the previous observation's pointing at its end (or the start pointing at the horizon
 * start) to the next observation's pointing at its start (the format's definition), rest to rest
 * ({@link RestToRestProfile}):
 *
 * <ul>
 *   <li><b>eigenaxis</b>: the angle between the two lines of sight, atan2(|a × b|, a · b); the profile plus
 *       settle, 0 when the angle is 0 or the two requests point at the same catalogue direction (the mount keeps
 *       tracking it); without a start pointing the first leg is 0. With {@code slewVia} (A3) the chain of legs
 *       through those catalogue directions (taken as written, GCRF, without aberration): the sum of the legs'
 *       profiles plus one settle.
 *   <li><b>altaz</b> (ground sites): each axis its own profile, the slower axis plus settle (0 when neither
 *       moves more than {@link #NO_MOVE_DEG}); the target's elevation at arrival must lie in the mount's
 *       [0°, 90°]. Cable wrap: the mount's unwrapped azimuth starts at the start pointing's azimuth if inside {@code azimuthRangeDeg}, else at
 *       its branch nearest the range centre (without a start pointing: 0 s onto the first target's branch
 *       nearest the centre); each leg goes to the branch of the target's azimuth nearest the current one inside
 *       the range (ties to the branch nearer the centre); during an observation the mount follows the target's
 *       continuous azimuth, unwrapped by sampling (at most 10 s apart, halved where the azimuth turns more than
 *       30° between samples, down to 0.25 s); a departure outside the range means the cable wrap ran out.
 *   <li><b>fixed</b>: the same seconds for every leg, the first one included; <b>matrix</b>: the table by the
 *       requests' file order, {@code fromStartSeconds} (0 when absent) for the first leg.
 * </ul>
 */
final class SlewLegs {
  /** Mount elevation limits of the alt-az model, degrees (the format's default mount). */
  static final double MOUNT_ELEVATION_MIN_DEG = 0;
  static final double MOUNT_ELEVATION_MAX_DEG = 90;
  /**
   * Axis moves at or below this are no move (alt-az): the noise of summing the unwrapped azimuth over an
   * observation, where one target is tracked through two back-to-back observations (3.6 micro-arcseconds).
   */
  static final double NO_MOVE_DEG = 1e-9;
  private static final double UNWRAP_STEP_S = 10;
  private static final double UNWRAP_MAX_TURN_DEG = 30;
  private static final double UNWRAP_MIN_S = 0.25;

  /**
   * One leg: its seconds (+inf when impossible, with {@code problem} saying why), and its path for the
   * keep-outs (A3): for eigenaxis the chain of GCRF directions (from, via..., to), for alt-az {u, e0, v, e1}
   * (unwrapped azimuths and elevations, degrees, at departure and arrival); both null when the leg has no path.
   */
  record Leg(double seconds, Violation problem, List<Vector3D> chain, double[] axes) {}

  private final Sky sky;
  private final SlewSettings settings;
  private final List<Request> requests;

  SlewLegs(Sky sky) {
    this.sky = sky;
    this.settings = sky.scenario().slew();
    this.requests = sky.scenario().requests();
  }

  /** Legs into each observation; {@code req.get(k)} is the request of {@code obs.get(k)} (none unknown). */
  List<Leg> legs(List<Observation> obs, List<Request> req) {
    List<Leg> out = new ArrayList<>();
    Instant horizonStart = sky.scenario().horizon().start();
    if (settings instanceof SlewSettings.AltAz a) {
      return altaz(a, obs, req);
    }
    for (int k = 0; k < obs.size(); k++) {
      Observation o = obs.get(k);
      if (!o.slewVia().isEmpty() && !(settings instanceof SlewSettings.Eigenaxis)) {
        out.add(new Leg(Double.POSITIVE_INFINITY, Violation.of(Kind.SLEW_VIA, o.id(), o.start(),
            "observation " + o.id() + ": slewVia is only defined for the eigenaxis slew model (this one is '"
                + settings.model() + "')"), null, null));
        continue;
      }
      if (settings instanceof SlewSettings.Fixed f) {
        out.add(new Leg(f.seconds(), null, null, null));
      } else if (settings instanceof SlewSettings.Matrix m) {
        int to = requests.indexOf(req.get(k));
        double s = k == 0 ? (m.fromStartSeconds() == null ? 0 : m.fromStartSeconds().get(to))
            : m.seconds().get(requests.indexOf(req.get(k - 1))).get(to);
        out.add(new Leg(s, null, null, null));
      } else {
        SlewSettings.Eigenaxis e = (SlewSettings.Eigenaxis) settings;
        Instant departure = k == 0 ? horizonStart : obs.get(k - 1).end();
        out.add(eigenaxis(e, k == 0 ? null : req.get(k - 1), req.get(k), o, departure));
      }
    }
    return out;
  }

  /** The eigenaxis leg from request {@code from} (null: the start pointing) at {@code departure} into {@code o}. */
  private Leg eigenaxis(SlewSettings.Eigenaxis e, Request from, Request to, Observation o, Instant departure) {
    if (!sky.hasObserver()) {
      return new Leg(0, null, null, null); // no geometry (the reader refuses this; nothing to measure)
    }
    AbsoluteDate td = sky.date(departure);
    AbsoluteDate ta = sky.date(o.start());
    Vector3D a = from == null ? sky.startLineOfSight(td) : sky.lineOfSight(from, td);
    if (a == null) {
      return new Leg(0, null, null, null); // no start pointing: the instrument starts on the first target
    }
    Object fromTarget = from == null ? sky.scenario().startPointing() : from.target();
    if (o.slewVia().isEmpty() && fromTarget instanceof RaDec && fromTarget.equals(to.target())) {
      return new Leg(0, null, null, null); // the same catalogue direction: the mount keeps tracking it
    }
    List<Vector3D> chain = new ArrayList<>();
    chain.add(a);
    for (RaDec via : o.slewVia()) {
      chain.add(Sky.direction(via));
    }
    chain.add(sky.lineOfSight(to, ta));
    RestToRestProfile p = new RestToRestProfile(e.rateDegPerS(), e.accelDegPerS2());
    double moving = 0;
    boolean moves = false;
    for (int i = 1; i < chain.size(); i++) {
      double angle = angleDeg(chain.get(i - 1), chain.get(i));
      moves |= angle > 0;
      moving += p.seconds(angle);
    }
    return new Leg(moves ? moving + e.settleS() : 0, null, moves ? chain : null, null);
  }

  /** The angle between two directions, degrees, accurate near 0° and 180°. */
  static double angleDeg(Vector3D a, Vector3D b) {
    return Math.toDegrees(Math.atan2(Vector3D.crossProduct(a, b).getNorm(), Vector3D.dotProduct(a, b)));
  }

  private List<Leg> altaz(SlewSettings.AltAz a, List<Observation> obs, List<Request> req) {
    List<Leg> out = new ArrayList<>();
    Wrap wrap = a.azimuthRangeDeg() == null ? Wrap.NONE : new Wrap(a.azimuthRangeDeg().get(0), a.azimuthRangeDeg().get(1));
    RestToRestProfile az = new RestToRestProfile(a.azimuthRateDegPerS(), a.azimuthAccelDegPerS2());
    RestToRestProfile el = new RestToRestProfile(a.elevationRateDegPerS(), a.elevationAccelDegPerS2());
    double state = Double.NaN; // the mount's unwrapped azimuth after the previous leg's arrival
    Violation lost = null;
    for (int k = 0; k < obs.size(); k++) {
      Observation o = obs.get(k);
      if (!o.slewVia().isEmpty()) {
        out.add(new Leg(Double.POSITIVE_INFINITY, Violation.of(Kind.SLEW_VIA, o.id(), o.start(),
            "observation " + o.id() + ": slewVia is only defined for the eigenaxis slew model (this one is 'altaz')"),
            null, null));
        lost = out.get(k).problem();
        continue;
      }
      if (sky.ground() == null || lost != null) {
        out.add(new Leg(Double.POSITIVE_INFINITY, lost != null ? lost : Violation.of(Kind.SLEW_IMPOSSIBLE, o.id(),
            o.start(), "observation " + o.id() + ": the altaz slew model needs a ground site"), null, null));
        continue;
      }
      AbsoluteDate ta = sky.date(o.start());
      double[] target = sky.azEl(sky.lineOfSight(req.get(k), ta), ta);
      if (target[1] < MOUNT_ELEVATION_MIN_DEG || target[1] > MOUNT_ELEVATION_MAX_DEG) {
        lost = Violation.of(Kind.SLEW_IMPOSSIBLE, o.id(), o.start(), target[1], target[1] < 0 ? 0 : 90,
            String.format(Locale.ROOT, "observation %s: the mount cannot reach elevation %.4f deg at %s", o.id(),
                target[1], o.start()));
        out.add(new Leg(Double.POSITIVE_INFINITY, lost, null, null));
        continue;
      }
      double u;
      double fromEl;
      if (k == 0) {
        if (sky.scenario().startPointing() == null) {
          state = wrap.initial(target[0]);
          out.add(new Leg(0, null, null, null));
          if (Double.isNaN(state)) {
            lost = noBranch(o, target[0], wrap);
            out.set(k, new Leg(Double.POSITIVE_INFINITY, lost, null, null));
          }
          continue;
        }
        double[] start = sky.scenario().startPointing() instanceof AzElPointing p
            ? new double[] {p.azimuthDeg(), p.elevationDeg()}
            : sky.azEl(sky.startLineOfSight(sky.date(sky.scenario().horizon().start())),
                sky.date(sky.scenario().horizon().start()));
        u = wrap.initial(start[0]);
        fromEl = start[1];
      } else {
        Request prev = req.get(k - 1);
        AbsoluteDate arrived = sky.date(obs.get(k - 1).start());
        AbsoluteDate td = sky.date(obs.get(k - 1).end());
        u = state + unwrappedChangeDeg(prev, arrived, td);
        fromEl = sky.azEl(sky.lineOfSight(prev, td), td)[1];
      }
      if (Double.isNaN(u) || !wrap.contains(u)) {
        lost = Violation.of(Kind.CABLE_WRAP, o.id(), k == 0 ? sky.scenario().horizon().start() : obs.get(k - 1).end(),
            u, Double.isNaN(u) || u < wrap.minDeg ? wrap.minDeg : wrap.maxDeg, String.format(Locale.ROOT,
                "observation %s: the mount's unwrapped azimuth %.4f deg is outside azimuthRangeDeg [%s, %s] when "
                    + "the slew into it departs (the cable wrap ran out)", o.id(), u, wrap.minDeg, wrap.maxDeg));
        out.add(new Leg(Double.POSITIVE_INFINITY, lost, null, null));
        continue;
      }
      double v = wrap.nearestLegal(target[0], u);
      if (Double.isNaN(v)) {
        lost = noBranch(o, target[0], wrap);
        out.add(new Leg(Double.POSITIVE_INFINITY, lost, null, null));
        continue;
      }
      double dAz = Math.abs(v - u);
      double dEl = Math.abs(target[1] - fromEl);
      boolean moves = dAz > NO_MOVE_DEG || dEl > NO_MOVE_DEG;
      double seconds = moves ? Math.max(az.seconds(dAz), el.seconds(dEl)) + a.settleS() : 0;
      out.add(new Leg(seconds, null, null, moves ? new double[] {u, fromEl, v, target[1]} : null));
      state = v;
    }
    return out;
  }

  private static Violation noBranch(Observation o, double azimuthDeg, Wrap wrap) {
    return Violation.of(Kind.SLEW_IMPOSSIBLE, o.id(), o.start(), azimuthDeg, wrap.minDeg, String.format(Locale.ROOT,
        "observation %s: no branch of azimuth %.4f deg lies inside azimuthRangeDeg [%s, %s]", o.id(), azimuthDeg,
        wrap.minDeg, wrap.maxDeg));
  }

  /** The continuous change of the request's azimuth from {@code a} to {@code b} (b >= a), degrees. */
  double unwrappedChangeDeg(Request r, AbsoluteDate a, AbsoluteDate b) {
    double length = b.durationFrom(a);
    if (length <= 0) {
      return 0;
    }
    int n = Math.max(1, (int) Math.ceil(length / UNWRAP_STEP_S));
    double sum = 0;
    double prevAz = azimuth(r, a);
    for (int i = 1; i <= n; i++) {
      AbsoluteDate t0 = a.shiftedBy((i - 1) * length / n);
      AbsoluteDate t1 = i == n ? b : a.shiftedBy(i * length / n);
      double az1 = azimuth(r, t1);
      sum += piece(r, t0, t1, prevAz, az1);
      prevAz = az1;
    }
    return sum;
  }

  private double piece(Request r, AbsoluteDate t0, AbsoluteDate t1, double az0, double az1) {
    double d = Math.IEEEremainder(az1 - az0, 360);
    double length = t1.durationFrom(t0);
    if (Math.abs(d) <= UNWRAP_MAX_TURN_DEG || length <= UNWRAP_MIN_S) {
      return d;
    }
    AbsoluteDate mid = t0.shiftedBy(length / 2);
    double azMid = azimuth(r, mid);
    return piece(r, t0, mid, az0, azMid) + piece(r, mid, t1, azMid, az1);
  }

  private double azimuth(Request r, AbsoluteDate t) {
    return sky.azEl(sky.lineOfSight(r, t), t)[0];
  }

  /** The allowed unwrapped azimuth [minDeg, maxDeg] of the mount; infinite ends for none. */
  record Wrap(double minDeg, double maxDeg) {
    static final Wrap NONE = new Wrap(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);

    boolean limited() {
      return Double.isFinite(minDeg);
    }

    boolean contains(double deg) {
      return deg >= minDeg && deg <= maxDeg;
    }

    /** The branch az + 360 k inside the range nearest {@code fromDeg}, ties to the one nearer the centre; NaN if none. */
    double nearestLegal(double azDeg, double fromDeg) {
      if (!limited()) {
        return azDeg + 360 * Math.rint((fromDeg - azDeg) / 360);
      }
      double centre = (minDeg + maxDeg) / 2;
      double best = Double.NaN;
      double k0 = Math.ceil((minDeg - azDeg) / 360);
      for (double k = k0; azDeg + 360 * k <= maxDeg; k++) {
        double v = azDeg + 360 * k;
        if (!contains(v)) {
          continue;
        }
        double dv = Math.abs(v - fromDeg);
        double db = Double.isNaN(best) ? Double.POSITIVE_INFINITY : Math.abs(best - fromDeg);
        if (dv < db || (dv == db && Math.abs(v - centre) < Math.abs(best - centre))) {
          best = v;
        }
      }
      return best;
    }

    /** The mount's first unwrapped azimuth: the value itself if inside, else its branch nearest the centre. */
    double initial(double azDeg) {
      if (contains(azDeg)) {
        return azDeg;
      }
      return limited() ? nearestLegal(azDeg, (minDeg + maxDeg) / 2) : azDeg;
    }
  }
}
