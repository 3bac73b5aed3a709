package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The visibility output file: {@code {"format": 1, "windows": [{"id", "intervals": [[start, end], ...]}]}};
 * with several resources (A6) one entry per request and allowed resource, {@code {"id", "resource",
 * "intervals"}} ({@link #toJsonByResource}; written for people and other tools, not read back here).
 * Intervals must be ordered and disjoint (each starts after the previous one ends); a single-instant
 * interval (a grazing pass) is allowed. Ids are unique and non-empty.
 */
public final class WindowsFile {
  static final List<String> TOP = List.of("format", "windows");
  static final List<String> ENTRY = List.of("id", "intervals");

  private WindowsFile() {}

  /** The file's contents as pretty, byte-stable JSON text. */
  public static String toJson(List<RequestWindows> windows) {
    ObjectNode o = JsonOut.NODES.objectNode();
    o.put("format", 1);
    ArrayNode a = o.putArray("windows");
    for (RequestWindows w : windows) {
      ObjectNode e = a.addObject();
      e.put("id", w.id());
      e.set("intervals", ScenarioWriter.windows(w.intervals()));
    }
    return JsonOut.pretty(o);
  }

  /** Writes the file atomically. */
  public static void write(List<RequestWindows> windows, Path file) {
    AtomicFiles.writeUtf8(file, toJson(windows));
  }

  /**
   * The file of a scenario with several resources (A6): per resource in the map's order, one entry per
   * request it may observe, {@code {"id", "resource", "intervals"}}.
   */
  public static String toJsonByResource(Map<String, List<RequestWindows>> byResource) {
    ObjectNode o = JsonOut.NODES.objectNode();
    o.put("format", 1);
    ArrayNode a = o.putArray("windows");
    byResource.forEach((resource, windows) -> {
      for (RequestWindows w : windows) {
        ObjectNode e = a.addObject();
        e.put("id", w.id());
        e.put("resource", resource);
        e.set("intervals", ScenarioWriter.windows(w.intervals()));
      }
    });
    return JsonOut.pretty(o);
  }

  /** Writes the file of {@link #toJsonByResource} atomically. */
  public static void writeByResource(Map<String, List<RequestWindows>> byResource, Path file) {
    AtomicFiles.writeUtf8(file, toJsonByResource(byResource));
  }

  public static List<RequestWindows> read(Path file) {
    return parse(Json.read(file), file.toString());
  }

  /** Reads windows JSON text; {@code source} names it in the exception message. */
  public static List<RequestWindows> parse(String json, String source) {
    Problems p = new Problems();
    JsonNode root = Json.parseObject(json, source, p);
    List<RequestWindows> out = root == null ? null : parse(root, p);
    p.throwIfAny(source);
    return out;
  }

  private static List<RequestWindows> parse(JsonNode root, Problems p) {
    Fields top = Fields.of(root, "", p, TOP);
    Integer format = top.integer("format", true, Range.ANY);
    if (format != null && format != 1) {
      p.invalid("format", "must be 1", root.get("format"));
    }
    ArrayNode entries = top.array("windows", true);
    List<RequestWindows> out = new ArrayList<>();
    if (entries == null) {
      return out;
    }
    Map<String, Integer> firstIndex = new HashMap<>();
    for (int i = 0; i < entries.size(); i++) {
      Fields e = Fields.of(entries.get(i), RequestParser.label("windows", i, entries.get(i)), p, ENTRY);
      if (e == null) {
        continue;
      }
      JsonNode idNode = e.get("id", true);
      String id = idNode == null ? null : Values.id(idNode, e.path("id"), p);
      if (id != null && firstIndex.putIfAbsent(id, i) != null) {
        p.add(e.path("id"), "duplicate id, already used by windows[" + firstIndex.get(id) + "]", id);
      }
      List<TimeWindow> intervals = intervals(e.array("intervals", true), e.path("intervals"), p);
      if (id != null && intervals != null) {
        out.add(new RequestWindows(id, intervals));
      }
    }
    return out;
  }

  /** Ordered, disjoint intervals; null after reporting. */
  static List<TimeWindow> intervals(ArrayNode a, String path, Problems p) {
    if (a == null) {
      return null;
    }
    int before = p.count();
    List<TimeWindow> out = new ArrayList<>();
    for (int i = 0; i < a.size(); i++) {
      String ip = path + "[" + i + "]";
      TimeWindow w = Values.window(a.get(i), ip, p, false);
      if (w == null) {
        continue;
      }
      if (!out.isEmpty() && !w.start().isAfter(out.get(out.size() - 1).end())) {
        p.add(ip, "starts at " + w.start() + ", not after the previous interval's end "
            + out.get(out.size() - 1).end() + "; intervals must be ordered and disjoint", Problems.text(a.get(i)));
      }
      out.add(w);
    }
    return p.count() == before ? out : null;
  }
}
