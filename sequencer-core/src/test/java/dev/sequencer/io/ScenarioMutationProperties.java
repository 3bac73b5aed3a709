package dev.sequencer.io;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.DoubleNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.function.BiFunction;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * One rule-breaking edit to a valid generated scenario makes the reader report a problem at the
 * edited field's path. Each mutation returns that path, or null when it does not apply to the document.
 */
class ScenarioMutationProperties {

  /** A mutated document and the path the reader must name. */
  record Mutant(String name, String json, String expectedPath) {}

  private static final List<String> NAMES = List.of("negativeDuration", "nanInSlew", "duplicateId",
      "reversedWindow", "unknownField", "badTleChecksum", "wrongMatrixSize", "latitude95", "priorityZero",
      "horizonReversed", "stringForNumber", "elevationLimitsSwapped", "formatTwo", "windowOutsideHorizon",
      "flexibleUtilityOffMin", "flexibleWithPriority", "missingId", "separation181", "negativeWorkers",
      "targetKindForObserver");

  @Provide
  Arbitrary<Mutant> mutants() {
    return Arbitraries.randomValue(ScenarioMutationProperties::mutant);
  }

  @Property(tries = 400)
  void readerNamesTheMutatedField(@ForAll("mutants") Mutant m) {
    ScenarioException e = assertThrows(ScenarioException.class, () -> ScenarioReader.parse(m.json()), m.name());
    assertTrue(e.problems().stream().anyMatch(p -> p.path().equals(m.expectedPath())),
        m.name() + ": expected a problem at " + m.expectedPath() + ", got:\n" + e.getMessage() + "\n" + m.json());
  }

  static Mutant mutant(Random r) {
    while (true) {
      ObjectNode doc = (ObjectNode) Docs.tree(ScenarioWriter.toJson(new ScenarioGen(r).scenario()));
      String name = NAMES.get(r.nextInt(NAMES.size()));
      String path = mutation(name).apply(doc, r);
      if (path != null) {
        return new Mutant(name, doc.toString(), path);
      }
    }
  }

  private static String label(ObjectNode doc, int i) {
    return RequestParser.label("requests", i, doc.get("requests").get(i));
  }

  /** Index of a random request satisfying {@code want}, or -1. */
  private static int pick(ObjectNode doc, Random r, java.util.function.Predicate<ObjectNode> want) {
    List<Integer> hits = new ArrayList<>();
    for (int i = 0; i < doc.get("requests").size(); i++) {
      if (want.test((ObjectNode) doc.get("requests").get(i))) {
        hits.add(i);
      }
    }
    return hits.isEmpty() ? -1 : hits.get(r.nextInt(hits.size()));
  }

  private static ObjectNode req(ObjectNode doc, int i) {
    return (ObjectNode) doc.get("requests").get(i);
  }

  static BiFunction<ObjectNode, Random, String> mutation(String name) {
    return switch (name) {
      case "negativeDuration" -> (doc, r) -> {
        int i = pick(doc, r, q -> q.has("durationS"));
        if (i < 0) return null;
        req(doc, i).put("durationS", -1 - r.nextInt(600));
        return label(doc, i) + ".durationS";
      };
      case "nanInSlew" -> (doc, r) -> {
        ObjectNode slew = (ObjectNode) doc.get("slew");
        if (slew.get("seconds") instanceof ArrayNode rows) {
          ((ArrayNode) rows.get(0)).set(0, DoubleNode.valueOf(r.nextBoolean() ? Double.NaN : Double.POSITIVE_INFINITY));
          return "slew.seconds[0][0]";
        }
        List<String> numeric = new ArrayList<>();
        slew.properties().forEach(e -> { if (e.getValue().isNumber()) numeric.add(e.getKey()); });
        String f = numeric.get(r.nextInt(numeric.size()));
        slew.put(f, Double.NaN);
        return "slew." + f;
      };
      case "duplicateId" -> (doc, r) -> {
        int n = doc.get("requests").size();
        if (n < 2) return null;
        int j = 1 + r.nextInt(n - 1);
        req(doc, j).put("id", req(doc, r.nextInt(j)).get("id").textValue());
        return label(doc, j) + ".id";
      };
      case "reversedWindow" -> (doc, r) -> {
        int i = pick(doc, r, q -> q.has("windows"));
        if (i < 0) return null;
        ArrayNode ws = (ArrayNode) req(doc, i).get("windows");
        int k = r.nextInt(ws.size());
        ArrayNode w = (ArrayNode) ws.get(k);
        JsonNode start = w.get(0);
        w.set(0, w.get(1));
        w.set(1, start);
        return label(doc, i) + ".windows[" + k + "]";
      };
      case "unknownField" -> (doc, r) -> {
        switch (r.nextInt(4)) {
          case 0:
            doc.put("requsts", 1);
            return "requsts";
          case 1:
            ((ObjectNode) doc.get("slew")).put("settle", 1);
            return "slew.settle";
          case 2:
            ((ObjectNode) doc.get("horizon")).put("stop", "2031-01-01T00:00:00Z");
            return "horizon.stop";
          default:
            int i = r.nextInt(doc.get("requests").size());
            req(doc, i).put("priorty", 3);
            return label(doc, i) + ".priorty";
        }
      };
      case "badTleChecksum" -> (doc, r) -> {
        List<String> paths = new ArrayList<>();
        List<ArrayNode> tles = new ArrayList<>();
        JsonNode orbitTle = doc.at("/observer/orbit/tle");
        if (orbitTle.isArray()) {
          paths.add("observer.orbit.tle");
          tles.add((ArrayNode) orbitTle);
        }
        for (int i = 0; i < doc.get("requests").size(); i++) {
          if (req(doc, i).at("/target/tle").isArray()) {
            paths.add(label(doc, i) + ".target.tle");
            tles.add((ArrayNode) req(doc, i).at("/target/tle"));
          }
        }
        if (tles.isEmpty()) return null;
        int t = r.nextInt(tles.size());
        int line = r.nextInt(2);
        String s = tles.get(t).get(line).textValue();
        tles.get(t).set(line, s.substring(0, 68) + (char) ('0' + (s.charAt(68) - '0' + 1 + r.nextInt(9)) % 10));
        return paths.get(t) + "[" + line + "]";
      };
      case "wrongMatrixSize" -> (doc, r) -> {
        int n = doc.get("requests").size() + (r.nextBoolean() ? 1 : -1);
        ArrayNode rows = JsonOut.NODES.arrayNode();
        for (int i = 0; i < n; i++) {
          ArrayNode row = rows.addArray();
          for (int j = 0; j < n; j++) row.add(5);
        }
        ObjectNode slew = JsonOut.NODES.objectNode().put("model", "matrix");
        slew.set("seconds", rows);
        doc.set("slew", slew);
        return "slew.seconds";
      };
      case "latitude95" -> (doc, r) -> {
        if (doc.at("/observer/ground").isObject()) {
          ((ObjectNode) doc.at("/observer/ground")).put("latitudeDeg", r.nextBoolean() ? 95 : -90.5);
          return "observer.ground.latitudeDeg";
        }
        int i = pick(doc, r, q -> q.at("/target/latitudeDeg").isNumber());
        if (i < 0) return null;
        ((ObjectNode) req(doc, i).get("target")).put("latitudeDeg", 95);
        return label(doc, i) + ".target.latitudeDeg";
      };
      case "priorityZero" -> (doc, r) -> {
        int i = pick(doc, r, q -> q.has("priority"));
        if (i < 0) return null;
        req(doc, i).put("priority", r.nextBoolean() ? 0 : -2.5);
        return label(doc, i) + ".priority";
      };
      case "horizonReversed" -> (doc, r) -> {
        ObjectNode h = (ObjectNode) doc.get("horizon");
        JsonNode start = h.get("start");
        h.set("start", h.get("end"));
        h.set("end", start);
        return "horizon.end";
      };
      case "stringForNumber" -> (doc, r) -> {
        int i = pick(doc, r, q -> q.has("durationS"));
        if (i < 0) return null;
        req(doc, i).put("durationS", req(doc, i).get("durationS").asText());
        return label(doc, i) + ".durationS";
      };
      case "elevationLimitsSwapped" -> (doc, r) -> {
        ObjectNode c = doc.has("constraints") ? (ObjectNode) doc.get("constraints") : doc.putObject("constraints");
        c.put("elevationMinDeg", 50);
        c.put("elevationMaxDeg", r.nextBoolean() ? 50 : 10);
        return "constraints.elevationMaxDeg";
      };
      case "formatTwo" -> (doc, r) -> {
        doc.put("format", 2);
        return "format";
      };
      case "windowOutsideHorizon" -> (doc, r) -> {
        int i = r.nextInt(doc.get("requests").size());
        Instant end = Instant.parse(doc.at("/horizon/end").textValue());
        ArrayNode ws = JsonOut.NODES.arrayNode();
        ws.addArray().add(end.plusSeconds(60).toString()).add(end.plusSeconds(3600).toString());
        req(doc, i).set("windows", ws);
        return label(doc, i) + ".windows[0]";
      };
      case "flexibleUtilityOffMin" -> (doc, r) -> {
        int i = pick(doc, r, q -> q.has("utility"));
        if (i < 0) return null;
        ArrayNode first = (ArrayNode) req(doc, i).get("utility").get(0);
        first.set(0, DoubleNode.valueOf(first.get(0).doubleValue() + 0.5));
        return label(doc, i) + ".utility[0][0]";
      };
      case "flexibleWithPriority" -> (doc, r) -> {
        int i = pick(doc, r, q -> q.has("utility"));
        if (i < 0) return null;
        req(doc, i).put("priority", 1);
        return label(doc, i) + ".priority";
      };
      case "missingId" -> (doc, r) -> {
        int i = r.nextInt(doc.get("requests").size());
        req(doc, i).remove("id");
        return "requests[" + i + "].id";
      };
      case "separation181" -> (doc, r) -> {
        ObjectNode c = doc.has("constraints") ? (ObjectNode) doc.get("constraints") : doc.putObject("constraints");
        c.put("moonSeparationMinDeg", 180.001);
        return "constraints.moonSeparationMinDeg";
      };
      case "negativeWorkers" -> (doc, r) -> {
        ObjectNode s = doc.has("solver") ? (ObjectNode) doc.get("solver") : doc.putObject("solver");
        s.put("workers", -1);
        return "solver.workers";
      };
      case "targetKindForObserver" -> (doc, r) -> {
        int i = r.nextInt(doc.get("requests").size());
        if (!doc.has("observer")) {
          req(doc, i).set("target", Docs.tree("{\"raDeg\": 1, \"decDeg\": 2}"));
          return label(doc, i) + ".target";
        }
        if (doc.at("/observer/ground").isObject()) {
          req(doc, i).set("target", Docs.tree("{\"latitudeDeg\": 1, \"longitudeDeg\": 2, \"altitudeM\": 3}"));
          return label(doc, i) + ".target";
        }
        req(doc, i).remove("target");
        return label(doc, i) + ".target";
      };
      default -> throw new IllegalArgumentException(name);
    };
  }
}
