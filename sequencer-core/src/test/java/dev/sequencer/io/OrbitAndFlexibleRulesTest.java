package dev.sequencer.io;

import static dev.sequencer.io.Docs.at;
import static dev.sequencer.io.Docs.base;
import static dev.sequencer.io.Docs.problems;
import static dev.sequencer.io.Docs.read;
import static dev.sequencer.io.Docs.request;
import static dev.sequencer.io.Docs.requests;
import static dev.sequencer.io.Docs.tree;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.model.FlexibleExposure;
import dev.sequencer.model.UtilityPoint;
import java.util.List;
import org.junit.jupiter.api.Test;

/** TLE, Keplerian and flexible-exposure rules. */
class OrbitAndFlexibleRulesTest {
  private static final String SAT7 = "requests[2] (id \"SAT7\").target.tle";

  private static ArrayNode sat7Lines(ObjectNode doc) {
    return (ArrayNode) request(doc, 2).get("target").get("tle");
  }

  @Test
  void badChecksumNamesTheLineAndBothDigits() {
    ObjectNode doc = base();
    String line = sat7Lines(doc).get(1).textValue();
    int computed = line.charAt(68) - '0'; // TestTles wrote the correct digit
    int written = (computed + 8) % 10;
    sat7Lines(doc).set(1, line.substring(0, 68) + written);
    Problem p = at(problems(doc), SAT7 + "[1]");
    assertEquals(SAT7 + "[1]: checksum digit is " + written + ", computed " + computed, p.toString());
    assertEquals(line.substring(0, 68) + written, p.value());
  }

  @Test
  void checksumCountsMinusSignsAsOne() {
    // "1 " + 66 spaces + "-" -> digits 1, minus 1: checksum 2
    String line = "1" + " ".repeat(66) + "-";
    assertEquals(2, TleCheck.checksum(line + "0"));
  }

  @Test
  void linesMustHave69ColumnsAndTheirNumbers() {
    ObjectNode doc = base();
    String l1 = sat7Lines(doc).get(0).textValue();
    String l2 = sat7Lines(doc).get(1).textValue();
    sat7Lines(doc).set(0, l2);
    sat7Lines(doc).set(1, l1.substring(0, 60));
    List<Problem> ps = problems(doc);
    assertTrue(at(ps, SAT7 + "[0]").message().startsWith("must start with the line number 1"));
    assertEquals("must be 69 characters long (was 60)", at(ps, SAT7 + "[1]").message());
  }

  @Test
  void satelliteNumbersMustMatch() {
    ObjectNode doc = base();
    String other = TestTles.tle(90008, Docs.HORIZON_START).get(1);
    sat7Lines(doc).set(1, other);
    assertEquals("satellite number \"90008\" differs from line 1's \"90007\"", at(problems(doc), SAT7 + "[1]").message());
  }

  @Test
  void aLetterOTypedForAZeroNamesTheFieldAtInputTime() {
    // Issue 15: "2O0.1234" for "200.1234" keeps the checksum ('O' counts 0 like '0') and used to fail
    // later inside Orekit (NumberFormatException, exit 3).
    ObjectNode doc = base();
    String line = sat7Lines(doc).get(1).textValue();
    assertEquals("200.1234", line.substring(43, 51)); // TestTles: mean anomaly 200.1234, columns 44-51
    String typo = line.substring(0, 44) + "O" + line.substring(45);
    assertEquals(TleCheck.checksum(line), TleCheck.checksum(typo));
    sat7Lines(doc).set(1, typo);
    assertEquals("mean anomaly (columns 44-51) must look like \"200.1234\" (was \"2O0.1234\"); is the letter O "
        + "written for the digit 0?", at(problems(doc), SAT7 + "[1]").message());
  }

  @Test
  void outOfRangeOrbitalElementsOfATleAreRefused() {
    assertEquals("inclination (columns 9-16) must be in [0, 180] (was 197.5000)",
        tleProblem(197.5, 123.4567, 12345, 14.12345678));
    assertEquals("right ascension of the ascending node (columns 18-25) must be in [0, 360) (was 400.0000)",
        tleProblem(98.0, 400.0, 12345, 14.12345678));
    assertEquals("mean motion (revolutions per day) (columns 53-63) must be > 0 (was 0.00000000)",
        tleProblem(98.0, 123.4567, 12345, 0.0));
    // 17.5 rev/day: a = (398600.8 / n^2)^(1/3) = 6267.2 km (Kepler's third law, SGP4's WGS-72 mu), perigee
    // a (1 - e) = 6259.5 km, below the surface.
    assertTrue(tleProblem(98.0, 123.4567, 12345, 17.5).startsWith("mean motion 17.50000000 rev/day and eccentricity "
        + "0.0012345 put the perigee at 6259 km from the Earth's centre, inside the Earth"));
  }

  @Test
  void aSeparatorColumnMustBeASpace() {
    ObjectNode doc = base();
    String line = sat7Lines(doc).get(1).textValue();
    sat7Lines(doc).set(1, line.substring(0, 16) + "0" + line.substring(17, 68)
        + TleCheck.checksum(line.substring(0, 16) + "0" + line.substring(17)));
    assertEquals("column 17 must be a space (was '0')", at(problems(doc), SAT7 + "[1]").message());
  }

  @Test
  void tlesWrittenByOrekitPassTheFieldChecks() {
    // Orekit's own writer (TLE.getLine1/2) is the reference layout: its lines must pass every check.
    org.orekit.time.TimeScale utc = dev.sequencer.astro.AstroContext.offline().utc();
    for (double inc : new double[] {0, 51.6, 98.7, 180}) {
      org.orekit.propagation.analytical.tle.TLE t = new org.orekit.propagation.analytical.tle.TLE(90100, 'U', 2031,
          5, "B", 0, 42, new org.orekit.time.AbsoluteDate(2031, 5, 4, 6, 0, 0.0, utc), 15.5 * 2 * Math.PI / 86400,
          1e-12, 0, 0.0007, Math.toRadians(inc), Math.toRadians(359.9), Math.toRadians(12), Math.toRadians(0.5), 7,
          3.1e-5, utc);
      ObjectNode doc = base();
      request(doc, 2).set("target", tree("{\"tle\": [\"" + t.getLine1() + "\", \"" + t.getLine2() + "\"]}"));
      read(doc);
    }
  }

  private static String tleProblem(double incl, double raan, int ecc7, double meanMotion) {
    ObjectNode doc = base();
    List<String> t = TestTles.tle(90007, Docs.HORIZON_START.minusSeconds(86_400), incl, raan, ecc7, 45.6789, 200.1234,
        meanMotion);
    request(doc, 2).set("target", tree("{\"tle\": [\"" + t.get(0) + "\", \"" + t.get(1) + "\"]}"));
    return at(problems(doc), SAT7 + "[1]").message();
  }

  @Test
  void tleMustBeTwoStrings() {
    ObjectNode doc = base();
    request(doc, 2).set("target", tree("{\"tle\": [\"1 x\"]}"));
    at(problems(doc), SAT7);
  }

  @Test
  void epochDecadesAwayIsAnError() {
    ObjectNode doc = base();
    // 2020-01-01 to 2031-01-01: 11 * 365 + 3 leap days = 4018 d; to 2031-05-04T18:00Z: + 123.75 d = 4141.75 d
    List<String> old = TestTles.tle(90007, java.time.Instant.parse("2020-01-01T00:00:00Z"));
    request(doc, 2).set("target", tree("{\"tle\": [\"" + old.get(0) + "\", \"" + old.get(1) + "\"]}"));
    assertEquals("epoch 2020-01-01T00:00:00Z is 4141.8 days before the horizon start; more than 3650 days is"
        + " surely the wrong TLE", at(problems(doc), SAT7 + "[0]").message());
  }

  @Test
  void epochAMonthAwayIsAWarning() {
    ObjectNode doc = base();
    // horizon ends 2031-05-05T06:00Z; to 2031-06-14T00:00Z is 25.75 + 14 = 39.75 days
    List<String> late = TestTles.tle(90007, java.time.Instant.parse("2031-06-14T00:00:00Z"));
    request(doc, 2).set("target", tree("{\"tle\": [\"" + late.get(0) + "\", \"" + late.get(1) + "\"]}"));
    assertEquals(List.of(SAT7 + "[0]: epoch 2031-06-14T00:00:00Z is 39.8 days after the horizon end; SGP4"
        + " predictions this far from the epoch are poor"), read(doc).warnings());
  }

  @Test
  void epochParsesTwoDigitYearsAndFractionalDays() {
    // day 124.75 of 2031 = 4 May 18:00 UTC (1 Jan is day 1)
    String l1 = TestTles.tle(90001, java.time.Instant.parse("2031-05-04T18:00:00Z")).get(0);
    assertEquals("31124.75000000", l1.substring(18, 32));
    assertEquals(java.time.Instant.parse("2031-05-04T18:00:00Z"), TleCheck.epoch(l1));
    String l1957 = l1.substring(0, 18) + "57" + l1.substring(20);
    assertEquals(1957, TleCheck.epoch(l1957).atZone(java.time.ZoneOffset.UTC).getYear());
  }

  private static ObjectNode keplerDoc(String elements) {
    ObjectNode doc = base();
    doc.set("observer", tree("{\"orbit\": {\"keplerian\": " + elements + "}}"));
    return doc;
  }

  @Test
  void keplerianElementsInRange() {
    read(keplerDoc("""
        {"epoch": "2031-05-04T00:00:00Z", "semiMajorAxisKm": 7000, "eccentricity": 0.001, "inclinationDeg": 98,
         "raanDeg": 0, "argumentOfPerigeeDeg": 0, "meanAnomalyDeg": 0}"""));
    List<Problem> ps = problems(keplerDoc("""
        {"epoch": "2031-05-04T00:00:00Z", "semiMajorAxisKm": 6000, "eccentricity": 1, "inclinationDeg": 181,
         "raanDeg": NaN, "argumentOfPerigeeDeg": 0}""".replace("NaN", "\"x\"")));
    String k = "observer.orbit.keplerian";
    assertEquals("must be > 6378.137 (was 6000)", at(ps, k + ".semiMajorAxisKm").message());
    assertEquals("must be in [0, 1) (was 1)", at(ps, k + ".eccentricity").message());
    at(ps, k + ".inclinationDeg");
    at(ps, k + ".raanDeg");
    assertEquals("is required", at(ps, k + ".meanAnomalyDeg").message());
  }

  @Test
  void keplerianPerigeeInsideTheEarth() {
    // a (1 - e) = 7000 * 0.1 = 700 km < 6378.137 km
    List<Problem> ps = problems(keplerDoc("""
        {"epoch": "2031-05-04T00:00:00Z", "semiMajorAxisKm": 7000, "eccentricity": 0.9, "inclinationDeg": 98,
         "raanDeg": 0, "argumentOfPerigeeDeg": 0, "meanAnomalyDeg": 0}"""));
    assertTrue(at(ps, "observer.orbit.keplerian.eccentricity").message().startsWith("perigee radius 700.000 km"));
  }

  @Test
  void keplerianEpochFarFromTheHorizon() {
    // Same distance rules as a TLE's epoch: a warning beyond 30 days, an error beyond 3650.
    // 2031-03-01 to the horizon start 2031-05-04T18:00Z: 30 + 31 + 3.75 = 64.75 days.
    ObjectNode doc = keplerDoc("""
        {"epoch": "2031-03-01T00:00:00Z", "semiMajorAxisKm": 7000, "eccentricity": 0.001, "inclinationDeg": 98,
         "raanDeg": 0, "argumentOfPerigeeDeg": 0, "meanAnomalyDeg": 0}""");
    doc.remove("startPointing");
    requests(doc).remove(2); // SAT7, a TLE target, is not needed here
    assertEquals(List.of("observer.orbit.keplerian.epoch: epoch 2031-03-01T00:00:00Z is 64.8 days before the horizon "
        + "start; the motion is integrated from it (two-body + J2, no drag), slower and further from the real orbit"),
        read(doc).warnings());
    ((ObjectNode) doc.get("observer").get("orbit").get("keplerian")).put("epoch", "2020-01-01T00:00:00Z");
    assertEquals("epoch 2020-01-01T00:00:00Z is 4141.8 days before the horizon start; more than 3650 days is"
        + " surely the wrong elements", at(problems(doc), "observer.orbit.keplerian.epoch").message());
  }

  @Test
  void orbitObserverAllowsEarthPointsAndTleTargets() {
    ObjectNode doc = keplerDoc("""
        {"epoch": "2031-05-04T00:00:00Z", "semiMajorAxisKm": 7000, "eccentricity": 0.001, "inclinationDeg": 98,
         "raanDeg": 0, "argumentOfPerigeeDeg": 0, "meanAnomalyDeg": 0}""");
    doc.remove("startPointing");
    request(doc, 0).set("target", tree("{\"latitudeDeg\": 1, \"longitudeDeg\": 359.5, \"altitudeM\": 0}"));
    read(doc);
  }

  private static ObjectNode flexibleDoc(String fields) {
    ObjectNode doc = base();
    ObjectNode r = (ObjectNode) tree("{\"id\": \"R9\", \"target\": {\"raDeg\": 1, \"decDeg\": 2}, " + fields + "}");
    doc.withArray("/requests").set(0, r);
    return doc;
  }

  @Test
  void flexibleRequestReadsWithDefaultStep() {
    ObjectNode doc = flexibleDoc("""
        "minDurationS": 300, "maxDurationS": 3600, "utility": [[300, 1.0], [900, 2.2], [3600, 3.4]]""");
    FlexibleExposure f = read(doc).scenario().requests().get(0).flexible();
    assertEquals(new FlexibleExposure(300, 3600, 60,
        List.of(new UtilityPoint(300, 1.0), new UtilityPoint(900, 2.2), new UtilityPoint(3600, 3.4))), f);
  }

  @Test
  void flexibleRequestMustNotGivePriorityOrDuration() {
    ObjectNode doc = flexibleDoc("""
        "minDurationS": 300, "maxDurationS": 600, "utility": [[300, 1], [600, 2]], "priority": 5, "durationS": 1""");
    List<Problem> ps = problems(doc);
    assertTrue(at(ps, "requests[0] (id \"R9\").priority").message().startsWith("must be absent for a flexible"));
    at(ps, "requests[0] (id \"R9\").durationS");
  }

  @Test
  void flexibleLimitsAndStep() {
    ObjectNode doc = flexibleDoc("""
        "minDurationS": 600, "maxDurationS": 300, "durationStepS": 0, "utility": [[600, 1]]""");
    List<Problem> ps = problems(doc);
    assertEquals("must be >= minDurationS 600 (was 300)", at(ps, "requests[0] (id \"R9\").maxDurationS").message());
    assertEquals("must be > 0 (was 0)", at(ps, "requests[0] (id \"R9\").durationStepS").message());
  }

  @Test
  void utilityCurveRules() {
    String u = "requests[0] (id \"R9\").utility";
    List<Problem> ps = problems(flexibleDoc("""
        "minDurationS": 300, "maxDurationS": 900, "utility": [[200, 1], [900, 2], [800, 3]]"""));
    assertEquals("seconds must increase: 800 is not after 900", at(ps, u + "[2][0]").message());
    ps = problems(flexibleDoc("""
        "minDurationS": 300, "maxDurationS": 900, "utility": [[200, 1], [800, -2]]"""));
    assertEquals("must be >= 0 (was -2)", at(ps, u + "[1][1]").message());
    ps = problems(flexibleDoc("""
        "minDurationS": 300, "maxDurationS": 900, "utility": [[200, 1], [800, 2]]"""));
    assertEquals("the first point must be at minDurationS 300 (was 200)", at(ps, u + "[0][0]").message());
    assertEquals("the last point must be at maxDurationS 900 (was 800)", at(ps, u + "[1][0]").message());
    ps = problems(flexibleDoc("\"minDurationS\": 300, \"maxDurationS\": 900, \"utility\": []"));
    at(ps, u);
  }
}
