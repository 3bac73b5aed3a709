package dev.sequencer.io;

import static dev.sequencer.io.Docs.at;
import static dev.sequencer.io.Docs.base;
import static dev.sequencer.io.Docs.network;
import static dev.sequencer.io.Docs.problems;
import static dev.sequencer.io.Docs.read;
import static dev.sequencer.io.Docs.request;
import static dev.sequencer.io.Docs.resource;
import static dev.sequencer.io.Docs.tree;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.model.AzElPointing;
import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Reconfiguration;
import dev.sequencer.model.Resource;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Several resources (format addition A6): what is read, and every rule with its path, its words and the value. */
class ResourceRulesTest {
  private static final String NORTH = "resources[0] (id \"north\")";
  private static final String SOUTH = "resources[1] (id \"south\")";
  private static final String QUEUE = "resources[2] (id \"queue\")";
  private static final String R1 = "requests[0] (id \"R1\")";

  @Test
  void eachResourceIsReadWithItsOwnParts() {
    Scenario s = read(network()).scenario();
    assertEquals(List.of("north", "south", "queue"), s.resources().stream().map(Resource::id).toList());
    Resource north = s.resource("north").orElseThrow();
    assertEquals(new GroundSite(28.7, -17.9, 2300, List.of(), null), north.observer());
    assertEquals(new SlewSettings.AltAz(3, 2, 1, 1, 10, List.of(-270.0, 270.0)), north.slew());
    assertEquals(new AzElPointing(0, 45), north.startPointing());
    assertEquals(new ConstraintOverrides(Constraints.builder().elevationMinDeg(30).build(),
        EnumSet.of(ConstraintField.SUN_SEPARATION_MIN_DEG)), north.constraints());
    assertNull(north.reconfiguration(), "inherits the scenario's");
    Resource south = s.resource("south").orElseThrow();
    assertEquals(new Reconfiguration(List.of("", "red"), 0, new double[][] {{0, 60}, {45, 0}}, true),
        south.reconfiguration());
    assertEquals(ConstraintOverrides.none(), south.constraints());
    Resource queue = s.resource("queue").orElseThrow();
    assertNull(queue.observer());
    assertNull(queue.startPointing());
    assertEquals(List.of("north", "south"), s.requests().get(0).resources());
    assertEquals(List.of("queue"), s.requests().get(3).resources());
    // The top level gives no observer, start pointing or slew of its own; the model's slew is the first resource's.
    assertNull(s.observer());
    assertNull(s.startPointing());
    assertEquals(north.slew(), s.slew());
  }

  @Test
  void aNetworkIsWrittenBackAsItWasRead() {
    Scenario s = read(network()).scenario();
    String json = ScenarioWriter.toJson(s);
    assertEquals(s, ScenarioReader.parse(json, "round trip").scenario(), json);
    ObjectNode written = (ObjectNode) tree(json);
    assertEquals(List.of("format", "name", "horizon", "constraints", "resources", "requests"),
        names(written));
    assertEquals(List.of("id", "observer", "slew", "startPointing", "constraints"),
        names(resource(written, 0)));
    assertEquals("[\"north\",\"south\"]", request(written, 0).get("resources").toString());
    assertEquals("{\"sunSeparationMinDeg\":null,\"elevationMinDeg\":30}", resource(written, 0).get("constraints")
        .toString(), "the removed field is written as null");
  }

  private static List<String> names(ObjectNode o) {
    List<String> out = new ArrayList<>();
    o.fieldNames().forEachRemaining(out::add);
    return out;
  }

  @Test
  void aResourcesConstraintsReplaceTheScenariosFieldByField() {
    Scenario s = read(network()).scenario();
    Constraints north = s.forResource(s.resource("north").orElseThrow()).constraints();
    // Scenario: Sun separation 45, elevation 20..88, Sun elevation <= -12; north: elevation >= 30, no Sun separation.
    assertEquals(Constraints.builder().elevationMinDeg(30).elevationMaxDeg(88).sunElevationMaxDeg(-12).build(), north);
    assertEquals(s.constraints(), s.forResource(s.resource("south").orElseThrow()).constraints());
  }

  @Test
  void anEmptyResourceListIsRefused() {
    ObjectNode doc = network();
    doc.set("resources", tree("[]"));
    Problem p = at(problems(doc), "resources");
    assertEquals("must list at least one resource (omit the field for one observer)", p.message());
    assertEquals("[]", p.value());
  }

  @Test
  void resourcesMustBeAnArrayOfObjects() {
    ObjectNode doc = network();
    ((ArrayNode) doc.get("resources")).add(7);
    assertEquals("must be an object (was 7)", at(problems(doc), "resources[3]").message());
    doc.put("resources", "north");
    assertEquals("must be an array (was \"north\")", at(problems(doc), "resources").message());
  }

  @Test
  void theOneObserverFieldsAreRefusedBesideResources() {
    ObjectNode doc = network();
    ObjectNode one = base();
    for (String field : List.of("observer", "slew", "startPointing")) {
      doc.set(field, one.get(field));
    }
    List<Problem> ps = problems(doc);
    for (String field : List.of("observer", "slew", "startPointing")) {
      Problem p = at(ps, field);
      assertEquals("must be absent when the file gives \"resources\" (each resource has its own " + field + ")",
          p.message());
      assertEquals(one.get(field).toString(), p.value());
    }
    assertEquals(3, ps.size(), ps.toString());
  }

  @Test
  void aResourceIdIsRequiredNonEmptyAndUnique() {
    ObjectNode doc = network();
    resource(doc, 1).put("id", "north");
    resource(doc, 2).remove("id");
    Problem dup = at(problems(doc), "resources[1] (id \"north\").id");
    assertEquals("duplicate resource id, already used by resources[0]", dup.message());
    assertEquals("north", dup.value());
    assertEquals("is required", at(problems(doc), "resources[2].id").message());
    doc = network();
    resource(doc, 0).put("id", " ");
    assertEquals("must not be empty (was \" \")", at(problems(doc), "resources[0] (id \" \").id").message());
  }

  @Test
  void anUnknownFieldInAResourceSuggestsTheName() {
    ObjectNode doc = network();
    resource(doc, 1).set("startPointng", tree("{\"raDeg\": 1, \"decDeg\": 2}"));
    Problem p = at(problems(doc), SOUTH + ".startPointng");
    assertEquals("unknown field (did you mean startPointing?)", p.message());
    assertEquals("{\"raDeg\":1,\"decDeg\":2}", p.value());
  }

  @Test
  void aResourceNeedsASlew() {
    ObjectNode doc = network();
    resource(doc, 1).remove("slew");
    assertEquals("is required", at(problems(doc), SOUTH + ".slew").message());
  }

  @Test
  void aResourceWithoutObserverDrivesOnlyMatrixOrFixedSlews() {
    ObjectNode doc = network();
    resource(doc, 2).set("slew", resource(doc, 1).get("slew"));
    Problem p = at(problems(doc), QUEUE + ".slew.model");
    assertEquals("needs an observer; without one use \"matrix\" or \"fixed\" (was \"eigenaxis\")", p.message());
    assertEquals("eigenaxis", p.value());
    doc = network();
    resource(doc, 2).set("slew", resource(doc, 0).get("slew"));
    assertEquals("is a ground mount and needs a ground observer (was \"altaz\")",
        at(problems(doc), QUEUE + ".slew.model").message());
  }

  @Test
  void anAltAzSlewNeedsAGroundResource() {
    ObjectNode doc = network();
    resource(doc, 1).set("observer", tree("{\"orbit\": {\"keplerian\": {\"epoch\": \"2031-05-04T18:00:00Z\","
        + " \"semiMajorAxisKm\": 7000, \"eccentricity\": 0.001, \"inclinationDeg\": 98, \"raanDeg\": 0,"
        + " \"argumentOfPerigeeDeg\": 0, \"meanAnomalyDeg\": 0}}}"));
    resource(doc, 1).set("slew", resource(doc, 0).get("slew"));
    assertEquals("is a ground mount and needs a ground observer (was \"altaz\")",
        at(problems(doc), SOUTH + ".slew.model").message());
  }

  @Test
  void aMatrixSlewIsIndexedByEveryRequestOfTheFile() {
    ObjectNode doc = network();
    ((ObjectNode) resource(doc, 2).get("slew")).set("seconds", tree("[[0]]"));
    Problem p = at(problems(doc), QUEUE + ".slew.seconds");
    assertEquals("1 rows, but the scenario has 4 requests", p.message());
    assertEquals("1", p.value());
  }

  @Test
  void aResourcesObserverFollowsTheTopLevelRules() {
    ObjectNode doc = network();
    ((ObjectNode) resource(doc, 0).at("/observer/ground")).put("latitudeDeg", 91);
    resource(doc, 1).set("observer", tree("{\"ground\": {}, \"orbit\": {}}"));
    List<Problem> ps = problems(doc);
    Problem lat = at(ps, NORTH + ".observer.ground.latitudeDeg");
    assertEquals("must be in [-90, 90] (was 91)", lat.message());
    assertEquals("91", lat.value());
    assertEquals("must have exactly one of \"ground\" or \"orbit\"", at(ps, SOUTH + ".observer").message());
  }

  @Test
  void aResourcesStartPointingFollowsItsObserverAndMount() {
    ObjectNode doc = network();
    resource(doc, 0).set("startPointing", tree("{\"azimuthDeg\": 300, \"elevationDeg\": 45}"));
    resource(doc, 2).set("startPointing", tree("{\"azimuthDeg\": 10, \"elevationDeg\": 45}"));
    List<Problem> ps = problems(doc);
    Problem az = at(ps, NORTH + ".startPointing.azimuthDeg");
    assertEquals("must be in [-270, 270] (was 300)", az.message(), "north's mount range");
    assertEquals("300", az.value());
    assertEquals("an azimuth/elevation pointing needs a ground observer", at(ps, QUEUE + ".startPointing").message());
  }

  @Test
  void aResourcesConstraintsAreCheckedOverTheScenarios() {
    ObjectNode doc = network();
    resource(doc, 1).set("constraints",
        tree("{\"elevationMaxDeg\": 15, \"airmasMax\": 2, \"moonIlluminationMax\": 3}"));
    List<Problem> ps = problems(doc);
    Problem p = at(ps, SOUTH + ".constraints.elevationMaxDeg");
    assertEquals("must be greater than elevationMinDeg 20 (from the scenario's constraints) (was 15)", p.message());
    assertEquals("15", p.value());
    assertEquals("unknown field (did you mean airmassMax?)", at(ps, SOUTH + ".constraints.airmasMax").message());
    assertEquals("must be in [0, 1] (was 3)", at(ps, SOUTH + ".constraints.moonIlluminationMax").message());
  }

  @Test
  void aRequestsConstraintsAreCheckedOnEachResourceAllowedToObserveIt() {
    ObjectNode doc = network();
    resource(doc, 1).set("constraints", tree("{\"hourAngleMaxH\": 1}"));
    request(doc, 0).set("constraints", tree("{\"hourAngleMinH\": 3}"));
    request(doc, 2).set("constraints", tree("{\"hourAngleMinH\": 3}"));
    List<Problem> ps = problems(doc);
    Problem p = at(ps, R1 + ".constraints.hourAngleMinH");
    assertEquals("must be <= hourAngleMaxH 1 (as inherited on resource \"south\") (was 3); a range across +-12 h is "
        + "not expressible", p.message());
    assertEquals("3", p.value());
    assertEquals(1, ps.size(), "SAT7 is observed by north only, where no maximum holds: " + ps);
  }

  @Test
  void aResourcesReconfigurationFollowsTheTopLevelRules() {
    ObjectNode doc = network();
    resource(doc, 1).set("reconfiguration", tree("{\"labels\": [\"\", \"red\"], \"seconds\": [[0, 60], [45, 5]]}"));
    Problem p = at(problems(doc), SOUTH + ".reconfiguration.seconds[1][1]");
    assertEquals("must be 0: the same configuration needs no change", p.message());
    assertEquals("5", p.value());
  }

  @Test
  void everyLabelARequestMeetsMustBeInTheTableOfEachResourceAllowedToObserveIt() {
    ObjectNode doc = network();
    doc.set("reconfiguration", tree("{\"labels\": [\"\", \"blue\"], \"seconds\": [[0, 9], [9, 0]]}"));
    request(doc, 0).put("configuration", "blue");
    List<Problem> ps = problems(doc);
    // R1 may use north (the scenario's table has "blue") and south (its own table has not).
    Problem p = at(ps, R1 + ".configuration");
    assertEquals("not among " + SOUTH + ".reconfiguration.labels [, red]", p.message());
    assertEquals("blue", p.value());
    // R2 ("red") is observed by south only: the scenario's table, without "red", does not apply to it.
    assertEquals(1, ps.size(), ps.toString());
  }

  @Test
  void theStartConfigurationMustBeInEveryTableInUse() {
    ObjectNode doc = network();
    doc.put("startConfiguration", "blue");
    Problem p = at(problems(doc), "startConfiguration");
    assertEquals("not among " + SOUTH + ".reconfiguration.labels [, red]", p.message());
    assertEquals("blue", p.value());
  }

  @Test
  void aRequestsResourcesMustBeKnownAndListedOnce() {
    ObjectNode doc = network();
    request(doc, 0).set("resources", tree("[\"north\", \"nrth\", \"north\", 3]"));
    List<Problem> ps = problems(doc);
    Problem unknown = at(ps, R1 + ".resources[1]");
    assertEquals("no resource has this id (did you mean north?)", unknown.message());
    assertEquals("nrth", unknown.value());
    Problem twice = at(ps, R1 + ".resources[2]");
    assertEquals("resource listed twice", twice.message());
    assertEquals("north", twice.value());
    assertEquals("must be a string (was 3)", at(ps, R1 + ".resources[3]").message());
    assertEquals(3, ps.size(), ps.toString());
  }

  @Test
  void aRequestsResourcesMustNotBeEmpty() {
    ObjectNode doc = network();
    request(doc, 0).set("resources", tree("[]"));
    Problem p = at(problems(doc), R1 + ".resources");
    assertEquals("must list at least one resource id (omit the field to allow every resource)", p.message());
    assertEquals("[]", p.value());
  }

  @Test
  void aRequestsResourcesNeedAScenarioWithResources() {
    ObjectNode doc = base();
    request(doc, 0).set("resources", tree("[\"north\"]"));
    Problem p = at(problems(doc), R1 + ".resources");
    assertEquals("is only for a scenario with \"resources\" (A6); this one has one observer", p.message());
    assertEquals("[\"north\"]", p.value());
  }

  @Test
  void aRequestObservedByAResourceWithAnObserverNeedsATarget() {
    ObjectNode doc = network();
    request(doc, 0).remove("target");
    Problem p = at(problems(doc), R1 + ".target");
    assertEquals("is required when resource \"north\" (allowed to observe it) has an observer", p.message());
    assertNull(p.value());
  }

  @Test
  void aRequestObservedByAResourceWithoutObserverHasNoTarget() {
    ObjectNode doc = network();
    request(doc, 0).set("resources", tree("[\"north\", \"queue\"]"));
    List<Problem> ps = problems(doc);
    Problem p = at(ps, R1 + ".target");
    assertEquals("must be absent when resource \"queue\" (allowed to observe it) has no observer"
        + " (was {\"raDeg\":10.0,\"decDeg\":-20.0})", p.message());
    assertEquals("{\"raDeg\":10.0,\"decDeg\":-20.0}", p.value());
    assertEquals("is required when resource \"queue\" (allowed to observe it) has no observer",
        at(ps, R1 + ".windows").message());
  }

  @Test
  void aRequestWithoutResourcesMayBeObservedByEveryOne() {
    ObjectNode doc = network();
    request(doc, 3).remove("resources");
    // Q1 has windows and no target: right for queue, but north and south have observers.
    Problem p = at(problems(doc), "requests[3] (id \"Q1\").target");
    assertEquals("is required when resource \"north\" (allowed to observe it) has an observer", p.message());
    doc = network();
    request(doc, 0).remove("resources");
    // R1 has a target and no windows: right for north and south, not for queue.
    List<Problem> ps = problems(doc);
    assertEquals("is required when resource \"queue\" (allowed to observe it) has no observer",
        at(ps, R1 + ".windows").message());
    assertEquals("{\"raDeg\":10.0,\"decDeg\":-20.0}", at(ps, R1 + ".target").value());
  }

  @Test
  void aPointOnTheEarthNeedsEveryResourceAllowedToObserveItInOrbit() {
    ObjectNode doc = network();
    resource(doc, 1).set("observer", tree("{\"orbit\": {\"keplerian\": {\"epoch\": \"2031-05-04T18:00:00Z\","
        + " \"semiMajorAxisKm\": 7000, \"eccentricity\": 0.001, \"inclinationDeg\": 98, \"raanDeg\": 0,"
        + " \"argumentOfPerigeeDeg\": 0, \"meanAnomalyDeg\": 0}}}"));
    String earthPoint = "{\"latitudeDeg\":1,\"longitudeDeg\":2,\"altitudeM\":3}";
    request(doc, 0).set("target", tree(earthPoint));
    Problem p = at(problems(doc), R1 + ".target");
    assertEquals("a point on the Earth can only be observed from an orbit observer, and resource \"north\" (allowed "
        + "to observe it) is on the ground", p.message());
    assertEquals(earthPoint, p.value());
    request(doc, 0).set("resources", tree("[\"south\"]"));
    assertEquals(List.of("south"), read(doc).scenario().requests().get(0).resources(), "south alone is in orbit");
  }

  @Test
  void aNullResourcesFieldMeansOneObserver() {
    ObjectNode doc = base();
    doc.putNull("resources");
    assertEquals(List.of(), read(doc).scenario().resources());
  }
}
