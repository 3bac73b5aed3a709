package dev.sequencer.io;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.sequencer.model.Scenario;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/** Write then read gives the scenario back, one observer or several resources (A6). */
class ScenarioRoundTripProperties {

  @Provide
  Arbitrary<Scenario> scenarios() {
    return Arbitraries.randomValue(random -> random.nextInt(3) == 0 ? new ScenarioGen(random).resourceScenario()
        : new ScenarioGen(random).scenario());
  }

  @Property(tries = 300)
  void writtenThenReadIsEqualWithoutWarnings(@ForAll("scenarios") Scenario s) {
    String json = ScenarioWriter.toJson(s);
    ScenarioReader.Result back = ScenarioReader.parse(json);
    assertEquals(s, back.scenario(), json);
    assertEquals(List.of(), back.warnings());
  }

  @Property(tries = 100)
  void writingIsByteStable(@ForAll("scenarios") Scenario s) {
    String json = ScenarioWriter.toJson(s);
    assertEquals(json, ScenarioWriter.toJson(ScenarioReader.parse(json).scenario()));
  }
}
