package dev.sequencer.io;

import java.time.Instant;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;
import java.util.List;
import java.util.Locale;

/**
 * Builds invented but well-formed two-line element sets (69 columns, correct checksums) for tests.
 * Satellite numbers are made up (90001 and up); the orbital values are plausible, not real objects.
 */
final class TestTles {
  private TestTles() {}

  /** A LEO-like TLE with this satellite number and epoch. */
  static List<String> tle(int satnum, Instant epoch) {
    return tle(satnum, epoch, 98.1234, 123.4567, 12345, 45.6789, 200.1234, 14.12345678);
  }

  static List<String> tle(int satnum, Instant epoch, double incl, double raan, int ecc7, double argp, double ma,
      double meanMotion) {
    ZonedDateTime t = epoch.atZone(ZoneOffset.UTC);
    double day = t.getDayOfYear() + t.toLocalTime().toNanoOfDay() / 86_400e9;
    String l1 = String.format(Locale.ROOT, "1 %05dU %02d%03d%-3s %02d%012.8f  .00001234  00000-0  12345-4 0 %4d",
        satnum, 31, 1, "A", t.getYear() % 100, day, 999);
    String l2 = String.format(Locale.ROOT, "2 %05d %8.4f %8.4f %07d %8.4f %8.4f %11.8f%5d",
        satnum, incl, raan, ecc7, argp, ma, meanMotion, 1234);
    return List.of(withChecksum(l1), withChecksum(l2));
  }

  /** Appends the checksum digit: digits count their value, '-' counts 1, modulo 10. */
  static String withChecksum(String first68) {
    if (first68.length() != 68) {
      throw new IllegalArgumentException("expected 68 columns, got " + first68.length() + ": " + first68);
    }
    int sum = 0;
    for (char c : first68.toCharArray()) {
      sum += Character.isDigit(c) ? c - '0' : c == '-' ? 1 : 0;
    }
    return first68 + (sum % 10);
  }
}
