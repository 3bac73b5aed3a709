package dev.sequencer.charts;

import dev.sequencer.visibility.SkyValues;
import java.text.FieldPosition;
import java.text.NumberFormat;
import java.text.ParsePosition;
import java.text.SimpleDateFormat;
import java.time.Instant;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.format.TextStyle;
import java.util.Locale;
import java.util.TimeZone;
import org.jfree.chart.axis.DateAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.axis.ValueAxis;

/**
 * The time axes drawn beside UTC: local civil time in a chosen zone and, at a ground site, local apparent
 * sidereal time (from {@link SkyValues}). Both are axes over epoch milliseconds, so they line up with a
 * UTC {@link DateAxis} of the same range; the sidereal axis labels the whole UTC hours with the LST there.
 *
 * @param zone the zone of "local time"
 * @param zoneNote how the zone was chosen, shown in the axis label ("from the longitude", "--zone")
 * @param sky the scenario's sky values, for the sidereal time (may be null: no LST axis)
 */
public record TimeAxes(ZoneId zone, String zoneNote, SkyValues sky) {
  private static final long HOUR_MS = 3_600_000L;

  /**
   * The nautical time zone of a longitude (UTC + round(longitude / 15) hours), common practice at sea and
   * the best guess without a zone from the user; for a spacecraft or no site, UTC.
   */
  public static ZoneId nauticalZone(double longitudeDeg) {
    int h = (int) Math.round(longitudeDeg / 15.0);
    return ZoneOffset.ofHours(Math.max(-12, Math.min(12, h)));
  }

  /** The zone's short name at {@code t} ("UTC+02:00", "CEST"). */
  public String zoneName(Instant t) {
    if (zone instanceof ZoneOffset off) {
      return off.getTotalSeconds() == 0 ? "UTC" : "UTC" + off.getId();
    }
    return zone.getRules().isDaylightSavings(t) ? zone.getDisplayName(TextStyle.SHORT, Locale.ROOT) + "*"
        : zone.getDisplayName(TextStyle.SHORT, Locale.ROOT);
  }

  /** A date axis in local time over [from, to]. */
  public DateAxis localAxis(Instant from, Instant to, boolean multiDay) {
    DateAxis a = new DateAxis("local time (" + zoneName(from) + (zoneNote == null ? "" : ", " + zoneNote) + ")");
    TimeZone tz = TimeZone.getTimeZone(zone);
    a.setTimeZone(tz);
    SimpleDateFormat fmt = new SimpleDateFormat(multiDay ? "MM-dd HH:mm" : "HH:mm", Locale.ROOT);
    fmt.setTimeZone(tz);
    a.setDateFormatOverride(fmt);
    a.setRange(from.toEpochMilli(), to.toEpochMilli());
    return a;
  }

  /** An axis labelling whole UTC hours with the local apparent sidereal time there; null without a site. */
  public ValueAxis siderealAxis(Instant from, Instant to) {
    if (sky == null || !sky.atGroundSite()) {
      return null;
    }
    NumberAxis a = new NumberAxis("local sidereal time (apparent) at the UTC hours");
    a.setRange(from.toEpochMilli(), to.toEpochMilli());
    long spanH = Math.max(1, (to.toEpochMilli() - from.toEpochMilli()) / HOUR_MS);
    long stepH = spanH <= 16 ? 1 : spanH <= 36 ? 2 : spanH <= 96 ? 6 : 24;
    a.setTickUnit(new NumberTickUnit(stepH * HOUR_MS, new SiderealFormat(sky)));
    a.setAutoRangeIncludesZero(false);
    return a;
  }

  /** "HH:MM" of the LST at the epoch milliseconds given. */
  static String lst(SkyValues sky, long epochMs) {
    double h = sky.localSiderealTimeH(Instant.ofEpochMilli(epochMs));
    int m = (int) Math.floor(h * 60 + 0.5) % (24 * 60);
    return String.format(Locale.ROOT, "%02d:%02d", m / 60, m % 60);
  }

  private static final class SiderealFormat extends NumberFormat {
    private static final long serialVersionUID = 1L;
    private final transient SkyValues sky;

    SiderealFormat(SkyValues sky) {
      this.sky = sky;
    }

    @Override
    public StringBuffer format(double number, StringBuffer toAppendTo, FieldPosition pos) {
      return toAppendTo.append(lst(sky, Math.round(number)));
    }

    @Override
    public StringBuffer format(long number, StringBuffer toAppendTo, FieldPosition pos) {
      return toAppendTo.append(lst(sky, number));
    }

    @Override
    public Number parse(String source, ParsePosition parsePosition) {
      throw new UnsupportedOperationException("display only");
    }
  }
}
