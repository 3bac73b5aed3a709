package dev.sequencer.io;

import java.util.List;
import java.util.Locale;
import java.util.regex.Pattern;
import org.hipparchus.CalculusFieldElement;
import org.orekit.propagation.analytical.tle.TLE;
import org.orekit.time.AbsoluteDate;
import org.orekit.time.FieldAbsoluteDate;
import org.orekit.time.TimeOffset;
import org.orekit.time.TimeScale;

/**
 * The fields of a two-line element set, column by column (the standard layout, as Orekit's own format
 * check reads it), each checked for its characters and, for the orbital elements, its range; and
 * Orekit's format check ({@link TLE#isFormatOK}) and parser, run last, so that a TLE accepted here is
 * one Orekit reads. A letter in a numeric field (an 'O' typed for a '0' keeps the checksum) is
 * reported with the field's name and columns.
 */
final class TleFields {
  /** Earth's equatorial radius (WGS-84), km: the perigee must lie above it. */
  private static final double EARTH_RADIUS_KM = 6378.137;
  /** SGP4's gravitational parameter (WGS-72), km^3/s^2, to turn the mean motion into a semi-major axis. */
  private static final double SGP4_MU_KM3_PER_S2 = 398600.8;

  /** One field: its line (1 or 2), first and last column (1-based, inclusive), allowed characters, range. */
  private record Field(int line, int first, int last, String name, Pattern pattern, String example, Range range) {
    String text(String[] lines) {
      return lines[line - 1].substring(first - 1, last);
    }

    String where() {
      return first == last ? "column " + first : "columns " + first + "-" + last;
    }
  }

  private static final String SATNUM = "[ 0-9A-Z&&[^IO]][ 0-9]{4}";
  private static final String ANGLE = "[ 0-9]{3}[.][ 0-9]{4}";
  private static final String EXPONENTIAL = "[ +-][ 0-9]{5}[+-][ 0-9]";
  private static final List<Field> FIELDS = List.of(
      field(1, 3, 7, "satellite number", SATNUM, "25544", null),
      field(1, 8, 8, "classification", "[A-Z]", "U", null),
      field(1, 10, 17, "international designator", "[ 0-9]{5}[ A-Z]{3}", "98067A", null),
      field(1, 19, 32, "epoch", "[ 0-9]{5}[.][ 0-9]{8}", "31124.75000000", null),
      field(1, 34, 43, "first derivative of the mean motion", "(?:[ 0+-][.][ 0-9]{8})|(?: [ +-][.][ 0-9]{7})",
          " .00001234", null),
      field(1, 45, 52, "second derivative of the mean motion", EXPONENTIAL, " 00000-0", null),
      field(1, 54, 61, "BSTAR drag term", EXPONENTIAL, " 12345-4", null),
      field(1, 63, 63, "ephemeris type", "[ 0-9]", "0", null),
      field(1, 65, 68, "element set number", "[ 0-9]{4}", " 999", null),
      field(2, 3, 7, "satellite number", SATNUM, "25544", null),
      field(2, 9, 16, "inclination", ANGLE, " 98.1234", Range.closed(0, 180)),
      field(2, 18, 25, "right ascension of the ascending node", ANGLE, "123.4567", new Range(0, true, 360, false)),
      field(2, 27, 33, "eccentricity (decimal point assumed)", "[ 0-9]{7}", "0012345", null),
      field(2, 35, 42, "argument of perigee", ANGLE, " 45.6789", new Range(0, true, 360, false)),
      field(2, 44, 51, "mean anomaly", ANGLE, "200.1234", new Range(0, true, 360, false)),
      field(2, 53, 63, "mean motion (revolutions per day)", "[ 0-9]{2}[.][ 0-9]{8}", "14.12345678",
          Range.POSITIVE),
      field(2, 64, 68, "revolution number", "[ 0-9]{5}", "12341", null));
  /** Columns that must hold a space, per line (1-based). */
  private static final int[][] SPACES = {{2, 9, 18, 33, 44, 53, 62, 64}, {2, 8, 17, 26, 34, 43, 52}};

  private TleFields() {}

  private static Field field(int line, int first, int last, String name, String regex, String example, Range range) {
    return new Field(line, first, last, name, Pattern.compile(regex), example, range);
  }

  /**
   * Checks two lines that already have the 69-column layout and valid checksums; reports at
   * {@code path + "[0]"} or {@code "[1]"} and returns true when every field is readable and in range.
   */
  static boolean check(String[] lines, String path, Problems p) {
    int before = p.count();
    for (int line = 1; line <= 2; line++) {
      for (int col : SPACES[line - 1]) {
        char c = lines[line - 1].charAt(col - 1);
        if (c != ' ') {
          p.add(linePath(path, line), "column " + col + " must be a space (was '" + c + "')", lines[line - 1]);
        }
      }
    }
    for (Field f : FIELDS) {
      String text = f.text(lines);
      String at = linePath(path, f.line());
      if (!f.pattern().matcher(text).matches()) {
        p.add(at, f.name() + " (" + f.where() + ") must look like \"" + f.example() + "\" (was \"" + text
            + "\")" + letterHint(text), lines[f.line() - 1]);
      } else if (f.range() != null && !f.range().contains(Double.parseDouble(text.trim()))) {
        p.add(at, f.name() + " (" + f.where() + ") " + f.range().rule() + " (was " + text.trim() + ")",
            lines[f.line() - 1]);
      }
    }
    if (p.count() == before) {
      checkPerigee(lines, path, p);
    }
    return p.count() == before;
  }

  private static String linePath(String path, int line) {
    return path + "[" + (line - 1) + "]";
  }

  /** " (the letter O where a digit 0 belongs?)" when the text holds an O, else "". */
  private static String letterHint(String text) {
    return text.indexOf('O') >= 0 || text.indexOf('o') >= 0 ? "; is the letter O written for the digit 0?" : "";
  }

  /** The perigee radius a (1 - e), with a from the mean motion (Kepler's third law), above the Earth. */
  private static void checkPerigee(String[] lines, String path, Problems p) {
    double revPerDay = Double.parseDouble(lines[1].substring(52, 63).trim());
    double e = Double.parseDouble("0." + lines[1].substring(26, 33).trim());
    double n = revPerDay * 2 * Math.PI / 86400.0;
    double a = Math.cbrt(SGP4_MU_KM3_PER_S2 / (n * n));
    if (a * (1 - e) <= EARTH_RADIUS_KM) {
      p.add(linePath(path, 2), String.format(Locale.ROOT, "mean motion %s rev/day and eccentricity %s put the "
          + "perigee at %.0f km from the Earth's centre, inside the Earth (radius %.3f km)", lines[1].substring(52, 63)
          .trim(), Range.num(e), a * (1 - e), EARTH_RADIUS_KM), lines[1]);
    }
  }

  /** Orekit's own format check and parser must accept what the other checks accepted. */
  static void checkWithOrekit(String[] lines, String path, Problems p) {
    if (!TLE.isFormatOK(lines[0], lines[1])) {
      p.add(path, "Orekit's TLE format check rejects these lines", lines[0] + " / " + lines[1]);
      return;
    }
    try {
      new TLE(lines[0], lines[1], ParseOnlyScale.INSTANCE);
    } catch (RuntimeException e) {
      p.add(path, "Orekit cannot read these lines: " + e.getMessage(), lines[0] + " / " + lines[1]);
    }
  }

  /**
   * A time scale for the parse check only: Orekit's parser needs one to build the epoch, and the scale
   * does not change whether the lines can be read (the real UTC comes from the astronomy context later).
   */
  private enum ParseOnlyScale implements TimeScale {
    INSTANCE;

    @Override
    public TimeOffset offsetFromTAI(AbsoluteDate date) {
      return TimeOffset.ZERO;
    }

    @Override
    public <T extends CalculusFieldElement<T>> T offsetFromTAI(FieldAbsoluteDate<T> date) {
      return date.getField().getZero();
    }

    @Override
    public String getName() {
      return "parse-only";
    }
  }
}
