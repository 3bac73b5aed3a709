package dev.sequencer.io;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.fail;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.time.Instant;
import java.util.List;

/** Test helpers: a valid base scenario as a mutable JSON tree, and ways to read it and find problems. */
final class Docs {
  static final ObjectMapper MAPPER = new ObjectMapper();
  static final Instant HORIZON_START = Instant.parse("2031-05-04T18:00:00Z");

  private Docs() {}

  /**
   * A valid scenario (invented): a ground site, eigenaxis slews, four requests R1, R2, SAT7 (a TLE
   * target, satellite 90007) and R4, the last with one window.
   */
  static ObjectNode base() {
    List<String> tle = TestTles.tle(90007, HORIZON_START.minusSeconds(86_400));
    String json = """
        {
          "format": 1,
          "name": "example night",
          "horizon": { "start": "2031-05-04T18:00:00Z", "end": "2031-05-05T06:00:00Z" },
          "observer": { "ground": { "latitudeDeg": 28.7, "longitudeDeg": -17.9, "altitudeM": 2300,
                                    "horizonMask": [[0, 10], [180, 15]] } },
          "constraints": { "sunSeparationMinDeg": 45, "elevationMinDeg": 20, "elevationMaxDeg": 88,
                           "sunElevationMaxDeg": -12 },
          "slew": { "model": "eigenaxis", "rateDegPerS": 1.0, "accelDegPerS2": 0.05, "settleS": 20 },
          "startPointing": { "raDeg": 0, "decDeg": 0 },
          "requests": [
            { "id": "R1", "target": { "raDeg": 10.0, "decDeg": -20.0 }, "durationS": 600, "priority": 5 },
            { "id": "R2", "target": { "raDeg": 150.0, "decDeg": 30.0 }, "durationS": 300, "priority": 2,
              "required": true },
            { "id": "SAT7", "target": { "tle": ["%s", "%s"] }, "durationS": 120, "priority": 3 },
            { "id": "R4", "target": { "raDeg": 200.0, "decDeg": 5.0 }, "durationS": 900, "priority": 4,
              "windows": [["2031-05-04T20:00:00Z", "2031-05-04T23:00:00Z"]] }
          ],
          "solver": { "timeLimitS": 30, "workers": 2, "seed": 1 }
        }
        """.formatted(tle.get(0), tle.get(1));
    return (ObjectNode) tree(json);
  }

  /** The base scenario without an observer: no targets, windows on every request, fixed slews. */
  static ObjectNode noObserver() {
    ObjectNode o = base();
    o.remove("observer");
    o.remove("startPointing");
    o.set("slew", tree("{\"model\": \"fixed\", \"seconds\": 60}"));
    for (JsonNode r : requests(o)) {
      ((ObjectNode) r).remove("target");
      ((ObjectNode) r).set("windows", tree("[[\"2031-05-04T20:00:00Z\", \"2031-05-04T23:00:00Z\"]]"));
    }
    return o;
  }

  /**
   * A valid scenario with three resources (invented): "north", a ground site with an alt-az mount and its
   * own constraints; "south", a ground site with eigenaxis slews and its own configuration table; "queue",
   * no observer and a matrix slew. Requests R1 (north, south), R2 (south, configuration "red"), SAT7 (a TLE
   * target, north) and Q1 (queue, with a window).
   */
  static ObjectNode network() {
    List<String> tle = TestTles.tle(90007, HORIZON_START.minusSeconds(86_400));
    String json = """
        {
          "format": 1,
          "name": "network night",
          "horizon": { "start": "2031-05-04T18:00:00Z", "end": "2031-05-05T06:00:00Z" },
          "constraints": { "sunSeparationMinDeg": 45, "elevationMinDeg": 20, "elevationMaxDeg": 88,
                           "sunElevationMaxDeg": -12 },
          "resources": [
            { "id": "north",
              "observer": { "ground": { "latitudeDeg": 28.7, "longitudeDeg": -17.9, "altitudeM": 2300 } },
              "slew": { "model": "altaz", "azimuthRateDegPerS": 3, "elevationRateDegPerS": 2,
                        "azimuthAccelDegPerS2": 1, "elevationAccelDegPerS2": 1, "settleS": 10,
                        "azimuthRangeDeg": [-270, 270] },
              "startPointing": { "azimuthDeg": 0, "elevationDeg": 45 },
              "constraints": { "elevationMinDeg": 30, "sunSeparationMinDeg": null } },
            { "id": "south",
              "observer": { "ground": { "latitudeDeg": -24.6, "longitudeDeg": -70.4, "altitudeM": 2600 } },
              "slew": { "model": "eigenaxis", "rateDegPerS": 1.0, "accelDegPerS2": 0.05, "settleS": 20 },
              "reconfiguration": { "labels": ["", "red"], "seconds": [[0, 60], [45, 0]] } },
            { "id": "queue",
              "slew": { "model": "matrix", "seconds": [[0, 30, 30, 30], [30, 0, 30, 30], [30, 30, 0, 30],
                                                       [30, 30, 30, 0]] } }
          ],
          "requests": [
            { "id": "R1", "target": { "raDeg": 10.0, "decDeg": -20.0 }, "durationS": 600, "priority": 5,
              "resources": ["north", "south"] },
            { "id": "R2", "target": { "raDeg": 150.0, "decDeg": 30.0 }, "durationS": 300, "priority": 2,
              "configuration": "red", "resources": ["south"] },
            { "id": "SAT7", "target": { "tle": ["%s", "%s"] }, "durationS": 120, "priority": 3,
              "resources": ["north"] },
            { "id": "Q1", "durationS": 900, "priority": 4,
              "windows": [["2031-05-04T20:00:00Z", "2031-05-04T23:00:00Z"]], "resources": ["queue"] }
          ]
        }
        """.formatted(tle.get(0), tle.get(1));
    return (ObjectNode) tree(json);
  }

  /** Resource {@code i} of {@link #network()}. */
  static ObjectNode resource(ObjectNode o, int i) {
    return (ObjectNode) o.get("resources").get(i);
  }

  static ArrayNode requests(ObjectNode o) {
    return (ArrayNode) o.get("requests");
  }

  static ObjectNode request(ObjectNode o, int i) {
    return (ObjectNode) o.get("requests").get(i);
  }

  static JsonNode tree(String json) {
    try {
      return MAPPER.readTree(json);
    } catch (JsonProcessingException e) {
      throw new IllegalArgumentException(e);
    }
  }

  static ScenarioReader.Result read(JsonNode doc) {
    return ScenarioReader.parse(doc.toString());
  }

  /** The problems the reader reports for {@code text}; fails when it accepts it. */
  static List<Problem> problems(String text) {
    return assertThrows(ScenarioException.class, () -> ScenarioReader.parse(text), text).problems();
  }

  static List<Problem> problems(JsonNode doc) {
    return problems(doc.toString());
  }

  /** The one problem at {@code path}; fails when there is none or several. */
  static Problem at(List<Problem> problems, String path) {
    List<Problem> hits = problems.stream().filter(p -> p.path().equals(path)).toList();
    if (hits.size() != 1) {
      fail("expected one problem at " + path + ", got " + hits.size() + " in:\n" + String.join("\n",
          problems.stream().map(Problem::toString).toList()));
    }
    return hits.get(0);
  }
}
