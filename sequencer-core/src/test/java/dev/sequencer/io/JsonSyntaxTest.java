package dev.sequencer.io;

import static dev.sequencer.io.Docs.base;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Malformed JSON is reported in our words: line, column, the file, what was expected and what was found,
 * never the parser's internals. Which inputs are malformed is RFC 8259 (the JSON grammar): no trailing
 * commas (section 4, 5), double-quoted names and strings (4, 7), control characters escaped in strings
 * (7), no leading zeros and digits after '.' and '-' (6), one value per text (2). Line and column are
 * counted from 1, as editors do; the expected columns below are counted by hand on each input.
 */
class JsonSyntaxTest {
  /** Fragments of the parser's own messages that must never reach the user. */
  private static final List<String> INTERNALS = List.of("REDACTED", "StreamReadFeature", "StreamReadConstraints",
      "DeserializationFeature", "com.fasterxml", "JsonNode", "`", "' (code ", "Source:", "START_", "CTRL-CHAR");

  private static Problem problem(String text) {
    ScenarioException e = assertThrows(ScenarioException.class, () -> ScenarioReader.parse(text, "night.json"), text);
    assertEquals(1, e.problems().size(), e.getMessage());
    return e.problems().get(0);
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', quoteCharacter = '`', value = {
      // input | path | line and column | message after "malformed JSON at line L, column C of night.json: "
      "{\"a\": 1,}||1, column 9|expected a field name in double quotes, found '}' (JSON allows no comma before '}')",
      "{'a': 1}||1, column 2|expected a field name in double quotes, found a single quote (') (JSON strings and field names take double quotes)",
      "{a: 1}||1, column 2|expected a field name in double quotes, found 'a'",
      "{\"a\" 1}|a|1, column 6|expected ':' after the field name, found '1'",
      "{\"a\": 1 \"b\": 2}||1, column 9|expected ',' or '}', found '\"'",
      "{\"a\": [1 2]}|a|1, column 10|expected ',' or ']', found '2'",
      "{\"a\": [1, 2}|a|1, column 12|expected ']' to close the array opened at line 1, column 7, found '}'",
      "{\"a\": tru}|a|1, column 10|expected a value (a string in double quotes, a number, an object, an array, true, false or null), found 'tru'",
      "{\"a\": 01}|a|1, column 8|a number may not start with 0 followed by more digits",
      "{\"a\": 1.}|a|1, column 8|expected a digit after the decimal point",
      "{\"a\": -}|a|1, column 8|expected a digit after '-'",
      "{\"a\": \"\\q\"}|a|1, column 9|unknown escape '\\q' in a string (JSON has \\\" \\\\ \\/ \\b \\f \\n \\r \\t and \\uXXXX)",
      "{\"a\": 1, \"a\": 2}|a|1, column 13|the field \"a\" appears twice in the same object",
      "{\"a\": 1} {}||1, column 10|more content after the end of the document (a file holds one JSON object)",
      "{\"a\": {\"b\": 1}||1, column 15|the file ends before the object opened at line 1, column 1 is closed (expected '}')",
      "{\"a\": \"abc|a|1, column 11|the file ends inside a string (expected its closing '\"')",
      "{\"a\": 1}]||1, column 9|found ']' with no array open",
  })
  void malformedJsonIsDescribedInOurWords(String input, String path, String at, String what) {
    Problem p = problem(input);
    assertEquals(path == null ? "" : path, p.path(), p.toString());
    assertEquals("malformed JSON at line " + at + " of night.json: " + what, p.message());
    assertFreeOfInternals(p.toString());
  }

  @org.junit.jupiter.api.Test
  void theLineColumnAndPathAreThoseOfTheError() {
    Problem p = problem("{\n  \"r\": [\n    {\"x\": 1,}\n  ]\n}");
    assertEquals("r[0]", p.path());
    assertEquals("malformed JSON at line 3, column 13 of night.json: expected a field name in double quotes, "
        + "found '}' (JSON allows no comma before '}')", p.message());
  }

  @org.junit.jupiter.api.Test
  void aControlCharacterInAStringIsNamed() {
    Problem p = problem("{\"a\": \"x\ny\"}");
    assertEquals("malformed JSON at line 1, column 9 of night.json: expected the closing '\"' of the string, found "
        + "a line break (code 10) (inside a string write it as an escape such as \\n or \\t)", p.message());
  }

  @org.junit.jupiter.api.Test
  void aByteOrderMarkIsNamed() {
    Problem p = problem("\ufeff{\"format\": 1}");
    assertTrue(p.message().startsWith("malformed JSON at line 1, column 1 of night.json: expected a value"), p.message());
    assertTrue(p.message().endsWith("found U+FEFF (a byte-order mark: save the file as UTF-8 without one)"), p.message());
  }

  @org.junit.jupiter.api.Test
  void limitsOfTheReaderAreStatedWithoutItsNames() {
    // Jackson's default limits (StreamReadConstraints: nesting 1000, number length 1000) are ours too.
    Problem deep = problem("[".repeat(1100) + "]".repeat(1100));
    assertEquals("malformed JSON in night.json: values nested 1001 levels deep (at most 1000)", deep.message());
    Problem longNumber = problem("{\"a\": " + "1".repeat(1200) + "}");
    assertEquals("malformed JSON in night.json: a number 1200 characters long (at most 1000)", longNumber.message());
  }

  /**
   * One character deleted from, or one of {@code , { } [ ] : " '} inserted into, a valid scenario: when
   * that makes it malformed, the message is in our words. (A change that keeps it valid JSON gives a
   * rule problem or none; those are the readers' business.)
   */
  @Property(tries = 400)
  void everySingleCharacterBreakageIsReportedInOurWords(@ForAll("edits") Tuple.Tuple3<Boolean, Integer, Character> edit) {
    String doc = base().toString();
    int at = edit.get2() % doc.length();
    String broken = edit.get1() ? doc.substring(0, at) + doc.substring(at + 1)
        : doc.substring(0, at) + edit.get3() + doc.substring(at);
    try {
      ScenarioReader.parse(broken, "night.json");
    } catch (ScenarioException e) {
      for (Problem p : e.problems()) {
        if (p.message().startsWith("malformed JSON")) {
          assertTrue(p.message().startsWith("malformed JSON at line ") || p.message().startsWith("malformed JSON in "),
              p.message());
          assertFalse(p.message().endsWith(": not valid JSON here"), () -> "unclassified: " + p + "\n" + broken);
          assertFreeOfInternals(p.toString());
        }
      }
    }
  }

  @Provide
  Arbitrary<Tuple.Tuple3<Boolean, Integer, Character>> edits() {
    return net.jqwik.api.Combinators.combine(Arbitraries.of(true, false), Arbitraries.integers().between(0, 100_000),
        Arbitraries.of(',', '{', '}', '[', ']', ':', '"', '\'')).as(Tuple::of);
  }

  private static void assertFreeOfInternals(String message) {
    for (String s : INTERNALS) {
      assertFalse(message.contains(s), () -> "\"" + s + "\" in: " + message);
    }
  }
}
