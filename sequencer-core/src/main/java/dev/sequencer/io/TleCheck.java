package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Tle;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;

/**
 * Checks a two-line element set as written in a file: two 69-character lines numbered 1 and 2, each
 * with a valid checksum (column 69: the sum of the digits in columns 1-68, a '-' counting 1, modulo 10),
 * every field readable and in range ({@link TleFields}, which also runs Orekit's format check and parser),
 * the same satellite number on both lines, and an epoch near the horizon.
 */
final class TleCheck {
  private TleCheck() {}

  /** The TLE at {@code path}, or null after reporting; {@code horizon} may be null (then no epoch check). */
  static Tle read(JsonNode n, String path, Problems p, TimeWindow horizon) {
    if (!n.isArray() || n.size() != 2 || !n.get(0).isTextual() || !n.get(1).isTextual()) {
      p.invalid(path, "must be an array of the two TLE lines (strings)", n);
      return null;
    }
    int before = p.count();
    String[] lines = {n.get(0).textValue(), n.get(1).textValue()};
    boolean shaped = true;
    for (int k = 0; k < 2; k++) {
      shaped &= checkLine(lines[k], k + 1, path + "[" + k + "]", p);
    }
    if (shaped && p.count() == before) {
      shaped = TleFields.check(lines, path, p);
    }
    if (shaped) {
      String sat1 = lines[0].substring(2, 7);
      String sat2 = lines[1].substring(2, 7);
      if (!sat1.equals(sat2)) {
        p.add(path + "[1]", "satellite number \"" + sat2 + "\" differs from line 1's \"" + sat1 + "\"", lines[1]);
      }
      if (p.count() == before) {
        TleFields.checkWithOrekit(lines, path, p);
      }
      checkEpoch(lines[0], path + "[0]", p, horizon);
    }
    return p.count() == before ? new Tle(lines[0], lines[1]) : null;
  }

  /** Length, line number and checksum; true when the line has the 69-column layout. */
  private static boolean checkLine(String line, int number, String path, Problems p) {
    if (line.length() != 69) {
      p.add(path, "must be 69 characters long (was " + line.length() + ")", line);
      return false;
    }
    boolean ok = true;
    if (line.charAt(0) != (char) ('0' + number) || line.charAt(1) != ' ') {
      p.add(path, "must start with the line number " + number + " and a space", line);
      ok = false;
    }
    char last = line.charAt(68);
    if (last < '0' || last > '9') {
      p.add(path, "checksum (column 69) must be a digit (was '" + last + "')", line);
      return false;
    }
    int computed = checksum(line);
    if (last - '0' != computed) {
      p.add(path, "checksum digit is " + last + ", computed " + computed, line);
    }
    return ok;
  }

  /** Sum of the digits in columns 1-68, each '-' counting 1, modulo 10. */
  static int checksum(String line) {
    int sum = 0;
    for (int i = 0; i < 68; i++) {
      char c = line.charAt(i);
      if (c >= '0' && c <= '9') {
        sum += c - '0';
      } else if (c == '-') {
        sum += 1;
      }
    }
    return sum % 10;
  }

  /** The epoch of line 1 (columns 19-32: two-digit year, 57-99 meaning 19xx, and day of year). */
  static Instant epoch(String line1) {
    int yy = Integer.parseInt(line1.substring(18, 20));
    double day = Double.parseDouble(line1.substring(20, 32).trim());
    if (!(day >= 1 && day < 367)) {
      throw new NumberFormatException("day of year " + day);
    }
    int year = yy < 57 ? 2000 + yy : 1900 + yy;
    Instant jan1 = LocalDate.of(year, 1, 1).atStartOfDay(ZoneOffset.UTC).toInstant();
    return jan1.plusNanos(Math.round((day - 1) * 86_400e9));
  }

  private static void checkEpoch(String line1, String path, Problems p, TimeWindow horizon) {
    Instant epoch;
    try {
      epoch = epoch(line1);
    } catch (NumberFormatException e) {
      p.add(path, "epoch \"" + line1.substring(18, 32) + "\" (columns 19-32) is not a year and day of year", line1);
      return;
    }
    Epochs.check(epoch, horizon, path, line1, p, "TLE", "SGP4 predictions this far from the epoch are poor");
  }
}
