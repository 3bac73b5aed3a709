package dev.sequencer.astro;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalTime;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Objects;
import org.orekit.bodies.OneAxisEllipsoid;
import org.orekit.data.DataContext;
import org.orekit.data.DirectoryCrawler;
import org.orekit.data.LazyLoadedDataContext;
import org.orekit.frames.Frame;
import org.orekit.frames.Frames;
import org.orekit.time.AbsoluteDate;
import org.orekit.time.DateComponents;
import org.orekit.time.DateTimeComponents;
import org.orekit.time.TimeScale;
import org.orekit.time.TimeScales;
import org.orekit.utils.Constants;
import org.orekit.utils.ExtendedPositionProvider;
import org.orekit.utils.IERSConventions;

/**
 * Everything astronomical the library needs, built once and passed explicitly: time scales, the inertial
 * (GCRF) and Earth-fixed (ITRF) frames, the WGS-84 Earth, and Sun and Moon position providers.
 *
 * <p>{@link #offline()} needs no data directory and no network: UTC comes from the bundled leap-second
 * table, the Earth frames use no Earth-orientation data (Orekit then applies zero UT1-UTC, polar motion and
 * nutation corrections, which moves a pointing by at most about 0.004 deg), and the Sun and Moon come from
 * published series ({@link SunSeries}, {@link MoonSeries}). {@link #fromOrekitData(Path)} uses a full
 * Orekit data directory instead (JPL ephemerides, EOP) for users who have one. The JVM-wide default
 * Orekit context is never read nor changed.
 *
 * <p>Immutable and thread-safe once built (Orekit frames and time scales are).
 */
public final class AstroContext {
  private final DataContext dataContext;
  private final ExtendedPositionProvider sun;
  private final ExtendedPositionProvider moon;
  private final LocalDate leapSecondsValidUntil;
  private final String description;
  private final Frame itrf;
  private final OneAxisEllipsoid earth;

  private AstroContext(
      DataContext dataContext,
      ExtendedPositionProvider sun,
      ExtendedPositionProvider moon,
      LocalDate leapSecondsValidUntil,
      String description) {
    this.dataContext = dataContext;
    this.sun = sun;
    this.moon = moon;
    this.leapSecondsValidUntil = leapSecondsValidUntil;
    this.description = description;
    this.itrf = dataContext.getFrames().getITRF(IERSConventions.IERS_2010, true);
    this.earth = new OneAxisEllipsoid(
        Constants.WGS84_EARTH_EQUATORIAL_RADIUS, Constants.WGS84_EARTH_FLATTENING, itrf);
  }

  /** The built-in context: bundled leap seconds, no EOP, series Sun and Moon. */
  public static AstroContext offline() {
    return Holder.OFFLINE;
  }

  /**
   * The built-in context with another leap-second table, e.g. one read by {@link LeapSecondTable#read} from
   * a newer IERS file than the bundled one.
   */
  public static AstroContext offline(LeapSecondTable table) {
    Objects.requireNonNull(table, "table");
    return buildOffline(table);
  }

  private static final class Holder {
    static final AstroContext OFFLINE = buildOffline(LeapSecondTable.bundled());
  }

  private static AstroContext buildOffline(LeapSecondTable table) {
    TimeScales timeScales = TimeScales.of(table.offsetModels(), (conventions, scales) -> List.of());
    Frames frames = Frames.of(timeScales, () -> {
      throw new UnsupportedOperationException(
          "the offline context has no solar-system barycentre (ICRF); use GCRF or an Orekit data directory");
    });
    DataContext ctx = new OfflineDataContext(timeScales, frames);
    return new AstroContext(
        ctx,
        new SunSeries(timeScales, frames),
        new MoonSeries(timeScales, frames),
        table.validUntil(),
        "offline (leap seconds from " + table.source() + " to " + table.validUntil()
            + ", no EOP, series Sun and Moon)");
  }

  /**
   * A context reading a full Orekit data directory (leap seconds, EOP, JPL ephemerides). The directory is
   * read lazily by Orekit on first use; a missing directory fails here.
   */
  public static AstroContext fromOrekitData(Path directory) {
    Objects.requireNonNull(directory, "directory");
    if (!Files.isDirectory(directory)) {
      throw new IllegalArgumentException("Orekit data directory " + directory + " does not exist");
    }
    LazyLoadedDataContext ctx = new LazyLoadedDataContext();
    ctx.getDataProvidersManager().addProvider(new DirectoryCrawler(directory.toFile()));
    return new AstroContext(
        ctx,
        ctx.getCelestialBodies().getSun(),
        ctx.getCelestialBodies().getMoon(),
        LocalDate.MAX,
        "Orekit data directory " + directory + " (JPL Sun and Moon, EOP)");
  }

  /** The Orekit data context behind this one. */
  public DataContext dataContext() {
    return dataContext;
  }

  /** Time scales (UTC, TT, ...). */
  public TimeScales timeScales() {
    return dataContext.getTimeScales();
  }

  /** UTC. */
  public TimeScale utc() {
    return dataContext.getTimeScales().getUTC();
  }

  /** The inertial frame all directions are expressed in: GCRF (ICRS axes, geocentric). */
  public Frame inertial() {
    return dataContext.getFrames().getGCRF();
  }

  /** The Earth-fixed frame: ITRF, IERS 2010 conventions, simple EOP (none in the offline context). */
  public Frame earthFixed() {
    return itrf;
  }

  /** The WGS-84 ellipsoid in the Earth-fixed frame. */
  public OneAxisEllipsoid earth() {
    return earth;
  }

  /** The Sun's geometric geocentric position. */
  public ExtendedPositionProvider sun() {
    return sun;
  }

  /** The Moon's geometric geocentric position. */
  public ExtendedPositionProvider moon() {
    return moon;
  }

  /** The last date the leap-second data is known to be complete for. */
  public LocalDate leapSecondsValidUntil() {
    return leapSecondsValidUntil;
  }

  /** True when {@code t} is after the leap-second table's validity date. */
  public boolean beyondLeapSecondValidity(Instant t) {
    return t.atZone(ZoneOffset.UTC).toLocalDate().isAfter(leapSecondsValidUntil);
  }

  /** Converts a UTC instant to an Orekit date, leap seconds included. */
  public AbsoluteDate date(Instant t) {
    return new AbsoluteDate(t, dataContext.getTimeScales().getUTC());
  }

  /**
   * Converts an Orekit date to a UTC instant. {@code java.time} has no 23:59:60, so any date inside a
   * leap second maps to 23:59:59.999999999 of that day (Orekit's own conversion throws there).
   */
  public Instant instant(AbsoluteDate date) {
    DateTimeComponents utcComponents = date.getComponents(utc());
    if (utcComponents.getTime().getSecond() >= 60.0) {
      DateComponents day = utcComponents.getDate();
      return LocalDate.of(day.getYear(), day.getMonth(), day.getDay()).atTime(LocalTime.MAX).toInstant(ZoneOffset.UTC);
    }
    return date.toInstant(dataContext.getTimeScales());
  }

  /** One line saying where the data comes from. */
  public String description() {
    return description;
  }

  @Override
  public String toString() {
    return "AstroContext[" + description + "]";
  }
}
