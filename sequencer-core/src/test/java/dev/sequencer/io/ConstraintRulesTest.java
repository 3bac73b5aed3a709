package dev.sequencer.io;

import static dev.sequencer.io.Docs.at;
import static dev.sequencer.io.Docs.base;
import static dev.sequencer.io.Docs.problems;
import static dev.sequencer.io.Docs.read;
import static dev.sequencer.io.Docs.request;
import static dev.sequencer.io.Docs.tree;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.model.ConstraintField;
import dev.sequencer.model.ConstraintOverrides;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import java.util.EnumSet;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The A2 constraint fields and a request's own constraints: reading, ranges, ordering rules, writing. */
class ConstraintRulesTest {

  private static ObjectNode withConstraints(String json) {
    ObjectNode doc = base();
    doc.set("constraints", tree(json));
    return doc;
  }

  @Test
  void readsEveryA2Field() {
    Scenario s = read(withConstraints("""
        { "airmassMax": 2.0, "hourAngleMinH": -3, "hourAngleMaxH": 4.5, "moonElevationMaxDeg": 0,
          "moonIlluminationMax": 0.4, "sunElevationMinDeg": -6, "offNadirMaxDeg": 30 }""")).scenario();
    assertEquals(Constraints.builder().airmassMax(2).hourAngleMinH(-3).hourAngleMaxH(4.5).moonElevationMaxDeg(0)
        .moonIlluminationMax(0.4).sunElevationMinDeg(-6).offNadirMaxDeg(30).build(), s.constraints());
  }

  @Test
  void aRequestReplacesInheritsAndRemovesFieldByField() {
    ObjectNode doc = withConstraints("{ \"sunSeparationMinDeg\": 45, \"airmassMax\": 2.0, \"moonIlluminationMax\": 0.5 }");
    request(doc, 0).set("constraints", tree("{ \"airmassMax\": 1.5, \"moonIlluminationMax\": null }"));
    Scenario s = read(doc).scenario();
    Request r1 = s.requests().get(0);
    assertEquals(new ConstraintOverrides(Constraints.builder().airmassMax(1.5).build(),
        EnumSet.of(ConstraintField.MOON_ILLUMINATION_MAX)), r1.constraints());
    Constraints eff = s.constraintsFor(r1);
    assertEquals(1.5, eff.airmassMax()); // replaced
    assertEquals(45.0, eff.sunSeparationMinDeg()); // inherited
    assertNull(eff.moonIlluminationMax()); // removed by null
    // The other requests keep the scenario's constraints.
    assertEquals(s.constraints(), s.constraintsFor(s.requests().get(1)));
  }

  @Test
  void overriddenByChainsLevelsFromGeneralToSpecific() {
    // The A6 order (scenario, resource, request): each level replaces field by field.
    Constraints top = Constraints.builder().elevationMinDeg(20).airmassMax(2).build();
    ConstraintOverrides resource = ConstraintOverrides.setting(Constraints.builder().elevationMinDeg(30).build());
    ConstraintOverrides req = new ConstraintOverrides(Constraints.builder().offNadirMaxDeg(10).build(),
        EnumSet.of(ConstraintField.AIRMASS_MAX));
    assertEquals(Constraints.builder().elevationMinDeg(30).offNadirMaxDeg(10).build(),
        top.overriddenBy(resource).overriddenBy(req));
    assertEquals(top, top.overriddenBy(ConstraintOverrides.none()));
  }

  @Test
  void unknownFieldInARequestsConstraintsSuggestsTheName() {
    ObjectNode doc = base();
    request(doc, 1).set("constraints", tree("{ \"airmasMax\": 1.5 }"));
    assertEquals("requests[1] (id \"R2\").constraints.airmasMax: unknown field (did you mean airmassMax?)",
        at(problems(doc), "requests[1] (id \"R2\").constraints.airmasMax").toString());
  }

  @Test
  void rangesOfTheNewFields() {
    List<Problem> ps = problems(withConstraints("""
        { "airmassMax": 0.9, "hourAngleMinH": -13, "hourAngleMaxH": 12.5, "moonElevationMaxDeg": 95,
          "moonIlluminationMax": 1.2, "sunElevationMinDeg": -91, "offNadirMaxDeg": -1 }"""));
    assertEquals("must be >= 1 (was 0.9)", at(ps, "constraints.airmassMax").message());
    assertEquals("must be in [-12, 12] (was -13)", at(ps, "constraints.hourAngleMinH").message());
    assertEquals("must be in [-12, 12] (was 12.5)", at(ps, "constraints.hourAngleMaxH").message());
    assertEquals("must be in [-90, 90] (was 95)", at(ps, "constraints.moonElevationMaxDeg").message());
    assertEquals("must be in [0, 1] (was 1.2)", at(ps, "constraints.moonIlluminationMax").message());
    assertEquals("must be in [-90, 90] (was -91)", at(ps, "constraints.sunElevationMinDeg").message());
    assertEquals("must be in [0, 180] (was -1)", at(ps, "constraints.offNadirMaxDeg").message());
    assertEquals(7, ps.size());
  }

  @Test
  void rangesApplyToARequestsOwnFieldsToo() {
    ObjectNode doc = base();
    request(doc, 0).set("constraints", tree("{ \"moonIlluminationMax\": -0.1 }"));
    assertEquals("must be in [0, 1] (was -0.1)",
        at(problems(doc), "requests[0] (id \"R1\").constraints.moonIlluminationMax").message());
  }

  @Test
  void hourAngleMinAboveMaxIsRefusedAtTheScenarioLevel() {
    Problem p = at(problems(withConstraints("{ \"hourAngleMinH\": 3, \"hourAngleMaxH\": -3 }")),
        "constraints.hourAngleMaxH");
    assertEquals("must be >= hourAngleMinH 3 (was -3); a range across +-12 h is not expressible", p.message());
    assertEquals("-3", p.value());
  }

  @Test
  void equalHourAnglesAreAllowed() {
    // Spec: hourAngleMinH <= hourAngleMaxH (equality is allowed: a single hour angle).
    assertEquals(2.0, read(withConstraints("{ \"hourAngleMinH\": 2, \"hourAngleMaxH\": 2 }")).scenario()
        .constraints().hourAngleMinH());
  }

  @Test
  void aRequestsBoundIsCheckedAgainstTheInheritedOne() {
    ObjectNode doc = withConstraints("{ \"hourAngleMaxH\": 1 }");
    request(doc, 2).set("constraints", tree("{ \"hourAngleMinH\": 3 }"));
    Problem p = at(problems(doc), "requests[2] (id \"SAT7\").constraints.hourAngleMinH");
    assertEquals("must be <= hourAngleMaxH 1 (from the scenario's constraints) (was 3); a range across +-12 h is "
        + "not expressible", p.message());
    // Removing the inherited bound makes the same request valid.
    request(doc, 2).set("constraints", tree("{ \"hourAngleMinH\": 3, \"hourAngleMaxH\": null }"));
    Request r = read(doc).scenario().requests().get(2);
    assertNull(read(doc).scenario().constraintsFor(r).hourAngleMaxH());
  }

  @Test
  void aRequestsElevationMaxBelowTheInheritedMinIsRefused() {
    // Base scenario: elevationMinDeg 20, elevationMaxDeg 88.
    ObjectNode doc = base();
    request(doc, 0).set("constraints", tree("{ \"elevationMaxDeg\": 15 }"));
    assertEquals("must be greater than elevationMinDeg 20 (from the scenario's constraints) (was 15)",
        at(problems(doc), "requests[0] (id \"R1\").constraints.elevationMaxDeg").message());
  }

  @Test
  void aRequestsConstraintsMustBeAnObject() {
    ObjectNode doc = base();
    request(doc, 0).put("constraints", 3);
    assertEquals("must be an object (was 3)", at(problems(doc), "requests[0] (id \"R1\").constraints").message());
  }

  @Test
  void writerKeepsReplacedAndRemovedFields() {
    ObjectNode doc = withConstraints("{ \"airmassMax\": 2.0, \"offNadirMaxDeg\": 20 }");
    request(doc, 0).set("constraints", tree("{ \"airmassMax\": 1.3, \"offNadirMaxDeg\": null }"));
    Scenario s = read(doc).scenario();
    String json = ScenarioWriter.toJson(s);
    assertTrue(json.contains("\"offNadirMaxDeg\": null"), json);
    assertEquals(s, ScenarioReader.parse(json).scenario());
  }
}
