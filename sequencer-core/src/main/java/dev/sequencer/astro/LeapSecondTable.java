package dev.sequencer.astro;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.orekit.time.DateComponents;
import org.orekit.time.OffsetModel;

/** The bundled TAI-UTC history (IERS Bulletin C), read from {@code leap-seconds.txt}. */
public final class LeapSecondTable {
  private static final String RESOURCE = "leap-seconds.txt";

  /** One change of TAI-UTC: from {@code date} (00:00 UTC) on, TAI - UTC = {@code taiMinusUtcS}. */
  public record Entry(LocalDate date, int taiMinusUtcS) {}

  private final List<Entry> entries;
  private final LocalDate validUntil;

  private LeapSecondTable(List<Entry> entries, LocalDate validUntil) {
    this.entries = List.copyOf(entries);
    this.validUntil = validUntil;
  }

  /** The table bundled with the library. */
  public static LeapSecondTable bundled() {
    try (InputStream in = LeapSecondTable.class.getResourceAsStream(RESOURCE)) {
      if (in == null) {
        throw new IllegalStateException("bundled resource " + RESOURCE + " is missing from the jar");
      }
      return parse(new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8)));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  static LeapSecondTable parse(BufferedReader reader) throws IOException {
    List<Entry> list = new ArrayList<>();
    LocalDate valid = null;
    String line;
    while ((line = reader.readLine()) != null) {
      line = line.strip();
      if (line.isEmpty() || line.startsWith("#")) {
        continue;
      }
      String[] parts = line.split("\\s+");
      if (parts[0].equals("valid-until")) {
        valid = LocalDate.parse(parts[1]);
      } else {
        list.add(new Entry(LocalDate.parse(parts[0]), Integer.parseInt(parts[1])));
      }
    }
    if (list.isEmpty() || valid == null) {
      throw new IllegalStateException("leap-second table has no entries or no valid-until line");
    }
    return new LeapSecondTable(list, valid);
  }

  /** Entries in date order. */
  public List<Entry> entries() {
    return entries;
  }

  /** Last date the table is known to be complete for (from the newest Bulletin C it was written from). */
  public LocalDate validUntil() {
    return validUntil;
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
