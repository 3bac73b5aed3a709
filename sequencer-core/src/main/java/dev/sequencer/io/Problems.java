package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.List;

/** Collects the errors and warnings met while reading one document. */
final class Problems {
  private final List<Problem> errors = new ArrayList<>();
  private final List<String> warnings = new ArrayList<>();

  /** Records an error whose message is complete as given. */
  void add(String path, String message, String value) {
    errors.add(new Problem(path, message, value));
  }

  /** Records that {@code node} breaks {@code rule}; the message ends with "(was <node>)". */
  void invalid(String path, String rule, JsonNode node) {
    add(path, rule + " (was " + (node.isNumber() ? node.asText() : node.toString()) + ")", text(node));
  }

  /** Records a missing required field. */
  void missing(String path) {
    add(path, "is required", null);
  }

  /** Records a warning: the input was accepted after an adjustment the user should know about. */
  void warn(String path, String message) {
    warnings.add(path + ": " + message);
  }

  /** Number of errors so far; compare before and after reading a part to know whether it was valid. */
  int count() {
    return errors.size();
  }

  List<String> warnings() {
    return List.copyOf(warnings);
  }

  /** Throws a {@link ScenarioException} listing every error, if there is any. */
  void throwIfAny(String source) {
    if (!errors.isEmpty()) {
      throw new ScenarioException(source, errors);
    }
  }

  /** The value as written: a string's own text, a number's digits (or NaN, Infinity), else the JSON text. */
  static String text(JsonNode node) {
    if (node == null) {
      return null;
    }
    return node.isTextual() || node.isNumber() ? node.asText() : node.toString();
  }
}
