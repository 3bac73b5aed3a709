package dev.sequencer.report;

import java.util.Locale;

/** Small HTML helpers: escaping and number formatting (always '.' decimals). */
final class Html {
  private Html() {}

  /** {@code s} escaped for HTML text and attribute values. */
  static String esc(String s) {
    if (s == null) {
      return "";
    }
    StringBuilder b = new StringBuilder(s.length() + 8);
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      switch (c) {
        case '&' -> b.append("&amp;");
        case '<' -> b.append("&lt;");
        case '>' -> b.append("&gt;");
        case '"' -> b.append("&quot;");
        case '\'' -> b.append("&#39;");
        default -> b.append(c);
      }
    }
    return b.toString();
  }

  /** {@code v} with {@code decimals} decimals, or "–" for NaN/null. */
  static String num(Double v, int decimals) {
    if (v == null || !Double.isFinite(v)) {
      return "\u2013";
    }
    String s = String.format(Locale.ROOT, "%." + decimals + "f", v);
    return s.equals("-0") || s.matches("-0\\.0*") ? s.substring(1) : s;
  }

  /** A table cell with a sort key: {@code <td data-v="key">text</td>}. */
  static String cell(String text, String sortKey) {
    return "<td data-v=\"" + esc(sortKey) + "\">" + text + "</td>";
  }
}
