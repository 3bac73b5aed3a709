package dev.sequencer.io;

import com.fasterxml.jackson.databind.JsonNode;
import dev.sequencer.model.TimeWindow;
import java.time.Instant;
import java.time.format.DateTimeParseException;

/** Typed reads of single JSON values at a path; each returns {@code null} after reporting a problem. */
final class Values {
  private Values() {}

  /** A finite number inside {@code range}. */
  static Double number(JsonNode n, String path, Problems p, Range range) {
    if (!n.isNumber()) {
      p.invalid(path, "must be a number", n);
      return null;
    }
    double v = n.doubleValue();
    if (!Double.isFinite(v)) {
      p.invalid(path, "must be a finite number", n);
      return null;
    }
    if (!range.contains(v)) {
      p.invalid(path, range.rule(), n);
      return null;
    }
    return v;
  }

  /** A whole number that fits an {@code int}, inside {@code range}. */
  static Integer integer(JsonNode n, String path, Problems p, Range range) {
    if (!n.isIntegralNumber()) {
      p.invalid(path, n.isNumber() && n.isFloatingPointNumber() ? "must be a whole number" : "must be an integer", n);
      return null;
    }
    if (!n.canConvertToInt()) {
      p.invalid(path, "must fit in a 32-bit integer", n);
      return null;
    }
    int v = n.intValue();
    if (!range.contains(v)) {
      p.invalid(path, range.rule(), n);
      return null;
    }
    return v;
  }

  static String text(JsonNode n, String path, Problems p) {
    if (!n.isTextual()) {
      p.invalid(path, "must be a string", n);
      return null;
    }
    return n.textValue();
  }

  /** A non-empty string, as request ids must be. */
  static String id(JsonNode n, String path, Problems p) {
    String s = text(n, path, p);
    if (s != null && s.isBlank()) {
      p.invalid(path, "must not be empty", n);
      return null;
    }
    return s;
  }

  static Boolean bool(JsonNode n, String path, Problems p) {
    if (!n.isBoolean()) {
      p.invalid(path, "must be true or false", n);
      return null;
    }
    return n.booleanValue();
  }

  /** An ISO-8601 UTC instant ending in Z; fractions of a second allowed. */
  static Instant instant(JsonNode n, String path, Problems p) {
    String rule = "must be an ISO-8601 UTC instant like \"2031-05-04T21:30:00Z\"";
    if (!n.isTextual()) {
      p.invalid(path, rule, n);
      return null;
    }
    String s = n.textValue();
    if (!s.endsWith("Z")) {
      p.invalid(path, rule + ", in UTC with a final Z", n);
      return null;
    }
    try {
      return Instant.parse(s);
    } catch (DateTimeParseException e) {
      p.invalid(path, rule, n);
      return null;
    }
  }

  /** An array of exactly {@code size} elements ({@code size < 0}: any size). */
  static boolean isArray(JsonNode n, String path, Problems p, int size, String what) {
    if (!n.isArray() || (size >= 0 && n.size() != size)) {
      p.invalid(path, "must be " + what, n);
      return false;
    }
    return true;
  }

  /** A closed interval written as [start, end]; end must not be before start, nor equal when strict. */
  static TimeWindow window(JsonNode n, String path, Problems p, boolean strict) {
    if (!isArray(n, path, p, 2, "an array of two instants [start, end]")) {
      return null;
    }
    Instant start = instant(n.get(0), path + "[0]", p);
    Instant end = instant(n.get(1), path + "[1]", p);
    if (start == null || end == null) {
      return null;
    }
    if (end.isBefore(start)) {
      p.add(path, "end " + end + " is before start " + start, Problems.text(n));
      return null;
    }
    if (strict && end.equals(start)) {
      p.add(path, "end equals start " + start + "; a window must have a positive length", Problems.text(n));
      return null;
    }
    return new TimeWindow(start, end);
  }
}
