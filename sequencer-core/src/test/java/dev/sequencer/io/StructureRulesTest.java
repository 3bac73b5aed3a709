package dev.sequencer.io;

import static dev.sequencer.io.Docs.at;
import static dev.sequencer.io.Docs.base;
import static dev.sequencer.io.Docs.problems;
import static dev.sequencer.io.Docs.read;
import static dev.sequencer.io.Docs.request;
import static dev.sequencer.io.Docs.tree;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.model.Group;
import dev.sequencer.model.Reconfiguration;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.Visits;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Visits, groups and configurations (format additions A4, A5): what is read, and every rule with its path. */
class StructureRulesTest {
  private static final String R1 = "requests[0] (id \"R1\")";

  @Test
  void visitsGroupsAndConfigurationsAreReadAndWrittenBack() {
    ObjectNode doc = base();
    request(doc, 0).set("visits", tree("{\"count\": 3, \"minSeparationS\": 1800, \"maxSeparationS\": 10800,"
        + " \"onePerWindow\": true}"));
    request(doc, 1).put("configuration", "red-grism");
    doc.set("groups", tree("[{\"id\": \"G1\", \"members\": [\"R2\", \"R4\"], \"allOrNothing\": true,"
        + " \"ordered\": true, \"maxGapS\": 600}]"));
    doc.set("reconfiguration", tree("{\"labels\": [\"\", \"red-grism\"], \"seconds\": [[0, 90], [80, 0]],"
        + " \"concurrentWithSlew\": false}"));
    Scenario s = read(doc).scenario();
    assertEquals(new Visits(3, 1800, 10800.0, true, false), s.requests().get(0).visits());
    assertEquals("red-grism", s.requests().get(1).configuration());
    assertEquals(List.of(new Group("G1", List.of("R2", "R4"), true, true, 600.0, false)), s.groups());
    Reconfiguration re = s.reconfiguration();
    assertEquals(90, re.changeS("", "red-grism"));
    assertEquals(80, re.changeS("red-grism", ""));
    assertEquals(0, re.changeS("red-grism", "red-grism"));
    assertTrue(!re.concurrentWithSlew());
    assertEquals(s, ScenarioReader.parse(ScenarioWriter.toJson(s), "round trip").scenario(),
        "written and read back unchanged");
  }

  @Test
  void aConstantChangeTimeAndTheDefaults() {
    ObjectNode doc = base();
    doc.set("reconfiguration", tree("{\"seconds\": 120}"));
    Scenario s = read(doc).scenario();
    assertEquals(Reconfiguration.constant(120, true), s.reconfiguration(), "concurrent with the slew by default");
    assertEquals(Visits.ONCE, s.requests().get(0).visits());
    assertEquals("", s.requests().get(0).configuration());
    assertEquals("", s.startConfiguration());
  }

  @Test
  void badVisitsNameTheirPath() {
    ObjectNode doc = base();
    request(doc, 0).set("visits", tree("{\"count\": 0, \"minSeparationS\": -5, \"every\": 2}"));
    List<Problem> ps = problems(doc);
    assertTrue(at(ps, R1 + ".visits.count").message().contains("(was 0)"));
    assertTrue(at(ps, R1 + ".visits.minSeparationS").message().contains("(was -5)"));
    assertTrue(at(ps, R1 + ".visits.every").message().startsWith("unknown field"));
    doc = base();
    request(doc, 0).set("visits", tree("{\"count\": 2, \"minSeparationS\": 600, \"maxSeparationS\": 300}"));
    assertEquals("must be >= minSeparationS 600 (was 300)",
        at(problems(doc), R1 + ".visits.maxSeparationS").message());
  }

  @Test
  void groupsMustNameKnownRequestsOnceAndKeepOrderedMembersSingle() {
    ObjectNode doc = base();
    request(doc, 0).set("visits", tree("{\"count\": 2}"));
    doc.set("groups", tree("[{\"id\": \"G1\", \"members\": [\"R1\", \"R2\", \"R9\"], \"ordered\": true},"
        + " {\"id\": \"G2\", \"members\": [\"R2\", \"R4\"], \"maxGapS\": 60}]"));
    List<Problem> ps = problems(doc);
    assertTrue(at(ps, "groups[0] (id \"G1\").members[0]").message().startsWith("members of ordered groups have no visits"));
    assertTrue(at(ps, "groups[0] (id \"G1\").members[2]").message().startsWith("no request has this id"));
    assertEquals("request already belongs to group \"G1\" (a request belongs to at most one group)",
        at(ps, "groups[1] (id \"G2\").members[0]").message());
    assertEquals("is for ordered groups only; this group is not ordered", at(ps, "groups[1] (id \"G2\").maxGapS").message());
  }

  @Test
  void everyLabelMustBeInTheTable() {
    ObjectNode doc = base();
    request(doc, 1).put("configuration", "blue");
    doc.put("startConfiguration", "green");
    doc.set("reconfiguration", tree("{\"labels\": [\"\", \"red\"], \"seconds\": [[0, 9], [9, 0]]}"));
    List<Problem> ps = problems(doc);
    assertTrue(at(ps, "requests[1] (id \"R2\").configuration").message().startsWith("not among reconfiguration.labels"));
    assertEquals("green", at(ps, "startConfiguration").value());
    doc = base();
    doc.set("reconfiguration", tree("{\"labels\": [\"\", \"red\"], \"seconds\": [[0, 9], [9, 1]]}"));
    assertTrue(at(problems(doc), "reconfiguration.seconds[1][1]").message().startsWith("must be 0"));
  }
}
