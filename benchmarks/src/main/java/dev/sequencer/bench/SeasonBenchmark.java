package dev.sequencer.bench;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.campaign.CampaignResult;
import dev.sequencer.campaign.CampaignSimulator;
import dev.sequencer.campaign.CampaignTables;
import dev.sequencer.campaign.NightRecord;
import dev.sequencer.campaign.Strategy;
import dev.sequencer.io.CampaignReader;
import dev.sequencer.io.ScenarioReader;
import dev.sequencer.model.Campaign;
import dev.sequencer.model.Scenario;
import dev.sequencer.sequence.SequencerOptions;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;

/**
 * A season of n invented fields at an invented ground site (29.9 S, 70.8 W), seeded weather, played by each
 * strategy in reproducible mode; prints the totals, the completion curve (collected value per night) and
 * the per-night CSV to standard output.
 *
 * <p>Usage: {@code SeasonBenchmark [requests=150] [nights=30] [limitUnits=0.2] [strategies=cpsat,greedy,best-now]}.
 */
public final class SeasonBenchmark {
  private SeasonBenchmark() {}

  /** n fields: RA 0-360, Dec -80..+10, 5-15 min, priority 1-10, 20 % of them wanted on 3 nights. */
  static String scenario(int n, long seed) {
    Random r = new Random(seed);
    StringBuilder b = new StringBuilder("{ \"format\": 1, \"name\": \"season benchmark fields\",\n"
        + " \"horizon\": { \"start\": \"2031-04-01T00:00:00Z\", \"end\": \"2031-04-02T00:00:00Z\" },\n"
        + " \"observer\": { \"ground\": { \"latitudeDeg\": -29.9, \"longitudeDeg\": -70.8, \"altitudeM\": 2400 } },\n"
        + " \"constraints\": { \"elevationMinDeg\": 30, \"sunElevationMaxDeg\": -15, \"moonSeparationMinDeg\": 15 },\n"
        + " \"slew\": { \"model\": \"eigenaxis\", \"rateDegPerS\": 1.5, \"accelDegPerS2\": 0.3, \"settleS\": 10 },\n"
        + " \"requests\": [\n");
    for (int i = 0; i < n; i++) {
      b.append(String.format(Locale.ROOT, "  { \"id\": \"B%03d\", \"target\": { \"raDeg\": %.3f, \"decDeg\": %.3f }, "
          + "\"durationS\": %d, \"priority\": %d }%s%n", i + 1, r.nextDouble() * 360, -80 + r.nextDouble() * 90,
          60 * (5 + r.nextInt(11)), 1 + r.nextInt(10), i + 1 < n ? "," : ""));
    }
    return b.append(" ]\n}\n").toString();
  }

  static String campaign(int n, int nights) {
    StringBuilder prog = new StringBuilder();
    for (int i = 0; i < n; i += 5) {
      prog.append(prog.length() == 0 ? "" : ", ").append(String.format(Locale.ROOT,
          "{ \"id\": \"B%03d\", \"seasonVisits\": 3 }", i + 1));
    }
    return String.format(Locale.ROOT, "{ \"format\": 1, \"name\": \"season benchmark\", \"scenario\": \"-\", "
        + "\"firstNight\": \"2031-04-01\", \"nights\": %d, \"programme\": [%s], \"weather\": { \"seed\": 30, "
        + "\"clearNightProbability\": 0.5, \"cloudBlocksMax\": 3, \"cloudBlockMinS\": 1200, \"cloudBlockMaxS\": 7200, "
        + "\"failureFraction\": 0.05 }, \"priorityAgeingPerNight\": 0.05 }", nights, prog);
  }

  public static void main(String[] args) {
    int n = args.length > 0 ? Integer.parseInt(args[0]) : 150;
    int nights = args.length > 1 ? Integer.parseInt(args[1]) : 30;
    double units = args.length > 2 ? Double.parseDouble(args[2]) : 0.2;
    String[] names = (args.length > 3 ? args[3] : "cpsat,greedy,best-now").split(",");
    Scenario s = ScenarioReader.parse(scenario(n, 2031)).scenario();
    Campaign c = CampaignReader.parse(campaign(n, nights), "season benchmark");
    CampaignReader.checkProgramme(c, s, "season benchmark");
    SequencerOptions o = SequencerOptions.defaults().withWorkers(1).withSeed(1).withTimeLimitS(Math.max(5, units))
        .withReproducible(units).withRelaxationBound(false);
    CampaignSimulator sim = new CampaignSimulator(c, s, AstroContext.offline(), o);
    List<CampaignResult> results = new ArrayList<>();
    for (String name : names) {
      CampaignResult r = sim.run(Strategy.of(name));
      results.add(r);
      System.out.printf(Locale.ROOT, "%s: collected %.1f of %.1f, remaining %.1f, %d/%d complete, %d observations, "
          + "%d lost, %d re-plans, %.0f s%n", r.strategy(), r.collected(), r.programmeValue(), r.remaining(),
          r.completed(), r.requests(), r.executed(), r.failedAttempts(), r.replans(), r.wallS());
      StringBuilder curve = new StringBuilder(r.strategy() + " collected by night:");
      for (NightRecord x : r.nights()) {
        curve.append(String.format(Locale.ROOT, " %.0f", x.collectedTotal()));
      }
      System.out.println(curve);
      System.out.flush();
    }
    System.out.print(CampaignTables.totalsCsv(results));
    System.out.print(CampaignTables.nightsCsv(results));
  }
}
