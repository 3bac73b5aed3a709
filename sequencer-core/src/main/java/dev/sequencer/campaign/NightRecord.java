package dev.sequencer.campaign;

import java.time.Instant;
import java.time.LocalDate;

/**
 * One night of a season. {@code darkStart}/{@code darkEnd}: the night's horizon ({@code null} when it had
 * none: no darkness, or nothing left to do). {@code offered}: requests still needing something (0 on a
 * night where none could be offered); {@code plannedPriority}: what the night's first plan would collect (planning priorities, aged);
 * {@code executed}: successful observations; {@code failedAttempts}: attempts lost to clouds or failures;
 * {@code collected}: programme value earned tonight; {@code collectedTotal}, {@code remaining}: after the
 * night; {@code completed}: requests whose need is met; {@code slewS}: slew seconds of the executed
 * observations; {@code wallS}: seconds this night took to simulate (not in the CSV).
 */
public record NightRecord(String strategy, int night, LocalDate date, Instant darkStart, Instant darkEnd,
    double cloudS, int offered, String firstStatus, double plannedPriority, int executed, int failedAttempts,
    int replans, double collected, double collectedTotal, double remaining, int completed, double slewS,
    double wallS) {
  /** Hours of darkness (0 when there was no horizon). */
  public double darkH() {
    return darkStart == null ? 0 : (darkEnd.getEpochSecond() - darkStart.getEpochSecond()) / 3600.0;
  }
}
