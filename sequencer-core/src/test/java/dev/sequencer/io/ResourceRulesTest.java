package dev.sequencer.io;

import static dev.sequencer.io.Docs.at;
import static dev.sequencer.io.Docs.base;
import static dev.sequencer.io.Docs.noObserver;
import static dev.sequencer.io.Docs.problems;
import static dev.sequencer.io.Docs.read;
import static dev.sequencer.io.Docs.request;
import static dev.sequencer.io.Docs.tree;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Observation;
import dev.sequencer.model.PlanStatus;
import dev.sequencer.model.Reconfiguration;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.TimeWindow;
import dev.sequencer.model.Timeline;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Several resources (format addition A6): what is read, written back, and every rule with its JSON path. */
class ResourceRulesTest {
  /** The base scenario's observer, slew and start pointing moved into two resources (the second a site of its own). */
  private static ObjectNode twoSites() {
    ObjectNode doc = base();
    JsonNode observer = doc.remove("observer");
    JsonNode slew = doc.remove("slew");
    JsonNode start = doc.remove("startPointing");
    ArrayNode resources = doc.putArray("resources");
    ObjectNode north = resources.addObject();
    north.put("id", "north");
    north.set("observer", observer);
    north.set("slew", slew);
    north.set("startPointing", start);
    ObjectNode south = resources.addObject();
    south.put("id", "south");
    south.set("observer", tree("{\"ground\": {\"latitudeDeg\": -24.2, \"longitudeDeg\": -69.8, \"altitudeM\": 2100}}"));
    south.set("slew", tree("{\"model\": \"fixed\", \"seconds\": 45}"));
    south.set("constraints", tree("{\"elevationMinDeg\": 35, \"sunSeparationMinDeg\": null}"));
    south.set("reconfiguration", tree("{\"seconds\": 30, \"concurrentWithSlew\": false}"));
    return doc;
  }

  @Test
  void resourcesAreReadWithTheirOwnObserverSlewConstraintsAndChangeTimesAndWrittenBack() {
    ObjectNode doc = twoSites();
    request(doc, 0).set("resources", tree("[\"south\"]"));
    Scenario s = read(doc).scenario();
    assertEquals(List.of("north", "south"), s.resources().stream().map(r -> r.id()).toList());
    assertNull(s.observer(), "the top level has no observer of its own");
    Scenario south = s.forResource(s.resource("south").orElseThrow());
    assertEquals(-24.2, ((GroundSite) south.observer()).latitudeDeg());
    assertEquals("fixed", south.slew().model());
    assertEquals(35.0, south.constraints().elevationMinDeg(), "the resource's own field replaces the scenario's");
    assertNull(south.constraints().sunSeparationMinDeg(), "null removes the scenario's field");
    assertEquals(88.0, south.constraints().elevationMaxDeg(), "fields it does not give are inherited");
    assertEquals(Reconfiguration.constant(30, false), south.reconfiguration());
    Scenario north = s.forResource(s.resource("north").orElseThrow());
    assertEquals(Reconfiguration.NONE, north.reconfiguration(), "no table of its own: the scenario's");
    assertEquals(45.0, north.constraints().sunSeparationMinDeg());
    assertEquals(List.of("south"), s.requests().get(0).resources());
    assertTrue(s.requests().get(0).allows("south") && !s.requests().get(0).allows("north"));
    assertTrue(s.requests().get(1).allows("north"), "no list: every resource");
    assertEquals(java.util.Set.of(ConstraintField.SUN_SEPARATION_MIN_DEG),
        s.resource("south").orElseThrow().constraints().removed());
    assertEquals(s, ScenarioReader.parse(ScenarioWriter.toJson(s), "round trip").scenario(),
        "written and read back unchanged");
  }

  @Test
  void oneFormOrTheOther() {
    ObjectNode doc = twoSites();
    doc.set("slew", tree("{\"model\": \"fixed\", \"seconds\": 10}"));
    doc.set("observer", tree("{\"ground\": {\"latitudeDeg\": 1, \"longitudeDeg\": 2, \"altitudeM\": 3}}"));
    List<Problem> ps = problems(doc);
    assertTrue(at(ps, "slew").message().startsWith("not allowed with \"resources\""));
    assertTrue(at(ps, "observer").message().startsWith("not allowed with \"resources\""));
    doc = twoSites();
    doc.set("resources", tree("[]"));
    assertEquals("[]", at(problems(doc), "resources").value());
  }

  @Test
  void everyResourceNeedsAUniqueIdAndASlewModelAndKnownFields() {
    ObjectNode doc = twoSites();
    ObjectNode second = (ObjectNode) doc.get("resources").get(1);
    second.put("id", "north");
    second.remove("slew");
    second.put("telescope", "big");
    List<Problem> ps = problems(doc);
    assertEquals("north", at(ps, "resources[1].id").value());
    assertTrue(at(ps, "resources[1].id").message().startsWith("duplicate id, already used by resources[0]"));
    assertTrue(at(ps, "resources[1].slew").message().contains("required"), at(ps, "resources[1].slew").message());
    assertTrue(at(ps, "resources[1].telescope").message().startsWith("unknown field"));
  }

  @Test
  void aResourcesObserverAndSlewFollowTheTopLevelRules() {
    ObjectNode doc = twoSites();
    ObjectNode second = (ObjectNode) doc.get("resources").get(1);
    second.set("observer", tree("{\"ground\": {\"latitudeDeg\": 95, \"longitudeDeg\": 0, \"altitudeM\": 0}}"));
    second.set("slew", tree("{\"model\": \"matrix\", \"seconds\": [[0, 1], [1, 0]]}"));
    List<Problem> ps = problems(doc);
    assertEquals("95", at(ps, "resources[1].observer.ground.latitudeDeg").value());
    assertTrue(ps.stream().anyMatch(p -> p.path().startsWith("resources[1].slew.seconds")),
        "a matrix slew is indexed by all requests (4 here): " + ps);
  }

  @Test
  void mixedObserverKindsAreRefused() {
    ObjectNode doc = twoSites();
    ObjectNode second = (ObjectNode) doc.get("resources").get(1);
    second.remove("observer");
    Problem p = at(problems(doc), "resources[1]");
    assertTrue(p.message().startsWith("every resource has the same kind of observer as resources[0] (ground)"),
        p.message());
  }

  @Test
  void requestsNameKnownResourcesOnce() {
    ObjectNode doc = twoSites();
    request(doc, 0).set("resources", tree("[\"south\", \"west\", \"south\", 7]"));
    request(doc, 1).set("resources", tree("[]"));
    List<Problem> ps = problems(doc);
    String r1 = "requests[0] (id \"R1\").resources";
    assertEquals("west", at(ps, r1 + "[1]").value());
    assertTrue(at(ps, r1 + "[1]").message().startsWith("no resource has this id (resources: [north, south])"));
    assertEquals("named twice", at(ps, r1 + "[2]").message());
    assertTrue(at(ps, r1 + "[3]").message().startsWith("must be a resource id"));
    assertEquals("[]", at(ps, "requests[1] (id \"R2\").resources").value());
    ObjectNode one = base();
    request(one, 0).set("resources", tree("[\"north\"]"));
    assertTrue(at(problems(one), "requests[0] (id \"R1\").resources").message()
        .startsWith("needs the top-level \"resources\""));
  }

  @Test
  void aResourcesChangeTableMustHoldEveryLabel() {
    ObjectNode doc = twoSites();
    request(doc, 1).put("configuration", "blue");
    ((ObjectNode) doc.get("resources").get(1)).set("reconfiguration",
        tree("{\"labels\": [\"\", \"red\"], \"seconds\": [[0, 9], [9, 0]]}"));
    Problem p = at(problems(doc), "requests[1] (id \"R2\").configuration");
    assertEquals("not among resources[1].reconfiguration.labels [, red]", p.message());
    assertEquals("blue", p.value());
  }

  @Test
  void withoutObserversEveryResourceIsATable() {
    ObjectNode doc = noObserver();
    JsonNode slew = doc.remove("slew");
    ArrayNode resources = doc.putArray("resources");
    resources.addObject().put("id", "antenna-1").set("slew", slew);
    resources.addObject().put("id", "antenna-2").set("slew", tree("{\"model\": \"fixed\", \"seconds\": 90}"));
    Scenario s = read(doc).scenario();
    assertEquals(2, s.resources().size());
    assertEquals(s, ScenarioReader.parse(ScenarioWriter.toJson(s), "round trip").scenario());
  }

  @Test
  void timelinesCarryTheResourceAndWindowsFilesOneEntryPerResource() {
    Instant t0 = Instant.parse("2031-05-04T20:00:00Z");
    Timeline t = new Timeline(PlanStatus.FEASIBLE, 7, 12.5, null,
        List.of(new Observation("R1", t0, t0.plusSeconds(60), 10, null, null).withResource("south"),
            new Observation("R2", t0.plusSeconds(30), t0.plusSeconds(90), 2.5, null, null).withResource("north")),
        List.of());
    Timeline back = TimelineFile.parse(TimelineFile.toJson(t), "round trip");
    assertEquals(List.of("south", "north"), back.observations().stream().map(Observation::resource).toList());
    assertTrue(!TimelineFile.toJson(new Timeline(PlanStatus.FEASIBLE, 0, 0, null,
        List.of(new Observation("R1", t0, t0.plusSeconds(60), 10, null, null)), List.of())).contains("resource"),
        "one observer: no resource written");
    Map<String, List<RequestWindows>> byResource = new LinkedHashMap<>();
    byResource.put("north", List.of(new RequestWindows("R1", List.of(new TimeWindow(t0, t0.plusSeconds(600))))));
    byResource.put("south", List.of(new RequestWindows("R1", List.of())));
    JsonNode w = tree(WindowsFile.toJsonByResource(byResource));
    assertEquals(2, w.get("windows").size());
    assertEquals("south", w.get("windows").get(1).get("resource").textValue());
    assertEquals("R1", w.get("windows").get(1).get("id").textValue());
  }
}
