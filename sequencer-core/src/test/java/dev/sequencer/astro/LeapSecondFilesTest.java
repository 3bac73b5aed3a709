package dev.sequencer.astro;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.orekit.time.AbsoluteDate;

class LeapSecondFilesTest {
  @TempDir Path dir;

  private static Path resource(String name) throws URISyntaxException {
    return Path.of(LeapSecondFilesTest.class.getResource(name).toURI());
  }

  @Test
  void bundledTableIsCurrentForTheNextNinetyDays() {
    // Fails 90 days before the bundled table's validity ends, so the table is renewed in time: the IERS
    // issues Bulletin C every January and July (a leap second is announced about six months ahead). To
    // renew: add any new entry and the new validity date to leap-seconds.txt from the newest Bulletin C.
    LocalDate soon = LocalDate.now(ZoneOffset.UTC).plusDays(90);
    LocalDate valid = LeapSecondTable.bundled().validUntil();
    assertFalse(soon.isAfter(valid), "the bundled leap-second table is valid until " + valid
        + ", less than 90 days from now: update leap-seconds.txt from the newest IERS Bulletin C");
  }

  @Test
  void readsTheNistIetfListAndVerifiesItsHash() throws Exception {
    // leap-seconds.list as shipped by Debian's tzdata 2025b (public domain, "Updated through IERS Bulletin C",
    // "File expires on 28 June 2026"): 28 rows, the last 37 s from 2017-01-01 (NTP 3692217600).
    LeapSecondTable t = LeapSecondTable.read(resource("leap-seconds-tzdata-2025b.list"));
    assertEquals(28, t.entries().size());
    assertEquals(new LeapSecondTable.Entry(LocalDate.of(1972, 1, 1), 10), t.entries().get(0));
    assertEquals(new LeapSecondTable.Entry(LocalDate.of(1972, 7, 1), 11), t.entries().get(1));
    assertEquals(new LeapSecondTable.Entry(LocalDate.of(2017, 1, 1), 37), t.entries().get(27));
    assertEquals(LocalDate.of(2026, 6, 28), t.validUntil()); // #@ 3991593600 = 2026-06-28 00:00 UTC
    assertEquals(LeapSecondTable.bundled().entries(), t.entries());
  }

  @Test
  void aDamagedListIsRefusedByItsHash() throws Exception {
    List<String> lines = new ArrayList<>(Files.readAllLines(resource("leap-seconds-tzdata-2025b.list")));
    int i = lines.indexOf(lines.stream().filter(l -> l.startsWith("3692217600")).findFirst().orElseThrow());
    lines.set(i, lines.get(i).replace("3692217600", "3692304000")); // the 2017 leap moved by one day
    Path bad = Files.write(dir.resolve("leap-seconds.list"), lines);
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> LeapSecondTable.read(bad));
    assertTrue(e.getMessage().contains("SHA-1") && e.getMessage().contains(bad.toString()), e.getMessage());
  }

  @Test
  void readsTheIersLeapSecondDat() throws Exception {
    // A file in the layout of the IERS Leap_Second.dat written from Bulletin C 72 ("File expires on 28 June 2027").
    LeapSecondTable t = LeapSecondTable.read(resource("Leap_Second-bulletin-c-72.dat"));
    assertEquals(LeapSecondTable.bundled().entries(), t.entries());
    assertEquals(LocalDate.of(2027, 6, 28), t.validUntil());
  }

  @Test
  void aNewerFileExtendsTheContext() throws IOException {
    // A hypothetical future bulletin: a leap second at the end of 2028, valid to 2029-06-28. Made-up data
    // (only to show that a user file takes effect); TAI-UTC becomes 38 s on 2029-01-01.
    List<String> lines = new ArrayList<>(List.of("valid-until 2029-06-28"));
    LeapSecondTable.bundled().entries().forEach(e -> lines.add(e.date() + " " + e.taiMinusUtcS()));
    lines.add("2029-01-01 38");
    AstroContext ctx = AstroContext.offline(LeapSecondTable.read(Files.write(dir.resolve("mine.txt"), lines)));
    assertEquals(LocalDate.of(2029, 6, 28), ctx.leapSecondsValidUntil());
    assertFalse(ctx.beyondLeapSecondValidity(Instant.parse("2029-01-05T00:00:00Z")));
    AbsoluteDate before = ctx.date(Instant.parse("2028-12-31T23:59:59Z"));
    AbsoluteDate after = ctx.date(Instant.parse("2029-01-01T00:00:00Z"));
    assertEquals(2.0, after.durationFrom(before), 1e-9); // 23:59:60 inserted
    assertTrue(ctx.description().contains("mine.txt"), ctx.description());
  }

  @Test
  void brokenFilesAreRefusedWithLineAndRule() throws IOException {
    assertRefused(List.of("# nothing here"), "no TAI-UTC entries");
    assertRefused(List.of("valid-until 2027-01-01", "1972-01-01 10", "1972-07-01 12"), "one second");
    assertRefused(List.of("valid-until 2027-01-01", "1973-01-01 10"), "1972-01-01");
    assertRefused(List.of("1972-01-01 10"), "no validity date");
    assertRefused(List.of("valid-until 1971-01-01", "1972-01-01 10"), "before the last entry");
    assertRefused(List.of("valid-until 2027-01-01", "1972-01-01 ten"), "line 2");
    assertRefused(List.of("#  File expires on 28 June 2027", "    41318.0    1  1 1972       10"), "MJD 41318.0");
    assertRefused(List.of("#@ 4023129600", "2272060801 10"), "not a UTC midnight");
  }

  private void assertRefused(List<String> lines, String fragment) throws IOException {
    Path f = Files.write(dir.resolve("bad-" + Math.abs(lines.hashCode()) + ".txt"), lines);
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> LeapSecondTable.read(f));
    assertTrue(e.getMessage().contains(fragment) && e.getMessage().contains(f.toString()), e.getMessage());
  }
}
