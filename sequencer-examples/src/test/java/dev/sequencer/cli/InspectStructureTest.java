package dev.sequencer.cli;

import static dev.sequencer.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * {@code inspect} on the bundled cadence night (issue 16): the visits, each group with its rules and members,
 * the configurations and change times, and the requested time counting every visit — the figures recomputed
 * here from the file itself.
 */
class InspectStructureTest {
  private static final Path CADENCE = Path.of("src/main/resources/scenarios/cadence-queue-night.json");

  @Test
  void inspectSummarisesVisitsGroupsAndConfigurations() throws Exception {
    CliTest.Run r = run("inspect", CADENCE.toString());
    assertEquals(0, r.code(), r.err());
    JsonNode file = new ObjectMapper().readTree(CADENCE.toFile());
    int repeated = 0;
    int visits = 0;
    double requested = 0;
    for (JsonNode q : file.get("requests")) {
      int count = q.has("visits") ? q.get("visits").get("count").asInt() : 1;
      repeated += count > 1 ? 1 : 0;
      visits += count > 1 ? count : 0;
      requested += q.get("durationS").asDouble() * count;
    }
    List<String> lines = r.out().lines().toList();
    String visitsLine = "visits      " + repeated + " request(s) with " + visits
        + " visits in all, 2 all or nothing; separations from 2400 s, at most 10800 s";
    assertTrue(lines.contains(visitsLine), visitsLine + " in " + r.out());
    for (JsonNode g : file.get("groups")) {
      String id = g.get("id").textValue();
      assertTrue(lines.stream().anyMatch(l -> l.startsWith("group       " + id + ": ")), id + ": " + r.out());
    }
    assertTrue(lines.contains("group       CHAIN1: ordered, all or nothing, gap <= 600 s: CAL1A -> F005 -> CAL1B"),
        r.out());
    assertTrue(lines.contains("group       PAIR1: all or nothing: F013, F014"), r.out());
    assertTrue(lines.stream().anyMatch(l -> l.startsWith("configs     {(none)=") && l.contains("red-grism=")
        && l.contains("(matrix), added to the slew")), r.out());
    String requestedLine = String.format(java.util.Locale.ROOT, "requested   %.0f s of observation", requested);
    assertTrue(lines.stream().anyMatch(l -> l.startsWith(requestedLine)), requestedLine + " in " + r.out());
  }
}
