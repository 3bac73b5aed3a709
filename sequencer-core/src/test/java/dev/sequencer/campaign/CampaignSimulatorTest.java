package dev.sequencer.campaign;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.CampaignReader;
import dev.sequencer.model.Observation;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.planner.Planner;
import dev.sequencer.planner.Prepared;
import dev.sequencer.sequence.SequencerOptions;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CampaignSimulatorTest {
  private static final AstroContext CTX = AstroContext.offline();
  /** Reproducible, short: 1 worker, 0.1 deterministic units per plan or re-plan, no LP bound. */
  private static final SequencerOptions FAST = SequencerOptions.defaults().withWorkers(1).withSeed(3)
      .withTimeLimitS(5).withReproducible(0.1).withRelaxationBound(false);

  private static CampaignReader.Result write(Path dir, String scenario, String campaign) throws IOException {
    Files.writeString(dir.resolve("scenario.json"), scenario);
    Files.writeString(dir.resolve("campaign.json"), campaign);
    return CampaignReader.read(dir.resolve("campaign.json"));
  }

  @Test
  void twentySeededNightsAreReproducibleAndAddUp(@TempDir Path dir) throws IOException {
    CampaignReader.Result in = write(dir, CampaignFixtures.groundScenario(10, 5, CampaignFixtures.EIGENAXIS),
        CampaignFixtures.campaign(20, 42, "{\"id\": \"F001\", \"seasonVisits\": 3}, {\"id\": \"F002\", \"exposureS\": 2400}",
            0.1));
    List<CampaignResult> first = new ArrayList<>();
    List<CampaignResult> second = new ArrayList<>();
    for (Strategy s : Strategy.values()) {
      first.add(new CampaignSimulator(in.campaign(), in.scenario(), CTX, FAST).run(s));
      second.add(new CampaignSimulator(in.campaign(), in.scenario(), CTX, FAST).run(s));
    }
    assertEquals(CampaignTables.nightsCsv(first), CampaignTables.nightsCsv(second), "same seed, same CSV");
    assertEquals(CampaignTables.totalsCsv(first), CampaignTables.totalsCsv(second));
    for (CampaignResult r : first) {
      System.out.printf("%s: %.1f s, %d re-plans, %d executed%n", r.strategy(), r.wallS(), r.replans(), r.executed());
      assertEquals(20, r.nights().size());
      double sum = r.nights().stream().mapToDouble(NightRecord::collected).sum();
      assertEquals(r.collected(), sum, 1e-9, "nights add up to the total");
      // The programme's identity (CampaignResult): collected + remaining + shortfall = programme value.
      assertEquals(r.programmeValue(), r.collected() + r.remaining() + r.shortfall(), 1e-9);
      assertEquals(r.remaining(), r.nights().get(19).remaining(), 1e-9);
      assertTrue(r.collected() > 0, r.strategy() + " collected nothing");
      int executed = r.nights().stream().mapToInt(NightRecord::executed).sum();
      assertEquals(r.executed(), executed);
      // Remaining never grows, collected never falls.
      for (int i = 1; i < r.nights().size(); i++) {
        assertTrue(r.nights().get(i).remaining() <= r.nights().get(i - 1).remaining() + 1e-9);
      }
    }
    // The weather really bites: some night is cloudy and some attempt is lost.
    assertTrue(first.get(0).nights().stream().anyMatch(n -> n.cloudS() > 0));
    assertTrue(first.stream().mapToInt(CampaignResult::failedAttempts).sum() > 0);
    // Programme value by hand: 3 visits of F001, F002's 2400 s at its priority per durationS, 1 visit each other.
    Scenario s = in.scenario();
    double expected = 0;
    for (var r : s.requests()) {
      expected += switch (r.id()) {
        case "F001" -> 3 * r.priority();
        case "F002" -> r.priority() / r.durationS() * 2400;
        default -> r.priority();
      };
    }
    assertEquals(expected, first.get(0).programmeValue(), 1e-9);
  }

  /**
   * Each night's executed observations, checked again from outside the executor: a validator built afresh
   * from the night's scenario (the same validator code the executor uses, so this checks the executor's
   * bookkeeping, not the validator), and the weather: no executed observation overlaps a cloud.
   */
  @Test
  void executedNightsPassTheValidatorAndAvoidClouds(@TempDir Path dir) throws IOException {
    CampaignReader.Result in = write(dir, CampaignFixtures.groundScenario(12, 8, CampaignFixtures.ALTAZ),
        CampaignFixtures.campaign(2, 7, "", 0));
    CampaignSimulator sim = new CampaignSimulator(in.campaign(), in.scenario(), CTX, FAST);
    for (int i = 0; i < 2; i++) {
      TimeWindow w = sim.night(i);
      Scenario night = new Scenario(1, "n", w, in.scenario().observer(), in.scenario().constraints(),
          in.scenario().slew(), null, in.scenario().requests(), null);
      Prepared p = Planner.prepare(night, CTX);
      for (Strategy st : Strategy.values()) {
        NightExecutor.NightLog log = new NightExecutor(p.problem(), p.validator(), sim.weather(i), FAST).run(st);
        assertEquals(List.of(), Planner.prepare(night, CTX).validator().withRequiredIgnored().violations(log.executed()));
        for (Observation o : log.executed().observations()) {
          assertEquals(null, sim.weather(i).cloudOver(o.start(), o.end()), st + " observed " + o.id() + " in a cloud");
        }
      }
    }
  }

  @Test
  void orbitObserverNightsAreUtcDays(@TempDir Path dir) throws IOException {
    CampaignReader.Result in = write(dir, CampaignFixtures.orbitScenario(5, 2), CampaignFixtures.campaign(1, 3, "", 0));
    CampaignSimulator sim = new CampaignSimulator(in.campaign(), in.scenario(), CTX, FAST);
    assertEquals(86_400, sim.night(0).durationS(), 0);
    CampaignResult r = sim.run(Strategy.GREEDY);
    assertEquals(r.programmeValue(), r.collected() + r.remaining() + r.shortfall(), 1e-9);
    assertTrue(r.executed() > 0);
  }

  @Test
  void clearWeatherLosesNothingAndFinishedRequestsStop(@TempDir Path dir) throws IOException {
    String campaign = """
        { "format": 1, "scenario": "scenario.json", "firstNight": "2031-03-01", "nights": 3,
          "weather": { "clearNightProbability": 1 } }""";
    CampaignReader.Result in = write(dir, CampaignFixtures.groundScenario(6, 4, CampaignFixtures.ALTAZ), campaign);
    CampaignResult r = new CampaignSimulator(in.campaign(), in.scenario(), CTX, FAST).run(Strategy.CPSAT);
    assertEquals(0, r.failedAttempts());
    assertEquals(0, r.replans());
    // One visit each: what night 1 observed is not offered on night 2.
    NightRecord n1 = r.nights().get(0);
    NightRecord n2 = r.nights().get(1);
    assertEquals(6, n1.offered());
    assertEquals(6 - n1.executed(), n2.offered());
    assertFalse(r.nights().stream().anyMatch(n -> n.cloudS() > 0));
  }
}
