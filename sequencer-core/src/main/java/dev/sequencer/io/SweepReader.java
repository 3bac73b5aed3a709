package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.sequencer.model.GroundSite;
import dev.sequencer.model.Scenario;
import dev.sequencer.model.SlewSettings;
import dev.sequencer.model.Sweep;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads a sweep file (docs/campaigns.md): one scenario or campaign and the axes of the grid. Unknown fields
 * are refused with a "did you mean"; each slew of the {@code slew} axis is read like a scenario's
 * {@code slew} object, for the scenario's observer.
 */
public final class SweepReader {
  static final List<String> TOP = List.of("format", "name", "scenario", "campaign", "axes", "reproducible");
  static final List<String> AXES = List.of("solver", "timeLimitS", "workers", "seed", "weatherSeed", "slew");
  /** The solvers a sweep or campaign names. */
  public static final List<String> SOLVERS = List.of("cpsat", "greedy", "best-now");
  /** Largest grid read: a guard against a typo multiplying the runs. */
  public static final int MAX_RUNS = 100_000;

  private SweepReader() {}

  /**
   * Reads {@code file}; {@code scenario} is the scenario the sweep's input leads to (read by the caller
   * first, see {@link #inputFile}), used for the slew axis.
   */
  public static Sweep read(Path file, Scenario scenario) {
    return parse(Json.read(file), file.toString(), scenario);
  }

  /** The sweep's input file (scenario or campaign), resolved against the sweep file's folder; read first. */
  public static Path inputFile(Path file) {
    Sweep s = parse(Json.read(file), file.toString(), null);
    return file.toAbsolutePath().getParent().resolve(s.inputFile());
  }

  /** Reads sweep JSON text; {@code scenario} may be null when the sweep has no slew axis. */
  public static Sweep parse(String json, String source, Scenario scenario) {
    Problems p = new Problems();
    JsonNode root = Json.parseObject(json, source, p);
    Sweep s = root == null ? null : parse(root, p, scenario);
    p.throwIfAny(source);
    return s;
  }

  private static Sweep parse(JsonNode root, Problems p, Scenario scenario) {
    Fields top = Fields.of(root, "", p, TOP);
    Integer format = top.integer("format", true, Range.ANY);
    if (format != null && format != Sweep.FORMAT) {
      p.invalid("format", "must be " + Sweep.FORMAT, root.get("format"));
    }
    String name = top.text("name", false);
    String scenarioFile = top.text("scenario", false);
    String campaignFile = top.text("campaign", false);
    if ((scenarioFile == null) == (campaignFile == null) && p.count() == 0) {
      p.add("scenario", "give exactly one of scenario and campaign", null);
    }
    Boolean reproducible = top.bool("reproducible", false);
    Fields axes = top.object("axes", false, AXES);
    List<String> solvers = new ArrayList<>();
    List<Double> limits = new ArrayList<>();
    List<Integer> workers = new ArrayList<>();
    List<Integer> seeds = new ArrayList<>();
    List<Long> weatherSeeds = new ArrayList<>();
    List<SlewSettings> slews = new ArrayList<>();
    if (axes != null) {
      each(axes, "solver", p, (n, path) -> {
        String v = Values.text(n, path, p);
        if (v != null && !SOLVERS.contains(v)) {
          p.add(path, "must be one of " + String.join(", ", SOLVERS) + Suggest.hint(v, SOLVERS) + " (was " + v + ")", v);
        } else if (v != null) {
          solvers.add(v);
        }
      });
      each(axes, "timeLimitS", p, (n, path) -> add(limits, Values.number(n, path, p, Range.POSITIVE)));
      each(axes, "workers", p, (n, path) -> add(workers, Values.integer(n, path, p, Range.closed(1, 1024))));
      each(axes, "seed", p, (n, path) -> add(seeds, Values.integer(n, path, p, Range.ANY)));
      each(axes, "weatherSeed", p, (n, path) -> {
        Integer v = Values.integer(n, path, p, Range.ANY);
        if (v != null) {
          weatherSeeds.add(v.longValue());
        }
      });
      if (campaignFile == null && axes.has("weatherSeed")) {
        p.add(axes.path("weatherSeed"), "only a campaign has weather (this sweep names a scenario)", null);
      }
      each(axes, "slew", p, (n, path) -> add(slews, slew(n, path, p, scenario)));
    }
    long runs = (long) Math.max(1, solvers.size()) * Math.max(1, limits.size()) * Math.max(1, workers.size())
        * Math.max(1, seeds.size()) * Math.max(1, weatherSeeds.size()) * Math.max(1, slews.size());
    if (runs > MAX_RUNS) {
      p.add("axes", "the grid has " + runs + " runs; at most " + MAX_RUNS, Long.toString(runs));
    }
    if (p.count() > 0) {
      return null;
    }
    return new Sweep(format, name, campaignFile != null ? campaignFile : scenarioFile, campaignFile != null, solvers,
        limits, workers, seeds, weatherSeeds, slews, reproducible == null || reproducible);
  }

  private interface Item {
    void read(JsonNode n, String path);
  }

  private static <T> void add(List<T> list, T v) {
    if (v != null) {
      list.add(v);
    }
  }

  /** Each element of the non-empty array {@code field}, with its path. */
  private static void each(Fields f, String field, Problems p, Item item) {
    ArrayNode a = f.array(field, false);
    if (a == null) {
      return;
    }
    if (a.isEmpty()) {
      p.invalid(f.path(field), "must list at least one value (leave the axis out to keep the input's)", a);
    }
    for (int i = 0; i < a.size(); i++) {
      item.read(a.get(i), f.path(field) + "[" + i + "]");
    }
  }

  private static SlewSettings slew(JsonNode n, String path, Problems p, Scenario scenario) {
    if (scenario == null) {
      return null; // first pass (inputFile): the slews are read once the scenario is known
    }
    ObserverKind kind = scenario.observer() == null ? ObserverKind.NONE
        : scenario.observer() instanceof GroundSite ? ObserverKind.GROUND : ObserverKind.ORBIT;
    // Fields of the wrapper at the parent path, so the slew's own problems read "axes.slew[i]...".
    String parent = path.substring(0, path.lastIndexOf('.'));
    String name = path.substring(path.lastIndexOf('.') + 1);
    ObjectNode named = JsonNodeFactory.instance.objectNode();
    named.set(name, n);
    Fields f = Fields.of(named, parent, p, List.of(name));
    return new SlewParser(p, kind, scenario.requests().size()).parse(f, name);
  }
}
