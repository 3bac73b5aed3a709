package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import dev.sequencer.model.SlewSettings;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Reads the {@code slew} object: the model's name, then that model's parameters. Rates and
 * accelerations must be > 0, settle and fixed times >= 0; a matrix is N x N for N requests.
 * {@code eigenaxis} needs an observer and {@code altaz} (a ground mount) a ground observer.
 */
final class SlewParser {
  static final Map<String, List<String>> MODELS =
      Map.of(
          "eigenaxis", List.of("model", "rateDegPerS", "accelDegPerS2", "settleS", "keepOutDuringSlew"),
          "altaz", List.of("model", "azimuthRateDegPerS", "elevationRateDegPerS", "azimuthAccelDegPerS2",
              "elevationAccelDegPerS2", "settleS", "azimuthRangeDeg", "keepOutDuringSlew"),
          "fixed", List.of("model", "seconds", "keepOutDuringSlew"),
          "matrix", List.of("model", "seconds", "fromStartSeconds", "keepOutDuringSlew"));
  static final List<String> MODEL_NAMES = List.of("eigenaxis", "altaz", "fixed", "matrix");

  private final Problems p;
  private final ObserverKind kind;
  private final int requestCount;

  /** {@code requestCount} < 0 when the requests could not be counted (then no size checks). */
  SlewParser(Problems problems, ObserverKind kind, int requestCount) {
    this.p = problems;
    this.kind = kind;
    this.requestCount = requestCount;
  }

  SlewSettings parse(Fields top) {
    return parse(top, "slew");
  }

  /** The slew object in {@code top}'s field {@code field} (a sweep's axis element reads like {@code slew}). */
  SlewSettings parse(Fields top, String field) {
    JsonNode n = top.get(field, true);
    if (n == null) {
      return null;
    }
    String path = top.path(field);
    JsonNode modelNode = n.get("model");
    String model = modelNode != null && modelNode.isTextual() ? modelNode.textValue() : null;
    List<String> allowed = model == null ? null : MODELS.get(model); // Map.of rejects a null key
    if (allowed == null) {
      Set<String> all = new LinkedHashSet<>();
      MODEL_NAMES.forEach(m -> all.addAll(MODELS.get(m)));
      allowed = new ArrayList<>(all);
    }
    Fields f = Fields.of(n, path, p, allowed);
    if (f == null) {
      return null;
    }
    if (model == null || !MODELS.containsKey(model)) {
      JsonNode m = f.get("model", true);
      if (m != null) {
        String hint = m.isTextual() ? Suggest.hint(m.textValue(), MODEL_NAMES) : "";
        p.invalid(f.path("model"), "must be one of " + String.join(", ", MODEL_NAMES) + hint, m);
      }
      return null;
    }
    int before = p.count();
    checkObserver(model, f.path("model"), modelNode);
    SlewSettings s =
        switch (model) {
          case "eigenaxis" -> eigenaxis(f);
          case "altaz" -> altaz(f);
          case "fixed" -> fixed(f);
          default -> matrix(f);
        };
    return p.count() == before ? s : null;
  }

  private void checkObserver(String model, String path, JsonNode modelNode) {
    if (model.equals("eigenaxis") && kind == ObserverKind.NONE) {
      p.invalid(path, "needs an observer; without one use \"matrix\" or \"fixed\"", modelNode);
    }
    if (model.equals("altaz") && (kind == ObserverKind.NONE || kind == ObserverKind.ORBIT)) {
      p.invalid(path, "is a ground mount and needs a ground observer", modelNode);
    }
  }

  private SlewSettings eigenaxis(Fields f) {
    Double rate = f.number("rateDegPerS", true, Range.POSITIVE);
    Double accel = f.number("accelDegPerS2", true, Range.POSITIVE);
    Double settle = f.number("settleS", true, Range.NON_NEGATIVE);
    boolean keepOut = keepOut(f);
    return rate == null || accel == null || settle == null ? null
        : new SlewSettings.Eigenaxis(rate, accel, settle, keepOut);
  }

  private SlewSettings altaz(Fields f) {
    Double azRate = f.number("azimuthRateDegPerS", true, Range.POSITIVE);
    Double elRate = f.number("elevationRateDegPerS", true, Range.POSITIVE);
    Double azAccel = f.number("azimuthAccelDegPerS2", true, Range.POSITIVE);
    Double elAccel = f.number("elevationAccelDegPerS2", true, Range.POSITIVE);
    Double settle = f.number("settleS", true, Range.NON_NEGATIVE);
    List<Double> range = null;
    JsonNode r = f.get("azimuthRangeDeg", false);
    String path = f.path("azimuthRangeDeg");
    if (r != null && Values.isArray(r, path, p, 2, "an array [min, max] of two numbers")) {
      Double min = Values.number(r.get(0), path + "[0]", p, Range.ANY);
      Double max = Values.number(r.get(1), path + "[1]", p, Range.ANY);
      if (min != null && max != null) {
        if (max - min < 360) {
          p.add(path, "must span at least 360 deg so every azimuth is reachable (spans " + Range.num(max - min)
              + " deg)", Problems.text(r));
        } else {
          range = List.of(min, max);
        }
      }
    }
    if (azRate == null || elRate == null || azAccel == null || elAccel == null || settle == null) {
      return null;
    }
    return new SlewSettings.AltAz(azRate, elRate, azAccel, elAccel, settle, range, keepOut(f));
  }

  /**
   * {@code keepOutDuringSlew} (spec A3): a boolean, default true. Accepted for every model; {@code fixed} and
   * {@code matrix} define no slew path, so the value has no effect there.
   */
  private static boolean keepOut(Fields f) {
    Boolean b = f.bool("keepOutDuringSlew", false);
    return b == null || b;
  }

  private SlewSettings fixed(Fields f) {
    keepOut(f); // type-checked; no path, no effect
    Double seconds = f.number("seconds", true, Range.NON_NEGATIVE);
    return seconds == null ? null : new SlewSettings.Fixed(seconds);
  }

  private SlewSettings matrix(Fields f) {
    keepOut(f); // type-checked; no path, no effect
    ArrayNode rows = f.array("seconds", true);
    List<List<Double>> table = new ArrayList<>();
    if (rows != null) {
      String path = f.path("seconds");
      if (requestCount >= 0 && rows.size() != requestCount) {
        p.add(path, rows.size() + " rows, but the scenario has " + requestCount + " requests",
            Integer.toString(rows.size()));
      }
      for (int i = 0; i < rows.size(); i++) {
        table.add(row(rows.get(i), path + "[" + i + "]", "columns"));
      }
    }
    List<Double> fromStart = null;
    JsonNode fs = f.get("fromStartSeconds", false);
    if (fs != null) {
      fromStart = row(fs, f.path("fromStartSeconds"), "entries");
    }
    return new SlewSettings.Matrix(table, fromStart);
  }

  /** One row of finite seconds >= 0, sized to the request count. */
  private List<Double> row(JsonNode n, String path, String noun) {
    List<Double> out = new ArrayList<>();
    if (!n.isArray()) {
      p.invalid(path, "must be an array of seconds", n);
      return out;
    }
    if (requestCount >= 0 && n.size() != requestCount) {
      p.add(path, n.size() + " " + noun + ", but the scenario has " + requestCount + " requests",
          Integer.toString(n.size()));
    }
    for (int j = 0; j < n.size(); j++) {
      Double v = Values.number(n.get(j), path + "[" + j + "]", p, Range.NON_NEGATIVE);
      out.add(v == null ? 0.0 : v);
    }
    return out;
  }
}
