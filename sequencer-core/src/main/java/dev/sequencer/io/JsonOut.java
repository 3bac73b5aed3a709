package dev.sequencer.io;

import com.fasterxml.jackson.core.io.JsonStringEncoder;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.DoubleNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.LongNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.time.Instant;
import java.util.Iterator;
import java.util.List;
import java.util.Map;

/**
 * JSON tree to text, byte-stable: fields in insertion order, two-space indent, "\n" line ends and a
 * final newline. An array whose elements are all scalars stays on one line ({@code [0, 12]}).
 */
final class JsonOut {
  static final JsonNodeFactory NODES = JsonNodeFactory.instance;

  private JsonOut() {}

  /**
   * A number node that reads back to exactly {@code v}: whole values below 2^53 as integers (600, not
   * 600.0), others in Java's shortest round-trip form; -0.0 stays -0.0. NaN and infinities are refused
   * with an {@link IllegalArgumentException}.
   */
  static JsonNode number(double v) {
    if (!Double.isFinite(v)) {
      // JSON has no NaN or Infinity; refusing here keeps an existing output file intact (nothing is written).
      throw new IllegalArgumentException("cannot write the non-finite number " + v + " as JSON");
    }
    boolean negativeZero = v == 0 && Double.doubleToRawLongBits(v) != 0;
    if (v == Math.rint(v) && Math.abs(v) < 0x1p53 && !negativeZero) {
      return LongNode.valueOf((long) v);
    }
    return DoubleNode.valueOf(v);
  }

  /** An ISO-8601 UTC instant with Z; fractions only when non-zero, in groups of three digits. */
  static String instant(Instant t) {
    return t.toString();
  }

  static ArrayNode numbers(List<Double> values) {
    ArrayNode a = NODES.arrayNode();
    values.forEach(v -> a.add(number(v)));
    return a;
  }

  static String pretty(JsonNode root) {
    StringBuilder sb = new StringBuilder();
    write(root, sb, "");
    return sb.append('\n').toString();
  }

  private static void write(JsonNode n, StringBuilder sb, String indent) {
    if (n.isObject()) {
      writeObject((ObjectNode) n, sb, indent);
    } else if (n.isArray()) {
      writeArray((ArrayNode) n, sb, indent);
    } else if (n.isTextual()) {
      sb.append('"').append(JsonStringEncoder.getInstance().quoteAsString(n.textValue())).append('"');
    } else {
      sb.append(n.toString());
    }
  }

  private static void writeObject(ObjectNode o, StringBuilder sb, String indent) {
    if (o.isEmpty()) {
      sb.append("{}");
      return;
    }
    String inner = indent + "  ";
    sb.append("{\n");
    for (Iterator<Map.Entry<String, JsonNode>> it = o.properties().iterator(); it.hasNext(); ) {
      Map.Entry<String, JsonNode> e = it.next();
      sb.append(inner).append('"').append(JsonStringEncoder.getInstance().quoteAsString(e.getKey())).append("\": ");
      write(e.getValue(), sb, inner);
      sb.append(it.hasNext() ? ",\n" : "\n");
    }
    sb.append(indent).append('}');
  }

  private static void writeArray(ArrayNode a, StringBuilder sb, String indent) {
    boolean flat = true;
    for (JsonNode e : a) {
      flat &= e.isValueNode();
    }
    if (flat) {
      sb.append('[');
      for (int i = 0; i < a.size(); i++) {
        sb.append(i == 0 ? "" : ", ");
        write(a.get(i), sb, indent);
      }
      sb.append(']');
      return;
    }
    String inner = indent + "  ";
    sb.append("[\n");
    for (int i = 0; i < a.size(); i++) {
      sb.append(inner);
      write(a.get(i), sb, inner);
      sb.append(i + 1 < a.size() ? ",\n" : "\n");
    }
    sb.append(indent).append(']');
  }
}
