package dev.sequencer.astro;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import org.hipparchus.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;
import org.orekit.data.DataContext;
import org.orekit.frames.Transform;
import org.orekit.time.AbsoluteDate;
import org.orekit.time.TimeScale;

class AstroContextTest {
  private static final AstroContext CTX = AstroContext.offline();

  @Test
  void leapSecond2016IsAValidUtcInstantOneSecondBeforeNewYear() {
    // IERS Bulletin C 52 (July 2016): a positive leap second 2016-12-31T23:59:60 UTC.
    TimeScale utc = CTX.utc();
    AbsoluteDate leap = new AbsoluteDate(2016, 12, 31, 23, 59, 60.0, utc);
    AbsoluteDate newYear = new AbsoluteDate(2017, 1, 1, 0, 0, 0.0, utc);
    assertEquals(1.0, newYear.durationFrom(leap), 1e-12);
    assertEquals(2.0, newYear.durationFrom(new AbsoluteDate(2016, 12, 31, 23, 59, 59.0, utc)), 1e-12);
    assertTrue(CTX.utc() instanceof org.orekit.time.UTCScale s && s.insideLeap(leap.shiftedBy(0.5)));
    assertEquals("2016-12-31T23:59:60.000", leap.toString(utc).substring(0, 23));
    // java.time has no 23:59:60; AstroContext.instant documents the mapping to the last representable instant.
    assertEquals(Instant.parse("2016-12-31T23:59:59.999999999Z"), CTX.instant(leap.shiftedBy(0.5)));
  }

  @Test
  void taiMinusUtcIs36BeforeAndThen37AfterTheLeapSecond() {
    // IERS Bulletin C 52: TAI - UTC = 36 s until 2016-12-31T23:59:60, 37 s from 2017-01-01T00:00:00.
    TimeScale utc = CTX.utc();
    double before = -utc.offsetFromTAI(new AbsoluteDate(2016, 12, 31, 23, 59, 59.0, utc)).toDouble();
    double after = -utc.offsetFromTAI(new AbsoluteDate(2017, 1, 1, 0, 0, 0.0, utc)).toDouble();
    assertEquals(36.0, before, 1e-12);
    assertEquals(37.0, after, 1e-12);
  }

  @Test
  void bundledTableIsSortedAndCompleteToItsValidityDate() {
    // IERS Bulletin C / Leap_Second.dat history: TAI - UTC = 10 s from 1972-01-01, one second per entry up
    // to 37 s from 2017-01-01 (28 entries). Validity 2027-06-28 is the date written in the bundled file
    // (from Bulletin C 72, per the file's header).
    List<LeapSecondTable.Entry> entries = LeapSecondTable.bundled().entries();
    assertEquals(new LeapSecondTable.Entry(LocalDate.of(1972, 1, 1), 10), entries.get(0));
    assertEquals(new LeapSecondTable.Entry(LocalDate.of(2017, 1, 1), 37), entries.get(entries.size() - 1));
    assertEquals(28, entries.size());
    for (int i = 1; i < entries.size(); i++) {
      assertTrue(entries.get(i).date().isAfter(entries.get(i - 1).date()), "entry " + i + " out of order");
      assertEquals(entries.get(i - 1).taiMinusUtcS() + 1, entries.get(i).taiMinusUtcS(), "entry " + i);
    }
    assertEquals(LocalDate.of(2027, 6, 28), LeapSecondTable.bundled().validUntil());
    assertEquals(LocalDate.of(2027, 6, 28), CTX.leapSecondsValidUntil());
    assertFalse(CTX.beyondLeapSecondValidity(Instant.parse("2027-06-28T23:59:59Z")));
    assertTrue(CTX.beyondLeapSecondValidity(Instant.parse("2027-06-29T00:00:00Z")));
  }

  @Test
  void instantsRoundTripThroughOrekitDates() {
    Instant t = Instant.parse("2031-05-05T06:07:08.125Z");
    assertEquals(t, CTX.instant(CTX.date(t)));
    // TT - UTC = (TT - TAI) + (TAI - UTC) = 32.184 s (IAU definition of TT) + 37 s (Bulletin C 52).
    AbsoluteDate d = CTX.date(Instant.parse("2017-01-01T00:00:00Z"));
    assertEquals(69.184,
        CTX.timeScales().getTT().offsetFromTAI(d).toDouble() - CTX.utc().offsetFromTAI(d).toDouble(), 1e-12);
  }

  @Test
  void offlineContextWorksWithoutDataAndLeavesTheDefaultContextAlone() {
    AstroContext ctx = AstroContext.offline();
    AbsoluteDate date = ctx.date(Instant.parse("2031-06-21T12:00:00Z"));
    Transform gcrfToItrf = ctx.inertial().getTransformTo(ctx.earthFixed(), date);
    Vector3D sunItrf = ctx.sun().getPosition(date, ctx.earthFixed());
    Vector3D moonItrf = ctx.moon().getPosition(date, ctx.earthFixed());
    // Near the June solstice the Sun's declination is about +23.4 deg (any almanac): z / r = sin(dec).
    assertEquals(23.43, Math.toDegrees(Math.asin(sunItrf.getZ() / sunItrf.getNorm())), 0.05);
    assertTrue(moonItrf.getNorm() > 3.5e8 && moonItrf.getNorm() < 4.1e8);
    assertTrue(gcrfToItrf.getRotation().getAngle() > 0.0);
    assertTrue(ctx.description().startsWith("offline"));
    // Orekit's JVM-wide default context was neither configured nor asked to load anything. No default data
    // is configured in the test JVM, so a library call that used the default UTC would also have thrown
    // above ("no IERS UTC-TAI history data loaded") instead of only showing up in this list.
    assertEquals(List.of(), List.copyOf(DataContext.getDefault().getDataProvidersManager().getLoadedDataNames()));
  }

  @Test
  void celestialBodiesOfTheOfflineDataContextAreRefusedWithAHint() {
    UnsupportedOperationException e = assertThrows(UnsupportedOperationException.class,
        () -> CTX.dataContext().getCelestialBodies());
    assertTrue(e.getMessage().contains("AstroContext.sun()"), e.getMessage());
  }

  @Test
  void missingOrekitDataDirectoryFailsEarly() {
    Path missing = Path.of("/nonexistent/orekit-data");
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> AstroContext.fromOrekitData(missing));
    assertTrue(e.getMessage().contains(missing.toString()), e.getMessage());
  }
}
