package dev.sequencer.io;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonStreamContext;
import com.fasterxml.jackson.core.exc.StreamConstraintsException;
import com.fasterxml.jackson.databind.exc.MismatchedInputException;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A JSON syntax error in our words: where (the file, line and column, and the JSON path of the enclosing
 * value when the parser knows it), what was expected and what was found. The parser's own message is
 * only read to tell the kinds of error apart; it is never shown, so none of its internals (class names,
 * feature flags, "REDACTED" source descriptions) reach the user.
 */
final class JsonSyntax {
  private static final Pattern FOUND_CHAR = Pattern.compile("^Unexpected character \\('(.)' \\(code (\\d+)");
  private static final Pattern TOKEN = Pattern.compile("^Unrecognized token '([^']*)'");
  private static final Pattern CLOSE_MARKER = Pattern.compile("^Unexpected close marker '(.)': expected '(.)'");
  private static final Pattern STRAY_CLOSE = Pattern.compile("^Unexpected close marker '(.)': no open");
  private static final Pattern OPENED_AT = Pattern.compile("line: (\\d+), column: (\\d+)");
  private static final Pattern DUPLICATE = Pattern.compile("^Duplicate field '(.*)'$", Pattern.DOTALL);
  private static final Pattern ESCAPE = Pattern.compile("^Unrecognized character escape '(.)'");
  private static final Pattern CONTROL =
      Pattern.compile("^Illegal unquoted character \\(\\(CTRL-CHAR, code (\\d+)\\)\\)");
  private static final Pattern NUMBER_LENGTH =
      Pattern.compile("^Number value length \\((\\d+)\\) exceeds the maximum allowed \\((\\d+)");
  private static final Pattern NESTING =
      Pattern.compile("nesting depth \\((\\d+)\\) exceeds the maximum allowed \\((\\d+)");
  private static final String A_VALUE =
      "a value (a string in double quotes, a number, an object, an array, true, false or null)";

  private JsonSyntax() {}

  /**
   * The problem for {@code e}, met while parsing the document named {@code source}. Its path is that of
   * the value being read when the error is inside one (a bad number, string or literal, a duplicate
   * field); between values (a missing comma, a stray bracket, the end of the file) it is that of the
   * enclosing object or array, "" for the document.
   */
  static Problem describe(JsonProcessingException e, String source) {
    String where = where(e.getLocation(), source);
    String what = what(e);
    return new Problem(path(e, insideValue(what)), "malformed JSON" + where + ": " + what, null);
  }

  /** True for the kinds of error that lie inside one value (see {@link #describe}). */
  private static boolean insideValue(String what) {
    return what.startsWith("expected a value") || what.startsWith("expected ':'") || what.contains("appears twice")
        || what.startsWith("unknown escape") || what.startsWith("expected the closing") || what.startsWith("a number")
        || what.startsWith("expected a digit") || what.startsWith("the file ends inside a string");
  }

  /** " at line L, column C of SOURCE", or " in SOURCE" without a location. */
  private static String where(JsonLocation at, String source) {
    String of = source == null || source.isEmpty() ? "" : " of " + source;
    if (at == null || at.getLineNr() < 1) {
      return of.isEmpty() ? "" : " in " + source;
    }
    return " at line " + at.getLineNr() + ", column " + at.getColumnNr() + of;
  }

  /**
   * The JSON path ("requests[2].target") of the value being read, or with {@code !value} of the object or
   * array holding it; "" at the top or when unknown.
   */
  private static String path(JsonProcessingException e, boolean value) {
    if (!(e.getProcessor() instanceof JsonParser parser)) {
      return "";
    }
    Deque<String> parts = new ArrayDeque<>();
    JsonStreamContext innermost = parser.getParsingContext();
    if (!value && innermost != null && !innermost.inRoot()) {
      innermost = innermost.getParent();
    }
    for (JsonStreamContext c = innermost; c != null && !c.inRoot(); c = c.getParent()) {
      if (c.inArray()) {
        parts.push("[" + Math.max(0, c.getCurrentIndex()) + "]");
      } else if (c.getCurrentName() != null) {
        parts.push("." + c.getCurrentName());
      }
    }
    String p = String.join("", parts);
    return p.startsWith(".") ? p.substring(1) : p;
  }

  /** What was wrong, in our words. */
  static String what(JsonProcessingException e) {
    String m = e.getOriginalMessage() == null ? "" : e.getOriginalMessage();
    Matcher x;
    if (e instanceof MismatchedInputException && m.startsWith("Trailing token")) {
      return "more content after the end of the document (a file holds one JSON object)";
    }
    if (e instanceof StreamConstraintsException || m.contains("exceeds the maximum")) {
      if ((x = NESTING.matcher(m)).find()) {
        return "values nested " + x.group(1) + " levels deep (at most " + x.group(2) + ")";
      }
      if ((x = NUMBER_LENGTH.matcher(m)).find()) {
        return "a number " + x.group(1) + " characters long (at most " + x.group(2) + ")";
      }
      return "a value larger than this reader accepts";
    }
    if ((x = DUPLICATE.matcher(m)).find()) {
      return "the field \"" + x.group(1) + "\" appears twice in the same object";
    }
    if (m.startsWith("Unexpected end-of-input")) {
      return endOfInput(m);
    }
    if ((x = CLOSE_MARKER.matcher(m)).find()) {
      Matcher opened = OPENED_AT.matcher(m);
      String container = x.group(2).equals("]") ? "array" : "object";
      return "expected '" + x.group(2) + "' to close the " + container
          + (opened.find() ? " opened at line " + opened.group(1) + ", column " + opened.group(2) : "")
          + ", found '" + x.group(1) + "'";
    }
    if ((x = STRAY_CLOSE.matcher(m)).find()) {
      return "found '" + x.group(1) + "' with no " + (x.group(1).equals("]") ? "array" : "object") + " open";
    }
    if ((x = TOKEN.matcher(m)).find()) {
      return "expected " + A_VALUE + ", found '" + x.group(1) + "'";
    }
    if ((x = ESCAPE.matcher(m)).find()) {
      return "unknown escape '\\" + x.group(1) + "' in a string (JSON has \\\" \\\\ \\/ \\b \\f \\n \\r \\t and \\uXXXX)";
    }
    if ((x = CONTROL.matcher(m)).find()) {
      return "expected the closing '\"' of the string, found " + character(Integer.parseInt(x.group(1)))
          + " (inside a string write it as an escape such as \\n or \\t)";
    }
    if (m.contains("Leading zeroes not allowed")) {
      return "a number may not start with 0 followed by more digits";
    }
    if (m.contains("Decimal point not followed by a digit")) {
      return "expected a digit after the decimal point";
    }
    if (m.contains("to follow minus sign")) {
      return "expected a digit after '-'";
    }
    if (m.contains("Exponent indicator not followed by a digit")) {
      return "expected a digit after the exponent 'e'";
    }
    if ((x = FOUND_CHAR.matcher(m)).find()) {
      return expected(m) + ", found " + character(Integer.parseInt(x.group(2))) + hint(m, x.group(1));
    }
    return "not valid JSON here";
  }

  /** What the parser was expecting when it met an unexpected character. */
  private static String expected(String m) {
    if (m.contains("double-quote to start field name")) {
      return "expected a field name in double quotes";
    }
    if (m.contains("colon to separate field name and value")) {
      return "expected ':' after the field name";
    }
    if (m.contains("comma to separate Object entries")) {
      return "expected ',' or '}'";
    }
    if (m.contains("comma to separate Array entries")) {
      return "expected ',' or ']'";
    }
    if (m.contains("expected a valid value") || m.contains("expected a value")) {
      return "expected " + A_VALUE;
    }
    return "unexpected character";
  }

  private static String hint(String m, String found) {
    if (found.equals("'")) {
      return " (JSON strings and field names take double quotes)";
    }
    if (found.equals("}") && m.contains("double-quote to start field name")) {
      return " (JSON allows no comma before '}')";
    }
    if (found.equals("]") && m.contains("expected a valid value")) {
      return " (JSON allows no comma before ']')";
    }
    if (found.equals("\ufeff")) {
      return " (a byte-order mark: save the file as UTF-8 without one)";
    }
    return "";
  }

  private static String endOfInput(String m) {
    for (String[] kind : new String[][] {{"Object", "object", "}"}, {"Array", "array", "]"}}) {
      if (m.contains("close marker for " + kind[0])) {
        Matcher opened = OPENED_AT.matcher(m);
        return "the file ends before the " + kind[1] + (opened.find() ? " opened at line " + opened.group(1)
            + ", column " + opened.group(2) : "") + " is closed (expected '" + kind[2] + "')";
      }
    }
    if (m.contains("closing quote for a string value") || m.contains("in field name")) {
      return "the file ends inside a string (expected its closing '\"')";
    }
    return "the file ends too early";
  }

  /** A character for a message: 'x', or its name and code when it would not print. */
  static String character(int code) {
    return switch (code) {
      case '\n' -> "a line break (code 10)";
      case '\r' -> "a carriage return (code 13)";
      case '\t' -> "a tab (code 9)";
      case '\'' -> "a single quote (')";
      case 0xfeff -> "U+FEFF";
      default -> code < 0x20 || code == 0x7f ? String.format(Locale.ROOT, "a control character (code %d)", code)
          : "'" + new String(Character.toChars(code)) + "'";
    };
  }
}
