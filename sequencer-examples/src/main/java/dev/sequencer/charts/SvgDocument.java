package dev.sequencer.charts;

import java.awt.Shape;
import java.awt.geom.AffineTransform;
import java.awt.geom.PathIterator;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The text of one SVG 1.1 document being drawn by {@link SvgGraphics}: the elements in drawing order (inside
 * the groups opened around them; a group left open is closed at the end), the shared definitions (clip paths,
 * gradients) and the number and text formatting they use. Coordinates are device pixels, written with at most
 * two decimals (1/100 px, far below what a viewer can show).
 */
final class SvgDocument {
  private final int widthPx;
  private final int heightPx;
  private final StringBuilder body = new StringBuilder(1 << 16);
  private final StringBuilder defs = new StringBuilder();
  /** Clip path data to its id, so that the many elements clipped to the plot area share one definition. */
  private final Map<String, String> clipIds = new LinkedHashMap<>();
  private final Map<String, String> gradientIds = new LinkedHashMap<>();
  /** Groups opened and not yet closed. */
  private int openGroups;

  SvgDocument(int widthPx, int heightPx) {
    this.widthPx = widthPx;
    this.heightPx = heightPx;
  }

  /** Appends one element (complete markup) to the body. */
  void element(String markup) {
    body.append(markup).append('\n');
  }

  /**
   * Opens a {@code <g>} element with these attributes (names as given, in their map order, values escaped);
   * the elements that follow belong to it until {@link #endGroup}. A name that is not a plain XML name is
   * refused.
   */
  void beginGroup(Map<String, String> attributes) {
    StringBuilder sb = new StringBuilder("<g");
    attributes.forEach((name, value) -> {
      if (!name.matches("[A-Za-z_][A-Za-z0-9_.-]*")) {
        throw new IllegalArgumentException("not an attribute name: '" + name + "'");
      }
      sb.append(' ').append(name).append("=\"").append(escape(value == null ? "" : value)).append('"');
    });
    body.append(sb).append(">\n");
    openGroups++;
  }

  /** Closes the group opened last; nothing when none is open. */
  void endGroup() {
    if (openGroups > 0) {
      body.append("</g>\n");
      openGroups--;
    }
  }

  /** The id of a clip path with path data {@code d} (device pixels), defined on first use. */
  String clipId(String d) {
    return clipIds.computeIfAbsent(d, k -> {
      String id = "clip" + clipIds.size();
      defs.append("<clipPath id=\"").append(id).append("\"><path d=\"").append(k).append("\"/></clipPath>\n");
      return id;
    });
  }

  /** The id of a gradient whose definition is {@code markup} with {@code ID} in place of the id. */
  String gradientId(String markup) {
    return gradientIds.computeIfAbsent(markup, k -> {
      String id = "gradient" + gradientIds.size();
      defs.append(k.replace("ID", id)).append('\n');
      return id;
    });
  }

  /** The whole document as text. */
  String text() {
    StringBuilder sb = new StringBuilder(body.length() + defs.length() + 300);
    sb.append("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
    sb.append("<svg xmlns=\"http://www.w3.org/2000/svg\" xmlns:xlink=\"http://www.w3.org/1999/xlink\" version=\"1.1\" ")
        .append("width=\"").append(widthPx).append("\" height=\"").append(heightPx)
        .append("\" viewBox=\"0 0 ").append(widthPx).append(' ').append(heightPx)
        .append("\" xml:space=\"preserve\">\n");
    if (defs.length() > 0) {
      sb.append("<defs>\n").append(defs).append("</defs>\n");
    }
    sb.append(body).append("</g>\n".repeat(openGroups)).append("</svg>\n");
    return sb.toString();
  }

  /** SVG path data of {@code shape} mapped by {@code at} (null = identity); empty for an empty shape. */
  static String pathData(Shape shape, AffineTransform at) {
    StringBuilder sb = new StringBuilder();
    double[] c = new double[6];
    for (PathIterator it = shape.getPathIterator(at); !it.isDone(); it.next()) {
      switch (it.currentSegment(c)) {
        case PathIterator.SEG_MOVETO -> points(sb.append('M'), c, 1);
        case PathIterator.SEG_LINETO -> points(sb.append('L'), c, 1);
        case PathIterator.SEG_QUADTO -> points(sb.append('Q'), c, 2);
        case PathIterator.SEG_CUBICTO -> points(sb.append('C'), c, 3);
        case PathIterator.SEG_CLOSE -> sb.append('Z');
        default -> throw new IllegalStateException("unknown path segment type");
      }
    }
    return sb.toString();
  }

  private static void points(StringBuilder sb, double[] c, int n) {
    for (int i = 0; i < 2 * n; i++) {
      if (i > 0) {
        sb.append(' ');
      }
      sb.append(number(c[i]));
    }
  }

  /**
   * {@code v} rounded to 1/100 with no exponent and no trailing zeros ("12.5", "-0.25", "3"); never "-0".
   * Non-finite values (a degenerate shape) are written as 0 so the document stays valid.
   */
  static String number(double v) {
    if (!Double.isFinite(v)) {
      return "0";
    }
    long hundredths = Math.round(v * 100);
    StringBuilder sb = new StringBuilder(12);
    if (hundredths < 0) {
      sb.append('-');
      hundredths = -hundredths;
    }
    sb.append(hundredths / 100);
    long frac = hundredths % 100;
    if (frac != 0) {
      sb.append('.').append(frac / 10);
      if (frac % 10 != 0) {
        sb.append(frac % 10);
      }
    }
    return sb.toString();
  }

  /** {@code s} escaped for XML text and attribute values; characters XML 1.0 forbids are dropped. */
  static String escape(String s) {
    StringBuilder sb = new StringBuilder(s.length() + 8);
    for (int i = 0; i < s.length(); i++) {
      char ch = s.charAt(i);
      switch (ch) {
        case '&' -> sb.append("&amp;");
        case '<' -> sb.append("&lt;");
        case '>' -> sb.append("&gt;");
        case '"' -> sb.append("&quot;");
        default -> {
          if (ch >= 0x20 || ch == '\t' || ch == '\n' || ch == '\r') {
            sb.append(ch);
          }
        }
      }
    }
    return sb.toString();
  }
}
