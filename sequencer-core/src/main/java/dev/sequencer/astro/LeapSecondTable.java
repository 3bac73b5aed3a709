package dev.sequencer.astro;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.orekit.time.DateComponents;
import org.orekit.time.OffsetModel;

/**
 * A TAI-UTC history since 1972 with the last date it is known to be complete for: the bundled table
 * ({@code leap-seconds.txt}, written from IERS Bulletin C) or a newer file the user passes.
 *
 * <p>{@link #read(Path)} accepts the two files the IERS publishes and updates after every Bulletin C:
 * <ul>
 *   <li>{@code Leap_Second.dat} (IERS Earth Orientation Centre): rows "MJD day month year TAI-UTC", the
 *       validity in a comment "File expires on 28 June 2027";
 *   <li>{@code leap-seconds.list} (the NIST/IETF format, also shipped by the IERS and the tz database): rows
 *       "NTP-seconds TAI-UTC", the expiry as "#@ NTP-seconds", and a SHA-1 "#h" line, which is verified;
 * </ul>
 * and the bundled format ("valid-until YYYY-MM-DD", then "YYYY-MM-DD TAI-UTC" rows). Orekit 13.1 has no
 * loader for the first two formats (its loaders read tai-utc.dat, UTC-TAI.history, Bulletin A and AGI
 * files), so they are parsed here. Every table must start at 1972-01-01 with 10 s, change by one second at
 * a time on the first day of a month, and give a validity date. Bad files are refused with
 * {@link IllegalArgumentException} naming the file, the line and the rule. Immutable.
 */
public final class LeapSecondTable {
  private static final String RESOURCE = "leap-seconds.txt";
  private static final LocalDate FIRST = LocalDate.of(1972, 1, 1);
  private static final LocalDate NTP_EPOCH = LocalDate.of(1900, 1, 1);
  private static final LocalDate MJD_EPOCH = LocalDate.of(1858, 11, 17);
  private static final Pattern EXPIRES = Pattern.compile("File expires on\\s+(\\d{1,2}\\s+\\p{Alpha}+\\s+\\d{4})");

  /** One change of TAI-UTC: from {@code date} (00:00 UTC) on, TAI - UTC = {@code taiMinusUtcS}. */
  public record Entry(LocalDate date, int taiMinusUtcS) {}

  private final List<Entry> entries;
  private final LocalDate validUntil;
  private final String source;

  private LeapSecondTable(List<Entry> entries, LocalDate validUntil, String source) {
    this.entries = List.copyOf(entries);
    this.validUntil = validUntil;
    this.source = source;
  }

  /** The table bundled with the library. */
  public static LeapSecondTable bundled() {
    try (InputStream in = LeapSecondTable.class.getResourceAsStream(RESOURCE)) {
      if (in == null) {
        throw new IllegalStateException("bundled resource " + RESOURCE + " is missing from the jar");
      }
      List<String> lines = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8)).lines().toList();
      return parse("bundled " + RESOURCE, lines);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } catch (IllegalArgumentException e) {
      throw new IllegalStateException("bundled leap-second table is broken: " + e.getMessage(), e);
    }
  }

  /**
   * Reads a leap-second file in any of the formats of the class comment (detected from its content).
   *
   * @throws IllegalArgumentException when the file breaks a rule (message names file, line and rule)
   * @throws UncheckedIOException when it cannot be read
   */
  public static LeapSecondTable read(Path file) {
    try {
      return parse(file.toString(), Files.readAllLines(file, StandardCharsets.UTF_8));
    } catch (IOException e) {
      throw new UncheckedIOException("cannot read leap-second file " + file, e);
    }
  }

  /** Parses lines of one of the three formats; {@code source} names the file in messages. */
  static LeapSecondTable parse(String source, List<String> lines) {
    boolean ntp = lines.stream().anyMatch(l -> l.startsWith("#@"));
    boolean own = lines.stream().map(String::strip)
        .anyMatch(l -> l.startsWith("valid-until") || l.matches("\\d{4}-\\d{2}-\\d{2}\\s.*"));
    List<Entry> list = new ArrayList<>();
    LocalDate valid = null;
    String updateNtp = null;
    String expiryNtp = null;
    String hash = null;
    StringBuilder hashed = new StringBuilder();
    for (int i = 0; i < lines.size(); i++) {
      String where = source + " line " + (i + 1);
      String raw = lines.get(i);
      String line = raw.strip();
      if (ntp && raw.startsWith("#$")) {
        updateNtp = line.substring(2).strip();
        continue;
      }
      if (ntp && raw.startsWith("#@")) {
        expiryNtp = line.substring(2).strip();
        valid = ntpDate(expiryNtp, where, false);
        continue;
      }
      if (ntp && raw.startsWith("#h")) {
        hash = line.substring(2).strip();
        continue;
      }
      if (!ntp && !own && line.startsWith("#")) {
        Matcher m = EXPIRES.matcher(line);
        if (m.find()) {
          valid = englishDate(m.group(1), where);
        }
        continue;
      }
      int comment = line.indexOf('#');
      String data = (comment >= 0 ? line.substring(0, comment) : line).strip();
      if (data.isEmpty()) {
        continue;
      }
      String[] f = data.split("\\s+");
      if (own) {
        if (f[0].equals("valid-until")) {
          valid = isoDate(field(f, 1, where), where);
        } else {
          list.add(new Entry(isoDate(f[0], where), integer(field(f, 1, where), where)));
        }
      } else if (ntp) {
        list.add(new Entry(ntpDate(f[0], where, true), integer(field(f, 1, where), where)));
        hashed.append(f[0]).append(field(f, 1, where));
      } else {
        list.add(mjdEntry(f, where));
      }
    }
    if (ntp) {
      checkHash(source, updateNtp, expiryNtp, hashed, hash);
    }
    check(source, list, valid);
    return new LeapSecondTable(list, valid, source);
  }

  /** The NIST hash: SHA-1 of the update and expiry stamps and every data row's two fields, no whitespace. */
  private static void checkHash(String source, String update, String expiry, StringBuilder rows, String hash) {
    if (hash == null) {
      return; // an unsigned copy (hand-made): nothing to verify
    }
    if (update == null || expiry == null) {
      throw new IllegalArgumentException(source + ": has a #h hash but no #$ update or #@ expiry line");
    }
    StringBuilder expected = new StringBuilder();
    for (String word : hash.split("\\s+")) {
      // Each 32-bit word may be printed without its leading zeros.
      expected.append("0".repeat(Math.max(0, 8 - word.length()))).append(word.toLowerCase(Locale.ROOT));
    }
    try {
      byte[] digest = MessageDigest.getInstance("SHA-1")
          .digest((update + expiry + rows).getBytes(StandardCharsets.US_ASCII));
      String actual = HexFormat.of().formatHex(digest);
      if (!actual.contentEquals(expected)) {
        throw new IllegalArgumentException(source + ": SHA-1 of the data is " + actual + " but the #h line says "
            + expected + " (the file is damaged or was edited)");
      }
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("SHA-1 is missing from this Java runtime", e);
    }
  }

  private static void check(String source, List<Entry> list, LocalDate valid) {
    if (list.isEmpty()) {
      throw new IllegalArgumentException(source + ": no TAI-UTC entries (not a leap-second file?)");
    }
    if (valid == null) {
      throw new IllegalArgumentException(source + ": no validity date (an expiry line \"#@\", \"File expires "
          + "on ...\" or \"valid-until\")");
    }
    Entry first = list.get(0);
    if (!first.date().equals(FIRST) || first.taiMinusUtcS() != 10) {
      throw new IllegalArgumentException(source + ": must start with TAI-UTC = 10 s on 1972-01-01 (starts with "
          + first.taiMinusUtcS() + " s on " + first.date() + ")");
    }
    for (int k = 1; k < list.size(); k++) {
      Entry a = list.get(k - 1);
      Entry b = list.get(k);
      if (!b.date().isAfter(a.date()) || b.date().getDayOfMonth() != 1
          || Math.abs(b.taiMinusUtcS() - a.taiMinusUtcS()) != 1) {
        throw new IllegalArgumentException(source + ": entry " + (k + 1) + " (" + b.date() + ", " + b.taiMinusUtcS()
            + " s) must follow " + a.date() + " (" + a.taiMinusUtcS() + " s) on the first day of a later month and "
            + "change TAI-UTC by one second");
      }
    }
    Entry last = list.get(list.size() - 1);
    if (valid.isBefore(last.date())) {
      throw new IllegalArgumentException(source + ": validity date " + valid + " is before the last entry "
          + last.date());
    }
  }

  private static Entry mjdEntry(String[] f, String where) {
    if (f.length < 5) {
      throw new IllegalArgumentException(where + ": expected \"MJD day month year TAI-UTC\" (Leap_Second.dat), got "
          + String.join(" ", f));
    }
    double mjd = number(f[0], where);
    if (mjd != Math.rint(mjd)) {
      throw new IllegalArgumentException(where + ": MJD " + f[0] + " is not a whole day");
    }
    LocalDate date = MJD_EPOCH.plusDays((long) mjd);
    LocalDate printed;
    try {
      printed = LocalDate.of(integer(f[3], where), integer(f[2], where), integer(f[1], where));
    } catch (java.time.DateTimeException e) {
      throw new IllegalArgumentException(where + ": day month year " + f[1] + " " + f[2] + " " + f[3]
          + " is not a date");
    }
    if (!printed.equals(date)) {
      throw new IllegalArgumentException(where + ": MJD " + f[0] + " is " + date + " but the row says " + printed);
    }
    return new Entry(date, integer(f[4], where));
  }

  private static LocalDate ntpDate(String seconds, String where, boolean wholeDay) {
    long s;
    try {
      s = Long.parseLong(seconds);
    } catch (NumberFormatException e) {
      throw new IllegalArgumentException(where + ": NTP time must be whole seconds since 1900 (was " + seconds + ")");
    }
    if (wholeDay && s % 86400 != 0) {
      throw new IllegalArgumentException(where + ": NTP time " + s + " is not a UTC midnight");
    }
    return NTP_EPOCH.plusDays(Math.floorDiv(s, 86400));
  }

  private static LocalDate englishDate(String text, String where) {
    try {
      return LocalDate.parse(text.replaceAll("\\s+", " "), DateTimeFormatter.ofPattern("d MMMM yyyy", Locale.ENGLISH));
    } catch (DateTimeParseException e) {
      throw new IllegalArgumentException(where + ": expiry date \"" + text + "\" is not a date like 28 June 2027");
    }
  }

  private static LocalDate isoDate(String text, String where) {
    try {
      return LocalDate.parse(text);
    } catch (DateTimeParseException e) {
      throw new IllegalArgumentException(where + ": \"" + text + "\" is not a YYYY-MM-DD date");
    }
  }

  private static String field(String[] f, int i, String where) {
    if (f.length <= i) {
      throw new IllegalArgumentException(where + ": expected " + (i + 1) + " fields, got " + String.join(" ", f));
    }
    return f[i];
  }

  private static int integer(String text, String where) {
    double v = number(text, where);
    if (v != Math.rint(v) || Math.abs(v) > 1e6) {
      throw new IllegalArgumentException(where + ": " + text + " is not a whole number");
    }
    return (int) v;
  }

  private static double number(String text, String where) {
    try {
      return Double.parseDouble(text);
    } catch (NumberFormatException e) {
      throw new IllegalArgumentException(where + ": \"" + text + "\" is not a number");
    }
  }

  /** Entries in date order. */
  public List<Entry> entries() {
    return entries;
  }

  /** Last date the table is known to be complete for (from the newest Bulletin C it was written from). */
  public LocalDate validUntil() {
    return validUntil;
  }

  /** Where the table came from ("bundled leap-seconds.txt" or the file name). */
  public String source() {
    return source;
  }

  /** The table as Orekit offset models (integer seconds, no drift). */
  List<OffsetModel> offsetModels() {
    return entries.stream()
        .map(e -> new OffsetModel(
            new DateComponents(e.date().getYear(), e.date().getMonthValue(), e.date().getDayOfMonth()),
            e.taiMinusUtcS()))
        .toList();
  }
}
