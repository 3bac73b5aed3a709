package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.model.RequestWindows;
import dev.sequencer.model.TimeWindow;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * The visibility output file: {@code {"format": 1, "windows": [{"id", "intervals": [[start, end], ...]}]}}.
 * Intervals must be ordered and disjoint (each starts after the previous one ends); a single-instant
 * interval (a grazing pass) is allowed. Ids are unique and non-empty.
 *
 * <p>For a scenario with several resources (A6) the file has one entry per request and allowed resource,
 * {@code {"id", "resource", "intervals"}}: the {@code ...ByResource} methods write and read it as a list of
 * {@link ResourceWindows}, entries grouped by resource in list order. There an id is unique per resource; the
 * one-observer methods refuse entries that name a resource, and the by-resource ones entries that do not.
 */
public final class WindowsFile {
  static final List<String> TOP = List.of("format", "windows");
  static final List<String> ENTRY = List.of("id", "resource", "intervals", "passes");
  static final List<String> PASS = List.of("rise", "culmination", "culminationElevationDeg", "set");

  /**
   * One pass of an orbiting target over a ground site, written beside its windows so that a station team can
   * read the contact plan: rise and set at the geometric horizon (0°), culmination at the highest geometric
   * elevation. Informational: reading a windows file checks and drops it.
   */
  public record Pass(Instant rise, Instant culmination, double culminationElevationDeg, Instant set) {
    public Pass {
      Objects.requireNonNull(rise, "rise");
      Objects.requireNonNull(culmination, "culmination");
      Objects.requireNonNull(set, "set");
    }
  }

  /** The passes of a request on a resource (null for one observer); an empty list writes no {@code passes}. */
  @FunctionalInterface
  public interface PassSource {
    List<Pass> passes(String resource, String id);

    /** No passes anywhere. */
    PassSource NONE = (resource, id) -> List.of();
  }

  /** The windows of one resource (A6): an entry per request it may observe. */
  public record ResourceWindows(String resource, List<RequestWindows> windows) {
    public ResourceWindows {
      Objects.requireNonNull(resource, "resource");
      windows = List.copyOf(windows);
    }
  }

  /** One entry as read; {@code resource} is null in a one-observer file. */
  private record Entry(String id, String resource, List<TimeWindow> intervals) {}

  private WindowsFile() {}

  /** The file's contents as pretty, byte-stable JSON text. */
  public static String toJson(List<RequestWindows> windows) {
    return toJson(windows, PassSource.NONE);
  }

  /** As {@link #toJson(List)}, each entry with its request's passes ({@code passes.passes(null, id)}) when any. */
  public static String toJson(List<RequestWindows> windows, PassSource passes) {
    ObjectNode o = JsonOut.NODES.objectNode();
    o.put("format", 1);
    ArrayNode a = o.putArray("windows");
    windows.forEach(w -> entry(a, w, null, passes));
    return JsonOut.pretty(o);
  }

  /** The file of a scenario with resources (A6) as pretty, byte-stable JSON text: resource by resource. */
  public static String toJsonByResource(List<ResourceWindows> windows) {
    return toJsonByResource(windows, PassSource.NONE);
  }

  /** As {@link #toJsonByResource(List)}, each entry with its passes over its resource when any. */
  public static String toJsonByResource(List<ResourceWindows> windows, PassSource passes) {
    ObjectNode o = JsonOut.NODES.objectNode();
    o.put("format", 1);
    ArrayNode a = o.putArray("windows");
    windows.forEach(rw -> rw.windows().forEach(w -> entry(a, w, rw.resource(), passes)));
    return JsonOut.pretty(o);
  }

  private static void entry(ArrayNode a, RequestWindows w, String resource, PassSource passes) {
    ObjectNode e = a.addObject();
    e.put("id", w.id());
    if (resource != null) {
      e.put("resource", resource);
    }
    e.set("intervals", ScenarioWriter.windows(w.intervals()));
    List<Pass> mine = passes.passes(resource, w.id());
    if (!mine.isEmpty()) {
      ArrayNode ps = e.putArray("passes");
      for (Pass p : mine) {
        ObjectNode n = ps.addObject();
        n.put("rise", p.rise().toString());
        n.put("culmination", p.culmination().toString());
        n.put("culminationElevationDeg", Math.round(p.culminationElevationDeg() * 1000) / 1000.0);
        n.put("set", p.set().toString());
      }
    }
  }

  /** Writes the file atomically. */
  public static void write(List<RequestWindows> windows, Path file) {
    AtomicFiles.writeUtf8(file, toJson(windows));
  }

  /** Writes the file atomically, with the passes. */
  public static void write(List<RequestWindows> windows, PassSource passes, Path file) {
    AtomicFiles.writeUtf8(file, toJson(windows, passes));
  }

  /** Writes the file of a scenario with resources (A6) atomically. */
  public static void writeByResource(List<ResourceWindows> windows, Path file) {
    AtomicFiles.writeUtf8(file, toJsonByResource(windows));
  }

  /** Writes the file of a scenario with resources (A6) atomically, with the passes. */
  public static void writeByResource(List<ResourceWindows> windows, PassSource passes, Path file) {
    AtomicFiles.writeUtf8(file, toJsonByResource(windows, passes));
  }

  public static List<RequestWindows> read(Path file) {
    return parse(Json.read(file), file.toString());
  }

  /** Reads the file of a scenario with resources (A6). */
  public static List<ResourceWindows> readByResource(Path file) {
    return parseByResource(Json.read(file), file.toString());
  }

  /** Reads windows JSON text; {@code source} names it in the exception message. */
  public static List<RequestWindows> parse(String json, String source) {
    Problems p = new Problems();
    JsonNode root = Json.parseObject(json, source, p);
    List<Entry> entries = root == null ? null : entries(root, p, false);
    p.throwIfAny(source);
    return entries.stream().map(e -> new RequestWindows(e.id(), e.intervals())).toList();
  }

  /**
   * Reads windows JSON text of a scenario with resources (A6), grouped by resource in the order each first
   * appears; {@code source} names it in the exception message.
   */
  public static List<ResourceWindows> parseByResource(String json, String source) {
    Problems p = new Problems();
    JsonNode root = Json.parseObject(json, source, p);
    List<Entry> entries = root == null ? null : entries(root, p, true);
    p.throwIfAny(source);
    Map<String, List<RequestWindows>> byResource = new LinkedHashMap<>();
    for (Entry e : entries) {
      byResource.computeIfAbsent(e.resource(), k -> new ArrayList<>()).add(new RequestWindows(e.id(), e.intervals()));
    }
    return byResource.entrySet().stream().map(e -> new ResourceWindows(e.getKey(), e.getValue())).toList();
  }

  /** The valid entries; each has a resource exactly when {@code byResource}. */
  private static List<Entry> entries(JsonNode root, Problems p, boolean byResource) {
    Fields top = Fields.of(root, "", p, TOP);
    Integer format = top.integer("format", true, Range.ANY);
    if (format != null && format != 1) {
      p.invalid("format", "must be 1", root.get("format"));
    }
    ArrayNode entries = top.array("windows", true);
    List<Entry> out = new ArrayList<>();
    if (entries == null) {
      return out;
    }
    Map<List<String>, Integer> firstIndex = new HashMap<>();
    for (int i = 0; i < entries.size(); i++) {
      Fields e = Fields.of(entries.get(i), RequestParser.label("windows", i, entries.get(i)), p, ENTRY);
      if (e == null) {
        continue;
      }
      JsonNode idNode = e.get("id", true);
      String id = idNode == null ? null : Values.id(idNode, e.path("id"), p);
      String resource = resource(e, p, byResource);
      List<String> key = Arrays.asList(id, resource);
      if (id != null && firstIndex.putIfAbsent(key, i) != null) {
        String forResource = resource == null ? "" : " for resource \"" + resource + "\"";
        p.add(e.path("id"), "duplicate id" + forResource + ", already used by windows[" + firstIndex.get(key) + "]",
            id);
      }
      List<TimeWindow> intervals = intervals(e.array("intervals", true), e.path("intervals"), p);
      passes(e.array("passes", false), e.path("passes"), p);
      if (id != null && intervals != null && (resource != null) == byResource) {
        out.add(new Entry(id, resource, intervals));
      }
    }
    return out;
  }

  /** The entry's {@code resource}: required and non-empty {@code byResource}, else refused. */
  private static String resource(Fields e, Problems p, boolean byResource) {
    JsonNode n = e.get("resource", byResource);
    if (n == null) {
      return null;
    }
    if (!byResource) {
      p.add(e.path("resource"), "must be absent: these windows are read for one observer (entries name a resource"
          + " only for a scenario with resources, A6)", Problems.text(n));
      return null;
    }
    return Values.id(n, e.path("resource"), p);
  }

  /** Checks the passes of an entry (rise ≤ culmination ≤ set, elevation in [−90°, 90°], in time order). */
  private static void passes(ArrayNode a, String path, Problems p) {
    Instant previousSet = null;
    for (int i = 0; a != null && i < a.size(); i++) {
      String ip = path + "[" + i + "]";
      Fields f = Fields.of(a.get(i), ip, p, PASS);
      if (f == null) {
        continue;
      }
      Instant rise = instant(f, "rise", p);
      Instant culmination = instant(f, "culmination", p);
      Instant set = instant(f, "set", p);
      f.number("culminationElevationDeg", true, Range.closed(-90, 90));
      if (rise != null && culmination != null && set != null) {
        if (culmination.isBefore(rise) || set.isBefore(culmination)) {
          p.add(ip, "needs rise <= culmination <= set", rise + ", " + culmination + ", " + set);
        }
        if (previousSet != null && !rise.isAfter(previousSet)) {
          p.add(f.path("rise"), "must be after the previous pass's set " + previousSet, rise.toString());
        }
        previousSet = set;
      }
    }
  }

  private static Instant instant(Fields f, String name, Problems p) {
    JsonNode n = f.get(name, true);
    return n == null ? null : Values.instant(n, f.path(name), p);
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
