package dev.sequencer.campaign;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.sequencer.astro.AstroContext;
import dev.sequencer.io.CampaignReader;
import dev.sequencer.io.ScenarioException;
import dev.sequencer.io.ScenarioReader;
import dev.sequencer.io.SweepReader;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Sweep;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The campaign and sweep files: errors with JSON path, rule and value; the grid; the summary's quartiles. */
class CampaignFilesTest {
  private static String message(Runnable r) {
    return assertThrows(ScenarioException.class, r::run).getMessage();
  }

  @Test
  void campaignErrorsNameThePathTheRuleAndTheValue() {
    String m = message(() -> CampaignReader.parse("""
        { "format": 1, "scenario": "s.json", "firstNight": "2031-02-30", "nights": 0, "wether": {},
          "programme": [ { "id": "A", "seasonVisits": 2, "exposureS": 60 }, { "id": "A" } ] }""", "c.json"));
    assertTrue(m.contains("wether: unknown field (did you mean weather?)"), m);
    assertTrue(m.contains("firstNight: must be an ISO-8601 date such as 2031-05-04 (was 2031-02-30)"), m);
    assertTrue(m.contains("nights: must be in [1, 1100] (was 0)"), m);
    assertTrue(m.contains("programme[0]: give seasonVisits or exposureS, not both"), m);
    assertTrue(m.contains("programme[1].id: listed twice (was A)"), m);
    String w = message(() -> CampaignReader.parse("""
        { "format": 1, "scenario": "s.json", "firstNight": "2031-02-01", "nights": 3,
          "weather": { "clearNightProbability": 1.5, "cloudBlockMinS": 600, "cloudBlockMaxS": 300 } }""", "c.json"));
    assertTrue(w.contains("weather.clearNightProbability: must be in [0, 1] (was 1.5)"), w);
    assertTrue(w.contains("weather.cloudBlockMaxS: must be >= cloudBlockMinS (600) (was 300)"), w);
  }

  @Test
  void programmeIdsMustBeTheScenarios(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("scenario.json"), CampaignFixtures.groundScenario(3, 1, CampaignFixtures.ALTAZ));
    Files.writeString(dir.resolve("c.json"), CampaignFixtures.campaign(2, 1, "{\"id\": \"F01\"}", 0));
    String m = message(() -> CampaignReader.read(dir.resolve("c.json")));
    assertTrue(m.contains("programme[0].id: no request of the scenario has this id (did you mean F001?) (was F01)"), m);
  }

  @Test
  void sweepErrorsAndGrid() {
    Scenario s = ScenarioReader.parse(CampaignFixtures.groundScenario(3, 1, CampaignFixtures.ALTAZ)).scenario();
    String m = message(() -> SweepReader.parse("""
        { "format": 1, "scenario": "s.json", "axes": { "solver": ["cpsat", "gredy"], "seeds": [1],
          "weatherSeed": [1], "slew": [ { "model": "fixed", "second": 5 } ] } }""", "w.json", s));
    assertTrue(m.contains("axes.solver[1]: must be one of cpsat, greedy, best-now (did you mean greedy?) (was gredy)"), m);
    assertTrue(m.contains("axes.seeds: unknown field (did you mean seed?)"), m);
    assertTrue(m.contains("axes.weatherSeed: only a campaign has weather"), m);
    assertTrue(m.contains("axes.slew[0].second: unknown field (did you mean seconds?)"), m);

    Sweep sw = SweepReader.parse("""
        { "format": 1, "scenario": "s.json", "axes": { "solver": ["cpsat", "greedy"], "seed": [1, 2, 3],
          "slew": [ { "model": "fixed", "seconds": 30 }, { "model": "fixed", "seconds": 90 } ] } }""", "w.json", s);
    SweepRunner runner = new SweepRunner(sw, s, null, AstroContext.offline());
    assertEquals(12, runner.size(), "2 solvers x 3 seeds x 2 slews");
    assertEquals(List.of("solver", "seed", "slew"), runner.axes());
    assertTrue(sw.reproducible(), "reproducible by default");
  }

  @Test
  void aCampaignSweepVariesTheWeather(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("scenario.json"), CampaignFixtures.groundScenario(5, 9, CampaignFixtures.EIGENAXIS));
    Files.writeString(dir.resolve("campaign.json"), CampaignFixtures.campaign(1, 1, "", 0));
    Files.writeString(dir.resolve("sweep.json"), "{ \"format\": 1, \"campaign\": \"campaign.json\", "
        + "\"axes\": { \"solver\": [\"greedy\"], \"workers\": [1], \"weatherSeed\": [1, 2, 3] } }");
    SweepRunner runner = SweepRunner.load(dir.resolve("sweep.json"), AstroContext.offline());
    assertEquals(3, runner.size());
    List<SweepRow> rows = runner.runAll(1);
    double programme = ScenarioReader.read(dir.resolve("scenario.json")).scenario().requests().stream()
        .mapToDouble(q -> q.priority()).sum();
    for (int i = 0; i < 3; i++) {
      SweepRow r = rows.get(i);
      assertEquals("SEASON", r.status());
      assertEquals(i + 1L, r.weatherSeed());
      // A one-night season of one-visit requests: collected + remaining is the programme value.
      assertEquals(programme, r.priority() + r.remaining(), 1e-9);
    }
  }

  @Test
  void quartilesAreType7() {
    // numpy.percentile([1, 2, 3, 4], [25, 50, 75]) = [1.75, 2.5, 3.25] (numpy's default "linear" method,
    // R's type 7: common practice; values from memory, and easy to redo by hand: h = 3q).
    double[] v = {1, 2, 3, 4};
    assertEquals(1.75, SweepSummary.quantile(v, 0.25), 1e-12);
    assertEquals(2.5, SweepSummary.quantile(v, 0.5), 1e-12);
    assertEquals(3.25, SweepSummary.quantile(v, 0.75), 1e-12);
    assertEquals(7, SweepSummary.quantile(new double[] {7}, 0.75), 0);
  }

  @Test
  void embeddedSweepIsReproducibleAndSummarised() {
    Scenario s = ScenarioReader.parse(CampaignFixtures.groundScenario(8, 3, CampaignFixtures.ALTAZ)).scenario();
    Sweep sw = SweepReader.parse("""
        { "format": 1, "scenario": "s.json", "axes": { "solver": ["cpsat", "greedy", "best-now"], "timeLimitS": [0.2],
          "workers": [1], "seed": [1, 2] } }""", "w.json", s);
    SweepRunner runner = new SweepRunner(sw, s, null, AstroContext.offline());
    List<String> a = runner.runAll(2).stream().map(SweepRow::resultCsv).toList();
    List<String> b = IntStream.range(0, runner.size()).mapToObj(i -> runner.run(i).resultCsv()).toList();
    assertEquals(a, b, "pool of 2 and one after another give the same rows");
    List<SweepSummary> sum = SweepSummary.of(runner.runAll(1), runner.axes());
    assertEquals(3 + 1 + 1 + 2, sum.size());
    assertTrue(sum.stream().allMatch(x -> x.min() <= x.q1() && x.q1() <= x.median() && x.median() <= x.q3()
        && x.q3() <= x.max()));
  }
}
