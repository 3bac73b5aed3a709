package dev.sequencer.campaign;

import java.util.List;
import java.util.Locale;

/** The per-night CSV and the totals table of campaign results (text only; the caller writes the files). */
public final class CampaignTables {
  /** Header of {@link #nightsCsv}. */
  public static final String NIGHTS_HEADER = "strategy,night,date,darkStart,darkEnd,darkH,cloudH,offered,firstStatus,"
      + "plannedPriority,executed,failedAttempts,replans,collected,collectedTotal,remaining,completed,slewS";
  /** Header of {@link #totalsCsv}. */
  public static final String TOTALS_HEADER = "strategy,nights,requests,programmeValue,collected,remaining,shortfall,"
      + "completed,executed,failedAttempts,replans";

  private CampaignTables() {}

  /** One row per night and strategy; deterministic (no wall times). */
  public static String nightsCsv(List<CampaignResult> results) {
    StringBuilder b = new StringBuilder(NIGHTS_HEADER).append('\n');
    for (CampaignResult r : results) {
      for (NightRecord n : r.nights()) {
        b.append(String.format(Locale.ROOT, "%s,%d,%s,%s,%s,%.3f,%.3f,%d,%s,%s,%d,%d,%d,%s,%s,%s,%d,%.3f%n",
            n.strategy(), n.night(), n.date(), n.darkStart() == null ? "" : n.darkStart(),
            n.darkEnd() == null ? "" : n.darkEnd(), n.darkH(), n.cloudS() / 3600.0, n.offered(), n.firstStatus(),
            SweepRow.num(n.plannedPriority()), n.executed(), n.failedAttempts(), n.replans(), SweepRow.num(n.collected()),
            SweepRow.num(n.collectedTotal()), SweepRow.num(n.remaining()), n.completed(), n.slewS()));
      }
    }
    return b.toString();
  }

  /** One row per strategy; deterministic (no wall times). */
  public static String totalsCsv(List<CampaignResult> results) {
    StringBuilder b = new StringBuilder(TOTALS_HEADER).append('\n');
    for (CampaignResult r : results) {
      b.append(String.format(Locale.ROOT, "%s,%d,%d,%s,%s,%s,%s,%d,%d,%d,%d%n", r.strategy(), r.nights().size(),
          r.requests(), SweepRow.num(r.programmeValue()), SweepRow.num(r.collected()), SweepRow.num(r.remaining()),
          SweepRow.num(r.shortfall()), r.completed(), r.executed(), r.failedAttempts(), r.replans()));
    }
    return b.toString();
  }
}
