package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import java.time.Instant;
import java.util.List;
import java.util.Map;

/**
 * One JSON object being read at a path. Construction reports every field not in the allowed list
 * (with a "did you mean" hint); the getters report wrong types, missing fields and out-of-range values,
 * and return {@code null} whenever they reported something. A JSON {@code null} counts as absent.
 */
final class Fields {
  private final JsonNode node;
  private final String path;
  private final Problems problems;

  private Fields(JsonNode node, String path, Problems problems, List<String> allowed) {
    this.node = node;
    this.path = path;
    this.problems = problems;
    for (Map.Entry<String, JsonNode> e : node.properties()) {
      if (!allowed.contains(e.getKey())) {
        problems.add(
            path(e.getKey()), "unknown field" + Suggest.hint(e.getKey(), allowed), Problems.text(e.getValue()));
      }
    }
  }

  /** Reads {@code node} as an object with these allowed fields, or reports it and returns null. */
  static Fields of(JsonNode node, String path, Problems problems, List<String> allowed) {
    if (!node.isObject()) {
      problems.invalid(path, "must be an object", node);
      return null;
    }
    return new Fields(node, path, problems, allowed);
  }

  /** The path of one of this object's fields. */
  String path(String name) {
    return path.isEmpty() ? name : path + "." + name;
  }

  String path() {
    return path;
  }

  /** Where this object's problems are collected (for rules across fields). */
  Problems problems() {
    return problems;
  }

  boolean has(String name) {
    JsonNode v = node.get(name);
    return v != null && !v.isNull();
  }

  /** True when the field is written with the JSON value {@code null}. */
  boolean isNull(String name) {
    JsonNode v = node.get(name);
    return v != null && v.isNull();
  }

  /** The raw value, or null when absent; reports a missing required field. */
  JsonNode get(String name, boolean required) {
    if (!has(name)) {
      if (required) {
        problems.missing(path(name));
      }
      return null;
    }
    return node.get(name);
  }

  Double number(String name, boolean required, Range range) {
    JsonNode v = get(name, required);
    return v == null ? null : Values.number(v, path(name), problems, range);
  }

  Integer integer(String name, boolean required, Range range) {
    JsonNode v = get(name, required);
    return v == null ? null : Values.integer(v, path(name), problems, range);
  }

  String text(String name, boolean required) {
    JsonNode v = get(name, required);
    return v == null ? null : Values.text(v, path(name), problems);
  }

  Boolean bool(String name, boolean required) {
    JsonNode v = get(name, required);
    return v == null ? null : Values.bool(v, path(name), problems);
  }

  Instant instant(String name, boolean required) {
    JsonNode v = get(name, required);
    return v == null ? null : Values.instant(v, path(name), problems);
  }

  /** A nested object with its own allowed fields. */
  Fields object(String name, boolean required, List<String> allowed) {
    JsonNode v = get(name, required);
    return v == null ? null : of(v, path(name), problems, allowed);
  }

  /** An array of any size; reports anything else. */
  ArrayNode array(String name, boolean required) {
    JsonNode v = get(name, required);
    if (v == null) {
      return null;
    }
    if (!v.isArray()) {
      problems.invalid(path(name), "must be an array", v);
      return null;
    }
    return (ArrayNode) v;
  }
}
