package dev.sequencer.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ContainerNode;
import com.fasterxml.jackson.databind.node.DoubleNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.fasterxml.jackson.databind.node.TextNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * One random edit of a valid generated scenario (delete a field, replace a value by a wrong type, NaN, a
 * huge or a negative number, duplicate a key, truncate the text), then every scenario command: exit 2
 * (still valid: 0, or 1 from {@code plan} when the edit made the required requests impossible), never 3,
 * never a stack trace; the commands agree on validity; a plan that came out passes {@code check}.
 */
class CliMutationProperties {
  /** A mutated scenario text and what was done to it. */
  record Mutant(String what, String json) {}

  @Provide
  Arbitrary<Mutant> mutants() {
    return Arbitraries.randomValue(CliMutationProperties::mutant);
  }

  @Property(tries = 150)
  void everyCommandRejectsCleanlyOrPlansValidly(@ForAll("mutants") Mutant m) throws IOException {
    Path dir = Files.createTempDirectory("mutant");
    try {
      Path scenario = dir.resolve("s.json");
      Files.writeString(scenario, m.json());
      Path tl = dir.resolve("t.json");
      Runs.Run inspect = Runs.run("inspect", scenario.toString());
      Runs.Run windows = Runs.run("windows", scenario.toString());
      Runs.Run plan = Runs.run("plan", scenario.toString(), "--time-limit", "1", "--workers", "1", "-o",
          tl.toString());
      for (Runs.Run r : List.of(inspect, windows, plan)) {
        String ctx = m.what() + "\n" + r.all() + "\n" + m.json();
        assertTrue(Set.of(0, 1, 2).contains(r.code()), ctx);
        assertTrue(!(r.out() + r.err()).contains("\tat ") && !(r.out() + r.err()).contains("Exception"), ctx);
      }
      assertTrue(inspect.code() == 0 || inspect.code() == 2, inspect::all);
      // inspect applies the format's rules and the planner's (InputRules), so it agrees with plan; windows
      // needs only the format's, so what it refuses inspect refuses too.
      assertTrue(windows.code() != 2 || inspect.code() == 2, () -> m.what() + "\n" + windows.all());
      if (inspect.code() == 2) {
        assertEquals(2, plan.code(), () -> m.what() + "\n" + plan.all());
        assertTrue(!inspect.err().isBlank(), inspect::all);
      } else if (plan.code() == 1) {
        assertTrue(plan.out().contains("no plan ("), plan::all);
      } else if (plan.code() == 0) {
        Runs.Run check = Runs.run("check", scenario.toString(), tl.toString());
        assertEquals(0, check.code(), () -> m.what() + "\n" + check.all() + "\n" + m.json());
      }
      assertTrue(plan.code() != 2 || inspect.code() == 2, () -> m.what() + ": plan refuses what inspect calls "
          + "valid\n" + plan.all());
    } finally {
      try (var files = Files.walk(dir)) {
        for (Path p : files.sorted(java.util.Comparator.reverseOrder()).toList()) {
          Files.deleteIfExists(p);
        }
      }
    }
  }

  /** A small valid scenario: windows only or an invented ground site with RA/Dec targets. */
  static ObjectNode valid(Random r) {
    Instant start = Instant.parse("2031-01-01T18:00:00Z").plusSeconds(86_400L * r.nextInt(365));
    ObjectNode s = Synthetic.base(start, 2 + r.nextInt(6), r.nextInt(60));
    if (r.nextBoolean()) {
      Synthetic.windowsOnly(s, 1 + r.nextInt(5), r);
    } else {
      Synthetic.ground(s, -60 + 120 * r.nextDouble(), 360 * r.nextDouble());
      if (r.nextBoolean()) {
        Synthetic.eigenaxis(s);
      }
      s.putObject("constraints").put("elevationMinDeg", 10 + r.nextInt(30));
      for (int i = 0; i < 1 + r.nextInt(5); i++) {
        Synthetic.raDec(s, "T" + i, 360 * r.nextDouble(), -80 + 160 * r.nextDouble(), 60L * (1 + r.nextInt(20)),
            1 + r.nextInt(9));
      }
    }
    if (r.nextInt(4) == 0) {
      ((ObjectNode) s.get("requests").get(0)).put("required", true);
    }
    s.putObject("solver").put("timeLimitS", 1).put("workers", 1).put("seed", r.nextInt(100));
    return s;
  }

  static Mutant mutant(Random r) {
    ObjectNode doc = valid(r);
    List<Slot> slots = new ArrayList<>();
    collect(doc, "", slots);
    Slot slot = slots.get(r.nextInt(slots.size()));
    switch (r.nextInt(5)) {
      case 0 -> {
        slot.delete();
        return new Mutant("delete " + slot.path, doc.toString());
      }
      case 1 -> {
        JsonNode v = List.<JsonNode>of(TextNode.valueOf("x"), DoubleNode.valueOf(Double.NaN),
            DoubleNode.valueOf(Double.POSITIVE_INFINITY), DoubleNode.valueOf(1e308), DoubleNode.valueOf(-1),
            DoubleNode.valueOf(-1e9), DoubleNode.valueOf(0.5), Synthetic.JSON.getNodeFactory().booleanNode(true),
            Synthetic.JSON.createArrayNode(), Synthetic.JSON.createObjectNode(),
            Synthetic.JSON.getNodeFactory().nullNode()).get(r.nextInt(11));
        slot.set(v);
        return new Mutant("set " + slot.path + " = " + v, doc.toString());
      }
      case 2 -> {
        String text = doc.toString();
        int cut = r.nextInt(text.length());
        return new Mutant("truncate at " + cut, text.substring(0, cut));
      }
      case 3 -> {
        // Duplicate a key: repeat the first member of a random object, with its value.
        List<ObjectNode> objects = new ArrayList<>();
        collectObjects(doc, objects);
        ObjectNode o = objects.get(r.nextInt(objects.size()));
        Map.Entry<String, JsonNode> first = o.properties().iterator().next();
        String marker = "\"__dup__\":0";
        o.put("__dup__", 0);
        String text = doc.toString().replace(marker, Synthetic.JSON.getNodeFactory().textNode(first.getKey())
            + ":" + first.getValue());
        return new Mutant("duplicate key " + first.getKey(), text);
      }
      default -> {
        JsonNode v = slot.get();
        JsonNode neg = v != null && v.isNumber() ? DoubleNode.valueOf(-v.doubleValue() - 1) : TextNode.valueOf("-1");
        slot.set(neg);
        return new Mutant("negate " + slot.path + " = " + neg, doc.toString());
      }
    }
  }

  /** A place in the tree: an object member or an array element. */
  record Slot(ContainerNode<?> parent, String key, int index, String path) {
    void delete() {
      if (parent instanceof ObjectNode o) {
        o.remove(key);
      } else {
        ((ArrayNode) parent).remove(index);
      }
    }

    void set(JsonNode v) {
      if (parent instanceof ObjectNode o) {
        o.set(key, v);
      } else {
        ((ArrayNode) parent).set(index, v);
      }
    }

    JsonNode get() {
      return parent instanceof ObjectNode o ? o.get(key) : ((ArrayNode) parent).get(index);
    }
  }

  private static void collect(JsonNode n, String path, List<Slot> out) {
    if (n instanceof ObjectNode o) {
      o.properties().forEach(e -> {
        out.add(new Slot(o, e.getKey(), -1, path + "." + e.getKey()));
        collect(e.getValue(), path + "." + e.getKey(), out);
      });
    } else if (n instanceof ArrayNode a) {
      for (int i = 0; i < a.size(); i++) {
        out.add(new Slot(a, null, i, path + "[" + i + "]"));
        collect(a.get(i), path + "[" + i + "]", out);
      }
    }
  }

  private static void collectObjects(JsonNode n, List<ObjectNode> out) {
    if (n instanceof ObjectNode o) {
      if (!o.isEmpty()) {
        out.add(o);
      }
      o.properties().forEach(e -> collectObjects(e.getValue(), out));
    } else if (n instanceof ArrayNode a) {
      a.forEach(e -> collectObjects(e, out));
    }
  }
}
