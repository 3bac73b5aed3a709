package dev.sequencer.campaign;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.astro.Topocentric;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.TimeWindow;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import org.orekit.time.AbsoluteDate;

/**
 * The dark part of one night at a ground site: the longest interval, in the 24 hours from local mean noon of
 * the evening's date, where the Sun's centre is at most {@code sunMaxDeg} high (geometric elevation, as the
 * scenario format's darkness rule). The Sun comes from the context's series ({@link AstroContext#sun()}),
 * the horizon from {@link Topocentric}. Crossings are found on a 120 s scan and refined by bisection to
 * 0.01 s, then rounded inwards to whole seconds (dusk up, dawn down), so every instant of the returned
 * window is dark.
 */
public final class DarkNights {
  static final long SCAN_S = 120;
  private final AstroContext ctx;
  private final GroundSite site;
  private final Topocentric topo;

  public DarkNights(AstroContext ctx, GroundSite site) {
    this.ctx = ctx;
    this.site = site;
    this.topo = Topocentric.of(ctx, site);
  }

  /** Geometric elevation of the Sun's centre at {@code t}, degrees. */
  public double sunElevationDeg(Instant t) {
    AbsoluteDate d = ctx.date(t);
    return topo.azElOfPosition(ctx.sun().getPosition(d, ctx.inertial()), d).elevationDeg();
  }

  /** Local mean noon of {@code evening} at the site (UTC noon shifted by the longitude, 15 deg per hour). */
  public Instant localNoon(LocalDate evening) {
    double lon = site.longitudeDeg() > 180 ? site.longitudeDeg() - 360 : site.longitudeDeg();
    return evening.atTime(12, 0).toInstant(ZoneOffset.UTC).minusSeconds(Math.round(lon / 15.0 * 3600));
  }

  /** The night after {@code evening}'s noon, or {@code null} when the Sun never gets that low (polar summer). */
  public TimeWindow night(LocalDate evening, double sunMaxDeg) {
    Instant t0 = localNoon(evening);
    long span = 86_400;
    long bestStart = -1;
    long bestEnd = -1;
    long runStart = -1;
    boolean prevDark = false;
    for (long s = 0; s <= span; s += SCAN_S) {
      boolean dark = sunElevationDeg(t0.plusSeconds(s)) <= sunMaxDeg;
      if (dark && !prevDark) {
        runStart = s;
      }
      if (!dark && prevDark) {
        if (s - runStart > bestEnd - bestStart) {
          bestStart = runStart;
          bestEnd = s;
        }
      }
      prevDark = dark;
    }
    if (prevDark && span - runStart > bestEnd - bestStart) {
      bestStart = runStart;
      bestEnd = span;
    }
    if (bestStart < 0) {
      return null;
    }
    double dusk = bestStart == 0 ? 0 : crossing(t0, bestStart - SCAN_S, bestStart, sunMaxDeg);
    double dawn = bestEnd == span ? span : crossing(t0, bestEnd - SCAN_S, bestEnd, sunMaxDeg);
    long a = (long) Math.ceil(dusk);
    long b = (long) Math.floor(dawn);
    return b > a ? new TimeWindow(t0.plusSeconds(a), t0.plusSeconds(b)) : null;
  }

  /** The crossing of the limit between two scan points (seconds from t0), by bisection. */
  private double crossing(Instant t0, double lo, double hi, double limit) {
    boolean loDark = elevation(t0, lo) <= limit;
    while (hi - lo > 0.01) {
      double mid = (lo + hi) / 2;
      if ((elevation(t0, mid) <= limit) == loDark) {
        lo = mid;
      } else {
        hi = mid;
      }
    }
    // dusk (light to dark): the dark side is hi; dawn (dark to light): the dark side is lo
    return loDark ? lo : hi;
  }

  private double elevation(Instant t0, double s) {
    long whole = (long) Math.floor(s);
    long nanos = Math.round((s - whole) * 1e9);
    return sunElevationDeg(t0.plusSeconds(whole).plusNanos(nanos));
  }
}
