package dev.sequencer.io;

import static dev.sequencer.io.Docs.at;
import static dev.sequencer.io.Docs.base;
import static dev.sequencer.io.Docs.noObserver;
import static dev.sequencer.io.Docs.problems;
import static dev.sequencer.io.Docs.read;
import static dev.sequencer.io.Docs.request;
import static dev.sequencer.io.Docs.tree;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.model.Constraints;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Refraction;
import dev.sequencer.model.OrbitingTarget;
import dev.sequencer.model.RaDec;
import dev.sequencer.model.Request;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.SolverSettings;
import dev.sequencer.model.TimeWindow;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ScenarioReaderTest {

  @Test
  void readsTheBaseScenario() {
    ScenarioReader.Result result = read(base());
    Scenario s = result.scenario();
    assertEquals(List.of(), result.warnings());
    assertEquals("example night", s.name());
    assertEquals(new TimeWindow(Instant.parse("2031-05-04T18:00:00Z"), Instant.parse("2031-05-05T06:00:00Z")),
        s.horizon());
    GroundSite site = assertInstanceOf(GroundSite.class, s.observer());
    assertEquals(28.7, site.latitudeDeg());
    assertEquals(2, site.horizonMask().size());
    assertEquals(new SlewSettings.Eigenaxis(1.0, 0.05, 20), s.slew());
    assertEquals(Constraints.builder().sunSeparationMinDeg(45).elevationMinDeg(20).elevationMaxDeg(88)
        .sunElevationMaxDeg(-12).build(), s.constraints());
    assertEquals(List.of("R1", "R2", "SAT7", "R4"), s.requests().stream().map(Request::id).toList());
    assertEquals(Request.of("R1", new RaDec(10, -20), 600, 5), s.requests().get(0));
    assertTrue(s.requests().get(1).required());
    assertInstanceOf(OrbitingTarget.class, s.requests().get(2).target());
    assertEquals(new SolverSettings(30, 2, 1), s.solver());
  }

  @Test
  void readsFromPathAndStream(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("s.json");
    Files.writeString(file, base().toString());
    assertEquals(read(base()).scenario(), ScenarioReader.read(file).scenario());
    assertEquals(read(base()).scenario(),
        ScenarioReader.read(new ByteArrayInputStream(base().toString().getBytes(StandardCharsets.UTF_8))).scenario());
  }

  @Test
  void problemsInAFileNameTheFile(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("bad.json");
    Files.writeString(file, "{\"format\": 2}");
    ScenarioException e = assertThrows(ScenarioException.class, () -> ScenarioReader.read(file));
    assertTrue(e.getMessage().startsWith(file + ": "), e.getMessage());
  }

  @Test
  void negativeDurationNamesRequestIndexAndId() {
    ObjectNode doc = base();
    request(doc, 3).put("durationS", -5);
    ScenarioException e = assertThrows(ScenarioException.class, () -> read(doc));
    assertEquals("requests[3] (id \"R4\").durationS", e.path());
    assertEquals("-5", e.value());
    assertEquals("scenario: 1 problem\nrequests[3] (id \"R4\").durationS: must be >= 0 (was -5)", e.getMessage());
  }

  @Test
  void zeroDurationIsAWaypoint() {
    ObjectNode doc = base();
    request(doc, 0).put("durationS", 0);
    assertEquals(0.0, read(doc).scenario().requests().get(0).durationS());
  }

  @Test
  void everyProblemIsReportedInFileOrderOnePerLine() {
    ObjectNode doc = base();
    doc.put("format", 2);
    request(doc, 0).put("priority", 0);
    request(doc, 1).put("durationS", "300");
    ScenarioException e = assertThrows(ScenarioException.class, () -> read(doc));
    assertEquals(List.of("format", "requests[0] (id \"R1\").priority", "requests[1] (id \"R2\").durationS"),
        e.problems().stream().map(Problem::path).toList());
    assertEquals(4, e.getMessage().split("\n").length);
    assertEquals("requests[1] (id \"R2\").durationS: must be a number (was \"300\")", e.getMessage().split("\n")[3]);
    assertEquals("300", e.problems().get(2).value());
  }

  @Test
  void malformedJsonGivesLineAndColumn() {
    Problem p = problems("{\n  \"format\": 1,\n  \"name\": }").get(0);
    assertEquals("name", p.path());
    assertTrue(p.message().startsWith("malformed JSON at line 3, column 11 of scenario: expected a value"), p.message());
  }

  @Test
  void duplicateKeysAndTrailingContentAreMalformed() {
    assertTrue(problems("{\"format\": 1, \"format\": 1}").get(0).message()
        .endsWith("the field \"format\" appears twice in the same object"));
    assertTrue(problems(base() + " {}").get(0).message().startsWith("malformed JSON"));
  }

  @Test
  void emptyInputAndNonObjectRoot() {
    assertEquals("empty input: expected a JSON object", problems("  ").get(0).message());
    assertEquals("the document must be a JSON object (was [1])", problems("[1]").get(0).message());
  }

  @Test
  void nanAndInfinityAreReportedNotParsedAway() {
    String json = base().toString()
        .replace("\"rateDegPerS\":1.0", "\"rateDegPerS\":NaN")
        .replace("\"durationS\":600", "\"durationS\":-Infinity");
    List<Problem> ps = problems(json);
    assertEquals("must be a finite number (was NaN)", at(ps, "slew.rateDegPerS").message());
    assertEquals("-Infinity", at(ps, "requests[0] (id \"R1\").durationS").value());
  }

  @Test
  void missingRequiredFieldsHaveNoValue() {
    ObjectNode doc = base();
    request(doc, 2).remove("priority");
    doc.remove("horizon");
    List<Problem> ps = problems(doc);
    assertEquals("is required", at(ps, "requests[2] (id \"SAT7\").priority").message());
    assertNull(at(ps, "horizon").value());
  }

  @Test
  void formatMustBeOne() {
    ObjectNode doc = base();
    doc.put("format", 1.0);
    assertEquals("must be a whole number (was 1.0)", at(problems(doc), "format").message());
    doc.put("format", 2);
    assertEquals("must be 1 (was 2)", at(problems(doc), "format").message());
  }

  @Test
  void horizonEndMustBeAfterStart() {
    ObjectNode doc = base();
    ((ObjectNode) doc.get("horizon")).put("end", "2031-05-04T17:00:00Z");
    Problem p = at(problems(doc), "horizon.end");
    assertEquals("end 2031-05-04T17:00:00Z is before start 2031-05-04T18:00:00Z", p.message());
    ((ObjectNode) doc.get("horizon")).put("end", "2031-05-04T18:00:00Z");
    assertTrue(at(problems(doc), "horizon.end").message().contains("positive length"));
  }

  @Test
  void instantsMustBeUtcWithZ() {
    ObjectNode doc = base();
    ((ObjectNode) doc.get("horizon")).put("start", "2031-05-04T18:00:00+01:00");
    ((ObjectNode) doc.get("horizon")).put("end", "tomorrow");
    List<Problem> ps = problems(doc);
    assertEquals("2031-05-04T18:00:00+01:00", at(ps, "horizon.start").value());
    assertEquals("tomorrow", at(ps, "horizon.end").value());
  }

  @Test
  void latitudeAndLongitudeRanges() {
    ObjectNode doc = base();
    ObjectNode ground = (ObjectNode) doc.get("observer").get("ground");
    ground.put("latitudeDeg", 95);
    ground.put("longitudeDeg", 360);
    List<Problem> ps = problems(doc);
    assertEquals("must be in [-90, 90] (was 95)", at(ps, "observer.ground.latitudeDeg").message());
    assertEquals("must be in [-180, 360) (was 360)", at(ps, "observer.ground.longitudeDeg").message());
    ground.put("latitudeDeg", -90);
    ground.put("longitudeDeg", -180);
    assertEquals(-180.0, ((GroundSite) read(doc).scenario().observer()).longitudeDeg());
  }

  @Test
  void altitudeInKilometresIsCaught() {
    ObjectNode doc = base();
    ((ObjectNode) doc.get("observer").get("ground")).put("altitudeM", 2_300_000);
    assertEquals("2300000", at(problems(doc), "observer.ground.altitudeM").value());
  }

  @Test
  void horizonMaskPairs() {
    ObjectNode doc = base();
    ((ObjectNode) doc.get("observer").get("ground")).set("horizonMask", tree("[[0, 10], [400, 5], [7]]"));
    List<Problem> ps = problems(doc);
    at(ps, "observer.ground.horizonMask[1][0]");
    at(ps, "observer.ground.horizonMask[2]");
  }

  @Test
  void refractionIsReadAndCheckedWithPaths() {
    // Format A1: observer.ground.refraction {pressureHPa, temperatureC}; both required, ranges from
    // Refraction's rules, an unknown field named with a suggestion.
    ObjectNode doc = base();
    ObjectNode ground = (ObjectNode) doc.get("observer").get("ground");
    ground.set("refraction", tree("{\"pressureHPa\": 780, \"temperatureC\": 5}"));
    GroundSite site = (GroundSite) read(doc).scenario().observer();
    assertEquals(new Refraction(780, 5), site.refraction());
    ground.set("refraction", tree("{\"pressureHPa\": -3, \"temperatureK\": 280}"));
    List<Problem> ps = problems(doc);
    assertEquals("must be in [0, 1200] (was -3)", at(ps, "observer.ground.refraction.pressureHPa").message());
    assertEquals("-3", at(ps, "observer.ground.refraction.pressureHPa").value());
    at(ps, "observer.ground.refraction.temperatureK");
    at(ps, "observer.ground.refraction.temperatureC");
    ground.set("refraction", tree("{\"pressureHPa\": 780, \"temperatureC\": 75}"));
    assertEquals("must be in [-90, 60] (was 75)", at(problems(doc), "observer.ground.refraction.temperatureC").message());
    ground.set("refraction", tree("[780, 5]"));
    at(problems(doc), "observer.ground.refraction");
  }

  @Test
  void observerNeedsExactlyOneKind() {
    ObjectNode doc = base();
    ((ObjectNode) doc.get("observer")).set("orbit", tree("{\"tle\": []}"));
    assertEquals("must have exactly one of \"ground\" or \"orbit\"", at(problems(doc), "observer").message());
  }

  @Test
  void idsMustBeUniqueAndNonEmpty() {
    ObjectNode doc = base();
    request(doc, 3).put("id", "R1");
    request(doc, 1).put("id", "");
    List<Problem> ps = problems(doc);
    Problem dup = at(ps, "requests[3] (id \"R1\").id");
    assertEquals("duplicate id, already used by requests[0]", dup.message());
    assertEquals("R1", dup.value());
    at(ps, "requests[1] (id \"\").id");
  }

  @Test
  void requestWithoutStringIdIsNamedByIndexOnly() {
    ObjectNode doc = base();
    request(doc, 2).put("id", 7);
    assertEquals("must be a string (was 7)", at(problems(doc), "requests[2].id").message());
  }

  @Test
  void atLeastOneRequest() {
    ObjectNode doc = base();
    doc.set("requests", tree("[]"));
    doc.set("slew", tree("{\"model\": \"fixed\", \"seconds\": 0}"));
    assertEquals("must list at least one request", at(problems(doc), "requests").message());
  }

  @Test
  void priorityMustBePositive() {
    ObjectNode doc = base();
    request(doc, 1).put("priority", 0);
    Problem p = at(problems(doc), "requests[1] (id \"R2\").priority");
    assertEquals("must be > 0 (was 0)", p.message());
    assertEquals("0", p.value());
  }

  @Test
  void unknownFieldsSuggestTheClosestName() {
    ObjectNode doc = base();
    ((ObjectNode) doc.get("constraints")).put("sunSeperationMinDeg", 45);
    request(doc, 0).put("priorty", 1);
    doc.put("colour", "red");
    List<Problem> ps = problems(doc);
    assertEquals("constraints.sunSeperationMinDeg: unknown field (did you mean sunSeparationMinDeg?)",
        at(ps, "constraints.sunSeperationMinDeg").toString());
    assertEquals("unknown field (did you mean priority?)", at(ps, "requests[0] (id \"R1\").priorty").message());
    assertEquals("unknown field", at(ps, "colour").message());
  }

  @Test
  void windowsMustBeOrderedApartAndPositive() {
    ObjectNode doc = base();
    request(doc, 3).set("windows", tree("""
        [["2031-05-04T20:00:00Z", "2031-05-04T19:00:00Z"],
         ["2031-05-04T21:00:00Z", "2031-05-04T21:00:00Z"],
         ["2031-05-04T22:00:00Z", "2031-05-04T23:00:00Z"],
         ["2031-05-04T23:00:00Z", "2031-05-05T01:00:00Z"],
         ["2031-05-05T00:30:00Z", "2031-05-05T02:00:00Z"]]"""));
    List<Problem> ps = problems(doc);
    String w = "requests[3] (id \"R4\").windows";
    assertEquals("end 2031-05-04T19:00:00Z is before start 2031-05-04T20:00:00Z", at(ps, w + "[0]").message());
    assertTrue(at(ps, w + "[1]").message().startsWith("end equals start"));
    assertTrue(at(ps, w + "[3]").message().startsWith("starts at 2031-05-04T23:00:00Z, not after"), "touching");
    assertTrue(at(ps, w + "[4]").message().startsWith("starts at 2031-05-05T00:30:00Z, not after"), "overlap");
    assertEquals(4, ps.size());
  }

  @Test
  void windowPartlyOutsideTheHorizonIsClippedWithAWarning() {
    ObjectNode doc = base();
    request(doc, 3).set("windows", tree("""
        [["2031-05-04T17:00:00Z", "2031-05-04T19:00:00Z"], ["2031-05-05T05:00:00Z", "2031-05-05T07:00:00Z"]]"""));
    ScenarioReader.Result r = read(doc);
    assertEquals(List.of(
            new TimeWindow(Instant.parse("2031-05-04T18:00:00Z"), Instant.parse("2031-05-04T19:00:00Z")),
            new TimeWindow(Instant.parse("2031-05-05T05:00:00Z"), Instant.parse("2031-05-05T06:00:00Z"))),
        r.scenario().requests().get(3).windows());
    assertEquals(List.of(
        "requests[3] (id \"R4\").windows[0]: clipped to the horizon: [2031-05-04T17:00:00Z, 2031-05-04T19:00:00Z]"
            + " became [2031-05-04T18:00:00Z, 2031-05-04T19:00:00Z]",
        "requests[3] (id \"R4\").windows[1]: clipped to the horizon: [2031-05-05T05:00:00Z, 2031-05-05T07:00:00Z]"
            + " became [2031-05-05T05:00:00Z, 2031-05-05T06:00:00Z]"), r.warnings());
  }

  @Test
  void windowEntirelyOutsideTheHorizonIsAnError() {
    ObjectNode doc = base();
    // ends exactly at the horizon start: the overlap is a single instant, so nothing is left
    request(doc, 3).set("windows", tree("[[\"2031-05-04T10:00:00Z\", \"2031-05-04T18:00:00Z\"]]"));
    assertEquals("lies entirely outside the horizon [2031-05-04T18:00:00Z, 2031-05-05T06:00:00Z]",
        at(problems(doc), "requests[3] (id \"R4\").windows[0]").message());
  }

  @Test
  void emptyWindowListIsAnError() {
    ObjectNode doc = base();
    request(doc, 0).set("windows", tree("[]"));
    at(problems(doc), "requests[0] (id \"R1\").windows");
  }

  @Test
  void slewParametersMustBePositive() {
    ObjectNode doc = base();
    ObjectNode slew = (ObjectNode) doc.get("slew");
    slew.put("rateDegPerS", 0);
    slew.put("accelDegPerS2", -1);
    slew.put("settleS", -0.5);
    List<Problem> ps = problems(doc);
    assertEquals("must be > 0 (was 0)", at(ps, "slew.rateDegPerS").message());
    at(ps, "slew.accelDegPerS2");
    assertEquals("must be >= 0 (was -0.5)", at(ps, "slew.settleS").message());
  }

  @Test
  void slewModelMustBeKnown() {
    ObjectNode doc = base();
    ((ObjectNode) doc.get("slew")).put("model", "eigenaxes");
    assertEquals("must be one of eigenaxis, altaz, fixed, matrix (did you mean eigenaxis?) (was \"eigenaxes\")",
        at(problems(doc), "slew.model").message());
  }

  @Test
  void fixedSecondsNonNegative() {
    ObjectNode doc = base();
    doc.set("slew", tree("{\"model\": \"fixed\", \"seconds\": -1}"));
    at(problems(doc), "slew.seconds");
    doc.set("slew", tree("{\"model\": \"fixed\", \"seconds\": 0}"));
    assertEquals(new SlewSettings.Fixed(0), read(doc).scenario().slew());
  }

  @Test
  void matrixIsSquareAndSizedToTheRequests() {
    ObjectNode doc = base();
    doc.set("slew", tree("""
        {"model": "matrix", "seconds": [[0, 1, 2, 3], [1, 0, 2], [1, 2, 0, -4]], "fromStartSeconds": [1, 2]}"""));
    List<Problem> ps = problems(doc);
    assertEquals("slew.seconds: 3 rows, but the scenario has 4 requests", at(ps, "slew.seconds").toString());
    assertEquals("3 columns, but the scenario has 4 requests", at(ps, "slew.seconds[1]").message());
    assertEquals("must be >= 0 (was -4)", at(ps, "slew.seconds[2][3]").message());
    assertEquals("2 entries, but the scenario has 4 requests", at(ps, "slew.fromStartSeconds").message());
  }

  @Test
  void altazRangeMustCoverAFullTurn() {
    ObjectNode doc = base();
    doc.set("slew", tree("""
        {"model": "altaz", "azimuthRateDegPerS": 3, "elevationRateDegPerS": 2, "azimuthAccelDegPerS2": 1,
         "elevationAccelDegPerS2": 1, "settleS": 10, "azimuthRangeDeg": [-100, 200]}"""));
    assertEquals("must span at least 360 deg so every azimuth is reachable (spans 300 deg)",
        at(problems(doc), "slew.azimuthRangeDeg").message());
    ((ObjectNode) doc.get("slew")).set("azimuthRangeDeg", tree("[270, -270]"));
    at(problems(doc), "slew.azimuthRangeDeg");
    ((ObjectNode) doc.get("slew")).set("azimuthRangeDeg", tree("[-270, 270]"));
    assertEquals(List.of(-270.0, 270.0), ((SlewSettings.AltAz) read(doc).scenario().slew()).azimuthRangeDeg());
  }

  @Test
  void altazNeedsAGroundObserver() {
    ObjectNode doc = base();
    List<String> tle = TestTles.tle(90001, Docs.HORIZON_START);
    doc.set("observer", tree("{\"orbit\": {\"tle\": [\"" + tle.get(0) + "\", \"" + tle.get(1) + "\"]}}"));
    doc.set("slew", tree("""
        {"model": "altaz", "azimuthRateDegPerS": 3, "elevationRateDegPerS": 2, "azimuthAccelDegPerS2": 1,
         "elevationAccelDegPerS2": 1, "settleS": 10}"""));
    assertEquals("is a ground mount and needs a ground observer (was \"altaz\")",
        at(problems(doc), "slew.model").message());
  }

  @Test
  void constraintRanges() {
    ObjectNode doc = base();
    ObjectNode c = (ObjectNode) doc.get("constraints");
    c.put("sunSeparationMinDeg", 181);
    c.put("moonSeparationMinDeg", -1);
    c.put("elevationMinDeg", 50);
    c.put("elevationMaxDeg", 40);
    c.put("sunElevationMaxDeg", -91);
    c.put("targetSunlitRequired", "yes");
    List<Problem> ps = problems(doc);
    assertEquals("must be in [0, 180] (was 181)", at(ps, "constraints.sunSeparationMinDeg").message());
    at(ps, "constraints.moonSeparationMinDeg");
    assertEquals("must be greater than elevationMinDeg 50 (was 40)", at(ps, "constraints.elevationMaxDeg").message());
    at(ps, "constraints.sunElevationMaxDeg");
    at(ps, "constraints.targetSunlitRequired");
    assertEquals(5, ps.size());
  }

  @Test
  void earthPointNeedsAnOrbitObserver() {
    ObjectNode doc = base();
    request(doc, 0).set("target", tree("{\"latitudeDeg\": 1, \"longitudeDeg\": 2, \"altitudeM\": 0}"));
    assertTrue(at(problems(doc), "requests[0] (id \"R1\").target").message().contains("orbit observer"));
  }

  @Test
  void targetKindMustBeRecognisable() {
    ObjectNode doc = base();
    request(doc, 0).set("target", tree("{\"ra\": 1, \"dec\": 2}"));
    at(problems(doc), "requests[0] (id \"R1\").target");
    request(doc, 0).set("target", tree("{\"raDeg\": 360, \"decDeg\": -91}"));
    List<Problem> ps = problems(doc);
    assertEquals("must be in [0, 360) (was 360)", at(ps, "requests[0] (id \"R1\").target.raDeg").message());
    at(ps, "requests[0] (id \"R1\").target.decDeg");
  }

  @Test
  void withoutObserverRequestsNeedWindowsAndNoTarget() {
    ScenarioReader.Result ok = read(noObserver());
    assertNull(ok.scenario().observer());
    ObjectNode doc = noObserver();
    request(doc, 0).remove("windows");
    request(doc, 1).set("target", tree("{\"raDeg\": 1, \"decDeg\": 2}"));
    List<Problem> ps = problems(doc);
    assertEquals("is required when the scenario has no observer", at(ps, "requests[0] (id \"R1\").windows").message());
    assertTrue(at(ps, "requests[1] (id \"R2\").target").message().startsWith("must be absent"));
  }

  @Test
  void withoutObserverTheSlewModelMustBeMatrixOrFixed() {
    ObjectNode doc = noObserver();
    doc.set("slew", tree("{\"model\": \"eigenaxis\", \"rateDegPerS\": 1, \"accelDegPerS2\": 1, \"settleS\": 0}"));
    assertEquals("needs an observer; without one use \"matrix\" or \"fixed\" (was \"eigenaxis\")",
        at(problems(doc), "slew.model").message());
  }

  @Test
  void startPointingRanges() {
    ObjectNode doc = base();
    doc.set("startPointing", tree("{\"azimuthDeg\": 360, \"elevationDeg\": 91}"));
    List<Problem> ps = problems(doc);
    at(ps, "startPointing.azimuthDeg");
    at(ps, "startPointing.elevationDeg");
    doc.set("startPointing", tree("{\"azimuthDeg\": 90, \"elevationDeg\": 45}"));
    read(doc);
  }

  @Test
  void azElStartPointingNeedsAGroundObserver() {
    ObjectNode doc = noObserver();
    doc.set("startPointing", tree("{\"azimuthDeg\": 90, \"elevationDeg\": 45}"));
    assertEquals("an azimuth/elevation pointing needs a ground observer", at(problems(doc), "startPointing").message());
  }

  @Test
  void solverSettings() {
    ObjectNode doc = base();
    doc.set("solver", tree("{\"timeLimitS\": 0, \"workers\": -1, \"seed\": 1.5}"));
    List<Problem> ps = problems(doc);
    assertEquals("must be > 0 (was 0)", at(ps, "solver.timeLimitS").message());
    assertEquals("must be >= 0 (was -1)", at(ps, "solver.workers").message());
    assertEquals("must be a whole number (was 1.5)", at(ps, "solver.seed").message());
    doc.set("solver", tree("{\"seed\": -7}"));
    assertEquals(SolverSettings.defaults().withSeed(-7), read(doc).scenario().solver());
    doc.set("solver", tree("{\"seed\": 3000000000}"));
    at(problems(doc), "solver.seed");
  }

  @Test
  void jsonNullCountsAsAbsent() {
    ObjectNode doc = base();
    doc.putNull("name");
    doc.putNull("solver");
    Scenario s = read(doc).scenario();
    assertNull(s.name());
    assertNull(s.solver());
    request(doc, 0).putNull("priority");
    assertEquals("is required", at(problems(doc), "requests[0] (id \"R1\").priority").message());
  }
}
